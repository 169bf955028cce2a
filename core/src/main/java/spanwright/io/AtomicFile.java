package spanwright.io;

import java.io.FileOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.PosixFileAttributeView;
import java.util.concurrent.atomic.AtomicLong;

/**
 * Writes a text file whole or not at all, the one way every file the command-line tool writes is
 * written: the UTF-8 bytes (encoded strictly first, so a lone surrogate is an error before any
 * file is touched) go to a new temporary file {@code .NAME.PID-N.tmp} in the target's own folder,
 * are forced to the disk, and the temporary file is renamed over the target in one atomic step.
 * A crash, a kill or a full disk at any moment leaves either the old file or the new one, never a
 * mix or an empty file; a failed write deletes its temporary file and leaves the target as it
 * was. The new file gets the permissions of the file it replaces, or those of any new file
 * (the process's umask), never the 0600 of {@code Files.createTempFile}.
 *
 * <p>Not used by the page (no files there). Cost: one write of the text, one fsync, one rename.
 */
public final class AtomicFile {
    private static final AtomicLong COUNTER = new AtomicLong();

    /** Opens the stream the bytes go through; tests pass one that fails part-way (a full disk). */
    interface Opener {
        OutputStream open(FileOutputStream file) throws IOException;
    }

    private AtomicFile() {}

    /**
     * Writes {@code text} as UTF-8 to {@code target}, atomically (see the class comment).
     *
     * @throws IOException with a message a person understands when the text cannot be encoded or
     *     any step fails; the target is then unchanged and no temporary file is left
     */
    public static void write(Path target, String text) throws IOException {
        write(target, text, f -> f);
    }

    static void write(Path target, String text, Opener opener) throws IOException {
        byte[] bytes = encode(text);
        Path abs = target.toAbsolutePath().normalize();
        Path dir = abs.getParent();
        if (dir == null) {
            throw new IOException("cannot write to a folder's root: " + target);
        }
        if (Files.isDirectory(abs)) {
            throw new IOException(target + " is a folder");
        }
        Files.createDirectories(dir);
        Path tmp = dir.resolve("." + abs.getFileName() + "." + ProcessHandle.current().pid() + "-"
                + COUNTER.incrementAndGet() + ".tmp");
        boolean done = false;
        try {
            Files.createFile(tmp); // the umask's permissions, like any new file
            copyPermissions(abs, tmp);
            try (FileOutputStream file = new FileOutputStream(tmp.toFile());
                    OutputStream os = opener.open(file)) {
                os.write(bytes);
                os.flush();
                file.getFD().sync();
            }
            try {
                Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            } catch (AtomicMoveNotSupportedException e) {
                throw new IOException("the file system of " + dir + " cannot replace a file atomically", e);
            }
            done = true;
            syncFolder(dir);
        } finally {
            if (!done) {
                Files.deleteIfExists(tmp);
            }
        }
    }

    private static byte[] encode(String text) throws IOException {
        try {
            ByteBuffer b = StandardCharsets.UTF_8.newEncoder()
                    .onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT)
                    .encode(CharBuffer.wrap(text));
            byte[] out = new byte[b.remaining()];
            b.get(out);
            return out;
        } catch (CharacterCodingException e) {
            throw new IOException("the text cannot be written as UTF-8 (it holds a lone surrogate, half of a"
                    + " character pair, near character " + Json.firstLoneSurrogate(text) + ")");
        }
    }

    private static void copyPermissions(Path from, Path to) {
        try {
            PosixFileAttributeView src = Files.getFileAttributeView(from, PosixFileAttributeView.class);
            PosixFileAttributeView dst = Files.getFileAttributeView(to, PosixFileAttributeView.class);
            if (src != null && dst != null && Files.exists(from, LinkOption.NOFOLLOW_LINKS)) {
                dst.setPermissions(src.readAttributes().permissions());
            }
        } catch (IOException | UnsupportedOperationException e) {
            // best effort: the new file keeps the permissions of any new file
        }
    }

    /** Makes the rename itself durable where the platform allows it; best effort. */
    private static void syncFolder(Path dir) {
        try (FileChannel ch = FileChannel.open(dir, StandardOpenOption.READ)) {
            ch.force(true);
        } catch (IOException | RuntimeException e) {
            // not every platform can open a folder; the rename is still atomic
        }
    }
}
