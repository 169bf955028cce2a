package spanwright.io;

import java.nio.charset.StandardCharsets;

/**
 * Turns scenario JSON text into a short, URL-safe fragment string and back, so a whole scenario
 * can travel in a link's {@code #fragment}.
 *
 * <p>Layout of a fragment: the version prefix {@code "s1."} followed by base64url (RFC 4648 §5,
 * no padding) of the bytes
 * <pre>
 *   method (1 byte: 0 = stored, 1 = compressed)
 *   length of the UTF-8 text (unsigned LEB128 varint)
 *   CRC-32 of the UTF-8 text (4 bytes, big-endian; the IEEE polynomial used by zip and PNG)
 *   body (the UTF-8 bytes, or their compressed form)
 * </pre>
 * The compressed form is a byte-oriented LZ77 stream of our own: a control byte {@code 0xxxxxxx}
 * is followed by {@code x+1} literal bytes; a control byte {@code 1xxxxxxx} copies {@code x+3}
 * bytes from a distance given by the unsigned varint that follows (1 ≤ distance ≤ 32,768,
 * copies may overlap). Matches are found with a hash chain over 3-byte prefixes. Cost O(n·c)
 * for n input bytes and a chain limit c = 64; decoding is O(n).
 *
 * <p>Decoding checks everything (prefix, alphabet, method, lengths, distances, checksum) and
 * throws {@link IllegalArgumentException} with a message a person understands; it never returns
 * damaged text. A declared length above {@link #MAX_TEXT_BYTES} is refused before any allocation.
 *
 * <p>Written for TeaVM as well as the JVM: no java.util.zip, no reflection, no String.format, no
 * threads. Stateless and thread-safe.
 */
public final class ShareCodec {
    /** Version prefix of fragments written by this codec. */
    public static final String PREFIX = "s1.";
    /** Largest scenario text (in UTF-8 bytes) a fragment may carry: 4 MiB. */
    public static final int MAX_TEXT_BYTES = 4 * 1024 * 1024;

    private static final int METHOD_STORED = 0;
    private static final int METHOD_LZ = 1;
    private static final int MIN_MATCH = 3;
    private static final int MAX_MATCH = 130;
    private static final int MAX_LITERALS = 128;
    private static final int WINDOW = 32768;
    private static final int HASH_BITS = 15;
    private static final int CHAIN_LIMIT = 64;

    private static final char[] ALPHABET =
            "ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_".toCharArray();
    private static final int[] CRC_TABLE = crcTable();

    private ShareCodec() {}

    /** Encodes scenario text (any string) to a fragment starting with {@link #PREFIX}. */
    public static String encode(String text) {
        if (text == null) {
            throw new IllegalArgumentException("No scenario text to encode.");
        }
        int lone = Json.firstLoneSurrogate(text);
        if (lone >= 0) {
            // UTF-8 cannot carry half a character pair; getBytes would silently write '?'
            throw new IllegalArgumentException("The scenario holds a lone surrogate (half of a character pair,"
                    + " e.g. \\ud800) at character " + lone + "; remove it to make a link.");
        }
        byte[] raw = text.getBytes(StandardCharsets.UTF_8);
        if (raw.length > MAX_TEXT_BYTES) {
            throw new IllegalArgumentException("The scenario is too large for a link ("
                    + raw.length + " bytes; at most " + MAX_TEXT_BYTES + ").");
        }
        byte[] packed = compress(raw);
        int method = packed.length < raw.length ? METHOD_LZ : METHOD_STORED;
        byte[] body = method == METHOD_LZ ? packed : raw;
        ByteSink out = new ByteSink(body.length + 16);
        out.put(method);
        out.putVarint(raw.length);
        int crc = crc32(raw, 0, raw.length);
        out.put(crc >>> 24);
        out.put(crc >>> 16);
        out.put(crc >>> 8);
        out.put(crc);
        out.putAll(body, 0, body.length);
        return PREFIX + base64UrlEncode(out.buffer, out.size);
    }

    /**
     * Decodes a fragment made by {@link #encode}. A leading {@code '#'} and surrounding
     * whitespace are ignored.
     *
     * @throws IllegalArgumentException if the fragment is not ours, of another version, or damaged
     */
    public static String decode(String fragment) {
        if (fragment == null) {
            throw new IllegalArgumentException("The link carries no scenario.");
        }
        String f = fragment.trim();
        if (f.startsWith("#")) {
            f = f.substring(1);
        }
        if (f.isEmpty()) {
            throw new IllegalArgumentException("The link carries no scenario (its part after '#' is empty).");
        }
        if (!f.startsWith(PREFIX)) {
            int dot = f.indexOf('.');
            if (dot > 0 && dot <= 4 && f.charAt(0) == 's') {
                throw new IllegalArgumentException("The link was made by another version of Spanwright (code '"
                        + f.substring(0, dot) + "'; this version reads '" + PREFIX.substring(0, 2) + "').");
            }
            throw new IllegalArgumentException("The link's part after '#' is not a Spanwright scenario code"
                    + " (it should start with '" + PREFIX + "').");
        }
        byte[] data = base64UrlDecode(f, PREFIX.length());
        ByteSource in = new ByteSource(data);
        int method = in.next("the method byte");
        if (method != METHOD_STORED && method != METHOD_LZ) {
            throw damaged("unknown method " + method);
        }
        int length = in.varint("the text length");
        if (length > MAX_TEXT_BYTES) {
            throw damaged("it declares " + length + " bytes of text, more than the limit of " + MAX_TEXT_BYTES);
        }
        int expectedCrc = (in.next("the checksum") << 24) | (in.next("the checksum") << 16)
                | (in.next("the checksum") << 8) | in.next("the checksum");
        byte[] raw;
        if (method == METHOD_STORED) {
            if (in.remaining() != length) {
                throw damaged("it holds " + in.remaining() + " bytes of text where " + length + " were declared");
            }
            raw = new byte[length];
            System.arraycopy(data, in.pos, raw, 0, length);
        } else {
            raw = decompress(in, length);
        }
        if (crc32(raw, 0, raw.length) != expectedCrc) {
            throw damaged("the checksum does not match");
        }
        return new String(raw, StandardCharsets.UTF_8);
    }

    private static IllegalArgumentException damaged(String why) {
        return new IllegalArgumentException("The link's scenario code is damaged (" + why
                + "); it may have been cut short or changed when it was copied.");
    }

    // ---------------------------------------------------------------- LZ77

    static byte[] compress(byte[] src) {
        int n = src.length;
        ByteSink out = new ByteSink(n / 2 + 16);
        int[] head = new int[1 << HASH_BITS];
        for (int i = 0; i < head.length; i++) {
            head[i] = -1;
        }
        int[] prev = new int[Math.max(n, 1)];
        int litStart = 0;
        int i = 0;
        while (i < n) {
            int bestLen = 0;
            int bestDist = 0;
            if (i + MIN_MATCH <= n) {
                int h = hash(src, i);
                int candidate = head[h];
                int chain = 0;
                int maxLen = Math.min(MAX_MATCH, n - i);
                while (candidate >= 0 && i - candidate <= WINDOW && chain < CHAIN_LIMIT) {
                    int len = 0;
                    while (len < maxLen && src[candidate + len] == src[i + len]) {
                        len++;
                    }
                    if (len > bestLen) {
                        bestLen = len;
                        bestDist = i - candidate;
                        if (len == maxLen) {
                            break;
                        }
                    }
                    candidate = prev[candidate];
                    chain++;
                }
                prev[i] = head[h];
                head[h] = i;
            }
            if (bestLen >= MIN_MATCH) {
                flushLiterals(out, src, litStart, i);
                out.put(0x80 | (bestLen - MIN_MATCH));
                out.putVarint(bestDist);
                int end = i + bestLen;
                for (int j = i + 1; j < end; j++) {
                    if (j + MIN_MATCH <= n) {
                        int h = hash(src, j);
                        prev[j] = head[h];
                        head[h] = j;
                    }
                }
                i = end;
                litStart = i;
            } else {
                i++;
            }
        }
        flushLiterals(out, src, litStart, n);
        byte[] result = new byte[out.size];
        System.arraycopy(out.buffer, 0, result, 0, out.size);
        return result;
    }

    private static void flushLiterals(ByteSink out, byte[] src, int from, int to) {
        while (from < to) {
            int run = Math.min(MAX_LITERALS, to - from);
            out.put(run - 1);
            out.putAll(src, from, run);
            from += run;
        }
    }

    private static int hash(byte[] b, int i) {
        int v = (b[i] & 0xff) | ((b[i + 1] & 0xff) << 8) | ((b[i + 2] & 0xff) << 16);
        return (v * 0x9E3779B1) >>> (32 - HASH_BITS);
    }

    private static byte[] decompress(ByteSource in, int length) {
        byte[] out = new byte[length];
        int o = 0;
        while (o < length) {
            int control = in.next("a block header");
            if ((control & 0x80) == 0) {
                int run = control + 1;
                if (run > length - o || run > in.remaining()) {
                    throw damaged("a run of text runs past the end");
                }
                System.arraycopy(in.data, in.pos, out, o, run);
                in.pos += run;
                o += run;
            } else {
                int len = (control & 0x7f) + MIN_MATCH;
                int dist = in.varint("a back-reference");
                if (dist < 1 || dist > o || dist > WINDOW) {
                    throw damaged("a back-reference points outside the text");
                }
                if (len > length - o) {
                    throw damaged("a repeat runs past the declared length");
                }
                for (int k = 0; k < len; k++) {
                    out[o] = out[o - dist];
                    o++;
                }
            }
        }
        if (in.remaining() != 0) {
            throw damaged("there are " + in.remaining() + " stray bytes at its end");
        }
        return out;
    }

    // ---------------------------------------------------------------- CRC-32 (IEEE 802.3)

    private static int[] crcTable() {
        int[] table = new int[256];
        for (int n = 0; n < 256; n++) {
            int c = n;
            for (int k = 0; k < 8; k++) {
                c = (c & 1) != 0 ? 0xEDB88320 ^ (c >>> 1) : c >>> 1;
            }
            table[n] = c;
        }
        return table;
    }

    static int crc32(byte[] b, int from, int to) {
        int c = 0xFFFFFFFF;
        for (int i = from; i < to; i++) {
            c = CRC_TABLE[(c ^ b[i]) & 0xff] ^ (c >>> 8);
        }
        return ~c;
    }

    // ---------------------------------------------------------------- base64url

    static String base64UrlEncode(byte[] b, int n) {
        StringBuilder sb = new StringBuilder((n * 4 + 2) / 3);
        int i = 0;
        while (i + 3 <= n) {
            int v = ((b[i] & 0xff) << 16) | ((b[i + 1] & 0xff) << 8) | (b[i + 2] & 0xff);
            sb.append(ALPHABET[v >>> 18]).append(ALPHABET[(v >>> 12) & 63])
                    .append(ALPHABET[(v >>> 6) & 63]).append(ALPHABET[v & 63]);
            i += 3;
        }
        int rest = n - i;
        if (rest == 1) {
            int v = (b[i] & 0xff) << 16;
            sb.append(ALPHABET[v >>> 18]).append(ALPHABET[(v >>> 12) & 63]);
        } else if (rest == 2) {
            int v = ((b[i] & 0xff) << 16) | ((b[i + 1] & 0xff) << 8);
            sb.append(ALPHABET[v >>> 18]).append(ALPHABET[(v >>> 12) & 63]).append(ALPHABET[(v >>> 6) & 63]);
        }
        return sb.toString();
    }

    static byte[] base64UrlDecode(String s, int from) {
        int len = s.length() - from;
        if (len % 4 == 1) {
            throw damaged("its length is impossible for base64url");
        }
        byte[] out = new byte[len / 4 * 3 + (len % 4 == 0 ? 0 : len % 4 - 1)];
        int o = 0;
        int acc = 0;
        int bits = 0;
        for (int i = from; i < s.length(); i++) {
            char c = s.charAt(i);
            int v = sextet(c);
            if (v < 0) {
                throw damaged("character '" + (c < 32 || c > 126 ? "\\u" + Integer.toHexString(c) : String.valueOf(c))
                        + "' at position " + (i + 1) + " is not allowed");
            }
            acc = (acc << 6) | v;
            bits += 6;
            if (bits >= 8) {
                bits -= 8;
                out[o++] = (byte) (acc >>> bits);
                acc &= (1 << bits) - 1;
            }
        }
        return out;
    }

    private static int sextet(char c) {
        if (c >= 'A' && c <= 'Z') {
            return c - 'A';
        }
        if (c >= 'a' && c <= 'z') {
            return c - 'a' + 26;
        }
        if (c >= '0' && c <= '9') {
            return c - '0' + 52;
        }
        if (c == '-') {
            return 62;
        }
        if (c == '_') {
            return 63;
        }
        return -1;
    }

    // ---------------------------------------------------------------- byte buffers

    private static final class ByteSink {
        byte[] buffer;
        int size;

        ByteSink(int capacity) {
            buffer = new byte[Math.max(16, capacity)];
        }

        void put(int b) {
            if (size == buffer.length) {
                grow(1);
            }
            buffer[size++] = (byte) b;
        }

        void putAll(byte[] b, int from, int count) {
            if (size + count > buffer.length) {
                grow(count);
            }
            System.arraycopy(b, from, buffer, size, count);
            size += count;
        }

        void putVarint(int v) {
            while ((v & ~0x7f) != 0) {
                put((v & 0x7f) | 0x80);
                v >>>= 7;
            }
            put(v);
        }

        private void grow(int extra) {
            int capacity = Math.max(buffer.length * 2, size + extra);
            byte[] bigger = new byte[capacity];
            System.arraycopy(buffer, 0, bigger, 0, size);
            buffer = bigger;
        }
    }

    private static final class ByteSource {
        final byte[] data;
        int pos;

        ByteSource(byte[] data) {
            this.data = data;
        }

        int remaining() {
            return data.length - pos;
        }

        int next(String what) {
            if (pos >= data.length) {
                throw damaged("it ends before " + what);
            }
            return data[pos++] & 0xff;
        }

        int varint(String what) {
            int v = 0;
            for (int shift = 0; shift < 35; shift += 7) {
                int b = next(what);
                if (shift == 28 && (b & 0x70) != 0) {
                    throw damaged(what + " is out of range");
                }
                v |= (b & 0x7f) << shift;
                if ((b & 0x80) == 0) {
                    if (v < 0) {
                        throw damaged(what + " is out of range");
                    }
                    return v;
                }
            }
            throw damaged(what + " is out of range");
        }
    }
}
