package spanwright.structure;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import spanwright.model.ScenarioException;
import spanwright.model.SeededRandom;
import spanwright.structure.PathsAndBonds.Method;

class PathsAndBondsTest {
    private static final long BUDGET = 2_000_000;

    // ------------------------------------------------------------ brute force over all edge subsets

    /** Whether the edge set is a simple s–t path: s and t of degree 1, others 0 or 2, no loop, one piece. */
    static boolean isPath(HostGraph g, boolean[] in) {
        int n = g.vertexCount();
        int[] deg = new int[n];
        int[] parent = new int[n];
        for (int x = 0; x < n; x++) {
            parent[x] = x;
        }
        int used = 0;
        for (int e = 0; e < g.edgeCount(); e++) {
            if (!in[e]) {
                continue;
            }
            if (g.u(e) == g.v(e)) {
                return false;
            }
            used++;
            deg[g.u(e)]++;
            deg[g.v(e)]++;
            parent[find(parent, g.u(e))] = find(parent, g.v(e));
        }
        if (used == 0 || deg[g.s()] != 1 || deg[g.t()] != 1) {
            return false;
        }
        for (int x = 0; x < n; x++) {
            if (x != g.s() && x != g.t() && deg[x] != 0 && deg[x] != 2) {
                return false;
            }
            if (deg[x] > 0 && find(parent, x) != find(parent, g.s())) {
                return false;
            }
        }
        return true;
    }

    private static int find(int[] p, int x) {
        while (p[x] != x) {
            x = p[x];
        }
        return x;
    }

    /** Whether s reaches t using the edges not in {@code removed}. */
    static boolean joined(HostGraph g, boolean[] removed) {
        int n = g.vertexCount();
        int[] parent = new int[n];
        for (int x = 0; x < n; x++) {
            parent[x] = x;
        }
        for (int e = 0; e < g.edgeCount(); e++) {
            if (!removed[e]) {
                parent[find(parent, g.u(e))] = find(parent, g.v(e));
            }
        }
        return find(parent, g.s()) == find(parent, g.t());
    }

    /** Whether the edge set is a minimal s–t cut (removing it separates s and t; no proper subset does). */
    static boolean isBond(HostGraph g, boolean[] in) {
        if (joined(g, in)) {
            return false;
        }
        for (int e = 0; e < g.edgeCount(); e++) {
            if (in[e]) {
                in[e] = false;
                boolean rejoins = joined(g, in);
                in[e] = true;
                if (!rejoins) {
                    return false;
                }
            }
        }
        return true;
    }

    static double sumWeight(HostGraph g, boolean[] in, boolean inverse) {
        double sum = 0;
        for (int e = 0; e < g.edgeCount(); e++) {
            if (in[e]) {
                sum += inverse ? 1.0 / g.weight(e) : g.weight(e);
            }
        }
        return sum;
    }

    /** {max path value, path count, max bond value, bond count} by enumerating all 2^m edge subsets. */
    static double[] bruteForce(HostGraph g) {
        int m = g.edgeCount();
        double bestPath = Double.NaN;
        double bestBond = Double.NaN;
        long paths = 0;
        long bonds = 0;
        boolean[] in = new boolean[m];
        for (int mask = 0; mask < (1 << m); mask++) {
            for (int e = 0; e < m; e++) {
                in[e] = (mask & (1 << e)) != 0;
            }
            if (isPath(g, in)) {
                paths++;
                double v = sumWeight(g, in, false);
                bestPath = Double.isNaN(bestPath) ? v : Math.max(bestPath, v);
            }
            if (isBond(g, in)) {
                bonds++;
                double v = sumWeight(g, in, true);
                bestBond = Double.isNaN(bestBond) ? v : Math.max(bestBond, v);
            }
        }
        return new double[] {bestPath, paths, bestBond, bonds};
    }

    static HostGraph randomMultigraph(SeededRandom rnd) {
        int n = 2 + rnd.nextInt(6);
        int m = rnd.nextInt(15);
        int[] u = new int[m];
        int[] v = new int[m];
        double[] w = new double[m];
        for (int e = 0; e < m; e++) {
            u[e] = rnd.nextInt(n);
            // one edge in eight repeats the previous one (parallel), one in ten is a self-loop
            int roll = rnd.nextInt(40);
            if (e > 0 && roll < 5) {
                u[e] = u[e - 1];
                v[e] = v[e - 1];
            } else if (roll < 9) {
                v[e] = u[e];
            } else {
                v[e] = rnd.nextInt(n);
            }
            w[e] = rnd.nextInt(3) == 0 ? 1 + rnd.nextInt(3) : 0.5 + 1.5 * rnd.nextDouble();
        }
        int s = rnd.nextInt(n);
        int t = (s + 1 + rnd.nextInt(n - 1)) % n;
        return new HostGraph(n, u, v, w, s, t);
    }

    private static void assertClose(double expected, double actual, String what) {
        if (Double.isNaN(expected)) {
            assertTrue(Double.isNaN(actual), what + ": expected NaN, got " + actual);
        } else {
            assertEquals(expected, actual, 1e-9 * Math.max(1, Math.abs(expected)), what);
        }
    }

    /** The witness is checked independently of the solver: shape and value. */
    static void assertValidPath(HostGraph g, Extreme r) {
        if (r.count().signum() == 0) {
            assertTrue(Double.isNaN(r.value()));
            assertNull(r.edges());
            return;
        }
        boolean[] in = r.edges();
        assertEquals(g.edgeCount(), in.length);
        assertTrue(isPath(g, in), "witness is a simple s–t path: " + r.method());
        assertClose(sumWeight(g, in, false), r.value(), "path value = Σ w over the witness");
    }

    static void assertValidBond(HostGraph g, Extreme r) {
        boolean[] in = r.edges();
        assertEquals(g.edgeCount(), in.length);
        assertTrue(isBond(g, in), "witness is a minimal s–t cut: " + r.method());
        assertClose(sumWeight(g, in, true), r.value(), "bond value = Σ 1/w over the witness");
        // both sides connected: S = what s reaches without the bond; the rest of s's component reaches t
        int n = g.vertexCount();
        int[] p = new int[n];
        int[] q = new int[n];
        for (int x = 0; x < n; x++) {
            p[x] = x;
            q[x] = x;
        }
        for (int e = 0; e < g.edgeCount(); e++) {
            q[find(q, g.u(e))] = find(q, g.v(e));
            if (!in[e]) {
                p[find(p, g.u(e))] = find(p, g.v(e));
            }
        }
        for (int x = 0; x < n; x++) {
            if (find(q, x) == find(q, g.s())) {
                assertTrue(find(p, x) == find(p, g.s()) || find(p, x) == find(p, g.t()),
                        "vertex " + x + " of s's component lies on a connected side");
            }
        }
    }

    @Test
    void agreesWithBruteForceOnRandomMultigraphs() {
        SeededRandom rnd = new SeededRandom(20240611L);
        int disconnected = 0;
        int withParallel = 0;
        for (int trial = 0; trial < 400; trial++) {
            HostGraph g = randomMultigraph(rnd);
            // source: independent computation, brute force over all 2^m edge subsets
            double[] bf = bruteForce(g);
            if (bf[1] == 0) {
                disconnected++;
            }
            for (int e = 1; e < g.edgeCount(); e++) {
                if (g.u(e) == g.u(e - 1) && g.v(e) == g.v(e - 1) && g.u(e) != g.v(e)) {
                    withParallel++;
                    break;
                }
            }
            for (Method method : Method.values()) {
                String what = "trial " + trial + " " + method;
                Extreme p = PathsAndBonds.heaviestPath(g, BUDGET, method);
                assertClose(bf[0], p.value(), what + " path value");
                assertEquals(BigInteger.valueOf((long) bf[1]), p.count(), what + " path count");
                assertValidPath(g, p);
                Extreme b = PathsAndBonds.heaviestBond(g, BUDGET, method);
                assertClose(bf[2], b.value(), what + " bond value");
                assertEquals(BigInteger.valueOf((long) bf[3]), b.count(), what + " bond count");
                assertValidBond(g, b);
            }
        }
        assertTrue(disconnected > 10, "the sample includes s, t disconnected: " + disconnected);
        assertTrue(withParallel > 10, "the sample includes parallel edges: " + withParallel);
    }

    @Test
    void disconnectedTerminalsHaveNoPathAndTheEmptyBond() {
        // derived: with s and t in different components no edge set joins them, and the empty set
        // already separates them, so it is the one minimal cut (the spec's convention)
        HostGraph g = new HostGraph(5, new int[] {0, 1, 3, 3}, new int[] {1, 2, 4, 3},
                new double[] {1, 2, 3, 4}, 0, 4);
        Extreme p = PathsAndBonds.heaviestPath(g, BUDGET);
        assertTrue(Double.isNaN(p.value()));
        assertNull(p.edges());
        assertEquals(BigInteger.ZERO, p.count());
        Extreme b = PathsAndBonds.heaviestBond(g, BUDGET);
        assertEquals(0.0, b.value());
        assertArrayEquals(new boolean[4], b.edges());
        assertEquals(BigInteger.ONE, b.count());
    }

    // ------------------------------------------------------------ grids: OEIS A007764

    /** OEIS A007764 (from memory): corner-to-corner simple paths in the k×k grid of vertices, k = 1.. */
    private static final long[] A007764 = {1, 2, 12, 184, 8512, 1262816, 575780564L, 789360053252L};

    @Test
    void gridPathCountsMatchA007764() {
        for (int k = 2; k <= 6; k++) {
            HostGraph g = HostGraph.grid(k, k);
            Extreme p = PathsAndBonds.heaviestPath(g, BUDGET);
            // source: OEIS A007764 (from memory); k ≤ 4 also checked by brute force below
            assertEquals(BigInteger.valueOf(A007764[k - 1]), p.count(), k + "×" + k);
            assertValidPath(g, p);
            // derived: a grid is bipartite and the corners have the same colour when 2(k−1) is even,
            // so every corner path has even length ≤ k² − 1 edges; k² − 1 is reached (snake) when k is odd,
            // and k² − 2 when k is even (a Hamiltonian path would need k² − 1, odd)
            assertEquals(k % 2 == 1 ? k * k - 1 : k * k - 2, p.value(), 0.0, k + "×" + k + " longest");
            assertValidBond(g, PathsAndBonds.heaviestBond(g, BUDGET));
        }
        for (int k = 2; k <= 3; k++) {
            HostGraph g = HostGraph.grid(k, k);
            // source: independent computation, brute force (3×3 has 12 edges)
            double[] bf = bruteForce(g);
            assertEquals(A007764[k - 1], (long) bf[1]);
            Extreme b = PathsAndBonds.heaviestBond(g, BUDGET);
            assertEquals(BigInteger.valueOf((long) bf[3]), b.count(), k + "×" + k + " bonds");
            assertEquals(bf[2], b.value(), 1e-12);
        }
    }

    @Test
    @Tag("slow")
    void fourByFourGridAgreesWithBruteForce() {
        // 4×4 has 24 edges: brute force over 2^24 subsets checks paths only (isPath is cheap)
        HostGraph g = HostGraph.grid(4, 4);
        long paths = 0;
        boolean[] in = new boolean[24];
        for (int mask = 0; mask < (1 << 24); mask++) {
            if (Integer.bitCount(mask) < 6) {
                continue; // a corner path needs at least 6 edges
            }
            for (int e = 0; e < 24; e++) {
                in[e] = (mask & (1 << e)) != 0;
            }
            if (isPath(g, in)) {
                paths++;
            }
        }
        // source: independent computation, brute force; OEIS A007764 (from memory) says 184
        assertEquals(184, paths);
        assertEquals(BigInteger.valueOf(paths), PathsAndBonds.heaviestPath(g, BUDGET).count());
    }

    @Test
    @Tag("slow")
    void sevenAndEightGridPathCountsMatchA007764() {
        for (int k = 7; k <= 8; k++) {
            HostGraph g = HostGraph.grid(k, k);
            Extreme p = PathsAndBonds.heaviestPath(g, BUDGET);
            // source: OEIS A007764 (from memory)
            assertEquals(BigInteger.valueOf(A007764[k - 1]), p.count(), k + "×" + k);
            assertValidPath(g, p);
        }
    }

    @Test
    @Tag("slow")
    void fiveByFiveGridBondsAgreeAcrossMethods() {
        // source: independent computation, the vertex-subset method (2^23 sides S) against frontier search
        HostGraph g = HostGraph.grid(5, 5);
        Extreme f = PathsAndBonds.heaviestBond(g, 1L << 24, Method.FRONTIER);
        Extreme s = PathsAndBonds.heaviestBond(g, 1L << 24, Method.SUBSETS);
        assertEquals(s.count(), f.count());
        assertEquals(s.value(), f.value(), 1e-12);
        assertValidBond(g, f);
    }

    @Test
    void rowMajorGridsGetAFrontierOfAboutOneRow() {
        for (int k = 2; k <= 12; k++) {
            // common practice, no source: k vertices of a row plus the one being entered
            FrontierPlan plan = new FrontierPlan(new Component(HostGraph.grid(k, k)));
            assertTrue(plan.width <= k + 1, k + "×" + k + ": widest frontier " + plan.width);
            FrontierPlan wide = new FrontierPlan(new Component(HostGraph.grid(3, 40)));
            assertTrue(wide.width <= 4, "3×40: widest frontier " + wide.width);
        }
    }

    // ------------------------------------------------------------ complete graphs

    /** Number of s–t paths in K_n: Σ_{k=0}^{n−2} (n−2)!/(n−2−k)!. */
    static BigInteger completePaths(int n) {
        BigInteger sum = BigInteger.ZERO;
        BigInteger falling = BigInteger.ONE;
        for (int k = 0; k <= n - 2; k++) {
            sum = sum.add(falling);
            falling = falling.multiply(BigInteger.valueOf(n - 2 - k));
        }
        return sum;
    }

    @Test
    void completeGraphsUnitWeights() {
        for (int n = 2; n <= 12; n++) {
            HostGraph g = HostGraph.complete(n);
            Extreme p = PathsAndBonds.heaviestPath(g, BUDGET);
            // derived: a simple path has at most n − 1 edges, and K_n has a Hamiltonian s–t path
            assertEquals(n - 1, p.value(), 0.0, "K" + n + " path");
            // derived: an s–t path is an ordered choice of k of the n − 2 inner vertices, k = 0..n−2
            assertEquals(completePaths(n), p.count(), "K" + n + " paths");
            assertValidPath(g, p);
            Extreme b = PathsAndBonds.heaviestBond(g, BUDGET);
            // derived: in K_n both sides of any bipartition are connected (complete), so every S with
            // s ∈ S, t ∉ S gives a bond of |S|(n − |S|) edges, maximal at |S| = ⌊n/2⌋
            assertEquals(n * n / 4, b.value(), 0.0, "K" + n + " bond");
            // derived: one bond per subset of the n − 2 inner vertices joined to s
            assertEquals(BigInteger.ONE.shiftLeft(n - 2), b.count(), "K" + n + " bonds");
            assertValidBond(g, b);
        }
        // derived, as above; the counts checked by hand: K4 has 1 + 2 + 2 = 5 paths
        assertEquals(BigInteger.valueOf(5), completePaths(4));
    }

    @Test
    void frontierSearchOnCompleteGraphs() {
        for (int n = 3; n <= 8; n++) {
            HostGraph g = HostGraph.complete(n);
            Extreme p = PathsAndBonds.heaviestPath(g, BUDGET, Method.FRONTIER);
            // derived (see completeGraphsUnitWeights)
            assertEquals(n - 1, p.value(), 0.0);
            assertEquals(completePaths(n), p.count());
            Extreme b = PathsAndBonds.heaviestBond(g, BUDGET, Method.FRONTIER);
            assertEquals(n * n / 4, b.value(), 0.0);
            assertEquals(BigInteger.ONE.shiftLeft(n - 2), b.count());
            assertTrue(p.method().startsWith("frontier search"), p.method());
        }
    }

    // ------------------------------------------------------------ the two methods agree

    @Test
    void frontierAndSubsetMethodsAgree() {
        SeededRandom rnd = new SeededRandom(77L);
        for (int trial = 0; trial < 60; trial++) {
            int n = 4 + rnd.nextInt(9);
            int m = n - 1 + rnd.nextInt(2 * n);
            int[] u = new int[m];
            int[] v = new int[m];
            double[] w = new double[m];
            for (int e = 0; e < m; e++) {
                // a random tree first (so s's component is large), then random extra edges
                u[e] = e < n - 1 ? e + 1 : rnd.nextInt(n);
                v[e] = e < n - 1 ? rnd.nextInt(e + 1) : rnd.nextInt(n);
                w[e] = 0.5 + 1.5 * rnd.nextDouble();
            }
            HostGraph g = new HostGraph(n, u, v, w, rnd.nextInt(n / 2), n / 2 + rnd.nextInt(n - n / 2));
            compareMethods(g, "trial " + trial);
        }
        for (int[] rc : new int[][] {{3, 3}, {3, 5}, {4, 4}, {2, 7}, {3, 6}}) {
            HostGraph grid = HostGraph.grid(rc[0], rc[1]);
            compareMethods(grid, rc[0] + "×" + rc[1]);
            double[] w = new double[grid.edgeCount()];
            for (int e = 0; e < w.length; e++) {
                w[e] = 0.5 + 1.5 * rnd.nextDouble();
            }
            compareMethods(grid.withWeights(w), rc[0] + "×" + rc[1] + " weighted");
        }
    }

    private static void compareMethods(HostGraph g, String what) {
        // source: independent computation, the other exact method
        Extreme pf = PathsAndBonds.heaviestPath(g, BUDGET, Method.FRONTIER);
        Extreme ps = PathsAndBonds.heaviestPath(g, BUDGET, Method.SUBSETS);
        assertClose(ps.value(), pf.value(), what + " path");
        assertEquals(ps.count(), pf.count(), what + " paths");
        assertValidPath(g, pf);
        assertValidPath(g, ps);
        Extreme bf = PathsAndBonds.heaviestBond(g, BUDGET, Method.FRONTIER);
        Extreme bs = PathsAndBonds.heaviestBond(g, BUDGET, Method.SUBSETS);
        assertClose(bs.value(), bf.value(), what + " bond");
        assertEquals(bs.count(), bf.count(), what + " bonds");
        assertValidBond(g, bf);
        assertValidBond(g, bs);
    }

    // ------------------------------------------------------------ budget, input checks, records

    @Test
    void tooWideIsThrownWithinTheBudget() {
        HostGraph g = HostGraph.complete(12);
        TooWideException f = assertThrows(TooWideException.class,
                () -> PathsAndBonds.heaviestPath(g, 50, Method.FRONTIER));
        assertEquals(50, f.budget());
        assertTrue(f.getMessage().contains("50") && f.getMessage().contains("widest frontier"), f.getMessage());
        TooWideException s = assertThrows(TooWideException.class,
                () -> PathsAndBonds.heaviestBond(g, 50, Method.SUBSETS));
        assertEquals(12, s.width());
        // AUTO falls back to the other method when it fits: 2^10 subsets for the bond of K12
        assertEquals(36, PathsAndBonds.heaviestBond(g, 1100).value(), 0.0);
        assertThrows(TooWideException.class, () -> PathsAndBonds.heaviestBond(g, 20));
    }

    @Test
    void badHostGraphsAreScenarioExceptions() {
        ScenarioException sameTerminal = assertThrows(ScenarioException.class,
                () -> new HostGraph(3, new int[] {0}, new int[] {1}, new double[] {1}, 1, 1));
        assertEquals("host-graph", sameTerminal.code());
        ScenarioException weight = assertThrows(ScenarioException.class,
                () -> new HostGraph(3, new int[] {0}, new int[] {1}, new double[] {0}, 0, 1));
        assertEquals("$.graph.edges[0].weight", weight.path());
        assertThrows(ScenarioException.class,
                () -> new HostGraph(3, new int[] {0}, new int[] {3}, new double[] {1}, 0, 1));
        assertThrows(ScenarioException.class,
                () -> new HostGraph(3, new int[] {0}, new int[] {1, 2}, new double[] {1}, 0, 1));
    }

    @Test
    void resultsAndGraphsDoNotShareArrays() {
        int[] u = {0};
        int[] v = {1};
        double[] w = {2};
        HostGraph g = new HostGraph(2, u, v, w, 0, 1);
        w[0] = 5;
        assertEquals(2, g.weight(0), 0.0);
        Extreme p = PathsAndBonds.heaviestPath(g, BUDGET);
        p.edges()[0] = false;
        assertTrue(p.edges()[0]);
        assertFalse(Double.isNaN(p.value()));
    }
}
