package spanwright.bounds;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.reduction.DecisionTreeBuilder;
import spanwright.reduction.FormulaBuilder;
import spanwright.model.ScenarioException;
import spanwright.io.ScenarioReader;
import spanwright.model.Scenario;
import spanwright.model.SeededRandom;

class BoundsTest {

    /** A scenario over the given variables whose graph is one s–t edge on the first variable. */
    static String scenarioJson(List<String> variables, String function, String promise) {
        StringBuilder v = new StringBuilder();
        for (String name : variables) {
            v.append(v.length() == 0 ? "" : ", ").append('"').append(name).append('"');
        }
        return "{\"format\": \"spanwright-scenario\", \"version\": 1, \"title\": \"test\", \"variables\": [" + v
                + "], \"function\": " + (function == null ? "null" : "\"" + function + "\"") + ", \"promise\": "
                + (promise == null ? "null" : promise) + ", \"graph\": {\"s\": \"s\", \"t\": \"t\", \"vertices\": "
                + "[{\"id\": \"s\"}, {\"id\": \"t\"}], \"edges\": [{\"id\": \"e\", \"u\": \"s\", \"v\": \"t\", \"when\": \""
                + variables.get(0) + "\"}]}}";
    }

    @Test
    void everyDemoScenarioHasGapAtLeastOne() throws IOException {
        assertTrue(demoScenarios(false) >= 3, "expected the demo scenarios in ../scenarios");
    }

    @Tag("slow")
    @Test
    void everyLargeDemoScenarioHasGapAtLeastOne() throws IOException {
        // the same for the demos beyond 6 variables (minutes: both SDPs at 7 variables)
        demoScenarios(true);
    }

    /** Checks the demos with more than 6 variables ({@code large}) or the others; returns how many. */
    private static int demoScenarios(boolean large) throws IOException {
        // Reichardt, SODA 2011 (arXiv:1005.1601): every graph deciding f is a span program with
        // witness size √(W₊W₋) ≥ ADV±; so the gap of every demo scenario is ≥ 1 (the façade would
        // throw BoundViolation otherwise), and ADV ≤ ADV± (Høyer, Lee & Špalek 2007)
        int count = 0;
        try (DirectoryStream<Path> ds = Files.newDirectoryStream(Path.of("..", "scenarios"), "*.json")) {
            for (Path p : ds) {
                Scenario sc = ScenarioReader.read(Files.readString(p, StandardCharsets.UTF_8));
                if ((sc.variableCount() > 6) != large) {
                    continue;
                }
                BoundsReport r = Bounds.compute(sc, Bounds.Limits.CLI);
                assertNotNull(r.general(), p.toString());
                GeneralAdversaryTest.checkCertificates(r.general());
                assertTrue(r.optimalityGap() >= 1 - Bounds.GAP_TOLERANCE, p + ": gap " + r.optimalityGap());
                assertTrue(r.positive().lower() <= r.general().upper() * (1 + 1e-9));
                assertEquals(r.classical().decisionTreeDepth() / r.complexity(), r.speedup(), 1e-12);
                count++;
            }
        }
        return count;
    }

    /** A seeded random AND/OR formula over distinct variables x1..xn with some negated leaves. */
    static String readOnceFormula(SeededRandom r, int from, int to) {
        if (from == to) {
            return (r.nextInt(3) == 0 ? "!" : "") + "x" + from;
        }
        int cut = from + r.nextInt(to - from);
        String op = r.nextInt(2) == 0 ? " & " : " | ";
        return "(" + readOnceFormula(r, from, cut) + op + readOnceFormula(r, cut + 1, to) + ")";
    }

    @Test
    void builtGraphsRespectTheBoundsAndReadOnceRuleWeightsAreOptimal() {
        // ADV ≤ ADV± ≤ √(W₊W₋) for every graph a builder produces for f (Høyer, Lee & Špalek 2007;
        // Reichardt 2011); for read-once formulas the builder's rule weights give √(W₊W₋) = √N
        // (FormulaBuilder javadoc) and ADV± = √N (Barnum & Saks 2004; Høyer, Lee & Špalek,
        // arXiv:quant-ph/0509067), so the gap is 1
        SeededRandom r = new SeededRandom(2024);
        for (int trial = 0; trial < 8; trial++) {
            int n = 2 + r.nextInt(4);
            String formula = readOnceFormula(r, 1, n);
            List<String> vars = TargetFunction.names("x", n);
            List<Scenario> graphs = new ArrayList<>();
            graphs.add(FormulaBuilder.build(formula, vars, FormulaBuilder.Weights.RULE).scenario());
            graphs.add(FormulaBuilder.build(formula, vars, FormulaBuilder.Weights.UNIT).scenario());
            graphs.add(DecisionTreeBuilder.build(formula, vars, false, null, DecisionTreeBuilder.Weights.UNIT).scenario());
            graphs.add(DecisionTreeBuilder.build(formula, vars, true, null, DecisionTreeBuilder.Weights.GUESS).scenario());
            TargetFunction f = TargetFunction.of(graphs.get(0));
            GeneralAdversary g = GeneralAdversary.compute(f);
            PositiveAdversary p = PositiveAdversary.compute(f);
            assertTrue(p.lower() <= g.upper() * (1 + 1e-9));
            assertEquals(Math.sqrt(n), g.lower(), 1e-6, formula);
            for (int k = 0; k < graphs.size(); k++) {
                AnalysisResult a = Analysis.run(graphs.get(k));
                assertEquals(Boolean.TRUE, a.correct(), "builder output decides " + formula);
                double gap = Bounds.optimalityGap(a.complexity(), g.lower());
                assertTrue(gap >= 1 - Bounds.GAP_TOLERANCE, formula + " graph " + k);
                if (k == 0) {
                    assertEquals(1, gap, 1e-6, "rule weights on " + formula);
                }
            }
        }
    }

    @Test
    void decisionTreeGraphsOfRandomFunctionsRespectTheBounds() {
        // ADV ≤ ADV± ≤ √(W₊W₋) (Høyer, Lee & Špalek 2007; Reichardt 2011) for the tree and the
        // diagram the decision-tree builder makes from a seeded random truth table
        for (int seed = 1; seed <= 4; seed++) {
            int n = 3 + seed % 3;
            TargetFunction f = Functions.random(n, 500 + seed, false);
            StringBuilder table = new StringBuilder();
            for (long m = 0; m < (1L << n); m++) {
                table.append(f.valueAt(m));
            }
            GeneralAdversary g = GeneralAdversary.compute(f);
            PositiveAdversary p = PositiveAdversary.compute(f);
            assertTrue(p.lower() <= g.upper() * (1 + 1e-9));
            for (boolean diagram : new boolean[] {false, true}) {
                for (DecisionTreeBuilder.Weights w : DecisionTreeBuilder.Weights.values()) {
                    Scenario sc = DecisionTreeBuilder.build(table.toString(), null, diagram, null, w).scenario();
                    AnalysisResult a = Analysis.run(sc);
                    assertEquals(Boolean.TRUE, a.correct());
                    assertTrue(Bounds.optimalityGap(a.complexity(), g.lower()) >= 1 - Bounds.GAP_TOLERANCE,
                            "seed " + seed + " " + w);
                }
            }
        }
    }

    @Test
    void pageLimitLeavesTheSdpOutWithAReason() {
        // the size guard: 7 variables is beyond the page's SDP limit (6) but within the others
        List<String> vars = TargetFunction.names("x", 7);
        Scenario sc = ScenarioReader.read(scenarioJson(vars, "any(" + String.join(", ", vars) + ")", null));
        BoundsReport r = Bounds.compute(sc, Bounds.Limits.PAGE);
        assertNull(r.general());
        assertTrue(r.reason("general").contains("limit of 6"), r.reason("general"));
        assertTrue(r.reason("general").contains("command-line tool allows 8"), r.reason("general"));
        assertNotNull(r.positive());
        assertNotNull(r.classical());
        assertTrue(Double.isNaN(r.optimalityGap()));
        assertNotNull(r.reason("optimalityGap"));
    }

    @Test
    void beyondEveryLimitEverythingIsAReason() {
        List<String> vars = TargetFunction.names("x", 13);
        Scenario sc = ScenarioReader.read(scenarioJson(vars, "x1", null));
        BoundsReport r = Bounds.compute(sc, Bounds.Limits.CLI);
        assertNull(r.function());
        assertNull(r.general());
        assertNull(r.positive());
        assertNull(r.classical());
        assertTrue(r.reason("classical").contains("limit of 12"), r.reason("classical"));
        // the graph x1 decides f = x1: √(W₊W₋) = 1 is still reported
        assertEquals(1, r.complexity(), 1e-12);
    }

    @Test
    void beyondEnumerationThisGraphsSideComesFromTheStructuralEngine() {
        // K12 with one variable per edge: 66 variables, never enumerated. Derived: unit weights give
        // W+ = 11 (a Hamiltonian s-t path) and W- = floor(12^2/4) = 36 (a balanced cut), so
        // sqrt(W+ W-) = sqrt(396); the graph decides its own connectivity by construction.
        Scenario k12 = spanwright.reduction.HostGraphBuilder.family("complete", new int[] {12}, null, null, 1, -1)
                .scenario();
        BoundsReport r = Bounds.compute(k12, Bounds.Limits.CLI);
        assertEquals("structure", r.measured().method);
        assertEquals("2^66", r.measured().domainText);
        assertEquals(Boolean.TRUE, r.measured().correct);
        assertEquals(Math.sqrt(396), r.complexity(), 1e-9);
        assertNull(r.analysis(), "nothing enumerated");
        assertNull(r.general());
        assertTrue(r.reason("general").contains("66 variables"), r.reason("general"));
        // the weight search (working set) never does worse than the weights it starts from
        assertNotNull(r.optimised());
        assertTrue(r.optimisedComplexity() <= r.complexity() * (1 + 1e-9), r.optimisedComplexity() + "");
        // a function this graph does not decide: no gap, no optimised weights, the reason in words
        Scenario wrong = ScenarioReader.read(spanwright.io.ScenarioWriter.write(k12)
                .replaceFirst("\"function\": \\{[^}]*\\}", "\"function\": \"" + k12.variables().get(0) + "\""));
        assertEquals(k12.variables().get(0), wrong.functionText());
        BoundsReport w = Bounds.compute(wrong, Bounds.Limits.CLI);
        assertEquals(Boolean.FALSE, w.measured().correct);
        assertTrue(w.reason("optimalityGap").contains("does not decide"), w.reason("optimalityGap"));
        assertNull(w.optimised());
    }

    @Test
    void wrongReductionHasNoGap() {
        // the one-edge graph decides x1, not x1 & x2
        Scenario sc = ScenarioReader.read(scenarioJson(List.of("x1", "x2"), "x1 & x2", null));
        BoundsReport r = Bounds.compute(sc, Bounds.Limits.CLI);
        assertTrue(Double.isNaN(r.optimalityGap()));
        assertTrue(r.reason("optimalityGap").contains("does not decide"));
        assertNotNull(r.general());
    }

    @Test
    void missingFunctionIsBadInput() {
        ScenarioException e = assertThrows(ScenarioException.class,
                () -> Bounds.compute(ScenarioReader.read(scenarioJson(List.of("a"), null, null)), Bounds.Limits.CLI));
        assertEquals("no-function", e.code());
        assertEquals("$.function", e.path());
    }

    @Test
    void violatedBoundsFailLoudly() {
        // common practice, no source: a ratio below 1 beyond the tolerance cannot be a rounding effect
        assertThrows(Bounds.BoundViolation.class, () -> Bounds.optimalityGap(1.0, 2.0));
        assertEquals(1, Bounds.optimalityGap(2.0 - 1e-9, 2.0), 1e-8);
        assertThrows(Bounds.BoundViolation.class, () -> Bounds.checkOrder(3, 2));
    }
}
