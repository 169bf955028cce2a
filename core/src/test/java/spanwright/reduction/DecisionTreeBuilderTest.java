package spanwright.reduction;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.io.RoundTrip;
import spanwright.model.ScenarioException;
import spanwright.model.Edge;
import spanwright.model.Scenario;

class DecisionTreeBuilderTest {
    private static final DecisionTreeBuilder.Weights GUESS = DecisionTreeBuilder.Weights.GUESS;
    private static final DecisionTreeBuilder.Weights UNIT = DecisionTreeBuilder.Weights.UNIT;

    private static String fold(String fn, int n) {
        StringBuilder sb = new StringBuilder(fn).append('(');
        for (int i = 1; i <= n; i++) {
            sb.append(i > 1 ? ", " : "").append('x').append(i);
        }
        return sb.append(')').toString();
    }

    private static String randomTable(Random rnd, int n) {
        StringBuilder sb = new StringBuilder();
        double bias = 0.15 + 0.7 * rnd.nextDouble();
        for (int i = 0; i < (1 << n); i++) {
            sb.append(rnd.nextDouble() < bias ? '1' : '0');
        }
        return sb.toString();
    }

    @Test
    void everyStrategyDecidesRandomFunctions() {
        // Source: independent computation — the analysis enumerates every input and compares s–t
        // connectivity with the function. Seeded random truth tables (n = 1..10) and random
        // formulas (n = 1..10); minimum-depth and ordered (random order), tree and diagram, both
        // weightings.
        Random rnd = new Random(99L);
        for (int trial = 0; trial < 40; trial++) {
            int n = 1 + trial % 10;
            String f = trial % 2 == 0 ? randomTable(rnd, n) : Formulas.random(rnd, n, 3);
            List<String> vars = trial % 2 == 0 ? null : Formulas.vars(n);
            List<String> order = new ArrayList<>(Formulas.vars(n));
            Collections.shuffle(order, rnd);
            for (List<String> o : new List[] {null, order}) {
                for (boolean diagram : new boolean[] {false, true}) {
                    DecisionTreeBuilder.Weights w = rnd.nextBoolean() ? GUESS : UNIT;
                    Built b = DecisionTreeBuilder.build(f, vars, diagram, o, w);
                    AnalysisResult r = Analysis.run(b.scenario());
                    assertEquals(Boolean.TRUE, r.correct(), f + " " + o + " diagram=" + diagram);
                    RoundTrip.check(b.scenario());
                }
            }
        }
    }

    @Test
    void depthEqualsDecisionTreeComplexityOfClassicFunctions() {
        // Common practice, no source: D(OR_n) = n, D(PARITY_n) = n, D(MAJ_3) = 3, D(AND_n) = n.
        for (int n = 1; n <= 8; n++) {
            assertEquals(n, DecisionTreeBuilder.build(fold("any", n), null, false, null, GUESS).stats().get("depth"));
            assertEquals(n, DecisionTreeBuilder.build(fold("all", n), null, false, null, GUESS).stats().get("depth"));
            assertEquals(n, DecisionTreeBuilder.build(fold("parity", n), null, false, null, GUESS).stats().get("depth"));
        }
        assertEquals(3, DecisionTreeBuilder.build("maj(a, b, c)", null, false, null, GUESS).stats().get("depth"));
        // Derived: x1 | (x2 & x3) — query x1, then x2, then x3: depth 3; x1 alone: depth 1.
        assertEquals(3, DecisionTreeBuilder.build("x1 | x2 & x3", null, false, null, GUESS).stats().get("depth"));
        assertEquals(1, DecisionTreeBuilder.build("x1 | x1 & x3", null, false, null, GUESS).stats().get("depth"));
    }

    @Test
    void minimumDepthMatchesBruteForce() {
        // Source: independent computation — a plain recursion over subfunctions (no subcube table):
        // D(f) = 0 if f is constant, else min over variables i of 1 + max(D(f|xi=0), D(f|xi=1)).
        Random rnd = new Random(5L);
        for (int trial = 0; trial < 60; trial++) {
            int n = 1 + trial % 5;
            String table = randomTable(rnd, n);
            int expected = bruteDepth(table, n, new HashMap<>());
            assertEquals(expected, DecisionTreeBuilder.build(table, null, false, null, GUESS).stats().get("depth"), table);
        }
    }

    /** Brute-force D(f) of a truth table (first variable = most significant bit of the index). */
    private static int bruteDepth(String table, int n, Map<String, Integer> memo) {
        if (table.indexOf('0') < 0 || table.indexOf('1') < 0) {
            return 0;
        }
        Integer done = memo.get(table);
        if (done != null) {
            return done;
        }
        int best = Integer.MAX_VALUE;
        for (int i = 0; i < n; i++) {
            // the two restrictions of variable i, each a table over the other n−1 variables
            StringBuilder lo = new StringBuilder();
            StringBuilder hi = new StringBuilder();
            for (int m = 0; m < table.length(); m++) {
                boolean bit = ((m >>> (n - 1 - i)) & 1) != 0;
                (bit ? hi : lo).append(table.charAt(m));
            }
            int d = 1 + Math.max(bruteDepth(lo.toString(), n - 1, memo), bruteDepth(hi.toString(), n - 1, memo));
            best = Math.min(best, d);
        }
        memo.put(table, best);
        return best;
    }

    @Test
    void parityDiagramHasTwoNMinusOneDecisionVertices() {
        // Derived: the subfunctions of PARITY_n after fixing the first k variables are parity and
        // its negation of the remaining n−k (two per level for k ≥ 1, one at the root), so the
        // reduced diagram has 1 + 2(n−1) = 2n−1 decision nodes; the tree has 2^n − 1.
        for (int n = 1; n <= 10; n++) {
            for (List<String> order : java.util.Arrays.asList(null, Formulas.vars(n))) {
                Built b = DecisionTreeBuilder.build(fold("parity", n), null, true, order, GUESS);
                assertEquals(2 * n - 1, b.stats().get("diagramDecisionVertices"), "n = " + n);
                assertEquals(2 * n - 1 + 1, b.scenario().vertexCount(), "plus t");
                assertEquals((1L << n) - 1, b.stats().get("treeDecisionVertices"), "n = " + n);
                // Derived: the 2n−3 nodes above the last level keep both out-edges, the last
                // level's nodes (x or !x) only their edge to t: 2(2n−3) + 2 = 4n − 4 (n ≥ 2), 1 for n = 1.
                assertEquals(n == 1 ? 1 : 4 * n - 4, b.scenario().edges().size());
                assertEquals(n, b.stats().get("wrongGuesses"), "rank of the complete tree of depth n");
            }
        }
    }

    @Test
    void orTreeIsAPathOfRankOne() {
        // Derived: the OR_n tree queries x1..xn in turn; each node's 1-child is a leaf (rank 0) and
        // its 0-child a subtree of rank 1 (OR_1 has two leaf children: rank 1), so rank = 1 and
        // the tree has n decision nodes and n edges to t plus n−1 internal edges.
        for (int n = 1; n <= 8; n++) {
            Built b = DecisionTreeBuilder.build(fold("any", n), null, false, null, GUESS);
            assertEquals(1, b.stats().get("wrongGuesses"));
            assertEquals((long) n, b.stats().get("treeDecisionVertices"));
            assertEquals(2 * n - 1, b.scenario().edges().size());
        }
    }

    @Test
    void guessWeightsMeetTheirBoundOnTrees() {
        // Derived (DecisionTreeBuilder javadoc, after Beigi & Taghavi, arXiv:1905.13095): on the tree
        // with guessed edges 1 and the others T/G, W₊ ≤ 2T and W₋ ≤ 2G; with unit weights
        // W₊ ≤ T and W₋ ≤ T.
        Random rnd = new Random(31L);
        for (int trial = 0; trial < 40; trial++) {
            int n = 2 + trial % 7;
            String table = randomTable(rnd, n);
            for (DecisionTreeBuilder.Weights w : DecisionTreeBuilder.Weights.values()) {
                Built b = DecisionTreeBuilder.build(table, null, false, null, w);
                AnalysisResult r = Analysis.run(b.scenario());
                if (r.positiveCount() == 0 || r.negativeCount() == 0) {
                    continue;
                }
                double bp = (Double) b.stats().get("boundPositive");
                double bn = (Double) b.stats().get("boundNegative");
                assertTrue(r.maxResistance() <= bp * (1 + 1e-12), table + " " + w + ": W+ " + r.maxResistance() + " > " + bp);
                assertTrue(r.maxCapacitance() <= bn * (1 + 1e-12), table + " " + w + ": W- " + r.maxCapacitance() + " > " + bn);
            }
        }
    }

    @Test
    void truthTableInputGetsVariablesAndAFunction() {
        // Derived: "0110" lists f(00), f(01), f(10), f(11): the exclusive or of x1 and x2.
        Built b = DecisionTreeBuilder.build("0110", null, false, null, GUESS);
        Scenario sc = b.scenario();
        assertEquals(List.of("x1", "x2"), sc.variables());
        for (long m = 0; m < 4; m++) {
            assertEquals(m == 1 || m == 2, sc.function().eval(m));
        }
        assertEquals(Boolean.TRUE, Analysis.run(sc).correct());
        assertEquals(List.of("p", "q"), DecisionTreeBuilder.build("0001", List.of("p", "q"), false, null, GUESS)
                .scenario().variables());
        // a table written in groups ("0110 1001", "0110_1001") is the same table: parity of three
        // variables, f(x) = x1 xor x2 xor x3 (derived)
        for (String grouped : List.of("0110 1001", " 0110_1001 ", "01 10 10 01")) {
            Scenario p = DecisionTreeBuilder.build(grouped, null, false, null, GUESS).scenario();
            assertEquals(List.of("x1", "x2", "x3"), p.variables(), grouped);
            for (long m = 0; m < 8; m++) {
                assertEquals(Long.bitCount(m) % 2 == 1, p.function().eval(m), grouped + " at " + m);
            }
        }
        ScenarioException short7 = assertThrows(ScenarioException.class,
                () -> DecisionTreeBuilder.build("0110 100", null, false, null, GUESS));
        assertTrue(short7.getMessage().contains("got 7"), short7.getMessage());
    }

    @Test
    void constantFunctionsGiveAWireOrNothing() {
        // Derived: a constant needs no query (depth 0); 1 is an always edge, 0 no edge.
        Built one = DecisionTreeBuilder.build("a | !a", null, false, null, GUESS);
        assertEquals(0, one.stats().get("depth"));
        assertEquals(1, one.scenario().edges().size());
        Built zero = DecisionTreeBuilder.build("0000", null, true, null, GUESS);
        assertEquals(0, zero.scenario().edges().size());
        assertEquals(Boolean.TRUE, Analysis.run(zero.scenario()).correct());
    }

    @Test
    void orderedTreeFollowsTheOrder() {
        // Derived: with order (c, b, a) the root of a & b & c queries c; a partial order
        // (c) is completed in declaration order (a, b).
        Built b = DecisionTreeBuilder.build("a & b & c", null, false, List.of("c", "b", "a"), GUESS);
        assertEquals(List.of("c", "b", "a"), b.stats().get("order"));
        assertEquals("c", b.scenario().edges().get(0).when().variableName());
        Built p = DecisionTreeBuilder.build("a & b & c", null, false, List.of("c"), GUESS);
        assertEquals(List.of("c", "a", "b"), p.stats().get("order"));
    }

    @Test
    void layoutIsLayeredDownwards() {
        // Common practice, no source: a layered drawing has every edge going down a layer or more.
        for (boolean diagram : new boolean[] {false, true}) {
            for (List<String> order : java.util.Arrays.asList(null, List.of("x3", "x1"))) {
                Scenario sc = DecisionTreeBuilder.build("maj(x1, x2, x3) ^ x4", null, diagram, order, GUESS).scenario();
                for (Edge e : sc.edges()) {
                    assertTrue(sc.vertices().get(e.u()).y() < sc.vertices().get(e.v()).y(), "edge " + e.id());
                }
            }
        }
    }

    @Test
    void diagramIsMuchSmallerThanTheTree() {
        // Derived: for x1 ^ … ^ x10 the tree has 2^10 − 1 = 1023 decision nodes, the diagram 19.
        Built b = DecisionTreeBuilder.build(fold("parity", 10), null, true, null, GUESS);
        assertEquals(1023L, b.stats().get("treeDecisionVertices"));
        assertEquals(19, b.stats().get("diagramDecisionVertices"));
    }

    @Test
    void badInputIsNamed() {
        // Common practice, no source: messages name the argument and the limit.
        ScenarioException order = assertThrows(ScenarioException.class,
                () -> DecisionTreeBuilder.build("a & b", null, false, List.of("q"), GUESS));
        assertEquals("$.order[0]", order.path());
        ScenarioException dup = assertThrows(ScenarioException.class,
                () -> DecisionTreeBuilder.build("a & b", null, false, List.of("a", "a"), GUESS));
        assertEquals("$.order[1]", dup.path());
        ScenarioException count = assertThrows(ScenarioException.class,
                () -> DecisionTreeBuilder.build("0110", List.of("a"), false, null, GUESS));
        assertEquals("$.variables", count.path());
        ScenarioException table = assertThrows(ScenarioException.class,
                () -> DecisionTreeBuilder.build("011", null, false, null, GUESS));
        // not 2^n values: the message says what a truth table needs (common practice, no source)
        assertEquals("truth-table", table.code());
        assertEquals("$.function", table.path());
        assertTrue(table.getMessage().contains("2^n characters") && table.getMessage().contains("got 3")
                && table.getMessage().contains("4 would make 2"), table.getMessage());
        ScenarioException seven = assertThrows(ScenarioException.class,
                () -> DecisionTreeBuilder.build("0111011", null, false, null, GUESS));
        assertTrue(seven.getMessage().contains("got 7; 4 would make 2 variables, 8 would make 3"), seven.getMessage());
        ScenarioException big = assertThrows(ScenarioException.class,
                () -> DecisionTreeBuilder.build(fold("any", 15), null, false, null, GUESS));
        assertEquals("too-many-variables", big.code());
        assertTrue(big.getMessage().contains("at most 14"), big.getMessage());
        // with an order, 15 variables are fine (ordered construction, O(2^n))
        assertEquals(15, DecisionTreeBuilder.build(fold("any", 15), null, true, List.of("x1"), GUESS).stats().get("depth"));
        ScenarioException tree = assertThrows(ScenarioException.class,
                () -> DecisionTreeBuilder.build(fold("parity", 16), null, false, List.of("x1"), GUESS));
        assertEquals("too-large", tree.code());
        assertTrue(tree.getMessage().contains("ask for the diagram"), tree.getMessage());
    }
}
