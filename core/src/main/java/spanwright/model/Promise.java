package spanwright.model;

import java.util.Arrays;
import java.util.List;
import spanwright.expr.Expr;

/**
 * The input domain: all 2^n inputs, or those a promise allows. Immutable.
 * Kinds: {@link Kind#NONE} (full cube), {@link Kind#EXPRESSION} (inputs where an expression holds),
 * {@link Kind#WEIGHTS} (inputs whose Hamming weight is in a set), {@link Kind#INPUTS} (an explicit
 * list of input strings).
 */
public final class Promise {
    public enum Kind { NONE, EXPRESSION, WEIGHTS, INPUTS }

    public static final Promise NONE = new Promise(Kind.NONE, null, null, null, null);

    private final Kind kind;
    private final String text;
    private final Expr expr;
    private final int[] weights;
    private final long[] inputs;

    private Promise(Kind kind, String text, Expr expr, int[] weights, long[] inputs) {
        this.kind = kind;
        this.text = text;
        this.expr = expr;
        this.weights = weights;
        this.inputs = inputs;
    }

    public static Promise expression(String text, Expr expr) {
        return new Promise(Kind.EXPRESSION, text, expr, null, null);
    }

    /** Allowed Hamming weights (sorted, distinct). */
    public static Promise weights(int[] weights) {
        int[] w = weights.clone();
        Arrays.sort(w);
        return new Promise(Kind.WEIGHTS, null, null, w, null);
    }

    /** An explicit list of inputs as masks in input order (kept sorted, distinct). */
    public static Promise inputs(long[] inputs) {
        long[] x = inputs.clone();
        Arrays.sort(x);
        return new Promise(Kind.INPUTS, null, null, null, x);
    }

    public Kind kind() {
        return kind;
    }

    public String text() {
        return text;
    }

    public Expr expr() {
        return expr;
    }

    public int[] weights() {
        return weights == null ? null : weights.clone();
    }

    public long[] inputs() {
        return inputs == null ? null : inputs.clone();
    }

    /** Whether {@code mask} is in the domain (for {@link Kind#INPUTS} by binary search). */
    public boolean allows(long mask) {
        switch (kind) {
            case NONE:
                return true;
            case EXPRESSION:
                return expr.eval(mask);
            case WEIGHTS:
                return Arrays.binarySearch(weights, Long.bitCount(mask)) >= 0;
            default:
                return Arrays.binarySearch(inputs, mask) >= 0;
        }
    }

    /** Human-readable description, e.g. "Hamming weight in {1, 2}". */
    public String describe(List<String> variables) {
        switch (kind) {
            case NONE:
                return "all inputs";
            case EXPRESSION:
                return "inputs where " + text;
            case WEIGHTS:
                StringBuilder sb = new StringBuilder("Hamming weight in {");
                for (int i = 0; i < weights.length; i++) {
                    sb.append(i > 0 ? ", " : "").append(weights[i]);
                }
                return sb.append('}').toString();
            default:
                return inputs.length + " listed inputs";
        }
    }
}
