package spanwright.sweep;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.io.Json;
import spanwright.model.ScenarioException;

/**
 * Spanwright's family template language: JSON in which the size parameter (and loop variables)
 * appear, expanded into an ordinary builder request or scenario for each size. Our own syntax,
 * documented in {@code docs/sweeps.md}:
 *
 * <ul>
 *   <li>in a string, {@code $n} is the value of the variable {@code n}; {@code $(n - 1)} the value
 *       of an integer expression ({@code + - * / % ^}, parentheses, {@code min(a, b)},
 *       {@code max(a, b)}, {@code log2(a)}, {@code sqrt(a)}; {@code /}, {@code log2} and
 *       {@code sqrt} round down); {@code $$} is a dollar sign;</li>
 *   <li>{@code $[i = A .. B : BODY]} repeats BODY for i = A … B (integer expressions), joined by
 *       {@code ", "}; {@code $[i = A .. B : BODY : SEP]} joins with SEP (taken as written, spaces
 *       included); BODY (without its leading and trailing spaces) may hold placeholders and
 *       repetitions of its own; an empty range gives an empty text;</li>
 *   <li>a string that is exactly one {@code $name} or {@code $(…)} becomes a JSON number;</li>
 *   <li>in an array, an element {@code {"for": "i = A .. B", "emit": X}} is replaced by X expanded
 *       for each i (when X is an array, by its elements).</li>
 * </ul>
 * Errors name the JSON path and the column inside the string. Written here because no library
 * offers this (it is our syntax); it is a small recursive-descent parser. Immutable, stateless.
 */
public final class TemplateText {
    /** Most characters one expanded string may have (a runaway repetition is refused). */
    public static final int MAX_LENGTH = 2_000_000;
    /** Most elements one {"for"} element may emit. */
    public static final int MAX_REPEAT = 100_000;

    private TemplateText() {}

    /** Expands a JSON value (from {@link Json#parse}) with the variables bound. */
    @SuppressWarnings("unchecked")
    public static Object expand(Object value, Map<String, Long> vars, String path) {
        if (value instanceof String) {
            return expandString((String) value, vars, path);
        }
        if (value instanceof List) {
            List<Object> out = new ArrayList<>();
            List<Object> in = (List<Object>) value;
            for (int i = 0; i < in.size(); i++) {
                Object el = in.get(i);
                String p = path + "[" + i + "]";
                if (el instanceof Map && ((Map<String, Object>) el).containsKey("for")) {
                    expandFor((Map<String, Object>) el, vars, p, out);
                } else {
                    out.add(expand(el, vars, p));
                }
            }
            return out;
        }
        if (value instanceof Map) {
            Map<String, Object> out = new LinkedHashMap<>();
            for (Map.Entry<String, Object> e : ((Map<String, Object>) value).entrySet()) {
                out.put(e.getKey(), expand(e.getValue(), vars, path + "." + e.getKey()));
            }
            return out;
        }
        return value;
    }

    private static void expandFor(Map<String, Object> el, Map<String, Long> vars, String path, List<Object> out) {
        for (String k : el.keySet()) {
            if (!k.equals("for") && !k.equals("emit")) {
                throw new ScenarioException("template", path + "." + k, "a repetition element has only the keys "
                        + "\"for\" and \"emit\", not \"" + k + "\"");
            }
        }
        if (!(el.get("for") instanceof String)) {
            throw new ScenarioException("template", path + ".for", "\"for\" is a text like \"i = 1 .. n\"");
        }
        if (!el.containsKey("emit")) {
            throw new ScenarioException("template", path + ".emit", "missing \"emit\": what to repeat");
        }
        String spec = (String) el.get("for");
        Parser p = new Parser(spec, vars, path + ".for");
        String var = p.name();
        p.expect('=');
        long a = p.sum();
        p.expect('.');
        p.expect('.');
        long b = p.sum();
        p.end();
        if (b - a + 1 > MAX_REPEAT) {
            throw new ScenarioException("template", path + ".for", "the repetition \"" + spec + "\" has "
                    + (b - a + 1) + " steps, more than " + MAX_REPEAT);
        }
        Map<String, Long> inner = new HashMap<>(vars);
        Object emit = el.get("emit");
        for (long i = a; i <= b; i++) {
            inner.put(var, i);
            Object x = expand(emit, inner, path + ".emit");
            if (x instanceof List) {
                out.addAll((List<?>) x);
            } else {
                out.add(x);
            }
        }
    }

    /** Expands the placeholders of one string; a lone numeric placeholder gives a Double. */
    public static Object expandString(String text, Map<String, Long> vars, String path) {
        Parser lone = new Parser(text, vars, path);
        if (lone.isLoneNumber()) {
            try {
                return (double) lone.loneNumber();
            } catch (ArithmeticException e) {
                throw new ScenarioException("template", path, "in \"" + text + "\": a number is too large");
            }
        }
        StringBuilder sb = new StringBuilder();
        try {
            new Parser(text, vars, path).text(sb, text.length());
        } catch (ArithmeticException e) {
            throw new ScenarioException("template", path, "in \"" + text + "\": a number is too large");
        }
        return sb.toString();
    }

    /** Value of an integer expression (e.g. {@code "n / 2"}) with the variables bound. */
    public static long evaluate(String expression, Map<String, Long> vars, String path) {
        Parser p = new Parser(expression, vars, path);
        try {
            long v = p.sum();
            p.end();
            return v;
        } catch (ArithmeticException e) {
            throw new ScenarioException("template", path, "in \"" + expression + "\": a number is too large");
        }
    }

    /** Recursive-descent parser over one string. */
    private static final class Parser {
        private final String s;
        private final Map<String, Long> vars;
        private final String path;
        private int pos;
        /** Levels of '(', unary '-' and '^' open now; at most 200 (no stack overflow on any text). */
        private int nesting;

        private void enter() {
            if (++nesting > 200) {
                throw error("nested more than 200 levels deep");
            }
        }

        Parser(String s, Map<String, Long> vars, String path) {
            this.s = s;
            this.vars = vars;
            this.path = path;
        }

        private ScenarioException error(String what) {
            return new ScenarioException("template", path, "in \"" + shorten(s) + "\" at column " + (pos + 1) + ": "
                    + what);
        }

        private static String shorten(String t) {
            return t.length() <= 60 ? t : t.substring(0, 57) + "…";
        }

        boolean isLoneNumber() {
            String t = s.trim();
            if (t.length() < 2 || t.charAt(0) != '$') {
                return false;
            }
            if (t.charAt(1) == '(') {
                // "$(" … ")" with the closing parenthesis last and matching the first
                int depth = 0;
                for (int i = 1; i < t.length(); i++) {
                    char c = t.charAt(i);
                    if (c == '(') {
                        depth++;
                    } else if (c == ')') {
                        depth--;
                        if (depth == 0) {
                            return i == t.length() - 1;
                        }
                    }
                }
                return false;
            }
            for (int i = 1; i < t.length(); i++) {
                if (!isNameChar(t.charAt(i), i == 1)) {
                    return false;
                }
            }
            return true;
        }

        long loneNumber() {
            skip();
            pos++; // '$'
            long v = placeholderValue();
            skip();
            if (pos < s.length()) {
                throw error("unexpected text after the placeholder");
            }
            return v;
        }

        /** $name or $(expr), after the '$'. */
        private long placeholderValue() {
            if (pos < s.length() && s.charAt(pos) == '(') {
                pos++;
                long v = sum();
                expect(')');
                return v;
            }
            return variable(name());
        }

        /** Appends the expansion of s[pos, end). */
        void text(StringBuilder out, int end) {
            while (pos < end) {
                char c = s.charAt(pos);
                if (c == '$') {
                    pos++;
                    if (pos >= end) {
                        throw error("a '$' must be followed by a name, '(', '[' or '$'");
                    }
                    char d = s.charAt(pos);
                    if (d == '$') {
                        out.append('$');
                        pos++;
                    } else if (d == '[') {
                        pos++;
                        repetition(out);
                    } else if (d == '(' || isNameChar(d, true)) {
                        out.append(placeholderValue());
                    } else {
                        throw error("a '$' must be followed by a name, '(', '[' or '$'");
                    }
                } else {
                    out.append(c);
                    pos++;
                }
                if (out.length() > MAX_LENGTH) {
                    throw error("the expansion is longer than " + MAX_LENGTH + " characters");
                }
            }
        }

        /** After "$[": var = A .. B : BODY [: SEP] ]. */
        private void repetition(StringBuilder out) {
            String var = name();
            expect('=');
            long a = sum();
            expect('.');
            expect('.');
            long b = sum();
            expect(':');
            int bodyStart = pos;
            int bodyEnd = scan(pos, true);
            String sep = ", ";
            int close = bodyEnd;
            int trimmedEnd = bodyEnd;
            while (bodyStart < trimmedEnd && s.charAt(bodyStart) == ' ') {
                bodyStart++;
            }
            while (trimmedEnd > bodyStart && s.charAt(trimmedEnd - 1) == ' ') {
                trimmedEnd--;
            }
            if (bodyEnd < s.length() && s.charAt(bodyEnd) == ':') {
                close = scan(bodyEnd + 1, false);
                sep = s.substring(bodyEnd + 1, Math.min(close, s.length()));
            }
            if (close >= s.length() || s.charAt(close) != ']') {
                pos = s.length();
                throw error("a repetition \"$[\" is not closed by \"]\"");
            }
            if (b - a + 1 > MAX_REPEAT) {
                throw error("the repetition over " + var + " has " + (b - a + 1) + " steps, more than " + MAX_REPEAT);
            }
            Map<String, Long> inner = new HashMap<>(vars);
            for (long i = a; i <= b; i++) {
                if (i > a) {
                    out.append(sep);
                }
                inner.put(var, i);
                Parser body = new Parser(s, inner, path);
                body.pos = bodyStart;
                body.text(out, trimmedEnd);
                if (out.length() > MAX_LENGTH) {
                    throw error("the expansion is longer than " + MAX_LENGTH + " characters");
                }
            }
            pos = close + 1;
        }

        /**
         * From {@code from}, the index of the first ']' (or, for a body, ':') outside nested
         * brackets; s.length() when there is none.
         */
        private int scan(int from, boolean body) {
            int depth = 0;
            int i = from;
            while (i < s.length()) {
                char c = s.charAt(i);
                if (c == '$' && i + 1 < s.length() && s.charAt(i + 1) == '$') {
                    i += 2;
                    continue;
                }
                if (c == '[') {
                    depth++;
                } else if (c == ']') {
                    if (depth == 0) {
                        return i;
                    }
                    depth--;
                } else if (c == ':' && depth == 0 && body) {
                    return i;
                }
                i++;
            }
            return i;
        }

        private static boolean isNameChar(char c, boolean first) {
            return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || c == '_' || (!first && c >= '0' && c <= '9');
        }

        String name() {
            skip();
            int start = pos;
            while (pos < s.length() && isNameChar(s.charAt(pos), pos == start)) {
                pos++;
            }
            if (pos == start) {
                throw error("expected a name");
            }
            return s.substring(start, pos);
        }

        private long variable(String name) {
            Long v = vars == null ? null : vars.get(name);
            if (v == null) {
                throw error("unknown variable \"" + name + "\" (known: " + (vars == null ? "none" : String.join(", ",
                        new java.util.TreeSet<>(vars.keySet()))) + ")");
            }
            return v;
        }

        void skip() {
            while (pos < s.length() && s.charAt(pos) == ' ') {
                pos++;
            }
        }

        void expect(char c) {
            skip();
            if (pos >= s.length() || s.charAt(pos) != c) {
                throw error("expected '" + c + "'");
            }
            pos++;
        }

        void end() {
            skip();
            if (pos < s.length()) {
                throw error("unexpected text");
            }
        }

        long sum() {
            long v = product();
            while (true) {
                skip();
                if (pos < s.length() && s.charAt(pos) == '+') {
                    pos++;
                    v = Math.addExact(v, product());
                } else if (pos < s.length() && s.charAt(pos) == '-') {
                    pos++;
                    v = Math.subtractExact(v, product());
                } else {
                    return v;
                }
            }
        }

        long product() {
            long v = power();
            while (true) {
                skip();
                char c = pos < s.length() ? s.charAt(pos) : 0;
                if (c != '*' && c != '/' && c != '%') {
                    return v;
                }
                pos++;
                long r = power();
                if (c == '*') {
                    v = Math.multiplyExact(v, r);
                } else {
                    if (r == 0) {
                        throw error("division by zero");
                    }
                    long q = v / r;
                    long m = v % r;
                    if (m != 0 && ((m < 0) != (r < 0))) {
                        q--;
                        m += r;
                    }
                    v = c == '/' ? q : m;
                }
            }
        }

        long power() {
            long base = unary();
            skip();
            if (pos < s.length() && s.charAt(pos) == '^') {
                pos++;
                enter();
                long e = power();
                nesting--;
                if (e < 0) {
                    throw error("negative exponent");
                }
                if (base == 0 || base == 1) {
                    return e == 0 ? 1 : base; // no loop of e steps (e may be huge)
                }
                if (base == -1) {
                    return e % 2 == 0 ? 1 : -1;
                }
                long r = 1;
                for (long i = 0; i < e; i++) {
                    r = Math.multiplyExact(r, base); // |base| ≥ 2 overflows within 63 steps
                }
                return r;
            }
            return base;
        }

        long unary() {
            skip();
            if (pos < s.length() && s.charAt(pos) == '-') {
                pos++;
                enter();
                long v = Math.negateExact(unary());
                nesting--;
                return v;
            }
            return atom();
        }

        long atom() {
            skip();
            if (pos >= s.length()) {
                throw error("expected a number, a name or '('");
            }
            char c = s.charAt(pos);
            if (c == '(') {
                enter();
                pos++;
                long v = sum();
                expect(')');
                nesting--;
                return v;
            }
            if (c >= '0' && c <= '9') {
                int start = pos;
                while (pos < s.length() && s.charAt(pos) >= '0' && s.charAt(pos) <= '9') {
                    pos++;
                }
                if (pos - start > 18) {
                    throw error("number too large");
                }
                return Long.parseLong(s.substring(start, pos));
            }
            if (isNameChar(c, true)) {
                String name = name();
                skip();
                if (pos < s.length() && s.charAt(pos) == '(') {
                    pos++;
                    long a = sum();
                    long b = 0;
                    boolean two = name.equals("min") || name.equals("max");
                    if (two) {
                        expect(',');
                        b = sum();
                    }
                    expect(')');
                    switch (name) {
                        case "min": return Math.min(a, b);
                        case "max": return Math.max(a, b);
                        case "log2":
                            if (a < 1) {
                                throw error("log2 of " + a);
                            }
                            return 63 - Long.numberOfLeadingZeros(a);
                        case "sqrt": {
                            if (a < 0) {
                                throw error("sqrt of " + a);
                            }
                            long r = (long) Math.sqrt((double) a);
                            while (r * r > a) {
                                r--;
                            }
                            while ((r + 1) * (r + 1) <= a) {
                                r++;
                            }
                            return r;
                        }
                        default:
                            throw error("unknown function \"" + name + "\" (known: min, max, log2, sqrt)");
                    }
                }
                return variable(name);
            }
            throw error("expected a number, a name or '('");
        }
    }
}
