package spanwright.facade;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import spanwright.domain.InputDomain;
import spanwright.io.Json;
import spanwright.io.ScenarioReader;
import spanwright.model.ScenarioException;

/**
 * The façade calls the page makes on instances beyond enumeration (one variable per host edge):
 * {@code validate} and {@code startAnalysis} never list the domain when {@code analyze} would use
 * the structural engine, {@code detail} and {@code tikz} work for any number of variables. Values
 * are derived by hand beside each check.
 */
class BeyondEnumerationFacadeTest {

    private static String host(String family, int... size) {
        StringBuilder s = new StringBuilder();
        for (int i = 0; i < size.length; i++) {
            s.append(i > 0 ? "," : "").append(size[i]);
        }
        Map<String, Object> built = JsonFacadeTest.ok(JsonFacade.build("{\"kind\":\"host\",\"family\":\"" + family
                + "\",\"size\":[" + s + "]}"));
        return Json.write(built.get("scenario"));
    }

    @Test
    void validateOfA60EdgeHostGraphDoesNotListTheCube() {
        String grid = host("grid", 6, 6);
        // derived: a 6×6 grid has 6·5 + 6·5 = 60 edges, one variable each
        assertEquals(60, ScenarioReader.read(grid).variableCount());
        // the domain cannot be listed (more than InputDomain's 30 variables) ...
        ScenarioException e = assertThrows(ScenarioException.class, () -> InputDomain.of(ScenarioReader.read(grid)));
        assertEquals("too-many-variables", e.code());
        // ... and validate does not try to: analyze would use the structural engine
        Map<String, Object> m = JsonFacadeTest.ok(JsonFacade.validate(grid));
        assertEquals(List.of("ok", "warnings", "variables", "domainSize", "method", "methodReason"),
                List.copyOf(m.keySet()));
        assertEquals("structure", m.get("method"));
        assertEquals(Math.pow(2, 60), (Double) m.get("domainSize"), 0.0); // derived: 2^60 inputs, exact in a double
        assertEquals(60, ((List<?>) m.get("variables")).size());
        Map<String, Object> analysis = JsonFacadeTest.obj(JsonFacadeTest.ok(JsonFacade.analyze(grid, false)), "result");
        assertEquals(analysis.get("methodReason"), m.get("methodReason"), "validate names the method analyze uses");

        // a small scenario still has its domain built (an empty promise is still refused)
        assertEquals("enumerate", JsonFacadeTest.ok(JsonFacade.validate(JsonFacadeTest.PARALLEL)).get("method"));
    }

    @Test
    void startAnalysisHandsStructureToAnalyze() {
        String k12 = host("complete", 12);
        Map<String, Object> m = JsonFacadeTest.ok(JsonFacade.startAnalysis(k12));
        assertSame(Json.NULL, m.get("job"), "nothing to step through");
        assertEquals("structure", m.get("method"));
        Map<String, Object> analysis = JsonFacadeTest.obj(JsonFacadeTest.ok(JsonFacade.analyze(k12, false)), "result");
        assertEquals(analysis.get("methodReason"), m.get("methodReason"));
        // derived: K12 has 12·11/2 = 66 edges, 2^66 inputs
        assertEquals(Math.pow(2, 66), (Double) m.get("domainSize"), 0.0);
        // an enumerated scenario still gets a job, and says why it is enumerated
        Map<String, Object> small = JsonFacadeTest.ok(JsonFacade.startAnalysis(JsonFacadeTest.PARALLEL));
        assertEquals("enumerate", small.get("method"));
        assertTrue(((String) small.get("methodReason")).startsWith("enumeration"), small.toString());
        JsonFacade.cancelAnalysis(((Number) small.get("job")).intValue());
    }

    /** The input of K12 (edges in the builder's order: pairs (i, j), i &lt; j, lexicographic) with the given edges present. */
    private static String k12Input(int[][] present) {
        char[] x = new char[66];
        java.util.Arrays.fill(x, '0');
        for (int[] p : present) {
            int i = p[0];
            int j = p[1];
            // index of pair (i, j) among 0 ≤ i < j < 12 in lexicographic order
            int k = i * 12 - i * (i + 1) / 2 + (j - i - 1);
            x[k] = '1';
        }
        return new String(x);
    }

    @Test
    void detailWorksForAnyNumberOfVariables() {
        String k12 = host("complete", 12);
        // one s–t path v1 – v2 – v3 – v12 (vertices 0, 1, 2, 11): series law, R = 1 + 1 + 1 = 3 (derived)
        Map<String, Object> path = JsonFacadeTest.ok(JsonFacade.detail(k12, k12Input(new int[][] {{0, 1}, {1, 2}, {2, 11}})));
        assertEquals(true, path.get("connected"));
        assertEquals(3.0, (Double) path.get("value"), 1e-12);
        assertEquals(1.0, path.get("f"), "s-t connectivity of the graph itself");
        assertEquals(true, path.get("inDomain"));
        assertEquals(66, ((List<?>) path.get("edges")).size());
        // every edge absent: C is the effective conductance of K12 with unit conductances between
        // two vertices, n/2 = 6 (derived: by symmetry R_eff(K_n) = 2/n)
        Map<String, Object> none = JsonFacadeTest.ok(JsonFacade.detail(k12, "0".repeat(66)));
        assertEquals(false, none.get("connected"));
        assertEquals(6.0, (Double) none.get("value"), 1e-9);
        // the worst inputs analyze reports are inspected with the same numbers
        Map<String, Object> result = JsonFacadeTest.obj(JsonFacadeTest.ok(JsonFacade.analyze(k12, false)), "result");
        for (String side : new String[] {"maxResistance", "maxCapacitance"}) {
            Map<String, Object> s = JsonFacadeTest.obj(result, side);
            Map<String, Object> worst = JsonFacadeTest.obj(s, "worst");
            Map<String, Object> d = JsonFacadeTest.ok(JsonFacade.detail(k12, (String) worst.get("x")));
            assertEquals((Double) s.get("value"), (Double) d.get("value"), 1e-12, side);
        }
        // derived: W+ = 11 (a Hamiltonian path of unit edges), W- = ⌊12²/4⌋ = 36 (a balanced cut)
        assertEquals(11.0, (Double) JsonFacadeTest.obj(result, "maxResistance").get("value"), 1e-9);
        assertEquals(36.0, (Double) JsonFacadeTest.obj(result, "maxCapacitance").get("value"), 1e-9);

        Map<String, Object> e = JsonFacadeTest.error(JsonFacade.detail(k12, "0".repeat(65)), "input-string", "$.input");
        assertTrue(((String) e.get("message")).contains("66 characters 0 or 1"), e.toString());
        assertTrue(((String) e.get("message")).length() < 300, "a long variable list is shortened: " + e);
    }

    @Test
    void tikzOfALargeInstanceWithAndWithoutTheBound() {
        String k12 = host("complete", 12);
        Map<String, Object> result = JsonFacadeTest.obj(JsonFacadeTest.ok(JsonFacade.analyze(k12, false)), "result");
        String bond = (String) JsonFacadeTest.obj(JsonFacadeTest.obj(result, "maxCapacitance"), "worst").get("x");
        // W+ and W- not given: the figure's caption computes them by the structural engine
        Map<String, Object> t = JsonFacadeTest.ok(JsonFacade.tikz(k12, "{\"input\":\"" + bond + "\"}"));
        String doc = (String) t.get("standalone");
        assertTrue(doc.startsWith("\\documentclass"), doc.substring(0, 40));
        assertTrue(doc.contains("C = 36"), "the worst bond's capacitance, 36 (derived above)");
        assertTrue(doc.contains("W+ = 11, W- = 36"), "caption bound by structure");
        // given by the caller (as the page does): used as they are
        Map<String, Object> given = JsonFacadeTest.ok(JsonFacade.tikz(k12, "{\"input\":\"" + bond
                + "\",\"positive\":11,\"negative\":36}"));
        assertEquals(doc, given.get("standalone"));
        JsonFacadeTest.error(JsonFacade.tikz(k12, "{\"input\":\"01\"}"), "input-string", "$.input");
    }
}
