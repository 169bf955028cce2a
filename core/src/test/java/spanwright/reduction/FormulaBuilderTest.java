package spanwright.reduction;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.expr.ExprParser;
import spanwright.io.RoundTrip;
import spanwright.model.ScenarioException;
import spanwright.model.Edge;
import spanwright.model.Scenario;

class FormulaBuilderTest {
    private static final FormulaBuilder.Weights RULE = FormulaBuilder.Weights.RULE;

    @Test
    void randomFormulasDecideTheirFunctionOnEveryInput() {
        // Source: independent computation — the analysis enumerates every input and compares s–t
        // connectivity with the formula's value. Seeded random formulas over 1..10 variables using
        // every operator of the language, both weightings.
        Random rnd = new Random(20260101L);
        for (int trial = 0; trial < 120; trial++) {
            int n = 1 + trial % 10;
            String f = Formulas.random(rnd, n, 3);
            for (FormulaBuilder.Weights w : FormulaBuilder.Weights.values()) {
                Built b = FormulaBuilder.build(f, Formulas.vars(n), w);
                AnalysisResult r = Analysis.run(b.scenario());
                assertEquals(Boolean.TRUE, r.correct(), f + " wrong on " + r.counterexampleCount() + " inputs");
                // Derived (FormulaBuilder javadoc): the recursion bounds W₊ and W₋ from above.
                if (r.positiveCount() > 0 && r.negativeCount() > 0) {
                    double p = (Double) b.stats().get("predictedPositive");
                    double m = (Double) b.stats().get("predictedNegative");
                    assertTrue(r.maxResistance() <= p * (1 + 1e-9), f + ": W+ " + r.maxResistance() + " > " + p);
                    assertTrue(r.maxCapacitance() <= m * (1 + 1e-9), f + ": W- " + r.maxCapacitance() + " > " + m);
                }
                RoundTrip.check(b.scenario());
            }
        }
    }

    @Test
    void readOnceFormulasReachSqrtNUpTo14Leaves() {
        readOnce(1, 14, 3, 7L);
    }

    @Test
    @Tag("slow")
    void readOnceFormulasReachSqrtNUpTo20Leaves() {
        readOnce(15, 20, 1, 8L);
    }

    /**
     * Source: Barnum &amp; Saks (JCSS 2004) and Høyer, Lee &amp; Špalek (arXiv:quant-ph/0509067): the
     * adversary bound of a read-once AND/OR formula on N variables is √N; derived (FormulaBuilder
     * javadoc): the rule weights give W₊W₋ = N exactly. Checked against the analysis's enumeration.
     */
    private static void readOnce(int fromN, int toN, int perN, long seed) {
        Random rnd = new Random(seed);
        for (int n = fromN; n <= toN; n++) {
            for (int k = 0; k < perN; k++) {
                String f = Formulas.readOnce(rnd, 1, n);
                Built b = FormulaBuilder.build(f, Formulas.vars(n), RULE);
                assertEquals(true, b.stats().get("readOnce"), f);
                AnalysisResult r = Analysis.run(b.scenario());
                assertEquals(Boolean.TRUE, r.correct(), f);
                assertEquals(Math.sqrt(n), r.complexity(), 1e-9 * Math.sqrt(n), f);
                // balanced: W₊ = W₋ = √N
                assertEquals(Math.sqrt(n), r.maxResistance(), 1e-9 * Math.sqrt(n), f);
                assertEquals(Math.sqrt(n), r.maxCapacitance(), 1e-9 * Math.sqrt(n), f);
            }
        }
    }

    @Test
    void parityExpansionSizes() {
        // Derived (AndOrForm javadoc): L(1) = 1, L(m) = 2(L(⌈m/2⌉) + L(⌊m/2⌋)); by hand:
        // L(2) = 4, L(3) = 2(4+1) = 10, L(4) = 16, L(5) = 2(10+4) = 28, L(6) = 40, L(7) = 52,
        // L(8) = 64; m² for m a power of two (L(16) = 256).
        long[] expected = {1, 4, 10, 16, 28, 40, 52, 64};
        for (int m = 1; m <= 8; m++) {
            StringBuilder sb = new StringBuilder("parity(");
            for (int i = 1; i <= m; i++) {
                sb.append(i > 1 ? ", " : "").append("x").append(i);
            }
            Built b = FormulaBuilder.build(sb.append(')').toString(), null, RULE);
            assertEquals(expected[m - 1], b.stats().get("leaves"), "parity of " + m);
            assertEquals(expected[m - 1], (long) b.scenario().edges().size());
            assertEquals(Boolean.TRUE, Analysis.run(b.scenario()).correct());
        }
        // the same through a chain of ^ (flattened, so the same balanced split)
        assertEquals(16L, FormulaBuilder.build("a ^ b ^ c ^ d", null, RULE).stats().get("leaves"));
        assertEquals(256L, FormulaBuilder.build(
                "parity(a,b,c,d,e,f,g,h,i,j,k,l,m,n,o,p)", null, RULE).stats().get("leaves"));
    }

    @Test
    void majorityOfThreeExpandsToTheFiveLeafFormula() {
        // From memory (the textbook formula): maj(a,b,c) = (a & b) | ((a | b) & c), 5 leaves,
        // which is what the balanced threshold split gives: j = 1: (a|b) & c, j = 2: a & b.
        Built b = FormulaBuilder.build("maj(a, b, c)", null, RULE);
        assertEquals(5L, b.stats().get("leaves"));
        assertEquals(false, b.stats().get("readOnce"));
        assertEquals(Boolean.TRUE, Analysis.run(b.scenario()).correct());
        // Derived: exactly(1, a, b) = (a|b) & (!a|!b): at least 1 of X and at least 1 of ¬X.
        assertEquals(4L, FormulaBuilder.build("exactly(1, a, b)", null, RULE).stats().get("leaves"));
    }

    @Test
    void literalsSeriesAndParallelGiveTheClassicGadgets() {
        // Derived (also the span-program facts of the core engine): a & b & c is a path of three
        // edges (3 edges, 4 vertices), a | b | c three parallel edges (2 vertices); with the rule
        // weights both have W₊ = W₋ = √3.
        Built and = FormulaBuilder.build("a & b & c", null, RULE);
        assertEquals(4, and.scenario().vertexCount());
        assertEquals(3, and.scenario().edges().size());
        Built or = FormulaBuilder.build("a | b | c", null, RULE);
        assertEquals(2, or.scenario().vertexCount());
        assertEquals(3, or.scenario().edges().size());
        for (Built b : List.of(and, or)) {
            AnalysisResult r = Analysis.run(b.scenario());
            assertEquals(Math.sqrt(3), r.maxResistance(), 1e-12);
            assertEquals(Math.sqrt(3), r.maxCapacitance(), 1e-12);
        }
        // Derived: unit weights on the path give W₊ = 3, W₋ = 1 (series of unit resistors;
        // one absent edge, the others shorted).
        AnalysisResult unit = Analysis.run(FormulaBuilder.build("a & b & c", null, FormulaBuilder.Weights.UNIT).scenario());
        assertEquals(3.0, unit.maxResistance(), 1e-12);
        assertEquals(1.0, unit.maxCapacitance(), 1e-12);
    }

    @Test
    void negationsArePushedToTheVariables() {
        // Derived by De Morgan: !(a & (b | !c)) = !a | (!b & c).
        Built b = FormulaBuilder.build("!(a & (b | !c))", null, RULE);
        StringBuilder labels = new StringBuilder();
        for (Edge e : b.scenario().edges()) {
            labels.append(e.when()).append(' ');
        }
        assertEquals("!a !b c ", labels.toString());
        assertEquals(Boolean.TRUE, Analysis.run(b.scenario()).correct());
    }

    @Test
    void constantsGiveAWireOrNothing() {
        // Derived: the constant 1 is one always-present edge (R = 1, no negative input);
        // 0 is no edge at all (C = 0, no positive input). Constants inside gates fold away.
        Scenario one = FormulaBuilder.build("a | 1", null, RULE).scenario();
        assertEquals(1, one.edges().size());
        assertTrue(one.edges().get(0).when().isAlways());
        AnalysisResult r1 = Analysis.run(one);
        assertEquals(Boolean.TRUE, r1.correct());
        assertEquals(0, r1.negativeCount());
        Scenario zero = FormulaBuilder.build("a & 0", null, RULE).scenario();
        assertEquals(0, zero.edges().size());
        AnalysisResult r0 = Analysis.run(zero);
        assertEquals(Boolean.TRUE, r0.correct());
        assertEquals(0.0, r0.maxCapacitance(), 0.0);
        RoundTrip.check(zero);
    }

    @Test
    void variablesComeInOrderOfFirstAppearanceOrAsGiven() {
        // Common practice, no source: the input order is the order a reader meets the names.
        assertEquals(List.of("b", "a", "c"), FormulaBuilder.build("b & (a | c) & !b", null, RULE).scenario().variables());
        assertEquals(List.of("c", "b", "a", "z"),
                FormulaBuilder.build("b & a", List.of("c", "b", "a", "z"), RULE).scenario().variables());
    }

    @Test
    void layoutRunsLeftToRight() {
        // Common practice, no source: series–parallel drawings put s left, t right.
        Scenario sc = FormulaBuilder.build("(a | b & c) & (d | e) & f", null, RULE).scenario();
        double xs = sc.vertices().get(sc.s()).x();
        double xt = sc.vertices().get(sc.t()).x();
        for (int v = 0; v < sc.vertexCount(); v++) {
            assertTrue(sc.vertices().get(v).hasPosition());
            assertTrue(sc.vertices().get(v).x() >= xs && sc.vertices().get(v).x() <= xt);
        }
        for (Edge e : sc.edges()) {
            assertTrue(sc.vertices().get(e.u()).x() < sc.vertices().get(e.v()).x(), "edges point right");
        }
    }

    @Test
    void badInputIsNamedNotThrownRaw() {
        // Common practice, no source: messages name the place and what was expected.
        ScenarioException op = assertThrows(ScenarioException.class, () -> FormulaBuilder.build("a $ b", null, RULE));
        assertEquals("expression", op.code());
        assertEquals("$.expression", op.path());
        assertTrue(op.getMessage().contains("column 3"), op.getMessage());

        ScenarioException fn = assertThrows(ScenarioException.class, () -> FormulaBuilder.build("nand(a, b)", null, RULE));
        assertTrue(fn.getMessage().contains("unknown function 'nand'"), fn.getMessage());

        ScenarioException word = assertThrows(ScenarioException.class, () -> FormulaBuilder.build("a & maj", null, RULE));
        assertTrue(word.getMessage().contains("function name"), word.getMessage());

        ScenarioException undeclared = assertThrows(ScenarioException.class,
                () -> FormulaBuilder.build("a & q", List.of("a"), RULE));
        assertTrue(undeclared.getMessage().contains("unknown variable 'q'"), undeclared.getMessage());

        ScenarioException dup = assertThrows(ScenarioException.class,
                () -> FormulaBuilder.build("a", List.of("a", "a"), RULE));
        assertEquals("$.variables[1]", dup.path());

        // too large to expand: three counting functions of 24 variables under parity
        StringBuilder xs = new StringBuilder();
        for (int i = 1; i <= 24; i++) {
            xs.append(", x").append(i);
        }
        String big = "exactly(12" + xs + ") ^ exactly(6" + xs + ") ^ thr(12" + xs + ")";
        ScenarioException large = assertThrows(ScenarioException.class, () -> FormulaBuilder.build(big, null, RULE));
        assertEquals("too-large", large.code());
        assertTrue(large.getMessage().contains("more than the limit of 20000"), large.getMessage());
        assertTrue(large.getMessage().matches(".*gives [0-9,]+ literal edges.*"), large.getMessage());

        ScenarioException many = assertThrows(ScenarioException.class,
                () -> FormulaBuilder.build("any(x25" + xs + ")", null, RULE));
        assertEquals("too-many-variables", many.code());
    }

    @Test
    void parsedFunctionIsTheUsersText() {
        // Contract: the scenario keeps the user's expression as its function.
        Scenario sc = FormulaBuilder.build("maj(a, b, c) -> d", null, RULE).scenario();
        assertEquals("maj(a, b, c) -> d", sc.functionText());
        assertEquals(ExprParser.parse("maj(a, b, c) -> d", sc.variables()).toString(), sc.function().toString());
    }
}
