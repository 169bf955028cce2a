package spanwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The command-line tool under hostile conditions: outputs that name inputs are refused before any
 * work, failed writes are exit 2 and never damage a file, a failing sweep worker ends the sweep
 * (no hang, no temporary file), and unexpected failures are one line with exit 3. Expectations:
 * the exit codes documented in {@code --help} and docs/cli.md; common practice, no source.
 */
class ReliabilityTest {
    @TempDir
    Path dir;

    static final String SCENARIO = MainTest.parallel("\"function\": \"a | b\",");

    Path write(String name, String text) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, text, StandardCharsets.UTF_8);
        return p;
    }

    List<String> names() throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().collect(Collectors.toList());
        }
    }

    static void assertOneLine(MainTest.Run r) {
        assertFalse(r.err.contains("\tat "), "no stack trace: " + r.err);
    }

    @Test
    void optimizeRefusesToWriteOverItsInput() throws IOException {
        Path in = write("x.json", SCENARIO);
        MainTest.Run r = MainTest.run("optimize", in.toString(), "-o", in.toString());
        assertEquals(2, r.status, r.err);
        assertTrue(r.err.contains("is also an input"), r.err);
        assertEquals(SCENARIO, Files.readString(in), "the input is untouched");
        // the same file by another spelling
        MainTest.Run r2 = MainTest.run("optimize", in.toString(), "-o", dir.resolve(".").resolve("x.json").toString());
        assertEquals(2, r2.status, r2.err);
    }

    @Test
    void buildComposeRefusesAnOutputThatIsAnInput() throws IOException {
        Path outer = write("outer.json", SCENARIO);
        Path inner = write("inner.json", SCENARIO);
        MainTest.Run r = MainTest.run("build", "compose", outer.toString(), inner.toString(), "-o", inner.toString());
        assertEquals(2, r.status, r.err);
        assertEquals(SCENARIO, Files.readString(inner));
    }

    @Test
    void aFailedWriteIsExitTwoAndLeavesNothingBehind() throws IOException {
        Path in = write("x.json", SCENARIO);
        Path plain = write("plain", "a regular file");
        MainTest.Run r = MainTest.run("optimize", in.toString(), "--iterations", "2", "-o",
                plain.resolve("out.json").toString());
        assertEquals(2, r.status, r.err);
        assertTrue(r.err.contains("cannot write") && r.err.contains("not a folder"), r.err);
        assertOneLine(r);
        assertEquals(List.of("plain", "x.json"), names());
    }

    @Test
    void sweepWithAnOutputUnderARegularFileEndsWithExitTwo() throws IOException {
        Path plain = write("plain", "a regular file");
        MainTest.Run r = MainTest.run("sweep", "or", "--n", "2..4", "--no-bounds", "--iterations", "2", "--threads", "2",
                "--quiet", "-o", plain.resolve("out.json").toString());
        assertEquals(2, r.status, r.err);
        assertTrue(r.err.contains("cannot write"), r.err);
        assertOneLine(r);
        assertEquals(List.of("plain"), names(), "no temporary file");
    }

    @Test
    void sweepTablesMayNotNameTheFamilyFileOrTheOutput() throws IOException {
        Path out = dir.resolve("out.json");
        MainTest.Run r = MainTest.run("sweep", "or", "--n", "2..3", "--quiet", "-o", out.toString(), "--csv", out.toString());
        assertEquals(2, r.status, r.err);
        assertTrue(r.err.contains("name the same file"), r.err);
        assertFalse(Files.exists(out), "refused before any work");
    }

    @Test
    void mergeMayNotWriteOverAPart() throws IOException {
        Path part = write("part.json", "{\"format\": \"not a part\"}");
        MainTest.Run r = MainTest.run("merge", part.toString(), "-o", part.toString());
        assertEquals(2, r.status, r.err);
        assertTrue(r.err.contains("is also an input"), r.err);
        assertEquals("{\"format\": \"not a part\"}", Files.readString(part));
    }

    @Test
    void anErrorInASweepWorkerReleasesTheMainThread() throws InterruptedException {
        // A worker that dies of an Error counts the latch down for every size (abort), records the
        // failure and stops further writes, so run() can never wait forever.
        SweepCommand.Args a = SweepCommand.parse(List.of("or", "--n", "2..4", "--quiet"));
        SweepCommand.Runner r = new SweepCommand.Runner(a, false, new java.util.TreeMap<>(), System.err);
        CountDownLatch latch = new CountDownLatch(3);
        Thread t = new Thread(r.guarded(latch, () -> {
            throw new StackOverflowError();
        }));
        t.start();
        t.join();
        assertEquals(0, latch.getCount(), "every waiting size is released");
        assertTrue(r.fatal instanceof StackOverflowError);
        assertTrue(r.stopped, "no later write");
    }

    @Test
    void unexpectedFailuresAreOneLineWithExitThree() {
        // Main.internal is what Main.run prints for any Throwable it did not expect
        assertTrue(Main.internal(new StackOverflowError()).contains("nested too deeply"));
        assertTrue(Main.internal(new OutOfMemoryError("Java heap space")).contains("out of memory"));
        assertFalse(Main.internal(new IllegalStateException("a\nb")).contains("\n"));
        assertTrue(Main.usage().contains("3 internal error"));
    }

    @Test
    void aFileThatIsNotUtf8IsNamedWithTheByte() throws IOException {
        // derived: {"title": "caf is 14 bytes, so the Latin-1 é (0xE9, not followed by two continuation bytes) is at byte 14
        byte[] latin1 = "{\"title\": \"caf\u00e9\"}".getBytes(StandardCharsets.ISO_8859_1);
        Path p = dir.resolve("latin1.json");
        Files.write(p, latin1);
        MainTest.Run r = MainTest.run("analyze", p.toString());
        assertEquals(2, r.status, r.err);
        assertTrue(r.err.contains("is not UTF-8 text at byte 14"), r.err);
        assertOneLine(r);
    }

    @Test
    void aUnicodeDigitInANumberIsAJsonSyntaxError() throws IOException {
        // U+0663 ARABIC-INDIC DIGIT THREE is a digit to Character.isDigit, not to JSON (RFC 8259 §6)
        Path p = write("digit.json", SCENARIO.replace("\"weight\": 2", "\"weight\": 1\u0663"));
        MainTest.Run r = MainTest.run("analyze", p.toString());
        assertEquals(2, r.status, r.err);
        assertTrue(r.err.contains("[json-syntax]"), r.err);
        assertOneLine(r);
    }
}
