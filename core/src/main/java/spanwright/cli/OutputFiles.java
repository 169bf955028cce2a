package spanwright.cli;

import java.io.IOException;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.NoSuchFileException;
import java.nio.file.NotDirectoryException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import spanwright.io.AtomicFile;

/**
 * The command-line tool's outputs: every file a command writes goes through {@link #write}
 * ({@link AtomicFile}: whole or not at all; a failure is exit 2 with a message), and
 * {@link #refuseClashes} stops a command before any work when an output would replace one of its
 * inputs or another of its outputs.
 */
final class OutputFiles {
    private OutputFiles() {}

    /** Writes {@code text} to {@code file} whole or not at all; a failure is a usage error (exit 2). */
    static void write(String command, String file, String text) {
        try {
            AtomicFile.write(Path.of(file), text);
        } catch (IOException | InvalidPathException e) {
            throw new Main.UsageException(command + ": cannot write " + file + ": " + reason(e)
                    + " (nothing was written; a file already there is unchanged)");
        }
    }

    /** A person's reason for a failed file operation (the JDK's message is often just the path). */
    static String reason(Exception e) {
        if (e instanceof NotDirectoryException || e instanceof FileAlreadyExistsException) {
            // (createDirectories reports a file where a folder should be as "already exists")
            return "a part of the path is a file, not a folder";
        }
        if (e instanceof NoSuchFileException) {
            return "no such file or folder";
        }
        if (e instanceof AccessDeniedException) {
            return "permission denied";
        }
        if (e instanceof FileSystemException && ((FileSystemException) e).getReason() != null) {
            return ((FileSystemException) e).getReason();
        }
        String m = e.getMessage();
        return m == null ? e.getClass().getSimpleName() : m.replace('\n', ' ');
    }

    /**
     * Refuses (exit 2, before any work) an output that names one of the inputs or another output:
     * the same path after normalisation, or the same existing file by another name (a link).
     * Null entries are skipped.
     */
    static void refuseClashes(String command, List<String> inputs, List<String> outputs) {
        List<String> seen = new ArrayList<>();
        for (String out : outputs) {
            if (out == null) {
                continue;
            }
            for (String in : inputs) {
                if (in != null && same(in, out)) {
                    throw new Main.UsageException(command + ": the output " + out + " is also an input ("
                            + in + "); writing it would replace what is being read. Choose another output file");
                }
            }
            for (String other : seen) {
                if (same(other, out)) {
                    throw new Main.UsageException(command + ": " + other + " and " + out + " name the same file;"
                            + " give each output its own file");
                }
            }
            seen.add(out);
        }
    }

    static boolean same(String a, String b) {
        try {
            Path pa = Path.of(a).toAbsolutePath().normalize();
            Path pb = Path.of(b).toAbsolutePath().normalize();
            if (pa.equals(pb)) {
                return true;
            }
            return Files.exists(pa) && Files.exists(pb) && Files.isSameFile(pa, pb);
        } catch (IOException | InvalidPathException e) {
            return false;
        }
    }
}
