package spanwright.io;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * Reads a text file that must be UTF-8, saying where it is not: "… is not UTF-8 text at byte N"
 * instead of the JDK's "Input length = 1". Cost O(size). Not used by the page.
 */
public final class TextFile {
    private TextFile() {}

    /** Thrown when the bytes are not UTF-8; the message names the file and the byte offset. */
    public static final class NotUtf8Exception extends IOException {
        private static final long serialVersionUID = 1L;
        private final long offset;

        NotUtf8Exception(String name, long offset) {
            super(name + " is not UTF-8 text at byte " + offset + " (counting from 0); save it as UTF-8");
            this.offset = offset;
        }

        /** Offset of the first byte that is not part of a valid UTF-8 sequence. */
        public long offset() {
            return offset;
        }
    }

    /** The file's text, strictly decoded as UTF-8. */
    public static String readUtf8(Path file) throws IOException {
        return decodeUtf8(Files.readAllBytes(file), file.toString());
    }

    /** {@code bytes} strictly decoded as UTF-8; {@code name} is used in the message. */
    public static String decodeUtf8(byte[] bytes, String name) throws NotUtf8Exception {
        CharsetDecoder d = StandardCharsets.UTF_8.newDecoder()
                .onMalformedInput(CodingErrorAction.REPORT)
                .onUnmappableCharacter(CodingErrorAction.REPORT);
        ByteBuffer in = ByteBuffer.wrap(bytes);
        CharBuffer out = CharBuffer.allocate(bytes.length + 1);
        CoderResult r = d.decode(in, out, true);
        if (r.isError()) {
            throw new NotUtf8Exception(name, in.position());
        }
        r = d.flush(out);
        if (r.isError()) {
            throw new NotUtf8Exception(name, in.position());
        }
        out.flip();
        return out.toString();
    }
}
