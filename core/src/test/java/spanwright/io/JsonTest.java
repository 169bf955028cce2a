package spanwright.io;

import spanwright.model.ScenarioException;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The JSON reader and writer. Expected values come from RFC 8259 (The JavaScript Object Notation
 * (JSON) Data Interchange Format, 2017): its grammar (§2–§7) and escapes (§7); and from the
 * writer's documented contract (non-finite numbers become null, key order is kept).
 */
class JsonTest {

    private static ScenarioException syntaxError(String text) {
        ScenarioException e = assertThrows(ScenarioException.class, () -> Json.parse(text), text);
        assertEquals("json-syntax", e.code(), text);
        assertEquals("$", e.path(), text);
        return e;
    }

    private static void assertAt(String text, int line, int column, String words) {
        ScenarioException e = syntaxError(text);
        String where = "line " + line + ", column " + column;
        assertTrue(e.getMessage().contains(where), "expected " + where + " in: " + e.getMessage());
        assertTrue(e.getMessage().contains(words), "expected '" + words + "' in: " + e.getMessage());
    }

    private static Map<String, Object> map(Object... kv) {
        Map<String, Object> m = new LinkedHashMap<>();
        for (int i = 0; i < kv.length; i += 2) {
            m.put((String) kv[i], kv[i + 1]);
        }
        return m;
    }

    // ------------------------------------------------------------------ reading

    @Test
    void readsEveryKindOfValue() {
        // Source: RFC 8259 §3 (values), §4 (objects), §5 (arrays), §6 (numbers), §7 (strings).
        Object v = Json.parse(" {\"s\": \"x\", \"n\": -12.5e1, \"i\": 3, \"t\": true, \"f\": false,"
            + " \"z\": null, \"a\": [1, [], {}], \"o\": {\"k\": \"v\"}} ");
        Map<String, Object> expected = map("s", "x", "n", -125.0, "i", 3.0, "t", true, "f", false,
            "z", Json.NULL, "a", Arrays.asList(1.0, new ArrayList<>(), new LinkedHashMap<>()), "o", map("k", "v"));
        assertEquals(expected, v);
        assertEquals(List.of("s", "n", "i", "t", "f", "z", "a", "o"), new ArrayList<>(((Map<?, ?>) v).keySet()),
            "key order is kept");
        assertSame(Json.NULL, Json.parse("null"));
        assertEquals(-0.0, Json.parse("-0"));
        assertEquals(1e-7, Json.parse("1E-7"));
        assertEquals(250.0, Json.parse("2.5e+2"));
        assertEquals("", Json.parse("\"\""));
        assertEquals(List.of(), Json.parse("[ ]"));
        assertEquals(Map.of(), Json.parse("{ }"));
    }

    @Test
    void hugeNumbersParseToInfinity() {
        // Source: IEEE 754 double range (max ≈ 1.8e308); RFC 8259 §6 leaves the range to the
        // implementation. The scenario reader rejects such weights (see ScenarioReaderTest).
        assertEquals(Double.POSITIVE_INFINITY, Json.parse("1e400"));
        assertEquals(Double.NEGATIVE_INFINITY, Json.parse("-1e400"));
        assertEquals(0.0, Json.parse("1e-400"));
    }

    @Test
    void readsEscapes() {
        // Source: RFC 8259 §7 — the two-character escapes and \\uXXXX (hex digits in either case).
        assertEquals("\" \\ / \b \f \n \r \t", Json.parse("\"\\\" \\\\ \\/ \\b \\f \\n \\r \\t\""));
        assertEquals("\u00e9\u00E9\u0000\u001f", Json.parse("\"\\u00e9\\u00E9\\u0000\\u001F\""));
    }

    @Test
    void readsUnicode() {
        // Source: RFC 8259 §7 — characters outside the BMP are escaped as a UTF-16 surrogate pair;
        // unescaped non-ASCII text is taken as it is.
        assertEquals("\ud83d\ude00", Json.parse("\"\\ud83d\\ude00\""));
        assertEquals("grüße – 東京 \ud83c\udf09", Json.parse("\"grüße – 東京 \ud83c\udf09\""));
        assertEquals(map("ключ", "значение"), Json.parse("{\"ключ\": \"значение\"}"));
    }

    @Test
    void refusesLoneSurrogatesWithTheirPosition() {
        // Source: Unicode §3.9 / RFC 3629 — UTF-8 encodes scalar values only, so half of a
        // surrogate pair cannot be written to a file or a link; the reader refuses it (code
        // json-syntax) at the column of the lone half, raw or escaped, high or low.
        String[][] cases = {
            {"\"ab\\ud800\"", "column 4"},          // high half at the end of the string
            {"\"ab\\ud800x\"", "column 4"},         // high half followed by an ordinary character
            {"\"ab\\ud800\\n\"", "column 4"},      // … by another escape
            {"\"ab\\udc00\"", "column 4"},          // low half alone
            {"\"ab\uD800cd\"", "column 4"},          // raw high half (a Java string can hold one)
            {"{\n \"k\": \"\uDFFF\"}", "line 2, column 8"}, // raw low half on line 2
            {"\"\\ud83d\\ud83d\\ude00\"", "column 2"}, // two high halves: the first is alone
        };
        for (String[] c : cases) {
            ScenarioException e = assertThrows(ScenarioException.class, () -> Json.parse(c[0]), c[0]);
            assertEquals("json-syntax", e.code());
            assertTrue(e.getMessage().contains("lone surrogate") && e.getMessage().contains(c[1]), c[0] + ": " + e.getMessage());
        }
        // the writer never produces one: a lone half is written as U+FFFD, a pair as it is
        assertEquals("\"a\ufffdb\ufffd\ud83d\ude00\"", Json.write("a\ud800b\udc00\ud83d\ude00"));
        // pairs, raw or escaped, are fine (see readsUnicode)
        assertEquals("\ud83d\ude00\ud83d\ude00", Json.parse("\"\\ud83d\\ude00\ud83d\ude00\""));
    }

    // ------------------------------------------------------------------ writing

    @Test
    void writesCompactly() {
        // Source: the writer's contract; integral doubles below 1e15 print without ".0".
        Map<String, Object> m = map("a", 1.0, "b", 0.5, "c", List.of(true, false), "d", Json.NULL, "e", null,
            "f", "x", "g", 7, "h", 9_000_000_000L, "i", -2.0);
        assertEquals("{\"a\":1,\"b\":0.5,\"c\":[true,false],\"d\":null,\"e\":null,\"f\":\"x\",\"g\":7,"
            + "\"h\":9000000000,\"i\":-2}", Json.write(m));
        assertEquals("[]", Json.write(List.of()));
        assertEquals("{}", Json.write(Map.of()));
    }

    @Test
    void nonFiniteNumbersAreWrittenAsNull() {
        // Source: RFC 8259 §6 — "Numeric values that cannot be represented ... (such as Infinity
        // and NaN) are not permitted"; the writer's contract says they become null.
        assertEquals("null", Json.write(Double.NaN));
        assertEquals("null", Json.write(Double.POSITIVE_INFINITY));
        assertEquals("null", Json.write(Double.NEGATIVE_INFINITY));
        assertEquals("null", Json.write(Float.NaN));
        assertEquals("[1,null,null,2.5]", Json.write(Arrays.asList(1.0, Double.NaN, Double.POSITIVE_INFINITY, 2.5)));
        assertEquals("{\"r\":null}", Json.write(map("r", Double.POSITIVE_INFINITY)));
        String pretty = Json.writePretty(map("r", Double.NaN, "s", List.of(Double.NEGATIVE_INFINITY)));
        assertEquals(map("r", Json.NULL, "s", List.of(Json.NULL)), Json.parse(pretty));
    }

    @Test
    void writesEscapes() {
        // Source: RFC 8259 §7 — quote, backslash and control characters U+0000–U+001F must be
        // escaped; U+2028/U+2029 are escaped too so the text is also valid JavaScript.
        assertEquals("\"\\\" \\\\ \\n \\r \\t \\u0000 \\u001f \\u0008 \\u2028 \\u2029 /\"",
            Json.write("\" \\ \n \r \t \u0000 \u001f \b \u2028 \u2029 /"));
        assertEquals("\"é 東 \ud83d\ude00\"", Json.write("é 東 \ud83d\ude00"), "other characters stay as they are");
    }

    // ------------------------------------------------------------------ round trips

    @Test
    void roundTripsHandWrittenDocuments() {
        // Source: contract parse(write(v)) == v and parse(writePretty(v)) == v.
        String[] docs = {"{\"format\":\"spanwright-scenario\",\"version\":1,\"graph\":{\"edges\":[{\"u\":\"s\","
            + "\"v\":\"t\",\"when\":\"!a\",\"weight\":0.25}]}}", "[1,2.5,-3e-9,1.0E300,\"a\\\"b\",null,true,[[[]]]]",
            "\"\\u0001\\u2028 \\ud83d\\ude00 tab\\t\"", "{\"\":{\"\":[]}}", "-0.1", "123456789012"};
        for (String doc : docs) {
            Object v = Json.parse(doc);
            assertEquals(v, Json.parse(Json.write(v)), doc);
            assertEquals(v, Json.parse(Json.writePretty(v)), doc);
            assertEquals(Json.write(v), Json.write(Json.parse(Json.write(v))), "writing is stable: " + doc);
        }
    }

    @Test
    void roundTripsSeededRandomValues() {
        // Source: contract parse(write(v)) == v on seeded random trees of every value kind, with
        // strings drawn from control characters, ASCII, accented letters, CJK and surrogate pairs,
        // and doubles of every magnitude (Double.toString is exact: Java SE Double.toString spec).
        Random random = new Random(31_415L);
        for (int trial = 0; trial < 500; trial++) {
            Object v = randomValue(random, 4);
            String compact = Json.write(v);
            assertEquals(v, Json.parse(compact), "trial " + trial + ": " + compact);
            assertEquals(v, Json.parse(Json.writePretty(v)), "trial " + trial + " (pretty)");
        }
    }

    private static Object randomValue(Random r, int depth) {
        int kind = depth == 0 ? r.nextInt(5) : r.nextInt(7);
        switch (kind) {
            case 0:
                return Json.NULL;
            case 1:
                return r.nextBoolean();
            case 2: {
                switch (r.nextInt(4)) {
                    case 0:
                        return (double) (r.nextInt(2_000_001) - 1_000_000);
                    case 1:
                        return r.nextDouble();
                    case 2:
                        return Double.longBitsToDouble(r.nextLong() & 0x7fefffffffffffffL) * (r.nextBoolean() ? 1 : -1);
                    default:
                        return (double) r.nextLong();
                }
            }
            case 3:
            case 4:
                return randomString(r);
            case 5: {
                List<Object> l = new ArrayList<>();
                int n = r.nextInt(6);
                for (int i = 0; i < n; i++) {
                    l.add(randomValue(r, depth - 1));
                }
                return l;
            }
            default: {
                Map<String, Object> m = new LinkedHashMap<>();
                int n = r.nextInt(6);
                for (int i = 0; i < n; i++) {
                    m.put(randomString(r), randomValue(r, depth - 1));
                }
                return m;
            }
        }
    }

    private static String randomString(Random r) {
        StringBuilder sb = new StringBuilder();
        int n = r.nextInt(12);
        for (int i = 0; i < n; i++) {
            switch (r.nextInt(6)) {
                case 0:
                    sb.append((char) r.nextInt(0x20));
                    break;
                case 1:
                    sb.append("\"\\/\u2028\u2029\u007f".charAt(r.nextInt(6)));
                    break;
                case 2:
                    sb.append((char) (0xc0 + r.nextInt(0x100)));
                    break;
                case 3:
                    sb.append((char) (0x4e00 + r.nextInt(0x5000)));
                    break;
                case 4:
                    sb.appendCodePoint(0x1f300 + r.nextInt(0x300));
                    break;
                default:
                    sb.append((char) (0x20 + r.nextInt(0x5f)));
            }
        }
        return sb.toString();
    }

    // ------------------------------------------------------------------ errors

    @Test
    void errorsNameLineAndColumn() {
        // Source: RFC 8259 grammar; line and column are 1-based and count characters (derived by
        // counting the characters of each text by hand).
        assertAt("{\n  \"a\": tru\n}", 2, 8, "expected 'true'");
        assertAt("{\"a\" 1}", 1, 6, "expected ':'");
        assertAt("[1, 2,\n\n   ]", 3, 4, "expected a value but found ']'");
        assertAt("{\"a\": 1,}", 1, 9, "expected a quoted key");
        assertAt("{\"a\": 1 \"b\": 2}", 1, 9, "expected ',' or '}'");
        assertAt("[1 2]", 1, 4, "expected ',' or ']'");
        assertAt("{} x", 1, 4, "unexpected text after the end");
        assertAt("", 1, 1, "text ended");
        assertAt("   ", 1, 4, "text ended");
        assertAt("[1,", 1, 4, "text ended");
        assertAt("{\"a\": [1, 2}", 1, 12, "expected ',' or ']'");
        assertAt("\r\n{\n\t'a': 1}", 3, 2, "expected a quoted key"); // '\r' is not a line break on its own here
    }

    @Test
    void errorsInStrings() {
        // Source: RFC 8259 §7.
        assertAt("\"abc", 1, 5, "unterminated string");
        assertAt("\"a\nb\"", 1, 3, "control character");
        assertAt("\"\\x\"", 1, 3, "unknown escape \\x");
        assertAt("\"\\u12G4\"", 1, 7, "bad hex digit");
        assertAt("\"\\u12\"", 1, 4, "\\u escape");
        assertAt("\"\\", 1, 3, "unterminated escape");
    }

    @Test
    void errorsInNumbers() {
        // Source: RFC 8259 §6 — no leading zeros, digits required around '.', in the exponent,
        // after '-'; no '+' sign, no NaN or Infinity literals, no hex.
        assertAt("01", 1, 1, "leading zero");
        assertAt("-", 1, 2, "expected digits");
        assertAt("1.", 1, 3, "after the decimal point");
        assertAt("1e", 1, 3, "exponent");
        assertAt("1e+", 1, 4, "exponent");
        assertAt(".5", 1, 1, "expected a value");
        assertAt("+1", 1, 1, "expected a value");
        assertAt("NaN", 1, 1, "expected a value");
        assertAt("Infinity", 1, 1, "expected a value");
        assertAt("[0x10]", 1, 3, "expected ',' or ']'");
    }

    @Test
    void duplicateKeysAreRejectedAtTheSecondKey() {
        // Source: RFC 8259 §4 says names "SHOULD be unique"; our reader refuses duplicates so a
        // scenario file cannot silently mean two things.
        assertAt("{\"a\": 1, \"a\": 2}", 1, 10, "duplicate key \"a\"");
        assertAt("{\"g\": {\n \"x\": 1,\n \"x\": 1}}", 3, 2, "duplicate key \"x\"");
        // the same key in different objects is fine
        assertEquals(List.of(map("a", 1.0), map("a", 2.0)), Json.parse("[{\"a\":1},{\"a\":2}]"));
    }

    @Test
    void deepNestingIsAnErrorNotACrash() {
        // Source: common practice, no source — a parser must bound its recursion.
        String deep = "[".repeat(100_000);
        ScenarioException e = syntaxError(deep);
        assertTrue(e.getMessage().contains("nesting"), e.getMessage());
        String ok = "[".repeat(150) + "]".repeat(150);
        assertTrue(Json.parse(ok) instanceof List);
    }

    @Test
    void nullTextIsAnError() {
        // Source: the reader's contract (never a NullPointerException for bad input).
        ScenarioException e = assertThrows(ScenarioException.class, () -> Json.parse(null));
        assertEquals("json-syntax", e.code());
    }
}
