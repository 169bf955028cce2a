package spanwright.bounds;

import java.util.ArrayList;
import java.util.List;

/**
 * Classical complexity measures of f on its domain D, each with its witness:
 * <ul>
 *   <li>D(f), deterministic query complexity: the depth of an optimal decision tree (returned);</li>
 *   <li>C₀(f), C₁(f), C(f) = max(C₀, C₁), certificate complexity: the largest, over inputs x with
 *       f(x) = 0 (resp. 1), of the smallest certificate of x (returned for a worst input);</li>
 *   <li>s(f), sensitivity, and bs(f), block sensitivity: the most variables / disjoint blocks whose
 *       flip (staying in D) changes f (returned for a worst input);</li>
 *   <li>deg(f), exact degree: the degree of the unique multilinear real polynomial equal to f on
 *       {0,1}^n, with a top monomial — for total functions only.</li>
 * </ul>
 * For a promise (D a proper subset of the cube) D, C, s and bs are the usual promise versions:
 * only inputs of D are evaluated or must be certified, and a flip must land in D. The degree of a
 * partial function depends on how it is extended outside D, so it is not computed then.
 *
 * <p>Definitions and the chain s ≤ bs ≤ C ≤ D, deg ≤ D: H. Buhrman and R. de Wolf, "Complexity
 * measures and decision tree complexity: a survey", Theoretical Computer Science 288(1), 2002;
 * block sensitivity: N. Nisan, "CREW PRAMs and decision trees", SIAM J. Computing 20(6), 1991.
 *
 * <p>Written here rather than taken from a library because neither dependency (JGraphT, EJML) has
 * Boolean-function measures. Method: every subcube of {0,1}^n (a partial assignment, 3^n of them,
 * indexed in base 3 with digit 2 = free) is classified as empty / all-0 / all-1 / mixed on D by
 * one pass (O(3^n)); D(f) is then the dynamic programme D(c) = 0 if c is not mixed, else
 * min over free i of 1 + max(D(c|i=0), D(c|i=1)) (O(n·3^n)); the smallest certificate of x is the
 * largest non-mixed subcube containing x, by a dynamic programme over supercubes (O(n·3^n));
 * bs(x) is a maximum packing of minimal sensitive blocks by a dynamic programme over subsets of
 * variables (O(2^n · number of minimal blocks) per input, run only where C(x) could beat the
 * best so far, since bs(x) ≤ C(x)); the degree is the Möbius transform of f (O(n·2^n)).
 * Memory O(3^n) bytes. Limit: {@link #MAX_VARIABLES}.
 */
public final class ClassicalMeasures {
    /** Largest n handled (3^12 = 531,441 subcubes). */
    public static final int MAX_VARIABLES = 12;

    private static final byte HAS_ZERO = 1;
    private static final byte HAS_ONE = 2;
    private static final byte MIXED = 3;
    private static final byte INFINITE = Byte.MAX_VALUE;

    private final TargetFunction function;
    private final DecisionTree tree;
    private final Certificate zeroCertificate;
    private final Certificate oneCertificate;
    private final SensitiveBlocks sensitivity;
    private final SensitiveBlocks blockSensitivity;
    private final TopMonomial degree;

    private ClassicalMeasures(TargetFunction function, DecisionTree tree, Certificate zeroCertificate,
            Certificate oneCertificate, SensitiveBlocks sensitivity, SensitiveBlocks blockSensitivity,
            TopMonomial degree) {
        this.function = function;
        this.tree = tree;
        this.zeroCertificate = zeroCertificate;
        this.oneCertificate = oneCertificate;
        this.sensitivity = sensitivity;
        this.blockSensitivity = blockSensitivity;
        this.degree = degree;
    }

    /**
     * Computes all measures. Cost O(n·3^n + Σ_x 2^n·blocks) time, O(3^n) memory.
     *
     * @throws IllegalArgumentException when n &gt; {@link #MAX_VARIABLES}
     */
    public static ClassicalMeasures compute(TargetFunction f) {
        int n = f.variableCount();
        if (n > MAX_VARIABLES) {
            throw new IllegalArgumentException(n + " variables: classical measures are limited to " + MAX_VARIABLES);
        }
        int[] pow3 = new int[n + 1];
        pow3[0] = 1;
        for (int j = 1; j <= n; j++) {
            pow3[j] = 3 * pow3[j - 1];
        }
        int count = pow3[n];
        byte[] code = classify(f, pow3, count);
        DecisionTree tree = decisionTree(f, pow3, count, code);
        int[] certificateSize = new int[f.size()];
        Certificate[] worst = certificates(f, pow3, count, code, certificateSize);
        SensitiveBlocks s = sensitivity(f);
        SensitiveBlocks bs = blockSensitivity(f, certificateSize, s);
        TopMonomial deg = f.isTotal() ? degree(f) : null;
        return new ClassicalMeasures(f, tree, worst[0], worst[1], s, bs, deg);
    }

    // ------------------------------------------------------------------ results

    public TargetFunction function() {
        return function;
    }

    /** D(f). */
    public int decisionTreeDepth() {
        return tree.depth();
    }

    /** An optimal decision tree (depth D(f)). */
    public DecisionTree decisionTree() {
        return tree;
    }

    /** C₀(f); 0 when no input of D has f = 0. */
    public int c0() {
        return zeroCertificate == null ? 0 : zeroCertificate.size();
    }

    /** C₁(f); 0 when no input of D has f = 1. */
    public int c1() {
        return oneCertificate == null ? 0 : oneCertificate.size();
    }

    /** C(f) = max(C₀, C₁). */
    public int c() {
        return Math.max(c0(), c1());
    }

    /** A smallest certificate of a 0-input whose smallest certificate is largest (null if none). */
    public Certificate zeroCertificate() {
        return zeroCertificate;
    }

    /** The same for 1-inputs (null if none). */
    public Certificate oneCertificate() {
        return oneCertificate;
    }

    /** s(f). */
    public int sensitivity() {
        return sensitivity.count();
    }

    /** A most sensitive input with its sensitive variables (one block each). */
    public SensitiveBlocks sensitiveInput() {
        return sensitivity;
    }

    /** bs(f). */
    public int blockSensitivity() {
        return blockSensitivity.count();
    }

    /** An input with bs(f) disjoint sensitive blocks. */
    public SensitiveBlocks sensitiveBlocks() {
        return blockSensitivity;
    }

    /** Is deg(f) computed (f total)? */
    public boolean hasDegree() {
        return degree != null;
    }

    /** deg(f), or −1 when not computed (promise). */
    public int degree() {
        return degree == null ? -1 : degree.degree();
    }

    /** A top monomial, or null when not computed (promise). */
    public TopMonomial topMonomial() {
        return degree;
    }

    // ---------------------------------------------------------------- algorithms

    /** Base-3 digit counter over subcubes (digit j belongs to mask bit j; 2 = free). */
    private static void increment(int[] d) {
        for (int j = 0; j < d.length; j++) {
            if (++d[j] < 3) {
                return;
            }
            d[j] = 0;
        }
    }

    private static void decrement(int[] d) {
        for (int j = 0; j < d.length; j++) {
            if (--d[j] >= 0) {
                return;
            }
            d[j] = 2;
        }
    }

    /** Which values of f occur on D ∩ c, for every subcube c, in increasing index order. */
    private static byte[] classify(TargetFunction f, int[] pow3, int count) {
        int n = f.variableCount();
        byte[] code = new byte[count];
        int[] d = new int[n];
        for (int c = 0; c < count; c++) {
            int free = -1;
            long mask = 0;
            for (int j = 0; j < n; j++) {
                if (d[j] == 2) {
                    free = j;
                    break;
                }
                mask |= (long) d[j] << j;
            }
            if (free < 0) {
                int v = f.valueAt(mask);
                code[c] = v == TargetFunction.OUTSIDE ? 0 : (v == 1 ? HAS_ONE : HAS_ZERO);
            } else {
                code[c] = (byte) (code[c - 2 * pow3[free]] | code[c - pow3[free]]);
            }
            increment(d);
        }
        return code;
    }

    private static DecisionTree decisionTree(TargetFunction f, int[] pow3, int count, byte[] code) {
        int n = f.variableCount();
        byte[] depth = new byte[count];
        byte[] query = new byte[count];
        int[] d = new int[n];
        for (int c = 0; c < count; c++) {
            if (code[c] != MIXED) {
                depth[c] = 0;
                query[c] = -1;
            } else {
                int best = INFINITE;
                int arg = -1;
                // variables in input order: bit j = n-1-i
                for (int j = n - 1; j >= 0; j--) {
                    if (d[j] == 2) {
                        int c0 = c - 2 * pow3[j];
                        int v = 1 + Math.max(depth[c0], depth[c0 + pow3[j]]);
                        if (v < best) {
                            best = v;
                            arg = j;
                        }
                    }
                }
                depth[c] = (byte) best;
                query[c] = (byte) arg;
            }
            increment(d);
        }
        return buildTree(count - 1, n, pow3, code, query);
    }

    private static DecisionTree buildTree(int c, int n, int[] pow3, byte[] code, byte[] query) {
        int j = query[c];
        if (j < 0) {
            return DecisionTree.leaf(code[c] == HAS_ONE, code[c] != 0);
        }
        int c0 = c - 2 * pow3[j];
        return DecisionTree.query(n - 1 - j, buildTree(c0, n, pow3, code, query),
                buildTree(c0 + pow3[j], n, pow3, code, query));
    }

    /**
     * Smallest certificate of every input (sizes into {@code sizeOut}, by domain ordinal) and a
     * worst certificate for each value: {0-side, 1-side}.
     */
    private static Certificate[] certificates(TargetFunction f, int[] pow3, int count, byte[] code, int[] sizeOut) {
        int n = f.variableCount();
        byte[] best = new byte[count];
        byte[] up = new byte[count];
        int[] d = new int[n];
        java.util.Arrays.fill(d, 2);
        for (int c = count - 1; c >= 0; c--) {
            int codim = 0;
            for (int j = 0; j < n; j++) {
                if (d[j] != 2) {
                    codim++;
                }
            }
            int b = code[c] == HAS_ZERO || code[c] == HAS_ONE ? codim : INFINITE;
            int arg = -1;
            for (int j = n - 1; j >= 0; j--) {
                if (d[j] != 2) {
                    int s = c + (2 - d[j]) * pow3[j];
                    if (best[s] < b) {
                        b = best[s];
                        arg = j;
                    }
                }
            }
            best[c] = (byte) b;
            up[c] = (byte) arg;
            decrement(d);
        }
        Certificate[] worst = new Certificate[2];
        for (int k = 0; k < f.size(); k++) {
            long x = f.input(k);
            int c = 0;
            for (int j = 0; j < n; j++) {
                if (((x >>> j) & 1L) != 0) {
                    c += pow3[j];
                }
            }
            sizeOut[k] = best[c];
            int side = f.value(k) ? 1 : 0;
            if (worst[side] == null || best[c] > worst[side].size()) {
                while (up[c] >= 0) {
                    int j = up[c];
                    c += (2 - (c / pow3[j]) % 3) * pow3[j];
                }
                long fixed = 0;
                for (int j = 0; j < n; j++) {
                    if ((c / pow3[j]) % 3 != 2) {
                        fixed |= 1L << j;
                    }
                }
                worst[side] = new Certificate(x, f.value(k), fixed);
            }
        }
        return worst;
    }

    private static SensitiveBlocks sensitivity(TargetFunction f) {
        int n = f.variableCount();
        long bestSet = 0;
        int bestCount = -1;
        int bestOrdinal = 0;
        for (int k = 0; k < f.size(); k++) {
            long x = f.input(k);
            int fx = f.value(k) ? 1 : 0;
            long set = 0;
            for (int j = 0; j < n; j++) {
                int v = f.valueAt(x ^ (1L << j));
                if (v != TargetFunction.OUTSIDE && v != fx) {
                    set |= 1L << j;
                }
            }
            if (Long.bitCount(set) > bestCount) {
                bestCount = Long.bitCount(set);
                bestSet = set;
                bestOrdinal = k;
            }
        }
        List<Long> blocks = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            long bit = f.variableMask(i);
            if ((bestSet & bit) != 0) {
                blocks.add(bit);
            }
        }
        return new SensitiveBlocks(f.input(bestOrdinal), f.value(bestOrdinal), blocks);
    }

    private static SensitiveBlocks blockSensitivity(TargetFunction f, int[] certificateSize, SensitiveBlocks s) {
        int n = f.variableCount();
        int full = (1 << n) - 1;
        boolean[] sensitive = new boolean[full + 1];
        boolean[] containsSensitive = new boolean[full + 1];
        int[] pack = new int[full + 1];
        int[] choice = new int[full + 1];
        List<List<Integer>> minimalByLowest = new ArrayList<>();
        for (int j = 0; j < n; j++) {
            minimalByLowest.add(new ArrayList<>());
        }
        // inputs in decreasing order of C(x): bs(x) ≤ C(x) lets the search stop early
        Integer[] order = new Integer[f.size()];
        for (int k = 0; k < order.length; k++) {
            order[k] = k;
        }
        java.util.Arrays.sort(order, (a, b) -> certificateSize[b] != certificateSize[a]
                ? certificateSize[b] - certificateSize[a] : a - b);
        SensitiveBlocks best = s;
        for (int idx : order) {
            if (certificateSize[idx] <= best.count()) {
                break;
            }
            long x = f.input(idx);
            int fx = f.value(idx) ? 1 : 0;
            for (List<Integer> l : minimalByLowest) {
                l.clear();
            }
            for (int b = 1; b <= full; b++) {
                int v = f.valueAt(x ^ b);
                sensitive[b] = v != TargetFunction.OUTSIDE && v != fx;
                boolean sub = false;
                for (int rest = b; rest != 0; rest &= rest - 1) {
                    if (containsSensitive[b ^ (rest & -rest)]) {
                        sub = true;
                        break;
                    }
                }
                containsSensitive[b] = sensitive[b] || sub;
                if (sensitive[b] && !sub) {
                    minimalByLowest.get(Integer.numberOfTrailingZeros(b)).add(b);
                }
            }
            pack[0] = 0;
            for (int u = 1; u <= full; u++) {
                int low = u & -u;
                int bestHere = pack[u ^ low];
                int arg = 0;
                for (int b : minimalByLowest.get(Integer.numberOfTrailingZeros(low))) {
                    if ((b & ~u) == 0 && 1 + pack[u ^ b] > bestHere) {
                        bestHere = 1 + pack[u ^ b];
                        arg = b;
                    }
                }
                pack[u] = bestHere;
                choice[u] = arg;
            }
            if (pack[full] > best.count()) {
                List<Long> blocks = new ArrayList<>();
                for (int u = full; u != 0;) {
                    if (choice[u] == 0) {
                        u ^= u & -u;
                    } else {
                        blocks.add((long) choice[u]);
                        u ^= choice[u];
                    }
                }
                best = new SensitiveBlocks(x, fx == 1, blocks);
            }
        }
        return best;
    }

    /** Möbius transform: coefficient of ∏_{i∈S} x_i is Σ_{T⊆S} (−1)^{|S−T|} f(T). */
    private static TopMonomial degree(TargetFunction f) {
        int n = f.variableCount();
        int size = 1 << n;
        long[] a = new long[size];
        for (int m = 0; m < size; m++) {
            a[m] = f.valueAt(m);
        }
        for (int j = 0; j < n; j++) {
            int bit = 1 << j;
            for (int m = 0; m < size; m++) {
                if ((m & bit) != 0) {
                    a[m] -= a[m ^ bit];
                }
            }
        }
        int bestMask = 0;
        for (int m = 1; m < size; m++) {
            if (a[m] != 0 && Integer.bitCount(m) > Integer.bitCount(bestMask)) {
                bestMask = m;
            }
        }
        return new TopMonomial(bestMask, a[bestMask]);
    }
}
