package spanwright.structure;

import java.math.BigInteger;
import spanwright.model.Deadline;

/**
 * Dynamic programming over vertex subsets, for dense graphs with few vertices (K_n up to about
 * n = 22). Parallel edges are folded into one pair: its multiplicity, its heaviest edge and its
 * capacitance Σ 1/w.
 *
 * <p>Paths (after Held &amp; Karp, "A dynamic programming approach to sequencing problems",
 * J. SIAM 10(1), 1962): for each set X of inner vertices and end j ∈ X, the heaviest s–path
 * through exactly X ending at j, and the number of such paths (product of multiplicities).
 * O(2^k·k²) time and O(2^k·k) memory for k = n − 2 inner vertices.
 *
 * <p>Bonds: every S with s ∈ S, t ∉ S such that G[S] and G[V∖S] are connected is one bond
 * (distinct S give distinct bonds, since S is the component of s once the bond is removed).
 * O(2^k·n) time with bit-set connectivity, O(n²) memory.
 *
 * <p><b>Single-threaded</b>; the static methods allocate their own arrays.
 */
final class SubsetDp {
    private SubsetDp() {}

    /** Largest vertex count the bit masks take. */
    static final int MAX_VERTICES = 31;

    /** States of the path DP for n vertices (k·2^k, k = n − 2), or Long.MAX_VALUE when too many to index. */
    static long pathStates(int n) {
        int k = n - 2;
        if (n > MAX_VERTICES) {
            return Long.MAX_VALUE;
        }
        return Math.max(1L, ((long) k) << k);
    }

    /** Subsets the bond enumeration visits (2^(n−2)). */
    static long bondStates(int n) {
        if (n > MAX_VERTICES + 1) {
            return Long.MAX_VALUE;
        }
        return 1L << (n - 2);
    }

    private static TooWideException tooWide(int n, long states, long maxStates, String what) {
        return new TooWideException(n, maxStates, "vertex-subset dynamic programming for the heaviest " + what
                + " over " + n + " vertices needs " + (states == Long.MAX_VALUE ? "too many" : String.valueOf(states))
                + " states, more than the budget of " + maxStates
                + "; raise the budget, or use frontier search if the graph is sparse (narrow frontier)");
    }

    static Extreme heaviestPath(Component c, long maxStates) {
        return heaviestPath(c, maxStates, Deadline.none());
    }

    /** With a time budget, checked every 256 vertex subsets; throws {@link Deadline.Expired} when it runs out. */
    static Extreme heaviestPath(Component c, long maxStates, Deadline deadline) {
        int n = c.n;
        long states = pathStates(n);
        if (states > maxStates || states > Integer.MAX_VALUE - 8) {
            throw tooWide(n, states, maxStates, "path");
        }
        int k = n - 2;
        // inner vertex index: local vertices except s and t
        int[] inner = new int[n];
        int idx = 0;
        for (int x = 0; x < n; x++) {
            inner[x] = x == c.s || x == c.t ? -1 : idx++;
        }
        // pair tables over k + 2 ids: inner 0..k−1, s = k, t = k + 1
        int ids = k + 2;
        long[] mult = new long[ids * ids];
        double[] heavy = new double[ids * ids];
        int[] heavyEdge = new int[ids * ids];
        for (int e = 0; e < c.m; e++) {
            int p = id(c, inner, k, c.eu[e]);
            int q = id(c, inner, k, c.ev[e]);
            for (int r = 0; r < 2; r++) {
                int pq = r == 0 ? p * ids + q : q * ids + p;
                if (mult[pq] == 0 || c.ew[e] > heavy[pq]) {
                    heavy[pq] = c.ew[e];
                    heavyEdge[pq] = e;
                }
                mult[pq]++;
            }
        }
        int sId = k;
        int tId = k + 1;
        Counts total = new Counts(1);
        double best = Double.NEGATIVE_INFINITY;
        int bestMask = -1;
        int bestEnd = -1;
        if (mult[sId * ids + tId] > 0) {
            Counts one = new Counts(1);
            one.set(0, 1);
            total.addProduct(0, one, 0, mult[sId * ids + tId]);
            best = heavy[sId * ids + tId];
        }
        int size = (int) Math.max(1, states);
        double[] value = new double[size];
        Counts count = new Counts(size);
        byte[] from = new byte[size];
        java.util.Arrays.fill(value, Double.NEGATIVE_INFINITY);
        Counts unit = new Counts(1);
        unit.set(0, 1);
        for (int j = 0; j < k; j++) {
            long mu = mult[sId * ids + j];
            if (mu > 0) {
                int st = (1 << j) * k + j;
                value[st] = heavy[sId * ids + j];
                count.addProduct(st, unit, 0, mu);
                from[st] = -1;
            }
        }
        int full = 1 << k;
        for (int mask = 1; mask < full; mask++) {
            if ((mask & 255) == 0) {
                deadline.check("vertex-subset dynamic programming for the heaviest path, subset " + mask + " of " + full);
            }
            for (int j = 0; j < k; j++) {
                int st = mask * k + j;
                if ((mask & (1 << j)) == 0 || count.isZero(st)) {
                    continue;
                }
                double val = value[st];
                long mt = mult[j * ids + tId];
                if (mt > 0) {
                    total.addProduct(0, count, st, mt);
                    double cand = val + heavy[j * ids + tId];
                    if (cand > best) {
                        best = cand;
                        bestMask = mask;
                        bestEnd = j;
                    }
                }
                for (int l = 0; l < k; l++) {
                    long ml = mult[j * ids + l];
                    if ((mask & (1 << l)) != 0 || ml == 0) {
                        continue;
                    }
                    int to = (mask | (1 << l)) * k + l;
                    count.addProduct(to, count, st, ml);
                    double cand = val + heavy[j * ids + l];
                    if (cand > value[to]) {
                        value[to] = cand;
                        from[to] = (byte) j;
                    }
                }
            }
        }
        String method = "vertex-subset dynamic programming over " + n + " vertices, " + states + " states";
        BigInteger paths = total.get(0);
        if (paths.signum() == 0) {
            return new Extreme(Double.NaN, null, BigInteger.ZERO, method);
        }
        boolean[] chosen = new boolean[c.m];
        if (bestMask < 0) {
            chosen[heavyEdge[sId * ids + tId]] = true;
        } else {
            chosen[heavyEdge[bestEnd * ids + tId]] = true;
            int mask = bestMask;
            int j = bestEnd;
            while (true) {
                int p = from[mask * k + j];
                chosen[heavyEdge[(p < 0 ? sId : p) * ids + j]] = true;
                if (p < 0) {
                    break;
                }
                mask &= ~(1 << j);
                j = p;
            }
        }
        return new Extreme(best, c.hostEdges(chosen), paths, method);
    }

    private static int id(Component c, int[] inner, int k, int x) {
        return x == c.s ? k : x == c.t ? k + 1 : inner[x];
    }

    static Extreme heaviestBond(Component c, long maxStates) {
        return heaviestBond(c, maxStates, Deadline.none());
    }

    /** With a time budget, checked every 4096 sides; throws {@link Deadline.Expired} when it runs out. */
    static Extreme heaviestBond(Component c, long maxStates, Deadline deadline) {
        int n = c.n;
        long states = bondStates(n);
        if (states > maxStates || n > MAX_VERTICES) {
            throw tooWide(n, states, maxStates, "bond");
        }
        int[] adj = new int[n];
        double[] cap = new double[n * n];
        for (int e = 0; e < c.m; e++) {
            int p = c.eu[e];
            int q = c.ev[e];
            adj[p] |= 1 << q;
            adj[q] |= 1 << p;
            cap[p * n + q] += 1.0 / c.ew[e];
            cap[q * n + p] += 1.0 / c.ew[e];
        }
        int[] others = new int[n - 2];
        int k = 0;
        for (int x = 0; x < n; x++) {
            if (x != c.s && x != c.t) {
                others[k++] = x;
            }
        }
        int all = n == 32 ? -1 : (1 << n) - 1;
        long bonds = 0;
        double best = Double.NEGATIVE_INFINITY;
        int bestSide = 0;
        for (long sub = 0; sub < states; sub++) {
            if ((sub & 4095) == 0 && sub > 0) {
                deadline.check("vertex-subset enumeration for the heaviest bond, side " + sub + " of " + states);
            }
            int sideS = 1 << c.s;
            for (int j = 0; j < k; j++) {
                if ((sub & (1L << j)) != 0) {
                    sideS |= 1 << others[j];
                }
            }
            int sideT = all & ~sideS;
            if (!connected(adj, sideS, c.s) || !connected(adj, sideT, c.t)) {
                continue;
            }
            bonds++;
            double val = 0;
            for (int x = 0; x < n; x++) {
                if ((sideS & (1 << x)) == 0) {
                    continue;
                }
                int nb = adj[x] & sideT;
                while (nb != 0) {
                    int y = Integer.numberOfTrailingZeros(nb);
                    nb &= nb - 1;
                    val += cap[x * n + y];
                }
            }
            if (val > best) {
                best = val;
                bestSide = sideS;
            }
        }
        String method = "vertex-subset enumeration over " + n + " vertices, " + states + " sides S tried";
        if (bonds == 0) {
            return new Extreme(Double.NaN, null, BigInteger.ZERO, method);
        }
        boolean[] cut = new boolean[c.m];
        for (int e = 0; e < c.m; e++) {
            cut[e] = ((bestSide >>> c.eu[e]) & 1) != ((bestSide >>> c.ev[e]) & 1);
        }
        return new Extreme(best, c.hostEdges(cut), BigInteger.valueOf(bonds), method);
    }

    /** Whether the vertices of {@code set} are all reachable from {@code root} inside {@code set}. */
    private static boolean connected(int[] adj, int set, int root) {
        int reach = 1 << root;
        int todo = reach;
        while (todo != 0) {
            int x = Integer.numberOfTrailingZeros(todo);
            todo &= todo - 1;
            int add = adj[x] & set & ~reach;
            reach |= add;
            todo |= add;
        }
        return reach == set;
    }
}
