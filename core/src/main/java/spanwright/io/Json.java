package spanwright.io;

import spanwright.model.ScenarioException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A small JSON reader and writer (RFC 8259). Written here rather than taken from a library because
 * the page's TeaVM build forbids reflection-based JSON libraries, and because errors must name the
 * line and column. Objects keep their key order ({@link LinkedHashMap}); numbers are doubles.
 * Values are plain Java objects: {@code Map<String,Object>}, {@code List<Object>}, {@code String},
 * {@code Double}, {@code Boolean}, and {@link #NULL}.
 */
public final class Json {
    /** The JSON null value (distinct from a missing key, which {@link Map#get} reports as null). */
    public static final Object NULL = new Object() {
        @Override
        public String toString() {
            return "null";
        }
    };

    private final String text;
    private int pos;

    private Json(String text) {
        this.text = text;
    }

    /**
     * Parses a complete JSON document. Cost O(length).
     *
     * @throws ScenarioException with code {@code json-syntax} naming line and column
     */
    public static Object parse(String text) {
        if (text == null) {
            throw new ScenarioException("json-syntax", "$", "no JSON text given");
        }
        Json p = new Json(text);
        p.skipWs();
        Object v = p.value(0);
        p.skipWs();
        if (p.pos < text.length()) {
            throw p.error("unexpected text after the end of the JSON value");
        }
        return v;
    }

    private ScenarioException error(String what) {
        int line = 1;
        int col = 1;
        for (int i = 0; i < pos && i < text.length(); i++) {
            if (text.charAt(i) == '\n') {
                line++;
                col = 1;
            } else {
                col++;
            }
        }
        return new ScenarioException("json-syntax", "$",
                "malformed JSON at line " + line + ", column " + col + ": " + what);
    }

    private void skipWs() {
        while (pos < text.length()) {
            char c = text.charAt(pos);
            if (c == ' ' || c == '\t' || c == '\n' || c == '\r') {
                pos++;
            } else {
                break;
            }
        }
    }

    private Object value(int depth) {
        if (depth > 200) {
            throw error("nesting deeper than 200 levels");
        }
        if (pos >= text.length()) {
            throw error("expected a value but the text ended");
        }
        char c = text.charAt(pos);
        switch (c) {
            case '{':
                return object(depth);
            case '[':
                return array(depth);
            case '"':
                return string();
            case 't':
                literal("true");
                return Boolean.TRUE;
            case 'f':
                literal("false");
                return Boolean.FALSE;
            case 'n':
                literal("null");
                return NULL;
            default:
                if (c == '-' || (c >= '0' && c <= '9')) {
                    return number();
                }
                throw error("expected a value but found '" + c + "'");
        }
    }

    private void literal(String word) {
        if (!text.startsWith(word, pos)) {
            throw error("expected '" + word + "'");
        }
        pos += word.length();
    }

    private Map<String, Object> object(int depth) {
        Map<String, Object> map = new LinkedHashMap<>();
        pos++;
        skipWs();
        if (pos < text.length() && text.charAt(pos) == '}') {
            pos++;
            return map;
        }
        while (true) {
            skipWs();
            if (pos >= text.length() || text.charAt(pos) != '"') {
                throw error("expected a quoted key");
            }
            int keyPos = pos;
            String key = string();
            if (map.containsKey(key)) {
                pos = keyPos;
                throw error("duplicate key \"" + key + "\"");
            }
            skipWs();
            if (pos >= text.length() || text.charAt(pos) != ':') {
                throw error("expected ':' after a key");
            }
            pos++;
            skipWs();
            map.put(key, value(depth + 1));
            skipWs();
            if (pos >= text.length()) {
                throw error("expected ',' or '}' but the text ended");
            }
            char c = text.charAt(pos++);
            if (c == '}') {
                return map;
            }
            if (c != ',') {
                pos--;
                throw error("expected ',' or '}'");
            }
        }
    }

    private List<Object> array(int depth) {
        List<Object> list = new ArrayList<>();
        pos++;
        skipWs();
        if (pos < text.length() && text.charAt(pos) == ']') {
            pos++;
            return list;
        }
        while (true) {
            skipWs();
            list.add(value(depth + 1));
            skipWs();
            if (pos >= text.length()) {
                throw error("expected ',' or ']' but the text ended");
            }
            char c = text.charAt(pos++);
            if (c == ']') {
                return list;
            }
            if (c != ',') {
                pos--;
                throw error("expected ',' or ']'");
            }
        }
    }

    /**
     * A string value. A lone surrogate (half of a UTF-16 character pair, raw or written
     * {@code \\ud800}) is refused with its position: UTF-8 cannot hold it, so a file, a link or
     * a result written from it would otherwise change it silently (RFC 8259 §8.2 leaves such
     * strings' behaviour unpredictable; we refuse them).
     */
    private String string() {
        pos++;
        StringBuilder sb = new StringBuilder();
        int highAt = -1; // source position of a high surrogate waiting for its low half
        while (true) {
            if (pos >= text.length()) {
                throw error("unterminated string");
            }
            int at = pos;
            char c = text.charAt(pos++);
            if (c == '"') {
                if (highAt >= 0) {
                    throw loneSurrogate(highAt);
                }
                return sb.toString();
            }
            if (c == '\\') {
                if (pos >= text.length()) {
                    throw error("unterminated escape");
                }
                char e = text.charAt(pos++);
                switch (e) {
                    case '"': sb.append('"'); break;
                    case '\\': sb.append('\\'); break;
                    case '/': sb.append('/'); break;
                    case 'b': sb.append('\b'); break;
                    case 'f': sb.append('\f'); break;
                    case 'n': sb.append('\n'); break;
                    case 'r': sb.append('\r'); break;
                    case 't': sb.append('\t'); break;
                    case 'u':
                        if (pos + 4 > text.length()) {
                            throw error("incomplete \\u escape");
                        }
                        int code = 0;
                        for (int i = 0; i < 4; i++) {
                            int d = hexDigit(text.charAt(pos++));
                            if (d < 0) {
                                throw error("bad hex digit in \\u escape");
                            }
                            code = code * 16 + d;
                        }
                        highAt = surrogateCheck(highAt, (char) code, at);
                        sb.append((char) code);
                        break;
                    default:
                        pos--;
                        throw error("unknown escape \\" + e);
                }
            } else if (c < 0x20) {
                pos--;
                throw error("control character inside a string");
            } else {
                highAt = surrogateCheck(highAt, c, at);
                sb.append(c);
            }
            if (highAt >= 0 && highAt != at) {
                throw loneSurrogate(highAt); // an escape such as \\n followed the high half
            }
        }
    }

    /**
     * Checks the pairing of the character {@code c} read at {@code at}, given the position of a
     * pending high surrogate (−1: none); returns the new pending position.
     */
    private int surrogateCheck(int highAt, char c, int at) {
        if (highAt >= 0) {
            if (!Character.isLowSurrogate(c)) {
                throw loneSurrogate(highAt);
            }
            return -1;
        }
        if (Character.isLowSurrogate(c)) {
            throw loneSurrogate(at);
        }
        return Character.isHighSurrogate(c) ? at : -1;
    }

    private ScenarioException loneSurrogate(int at) {
        pos = at;
        return error("lone surrogate (half of a UTF-16 character pair, e.g. \"\\ud800\" without a following"
                + " \"\\udc00\" … \"\\udfff\") inside a string; UTF-8 cannot hold it: remove it or write the whole"
                + " character");
    }

    /**
     * Index of the first lone surrogate (half of a character pair, which UTF-8 cannot carry) in
     * {@code s}, or −1. O(length). (Here because it is text handling the page may use too.)
     */
    public static int firstLoneSurrogate(String s) {
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (Character.isHighSurrogate(c) && i + 1 < s.length() && Character.isLowSurrogate(s.charAt(i + 1))) {
                i++;
            } else if (Character.isSurrogate(c)) {
                return i;
            }
        }
        return -1;
    }

    /** JSON digits are ASCII 0–9 only (RFC 8259 §6); Character.isDigit would take any script's. */
    private static boolean isAsciiDigit(char c) {
        return c >= '0' && c <= '9';
    }

    /** Value of an ASCII hex digit, or −1 (RFC 8259 §7: \\u is followed by four HEXDIG). */
    private static int hexDigit(char c) {
        return c >= '0' && c <= '9' ? c - '0' : c >= 'a' && c <= 'f' ? c - 'a' + 10 : c >= 'A' && c <= 'F' ? c - 'A' + 10 : -1;
    }

    private Double number() {
        int start = pos;
        if (text.charAt(pos) == '-') {
            pos++;
        }
        int digits = pos;
        while (pos < text.length() && isAsciiDigit(text.charAt(pos))) {
            pos++;
        }
        if (pos == digits) {
            throw error("expected digits in a number");
        }
        if (text.charAt(digits) == '0' && pos - digits > 1) {
            pos = digits;
            throw error("leading zero in a number");
        }
        if (pos < text.length() && text.charAt(pos) == '.') {
            pos++;
            int f = pos;
            while (pos < text.length() && isAsciiDigit(text.charAt(pos))) {
                pos++;
            }
            if (pos == f) {
                throw error("expected digits after the decimal point");
            }
        }
        if (pos < text.length() && (text.charAt(pos) == 'e' || text.charAt(pos) == 'E')) {
            pos++;
            if (pos < text.length() && (text.charAt(pos) == '+' || text.charAt(pos) == '-')) {
                pos++;
            }
            int f = pos;
            while (pos < text.length() && isAsciiDigit(text.charAt(pos))) {
                pos++;
            }
            if (pos == f) {
                throw error("expected digits in the exponent");
            }
        }
        return Double.valueOf(Double.parseDouble(text.substring(start, pos)));
    }

    // ------------------------------------------------------------------ writing

    /** Writes a value compactly. Non-finite numbers become null (JSON has no infinity). */
    public static String write(Object value) {
        StringBuilder sb = new StringBuilder();
        write(sb, value, -1, 0);
        return sb.toString();
    }

    /** Writes a value with two-space indentation, for files a person reads. */
    public static String writePretty(Object value) {
        StringBuilder sb = new StringBuilder();
        write(sb, value, 2, 0);
        sb.append('\n');
        return sb.toString();
    }

    private static void newline(StringBuilder sb, int indent, int level) {
        if (indent >= 0) {
            sb.append('\n');
            for (int i = 0; i < indent * level; i++) {
                sb.append(' ');
            }
        }
    }

    @SuppressWarnings("unchecked")
    private static void write(StringBuilder sb, Object v, int indent, int level) {
        if (v == null || v == NULL) {
            sb.append("null");
        } else if (v instanceof String) {
            quote(sb, (String) v);
        } else if (v instanceof Boolean) {
            sb.append(((Boolean) v).booleanValue() ? "true" : "false");
        } else if (v instanceof Number) {
            writeNumber(sb, (Number) v);
        } else if (v instanceof Map) {
            Map<String, Object> m = (Map<String, Object>) v;
            sb.append('{');
            boolean first = true;
            boolean flat = indent >= 0 && isFlat(m.values());
            for (Map.Entry<String, Object> e : m.entrySet()) {
                if (!first) {
                    sb.append(',');
                    if (flat) {
                        sb.append(' ');
                    }
                }
                first = false;
                if (!flat) {
                    newline(sb, indent, level + 1);
                }
                quote(sb, e.getKey());
                sb.append(indent >= 0 ? ": " : ":");
                write(sb, e.getValue(), indent, level + 1);
            }
            if (!first && !flat) {
                newline(sb, indent, level);
            }
            sb.append('}');
        } else if (v instanceof List) {
            List<Object> l = (List<Object>) v;
            sb.append('[');
            boolean flat = indent >= 0 && isFlat(l);
            for (int i = 0; i < l.size(); i++) {
                if (i > 0) {
                    sb.append(',');
                    if (flat) {
                        sb.append(' ');
                    }
                }
                if (!flat) {
                    newline(sb, indent, level + 1);
                }
                write(sb, l.get(i), indent, level + 1);
            }
            if (!l.isEmpty() && !flat) {
                newline(sb, indent, level);
            }
            sb.append(']');
        } else if (v instanceof RawJson) {
            sb.append(((RawJson) v).text);
        } else {
            quote(sb, v.toString());
        }
    }

    /** Short collections of scalars (or of small objects of scalars) print on one line. */
    private static boolean isFlat(java.util.Collection<Object> values) {
        boolean scalars = true;
        for (Object o : values) {
            if (o instanceof Map || o instanceof List) {
                scalars = false;
                break;
            }
        }
        if (scalars && values.size() <= 64) {
            return true;
        }
        if (values.size() > 12) {
            return false;
        }
        for (Object o : values) {
            if (o instanceof Map) {
                Map<?, ?> m = (Map<?, ?>) o;
                if (m.size() > 8) {
                    return false;
                }
                for (Object x : m.values()) {
                    if (x instanceof Map || x instanceof List) {
                        return false;
                    }
                }
                if (values.size() > 1) {
                    return false;
                }
            } else if (o instanceof List) {
                return false;
            }
        }
        return true;
    }

    private static void writeNumber(StringBuilder sb, Number n) {
        if (n instanceof Integer || n instanceof Long) {
            sb.append(n.longValue());
            return;
        }
        double d = n.doubleValue();
        if (Double.isNaN(d) || Double.isInfinite(d)) {
            sb.append("null");
        } else if (d == Math.rint(d) && Math.abs(d) < 1e15) {
            sb.append((long) d);
        } else {
            sb.append(Double.toString(d));
        }
    }

    /**
     * Appends {@code s} as a JSON string literal. A lone surrogate (which the reader refuses and
     * UTF-8 cannot hold) is written as U+FFFD, the replacement character, so every text this
     * writer produces can be read back; it can only reach the writer from text built in code or
     * quoted in an error message (e.g. a variable name a rename refused).
     */
    public static void quote(StringBuilder sb, String s) {
        sb.append('"');
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (Character.isSurrogate(c)) {
                if (Character.isHighSurrogate(c) && i + 1 < s.length() && Character.isLowSurrogate(s.charAt(i + 1))) {
                    sb.append(c).append(s.charAt(++i));
                } else {
                    sb.append('\ufffd');
                }
                continue;
            }
            switch (c) {
                case '"': sb.append("\\\""); break;
                case '\\': sb.append("\\\\"); break;
                case '\n': sb.append("\\n"); break;
                case '\r': sb.append("\\r"); break;
                case '\t': sb.append("\\t"); break;
                default:
                    if (c < 0x20 || c == '\u2028' || c == '\u2029') {
                        sb.append("\\u");
                        String h = Integer.toHexString(c);
                        for (int k = h.length(); k < 4; k++) {
                            sb.append('0');
                        }
                        sb.append(h);
                    } else {
                        sb.append(c);
                    }
            }
        }
        sb.append('"');
    }

    /** Already-serialised JSON text to embed as a value. */
    public static final class RawJson {
        final String text;

        public RawJson(String text) {
            this.text = text;
        }
    }
}
