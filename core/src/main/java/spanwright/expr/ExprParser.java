package spanwright.expr;

import java.util.ArrayList;
import java.util.List;

/**
 * Parser for Spanwright's expression language.
 *
 * <pre>
 * expr    := iff
 * iff     := implies ( "&lt;-&gt;" implies )*          left-associative
 * implies := or ( "-&gt;" implies )?                  right-associative
 * or      := xor ( "|" xor )*
 * xor     := and ( "^" and )*
 * and     := unary ( "&amp;" unary )*
 * unary   := "!" unary | atom
 * atom    := "0" | "1" | name | "(" expr ")" | call
 * call    := fn "(" args ")"   fn ∈ any all parity maj thr exactly atmost
 *            thr/exactly/atmost take a whole number k first: thr(2, a, b, c)
 * name    := letter or _ , then letters, digits, _ or .
 * </pre>
 *
 * {@code maj(e1..em)} is strict majority: at least ⌊m/2⌋+1 of the arguments true.
 * {@code any} = OR, {@code all} = AND, {@code parity} = XOR of the arguments (0 when empty is not
 * allowed: every function needs at least one argument). A name followed by "(" is a function call;
 * otherwise it is a variable and must be one of the declared variables. Errors report the 1-based
 * column and what was expected. Cost O(length).
 *
 * <p><b>Limits</b> (so that no walk over an expression, here or in any caller, can overflow the
 * stack, in the JVM or in the page's JavaScript): at most {@value #MAX_NESTING} levels of
 * nesting — parentheses, {@code !}, the right side of {@code ->}, function calls — and a tree at
 * most {@value #MAX_DEPTH} deep. Long chains of one associative operator ({@code |}, {@code &},
 * {@code ^}, and {@code any}, {@code all}, {@code parity}) with more than {@value #FLAT_CHAIN}
 * operands are built as balanced trees, so an OR of any length is only about log₂(length) deep;
 * shorter chains stay left-nested as written.
 */
public final class ExprParser {
    /** Most levels of nesting (parentheses, !, ->, function calls) an expression may have. */
    public static final int MAX_NESTING = 200;
    /** Most depth the expression tree may have (checked after parsing, without recursion). */
    public static final int MAX_DEPTH = 1000;
    /** Chains of an associative operator up to this many operands stay left-nested. */
    static final int FLAT_CHAIN = 8;
    private final String text;
    private final List<String> variables;
    /** When true, undeclared names are collected into {@link #variables} instead of rejected. */
    private final boolean declaring;
    private int pos;
    private int nesting;

    private ExprParser(String text, List<String> variables, boolean declaring) {
        this.text = text;
        this.variables = variables;
        this.declaring = declaring;
    }

    /**
     * Parses {@code text} against the declared {@code variables}.
     *
     * @throws ExprException with the column and what was expected
     */
    public static Expr parse(String text, List<String> variables) {
        return new ExprParser(text, variables, false).whole();
    }

    /**
     * The variables an expression uses, in order of first appearance (for callers that build a
     * scenario from an expression alone, such as the builders). The text is fully parsed, so the
     * same syntax errors as {@link #parse} are reported. Cost O(length × distinct names).
     *
     * @throws ExprException with the column and what was expected
     */
    public static List<String> variablesOf(String text) {
        List<String> names = new ArrayList<>();
        new ExprParser(text, names, true).whole();
        return names;
    }

    /** True if {@code name} is one of the language's function names (so not a variable name). */
    public static boolean isFunctionName(String name) {
        switch (name) {
            case "any": case "all": case "parity": case "maj": case "thr": case "exactly": case "atmost":
                return true;
            default:
                return false;
        }
    }

    /**
     * Is {@code text} (trimmed) a string of at least two characters 0/1, such as a truth table?
     * Such text is never an expression (the parser would stop at its second character).
     */
    public static boolean looksLikeTruthTable(String text) {
        return tableDigits(text) != null;
    }

    /**
     * The 0/1 characters of a truth table written with blanks or underscores between groups
     * ({@code "0110 1001"}, {@code "0110_1001"}), or null when {@code text} is not such a string of
     * at least two 0s and 1s.
     */
    public static String tableDigits(String text) {
        if (text == null) {
            return null;
        }
        StringBuilder d = new StringBuilder();
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            if (c == '0' || c == '1') {
                d.append(c);
            } else if (!(c == ' ' || c == '\t' || c == '\n' || c == '\r' || c == '_')) {
                return null;
            }
        }
        return d.length() < 2 ? null : d.toString();
    }

    /**
     * For a string of 0/1 ({@link #looksLikeTruthTable}) whose length is not a power of two, what
     * a truth table needs, e.g. "a truth table needs 2^n characters 0 or 1, one per input (got 7;
     * 4 would make 2 variables, 8 would make 3)"; null otherwise.
     */
    public static String truthTableLengthProblem(String text) {
        if (!looksLikeTruthTable(text)) {
            return null;
        }
        int len = tableDigits(text).length();
        if ((len & (len - 1)) == 0) {
            return null;
        }
        int below = 31 - Integer.numberOfLeadingZeros(len); // 2^below < len < 2^(below+1)
        return "a truth table needs 2^n characters 0 or 1, one per input in input order (got " + len + "; "
                + (below >= 1 ? (1 << below) + " would make " + below + " variable" + (below == 1 ? "" : "s") + ", " : "")
                + (below < 30 ? (1 << (below + 1)) + " would make " + (below + 1) + ")" : "at most 2^30)");
    }

    private Expr whole() {
        skipWs();
        if (pos >= text.length()) {
            throw new ExprException(1, "the expression is empty");
        }
        if (looksLikeTruthTable(text)) {
            String length = truthTableLengthProblem(text);
            int len = tableDigits(text).length();
            throw new ExprException(pos + 1, (length != null ? length + "; and here"
                    : "\"" + (len > 40 ? text.trim().substring(0, 37) + "…" : text.trim()) + "\" reads as a truth table of "
                    + Integer.numberOfTrailingZeros(len) + " variable" + (len == 2 ? "" : "s") + ", but here")
                    + " f is an expression over the variables (e.g. a & !b); a scenario is built from a truth table by"
                    + " the decision-tree builder (build tree TABLE, or New from… → a function)");
        }
        Expr e = iff();
        skipWs();
        if (pos < text.length()) {
            throw expected("an operator or the end of the expression");
        }
        if (depth(e) > MAX_DEPTH) {
            throw new ExprException(1, "the expression is more than " + MAX_DEPTH + " levels deep; write long"
                    + " lists with any(…), all(…) or parity(…), or split it");
        }
        return e;
    }

    /** One more level of nesting at the current position; refused beyond {@link #MAX_NESTING}. */
    private void enter() {
        if (++nesting > MAX_NESTING) {
            throw new ExprException(pos + 1, "the expression nests more than " + MAX_NESTING + " levels deep"
                    + " (parentheses, !, -> and function calls); write it flatter, e.g. long lists as any(…)"
                    + " or all(…), and !!x as x");
        }
    }

    /** Depth of the tree (a leaf is 1), by an explicit stack: O(size), no recursion. */
    static int depth(Expr root) {
        java.util.ArrayDeque<Expr> nodes = new java.util.ArrayDeque<>();
        java.util.ArrayDeque<Integer> depths = new java.util.ArrayDeque<>();
        nodes.push(root);
        depths.push(1);
        int max = 0;
        while (!nodes.isEmpty()) {
            Expr e = nodes.pop();
            int d = depths.pop();
            max = Math.max(max, d);
            if (d > MAX_DEPTH) {
                return d;
            }
            if (e instanceof Expr.Not) {
                nodes.push(((Expr.Not) e).operand);
                depths.push(d + 1);
            } else if (e instanceof Expr.Binary) {
                nodes.push(((Expr.Binary) e).left);
                depths.push(d + 1);
                nodes.push(((Expr.Binary) e).right);
                depths.push(d + 1);
            } else if (e instanceof Expr.Counting) {
                for (Expr a : ((Expr.Counting) e).args) {
                    nodes.push(a);
                    depths.push(d + 1);
                }
            }
        }
        return max;
    }

    /** True if {@code s} is a valid variable name in this language. */
    public static boolean isName(String s) {
        if (s == null || s.isEmpty() || !isNameStart(s.charAt(0))) {
            return false;
        }
        for (int i = 1; i < s.length(); i++) {
            if (!isNamePart(s.charAt(i))) {
                return false;
            }
        }
        return true;
    }

    private static boolean isNameStart(char c) {
        return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || c == '_';
    }

    private static boolean isNamePart(char c) {
        return isNameStart(c) || (c >= '0' && c <= '9') || c == '.';
    }

    private ExprException expected(String what) {
        String found = pos >= text.length() ? "the end of the expression" : "'" + text.charAt(pos) + "'";
        return new ExprException(pos + 1, "expected " + what + " but found " + found);
    }

    private void skipWs() {
        while (pos < text.length() && Character.isWhitespace(text.charAt(pos))) {
            pos++;
        }
    }

    private boolean accept(String token) {
        skipWs();
        if (text.startsWith(token, pos)) {
            pos += token.length();
            return true;
        }
        return false;
    }

    private Expr iff() {
        Expr e = implies();
        while (accept("<->")) {
            e = new Expr.Binary(Expr.Op.IFF, e, implies());
        }
        return e;
    }

    private Expr implies() {
        Expr e = or();
        if (accept("->")) {
            enter();
            Expr r = implies();
            nesting--;
            return new Expr.Binary(Expr.Op.IMPLIES, e, r);
        }
        return e;
    }

    private Expr or() {
        List<Expr> chain = new ArrayList<>();
        chain.add(xor());
        while (true) {
            skipWs();
            if (pos < text.length() && text.charAt(pos) == '|') {
                pos++;
                chain.add(xor());
            } else {
                return fold(Expr.Op.OR, chain);
            }
        }
    }

    private Expr xor() {
        List<Expr> chain = new ArrayList<>();
        chain.add(and());
        while (accept("^")) {
            chain.add(and());
        }
        return fold(Expr.Op.XOR, chain);
    }

    private Expr and() {
        List<Expr> chain = new ArrayList<>();
        chain.add(unary());
        while (accept("&")) {
            chain.add(unary());
        }
        return fold(Expr.Op.AND, chain);
    }

    private Expr unary() {
        int bangs = 0;
        int start = nesting;
        while (accept("!")) {
            enter();
            bangs++;
        }
        Expr e = atom();
        for (int i = 0; i < bangs; i++) {
            e = new Expr.Not(e);
        }
        nesting = start;
        return e;
    }

    private Expr atom() {
        skipWs();
        if (pos >= text.length()) {
            throw expected("a variable, 0, 1, '(' or a function");
        }
        char c = text.charAt(pos);
        if (c == '(') {
            enter(); // the error's column is this parenthesis
            pos++;
            Expr e = iff();
            if (!accept(")")) {
                throw expected("')'");
            }
            nesting--;
            return e;
        }
        if (c == '0' || c == '1') {
            int start = pos;
            pos++;
            if (pos < text.length() && isNamePart(text.charAt(pos))) {
                pos = start;
                throw expected("a variable, 0, 1, '(' or a function");
            }
            return new Expr.Const(c == '1');
        }
        if (!isNameStart(c)) {
            throw expected("a variable, 0, 1, '(' or a function");
        }
        int start = pos;
        while (pos < text.length() && isNamePart(text.charAt(pos))) {
            pos++;
        }
        String name = text.substring(start, pos);
        int afterName = pos;
        skipWs();
        if (pos < text.length() && text.charAt(pos) == '(') {
            return call(name, start);
        }
        pos = afterName;
        int index = variables.indexOf(name);
        if (index < 0 && declaring) {
            if (isFunctionName(name)) {
                throw new ExprException(start + 1, "'" + name + "' is a function name; write " + name
                        + "(…) or choose another variable name");
            }
            variables.add(name);
            index = variables.size() - 1;
        }
        if (index < 0) {
            throw new ExprException(start + 1, "unknown variable '" + name + "' (declared: "
                    + String.join(", ", variables) + ")");
        }
        return new Expr.Var(name, index, variables.size());
    }

    private Expr call(String name, int nameStart) {
        pos++; // '('
        enter();
        Expr e = callBody(name, nameStart);
        nesting--;
        return e;
    }

    private Expr callBody(String name, int nameStart) {
        Expr.Count count = null;
        switch (name) {
            case "thr":
                count = Expr.Count.AT_LEAST;
                break;
            case "exactly":
                count = Expr.Count.EXACTLY;
                break;
            case "atmost":
                count = Expr.Count.AT_MOST;
                break;
            case "any":
            case "all":
            case "parity":
            case "maj":
                break;
            default:
                throw new ExprException(nameStart + 1, "unknown function '" + name
                        + "' (known: any, all, parity, maj, thr, exactly, atmost)");
        }
        int k = 0;
        if (count != null) {
            skipWs();
            int start = pos;
            while (pos < text.length() && text.charAt(pos) >= '0' && text.charAt(pos) <= '9') { // ASCII only
                pos++;
            }
            if (start == pos || pos - start > 6) {
                pos = start;
                throw expected("a whole number k as the first argument of " + name);
            }
            k = Integer.parseInt(text.substring(start, pos));
            if (!accept(",")) {
                throw expected("',' after k");
            }
        }
        List<Expr> args = new ArrayList<>();
        args.add(iff());
        while (accept(",")) {
            args.add(iff());
        }
        if (!accept(")")) {
            throw expected("',' or ')'");
        }
        switch (name) {
            case "any":
                return fold(Expr.Op.OR, args);
            case "all":
                return fold(Expr.Op.AND, args);
            case "parity":
                return fold(Expr.Op.XOR, args);
            case "maj":
                return new Expr.Counting(Expr.Count.AT_LEAST, args.size() / 2 + 1, args);
            default:
                return new Expr.Counting(count, k, args);
        }
    }

    /**
     * {@code args[0] op args[1] op …}: left-nested as written for up to {@link #FLAT_CHAIN}
     * operands, balanced beyond (op is associative, so the value is the same; depth ⌈log₂ n⌉).
     */
    private static Expr fold(Expr.Op op, List<Expr> args) {
        return fold(op, args, 0, args.size());
    }

    private static Expr fold(Expr.Op op, List<Expr> args, int from, int to) {
        if (to - from > FLAT_CHAIN) {
            int mid = (from + to) >>> 1;
            return new Expr.Binary(op, fold(op, args, from, mid), fold(op, args, mid, to));
        }
        Expr e = args.get(from);
        for (int i = from + 1; i < to; i++) {
            e = new Expr.Binary(op, e, args.get(i));
        }
        return e;
    }
}
