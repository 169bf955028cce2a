package spanwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import spanwright.io.Json;
import spanwright.facade.JsonFacade;

/** The simulate command and JsonFacade.simulate: keys, exit codes, envelopes, agreement. */
class SimulateCommandTest {

    private static int run(ByteArrayOutputStream out, ByteArrayOutputStream err, String... args) {
        return Main.run(args, new PrintStream(out, true, StandardCharsets.UTF_8),
                new PrintStream(err, true, StandardCharsets.UTF_8));
    }

    private static String text(ByteArrayOutputStream b) {
        return b.toString(StandardCharsets.UTF_8);
    }

    @Test
    @SuppressWarnings("unchecked")
    void jsonHasTheIssueKeysAndAgreesWithTheFacade() throws Exception {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        assertEquals(0, run(out, err, "simulate", "--json", "--input", "001100", "--epsilon", "0.1"), text(err));
        Map<String, Object> m = (Map<String, Object>) Json.parse(text(out));
        // the keys the issue asks for, at least (issue "Run the algorithm", section "Where it lives")
        for (String k : List.of("alpha2", "epsilon", "bits", "queries", "qubits", "inputs", "caution", "assumptions")) {
            assertTrue(m.containsKey(k), "key " + k);
        }
        List<Object> inputs = (List<Object>) m.get("inputs");
        assertEquals(64, inputs.size());
        for (Object o : inputs) {
            Map<String, Object> row = (Map<String, Object>) o;
            for (String k : List.of("x", "positive", "phaseZeroWeight", "acceptance")) {
                assertTrue(row.containsKey(k), "row key " + k);
            }
        }
        Map<String, Object> focus = (Map<String, Object>) m.get("focus");
        assertEquals("001100", focus.get("x"));
        assertEquals(7, ((List<Object>) focus.get("spectrum")).size()); // |E| + 1 eigenvalues
        assertEquals(0.1, (Double) m.get("epsilon"), 0.0);
        // derived: the default scenario is two chains of two unit edges and a bypass of two edges of
        // weight 1/2, in parallel; the worst positive input is joined by one unit chain only,
        // R = 1 + 1 = 2 = W+, so alpha² = 2 by default
        assertEquals(2.0, (Double) m.get("alpha2"), 1e-12);

        // the page's entry gives the same result object for the same scenario and options
        String scenario = Main.readScenarioText(null);
        Map<String, Object> facade = (Map<String, Object>) Json.parse(
                JsonFacade.simulate(scenario, "{\"epsilon\": 0.1, \"input\": \"001100\"}"));
        assertEquals(Boolean.TRUE, facade.get("ok"));
        assertEquals(Json.write(m), Json.write(facade.get("result")));
    }

    @Test
    void humanSummaryStatesCostsAndCautions() {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        assertEquals(0, run(out, err, "simulate", "--input", "000011", "--inputs"), text(err));
        String s = text(out);
        for (String part : List.of("phase bits", "queries per run", "qubits", "textbook", "assumptions:",
                "caution:", "not run-time estimates", "eigenphases", "acceptance by phase bits", "000011  yes")) {
            assertTrue(s.contains(part), "summary mentions " + part + "\n" + s);
        }
    }

    @Test
    void badUsageAndBadScenariosExitWithTwoAndAMessage(@TempDir Path dir) throws Exception {
        String[][] bad = {
            {"simulate", "--input", "01"},
            {"simulate", "--epsilon", "2"},
            {"simulate", "--epsilon", "x"},
            {"simulate", "--alpha2", "-1"},
            {"simulate", "--frobnicate"},
            {"simulate", "a.json", "b.json"},
        };
        for (String[] args : bad) {
            ByteArrayOutputStream out = new ByteArrayOutputStream();
            ByteArrayOutputStream err = new ByteArrayOutputStream();
            assertEquals(2, run(out, err, args), String.join(" ", args));
            assertTrue(text(err).startsWith("spanwright: simulate"), text(err));
            assertFalse(text(err).contains("Exception"), text(err));
        }
        // too large: 17 variables without a promise is 131072 inputs
        StringBuilder vars = new StringBuilder();
        StringBuilder edges = new StringBuilder();
        for (int i = 1; i <= 17; i++) {
            vars.append(i > 1 ? "," : "").append("\"x").append(i).append('"');
            edges.append(i > 1 ? "," : "").append("{\"id\":\"e").append(i)
                    .append("\",\"u\":\"s\",\"v\":\"t\",\"when\":\"x").append(i).append("\"}");
        }
        Path f = dir.resolve("wide.json");
        Files.writeString(f, "{\"format\":\"spanwright-scenario\",\"version\":1,\"variables\":[" + vars
                + "],\"graph\":{\"s\":\"s\",\"t\":\"t\",\"vertices\":[{\"id\":\"s\"},{\"id\":\"t\"}],"
                + "\"edges\":[" + edges + "]}}");
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        assertEquals(2, run(out, err, "simulate", f.toString()));
        assertTrue(text(err).contains("$.variables") && text(err).contains("too-large-to-simulate"), text(err));
        assertFalse(text(err).contains("Exception"), text(err));
    }

    @Test
    @SuppressWarnings("unchecked")
    void facadeErrorEnvelopesNameThePath() {
        String scenario = Main.readScenarioText(null);
        String[][] cases = {
            {"{\"epsilon\": 1.5}", "option", "$options.epsilon"},
            {"{\"epsilon\": \"small\"}", "option", "$options.epsilon"},
            {"{\"alpha2\": 0}", "option", "$options.alpha2"},
            {"{\"input\": \"0102\"}", "input-string", "$options.input"},
            {"{\"colour\": 1}", "option", "$options.colour"},
            {"[1]", "type", "$options"},
        };
        for (String[] c : cases) {
            Map<String, Object> m = (Map<String, Object>) Json.parse(JsonFacade.simulate(scenario, c[0]));
            assertEquals(Boolean.FALSE, m.get("ok"), c[0]);
            Map<String, Object> e = (Map<String, Object>) m.get("error");
            assertEquals(c[1], e.get("code"), c[0]);
            assertEquals(c[2], e.get("path"), c[0]);
        }
        Map<String, Object> bad = (Map<String, Object>) Json.parse(JsonFacade.simulate("{", null));
        assertEquals(Boolean.FALSE, bad.get("ok"));
        Map<String, Object> ok = (Map<String, Object>) Json.parse(JsonFacade.simulate(scenario, null));
        assertEquals(Boolean.TRUE, ok.get("ok"));
        assertEquals(Json.NULL, ((Map<String, Object>) ok.get("result")).get("focus"));
    }

    @Test
    @SuppressWarnings("unchecked")
    void oneInputOfTwentyVariablesIsSimulated(@TempDir Path dir) throws Exception {
        // 20 variables (2^20 inputs, beyond the 65,536 of a whole-domain run): a chain of ten
        // two-edge parallel links, edge pair i switched by a_i and b_i (unit weights).
        StringBuilder vars = new StringBuilder();
        StringBuilder verts = new StringBuilder("{\"id\":\"s\"}");
        StringBuilder edges = new StringBuilder();
        for (int i = 0; i < 10; i++) {
            vars.append(i == 0 ? "" : ",").append("\"a").append(i).append("\",\"b").append(i).append('"');
            String u = i == 0 ? "s" : "m" + i;
            String v = i == 9 ? "t" : "m" + (i + 1);
            if (i < 9) {
                verts.append(",{\"id\":\"").append(v).append("\"}");
            }
            edges.append(i == 0 ? "" : ",").append("{\"id\":\"e").append(i).append("a\",\"u\":\"").append(u)
                    .append("\",\"v\":\"").append(v).append("\",\"when\":\"a").append(i).append("\"},")
                    .append("{\"id\":\"e").append(i).append("b\",\"u\":\"").append(u)
                    .append("\",\"v\":\"").append(v).append("\",\"when\":\"b").append(i).append("\"}");
        }
        verts.append(",{\"id\":\"t\"}");
        Path file = dir.resolve("chain20.json");
        Files.writeString(file, "{\"format\":\"spanwright-scenario\",\"version\":1,\"title\":\"chain of ten links\","
                + "\"variables\":[" + vars + "],\"graph\":{\"s\":\"s\",\"t\":\"t\",\"vertices\":[" + verts
                + "],\"edges\":[" + edges + "]}}", StandardCharsets.UTF_8);
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        String x = "11".repeat(10); // every link doubled: R = 10 × 1/2 = 5 (series of parallel pairs, derived)
        assertEquals(0, run(out, err, "simulate", file.toString(), "--input", x, "--json"), text(err));
        Map<String, Object> m = (Map<String, Object>) Json.parse(text(out));
        assertEquals("input", m.get("scope"));
        Map<String, Object> focus = (Map<String, Object>) m.get("focus");
        assertEquals(x, focus.get("x"));
        assertEquals(5.0, (Double) focus.get("witnessSize"), 1e-12);
        // W+ = 10 (one edge per link), α² = W+: weight α²/(α² + R) = 10/15 (derived, docs/simulation.md)
        assertEquals(10.0, (Double) m.get("alpha2"), 1e-9);
        assertEquals(10.0 / 15, (Double) focus.get("phaseZeroWeight"), 1e-9);
        assertEquals(Json.NULL, m.get("bits"));
        assertTrue(((List<Object>) m.get("inputs")).isEmpty());
        // the page's entry gives the same object
        Map<String, Object> page = (Map<String, Object>) Json.parse(JsonFacade.simulate(Files.readString(file),
                "{\"input\":\"" + x + "\"}"));
        assertEquals(focus.get("phaseZeroWeight"), ((Map<String, Object>) ((Map<String, Object>) page.get("result"))
                .get("focus")).get("phaseZeroWeight"));
        // text: says it is one input and why
        out.reset();
        assertEquals(0, run(out, err, "simulate", file.toString(), "--input", x));
        assertTrue(text(out).contains("the input " + x + " alone") && text(out).contains("at most 65536 inputs"),
                text(out));
    }
}
