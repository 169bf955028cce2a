package spanwright.reduction;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.io.RoundTrip;
import spanwright.model.ScenarioException;
import spanwright.io.ScenarioReader;
import spanwright.model.Edge;
import spanwright.model.Scenario;

class CompositionBuilderTest {

    /** A unit-weight scenario from a compact edge list "u v when; …". */
    private static Scenario scenario(String vars, String function, String promise, String edges) {
        StringBuilder sb = new StringBuilder("{\"format\":\"spanwright-scenario\",\"version\":1,\"variables\":[");
        String[] vs = vars.split(",");
        for (int i = 0; i < vs.length; i++) {
            sb.append(i > 0 ? "," : "").append('"').append(vs[i]).append('"');
        }
        sb.append("],\"function\":").append(function == null ? "null" : "\"" + function + "\"");
        sb.append(",\"promise\":").append(promise == null ? "null" : promise).append(",\"graph\":{\"s\":\"s\",\"t\":\"t\",\"vertices\":[");
        java.util.LinkedHashSet<String> ids = new java.util.LinkedHashSet<>(List.of("s", "t"));
        String[] es = edges.split(";");
        for (String e : es) {
            String[] p = e.trim().split(" ");
            ids.add(p[0]);
            ids.add(p[1]);
        }
        int k = 0;
        for (String id : ids) {
            sb.append(k++ > 0 ? "," : "").append("{\"id\":\"").append(id).append("\"}");
        }
        sb.append("],\"edges\":[");
        for (int i = 0; i < es.length; i++) {
            String[] p = es[i].trim().split(" ");
            sb.append(i > 0 ? "," : "").append("{\"u\":\"").append(p[0]).append("\",\"v\":\"").append(p[1])
                    .append("\",\"when\":\"").append(p[2]).append("\"}");
        }
        return ScenarioReader.read(sb.append("]}}").toString());
    }

    private static final Scenario OR2 = scenario("y1,y2", "y1 | y2", null, "s t y1; s t y2");
    private static final Scenario AND2 = scenario("a,b", "a & b", null, "s m a; m t b");

    @Test
    void orOfAndsHasProductFour() {
        // Derived: OR_2 as two parallel unit edges (W₊ = 1, W₋ = 2), AND_2 as a two-edge path
        // (W₊ = 2, W₋ = 1). Each y-edge becomes a path scaled by 1/W₊(AND) = 1/2: a parallel of
        // two series pairs, every weight 1/2. W₊: one pair present, R = 1/2 + 1/2 = 1. W₋: each
        // pair broken once, capacitance 1/(1/2) = 2 per pair, in parallel 4. W₊W₋ = 4, equal to
        // the product of the parts W₊(F)W₋(F)·W₊W₋(g) = 1·2·2.
        Built b = CompositionBuilder.compose(OR2, AND2);
        Scenario sc = b.scenario();
        assertEquals(List.of("y1.a", "y1.b", "y2.a", "y2.b"), sc.variables());
        assertEquals(4, sc.edges().size());
        for (Edge e : sc.edges()) {
            assertEquals(0.5, e.weight(), 1e-15);
        }
        AnalysisResult r = Analysis.run(sc);
        assertEquals(Boolean.TRUE, r.correct());
        assertEquals(1.0, r.maxResistance(), 1e-12);
        assertEquals(4.0, r.maxCapacitance(), 1e-12);
        assertEquals(4.0, r.maxResistance() * r.maxCapacitance(), 1e-12);
        assertEquals(4.0, (Double) b.stats().get("productBound"), 1e-12);
        RoundTrip.check(sc);
    }

    @Test
    void andOfOrsHasProductFour() {
        // Derived: AND_2 outer (W₊ = 2, W₋ = 1), OR_2 inner (W₊ = 1, W₋ = 2), scale 1/1: a series of
        // two parallel pairs of unit edges. W₊ = 2 (one edge of each pair), W₋ = 2 (one pair fully
        // absent: two unit capacitors in parallel, the other pair shorted). Product 4 = 2·1·2.
        Scenario outer = scenario("y1,y2", "y1 & y2", null, "s m y1; m t y2");
        Scenario inner = scenario("a,b", "a | b", null, "s t a; s t b");
        Built b = CompositionBuilder.compose(outer, inner);
        AnalysisResult r = Analysis.run(b.scenario());
        assertEquals(Boolean.TRUE, r.correct());
        assertEquals(2.0, r.maxResistance(), 1e-12);
        assertEquals(2.0, r.maxCapacitance(), 1e-12);
        assertEquals(4.0, (Double) b.stats().get("productBound"), 1e-12);
    }

    @Test
    void randomCompositionsDecideTheComposedFunctionWithinTheProductBound() {
        // Source: independent computation (the analysis enumerates every input of F∘g) for the
        // reduction; derived (CompositionBuilder javadoc) for W₊W₋ ≤ W₊(F)W₋(F)·max W₊W₋(gadget).
        // Seeded random outer formulas with negations (2–3 variables) and inner scenarios from the
        // formula and decision-tree builders (2–3 variables): at most 9 variables.
        Random rnd = new Random(77L);
        for (int trial = 0; trial < 30; trial++) {
            int k = 2 + rnd.nextInt(2);
            int m = 2 + rnd.nextInt(2);
            List<String> ys = List.of("y1", "y2", "y3").subList(0, k);
            String fo = Formulas.random(rnd, k, 2, "y");
            String gi = Formulas.random(rnd, m, 2);
            Scenario outer = FormulaBuilder.build(fo, ys, FormulaBuilder.Weights.RULE).scenario();
            Scenario inner = trial % 2 == 0
                    ? FormulaBuilder.build(gi, Formulas.vars(m), FormulaBuilder.Weights.RULE).scenario()
                    : DecisionTreeBuilder.build(gi, Formulas.vars(m), trial % 4 == 1, null,
                            DecisionTreeBuilder.Weights.GUESS).scenario();
            Built b = CompositionBuilder.compose(outer, inner);
            AnalysisResult r = Analysis.run(b.scenario());
            assertEquals(Boolean.TRUE, r.correct(), fo + " of " + gi);
            double bound = (Double) b.stats().get("productBound");
            if (r.positiveCount() > 0 && r.negativeCount() > 0 && !Double.isNaN(bound)) {
                double product = r.maxResistance() * r.maxCapacitance();
                assertTrue(product <= bound * (1 + 1e-9), fo + " of " + gi + ": " + product + " > " + bound);
            }
            RoundTrip.check(b.scenario());
        }
    }

    @Test
    void negatedLiteralsUseAGraphForTheNegation() {
        // Derived: F = y1 & !y2 with g = a & b; the !y2 edge becomes a graph for !(a & b) = !a | !b
        // (two parallel edges), so F∘g = (y1.a & y1.b) & !(y2.a & y2.b).
        Scenario outer = scenario("y1,y2", "y1 & !y2", null, "s m y1; m t !y2");
        Built b = CompositionBuilder.compose(outer, AND2);
        AnalysisResult r = Analysis.run(b.scenario());
        assertEquals(Boolean.TRUE, r.correct());
        assertEquals(4, b.scenario().edges().size());
        assertTrue(b.stats().containsKey("negatedInnerPositive"));
    }

    @Test
    void outerPromiseCarriesOver() {
        // Derived: an outer promise "Hamming weight 1" on (y1, y2) becomes "exactly one block has
        // g = 1" on the composed inputs: with g = a & b, 2·3 = 6 of the 16 inputs.
        Scenario outer = scenario("y1,y2", "y1 | y2", "{\"weights\": [1]}", "s t y1; s t y2");
        Built b = CompositionBuilder.compose(outer, AND2);
        AnalysisResult r = Analysis.run(b.scenario());
        assertEquals(6, r.domainSize());
        assertEquals(Boolean.TRUE, r.correct());
        RoundTrip.check(b.scenario());
    }

    @Test
    void badPartsAreRefusedWithTheirPath() {
        // Common practice, no source: the refusal names the part at fault.
        Scenario noFunction = scenario("a,b", null, null, "s m a; m t b");
        ScenarioException f = assertThrows(ScenarioException.class, () -> CompositionBuilder.compose(OR2, noFunction));
        assertEquals("$.inner.function", f.path());
        Scenario promised = scenario("a,b", "a & b", "\"a | b\"", "s m a; m t b");
        ScenarioException p = assertThrows(ScenarioException.class, () -> CompositionBuilder.compose(OR2, promised));
        assertEquals("$.inner.promise", p.path());
        Scenario wrong = scenario("y1,y2", "y1 & y2", null, "s t y1; s t y2");
        ScenarioException w = assertThrows(ScenarioException.class, () -> CompositionBuilder.compose(wrong, AND2));
        assertEquals("$.outer", w.path());
        assertEquals("wrong-reduction", w.code());
        assertTrue(w.getMessage().contains("wrong on"), w.getMessage());
    }

    @Test
    void theBuiltInGadgetsMakeTheDefaultCompositionWork() throws Exception {
        // Each gadget decides its function (checked by enumeration), and the read-once ones have
        // sqrt(W+ W-) = sqrt(leaves) under the read-once rule (the adversary bound of a read-once
        // formula, Barnum & Saks 2004 / Reichardt & Špalek arXiv:0710.2630; from memory): sqrt 2.
        for (Gadgets.Gadget g : Gadgets.ALL) {
            AnalysisResult r = Analysis.run(Gadgets.scenario(g.name(), "$.inner"));
            assertEquals(Boolean.TRUE, r.correct(), g.name());
            if (!g.name().equals("two-of-3")) {
                assertEquals(Math.sqrt(2), r.complexity(), 1e-12, g.name());
            }
        }
        // The page's default composition: the current (default) scenario of 6 variables with the
        // first gadget: 12 variables, within every limit; it decides F∘g and its W+ W- is at most
        // the product of the parts' (Rayleigh monotonicity, see CompositionBuilder).
        String outer = new String(getClass().getResourceAsStream("/spanwright/scenarios/default.json").readAllBytes(),
                java.nio.charset.StandardCharsets.UTF_8);
        Built b = BuildRequest.run(spanwright.io.Json.parse("{\"kind\":\"compose\",\"outer\":" + outer
                + ",\"inner\":\"" + Gadgets.ALL.get(0).name() + "\"}"));
        assertEquals(12, b.scenario().variableCount());
        AnalysisResult r = Analysis.run(b.scenario());
        assertEquals(Boolean.TRUE, r.correct());
        double product = ((Number) b.stats().get("productBound")).doubleValue();
        assertTrue(r.maxResistance() * r.maxCapacitance() <= product * (1 + 1e-9), r.complexity() + " vs " + product);
        ScenarioException e = assertThrows(ScenarioException.class, () -> BuildRequest.run(spanwright.io.Json.parse(
                "{\"kind\":\"compose\",\"outer\":" + outer + ",\"inner\":\"three-of-5\"}")));
        assertEquals("$.inner", e.path());
        assertTrue(e.getMessage().contains("either-of-2, both-of-2, two-of-3"), e.getMessage());
    }
}
