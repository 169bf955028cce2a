package spanwright.facade;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import spanwright.io.GraphFile;
import spanwright.io.GraphFormats;
import spanwright.io.Json;
import spanwright.io.ScenarioReader;
import spanwright.io.ScenarioWriter;
import spanwright.model.Scenario;
import spanwright.reduction.HostGraphBuilder;

/**
 * {@link JsonFacade#importGraph} and the {@code "family":"import"} build request: the page's way to
 * open GraphML and DOT files. Its scenario must be the command line's ({@code build host import},
 * jgrapht-io, the independent reference) for the same file and options; the witness sizes of the
 * bridge fixture are derived by hand in HostGraphImportTest (W+ = 5, W- = 3).
 */
class ImportGraphTest {
    private static String fixture(String name) throws IOException {
        return Files.readString(Path.of("src/test/resources/graphs", name));
    }

    private static String options(Object... kv) {
        Map<String, Object> m = new LinkedHashMap<>();
        for (int i = 0; i < kv.length; i += 2) {
            m.put((String) kv[i], kv[i + 1]);
        }
        return Json.write(m);
    }

    /** The command line's scenario for the file: jgrapht-io, then HostGraphBuilder.imported. */
    private static String cliScenario(String text, GraphFile.Format f, String s, String t, String literalKey) {
        Scenario sc = HostGraphBuilder.imported(GraphFormats.read(text, f, "$.graph"), s, t, -1, literalKey,
                GraphFormats.WEIGHT).scenario();
        return Json.write(ScenarioWriter.toJson(sc));
    }

    @Test
    void theBridgeFixturesOpenAsTheCommandLineBuildsThem() throws IOException {
        for (String f : new String[] {"bridge-networkx.graphml", "bridge-graphviz.dot"}) {
            String text = fixture(f);
            Map<String, Object> r = JsonFacadeTest.ok(JsonFacade.importGraph(text, options("fileName", f)));
            assertEquals(List.of("s", "a", "b", "t"), r.get("vertices"), f);
            assertEquals(5.0, r.get("edges"), f);
            // no role marks in these files: s and t default to the first and the last vertex
            assertEquals(Map.of("s", Json.NULL, "t", Json.NULL), r.get("marked"), f);
            assertEquals("s", r.get("s"), f);
            assertEquals("t", r.get("t"), f);
            assertEquals(cliScenario(text, GraphFile.Format.ofFileName(f), "s", "t", null), Json.write(r.get("scenario")), f);
            String body = Json.write(r.get("scenario"));
            Map<String, Object> a = JsonFacadeTest.ok(JsonFacade.analyze(body, false));
            Map<String, Object> res = JsonFacadeTest.obj(a, "result");
            // derived (HostGraphImportTest): W+ = 5 (path s-b-a-t), W- = 3 (bond {s-a, a-b, b-t})
            assertEquals(5.0, (Double) JsonFacadeTest.obj(res, "positive").get("maxResistance"), 1e-12, f);
            assertEquals(3.0, (Double) JsonFacadeTest.obj(res, "negative").get("maxCapacitance"), 1e-12, f);
            // the build request is the same path
            Map<String, Object> req = new LinkedHashMap<>();
            req.put("kind", "host");
            req.put("family", "import");
            req.put("text", text);
            req.put("s", "s");
            req.put("t", "t");
            Map<String, Object> b = JsonFacadeTest.ok(JsonFacade.build(Json.write(req)));
            assertEquals(Json.write(r.get("scenario")), Json.write(b.get("scenario")), f);
            assertEquals("import", JsonFacadeTest.obj(b, "stats").get("family"));
        }
    }

    @Test
    void anExportedScenarioComesBackWithItsEndsLiteralsAndWeights() throws IOException {
        String json = Files.readString(Path.of("../scenarios/inverter-ladder.json"));
        Scenario drawn = ScenarioReader.read(json);
        for (String[] f : new String[][] {{"graphml", GraphFormats.writeGraphML(drawn)}, {"dot", GraphFormats.writeDot(drawn)}}) {
            Map<String, Object> d = JsonFacadeTest.ok(JsonFacade.importGraph(f[1], options("build", false)));
            assertFalse(d.containsKey("scenario"), "build: false describes only");
            assertEquals(f[0], d.get("format"));
            Map<String, Object> marked = JsonFacadeTest.obj(d, "marked");
            assertEquals(drawn.vertices().get(drawn.s()).id(), marked.get("s"));
            assertEquals(drawn.vertices().get(drawn.t()).id(), marked.get("t"));
            boolean literalOnEvery = false;
            for (Object o : (List<?>) d.get("edgeAttributes")) {
                Map<?, ?> a = (Map<?, ?>) o;
                literalOnEvery |= a.get("name").equals("literal") && ((Double) a.get("edges")) == drawn.edges().size();
            }
            assertTrue(literalOnEvery, "every edge carries its literal: " + d.get("edgeAttributes"));
            Map<String, Object> r = JsonFacadeTest.ok(JsonFacade.importGraph(f[1], options("literalKey", "literal")));
            String expected = cliScenario(f[1], GraphFile.Format.named(f[0]), null, null, "literal");
            assertEquals(expected, Json.write(r.get("scenario")), f[0]);
            Scenario back = ScenarioReader.fromJson(r.get("scenario"));
            for (int i = 0; i < drawn.edges().size(); i++) {
                assertEquals(drawn.edges().get(i).when().toString(), back.edges().get(i).when().toString());
                assertEquals(drawn.edges().get(i).weight(), back.edges().get(i).weight(), 0);
            }
        }
    }

    @Test
    void optionsChooseEndsAndWeights() throws IOException {
        String text = fixture("bridge-graphviz.dot");
        Map<String, Object> r = JsonFacadeTest.ok(JsonFacade.importGraph(text, options("s", "a", "t", "b", "weightKey", "")));
        assertEquals("a", r.get("s"));
        Scenario sc = ScenarioReader.fromJson(r.get("scenario"));
        assertEquals("a", sc.vertices().get(sc.s()).id());
        assertEquals("b", sc.vertices().get(sc.t()).id());
        for (int i = 0; i < sc.edges().size(); i++) {
            assertEquals(1, sc.edges().get(i).weight(), 0, "weightKey \"\": every weight 1");
        }
        // the text alone tells its format
        assertEquals("dot", JsonFacadeTest.ok(JsonFacade.importGraph(text, null)).get("format"));
        assertEquals("graphml", JsonFacadeTest.ok(JsonFacade.importGraph(fixture("bridge-networkx.graphml"),
                options("fileName", "bridge.xml"))).get("format"));
    }

    @Test
    void badFilesAndOptionsComeBackAsLocatedErrors() throws IOException {
        Map<String, Object> e = JsonFacadeTest.obj(JsonFacadeTest.parse(JsonFacade.importGraph(
                "graph {\n  a -- b;\n  b -- ;\n}", options("fileName", "broken.dot"))), "error");
        assertEquals("graph-file", e.get("code"));
        assertEquals("$.text", e.get("path"));
        assertTrue(((String) e.get("message")).contains("line 3, column 8"), e.toString());
        e = JsonFacadeTest.obj(JsonFacadeTest.parse(JsonFacade.importGraph("graph { a }", null)), "error");
        assertTrue(((String) e.get("message")).contains("1 vertex"), e.toString());
        e = JsonFacadeTest.obj(JsonFacadeTest.parse(JsonFacade.importGraph(fixture("bridge-graphviz.dot"),
                options("s", "nowhere"))), "error");
        assertEquals("unknown-vertex", e.get("code"));
        assertEquals("$.s", e.get("path"));
        e = JsonFacadeTest.obj(JsonFacadeTest.parse(JsonFacade.importGraph(fixture("bridge-graphviz.dot"),
                options("colour", "red"))), "error");
        assertEquals("$.colour", e.get("path"));
        e = JsonFacadeTest.obj(JsonFacadeTest.parse(JsonFacade.importGraph("just words", null)), "error");
        assertEquals("format", e.get("code"));
        e = JsonFacadeTest.obj(JsonFacadeTest.parse(JsonFacade.importGraph(fixture("bridge-graphviz.dot"),
                options("literalKey", "literal"))), "error");
        assertEquals("literal", e.get("code"));
        assertEquals("$.graph.edges[0]", e.get("path"));
        e = JsonFacadeTest.obj(JsonFacadeTest.parse(JsonFacade.build("{\"kind\":\"host\",\"family\":\"import\"}")), "error");
        assertEquals("missing", e.get("code"));
        assertEquals("$.text", e.get("path"));
        assertNull(JsonFacadeTest.parse(JsonFacade.importGraph("graph { a -- b }", null)).get("error"));
    }
}
