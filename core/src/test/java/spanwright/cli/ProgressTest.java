package spanwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Progress lines on stderr: forced on at once with the two system properties (0 s before the
 * first line, 0 s between lines), checked for each long-running command, and silenced by --quiet.
 * The wording is ours (common practice, no source).
 */
class ProgressTest {
    @TempDir
    Path dir;

    @AfterEach
    void defaults() {
        System.clearProperty(Progress.AFTER_PROPERTY);
        System.clearProperty(Progress.EVERY_PROPERTY);
    }

    private static void forceProgress() {
        System.setProperty(Progress.AFTER_PROPERTY, "0");
        System.setProperty(Progress.EVERY_PROPERTY, "0");
    }

    /** Status, stdout and stderr of one run ({@link MainTest#run}). */
    private static String[] run(String... args) {
        MainTest.Run r = MainTest.run(args);
        return new String[] {Integer.toString(r.status), r.out, r.err};
    }

    @Test
    void aLineSaysWhatHowFarAndHowLong() {
        forceProgress();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        try (Progress p = Progress.start("analyze", new PrintStream(err, true, StandardCharsets.UTF_8), false)) {
            p.phase("enumerating inputs");
            p.count(250, 1000);
            String line = p.line(System.nanoTime());
            assertTrue(line.startsWith("spanwright: analyze: enumerating inputs: 250 of 1,000 (25%), "), line);
            assertTrue(line.contains(" s so far, about ") && line.endsWith(" s left"), line);
            p.detail("start 2 of 3");
            assertTrue(p.line(System.nanoTime()).contains("(25%), start 2 of 3, "), p.line(System.nanoTime()));
        }
        assertTrue(err.toString(StandardCharsets.UTF_8).startsWith("spanwright: analyze: enumerating inputs"));
        assertEquals("1,048,576", Progress.grouped(1L << 20));
        assertEquals("999", Progress.grouped(999));
    }

    @Test
    void everyLongCommandReportsAndQuietSilencesIt() throws Exception {
        Path small = dir.resolve("small.json");
        String[] built = run("build", "formula", "a & (b | c)", "--quiet");
        assertEquals("0", built[0], built[2]);
        assertEquals("", built[2], "build --quiet: nothing on stderr");
        Files.writeString(small, built[1]);
        forceProgress();
        String[][] commands = {
            {"analyze"}, {"analyze", "--method", "structure"}, {"optimize", "--seconds", "1"},
            {"bounds", small.toString()}, {"build", "tree", "maj(a, b, c)"}, {"simulate"},
            {"simulate", small.toString(), "--input", "110"}
        };
        String[] expected = {
            "spanwright: analyze: enumerating inputs", "spanwright: analyze: structural analysis",
            "spanwright: optimize: optimising edge weights", "spanwright: bounds: lower bounds",
            "spanwright: build tree: building", "spanwright: simulate: simulating every input",
            "spanwright: simulate: analysing the domain"
        };
        for (int k = 0; k < commands.length; k++) {
            String[] loud = run(commands[k]);
            assertTrue(loud[0].equals("0") || loud[0].equals("1"), String.join(" ", commands[k]) + ": " + loud[2]);
            assertTrue(loud[2].contains(expected[k]), String.join(" ", commands[k]) + ":\n" + loud[2]);
            assertTrue(loud[2].contains(" s so far"), loud[2]);
            String[] args = java.util.Arrays.copyOf(commands[k], commands[k].length + 1);
            args[args.length - 1] = "--quiet";
            String[] quiet = run(args);
            assertEquals(loud[0], quiet[0]);
            assertEquals("", quiet[2], String.join(" ", args) + " prints nothing on stderr");
        }
    }

    @Test
    void sweepReportsPerSizeAndQuietSilencesIt() {
        forceProgress();
        String[] loud = run("sweep", "or", "--n", "2..3", "--no-bounds", "--iterations", "0", "--json");
        assertEquals("0", loud[0], loud[2]);
        assertTrue(loud[2].contains("[sweep] size 2"), loud[2]);
        String[] quiet = run("sweep", "or", "--n", "2..3", "--no-bounds", "--iterations", "0", "--json", "--quiet");
        assertEquals("0", quiet[0]);
        assertEquals("", quiet[2]);
    }

    @Test
    void aShortRunPrintsNothingByDefault() {
        // the default threshold (2 s) is far above the default scenario's few milliseconds
        String[] r = run("analyze");
        assertEquals("0", r[0]);
        assertEquals("", r[2]);
    }
}
