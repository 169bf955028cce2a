package spanwright.model;

/**
 * Input strings: {@code "0110"} lists the variables' values in declaration order. As a mask the
 * string is read as a binary number (first variable = most significant bit), so masks in
 * increasing order are the inputs in lexicographic order — Spanwright's "input order".
 */
public final class Inputs {
    private Inputs() {}

    /** The input string of {@code mask} for {@code n} variables. */
    public static String format(long mask, int n) {
        char[] c = new char[n];
        for (int i = 0; i < n; i++) {
            c[i] = ((mask >>> (n - 1 - i)) & 1L) != 0 ? '1' : '0';
        }
        return new String(c);
    }

    /**
     * Parses an input string of exactly {@code n} characters '0'/'1'.
     *
     * @return the mask, or −1 when the string has the wrong length or alphabet
     */
    public static long parse(String s, int n) {
        if (s == null || s.length() != n || n > 63) {
            return -1;
        }
        long m = 0;
        for (int i = 0; i < n; i++) {
            char c = s.charAt(i);
            if (c != '0' && c != '1') {
                return -1;
            }
            m = (m << 1) | (c - '0');
        }
        return m;
    }

    /**
     * Parses an input string of exactly {@code n} characters '0'/'1', for any number of variables
     * (graph instances have one variable per edge, often more than a mask holds).
     *
     * @return the values, variable 0 first, or null when the string has the wrong length or alphabet
     */
    public static boolean[] parseBits(String s, int n) {
        if (s == null || s.length() != n) {
            return null;
        }
        boolean[] x = new boolean[n];
        for (int i = 0; i < n; i++) {
            char c = s.charAt(i);
            if (c != '0' && c != '1') {
                return null;
            }
            x[i] = c == '1';
        }
        return x;
    }

    /** Value of variable {@code i} in {@code mask} of {@code n} variables. */
    public static boolean bit(long mask, int i, int n) {
        return ((mask >>> (n - 1 - i)) & 1L) != 0;
    }
}
