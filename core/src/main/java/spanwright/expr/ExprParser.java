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
 */
public final class ExprParser {
    private final String text;
    private final List<String> variables;
    /** When true, undeclared names are collected into {@link #variables} instead of rejected. */
    private final boolean declaring;
    private int pos;

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

    private Expr whole() {
        skipWs();
        if (pos >= text.length()) {
            throw new ExprException(1, "the expression is empty");
        }
        Expr e = iff();
        skipWs();
        if (pos < text.length()) {
            throw expected("an operator or the end of the expression");
        }
        return e;
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
            return new Expr.Binary(Expr.Op.IMPLIES, e, implies());
        }
        return e;
    }

    private Expr or() {
        Expr e = xor();
        while (true) {
            skipWs();
            if (pos < text.length() && text.charAt(pos) == '|') {
                pos++;
                e = new Expr.Binary(Expr.Op.OR, e, xor());
            } else {
                return e;
            }
        }
    }

    private Expr xor() {
        Expr e = and();
        while (accept("^")) {
            e = new Expr.Binary(Expr.Op.XOR, e, and());
        }
        return e;
    }

    private Expr and() {
        Expr e = unary();
        while (accept("&")) {
            e = new Expr.Binary(Expr.Op.AND, e, unary());
        }
        return e;
    }

    private Expr unary() {
        if (accept("!")) {
            return new Expr.Not(unary());
        }
        return atom();
    }

    private Expr atom() {
        skipWs();
        if (pos >= text.length()) {
            throw expected("a variable, 0, 1, '(' or a function");
        }
        char c = text.charAt(pos);
        if (c == '(') {
            pos++;
            Expr e = iff();
            if (!accept(")")) {
                throw expected("')'");
            }
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
            while (pos < text.length() && Character.isDigit(text.charAt(pos))) {
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

    private static Expr fold(Expr.Op op, List<Expr> args) {
        Expr e = args.get(0);
        for (int i = 1; i < args.size(); i++) {
            e = new Expr.Binary(op, e, args.get(i));
        }
        return e;
    }
}
