package spanwright.io;

import spanwright.model.ScenarioException;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Consumer;
import org.junit.jupiter.api.Test;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.domain.InputDomain;
import spanwright.model.Condition;
import spanwright.model.Edge;
import spanwright.model.Promise;
import spanwright.model.Scenario;

/**
 * Scenario format v1: acceptance of the example in the "Core engine" issue and every rejection of
 * its validation list, each checked for its code, its JSON path and a plain message that names the
 * problem. Source of every expectation: the format's specification (issue "Core engine", section
 * "Scenario file, format v1", and docs/scenario-format.md).
 */
class ScenarioReaderTest {

    /** The example of the issue, verbatim. */
    static final String EXAMPLE = "{\n"
        + "  \"format\": \"spanwright-scenario\", \"version\": 1,\n"
        + "  \"title\": \"…\", \"notes\": \"…\",\n"
        + "  \"variables\": [\"a\", \"b\", \"c\"],\n"
        + "  \"function\": \"maj(a, b, c)\",\n"
        + "  \"promise\": null,\n"
        + "  \"graph\": {\n"
        + "    \"s\": \"s\", \"t\": \"t\",\n"
        + "    \"vertices\": [{\"id\": \"s\", \"x\": 0, \"y\": 0}, {\"id\": \"m\"}, {\"id\": \"t\"}],\n"
        + "    \"edges\": [{\"id\": \"e1\", \"u\": \"s\", \"v\": \"m\", \"when\": \"a\", \"weight\": 1.0},\n"
        + "              {\"id\": \"e2\", \"u\": \"m\", \"v\": \"t\", \"when\": \"!b\"},\n"
        + "              {\"id\": \"e3\", \"u\": \"s\", \"v\": \"t\", \"when\": \"1\"}]\n"
        + "  }\n"
        + "}\n";

    // ------------------------------------------------------------------ helpers

    @SuppressWarnings("unchecked")
    static Map<String, Object> example() {
        return (Map<String, Object>) Json.parse(EXAMPLE);
    }

    /** The example with one change applied, as JSON text. */
    static String changed(Consumer<Map<String, Object>> change) {
        Map<String, Object> m = example();
        change.accept(m);
        return Json.write(m);
    }

    @SuppressWarnings("unchecked")
    static Map<String, Object> graph(Map<String, Object> m) {
        return (Map<String, Object>) m.get("graph");
    }

    @SuppressWarnings("unchecked")
    static List<Object> edges(Map<String, Object> m) {
        return (List<Object>) graph(m).get("edges");
    }

    @SuppressWarnings("unchecked")
    static Map<String, Object> edge(Map<String, Object> m, int i) {
        return (Map<String, Object>) edges(m).get(i);
    }

    @SuppressWarnings("unchecked")
    static List<Object> vertices(Map<String, Object> m) {
        return (List<Object>) graph(m).get("vertices");
    }

    static Map<String, Object> obj(Object... kv) {
        Map<String, Object> m = new LinkedHashMap<>();
        for (int i = 0; i < kv.length; i += 2) {
            m.put((String) kv[i], kv[i + 1]);
        }
        return m;
    }

    /**
     * Asserts that reading {@code text} is rejected with this code and path, and that the message
     * contains each of {@code words} and reads as plain text (no Java class names, no "null").
     */
    static ScenarioException assertRejected(String text, String code, String path, String... words) {
        ScenarioException e = assertThrows(ScenarioException.class, () -> ScenarioReader.read(text));
        assertEquals(code, e.code(), "code; message was: " + e.getMessage());
        assertEquals(path, e.path(), "path; message was: " + e.getMessage());
        assertPlain(e.getMessage());
        for (String w : words) {
            assertTrue(e.getMessage().contains(w), "message should contain '" + w + "': " + e.getMessage());
        }
        assertEquals(path + ": " + e.getMessage(), e.describe());
        return e;
    }

    static void assertPlain(String message) {
        assertNotNull(message);
        assertFalse(message.isBlank());
        for (String bad : new String[] {"Exception", "java.", "spanwright.", "NullPointer", "Double", "@"}) {
            assertFalse(message.contains(bad), "message is not plain (contains " + bad + "): " + message);
        }
    }

    static String withVariables(int n, Object promise) {
        List<Object> vars = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            vars.add("x" + i);
        }
        return changed(m -> {
            m.put("variables", vars);
            m.put("function", "x0");
            m.put("promise", promise == null ? Json.NULL : promise);
            edge(m, 0).put("when", "x0");
            edge(m, 1).put("when", "!x1");
            edge(m, 2).put("when", "x" + (n - 1));
        });
    }

    // ------------------------------------------------------------------ acceptance

    @Test
    void acceptsTheIssueExample() {
        Scenario sc = ScenarioReader.read(EXAMPLE);
        assertEquals("…", sc.title());
        assertEquals("…", sc.notes());
        assertEquals(List.of("a", "b", "c"), sc.variables());
        assertEquals("maj(a, b, c)", sc.functionText());
        assertNotNull(sc.function());
        assertSame(Promise.NONE, sc.promise());
        assertEquals(3, sc.vertexCount());
        assertEquals(List.of("s", "m", "t"), List.of(sc.vertices().get(0).id(), sc.vertices().get(1).id(),
            sc.vertices().get(2).id()));
        assertEquals(0, sc.s());
        assertEquals(2, sc.t());
        assertEquals(0.0, sc.vertices().get(0).x());
        assertTrue(Double.isNaN(sc.vertices().get(1).x()), "position is optional");
        assertEquals(3, sc.edges().size());
        Edge e1 = sc.edges().get(0);
        Edge e2 = sc.edges().get(1);
        Edge e3 = sc.edges().get(2);
        assertEquals("e1", e1.id());
        assertEquals(0, e1.u());
        assertEquals(1, e1.v());
        assertEquals(1.0, e1.weight());
        assertEquals(0, e1.when().variable());
        assertTrue(e1.when().positive());
        assertEquals(1.0, e2.weight(), "weight defaults to 1");
        assertEquals(1, e2.when().variable());
        assertFalse(e2.when().positive(), "!b is present when b = 0");
        assertSame(Condition.ALWAYS, e3.when());
        assertEquals(List.of(), sc.warnings());
        // maj is majority: the expression reads as documented (derived: maj(1,1,0) = 1, maj(1,0,0) = 0)
        assertTrue(sc.function().eval(0b110));
        assertFalse(sc.function().eval(0b100));
        assertEquals(8, InputDomain.of(sc).size());
    }

    @Test
    void acceptsOptionalPartsAndDefaults() {
        // no title, notes, function, promise, ids, weights; whitespace around a condition
        String text = "{\"format\":\"spanwright-scenario\",\"version\":1,\"variables\":[\"a\"],"
            + "\"graph\":{\"s\":\"s\",\"t\":\"t\",\"vertices\":[{\"id\":\"s\"},{\"id\":\"t\"}],"
            + "\"edges\":[{\"u\":\"s\",\"v\":\"t\",\"when\":\" ! a \"},{\"u\":\"t\",\"v\":\"s\",\"when\":\"a\"}]},"
            + "\"extra\":{\"kept\":\"by the page\"}}";
        Scenario sc = ScenarioReader.read(text);
        assertEquals("", sc.title());
        assertNull(sc.function());
        assertNull(sc.functionText());
        assertEquals("e1", sc.edges().get(0).id(), "edge ids default to e1, e2, … by position");
        assertEquals("e2", sc.edges().get(1).id());
        assertFalse(sc.edges().get(0).when().positive());
        assertEquals(1.0, sc.edges().get(1).weight());
        // function: null means no function
        assertNull(ScenarioReader.read(changed(m -> m.put("function", Json.NULL))).function());
    }

    @Test
    void acceptsEveryKindOfPromise() {
        // Source: derived — for 3 variables: "a | b" holds on 6 of 8 inputs; Hamming weight 1 or 2:
        // C(3,1) + C(3,2) = 6 inputs; an explicit list of 2 inputs gives 2.
        Scenario expr = ScenarioReader.read(changed(m -> m.put("promise", "a | b")));
        assertEquals(Promise.Kind.EXPRESSION, expr.promise().kind());
        assertEquals(6, InputDomain.of(expr).size());
        Scenario weights = ScenarioReader.read(changed(m -> m.put("promise", obj("weights", List.of(1.0, 2.0)))));
        assertEquals(Promise.Kind.WEIGHTS, weights.promise().kind());
        assertEquals(6, InputDomain.of(weights).size());
        Scenario inputs = ScenarioReader.read(changed(m -> m.put("promise", obj("inputs", List.of("011", "101")))));
        assertEquals(Promise.Kind.INPUTS, inputs.promise().kind());
        InputDomain d = InputDomain.of(inputs);
        assertEquals(2, d.size());
        assertEquals("011", d.format(0));
        assertEquals("101", d.format(1));
    }

    @Test
    void acceptsParallelEdges() {
        Scenario sc = ScenarioReader.read(changed(m -> edges(m).add(obj("id", "e4", "u", "s", "v", "t", "when", "a"))));
        assertEquals(4, sc.edges().size());
    }

    // ------------------------------------------------------------------ malformed JSON, format, version

    @Test
    void rejectsMalformedJson() {
        assertRejected("{\"format\": \"spanwright-scenario\",\n \"version\": 1,,}", "json-syntax", "$",
            "malformed JSON", "line 2, column 15", "expected a quoted key");
        assertRejected("", "json-syntax", "$", "malformed JSON");
        assertRejected(EXAMPLE.replace("\"notes\"", "\"title\""), "json-syntax", "$", "duplicate key \"title\"", "line 3");
    }

    @Test
    void rejectsADocumentThatIsNotAnObject() {
        assertRejected("[1, 2]", "type", "$", "expected an object");
        assertRejected("\"spanwright-scenario\"", "type", "$", "expected an object");
    }

    @Test
    void rejectsWrongOrMissingFormat() {
        assertRejected(changed(m -> m.put("format", "spanwright")), "format", "$.format",
            "unknown format \"spanwright\"", "spanwright-scenario");
        assertRejected(changed(m -> m.put("format", 1.0)), "format", "$.format", "unknown format");
        assertRejected(changed(m -> m.remove("format")), "format", "$.format", "missing \"format\"");
    }

    @Test
    void rejectsWrongOrMissingVersion() {
        assertRejected(changed(m -> m.put("version", 2.0)), "version", "$.version", "unsupported version 2",
            "version 1");
        assertRejected(changed(m -> m.put("version", 1.5)), "version", "$.version", "unsupported version 1.5");
        assertRejected(changed(m -> m.put("version", "1")), "version", "$.version", "unsupported version \"1\"");
        assertRejected(changed(m -> m.remove("version")), "version", "$.version", "missing \"version\"");
    }

    // ------------------------------------------------------------------ missing keys and types

    @Test
    void rejectsMissingKeys() {
        assertRejected(changed(m -> m.remove("variables")), "missing", "$.variables", "missing \"variables\"");
        assertRejected(changed(m -> m.remove("graph")), "missing", "$.graph", "missing \"graph\"");
        assertRejected(changed(m -> graph(m).remove("vertices")), "missing", "$.graph.vertices", "missing \"vertices\"");
        assertRejected(changed(m -> graph(m).remove("edges")), "missing", "$.graph.edges", "missing \"edges\"");
        assertRejected(changed(m -> edge(m, 1).remove("u")), "missing", "$.graph.edges[1].u", "no \"u\"");
        assertRejected(changed(m -> edge(m, 2).remove("v")), "missing", "$.graph.edges[2].v", "no \"v\"");
        assertRejected(changed(m -> edge(m, 0).remove("when")), "missing", "$.graph.edges[0].when", "no \"when\"");
        assertRejected(changed(m -> vertices(m).set(1, obj("x", 3.0))), "missing", "$.graph.vertices[1].id",
            "no \"id\"");
    }

    @Test
    void rejectsMissingSOrT() {
        assertRejected(changed(m -> graph(m).remove("s")), "missing", "$.graph.s", "missing \"s\"");
        assertRejected(changed(m -> graph(m).remove("t")), "missing", "$.graph.t", "missing \"t\"");
        assertRejected(changed(m -> graph(m).put("t", Json.NULL)), "missing", "$.graph.t", "missing \"t\"");
    }

    @Test
    void rejectsWrongTypes() {
        assertRejected(changed(m -> m.put("variables", "a b c")), "type", "$.variables", "expected a list");
        assertRejected(changed(m -> m.put("variables", List.of("a", 2.0))), "type", "$.variables[1]",
            "expected a string, got 2");
        assertRejected(changed(m -> m.put("graph", List.of())), "type", "$.graph", "expected an object");
        assertRejected(changed(m -> graph(m).put("edges", obj())), "type", "$.graph.edges", "expected a list");
        assertRejected(changed(m -> edges(m).set(1, "e2")), "type", "$.graph.edges[1]", "expected an object");
        assertRejected(changed(m -> edge(m, 0).put("when", 1.0)), "type", "$.graph.edges[0].when", "expected a string");
        assertRejected(changed(m -> graph(m).put("s", 0.0)), "type", "$.graph.s", "expected a string");
        assertRejected(changed(m -> ((Map<String, Object>) vertices(m).get(0)).put("x", "left")), "type",
            "$.graph.vertices[0].x", "expected a number");
        assertRejected(changed(m -> m.put("title", 3.0)), "type", "$.title", "expected a string");
        assertRejected(changed(m -> m.put("function", true)), "type", "$.function", "expected a string");
    }

    // ------------------------------------------------------------------ vertices and variables

    @Test
    void rejectsUnknownVertices() {
        assertRejected(changed(m -> graph(m).put("s", "source")), "unknown-vertex", "$.graph.s", "\"source\"",
            "not a vertex");
        assertRejected(changed(m -> graph(m).put("t", "sink")), "unknown-vertex", "$.graph.t", "\"sink\"");
        assertRejected(changed(m -> edge(m, 1).put("u", "q")), "unknown-vertex", "$.graph.edges[1].u",
            "unknown vertex \"q\"");
        assertRejected(changed(m -> edge(m, 2).put("v", "T")), "unknown-vertex", "$.graph.edges[2].v",
            "unknown vertex \"T\"");
    }

    @Test
    void rejectsUnknownVariableInWhen() {
        assertRejected(changed(m -> edge(m, 1).put("when", "!d")), "unknown-variable", "$.graph.edges[1].when",
            "unknown variable \"d\"", "a, b, c");
        assertRejected(changed(m -> edge(m, 0).put("when", "A")), "unknown-variable", "$.graph.edges[0].when",
            "unknown variable \"A\"");
    }

    @Test
    void rejectsBadConditionText() {
        for (String bad : new String[] {"a & b", "!!a", "0", "", "a|b", "maj(a, b, c)", "-a", "!"}) {
            assertRejected(changed(m -> edge(m, 2).put("when", bad)), "condition", "$.graph.edges[2].when",
                "not a condition", "!a", "1 for always");
        }
    }

    @Test
    void rejectsBadExpressionsInFunctionAndPromise() {
        assertRejected(changed(m -> m.put("function", "maj(a, b, d)")), "expression", "$.function",
            "column 11", "unknown variable 'd'");
        assertRejected(changed(m -> m.put("function", "a &")), "expression", "$.function", "column 4", "expected");
        assertRejected(changed(m -> m.put("function", "")), "expression", "$.function", "empty");
        assertRejected(changed(m -> m.put("promise", "a | (b")), "expression", "$.promise", "column 7", "')'");
    }

    @Test
    void rejectsDuplicateIds() {
        assertRejected(changed(m -> vertices(m).add(obj("id", "m"))), "duplicate-id", "$.graph.vertices[3].id",
            "vertex id \"m\"", "twice");
        assertRejected(changed(m -> edge(m, 2).put("id", "e1")), "duplicate-id", "$.graph.edges[2].id",
            "edge id \"e1\"", "twice");
        assertRejected(changed(m -> m.put("variables", List.of("a", "b", "a"))), "duplicate-id", "$.variables[2]",
            "variable \"a\"", "twice");
    }

    @Test
    void rejectsBadVariableNames() {
        assertRejected(changed(m -> m.put("variables", List.of("a", "2b", "c"))), "variable-name", "$.variables[1]",
            "\"2b\"", "not a valid variable name");
        assertRejected(changed(m -> m.put("variables", List.of("a", "maj", "c"))), "variable-name", "$.variables[1]",
            "function name");
    }

    @Test
    void rejectsEmptyVertexId() {
        assertRejected(changed(m -> vertices(m).set(1, obj("id", ""))), "type", "$.graph.vertices[1].id", "empty");
    }

    @Test
    void rejectsSEqualT() {
        assertRejected(changed(m -> graph(m).put("t", "s")), "same-s-t", "$.graph.t", "same vertex \"s\"", "differ");
    }

    // ------------------------------------------------------------------ weights

    @Test
    void rejectsNonPositiveWeights() {
        assertRejected(changed(m -> edge(m, 1).put("weight", 0.0)), "weight", "$.graph.edges[1].weight",
            "finite number > 0", "got 0");
        assertRejected(changed(m -> edge(m, 1).put("weight", -2.5)), "weight", "$.graph.edges[1].weight",
            "finite number > 0", "got -2.5");
        assertRejected(changed(m -> edge(m, 0).put("weight", -0.0)), "weight", "$.graph.edges[0].weight");
    }

    @Test
    void rejectsNaNLikeWeights() {
        // JSON has no NaN: what a person writes instead is a string, or null
        assertRejected(changed(m -> edge(m, 1).put("weight", "NaN")), "weight", "$.graph.edges[1].weight",
            "must be a number", "\"NaN\"");
        assertRejected(changed(m -> edge(m, 1).put("weight", "1.5")), "weight", "$.graph.edges[1].weight",
            "must be a number");
        assertRejected(changed(m -> edge(m, 1).put("weight", true)), "weight", "$.graph.edges[1].weight",
            "must be a number");
        assertRejected(changed(m -> edge(m, 1).put("weight", Json.NULL)), "weight", "$.graph.edges[1].weight",
            "got null");
        assertRejected(EXAMPLE.replace("\"when\": \"!b\"", "\"when\": \"!b\", \"weight\": NaN"), "json-syntax", "$",
            "line 11");
    }

    @Test
    void rejectsInfiniteWeights() {
        // Source: IEEE 754 — 1e400 overflows a double to infinity (see JsonTest).
        ScenarioException big = assertRejected(EXAMPLE.replace("\"weight\": 1.0", "\"weight\": 1e400"), "weight",
            "$.graph.edges[0].weight", "finite number > 0", "infinit");
        assertFalse(big.getMessage().contains("null"), "the person wrote a number, not null: " + big.getMessage());
        ScenarioException negative = assertRejected(EXAMPLE.replace("\"weight\": 1.0", "\"weight\": -1e400"),
            "weight", "$.graph.edges[0].weight", "infinit");
        assertFalse(negative.getMessage().contains("null"), negative.getMessage());
        // the ends of the accepted range are fine (Edge.MIN_WEIGHT, Edge.MAX_WEIGHT)
        assertEquals(1e-100, ScenarioReader.read(EXAMPLE.replace("\"weight\": 1.0", "\"weight\": 1e-100"))
            .edges().get(0).weight());
        assertEquals(1e100, ScenarioReader.read(EXAMPLE.replace("\"weight\": 1.0", "\"weight\": 1e100"))
            .edges().get(0).weight());
    }

    @Test
    void rejectsWeightsOutsideTheAcceptedRange() {
        // Project rule (Edge.MIN_WEIGHT = 1e-100, MAX_WEIGHT = 1e100): a subnormal weight has an
        // infinite conductance (IEEE 754: 1/5e-324 overflows); 1e-101 and 1e101 are just outside.
        for (String w : new String[] {"5e-324", "1e-300", "1e-101", "1e101", "1e300"}) {
            ScenarioException e = assertRejected(EXAMPLE.replace("\"weight\": 1.0", "\"weight\": " + w), "weight",
                "$.graph.edges[0].weight", "outside the accepted range [1e-100, 1e100]", "scale all weights");
            assertTrue(e.getMessage().contains("edge \""), "names the edge: " + e.getMessage());
        }
    }

    // ------------------------------------------------------------------ promise

    @Test
    void rejectsInputStringsOfTheWrongLengthOrAlphabet() {
        for (String bad : new String[] {"01", "0110", "", "01x", "0 1", "1O1", "٠١١"}) {
            assertRejected(changed(m -> m.put("promise", obj("inputs", List.of("011", bad)))), "input-string",
                "$.promise.inputs[1]", "\"" + bad + "\"", "3 characters 0 or 1", "a, b, c");
        }
        assertRejected(changed(m -> m.put("promise", obj("inputs", List.of(11.0)))), "type", "$.promise.inputs[0]",
            "expected a string");
        assertRejected(changed(m -> m.put("promise", obj("inputs", List.of("011", "011")))), "input-string",
            "$.promise.inputs[1]", "listed twice");
    }

    @Test
    void rejectsBadPromiseShapesAndHammingWeights() {
        assertRejected(changed(m -> m.put("promise", obj("weight", List.of(1.0)))), "promise", "$.promise",
            "{\"weights\": [...]}");
        assertRejected(changed(m -> m.put("promise", obj("weights", List.of(1.0), "inputs", List.of("011")))),
            "promise", "$.promise");
        assertRejected(changed(m -> m.put("promise", 1.0)), "type", "$.promise", "expected an object");
        assertRejected(changed(m -> m.put("promise", obj("weights", List.of(1.0, 4.0)))), "promise",
            "$.promise.weights[1]", "outside 0..3");
        assertRejected(changed(m -> m.put("promise", obj("weights", List.of(-1.0)))), "promise",
            "$.promise.weights[0]", "outside 0..3");
        assertRejected(changed(m -> m.put("promise", obj("weights", List.of(1.5)))), "promise",
            "$.promise.weights[0]", "whole number");
        assertRejected(changed(m -> m.put("promise", obj("weights", List.of(2.0, 2.0)))), "promise",
            "$.promise.weights[1]", "listed twice");
    }

    @Test
    void rejectsEmptyDomains() {
        assertRejected(changed(m -> m.put("promise", obj("weights", List.of()))), "empty-domain",
            "$.promise.weights", "empty", "no input");
        assertRejected(changed(m -> m.put("promise", obj("inputs", List.of()))), "empty-domain",
            "$.promise.inputs", "empty");
        // An expression that is never true parses fine; the domain is found empty when it is built.
        // Source: derived — a & !a is 0 on every input.
        Scenario sc = ScenarioReader.read(changed(m -> m.put("promise", "a & !a")));
        ScenarioException e = assertThrows(ScenarioException.class, () -> InputDomain.of(sc));
        assertEquals("empty-domain", e.code());
        assertEquals("$.promise", e.path());
        assertPlain(e.getMessage());
        assertTrue(e.getMessage().contains("a & !a") && e.getMessage().contains("none of the 2^3 inputs"),
            e.getMessage());
    }

    // ------------------------------------------------------------------ limits

    @Test
    void acceptsTwentyFourVariablesAndRejectsMore() {
        // Source: the documented limit ScenarioReader.MAX_ENUMERATED_VARIABLES = 24 (2^24 inputs).
        assertEquals(24, ScenarioReader.MAX_ENUMERATED_VARIABLES);
        assertEquals(24, ScenarioReader.read(withVariables(24, null)).variableCount());
        assertRejected(withVariables(30, "x0 | x1"), "too-many-variables", "$.variables", "limit of 24",
            "drop the promise", "\"inputs\"");
        assertRejected(withVariables(25, obj("weights", List.of(1.0))), "too-many-variables", "$.variables",
            "limit of 24");
    }

    @Test
    void withoutAPromiseTheWholeCubeMayHaveThousandsOfVariables() {
        // Source: the documented limit ScenarioReader.MAX_VARIABLES = 4096 (the whole cube is then
        // analysed by structure, not enumerated).
        assertEquals(4096, ScenarioReader.MAX_VARIABLES);
        assertEquals(25, ScenarioReader.read(withVariables(25, null)).variableCount());
        assertEquals(4096, ScenarioReader.read(withVariables(4096, null)).variableCount());
        assertRejected(withVariables(4097, null), "too-many-variables", "$.variables", "4097 variables",
            "limit of 4096");
    }

    @Test
    void theConnectivityFormReadsWritesAndEvaluates() {
        // Derived: in the graph s–m (a), m–t (b), s–t (c), s and t are connected exactly when
        // (a and b) or c.
        String own = "{\"format\":\"spanwright-scenario\",\"version\":1,\"variables\":[\"a\",\"b\",\"c\"],"
                + "\"function\":{\"connects\":\"graph\"},\"graph\":{\"s\":\"s\",\"t\":\"t\",\"vertices\":"
                + "[{\"id\":\"s\"},{\"id\":\"m\"},{\"id\":\"t\"}],\"edges\":[{\"u\":\"s\",\"v\":\"m\",\"when\":\"a\"},"
                + "{\"u\":\"m\",\"v\":\"t\",\"when\":\"b\"},{\"u\":\"s\",\"v\":\"t\",\"when\":\"c\"}]}}";
        Scenario sc = ScenarioReader.read(own);
        assertTrue(sc.connectivity().ownGraph());
        for (long x = 0; x < 8; x++) {
            boolean a = (x & 4) != 0;
            boolean b = (x & 2) != 0;
            boolean c = (x & 1) != 0;
            assertEquals(a && b || c, sc.function().eval(x), "input " + x);
        }
        assertEquals(Boolean.TRUE, Analysis.run(sc).correct());
        Scenario back = RoundTrip.check(sc);
        assertTrue(back.connectivity().ownGraph());
        assertTrue(ScenarioWriter.write(sc).contains("\"connects\": \"graph\""), ScenarioWriter.write(sc));
        // another listed host graph: a single edge s–t switched by c; the graph above then decides
        // "c" only where a & b is 0, so the reduction is wrong on inputs 110 (derived).
        String other = own.replace("{\"connects\":\"graph\"}", "{\"connects\":{\"s\":\"p\",\"t\":\"q\",\"vertices\":"
                + "[{\"id\":\"p\"},{\"id\":\"q\"}],\"edges\":[{\"u\":\"p\",\"v\":\"q\",\"when\":\"c\"}]}}");
        Scenario o = ScenarioReader.read(other);
        assertFalse(o.connectivity().ownGraph());
        AnalysisResult r = Analysis.run(o);
        assertEquals(1, r.counterexampleCount());
        assertEquals(6L, r.counterexamples().get(0));
        Scenario oBack = RoundTrip.check(o);
        assertEquals(2, oBack.connectivity().vertices().size());
        // errors inside the host graph name their path under $.function.connects
        assertRejected(other.replace("\"v\":\"q\",\"when\":\"c\"", "\"v\":\"q\",\"when\":\"z\""), "unknown-variable",
            "$.function.connects.edges[0].when");
        assertRejected(own.replace("{\"connects\":\"graph\"}", "{\"connects\":7}"), "type", "$.function.connects");
        assertRejected(own.replace("{\"connects\":\"graph\"}", "{\"links\":1}"), "type", "$.function");
    }

    @Test
    void explicitInputsAllowMoreVariables() {
        // Source: the documented limit MAX_LISTED_VARIABLES = 63 (inputs are 64-bit masks).
        String one = "1" + "0".repeat(39);
        String two = "0".repeat(39) + "1";
        Scenario sc = ScenarioReader.read(withVariables(40, obj("inputs", List.of(one, two))));
        assertEquals(40, sc.variableCount());
        assertEquals(2, InputDomain.of(sc).size());
        // the analysis runs on it: input "10…0" has x0 = 1 (edge s–m present), x1 = 0 (m–t present)
        // — derived: s–m–t is a path, so s and t connect; "0…01" has x39 = 1, so edge s–t is present.
        AnalysisResult r = Analysis.run(sc);
        assertEquals(2, r.positiveCount());
        assertEquals(63, ScenarioReader.MAX_LISTED_VARIABLES);
        assertEquals(63, ScenarioReader.read(withVariables(63, obj("inputs", List.of("1".repeat(63)))))
            .variableCount());
    }

    @Test
    void tooManyVariablesEvenWithExplicitInputs() {
        // 64 variables with well-formed 64-character inputs: the limit is what is wrong, and the
        // message must say so (not complain about the input strings).
        assertRejected(withVariables(64, obj("inputs", List.of("1".repeat(64)))), "too-many-variables",
            "$.variables", "64 variables", "limit of 63");
    }

    // ------------------------------------------------------------------ self-loops

    @Test
    void selfLoopsAreKeptWithAWarningAndCarryNothing() {
        // Source: documented choice (docs/scenario-format.md): self-loops are kept in the file and
        // left out of the analysis, with a warning. Derived: a self-loop joins a vertex to itself,
        // so it carries no current and stores no charge; results equal those without it.
        String withLoop = changed(m -> edges(m).add(1, obj("id", "loop", "u", "m", "v", "m", "when", "c",
            "weight", 3.0)));
        Scenario sc = ScenarioReader.read(withLoop);
        assertEquals(4, sc.edges().size(), "the self-loop is kept");
        assertTrue(sc.edges().get(1).isSelfLoop());
        assertEquals(1, sc.warnings().size());
        String w = sc.warnings().get(0);
        assertPlain(w);
        assertTrue(w.contains("\"loop\"") && w.contains("self-loop") && w.contains("$.graph.edges[1]")
            && w.contains("\"m\""), w);

        AnalysisResult with = Analysis.run(sc);
        AnalysisResult without = Analysis.run(ScenarioReader.read(EXAMPLE));
        assertEquals(without.domainSize(), with.domainSize());
        for (int i = 0; i < with.domainSize(); i++) {
            assertEquals(without.connected(i), with.connected(i));
            assertEquals(without.value(i), with.value(i), 1e-12 * Math.max(1, without.value(i)));
        }
        // a self-loop on s is fine too
        assertEquals(1, ScenarioReader.read(changed(m -> edges(m).add(obj("u", "s", "v", "s", "when", "1"))))
            .warnings().size());
    }
}
