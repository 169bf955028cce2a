package spanwright.structure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.math.BigInteger;
import java.nio.charset.StandardCharsets;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import spanwright.expr.ExprParser;
import spanwright.io.Json;
import spanwright.io.ScenarioReader;
import spanwright.model.Promise;
import spanwright.model.RandomScenarios;
import spanwright.model.Scenario;
import spanwright.model.ScenarioException;
import spanwright.sweep.FamilyTemplate;

class DiagramCheckTest {
    private static final long BUDGET = 1_000_000;

    /** The enumerator's answer: counterexamples in the domain, and the first ten in input order. */
    private record Expected(long domain, long count, List<boolean[]> first) {}

    /**
     * Independent computation: every mask in input order, the promise by {@code Promise.allows},
     * f by the expression evaluator, G(x) by union–find.
     */
    private static Expected bruteForce(Scenario sc) {
        int n = sc.variableCount();
        long domain = 0;
        long count = 0;
        List<boolean[]> first = new ArrayList<>();
        for (long mask = 0; mask < (1L << n); mask++) {
            if (!sc.promise().allows(mask)) {
                continue;
            }
            domain++;
            if (ConnectivityBruteForce.connected(sc, mask) != sc.function().eval(mask)) {
                count++;
                if (first.size() < DiagramCheck.LISTED) {
                    first.add(ConnectivityBruteForce.assignment(mask, n));
                }
            }
        }
        return new Expected(domain, count, first);
    }

    private static void assertAgrees(Scenario sc, String what) {
        Expected want = bruteForce(sc);
        DiagramCheck.Result r = DiagramCheck.check(sc, BUDGET);
        if (want.domain() == 0) {
            assertEquals(DiagramCheck.Status.EMPTY_DOMAIN, r.status(), what);
            return;
        }
        assertEquals(DiagramCheck.Status.CHECKED, r.status(), what + ": " + r.message());
        assertEquals(BigInteger.valueOf(want.domain()), r.domainSize(), what);
        assertEquals(BigInteger.valueOf(want.count()), r.counterexamples(), what);
        assertEquals(want.count() == 0, r.holds(), what);
        DecisionDiagramsTest.assertSameAssignments(want.first(), r.firstCounterexamples());
        assertTrue(r.graphNodes() >= 1 && r.functionNodes() >= 1, what);
        assertEquals(sc.promise().kind() == Promise.Kind.NONE, r.promiseNodes() == 0, what);
    }

    @Test
    void everyDemoScenarioAgreesWithEnumeration() throws IOException {
        int count = 0;
        try (DirectoryStream<Path> ds = Files.newDirectoryStream(Path.of("..", "scenarios"), "*.json")) {
            for (Path p : ds) {
                Scenario sc = ScenarioReader.read(Files.readString(p, StandardCharsets.UTF_8));
                assertAgrees(sc, p.getFileName().toString());
                // the demos are correct reductions (their files say so): the check holds
                assertTrue(DiagramCheck.check(sc, BUDGET).holds(), p.getFileName().toString());
                count++;
            }
        }
        assertTrue(count >= 5, "expected the demo scenarios in ../scenarios");
    }

    @Test
    void theLanternRelayFamilyAgreesWithEnumeration() throws IOException {
        // parity through negated and shared literals (four edges per variable)
        FamilyTemplate f = FamilyTemplate.read(Json.parse(Files.readString(
                Path.of("..", "scenarios", "families", "lantern-relay.json"), StandardCharsets.UTF_8)));
        for (int n = 1; n <= 8; n++) {
            assertAgrees(f.instance(n).scenario(), "lantern relay " + n);
        }
    }

    /** DNF text of the minterms where {@code table} is 1. */
    private static String minterms(boolean[] table, List<String> vars) {
        int n = vars.size();
        StringBuilder sb = new StringBuilder();
        for (int mask = 0; mask < table.length; mask++) {
            if (!table[mask]) {
                continue;
            }
            sb.append(sb.length() > 0 ? " | " : "").append('(');
            for (int i = 0; i < n; i++) {
                boolean bit = ((mask >>> (n - 1 - i)) & 1) != 0;
                sb.append(i > 0 ? " & " : "").append(bit ? "" : "!").append(vars.get(i));
            }
            sb.append(')');
        }
        return sb.length() == 0 ? "0" : sb.toString();
    }

    @Test
    void randomScenariosWithPromisesAndWrongFunctionsAgreeWithEnumeration() {
        Random rnd = new Random(31415L); // seeded
        int holding = 0;
        int failing = 0;
        for (int trial = 0; trial < 150; trial++) {
            int n = 1 + rnd.nextInt(8);
            int vertices = 2 + rnd.nextInt(7);
            Scenario g = RandomScenarios.generate(rnd, n, vertices, vertices - 1 + rnd.nextInt(9), 0.15, 0.35, 1, 1);
            List<String> vars = g.variables();
            boolean[] table = new boolean[1 << n];
            for (int mask = 0; mask < table.length; mask++) {
                table[mask] = ConnectivityBruteForce.connected(g, mask);
            }
            String function;
            switch (trial % 3) {
                case 0: // the right function
                    function = minterms(table, vars);
                    break;
                case 1: // the right function with a few inputs flipped
                    for (int k = 1 + rnd.nextInt(3); k > 0; k--) {
                        int at = rnd.nextInt(table.length);
                        table[at] = !table[at];
                    }
                    function = minterms(table, vars);
                    break;
                default:
                    function = DecisionDiagramsTest.randomExpr(rnd, vars, 3);
            }
            Promise promise;
            switch (rnd.nextInt(3)) {
                case 0:
                    promise = Promise.NONE;
                    break;
                case 1: {
                    String text = DecisionDiagramsTest.randomExpr(rnd, vars, 2);
                    promise = Promise.expression(text, ExprParser.parse(text, vars));
                    break;
                }
                default:
                    promise = Promise.weights(new int[] {rnd.nextInt(n + 1), rnd.nextInt(n + 1)});
            }
            Scenario sc = new Scenario("trial " + trial, "", vars, function, ExprParser.parse(function, vars), promise,
                    g.vertices(), g.s(), g.t(), g.edges(), null);
            assertAgrees(sc, "trial " + trial + ": " + function);
            DiagramCheck.Result r = DiagramCheck.check(sc, BUDGET);
            if (r.status() == DiagramCheck.Status.CHECKED) {
                if (r.holds()) {
                    holding++;
                } else {
                    failing++;
                }
            }
        }
        // the sample must exercise both outcomes, or the comparison above proves little
        assertTrue(holding > 20 && failing > 20, holding + " holding, " + failing + " failing");
    }

    @Test
    void gridAgainstItsConnectivityWrittenInReverse() {
        for (int k = 2; k <= 3; k++) {
            Scenario grid = DiagramBench.grid(k, false, -1);
            DiagramCheck.Result same = DiagramCheck.checkAgainstConnectivity(grid, DiagramBench.grid(k, true, -1), BUDGET);
            // derived: the reversed listing is the same graph, so G decides its own connectivity
            assertTrue(same.holds(), same.message());
            assertEquals(same.graphNodes(), same.functionNodes());
            Scenario negated = DiagramBench.grid(k, true, 1);
            DiagramCheck.Result wrong = DiagramCheck.checkAgainstConnectivity(grid, negated, BUDGET);
            // independent computation: union–find on both graphs over every input
            int n = grid.variableCount();
            long count = 0;
            List<boolean[]> first = new ArrayList<>();
            for (long mask = 0; mask < (1L << n); mask++) {
                if (ConnectivityBruteForce.connected(grid, mask) != ConnectivityBruteForce.connected(negated, mask)) {
                    count++;
                    if (first.size() < DiagramCheck.LISTED) {
                        first.add(ConnectivityBruteForce.assignment(mask, n));
                    }
                }
            }
            assertTrue(count > 0);
            assertEquals(BigInteger.valueOf(count), wrong.counterexamples());
            DecisionDiagramsTest.assertSameAssignments(first, wrong.firstCounterexamples());
        }
    }

    @Test
    void whatTheCheckCannotDoIsAStatusWithAReason() {
        Scenario g = DiagramBench.grid(3, false, -1);
        List<String> vars = g.variables();
        DiagramCheck.Result none = DiagramCheck.check(g, BUDGET);
        assertEquals(DiagramCheck.Status.NO_FUNCTION, none.status());
        assertFalse(none.holds());
        assertNull(none.counterexamples());

        String f = vars.get(0);
        Scenario listed = new Scenario("", "", vars, f, ExprParser.parse(f, vars), Promise.inputs(new long[] {0, 5}),
                g.vertices(), g.s(), g.t(), g.edges(), null);
        DiagramCheck.Result r = DiagramCheck.check(listed, BUDGET);
        assertEquals(DiagramCheck.Status.UNSUPPORTED_PROMISE, r.status());
        assertTrue(r.message().contains("enumeration"), r.message());

        String never = f + " & !" + f;
        Scenario empty = new Scenario("", "", vars, f, ExprParser.parse(f, vars),
                Promise.expression(never, ExprParser.parse(never, vars)), g.vertices(), g.s(), g.t(),
                g.edges(), null);
        assertEquals(DiagramCheck.Status.EMPTY_DOMAIN, DiagramCheck.check(empty, BUDGET).status());

        Scenario big = DiagramBench.grid(5, false, -1);
        DiagramCheck.Result tooLarge = DiagramCheck.checkAgainstConnectivity(big, DiagramBench.grid(5, true, -1), 100);
        assertEquals(DiagramCheck.Status.TOO_LARGE, tooLarge.status());
        assertTrue(tooLarge.message().contains("100"), tooLarge.message());

        ScenarioException e = assertThrows(ScenarioException.class,
                () -> DiagramCheck.checkAgainstConnectivity(g, DiagramBench.grid(2, false, -1), BUDGET));
        assertEquals("host-variables", e.code());
    }

    @Test
    void theResultCannotBeChangedThroughItsLists() {
        Scenario sc = DiagramBench.grid(2, false, -1);
        DiagramCheck.Result r = DiagramCheck.checkAgainstConnectivity(sc, DiagramBench.grid(2, true, 0), BUDGET);
        boolean[] x = r.firstCounterexamples().get(0);
        boolean before = x[0];
        x[0] = !before;
        assertEquals(before, r.firstCounterexamples().get(0)[0]);
    }
}
