package spanwright.structure;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import spanwright.expr.Expr;
import spanwright.expr.ExprParser;
import spanwright.model.Edge;
import spanwright.model.RandomScenarios;
import spanwright.model.Scenario;

class DecisionDiagramsTest {
    private static final List<String> ABCDE = List.of("a", "b", "c", "d", "e");

    private static int fromText(DecisionDiagrams dd, String text, List<String> vars) {
        return dd.fromExpr(ExprParser.parse(text, vars));
    }

    private static int[] ones(int m, int value) {
        int[] a = new int[m];
        Arrays.fill(a, value);
        return a;
    }

    private static int[] identity(int m) {
        int[] a = new int[m];
        for (int i = 0; i < m; i++) {
            a[i] = i;
        }
        return a;
    }

    private static boolean[] all(int m, boolean b) {
        boolean[] a = new boolean[m];
        Arrays.fill(a, b);
        return a;
    }

    /** One variable per edge: count of edge subsets joining s and t, by union–find over 2^m subsets. */
    private static long bruteCount(int vertices, int s, int t, int[] u, int[] v) {
        int m = u.length;
        long count = 0;
        for (long mask = 0; mask < (1L << m); mask++) {
            if (ConnectivityBruteForce.connected(vertices, s, t, u, v, identity(m), all(m, true),
                    ConnectivityBruteForce.assignment(mask, m))) {
                count++;
            }
        }
        return count;
    }

    @Test
    void gridConnectivityCountsEqualBruteForce() {
        for (int k = 2; k <= 3; k++) {
            int[][] g = ConnectivityBruteForce.grid(k);
            int m = g[0].length;
            DecisionDiagrams dd = new DecisionDiagrams(m, 1_000_000);
            int f = dd.connectivity(k * k, 0, k * k - 1, g[0], g[1], identity(m), all(m, true));
            // independent computation: union–find on each of the 2^m edge subsets
            assertEquals(BigInteger.valueOf(bruteCount(k * k, 0, k * k - 1, g[0], g[1])), dd.satCount(f));
        }
        // derived: the 2×2 grid is a 4-cycle with s, t opposite; s~t iff one of the two disjoint
        // 2-edge paths is complete: 16 − (4 − 1)·(4 − 1) = 7 subsets
        int[][] g = ConnectivityBruteForce.grid(2);
        DecisionDiagrams dd = new DecisionDiagrams(4, 1000);
        assertEquals(BigInteger.valueOf(7), dd.satCount(dd.connectivity(4, 0, 3, g[0], g[1], identity(4), all(4, true))));
    }

    @Test
    void gridConnectivityIsTheCanonicalNodeOfItsPathDnf() {
        // canonicity of ROBDDs (Bryant, IEEE Trans. Computers 1986): equal functions, equal node.
        // The DNF over the simple s–t paths of the k×k grid (found here by depth-first search)
        // is the same function as connectivity, built by a different route.
        // OEIS A007764 (from memory): 12 and 184 corner-to-corner self-avoiding paths for k = 3, 4
        int[] pathCounts = {0, 0, 2, 12, 184};
        for (int k = 2; k <= 4; k++) {
            int[][] g = ConnectivityBruteForce.grid(k);
            int m = g[0].length;
            int last = k * k - 1;
            List<String> names = new ArrayList<>();
            for (int i = 0; i < m; i++) {
                names.add("e" + i);
            }
            List<List<Integer>> paths = new ArrayList<>();
            simplePaths(k * k, g[0], g[1], 0, last, new boolean[k * k], new ArrayList<>(), paths);
            assertEquals(pathCounts[k], paths.size());
            StringBuilder dnf = new StringBuilder();
            for (List<Integer> p : paths) {
                dnf.append(dnf.length() > 0 ? " | " : "").append('(');
                for (int i = 0; i < p.size(); i++) {
                    dnf.append(i > 0 ? " & " : "").append(names.get(p.get(i)));
                }
                dnf.append(')');
            }
            DecisionDiagrams dd = new DecisionDiagrams(m, 1_000_000);
            int conn = dd.connectivity(k * k, 0, last, g[0], g[1], identity(m), all(m, true));
            int viaDnf = fromText(dd, dnf.toString(), names);
            assertEquals(conn, viaDnf);
            // the same graph listed in reverse order, vertices renumbered backwards, s and t swapped
            int[] ru = new int[m];
            int[] rv = new int[m];
            int[] rvar = new int[m];
            for (int i = 0; i < m; i++) {
                ru[i] = last - g[1][m - 1 - i];
                rv[i] = last - g[0][m - 1 - i];
                rvar[i] = m - 1 - i;
            }
            assertEquals(conn, dd.connectivity(k * k, 0, last, ru, rv, rvar, all(m, true)));
        }
    }

    private static void simplePaths(int n, int[] u, int[] v, int at, int t, boolean[] seen, List<Integer> path,
            List<List<Integer>> out) {
        if (at == t) {
            out.add(new ArrayList<>(path));
            return;
        }
        seen[at] = true;
        for (int e = 0; e < u.length; e++) {
            int other = u[e] == at ? v[e] : v[e] == at ? u[e] : -1;
            if (other >= 0 && !seen[other]) {
                path.add(e);
                simplePaths(n, u, v, other, t, seen, path, out);
                path.remove(path.size() - 1);
            }
        }
        seen[at] = false;
    }

    @Test
    void equivalentExpressionsGiveTheSameNode() {
        // canonicity of ROBDDs (Bryant, IEEE Trans. Computers 1986)
        DecisionDiagrams dd = new DecisionDiagrams(5, 100_000);
        assertEquals(fromText(dd, "a & (b | c)", ABCDE), fromText(dd, "(a & b) | (a & c)", ABCDE));
        assertEquals(fromText(dd, "!(a | b)", ABCDE), fromText(dd, "!a & !b", ABCDE)); // De Morgan
        assertEquals(fromText(dd, "a -> b", ABCDE), fromText(dd, "!a | b", ABCDE));
        assertEquals(fromText(dd, "a <-> b", ABCDE), fromText(dd, "!(a ^ b)", ABCDE));
        assertEquals(fromText(dd, "maj(a, b, c)", ABCDE), fromText(dd, "a & b | a & c | b & c", ABCDE));
        assertEquals(fromText(dd, "parity(a, b, c)", ABCDE), fromText(dd, "a ^ b ^ c", ABCDE));
        assertEquals(DecisionDiagrams.TRUE, fromText(dd, "a | !a", ABCDE));
        assertEquals(DecisionDiagrams.FALSE, fromText(dd, "a & !a", ABCDE));
        int a = dd.variable(0);
        assertEquals(3, dd.nodeCount(a)); // derived: one test, two sinks
        assertEquals(1, dd.nodeCount(DecisionDiagrams.TRUE));
        assertEquals(a, dd.not(dd.not(a))); // double negation
    }

    @Test
    void completeGraphOnFourVerticesHas48ConnectingSubsets() {
        // K4 on s=0, t=1, a=2, b=3. Derived: with edge st present all 32 subsets connect; without
        // it, with ab absent s~t iff (sa & at) | (sb & bt): 16 − 3·3 = 7; with ab present a and b
        // merge and s~t iff (sa | sb) & (at | bt): 3·3 = 9. Total 32 + 7 + 9 = 48.
        int[] u = {0, 0, 0, 1, 1, 2};
        int[] v = {1, 2, 3, 2, 3, 3};
        assertEquals(48, bruteCount(4, 0, 1, u, v)); // independent computation: 2^6 subsets
        DecisionDiagrams dd = new DecisionDiagrams(6, 10_000);
        assertEquals(BigInteger.valueOf(48), dd.satCount(dd.connectivity(4, 0, 1, u, v, identity(6), all(6, true))));
    }

    @Test
    void pathsAndParallelEdges() {
        for (int m = 1; m <= 40; m += 13) {
            // a path of m edges: derived, only the full edge set connects its ends, so 1 subset;
            // its diagram is a chain of m tests plus two sinks
            DecisionDiagrams dd = new DecisionDiagrams(m, 10_000);
            int[] u = identity(m);
            int[] v = new int[m];
            for (int i = 0; i < m; i++) {
                v[i] = i + 1;
            }
            int path = dd.connectivity(m + 1, 0, m, u, v, identity(m), all(m, true));
            assertEquals(BigInteger.ONE, dd.satCount(path));
            assertEquals(m + 2, dd.nodeCount(path));
            // m parallel edges: derived, every subset but the empty one connects: 2^m − 1
            int par = dd.connectivity(2, 0, 1, ones(m, 0), ones(m, 1), identity(m), all(m, true));
            assertEquals(BigInteger.ONE.shiftLeft(m).subtract(BigInteger.ONE), dd.satCount(par));
        }
    }

    @Test
    void degenerateGraphs() {
        DecisionDiagrams dd = new DecisionDiagrams(2, 1000);
        // derived: s = t is connected by the empty path; an isolated s never is
        assertEquals(DecisionDiagrams.TRUE, dd.connectivity(3, 1, 1, new int[0], new int[0], new int[0], new boolean[0]));
        assertEquals(DecisionDiagrams.FALSE, dd.connectivity(3, 0, 2, new int[] {1}, new int[] {2}, new int[] {0},
                new boolean[] {true}));
        // derived: an always-present s–t edge makes the function 1; a self-loop changes nothing
        assertEquals(DecisionDiagrams.TRUE, dd.connectivity(2, 0, 1, new int[] {0, 1}, new int[] {1, 1},
                new int[] {-1, 0}, new boolean[] {true, true}));
        // derived: edges x and !x in series can never both be present
        assertEquals(DecisionDiagrams.FALSE, dd.connectivity(3, 0, 2, new int[] {0, 1}, new int[] {1, 2},
                new int[] {1, 1}, new boolean[] {true, false}));
        assertThrows(IllegalArgumentException.class, () -> dd.connectivity(2, 0, 1, new int[] {0},
                new int[] {1}, new int[] {5}, new boolean[] {true}));
    }

    @Test
    void randomGraphsWithSharedNegatedAndAlwaysEdgesEqualBruteForce() {
        Random rnd = new Random(20240614L); // seeded
        for (int trial = 0; trial < 60; trial++) {
            int n = 2 + rnd.nextInt(9);
            int vertices = 2 + rnd.nextInt(7);
            int edges = vertices - 1 + rnd.nextInt(10);
            Scenario sc = RandomScenarios.generate(rnd, n, vertices, edges, 0.2, 0.35, 1, 1);
            int m = sc.edges().size();
            int[] u = new int[m];
            int[] v = new int[m];
            int[] var = new int[m];
            boolean[] pos = new boolean[m];
            for (int i = 0; i < m; i++) {
                Edge e = sc.edges().get(i);
                u[i] = e.u();
                v[i] = e.v();
                var[i] = e.when().variable();
                pos[i] = e.when().positive();
            }
            DecisionDiagrams dd = new DecisionDiagrams(n, 1_000_000);
            int f = dd.connectivity(vertices, sc.s(), sc.t(), u, v, var, pos);
            long count = 0;
            List<boolean[]> first = new ArrayList<>();
            for (long mask = 0; mask < (1L << n); mask++) {
                boolean[] x = ConnectivityBruteForce.assignment(mask, n);
                // independent computation: union–find on G(x)
                boolean want = ConnectivityBruteForce.connected(vertices, sc.s(), sc.t(), u, v, var, pos, x);
                assertEquals(want, dd.evaluate(f, x), "trial " + trial + " input " + mask);
                if (want) {
                    count++;
                    if (first.size() < 7) {
                        first.add(x);
                    }
                }
            }
            assertEquals(BigInteger.valueOf(count), dd.satCount(f));
            assertSameAssignments(first, dd.firstSatisfying(f, 7));
        }
    }

    static void assertSameAssignments(List<boolean[]> want, List<boolean[]> got) {
        assertEquals(want.size(), got.size());
        for (int i = 0; i < want.size(); i++) {
            assertArrayEquals(want.get(i), got.get(i), "assignment " + i);
        }
    }

    /** A seeded random expression text over the variables, with every operator and counting form. */
    static String randomExpr(Random rnd, List<String> vars, int depth) {
        if (depth == 0 || rnd.nextInt(5) == 0) {
            int r = rnd.nextInt(vars.size() + 1);
            return r == vars.size() ? (rnd.nextBoolean() ? "1" : "0") : vars.get(r);
        }
        switch (rnd.nextInt(9)) {
            case 0:
                return "!(" + randomExpr(rnd, vars, depth - 1) + ")";
            case 1:
            case 2:
            case 3:
            case 4: {
                String[] ops = {"&", "|", "^", "->", "<->"};
                return "(" + randomExpr(rnd, vars, depth - 1) + ") " + ops[rnd.nextInt(5)] + " ("
                        + randomExpr(rnd, vars, depth - 1) + ")";
            }
            default: {
                String[] fns = {"thr", "exactly", "atmost", "maj", "parity", "any", "all"};
                String fn = fns[rnd.nextInt(fns.length)];
                int args = 1 + rnd.nextInt(4);
                StringBuilder sb = new StringBuilder(fn).append('(');
                boolean counted = fn.equals("thr") || fn.equals("exactly") || fn.equals("atmost");
                if (counted) {
                    sb.append(rnd.nextInt(args + 2)).append(", ");
                }
                for (int i = 0; i < args; i++) {
                    sb.append(i > 0 ? ", " : "").append(randomExpr(rnd, vars, depth - 1));
                }
                return sb.append(')').toString();
            }
        }
    }

    @Test
    void expressionsEqualTheirEvaluatorOnEveryInput() {
        Random rnd = new Random(77L); // seeded
        for (int trial = 0; trial < 300; trial++) {
            List<String> vars = ABCDE.subList(0, 1 + rnd.nextInt(5));
            int n = vars.size();
            String text = randomExpr(rnd, vars, 4);
            Expr e = ExprParser.parse(text, vars);
            DecisionDiagrams dd = new DecisionDiagrams(n, 100_000);
            int f = dd.fromExpr(e);
            long count = 0;
            List<boolean[]> first = new ArrayList<>();
            for (long mask = 0; mask < (1L << n); mask++) {
                boolean want = e.eval(mask); // independent computation: the expression evaluator
                assertEquals(want, dd.evaluate(f, ConnectivityBruteForce.assignment(mask, n)), text + " at " + mask);
                if (want) {
                    count++;
                    if (first.size() < 3) {
                        first.add(ConnectivityBruteForce.assignment(mask, n));
                    }
                }
            }
            assertEquals(BigInteger.valueOf(count), dd.satCount(f), text);
            assertSameAssignments(first, dd.firstSatisfying(f, 3));
        }
    }

    @Test
    void hammingWeightSetsEqualBitCounts() {
        Random rnd = new Random(5L); // seeded
        for (int trial = 0; trial < 20; trial++) {
            int n = 1 + rnd.nextInt(9);
            int[] w = {rnd.nextInt(n + 1), rnd.nextInt(n + 1), n + 3};
            DecisionDiagrams dd = new DecisionDiagrams(n, 100_000);
            int f = dd.hammingWeightIn(w);
            for (long mask = 0; mask < (1L << n); mask++) {
                int pop = Long.bitCount(mask); // independent computation: bit count
                boolean want = pop == w[0] || pop == w[1];
                assertEquals(want, dd.evaluate(f, ConnectivityBruteForce.assignment(mask, n)));
            }
        }
        // law: Σ over the allowed weights of C(n, w); here C(30, 15) = 155117520 (derived by Pascal's rule)
        DecisionDiagrams dd = new DecisionDiagrams(30, 100_000);
        assertEquals(BigInteger.valueOf(155117520L), dd.satCount(dd.hammingWeightIn(new int[] {15})));
    }

    @Test
    void aLongChainDoesNotOverflowTheStack() {
        // derived: x0 | x1 | … repeated is "any of the 20 variables"
        int n = 20;
        List<String> names = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            names.add("x" + i);
        }
        Expr chain = new Expr.Var("x0", 0, n);
        for (int i = 1; i < 200_000; i++) {
            chain = new Expr.Binary(Expr.Op.OR, chain, new Expr.Var("x" + (i % n), i % n, n));
        }
        DecisionDiagrams dd = new DecisionDiagrams(n, 100_000);
        int f = dd.fromExpr(chain);
        assertEquals(fromText(dd, "any(" + String.join(", ", names) + ")", names), f);
        // derived: 2^20 − 1 nonzero inputs
        assertEquals(BigInteger.valueOf((1L << n) - 1), dd.satCount(f));
    }

    @Test
    void firstSatisfyingFillsSkippedVariablesInInputOrder() {
        // derived: f = b over (a, b, c); masks with b = 1 in increasing order are 010, 011, 110, 111
        DecisionDiagrams dd = new DecisionDiagrams(3, 100);
        List<boolean[]> got = dd.firstSatisfying(dd.variable(1), 10);
        assertEquals(4, got.size());
        long[] masks = {2, 3, 6, 7};
        for (int i = 0; i < 4; i++) {
            assertEquals(masks[i], ConnectivityBruteForce.mask(got.get(i)));
        }
        assertEquals(BigInteger.ZERO, dd.satCount(DecisionDiagrams.FALSE));
        assertEquals(BigInteger.valueOf(8), dd.satCount(DecisionDiagrams.TRUE));
        assertTrue(dd.firstSatisfying(DecisionDiagrams.FALSE, 3).isEmpty());
    }

    @Test
    void theBudgetIsEnforcedWithAMessageThatSaysWhatToTry() {
        int[][] g = ConnectivityBruteForce.grid(4);
        int m = g[0].length;
        DecisionDiagrams dd = new DecisionDiagrams(m, 40);
        TooLargeDiagramException e = assertThrows(TooLargeDiagramException.class,
                () -> dd.connectivity(16, 0, 15, g[0], g[1], identity(m), all(m, true)));
        assertEquals(40, e.budget());
        assertTrue(e.getMessage().contains("40") && e.getMessage().contains("budget"), e.getMessage());
        DecisionDiagrams small = new DecisionDiagrams(m, 10);
        TooLargeDiagramException e2 = assertThrows(TooLargeDiagramException.class,
                () -> small.fromExpr(ExprParser.parse("parity(a, b, c, d, e)", ABCDE)));
        assertTrue(e2.getMessage().contains("10"), e2.getMessage());
        assertTrue(small.tableSize() <= 10);
    }
}
