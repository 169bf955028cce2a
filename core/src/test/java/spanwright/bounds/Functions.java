package spanwright.bounds;

import java.util.ArrayList;
import java.util.List;
import spanwright.model.Promise;
import spanwright.model.SeededRandom;

/** Test functions and brute-force reference computations for the bounds tests. */
final class Functions {
    private Functions() {}

    /** f over x1..xn given by an expression of the expression language. */
    static TargetFunction of(int n, String expression) {
        return TargetFunction.parse(TargetFunction.names("x", n), expression, null);
    }

    /** The same on the inputs a promise allows. */
    static TargetFunction of(int n, String expression, Promise promise) {
        return TargetFunction.parse(TargetFunction.names("x", n), expression, promise);
    }

    /** "x1, x2, …, xn". */
    static String args(int n) {
        List<String> l = TargetFunction.names("x", n);
        return String.join(", ", l);
    }

    static TargetFunction or(int n) {
        return of(n, "any(" + args(n) + ")");
    }

    static TargetFunction and(int n) {
        return of(n, "all(" + args(n) + ")");
    }

    static TargetFunction parity(int n) {
        return of(n, "parity(" + args(n) + ")");
    }

    /** The 4-bit sortedness function: 1 on the monotone strings 0000, 0001, 0011, 0111, 1111, 1110, 1100, 1000. */
    static TargetFunction sortedness() {
        long[] x = new long[16];
        boolean[] v = new boolean[16];
        for (int m = 0; m < 16; m++) {
            x[m] = m;
            String s = spanwright.model.Inputs.format(m, 4);
            boolean up = s.equals("0000") || s.equals("0001") || s.equals("0011") || s.equals("0111") || s.equals("1111");
            boolean down = s.equals("1111") || s.equals("1110") || s.equals("1100") || s.equals("1000") || s.equals("0000");
            v[m] = up || down;
        }
        return new TargetFunction(TargetFunction.names("x", 4), x, v);
    }

    /**
     * A seeded random function of n variables; with {@code promise} a random subset of about
     * 70% of the cube (at least two inputs) is its domain.
     */
    static TargetFunction random(int n, long seed, boolean promise) {
        SeededRandom r = new SeededRandom(seed);
        List<Long> xs = new ArrayList<>();
        for (long m = 0; m < (1L << n); m++) {
            if (!promise || r.nextDouble() < 0.7 || m < 2) {
                xs.add(m);
            }
        }
        long[] x = new long[xs.size()];
        boolean[] v = new boolean[x.length];
        for (int k = 0; k < x.length; k++) {
            x[k] = xs.get(k);
            v[k] = r.nextDouble() < 0.5;
        }
        return new TargetFunction(TargetFunction.names("x", n), x, v);
    }

    // ------------------------------------------------------- brute-force references

    /** Optimal decision-tree depth on the inputs of the domain consistent with a partial assignment. */
    static int bruteDepth(TargetFunction f, long fixedMask, long fixedValues) {
        boolean seen0 = false;
        boolean seen1 = false;
        for (int k = 0; k < f.size(); k++) {
            long x = f.input(k);
            if ((x & fixedMask) == fixedValues) {
                if (f.value(k)) {
                    seen1 = true;
                } else {
                    seen0 = true;
                }
            }
        }
        if (!(seen0 && seen1)) {
            return 0;
        }
        int best = Integer.MAX_VALUE;
        for (int i = 0; i < f.variableCount(); i++) {
            long bit = f.variableMask(i);
            if ((fixedMask & bit) == 0) {
                int d0 = bruteDepth(f, fixedMask | bit, fixedValues);
                int d1 = bruteDepth(f, fixedMask | bit, fixedValues | bit);
                best = Math.min(best, 1 + Math.max(d0, d1));
            }
        }
        return best;
    }

    /** Does fixing x on the variables of {@code set} force f(x) on the domain? */
    static boolean isCertificate(TargetFunction f, long x, long set) {
        int fx = f.valueAt(x);
        for (int k = 0; k < f.size(); k++) {
            long y = f.input(k);
            if (((x ^ y) & set) == 0 && (f.value(k) ? 1 : 0) != fx) {
                return false;
            }
        }
        return true;
    }

    /** Smallest certificate size of x, by trying every set of variables. */
    static int bruteCertificate(TargetFunction f, long x) {
        int n = f.variableCount();
        int best = n;
        for (long set = 0; set < (1L << n); set++) {
            if (Long.bitCount(set) < best && isCertificate(f, x, set)) {
                best = Long.bitCount(set);
            }
        }
        return best;
    }

    /** Is flipping the block B at x inside the domain and a change of f? */
    static boolean sensitiveTo(TargetFunction f, long x, long block) {
        int v = f.valueAt(x ^ block);
        return block != 0 && v != TargetFunction.OUTSIDE && v != f.valueAt(x);
    }

    /** Largest number of disjoint sensitive blocks at x within the free set, by exhaustive search. */
    static int bruteBlockSensitivity(TargetFunction f, long x, long free) {
        if (free == 0) {
            return 0;
        }
        long low = free & -free;
        int best = bruteBlockSensitivity(f, x, free ^ low);
        // blocks containing the lowest free variable
        long rest = free ^ low;
        for (long sub = rest;; sub = (sub - 1) & rest) {
            long block = sub | low;
            if (sensitiveTo(f, x, block)) {
                best = Math.max(best, 1 + bruteBlockSensitivity(f, x, free ^ block));
            }
            if (sub == 0) {
                break;
            }
        }
        return best;
    }

    /** Fourier degree: the largest |S| with Σ_x f(x)(−1)^{S·x} ≠ 0 (total f). */
    static int fourierDegree(TargetFunction f) {
        int n = f.variableCount();
        int best = 0;
        for (long s = 0; s < (1L << n); s++) {
            long sum = 0;
            for (long x = 0; x < (1L << n); x++) {
                if (f.valueAt(x) == 1) {
                    sum += Long.bitCount(s & x) % 2 == 0 ? 1 : -1;
                }
            }
            if (sum != 0) {
                best = Math.max(best, Long.bitCount(s));
            }
        }
        return best;
    }
}
