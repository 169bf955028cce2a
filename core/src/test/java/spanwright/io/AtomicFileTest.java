package spanwright.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.FilterOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermission;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.List;
import java.util.Set;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Files are written whole or not at all: a write that fails part-way (a fault-injecting stream
 * standing in for a full disk), a target under a regular file, or text that is not encodable
 * leaves the old content and no temporary file. Expectations: the contract in AtomicFile's
 * javadoc; common practice, no source.
 */
class AtomicFileTest {
    @TempDir
    Path dir;

    /** A stream that accepts {@code budget} bytes, then fails as a full disk does. */
    static final class FullDisk extends FilterOutputStream {
        private long budget;

        FullDisk(OutputStream out, long budget) {
            super(out);
            this.budget = budget;
        }

        @Override
        public void write(int b) throws IOException {
            if (budget-- <= 0) {
                throw new IOException("No space left on device");
            }
            super.write(b);
        }

        @Override
        public void write(byte[] b, int off, int len) throws IOException {
            for (int i = 0; i < len; i++) {
                write(b[off + i]);
            }
        }
    }

    private List<String> names() throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().collect(Collectors.toList());
        }
    }

    @Test
    void writesAndReplaces() throws IOException {
        Path p = dir.resolve("out.json");
        AtomicFile.write(p, "first");
        AtomicFile.write(p, "second ✓");
        assertEquals("second ✓", Files.readString(p, StandardCharsets.UTF_8));
        assertEquals(List.of("out.json"), names(), "no temporary file is left");
    }

    @Test
    void aFullDiskPartWayLeavesTheOldContent() throws IOException {
        Path p = dir.resolve("scenario.json");
        Files.writeString(p, "old content", StandardCharsets.UTF_8);
        String big = "x".repeat(100_000);
        for (long budget : new long[] {0, 1, 4096, 99_999}) {
            IOException e = assertThrows(IOException.class,
                    () -> AtomicFile.write(p, big, f -> new FullDisk(f, budget)));
            assertTrue(e.getMessage().contains("No space left"), e.getMessage());
            assertEquals("old content", Files.readString(p, StandardCharsets.UTF_8), "after a failure at " + budget);
            assertEquals(List.of("scenario.json"), names(), "the temporary file is removed");
        }
        // the same write with room enough succeeds
        AtomicFile.write(p, big, f -> new FullDisk(f, 100_000));
        assertEquals(big, Files.readString(p, StandardCharsets.UTF_8));
    }

    @Test
    void aTargetUnderARegularFileFails() throws IOException {
        Path file = dir.resolve("plain");
        Files.writeString(file, "I am a file");
        assertThrows(IOException.class, () -> AtomicFile.write(file.resolve("out.json"), "text"));
        assertEquals("I am a file", Files.readString(file));
        assertEquals(List.of("plain"), names());
    }

    @Test
    void aLoneSurrogateIsRefusedBeforeAnyFileIsTouched() throws IOException {
        Path p = dir.resolve("t.json");
        Files.writeString(p, "old");
        IOException e = assertThrows(IOException.class, () -> AtomicFile.write(p, "title \uD800 end"));
        assertTrue(e.getMessage().contains("lone surrogate") && e.getMessage().contains("6"), e.getMessage());
        assertEquals("old", Files.readString(p));
        assertEquals(List.of("t.json"), names());
    }

    @Test
    void permissionsAreThoseOfAnOrdinaryFileOrTheReplacedOne() throws IOException {
        Path fresh = dir.resolve("fresh.json");
        AtomicFile.write(fresh, "{}");
        // an ordinary new file in the same folder, for comparison (the umask decides both)
        Path plain = Files.createFile(dir.resolve("plain.json"));
        if (Files.getFileStore(dir).supportsFileAttributeView("posix")) {
            Set<PosixFilePermission> ordinary = Files.getPosixFilePermissions(plain);
            assertEquals(ordinary, Files.getPosixFilePermissions(fresh), "not the 0600 of a temp file");
            Set<PosixFilePermission> custom = PosixFilePermissions.fromString("rw-rw-r--");
            Files.setPosixFilePermissions(fresh, custom);
            AtomicFile.write(fresh, "{\"again\": 1}");
            assertEquals(custom, Files.getPosixFilePermissions(fresh), "a replaced file keeps its permissions");
        }
    }
}
