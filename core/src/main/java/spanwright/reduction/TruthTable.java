package spanwright.reduction;

import spanwright.expr.Expr;

/**
 * A Boolean function of n variables as its 2^n values in input order (mask = input read as a
 * binary number, first variable most significant), packed 64 to a long. Immutable once built.
 * Cost O(2^n) space (bits) and, from an expression, O(2^n × expression size) time.
 */
final class TruthTable {
    /** Largest n a table is built for (2^20 bits = 128 KiB). */
    static final int MAX_VARIABLES = 20;

    final int n;
    private final long[] bits;

    private TruthTable(int n, long[] bits) {
        this.n = n;
        this.bits = bits;
    }

    static TruthTable of(Expr e, int n) {
        long size = 1L << n;
        long[] b = new long[(int) ((size + 63) / 64)];
        for (long m = 0; m < size; m++) {
            if (e.eval(m)) {
                b[(int) (m >>> 6)] |= 1L << (m & 63);
            }
        }
        return new TruthTable(n, b);
    }

    /** From a string of 2^n characters '0'/'1' (already checked by the caller). */
    static TruthTable ofString(String values, int n) {
        long[] b = new long[(int) (((1L << n) + 63) / 64)];
        for (int m = 0; m < values.length(); m++) {
            if (values.charAt(m) == '1') {
                b[m >>> 6] |= 1L << (m & 63);
            }
        }
        return new TruthTable(n, b);
    }

    /** f on input {@code mask}. */
    boolean get(long mask) {
        return (bits[(int) (mask >>> 6)] & (1L << (mask & 63))) != 0;
    }

    /** Whether {@code text} is a truth table: only '0'/'1', length 2^n with n ≥ 1. */
    static int variablesOfString(String text) {
        int len = text.length();
        if (len < 2 || (len & (len - 1)) != 0) {
            return -1;
        }
        for (int i = 0; i < len; i++) {
            char c = text.charAt(i);
            if (c != '0' && c != '1') {
                return -1;
            }
        }
        return Integer.numberOfTrailingZeros(len);
    }
}
