package spanwright.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import spanwright.io.ScenarioReader;
import spanwright.model.Inputs;
import spanwright.model.Scenario;

/** Witness sizes of classic st-connectivity gadgets, derived by hand (comments show how). */
class SpanProgramFactsTest {
    private static final double EPS = 1e-12;

    static String scenario(List<String> vars, String function, String promise, String s, String t,
            List<String> vertices, List<String[]> edges) {
        StringBuilder sb = new StringBuilder("{\"format\":\"spanwright-scenario\",\"version\":1,\"variables\":[");
        for (int i = 0; i < vars.size(); i++) {
            sb.append(i > 0 ? "," : "").append('"').append(vars.get(i)).append('"');
        }
        sb.append("],\"function\":").append(function == null ? "null" : "\"" + function + "\"");
        sb.append(",\"promise\":").append(promise == null ? "null" : promise);
        sb.append(",\"graph\":{\"s\":\"").append(s).append("\",\"t\":\"").append(t).append("\",\"vertices\":[");
        for (int i = 0; i < vertices.size(); i++) {
            sb.append(i > 0 ? "," : "").append("{\"id\":\"").append(vertices.get(i)).append("\"}");
        }
        sb.append("],\"edges\":[");
        for (int i = 0; i < edges.size(); i++) {
            String[] e = edges.get(i);
            sb.append(i > 0 ? "," : "").append("{\"u\":\"").append(e[0]).append("\",\"v\":\"").append(e[1])
                    .append("\",\"when\":\"").append(e[2]).append('"');
            if (e.length > 3) {
                sb.append(",\"weight\":").append(e[3]);
            }
            sb.append('}');
        }
        return sb.append("]}}").toString();
    }

    private static List<String> vars(int n) {
        List<String> v = new ArrayList<>();
        for (int i = 1; i <= n; i++) {
            v.add("x" + i);
        }
        return v;
    }

    @ParameterizedTest
    @ValueSource(ints = {1, 2, 3, 5, 8})
    void orAsParallelEdges(int n) {
        // Derived: OR_n as n parallel unit edges s–t. A positive input with k ≥ 1 ones has R = 1/k,
        // max 1 (one edge on). The only negative input (all zero) has n unit capacitors in
        // parallel: C = n. So W₊ = 1, W₋ = n, bound √n.
        List<String[]> e = new ArrayList<>();
        for (int i = 1; i <= n; i++) {
            e.add(new String[] {"s", "t", "x" + i});
        }
        Scenario sc = ScenarioReader.read(scenario(vars(n), "any(" + String.join(",", vars(n)) + ")", null,
                "s", "t", List.of("s", "t"), e));
        AnalysisResult r = Analysis.run(sc);
        assertEquals(Boolean.TRUE, r.correct());
        assertEquals(1.0, r.maxResistance(), EPS);
        assertEquals(n, r.maxCapacitance(), EPS);
        assertEquals(Math.sqrt(n), r.complexity(), EPS);
        assertEquals((1L << n) - 1, r.positiveCount());
    }

    @ParameterizedTest
    @ValueSource(ints = {1, 2, 3, 6, 9})
    void andAsSeriesPath(int n) {
        // Derived: AND_n as a path of n unit edges. The only positive input has n resistors in
        // series: R = n. A negative input with k ≥ 1 zeros has k capacitors in series: C = 1/k,
        // max 1. So W₊ = n, W₋ = 1, bound √n.
        List<String> vs = new ArrayList<>();
        List<String[]> e = new ArrayList<>();
        for (int i = 0; i <= n; i++) {
            vs.add("v" + i);
        }
        for (int i = 1; i <= n; i++) {
            e.add(new String[] {"v" + (i - 1), "v" + i, "x" + i});
        }
        Scenario sc = ScenarioReader.read(scenario(vars(n), "all(" + String.join(",", vars(n)) + ")", null,
                "v0", "v" + n, vs, e));
        AnalysisResult r = Analysis.run(sc);
        assertEquals(Boolean.TRUE, r.correct());
        assertEquals(n, r.maxResistance(), EPS);
        assertEquals(1.0, r.maxCapacitance(), EPS);
        assertEquals(Math.sqrt(n), r.complexity(), EPS);
    }

    @ParameterizedTest
    @ValueSource(doubles = {0.25, 1.0, 2.0, 3.5})
    void majorityBridge(double r) {
        // Derived: the bridge for maj(a, b, c) — s–A: a, B–t: a, s–B: b, A–t: b, A–B: c of weight r.
        // Positive inputs: a=b=1 gives two parallel 2-paths (bridge balanced) R = 1; a=1,b=0,c=1
        // gives the path s–A–B–t: R = 1 + r + 1; symmetric for b=1,a=0,c=1. So W₊ = 2 + r.
        // Negative: a=1,b=0,c=0 joins {s,A} and {B,t}; between them s–B, A–t (capacitance 1 each)
        // and A–B (1/r): C = 2 + 1/r; a=b=0 gives C = 1 either way. So W₋ = 2 + 1/r.
        List<String[]> e = List.of(new String[] {"s", "A", "a"}, new String[] {"B", "t", "a"},
                new String[] {"s", "B", "b"}, new String[] {"A", "t", "b"},
                new String[] {"A", "B", "c", Double.toString(r)});
        Scenario sc = ScenarioReader.read(scenario(List.of("a", "b", "c"), "maj(a, b, c)", null, "s", "t",
                List.of("s", "A", "B", "t"), e));
        AnalysisResult res = Analysis.run(sc);
        assertEquals(Boolean.TRUE, res.correct());
        assertEquals(2 + r, res.maxResistance(), EPS);
        assertEquals(2 + 1 / r, res.maxCapacitance(), EPS);
        assertEquals(Math.sqrt((2 + r) * (2 + 1 / r)), res.complexity(), EPS);
        // worst inputs: first in input order among maximisers (derived from the list above: 011 and
        // 101 tie on the positive side; 010 and 100 on the negative side, by the a↔b symmetry)
        assertEquals("011", Inputs.format(res.worstPositive(), 3));
        assertEquals("010", Inputs.format(res.worstNegative(), 3));
    }

    @Test
    void wrongReductionIsReportedWithCounterexamples() {
        // Derived: one edge labelled a decides f = a; claiming f = a & b is wrong exactly on 10.
        Scenario sc = ScenarioReader.read(scenario(List.of("a", "b"), "a & b", null, "s", "t",
                List.of("s", "t"), List.<String[]>of(new String[] {"s", "t", "a"})));
        AnalysisResult r = Analysis.run(sc);
        assertEquals(Boolean.FALSE, r.correct());
        assertEquals(1, r.counterexampleCount());
        assertEquals("10", Inputs.format(r.counterexamples().get(0), 2));
    }

    @Test
    void noFunctionMeansNotChecked() {
        Scenario sc = ScenarioReader.read(scenario(List.of("a"), null, null, "s", "t", List.of("s", "t"),
                List.<String[]>of(new String[] {"s", "t", "a"})));
        AnalysisResult r = Analysis.run(sc);
        assertNull(r.correct());
        assertEquals(1.0, r.complexity(), EPS); // derived: R = 1 on a=1, C = 1 on a=0
    }

    @Test
    void emptySidesAndWholeGraphDisconnected() {
        // Derived: an always-present edge makes every input positive — no negative side, no bound.
        Scenario always = ScenarioReader.read(scenario(List.of("a"), null, null, "s", "t", List.of("s", "t"),
                List.<String[]>of(new String[] {"s", "t", "1", "3"})));
        AnalysisResult r = Analysis.run(always);
        assertEquals(2, r.positiveCount());
        assertEquals(0, r.negativeCount());
        assertEquals(3.0, r.maxResistance(), EPS);
        assertTrue(Double.isNaN(r.maxCapacitance()));
        assertTrue(Double.isNaN(r.complexity()));
        assertEquals(-1, r.worstNegative());
        // s and t in different components of the whole graph: C = 0 on every input.
        Scenario apart = ScenarioReader.read(scenario(List.of("a"), "0", null, "s", "t",
                List.of("s", "m", "t"), List.<String[]>of(new String[] {"s", "m", "a"})));
        AnalysisResult q = Analysis.run(apart);
        assertEquals(Boolean.TRUE, q.correct());
        assertEquals(0, q.positiveCount());
        assertEquals(0.0, q.maxCapacitance(), 0.0);
        assertTrue(Double.isNaN(q.complexity()));
    }

    @Test
    void promiseRestrictsTheDomain() {
        // Derived: OR_3 as parallel edges under the promise "exactly one or zero ones": positive
        // inputs have one edge (R = 1), the negative one has C = 3; 4 inputs in all.
        List<String[]> e = List.of(new String[] {"s", "t", "x1"}, new String[] {"s", "t", "x2"},
                new String[] {"s", "t", "x3"});
        Scenario sc = ScenarioReader.read(scenario(vars(3), "x1 | x2 | x3", "{\"weights\":[0,1]}", "s", "t",
                List.of("s", "t"), e));
        AnalysisResult r = Analysis.run(sc);
        assertEquals(4, r.domainSize());
        assertEquals(1.0, r.maxResistance(), EPS);
        assertEquals(3.0, r.maxCapacitance(), EPS);
    }

    @Test
    void stepwiseRunEqualsOneShot() {
        // Common practice, no source: the stepped enumeration must give the same result.
        List<String[]> e = List.of(new String[] {"s", "A", "a"}, new String[] {"B", "t", "a"},
                new String[] {"s", "B", "b"}, new String[] {"A", "t", "b"}, new String[] {"A", "B", "c"});
        Scenario sc = ScenarioReader.read(scenario(List.of("a", "b", "c"), "maj(a,b,c)", null, "s", "t",
                List.of("s", "A", "B", "t"), e));
        AnalysisRun run = Analysis.start(sc);
        int steps = 0;
        while (!run.step(3)) {
            steps++;
        }
        AnalysisResult a = run.result();
        AnalysisResult b = Analysis.run(sc);
        assertEquals(2, steps);
        assertEquals(b.complexity(), a.complexity(), 0.0);
        assertEquals(b.worstPositive(), a.worstPositive());
    }
}
