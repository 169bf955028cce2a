package spanwright.facade;

import spanwright.io.Json;
import spanwright.io.ShareCodec;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import spanwright.cli.Main;

/**
 * Every method of {@link JsonFacade}, against the contract in its javadoc: the ok envelope, the
 * error envelope {@code {"ok":false,"error":{"code","message","path"}}} for bad input (never an
 * exception), the step API agreeing with {@code analyze}, one input's detail, and share links.
 * Values of the small scenario are derived by hand beside each check.
 */
class JsonFacadeTest {

    /** Two variables, parallel s–t edges of resistance 1 (a) and 2 (b); decides a | b. */
    static final String PARALLEL = "{\"format\": \"spanwright-scenario\", \"version\": 1, \"title\": \"Two parallel edges\","
        + " \"variables\": [\"a\", \"b\"], \"function\": \"a | b\","
        + " \"graph\": {\"s\": \"s\", \"t\": \"t\", \"vertices\": [{\"id\": \"s\"}, {\"id\": \"t\"}],"
        + " \"edges\": [{\"id\": \"ea\", \"u\": \"s\", \"v\": \"t\", \"when\": \"a\"},"
        + " {\"id\": \"eb\", \"u\": \"s\", \"v\": \"t\", \"when\": \"b\", \"weight\": 2}]}}";

    static final String BAD_WEIGHT = PARALLEL.replace("\"weight\": 2", "\"weight\": 0");

    static String defaultScenario() throws IOException {
        return Files.readString(Path.of("..", "scenarios", "default.json"), StandardCharsets.UTF_8);
    }

    @SuppressWarnings("unchecked")
    static Map<String, Object> parse(String json) {
        return (Map<String, Object>) Json.parse(json);
    }

    @SuppressWarnings("unchecked")
    static Map<String, Object> obj(Map<String, Object> m, String key) {
        assertTrue(m.get(key) instanceof Map, key + " is an object in " + m);
        return (Map<String, Object>) m.get(key);
    }

    static Map<String, Object> ok(String reply) {
        Map<String, Object> m = parse(reply);
        assertEquals(Boolean.TRUE, m.get("ok"), reply);
        return m;
    }

    /** Asserts the error envelope: exactly ok and error, error exactly code, message and path. */
    static Map<String, Object> error(String reply, String code, String path) {
        Map<String, Object> m = parse(reply);
        assertEquals(List.of("ok", "error"), List.copyOf(m.keySet()), reply);
        assertEquals(Boolean.FALSE, m.get("ok"));
        Map<String, Object> e = obj(m, "error");
        assertEquals(List.of("code", "message", "path"), List.copyOf(e.keySet()), reply);
        assertEquals(code, e.get("code"), reply);
        assertEquals(path, e.get("path"), reply);
        String message = (String) e.get("message");
        assertFalse(message.isBlank());
        assertFalse(message.contains("Exception"), "plain message: " + message);
        return e;
    }

    // ------------------------------------------------------------------ error envelope

    @Test
    void errorEnvelopeShape() {
        assertEquals("{\"ok\":false,\"error\":{\"code\":\"weight\",\"message\":\"too \\\"heavy\\\"\","
            + "\"path\":\"$.graph.edges[0].weight\"}}", JsonFacade.error("weight", "$.graph.edges[0].weight", "too \"heavy\""));
    }

    @Test
    void noMethodThrowsForBadInput() {
        // Source: the contract — "it never throws for bad input".
        error(JsonFacade.validate(null), "json-syntax", "$");
        error(JsonFacade.analyze(null, true), "json-syntax", "$");
        error(JsonFacade.startAnalysis(null), "json-syntax", "$");
        error(JsonFacade.detail(null, "01"), "json-syntax", "$");
        error(JsonFacade.detail(PARALLEL, null), "input-string", "$.input");
        error(JsonFacade.encodeShare(null), "json-syntax", "$");
        error(JsonFacade.decodeShare(null), "share-link", "$");
        error(JsonFacade.stepAnalysis(-5, 10), "no-job", "$");
        error(JsonFacade.finishAnalysis(987_654, false), "no-job", "$");
        ok(JsonFacade.cancelAnalysis(987_654)); // cancelling an unknown job is harmless
    }

    // ------------------------------------------------------------------ validate

    @Test
    void validateOk() {
        Map<String, Object> m = ok(JsonFacade.validate(PARALLEL));
        assertEquals(List.of("ok", "warnings", "variables", "domainSize", "method", "methodReason"), List.copyOf(m.keySet()));
        assertEquals("enumerate", m.get("method"));
        assertEquals(List.of(), m.get("warnings"));
        assertEquals(List.of("a", "b"), m.get("variables"));
        assertEquals(4.0, m.get("domainSize"));
        // derived: Hamming weight 1 of 2 variables allows 01 and 10
        assertEquals(2.0, ok(JsonFacade.validate(PARALLEL.replace("\"function\"", "\"promise\": {\"weights\": [1]},"
            + " \"function\""))).get("domainSize"));
        String loop = PARALLEL.replace("]}}", ", {\"id\": \"spin\", \"u\": \"s\", \"v\": \"s\", \"when\": \"1\"}]}}");
        List<?> warnings = (List<?>) ok(JsonFacade.validate(loop)).get("warnings");
        assertEquals(1, warnings.size());
        assertTrue(((String) warnings.get(0)).contains("\"spin\""), warnings.toString());
    }

    @Test
    void validateErrors() {
        Map<String, Object> e = error(JsonFacade.validate("{\"format\": "), "json-syntax", "$");
        assertTrue(((String) e.get("message")).contains("line 1, column 12"), e.toString());
        error(JsonFacade.validate(BAD_WEIGHT), "weight", "$.graph.edges[1].weight");
        error(JsonFacade.validate(PARALLEL.replace("\"u\": \"s\"", "\"u\": \"x\"")), "unknown-vertex", "$.graph.edges[0].u");
        // an expression promise that is never true is found when the domain is built (derived: a & !a ≡ 0)
        error(JsonFacade.validate(PARALLEL.replace("\"function\"", "\"promise\": \"a & !a\", \"function\"")),
            "empty-domain", "$.promise");
    }

    // ------------------------------------------------------------------ analyze

    @Test
    void analyzeOkHasTheCommandLineKeys() {
        Map<String, Object> result = obj(ok(JsonFacade.analyze(PARALLEL, false)), "result");
        for (String k : new String[] {"title", "variables", "vertices", "edges", "domainSize", "reduction", "positive",
            "negative", "complexity", "histogram"}) {
            assertTrue(result.containsKey(k), k + " in " + result.keySet());
        }
        assertFalse(result.containsKey("inputs"));
        // Derived: R(01) = 2, R(10) = 1, R(11) = 2/3, C(00) = 1 + 1/2; bound sqrt(2 · 1.5).
        assertEquals(true, obj(result, "reduction").get("correct"));
        assertEquals(2.0, (Double) obj(result, "positive").get("maxResistance"), 1e-12);
        assertEquals(1.5, (Double) obj(result, "negative").get("maxCapacitance"), 1e-12);
        assertEquals(Math.sqrt(3), (Double) result.get("complexity"), 1e-12);
        Map<String, Object> hist = obj(result, "histogram");
        assertTrue(hist.containsKey("positive") && hist.containsKey("negative"), hist.toString());

        Map<String, Object> withInputs = obj(ok(JsonFacade.analyze(PARALLEL, true)), "result");
        assertEquals(4, ((List<?>) withInputs.get("inputs")).size());
    }

    @Test
    void analyzeAgreesWithTheCommandLine() throws IOException {
        // Source: the one-façade rule — the page (through JsonFacade) and the CLI give the same JSON.
        String text = defaultScenario();
        Map<String, Object> result = obj(ok(JsonFacade.analyze(text, true)), "result");
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int status = Main.run(new String[] {"analyze", Path.of("..", "scenarios", "default.json").toString(), "--json",
            "--inputs"}, new PrintStream(out, true, StandardCharsets.UTF_8), new PrintStream(err, true, StandardCharsets.UTF_8));
        assertEquals(0, status, err.toString(StandardCharsets.UTF_8));
        assertEquals(result, Json.parse(out.toString(StandardCharsets.UTF_8)));
    }

    @Test
    void analyzeErrors() {
        error(JsonFacade.analyze("not json", false), "json-syntax", "$");
        error(JsonFacade.analyze(BAD_WEIGHT, false), "weight", "$.graph.edges[1].weight");
        error(JsonFacade.analyze(PARALLEL.replace("\"function\"", "\"promise\": \"a & !a\", \"function\""), false),
            "empty-domain", "$.promise");
        error(JsonFacade.analyze(PARALLEL.replace("\"version\": 1", "\"version\": 7"), true), "version", "$.version");
    }

    // ------------------------------------------------------------------ step API

    @Test
    void stepwiseAnalysisGivesTheSameResultAsAnalyze() throws IOException {
        String text = defaultScenario();
        Map<String, Object> start = ok(JsonFacade.startAnalysis(text));
        assertEquals(List.of("ok", "job", "domainSize", "maxListedInputs", "method", "methodReason"), List.copyOf(start.keySet()));
        int job = ((Double) start.get("job")).intValue();
        int total = ((Double) start.get("domainSize")).intValue();
        assertEquals(64, total); // derived: 6 variables, no promise, 2^6 inputs

        Map<String, Object> none = ok(JsonFacade.stepAnalysis(job, 0));
        assertEquals(0.0, none.get("processed"));
        assertEquals(false, none.get("done"));

        int processed = 0;
        boolean done = false;
        int steps = 0;
        while (!done) {
            Map<String, Object> s = ok(JsonFacade.stepAnalysis(job, 7));
            assertEquals(List.of("ok", "done", "processed", "total"), List.copyOf(s.keySet()));
            processed = Math.min(total, processed + 7);
            assertEquals((double) processed, s.get("processed"));
            assertEquals((double) total, s.get("total"));
            done = (Boolean) s.get("done");
            assertEquals(processed == total, done);
            steps++;
        }
        assertEquals(10, steps); // derived: ceil(64 / 7) = 10
        String finished = JsonFacade.finishAnalysis(job, true);
        assertEquals(JsonFacade.analyze(text, true), finished);
        error(JsonFacade.stepAnalysis(job, 1), "no-job", "$"); // a finished job is gone
        error(JsonFacade.finishAnalysis(job, true), "no-job", "$");
    }

    @Test
    void finishAfterSomeStepsCompletesTheRest() throws IOException {
        // finish must process whatever the steps left, not only work from a fresh start
        String text = defaultScenario();
        int job = ((Double) ok(JsonFacade.startAnalysis(text)).get("job")).intValue();
        ok(JsonFacade.stepAnalysis(job, 10));
        assertEquals(JsonFacade.analyze(text, false), JsonFacade.finishAnalysis(job, false));
    }

    @Test
    void finishWithoutStepsAndIndependentJobs() {
        int a = ((Double) ok(JsonFacade.startAnalysis(PARALLEL)).get("job")).intValue();
        int b = ((Double) ok(JsonFacade.startAnalysis(PARALLEL)).get("job")).intValue();
        assertNotEquals(a, b, "each start gets its own job");
        ok(JsonFacade.stepAnalysis(a, 3));
        assertEquals(1.0, ok(JsonFacade.stepAnalysis(b, 1)).get("processed"), "jobs do not share progress");
        assertEquals(JsonFacade.analyze(PARALLEL, false), JsonFacade.finishAnalysis(b, false));
        assertEquals(JsonFacade.analyze(PARALLEL, true), JsonFacade.finishAnalysis(a, true));
        int c = ((Double) ok(JsonFacade.startAnalysis(PARALLEL)).get("job")).intValue();
        assertEquals(JsonFacade.analyze(PARALLEL, false), JsonFacade.finishAnalysis(c, false));
    }

    @Test
    void cancelledJobIsGone() {
        int job = ((Double) ok(JsonFacade.startAnalysis(PARALLEL)).get("job")).intValue();
        ok(JsonFacade.stepAnalysis(job, 1));
        assertEquals("{\"ok\":true}", JsonFacade.cancelAnalysis(job));
        error(JsonFacade.stepAnalysis(job, 1), "no-job", "$");
        error(JsonFacade.finishAnalysis(job, false), "no-job", "$");
    }

    @Test
    void startErrors() {
        error(JsonFacade.startAnalysis(BAD_WEIGHT), "weight", "$.graph.edges[1].weight");
        error(JsonFacade.startAnalysis(PARALLEL.replace("\"function\"", "\"promise\": \"a & !a\", \"function\"")),
            "empty-domain", "$.promise");
    }

    // ------------------------------------------------------------------ detail

    @Test
    void detailOfAPositiveInput() {
        // Derived (input 11, both edges present): R = 1·2/(1+2) = 2/3. A unit current splits
        // inversely to resistance: 2/3 through ea (w = 1), 1/3 through eb (w = 2), both s→t as
        // the edges are written. Potentials φ(t) = 0, φ(s) = R (Ohm's law). The dissipated
        // energies w·i² are 4/9 and 2/9, summing to R (Thomson's principle); the contract asks for
        // "energy" only on absent edges of negative inputs, so it is checked from the currents.
        Map<String, Object> m = ok(JsonFacade.detail(PARALLEL, "11"));
        for (String k : new String[] {"x", "connected", "f", "value", "edges", "potentials"}) {
            assertTrue(m.containsKey(k), k + " in " + m.keySet());
        }
        assertEquals("11", m.get("x"));
        assertEquals(true, m.get("connected"));
        assertEquals(1.0, m.get("f"));
        assertEquals(2.0 / 3, (Double) m.get("value"), 1e-12);
        List<?> edges = (List<?>) m.get("edges");
        assertEquals(2, edges.size());
        double[] current = {2.0 / 3, 1.0 / 3};
        double[] weight = {1, 2};
        double[] energy = {4.0 / 9, 2.0 / 9};
        String[] ids = {"ea", "eb"};
        for (int i = 0; i < 2; i++) {
            Map<?, ?> e = (Map<?, ?>) edges.get(i);
            assertEquals(List.of("id", "present", "current", "energy"), List.copyOf(e.keySet()));
            assertEquals(ids[i], e.get("id"));
            assertEquals(true, e.get("present"));
            assertEquals(current[i], (Double) e.get("current"), 1e-12);
            double i2 = (Double) e.get("current");
            assertEquals(energy[i], weight[i] * i2 * i2, 1e-12);
            assertTrue(e.get("energy") instanceof Double, "energy is a number");
        }
        Map<String, Object> p = obj(m, "potentials");
        assertEquals(List.of("s", "t"), List.copyOf(p.keySet()));
        assertEquals(2.0 / 3, (Double) p.get("s"), 1e-12);
        assertEquals(0.0, (Double) p.get("t"), 1e-12);
    }

    @Test
    void detailOfANegativeInput() {
        // Derived (input 00, both edges absent): capacitors 1/1 and 1/2 in parallel, C = 1.5;
        // potential 1 on s, 0 on t; energies (1/w)(Δp)²: 1 and 0.5; no current anywhere.
        Map<String, Object> m = ok(JsonFacade.detail(PARALLEL, "00"));
        assertEquals(false, m.get("connected"));
        assertEquals(0.0, m.get("f"));
        assertEquals(1.5, (Double) m.get("value"), 1e-12);
        double[] energy = {1.0, 0.5};
        List<?> edges = (List<?>) m.get("edges");
        for (int i = 0; i < 2; i++) {
            Map<?, ?> e = (Map<?, ?>) edges.get(i);
            assertEquals(false, e.get("present"));
            assertEquals(0.0, (Double) e.get("current"), 1e-12);
            assertEquals(energy[i], (Double) e.get("energy"), 1e-12);
        }
        Map<String, Object> p = obj(m, "potentials");
        assertEquals(1.0, (Double) p.get("s"), 1e-12);
        assertEquals(0.0, (Double) p.get("t"), 1e-12);
    }

    @Test
    void detailAgreesWithTheInputsOfAnalyze() throws IOException {
        String text = defaultScenario();
        List<?> rows = (List<?>) obj(ok(JsonFacade.analyze(text, true)), "result").get("inputs");
        for (Object o : rows) {
            Map<?, ?> row = (Map<?, ?>) o;
            Map<String, Object> d = ok(JsonFacade.detail(text, (String) row.get("x")));
            assertEquals(row.get("connected"), d.get("connected"), row.toString());
            assertEquals(row.get("f"), d.get("f"), row.toString());
            double v = (Double) row.get("value");
            assertEquals(v, (Double) d.get("value"), 1e-9 * Math.max(1, v), row.toString());
        }
    }

    @Test
    void detailWithoutAFunctionHasNullF() {
        assertSame(Json.NULL, ok(JsonFacade.detail(PARALLEL.replace("\"function\": \"a | b\",", ""), "10")).get("f"));
    }

    @Test
    void detailErrors() {
        for (String bad : new String[] {"1", "011", "2x", "", "ab"}) {
            Map<String, Object> e = error(JsonFacade.detail(PARALLEL, bad), "input-string", "$.input");
            assertTrue(((String) e.get("message")).contains("2 characters 0 or 1"), e.toString());
        }
        error(JsonFacade.detail(BAD_WEIGHT, "01"), "weight", "$.graph.edges[1].weight");
    }

    // ------------------------------------------------------------------ share links

    @Test
    void shareRoundTrip() throws IOException {
        for (String text : new String[] {PARALLEL, defaultScenario()}) {
            Map<String, Object> enc = ok(JsonFacade.encodeShare(text));
            assertEquals(List.of("ok", "fragment"), List.copyOf(enc.keySet()));
            String fragment = (String) enc.get("fragment");
            assertTrue(fragment.startsWith("s1.") && fragment.matches("[A-Za-z0-9._-]+"), fragment);
            Map<String, Object> dec = ok(JsonFacade.decodeShare(fragment));
            assertEquals(List.of("ok", "scenario"), List.copyOf(dec.keySet()));
            assertEquals(text, dec.get("scenario"), "the text comes back exactly");
            assertEquals(text, ok(JsonFacade.decodeShare("#" + fragment)).get("scenario"));
        }
    }

    @Test
    void damagedFragments() {
        String fragment = (String) ok(JsonFacade.encodeShare(PARALLEL)).get("fragment");
        int[] positions = {3, 5, fragment.length() / 2, fragment.length() - 5};
        for (int at : positions) {
            char c = fragment.charAt(at);
            char other = c == 'A' ? 'B' : 'A';
            String damaged = fragment.substring(0, at) + other + fragment.substring(at + 1);
            Map<String, Object> e = error(JsonFacade.decodeShare(damaged), "share-link", "$");
            assertTrue(((String) e.get("message")).contains("damaged"), "position " + at + ": " + e);
        }
        error(JsonFacade.decodeShare(fragment.substring(0, fragment.length() - 10)), "share-link", "$");
        error(JsonFacade.decodeShare("hello"), "share-link", "$");
        error(JsonFacade.decodeShare(""), "share-link", "$");
        error(JsonFacade.decodeShare("s1.***"), "share-link", "$");
    }

    @Test
    void shareRefusesInvalidScenarios() {
        // encode validates first; a well-formed link to an invalid scenario reports the scenario's problem
        error(JsonFacade.encodeShare(BAD_WEIGHT), "weight", "$.graph.edges[1].weight");
        error(JsonFacade.encodeShare("{"), "json-syntax", "$");
        error(JsonFacade.decodeShare(ShareCodec.encode(BAD_WEIGHT)), "weight", "$.graph.edges[1].weight");
    }

    @Test
    void anErrorInsideACallIsAnInternalEnvelopeNotAnException() throws InterruptedException {
        // A thread with a very small stack overflows inside the façade (the reader, the expression
        // parser and the evaluator all take some stack per level of a 190-deep function): the call
        // must answer with the error envelope, never let the StackOverflowError escape.
        StringBuilder f = new StringBuilder();
        for (int i = 0; i < 190; i++) {
            f.append("(a & ");
        }
        f.append("b");
        for (int i = 0; i < 190; i++) {
            f.append(')');
        }
        String deep = PARALLEL.replace("\"a | b\"", "\"" + f + "\"");
        ok(JsonFacade.validate(deep)); // fine on an ordinary stack
        String[] reply = new String[1];
        Throwable[] escaped = new Throwable[1];
        int overflowed = 0;
        for (int kib = 16; kib <= 256 && overflowed == 0; kib *= 2) {
            Thread th = new Thread(null, () -> {
                try {
                    reply[0] = JsonFacade.analyze(deep, true);
                } catch (Throwable e) {
                    escaped[0] = e;
                }
            }, "small-stack", kib * 1024L);
            th.start();
            th.join();
            assertEquals(null, escaped[0], "escaped from the façade with a " + kib + " KiB stack");
            if (!Boolean.TRUE.equals(parse(reply[0]).get("ok"))) {
                Map<String, Object> e = error(reply[0], "internal", "$");
                assertTrue(((String) e.get("message")).contains("stack overflow"), reply[0]);
                overflowed++;
            }
        }
        assertEquals(1, overflowed, "some small stack overflowed inside the call");
        // the same helper turns any other Error into a plain message
        Map<String, Object> oom = error(JsonFacade.fail(new OutOfMemoryError("Java heap space")), "internal", "$");
        assertTrue(((String) oom.get("message")).contains("out of memory"), oom.toString());
    }

    @Test
    void theLimitsOnKeptAndListedInputsAreStatedAndRefusedCleanly() {
        // docs/scenario-format.md, "Limits": 2^24 inputs kept, 2^20 listed — the same numbers here
        assertEquals(1L << 24, spanwright.analysis.Analysis.MAX_ENUMERATED_INPUTS);
        assertEquals(1L << 20, spanwright.analysis.Analysis.MAX_LISTED_INPUTS);
        spanwright.analysis.Analysis.checkEnumerable(1L << 24);
        spanwright.model.ScenarioException e = org.junit.jupiter.api.Assertions.assertThrows(
                spanwright.model.ScenarioException.class,
                () -> spanwright.analysis.Analysis.checkEnumerable((1L << 24) + 1));
        assertEquals("too-many-inputs", e.code());
        assertTrue(e.getMessage().contains("structure"), e.getMessage());
        // analyze with the list on 2^21 inputs: refused before the analysis (the page's worker asks
        // for rows only up to maxListedInputs, which startAnalysis reports)
        // 21 variables, the promise allows every input: 2^21 inputs (one edge s–t on x1)
        StringBuilder vars = new StringBuilder();
        for (int i = 1; i <= 21; i++) {
            vars.append(i > 1 ? ", " : "").append("\"x").append(i).append('"');
        }
        String wide = PARALLEL.replace("[\"a\", \"b\"]", "[" + vars + "]").replace("\"a | b\"", "\"x1 | x2\"")
                .replace("\"when\": \"a\"", "\"when\": \"x1\"").replace("\"when\": \"b\"", "\"when\": \"x2\"")
                .replace("\"function\"", "\"promise\": \"x1 | !x1\", \"function\"");
        Map<String, Object> err = error(JsonFacade.analyze(wide, true), "too-many-inputs", "$");
        assertTrue(((String) err.get("message")).contains("2^20"), err.toString());
        Map<String, Object> started = ok(JsonFacade.startAnalysis(wide));
        assertEquals(1048576.0, ((Number) started.get("maxListedInputs")).doubleValue());
        assertEquals(2097152.0, ((Number) started.get("domainSize")).doubleValue());
        JsonFacade.cancelAnalysis(((Number) started.get("job")).intValue());
    }
}
