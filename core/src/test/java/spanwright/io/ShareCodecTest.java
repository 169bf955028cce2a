package spanwright.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.util.Random;
import org.junit.jupiter.api.Test;

class ShareCodecTest {

    private static final String SAMPLE = "{\"format\":\"spanwright-scenario\",\"version\":1,"
            + "\"title\":\"Three-way vote \u2014 \u00e9t\u00e9 \ud83d\uddf3\",\"variables\":[\"a\",\"b\",\"c\"],"
            + "\"function\":\"maj(a, b, c)\",\"promise\":null,\"graph\":{\"s\":\"s\",\"t\":\"t\","
            + "\"vertices\":[{\"id\":\"s\",\"x\":0,\"y\":0},{\"id\":\"m\"},{\"id\":\"t\"}],"
            + "\"edges\":[{\"id\":\"e1\",\"u\":\"s\",\"v\":\"m\",\"when\":\"a\",\"weight\":1.0},"
            + "{\"id\":\"e2\",\"u\":\"m\",\"v\":\"t\",\"when\":\"!b\"},{\"id\":\"e3\",\"u\":\"s\",\"v\":\"t\",\"when\":\"1\"}]}}";

    @Test
    void roundTripsTextExactly() {
        // Source: the codec's contract (decode(encode(x)) == x), checked on hand-picked texts.
        String[] texts = {"", "a", "aaaa", "abcabcabcabcabc", SAMPLE, "<img src=x onerror=alert(1)>\"><script>",
            "\u0000\u0001\u007f\u0080\u07ff\u0800\uffff", "\ud83d\ude00\ud83d\ude00\ud83d\ude00\ud83d\ude00"};
        for (String text : texts) {
            String fragment = ShareCodec.encode(text);
            assertTrue(fragment.startsWith("s1."), fragment);
            assertTrue(fragment.substring(3).matches("[A-Za-z0-9_-]*"), "URL-safe alphabet only: " + fragment);
            assertEquals(text, ShareCodec.decode(fragment));
            assertEquals(text, ShareCodec.decode("#" + fragment + "\n"));
        }
    }

    @Test
    void roundTripsSeededRandomTexts() {
        // Source: contract decode(encode(x)) == x; random texts from a fixed seed, from
        // low-entropy (long repeats, overlapping copies) to high-entropy, lengths up to 200 kB.
        Random random = new Random(20240611L);
        for (int trial = 0; trial < 200; trial++) {
            int alphabet = 1 + random.nextInt(trial % 3 == 0 ? 3 : 90);
            int length = trial == 199 ? 200_000 : random.nextInt(3000);
            StringBuilder sb = new StringBuilder();
            for (int i = 0; i < length; i++) {
                sb.append((char) (trial % 7 == 0 ? 0x400 + random.nextInt(alphabet) : 32 + random.nextInt(alphabet)));
            }
            String text = sb.toString();
            assertEquals(text, ShareCodec.decode(ShareCodec.encode(text)), "trial " + trial);
        }
    }

    @Test
    void compressesRepetitiveScenarioText() {
        // Source: common practice, no source — LZ77 must shrink text with many repeats. A scenario
        // with 60 similar edges (about 3.7 kB) should fit in well under half its size.
        StringBuilder sb = new StringBuilder("{\"format\":\"spanwright-scenario\",\"version\":1,\"graph\":{\"edges\":[");
        for (int i = 0; i < 60; i++) {
            sb.append(i == 0 ? "" : ",").append("{\"id\":\"e").append(i).append("\",\"u\":\"v").append(i % 9)
                    .append("\",\"v\":\"v").append((i * 7) % 11).append("\",\"when\":\"x").append(i % 5)
                    .append("\",\"weight\":1.0}");
        }
        String text = sb.append("]}}").toString();
        String fragment = ShareCodec.encode(text);
        assertTrue(fragment.length() < text.length() / 2, fragment.length() + " vs " + text.length());
    }

    @Test
    void crc32MatchesTheStandardCheckValue() {
        // Source: the CRC-32 (IEEE) "check" value for the ASCII string 123456789 is 0xCBF43926
        // (Ross Williams' CRC catalogue; also the value zlib's crc32 gives).
        byte[] b = "123456789".getBytes(StandardCharsets.US_ASCII);
        assertEquals(0xCBF43926, ShareCodec.crc32(b, 0, b.length));
    }

    @Test
    void base64UrlMatchesRfc4648Vectors() {
        // Source: RFC 4648 §10 test vectors (without padding, as §5 base64url allows).
        String[][] vectors = {{"", ""}, {"f", "Zg"}, {"fo", "Zm8"}, {"foo", "Zm9v"}, {"foob", "Zm9vYg"},
            {"fooba", "Zm9vYmE"}, {"foobar", "Zm9vYmFy"}};
        for (String[] v : vectors) {
            byte[] b = v[0].getBytes(StandardCharsets.US_ASCII);
            assertEquals(v[1], ShareCodec.base64UrlEncode(b, b.length));
            assertEquals(v[0], new String(ShareCodec.base64UrlDecode(v[1], 0), StandardCharsets.US_ASCII));
        }
    }

    @Test
    void everySingleCharacterChangeIsDetected() {
        // Source: derived — the CRC-32 detects every error confined to one 32-bit span, and
        // structural checks catch the rest; so any one-character substitution must be refused.
        String fragment = ShareCodec.encode(SAMPLE);
        for (int i = 3; i < fragment.length(); i++) {
            char c = fragment.charAt(i);
            char replacement = c == 'A' ? 'B' : 'A';
            String broken = fragment.substring(0, i) + replacement + fragment.substring(i + 1);
            // The last character may carry unused low bits; changing only those keeps the bytes.
            if (i == fragment.length() - 1) {
                continue;
            }
            int index = i;
            IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                    () -> ShareCodec.decode(broken), "position " + index);
            assertTrue(e.getMessage().contains("damaged"), e.getMessage());
        }
    }

    @Test
    void truncatedLinksAreRefused() {
        // Source: common practice, no source — a cut-short link must never decode to other text.
        String fragment = ShareCodec.encode(SAMPLE);
        for (int cut = 3; cut < fragment.length(); cut++) {
            String broken = fragment.substring(0, cut);
            assertThrows(IllegalArgumentException.class, () -> ShareCodec.decode(broken), "cut at " + cut);
        }
    }

    @Test
    void foreignOrGarbageFragmentsGiveClearMessages() {
        // Source: the codec's contract — each refusal says what is wrong in plain words.
        assertMessage("", "empty");
        assertMessage("#", "empty");
        assertMessage("hello", "not a Spanwright scenario code");
        assertMessage("s2.AAAA", "another version");
        assertMessage("s1.ab+c", "not allowed");
        assertMessage("s1.<script>", "not allowed");
        assertMessage("s1.A", "impossible");
        assertMessage("s1.", "ends before");
        // method 1, declared length 2^31-1 via a 5-byte varint: refused before allocating.
        byte[] huge = {1, (byte) 0xff, (byte) 0xff, (byte) 0xff, (byte) 0xff, 0x07, 0, 0, 0, 0};
        assertMessage("s1." + ShareCodec.base64UrlEncode(huge, huge.length), "limit");
        // method 9 does not exist.
        byte[] method = {9, 0, 0, 0, 0, 0};
        assertMessage("s1." + ShareCodec.base64UrlEncode(method, method.length), "unknown method");
        // A back-reference before the start of the text.
        byte[] backRef = {1, 4, 0, 0, 0, 0, (byte) 0x81, 5};
        assertMessage("s1." + ShareCodec.base64UrlEncode(backRef, backRef.length), "back-reference");
        assertThrows(IllegalArgumentException.class, () -> ShareCodec.decode(null));
    }

    private static void assertMessage(String fragment, String expectedPart) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> ShareCodec.decode(fragment));
        assertTrue(e.getMessage().contains(expectedPart), "'" + fragment + "': " + e.getMessage());
    }
}
