package spanwright.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.junit.jupiter.api.Test;
import spanwright.model.ConnectivityForm;
import spanwright.model.Edge;
import spanwright.model.Promise;
import spanwright.model.RandomScenarios;
import spanwright.model.Scenario;
import spanwright.model.ScenarioException;
import spanwright.reduction.HostGraphBuilder;

/**
 * The structural engine against enumeration (independent computation: {@link Analysis#run} lists
 * every input) and against derived and published values, with every worst input's certificate
 * recomputed independently on an EJML Laplacian pseudo-inverse.
 */
class StructuralAnalysisTest {
    private static final double TOL = 1e-9;

    private static void assertClose(double expected, double actual, String what) {
        if (Double.isNaN(expected)) {
            assertTrue(Double.isNaN(actual), what + ": expected NaN, got " + actual);
            return;
        }
        assertEquals(expected, actual, TOL * Math.max(1, Math.abs(expected)), what);
    }

    /** Enumeration and structure agree on W₊, W₋ and the bound; certificates recompute to the same values. */
    private static void agree(Scenario sc, String name) {
        AnalysisResult e = Analysis.run(sc);
        StructuralAnalysis.Result r = StructuralAnalysis.run(sc);
        assertTrue(r.exact(), name + ": " + r.method());
        assertClose(e.maxResistance(), r.positive().value(), name + " W+");
        assertClose(e.maxCapacitance(), r.negative().value(), name + " W-");
        certificate(sc, r.positive(), true, name);
        certificate(sc, r.negative(), false, name);
    }

    /** The worst input's value, recomputed with EJML's pseudo-inverse of the Laplacian, is the side's value. */
    static void certificate(Scenario sc, StructuralAnalysis.Side side, boolean positive, String name) {
        if (side.worst() == null) {
            assertTrue(Double.isNaN(side.value()), name + ": no worst input but a value");
            return;
        }
        assertEquals(positive, side.worst().witness.connected, name + ": worst input on the wrong side");
        double independent = laplacianValue(sc, side.worst().present, positive);
        assertClose(independent, side.value(), name + (positive ? " R" : " C") + " of the worst input (EJML pinv)");
    }

    /**
     * R_st = (e_s − e_t)ᵀ L⁺ (e_s − e_t) on the present edges (conductance 1/w); C_st is the
     * effective conductance between the contracted components of s and t on the absent edges
     * (conductance 1/w), i.e. 1 / R_st of that network.
     * Source: the Laplacian pseudo-inverse formula for effective resistance (Klein &amp; Randić,
     * "Resistance distance", J. Math. Chem. 1993); independent of the production elimination.
     */
    static double laplacianValue(Scenario sc, boolean[] present, boolean positive) {
        int n = sc.vertexCount();
        int[] comp = new int[n];
        for (int i = 0; i < n; i++) {
            comp[i] = i;
        }
        if (!positive) {
            for (int i = 0; i < present.length; i++) {
                if (present[i]) {
                    union(comp, sc.edges().get(i).u(), sc.edges().get(i).v());
                }
            }
        }
        DMatrixRMaj lap = new DMatrixRMaj(n, n);
        for (int i = 0; i < present.length; i++) {
            Edge e = sc.edges().get(i);
            if (present[i] != positive) {
                continue;
            }
            int a = find(comp, e.u());
            int b = find(comp, e.v());
            if (a == b) {
                continue;
            }
            double c = 1 / e.weight();
            lap.add(a, a, c);
            lap.add(b, b, c);
            lap.add(a, b, -c);
            lap.add(b, a, -c);
        }
        DMatrixRMaj pinv = new DMatrixRMaj(n, n);
        CommonOps_DDRM.pinv(lap, pinv);
        int s = find(comp, sc.s());
        int t = find(comp, sc.t());
        double r = pinv.get(s, s) + pinv.get(t, t) - 2 * pinv.get(s, t);
        return positive ? r : 1 / r;
    }

    private static int find(int[] p, int x) {
        while (p[x] != x) {
            x = p[x];
        }
        return x;
    }

    private static void union(int[] p, int a, int b) {
        p[find(p, a)] = find(p, b);
    }

    @Test
    void branchAndBoundEqualsEnumerationOnGeneralInstances() {
        // shared variables, negated literals, always-present edges: branch and bound on both sides
        Random rnd = new Random(20261204L);
        for (int k = 0; k < 40; k++) {
            int vars = 3 + rnd.nextInt(8);
            int vertices = 3 + rnd.nextInt(6);
            int edges = vertices - 1 + rnd.nextInt(8);
            Scenario sc = RandomScenarios.generate(rnd, vars, vertices, edges, 0.15, 0.4, 0.2, 5.0);
            agree(sc, "random general #" + k);
        }
    }

    @Test
    void hostFormEqualsEnumerationOnRandomGraphs() {
        // one positive literal per edge (paths and bonds), with and without always-present edges
        Random rnd = new Random(7L);
        for (int k = 0; k < 40; k++) {
            int vertices = 3 + rnd.nextInt(6);
            int edges = vertices - 1 + rnd.nextInt(9);
            Scenario g = RandomScenarios.generate(rnd, edges, vertices, edges, k % 2 == 0 ? 0 : 0.2, 0, 0.3, 3.0);
            agree(hostForm(g), "random host #" + k);
        }
    }

    /** The same graph with edge i switched by its own variable x(i+1) (or always present). */
    static Scenario hostForm(Scenario g) {
        List<Edge> es = new ArrayList<>();
        for (int i = 0; i < g.edges().size(); i++) {
            Edge e = g.edges().get(i);
            es.add(new Edge(e.id(), e.u(), e.v(), e.when().isAlways() ? e.when()
                    : spanwright.model.Condition.literal(i, g.variables().get(i), true), e.weight()));
        }
        return new Scenario(g.title(), "", g.variables(), null, null, Promise.NONE, g.vertices(), g.s(), g.t(), es, null,
                ConnectivityForm.OWN_GRAPH);
    }

    @Test
    void gridsAndCompleteGraphsMatchEnumerationAndCountPaths() {
        // Source: OEIS A007764 (corner-to-corner self-avoiding paths in the k×k grid: 1, 2, 12, 184;
        // from memory, and the enumeration here confirms W± for the same graphs).
        long[] paths = {2, 12};
        for (int k = 2; k <= 3; k++) {
            Scenario sc = HostGraphBuilder.family("grid", new int[] {k, k}, null, null, 0, -1).scenario();
            agree(sc, k + "x" + k + " grid");
            assertEquals(BigInteger.valueOf(paths[k - 2]), StructuralAnalysis.run(sc).positive().extremeInputs(),
                    "A007764 for k = " + k);
        }
        for (int n = 3; n <= 6; n++) {
            Scenario sc = HostGraphBuilder.family("complete", new int[] {n}, null, null, 0, -1).scenario();
            agree(sc, "K" + n);
            StructuralAnalysis.Result r = StructuralAnalysis.run(sc);
            // Derived: in K_n with unit weights the heaviest simple s–t path is Hamiltonian (n − 1 edges),
            // and every bipartition with s, t apart is a bond of |S|(n − |S|) edges, largest at |S| = ⌊n/2⌋.
            assertClose(n - 1, r.positive().value(), "K" + n + " W+ = n - 1");
            assertClose(Math.floor(n * n / 4.0), r.negative().value(), "K" + n + " W- = floor(n^2/4)");
            // Derived: every S ∋ s, ∌ t is a bond, so K_n has 2^(n−2) s–t bonds.
            assertEquals(BigInteger.ONE.shiftLeft(n - 2), r.negative().extremeInputs(), "K" + n + " bonds");
        }
    }

    @Test
    void largeHostGraphsBeyondEnumeration() {
        // 6×6 grid: 60 edge variables, 2^60 inputs, far beyond enumeration. Checked: the path count
        // against OEIS A007764 (1262816, from memory), both certificates independently (EJML), and
        // the heaviest path against a derived bound.
        Scenario sc = HostGraphBuilder.family("grid", new int[] {6, 6}, null, null, 0, -1).scenario();
        assertEquals(60, sc.variableCount());
        StructuralAnalysis.Result r = StructuralAnalysis.run(sc);
        assertTrue(r.exact());
        assertEquals(BigInteger.valueOf(1262816), r.positive().extremeInputs(), "OEIS A007764, k = 6");
        certificate(sc, r.positive(), true, "6x6");
        certificate(sc, r.negative(), false, "6x6");
        // Derived: a simple path in the 6×6 grid visits at most 36 vertices, and a corner-to-corner
        // path joins two vertices of the same colour of the chessboard colouring, so it has an even
        // number of edges ≤ 35: at most 34 edges.
        assertClose(34, r.positive().value(), "6x6 heaviest path, unit weights");
        assertEquals("by construction", r.reduction().status());
    }

    @Test
    void autoChoosesByDomainSizeAndRefusesWithReasons() {
        Scenario small = HostGraphBuilder.family("grid", new int[] {3, 3}, null, null, 0, -1).scenario();
        assertEquals(Analysis.Method.ENUMERATE, Analysis.choose(small, Analysis.Method.AUTO).method());
        Scenario big = HostGraphBuilder.family("grid", new int[] {5, 5}, null, null, 0, -1).scenario();
        Analysis.Choice c = Analysis.choose(big, Analysis.Method.AUTO);
        assertEquals(Analysis.Method.STRUCTURE, c.method());
        assertTrue(c.reason().contains("2^40"), c.reason());
        ScenarioException tooMany = assertThrows(ScenarioException.class,
                () -> Analysis.choose(big, Analysis.Method.ENUMERATE));
        assertTrue(tooMany.getMessage().contains("--method structure"), tooMany.getMessage());
        Scenario promised = HostGraphBuilder.family("grid", new int[] {2, 2}, null, null, 0, 1).scenario();
        assertEquals(Analysis.Method.ENUMERATE, Analysis.choose(promised, Analysis.Method.AUTO).method());
        assertEquals(Analysis.Method.STRUCTURE, Analysis.choose(promised, Analysis.Method.STRUCTURE).method());
    }

    @Test
    void underAPromiseBranchAndBoundEqualsEnumeration() {
        // Hamming-weight promises ("at most k edges missing") on host graphs, and expression
        // promises on random general instances; enumeration is the independent computation.
        for (int k = 0; k <= 3; k++) {
            agree(HostGraphBuilder.family("grid", new int[] {3, 3}, null, null, 0, k).scenario(), "3x3 grid, " + k + " missing");
        }
        Random rnd = new Random(31L);
        for (int k = 0; k < 10; k++) {
            Scenario g = RandomScenarios.generate(rnd, 6, 5, 8, 0.1, 0.3, 0.5, 2.0);
            Scenario sc = new Scenario("promised", "", g.variables(), null, null,
                    Promise.expression("x1 | x2 & !x3", spanwright.expr.ExprParser.parse("x1 | x2 & !x3", g.variables())),
                    g.vertices(), g.s(), g.t(), g.edges(), null);
            agree(sc, "random under an expression promise #" + k);
        }
    }

    @Test
    void branchAndBoundUnderABudgetGivesACertifiedInterval() {
        Random rnd = new Random(99L);
        Scenario sc = RandomScenarios.generate(rnd, 12, 9, 20, 0.1, 0.4, 0.2, 5.0);
        AnalysisResult e = Analysis.run(sc);
        StructuralAnalysis.Result r = StructuralAnalysis.run(sc, 1000, 5, 1000);
        for (StructuralAnalysis.Side side : List.of(r.positive(), r.negative())) {
            double truth = side == r.positive() ? e.maxResistance() : e.maxCapacitance();
            assertFalse(side.exact());
            if (!Double.isNaN(side.value())) {
                assertTrue(side.value() <= truth * (1 + 1e-12), "lower end " + side.value() + " above " + truth);
            }
            assertTrue(side.upper() >= truth * (1 - 1e-12), "upper end " + side.upper() + " below " + truth);
        }
        assertNotNull(r.method());
    }
    /** The scenario with f = s–t connectivity of {@code hostEdges} on the same vertices. */
    private static Scenario withListedHost(Scenario sc, List<Edge> hostEdges) {
        return new Scenario(sc.title(), "", sc.variables(), null, null, sc.promise(), sc.vertices(), sc.s(), sc.t(),
                sc.edges(), null, ConnectivityForm.of(sc.vertices(), sc.s(), sc.t(), hostEdges));
    }

    @Test
    void reductionCheckByDiagramsMatchesEnumeration() {
        // 3×3 grid (12 variables): f = connectivity of the same grid without its first edge; the
        // graph then says "connected" on inputs where only that edge makes the path. Enumeration
        // (independent computation) counts and lists the counterexamples.
        Scenario grid = HostGraphBuilder.family("grid", new int[] {3, 3}, null, null, 0, -1).scenario();
        Scenario wrong = withListedHost(grid, grid.edges().subList(1, grid.edges().size()));
        AnalysisResult e = Analysis.run(wrong);
        StructuralAnalysis.Reduction r = StructuralAnalysis.reduction(wrong, 1_000_000);
        assertEquals("fails", r.status());
        assertEquals(BigInteger.valueOf(e.counterexampleCount()), r.counterexamples());
        for (int k = 0; k < r.firstCounterexamples().size(); k++) {
            assertEquals(spanwright.model.Inputs.format(e.counterexamples().get(k), 12), r.firstCounterexamples().get(k));
        }
        // 6×6 grid (60 variables, beyond enumeration): f = the same grid listed in reverse order holds
        Scenario big = HostGraphBuilder.family("grid", new int[] {6, 6}, null, null, 0, -1).scenario();
        List<Edge> reversed = new ArrayList<>(big.edges());
        java.util.Collections.reverse(reversed);
        assertEquals("holds", StructuralAnalysis.reduction(withListedHost(big, reversed), 5_000_000).status());
        // and without one edge it fails; derived: the inputs where s~t in the grid but not in the
        // grid minus edge e are those where every s–t path uses e — at least one (the path through e
        // with all other edges absent), so the count is positive
        StructuralAnalysis.Reduction bad = StructuralAnalysis.reduction(withListedHost(big, reversed.subList(1, 60)),
                5_000_000);
        assertEquals("fails", bad.status());
        assertTrue(bad.counterexamples().signum() > 0);
        // every listed counterexample really is one (independent: union-find on the input)
        for (String x : bad.firstCounterexamples()) {
            boolean[] bits = new boolean[60];
            for (int i = 0; i < 60; i++) {
                bits[i] = x.charAt(i) == '1';
            }
            InputDetail d = StructuralAnalysis.detail(withListedHost(big, reversed.subList(1, 60)), bits);
            assertEquals(d.witness.connected, !d.f, "counterexample " + x);
        }
    }

    @Test
    void aHostGraphTooWideForItsBudgetFallsBackToACertifiedInterval() {
        // 3×4 grid (17 variables): a budget of 5 frontier states forces the fallback; enumeration
        // (independent computation) must lie inside each side's interval.
        Scenario sc = HostGraphBuilder.family("grid", new int[] {3, 4}, null, null, 0, -1).scenario();
        AnalysisResult e = Analysis.run(sc);
        StructuralAnalysis.Result r = StructuralAnalysis.run(sc, 5, 40, 1000, 5);
        double[] truth = {e.maxResistance(), e.maxCapacitance()};
        StructuralAnalysis.Side[] sides = {r.positive(), r.negative()};
        for (int k = 0; k < 2; k++) {
            assertTrue(sides[k].method().contains("fell back"), sides[k].method());
            assertTrue(sides[k].value() <= truth[k] * (1 + 1e-12), sides[k].value() + " > " + truth[k]);
            assertTrue(sides[k].upper() >= truth[k] * (1 - 1e-12), sides[k].upper() + " < " + truth[k]);
            assertTrue(Double.isFinite(sides[k].upper()), "the derived caps keep the upper end finite");
        }
    }

    /** The interval of each side holds the enumerated truth (independent computation: {@link Analysis#run}). */
    private static void inside(StructuralAnalysis.Result r, AnalysisResult e, String name) {
        double[] truth = {e.maxResistance(), e.maxCapacitance()};
        StructuralAnalysis.Side[] sides = {r.positive(), r.negative()};
        for (int k = 0; k < 2; k++) {
            if (!Double.isNaN(sides[k].value())) {
                assertTrue(sides[k].value() <= truth[k] * (1 + 1e-12), name + ": lower end " + sides[k].value()
                        + " above " + truth[k]);
            }
            assertTrue(sides[k].upper() >= truth[k] * (1 - 1e-12), name + ": upper end " + sides[k].upper()
                    + " below " + truth[k]);
        }
    }

    @Test
    void anExpiredBudgetCutsEveryPassAndSaysSo() {
        // 4×4 grid (24 variables) with the function given as the same grid listed in reverse order,
        // so that the reduction check must build diagrams; a budget that has already run out stops
        // the frontier searches and the diagrams at their first check. Enumeration (independent
        // computation) lies inside each side's interval; the lower ends come with witnesses.
        Scenario grid = HostGraphBuilder.family("grid", new int[] {4, 4}, null, null, 0, -1).scenario();
        List<Edge> reversed = new ArrayList<>(grid.edges());
        java.util.Collections.reverse(reversed);
        Scenario sc = withListedHost(grid, reversed);
        StructuralAnalysis.Result r = StructuralAnalysis.run(sc, spanwright.model.Deadline.afterChecks(0));
        assertFalse(r.positive().exact());
        assertFalse(r.negative().exact());
        assertTrue(r.reduction().timeCut(), r.reduction().method());
        assertEquals(null, r.reduction().correct(), "a check that did not run says neither yes nor no");
        assertNotNull(r.cut());
        assertTrue(r.cut().contains("W+") && r.cut().contains("W-") && r.cut().contains("reduction"), r.cut());
        assertTrue(r.positive().method().contains("time budget"), r.positive().method());
        certificate(sc, r.positive(), true, "cut 4x4 lower end");
        certificate(sc, r.negative(), false, "cut 4x4 lower end");
        inside(r, Analysis.run(sc), "cut 4x4");
        assertTrue(Double.isFinite(r.complexityUpper()) && r.complexityUpper() >= r.complexity());
        // with no budget the same scenario is exact and nothing is cut
        StructuralAnalysis.Result full = StructuralAnalysis.run(sc, spanwright.model.Deadline.none());
        assertTrue(full.exact());
        assertEquals(null, full.cut());
        assertEquals("holds", full.reduction().status());
    }

    @Test
    void aBudgetThatRunsOutInsideTheSearchGivesACertifiedInterval() {
        // budgets of a few checks end the frontier search, the subset dynamic programme or branch
        // and bound part-way: every side is exact or an interval around the enumerated truth
        Scenario grid = HostGraphBuilder.family("grid", new int[] {4, 4}, null, null, 0, -1).scenario();
        Random rnd = new Random(7L);
        Scenario general = RandomScenarios.generate(rnd, 12, 9, 20, 0.1, 0.4, 0.2, 5.0);
        for (Scenario sc : List.of(grid, general)) {
            AnalysisResult e = Analysis.run(sc);
            for (long checks : new long[] {1, 2, 5, 20}) {
                StructuralAnalysis.Result r = StructuralAnalysis.worstCases(sc, StructuralAnalysis.DEFAULT_STATES,
                        StructuralAnalysis.DEFAULT_NODES, spanwright.model.Deadline.afterChecks(checks));
                inside(r, e, sc.title() + " after " + checks + " checks");
                assertEquals(r.exact(), r.cut() == null, r.cut() + " / exact " + r.exact());
            }
        }
    }
}
