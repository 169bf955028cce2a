package spanwright.bounds;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Symmetries of f on its domain: signed variable permutations g(x) = π(x) ⊕ a (variable i of x
 * becomes variable π(i), possibly negated) with g(D) = D and f(g(x)) = f(x) for every x ∈ D.
 * They map the general adversary SDP to itself (the pair equation of (x, y) to that of (gx, gy),
 * the block of variable i to that of π(i)), so by convexity the SDP has an optimal solution
 * invariant under the group they generate: X_{π(i)}[gx, gy] = X_i[x, y], Γ(gx, gy) = Γ(x, y),
 * α(gx) = α(x) (the orbit-averaging argument used for symmetric functions throughout the
 * adversary literature, e.g. Høyer, Lee &amp; Špalek, STOC 2007, arXiv:quant-ph/0611054, §4).
 *
 * <p>Found by a stabiliser-chain search: for each level k and each literal L, one symmetry that
 * fixes variables 0..k−1 and sends variable k to L, by backtracking over the remaining variables
 * with per-variable invariants (sensitivity count, counts of ones and of inputs with the variable
 * set or clear) pruning the images. Any subset of symmetries is valid for the reduction, so the
 * search stops at a budget of {@link #BUDGET} candidate tests (each O(|D|)) and keeps what it
 * found. Cost O(BUDGET · |D|) at worst, usually far less; immutable result.
 */
final class InputSymmetry {
    /** Most candidate maps tested in one search. */
    static final int BUDGET = 200_000;

    private InputSymmetry() {}

    /** The symmetries found (generators of a subgroup of the symmetry group; none for most f). */
    static List<Generator> generators(TargetFunction f) {
        int n = f.variableCount();
        int size = f.size();
        int[] ordinal = new int[1 << n];
        Arrays.fill(ordinal, -1);
        for (int k = 0; k < size; k++) {
            ordinal[(int) f.input(k)] = k;
        }
        long[][] sig = new long[n][];
        for (int i = 0; i < n; i++) {
            long sensitive = 0;
            long set = 0;
            long clear = 0;
            long onesSet = 0;
            long onesClear = 0;
            for (int k = 0; k < size; k++) {
                long x = f.input(k);
                boolean b = f.bit(x, i);
                boolean v = f.value(k);
                int other = f.valueAt(x ^ f.variableMask(i));
                if (other != TargetFunction.OUTSIDE && (other == 1) != v) {
                    sensitive++;
                }
                if (b) {
                    set++;
                    onesSet += v ? 1 : 0;
                } else {
                    clear++;
                    onesClear += v ? 1 : 0;
                }
            }
            sig[i] = new long[] {sensitive, set, clear, onesSet, onesClear};
        }
        Search s = new Search(f, ordinal, sig);
        List<Generator> found = new ArrayList<>();
        for (int k = 0; k < n && s.tests < BUDGET; k++) {
            for (int j = k; j < n; j++) {
                for (int neg = 0; neg < 2; neg++) {
                    if (j == k && neg == 0) {
                        continue;
                    }
                    if (!s.compatible(k, j, neg == 1)) {
                        continue;
                    }
                    int[] image = new int[n];
                    boolean[] negate = new boolean[n];
                    boolean[] taken = new boolean[n];
                    for (int i = 0; i < k; i++) {
                        image[i] = i;
                        taken[i] = true;
                    }
                    image[k] = j;
                    negate[k] = neg == 1;
                    taken[j] = true;
                    int[] map = s.extend(k + 1, image, negate, taken);
                    if (map != null) {
                        found.add(new Generator(image.clone(), negate.clone(), map));
                    }
                }
            }
        }
        return found;
    }

    /** One symmetry: variable i ↦ variable image[i], negated when negate[i]; inputs by ordinal. */
    static final class Generator {
        final int[] image;
        final boolean[] negate;
        final int[] inputMap;

        Generator(int[] image, boolean[] negate, int[] inputMap) {
            this.image = image;
            this.negate = negate;
            this.inputMap = inputMap;
        }
    }

    /** Backtracking state; not thread-safe. */
    private static final class Search {
        final TargetFunction f;
        final int[] ordinal;
        final long[][] sig;
        final int n;
        int tests;

        Search(TargetFunction f, int[] ordinal, long[][] sig) {
            this.f = f;
            this.ordinal = ordinal;
            this.sig = sig;
            this.n = f.variableCount();
        }

        /** May variable i go to variable j (negated when neg)? Compares the invariants. */
        boolean compatible(int i, int j, boolean neg) {
            long[] a = sig[i];
            long[] b = sig[j];
            if (a[0] != b[0]) {
                return false;
            }
            return neg ? a[1] == b[2] && a[2] == b[1] && a[3] == b[4] && a[4] == b[3]
                    : a[1] == b[1] && a[2] == b[2] && a[3] == b[3] && a[4] == b[4];
        }

        int[] extend(int level, int[] image, boolean[] negate, boolean[] taken) {
            if (tests >= BUDGET) {
                return null;
            }
            if (level == n) {
                tests++;
                return test(image, negate);
            }
            for (int j = 0; j < n; j++) {
                if (taken[j]) {
                    continue;
                }
                for (int neg = 0; neg < 2; neg++) {
                    if (!compatible(level, j, neg == 1)) {
                        continue;
                    }
                    image[level] = j;
                    negate[level] = neg == 1;
                    taken[j] = true;
                    int[] map = extend(level + 1, image, negate, taken);
                    taken[j] = false;
                    if (map != null) {
                        return map;
                    }
                }
            }
            return null;
        }

        /** The ordinal map of g when g is a symmetry, else null. O(|D|·n). */
        int[] test(int[] image, boolean[] negate) {
            int size = f.size();
            int[] map = new int[size];
            for (int k = 0; k < size; k++) {
                long x = f.input(k);
                long gx = 0;
                for (int i = 0; i < n; i++) {
                    if (f.bit(x, i) != negate[i]) {
                        gx |= f.variableMask(image[i]);
                    }
                }
                int o = ordinal[(int) gx];
                if (o < 0 || f.value(o) != f.value(k)) {
                    return null;
                }
                map[k] = o;
            }
            return map;
        }
    }
}
