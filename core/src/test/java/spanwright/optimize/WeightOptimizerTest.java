package spanwright.optimize;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.analysis.InputDetail;
import spanwright.model.Condition;
import spanwright.model.Edge;
import spanwright.model.Promise;
import spanwright.model.RandomScenarios;
import spanwright.model.Scenario;
import spanwright.model.Vertex;

class WeightOptimizerTest {

    static Scenario readOnce(long seed, int leaves) {
        return RandomScenarios.readOnceFormula(new Random(seed), leaves, 1.0);
    }

    @ParameterizedTest
    @ValueSource(longs = {1, 2, 3, 4, 5, 6})
    void readOnceFormulasReachSqrtN(long seed) {
        // Published: ADV(f) = √N for read-once AND/OR formulas on N variables (Barnum & Saks 2004;
        // Høyer, Lee & Špalek 2005, arXiv:quant-ph/0509067), and no st-connectivity graph beats the
        // adversary bound; the series–parallel graph with suitable weights attains √N. So from unit
        // weights the optimiser must reach √N within 1e-6 relative.
        int leaves = 4 + (int) (seed * 2 % 9);
        Scenario sc = readOnce(seed, leaves);
        assertEquals(Boolean.TRUE, Analysis.run(sc).correct(), "the generator's graph decides its formula");
        OptimizationResult r = WeightOptimizer.optimize(sc);
        assertEquals(Math.sqrt(leaves), r.complexity, 1e-6 * Math.sqrt(leaves),
                "N = " + leaves + ", status " + r.status + ", trace " + r.trace);
        assertTrue(r.complexity >= Math.sqrt(leaves) * (1 - 1e-9), "never below the adversary bound");
        assertTrue(r.balanced);
        assertEquals(r.maxResistance, r.maxCapacitance, 1e-9 * r.maxResistance, "balanced: W+ = W-");
    }

    @Test
    void sixteenVariableReadOnceFormula() {
        // Same source as above, N = 16: √16 = 4.
        Scenario sc = readOnce(42, 16);
        OptimizationResult r = WeightOptimizer.optimize(sc);
        assertEquals(4.0, r.complexity, 4e-6, "trace " + r.trace);
    }

    @ParameterizedTest
    @ValueSource(ints = {2, 3, 5, 8})
    void orAndAndFromRandomWeights(int n) {
        // Derived: OR_n as n parallel edges with weights w_i: W+ = max_i w_i (one edge on),
        // W- = Σ 1/w_i (all off), so W+W- = max w · Σ 1/w ≥ n, equality iff all equal — optimum √n.
        // AND_n as a path: W+ = Σ w_i, W- = max_i 1/w_i... i.e. 1/min w; again ≥ n with equality
        // at equal weights.
        Random rnd = new Random(100 + n);
        List<String> vars = new ArrayList<>();
        List<Vertex> vs = new ArrayList<>();
        List<Edge> or = new ArrayList<>();
        List<Edge> and = new ArrayList<>();
        for (int i = 0; i <= n; i++) {
            vs.add(new Vertex("v" + i));
        }
        for (int i = 0; i < n; i++) {
            vars.add("x" + i);
            Condition c = Condition.literal(i, "x" + i, true);
            or.add(new Edge("o" + i, 0, n, c, Math.exp(2 * rnd.nextGaussian())));
            and.add(new Edge("a" + i, i, i + 1, c, Math.exp(2 * rnd.nextGaussian())));
        }
        for (List<Edge> edges : List.of(or, and)) {
            Scenario sc = new Scenario("t", "", vars, null, null, Promise.NONE, vs, 0, n, edges, null);
            OptimizationResult r = WeightOptimizer.optimize(sc);
            assertEquals(Math.sqrt(n), r.complexity, 1e-7 * Math.sqrt(n), "trace " + r.trace);
        }
    }

    @Test
    void majorityBridgeWithOnlyTheBridgeFree() {
        // Derived: for the majority bridge with unit outer edges and bridge weight r,
        // W+ = 2 + r and W- = 2 + 1/r, so W+W- = 5 + 2(r + 1/r) ≥ 9 with equality at r = 1.
        // From r = 5 (product 7 · 2.2 = 15.4) with the outer four edges locked, the optimiser must
        // reach 9, i.e. √(W+W-) = 3.
        List<String> vars = List.of("a", "b", "c");
        List<Vertex> vs = List.of(new Vertex("s"), new Vertex("A"), new Vertex("B"), new Vertex("t"));
        Condition a = Condition.literal(0, "a", true);
        Condition b = Condition.literal(1, "b", true);
        Condition c = Condition.literal(2, "c", true);
        List<Edge> es = List.of(new Edge("sA", 0, 1, a, 1, null, true), new Edge("Bt", 2, 3, a, 1, null, true),
                new Edge("sB", 0, 2, b, 1, null, true), new Edge("At", 1, 3, b, 1, null, true),
                new Edge("AB", 1, 2, c, 5.0));
        Scenario sc = new Scenario("maj", "", vars, null, null, Promise.NONE, vs, 0, 3, es, null);
        OptimizationResult r = WeightOptimizer.optimize(sc);
        assertEquals(Math.sqrt(15.4), r.initialComplexity, 1e-12);
        assertEquals(3.0, r.complexity, 1e-8);
        assertEquals(1.0, r.scenario.edges().get(4).weight(), 1e-6);
        for (int i = 0; i < 4; i++) {
            assertEquals(1.0, r.scenario.edges().get(i).weight(), 0.0, "locked weights stay exactly");
        }
    }

    @Test
    void traceNeverIncreasesAndCertificatesHold() {
        // Monotone descent (required of the method; common practice, no source) and the
        // certificates: Kirchhoff's current law for the worst positive flow and its energy
        // Σ w θ² = W+ (Thomson); admissibility of the worst negative potential and its energy = W-.
        Random rnd = new Random(77);
        for (int trial = 0; trial < 6; trial++) {
            Scenario sc = randomScenario(rnd, 6, 8, 16);
            AnalysisResult before = Analysis.run(sc);
            if (Double.isNaN(before.complexity())) {
                continue;
            }
            OptimizationResult r = WeightOptimizer.optimize(sc, OptimizerOptions.defaults().withStarts(2), null);
            for (int i = 1; i < r.trace.size(); i++) {
                assertTrue(r.trace.get(i) <= r.trace.get(i - 1) * (1 + 1e-12), "trace " + r.trace);
            }
            assertTrue(r.complexity <= before.complexity() * (1 + 1e-9));
            assertEquals(r.trace.get(r.trace.size() - 1), r.complexity, 1e-9 * r.complexity,
                    "the pruned evaluator agrees with the full analysis");
            check(r.scenario, r.worstPositiveCertificate, r.maxResistance);
            check(r.scenario, r.worstNegativeCertificate, r.maxCapacitance);
        }
    }

    private static void check(Scenario sc, InputDetail d, double expected) {
        assertNotNull(d);
        double energy = 0;
        double[] out = new double[sc.vertexCount()];
        for (int e = 0; e < sc.edges().size(); e++) {
            Edge ed = sc.edges().get(e);
            if (d.witness.connected) {
                if (!d.present[e]) {
                    assertEquals(0.0, d.witness.current[e], 0.0);
                }
                energy += ed.weight() * d.witness.current[e] * d.witness.current[e];
                out[ed.u()] += d.witness.current[e];
                out[ed.v()] -= d.witness.current[e];
            } else {
                double diff = d.witness.potential[ed.u()] - d.witness.potential[ed.v()];
                if (d.present[e]) {
                    assertEquals(0.0, diff, 1e-12, "potential constant on present edges");
                } else {
                    energy += diff * diff / ed.weight();
                }
            }
        }
        if (d.witness.connected) {
            for (int v = 0; v < sc.vertexCount(); v++) {
                double want = v == sc.s() ? 1 : v == sc.t() ? -1 : 0;
                assertEquals(want, out[v], 1e-9, "unit s-t flow");
            }
        } else {
            assertEquals(1.0, d.witness.potential[sc.s()], 0.0);
            assertEquals(0.0, d.witness.potential[sc.t()], 0.0);
        }
        assertEquals(expected, energy, 1e-9 * expected);
    }

    @Test
    void tiedWeightsStayEqual() {
        // Common practice, no source: edges in one group share one weight throughout.
        Random rnd = new Random(5);
        Scenario base = randomScenario(rnd, 5, 7, 14);
        List<Edge> es = new ArrayList<>();
        for (int i = 0; i < base.edges().size(); i++) {
            Edge e = base.edges().get(i);
            es.add(new Edge(e.id(), e.u(), e.v(), e.when(), e.weight(), i % 3 == 0 ? "g" : null, false));
        }
        Scenario sc = base.withEdges(es);
        OptimizationResult r = WeightOptimizer.optimize(sc);
        double w0 = r.scenario.edges().get(0).weight();
        for (int i = 0; i < es.size(); i += 3) {
            assertEquals(w0, r.scenario.edges().get(i).weight(), 1e-12 * w0);
        }
        OptimizationResult lit = WeightOptimizer.optimize(base,
                OptimizerOptions.defaults().withTie(OptimizerOptions.Tie.LITERAL), null);
        for (int i = 0; i < es.size(); i++) {
            for (int j = 0; j < es.size(); j++) {
                if (es.get(i).when().toString().equals(es.get(j).when().toString())) {
                    assertEquals(lit.scenario.edges().get(i).weight(), lit.scenario.edges().get(j).weight(), 1e-12);
                }
            }
        }
    }

    static Scenario randomScenario(Random rnd, int vars, int vertexCount, int edgeCount) {
        return RandomScenarios.generate(rnd, vars, vertexCount, edgeCount, 0.0, 1.0 / 3, 0.5, 1.5);
    }
}
