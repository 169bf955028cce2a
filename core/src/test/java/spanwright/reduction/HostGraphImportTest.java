package spanwright.reduction;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.io.GraphFile;
import spanwright.io.GraphFormats;
import spanwright.io.ScenarioReader;
import spanwright.io.ScenarioWriter;
import spanwright.model.Edge;
import spanwright.model.Scenario;
import spanwright.model.ScenarioException;

/**
 * Host graphs imported from graph files ({@link GraphFormats#read} then
 * {@link HostGraphBuilder#imported}): the fixtures in src/test/resources/graphs (one bridge in
 * networkx-style GraphML and GML, Graphviz DOT and a pandas-style CSV edge list; see the README
 * there for where each layout comes from) give the same instance as the typed JSON scenario;
 * exports read back unchanged; bad files and options are refused with a located message.
 */
class HostGraphImportTest {
    private static String resource(String name) throws IOException {
        try (InputStream in = HostGraphImportTest.class.getResourceAsStream("/graphs/" + name)) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
    }

    private static Scenario importFile(String name, String s, String t) throws IOException {
        GraphFile g = GraphFormats.read(resource(name), GraphFile.Format.ofFileName(name), "$.graph");
        return HostGraphBuilder.imported(g, s, t, -1, null, GraphFormats.WEIGHT).scenario();
    }

    @Test
    void everyFormatGivesTheBridgesWitnessSizes() throws IOException {
        Scenario typed = ScenarioReader.read(resource("bridge.json"));
        AnalysisResult expected = Analysis.run(typed);
        // derived: one variable per edge, so W+ is the heaviest simple s-t path (s-b-a-t: 2+1+2 = 5)
        // and W- the heaviest bond by sum of 1/w ({s-a, a-b, b-t}: 1+1+1 = 3) (DESIGN.md section 6)
        assertEquals(5, expected.maxResistance(), 1e-12);
        assertEquals(3, expected.maxCapacitance(), 1e-12);
        for (String f : new String[] {"bridge-networkx.graphml", "bridge-graphviz.dot", "bridge.gml", "bridge.csv"}) {
            Scenario sc = importFile(f, "s", "t");
            AnalysisResult r = Analysis.run(sc);
            assertEquals(expected.maxResistance(), r.maxResistance(), 1e-12, f);
            assertEquals(expected.maxCapacitance(), r.maxCapacitance(), 1e-12, f);
            assertEquals(Boolean.TRUE, r.correct(), f);
            assertEquals(4, sc.vertexCount(), f);
            assertEquals(5, sc.variableCount(), f);
            assertTrue(sc.connectivity() != null && sc.connectivity().ownGraph(), f + ": the connectivity form");
            // the same edges and weights in the same order as the typed scenario (the typed file's order)
            for (int i = 0; i < 5; i++) {
                Edge a = typed.edges().get(i);
                Edge b = sc.edges().get(i);
                assertEquals(typed.vertices().get(a.u()).id(), sc.vertices().get(b.u()).id(), f);
                assertEquals(typed.vertices().get(a.v()).id(), sc.vertices().get(b.v()).id(), f);
                assertEquals(a.weight(), b.weight(), 0, f);
            }
            if (!f.endsWith(".csv")) {
                // positions kept; the DOT file's y points up and is mirrored on reading
                for (int i = 0; i < 4; i++) {
                    assertEquals(typed.vertices().get(i).x(), sc.vertices().get(i).x(), 0, f);
                    assertEquals(typed.vertices().get(i).y(), sc.vertices().get(i).y(), 0, f);
                }
            }
        }
    }

    @Test
    void graphMLAndDotExportsReadBackAsTheSameScenario() throws IOException {
        Scenario first = importFile("bridge-networkx.graphml", "s", "t");
        String graphml = GraphFormats.writeGraphML(first);
        Scenario again = HostGraphBuilder.imported(GraphFormats.read(graphml, GraphFile.Format.GRAPHML, "$.graph"),
                null, null, -1, null, GraphFormats.WEIGHT).scenario();
        // round trip: s and t come back from the vertex attribute "role"
        assertEquals(ScenarioWriter.write(first), ScenarioWriter.write(again));
        Scenario viaDot = HostGraphBuilder.imported(GraphFormats.read(GraphFormats.writeDot(first), GraphFile.Format.DOT,
                "$.graph"), null, null, -1, null, GraphFormats.WEIGHT).scenario();
        assertEquals(ScenarioWriter.write(first).replace("a GraphML graph", "a DOT (Graphviz) graph"),
                ScenarioWriter.write(viaDot));
    }

    @Test
    void literalsAndWeightsFromAttributesKeepADrawnScenario() throws IOException {
        // a drawn scenario with negated literals and several edges per variable: exported, then
        // imported with --literal-key literal, it keeps every edge's condition, weight and place
        for (String name : new String[] {"inverter-ladder.json", "default.json"}) {
            Scenario drawn = ScenarioReader.read(Files.readString(Path.of("../scenarios", name)));
            for (GraphFile.Format format : new GraphFile.Format[] {GraphFile.Format.GRAPHML, GraphFile.Format.DOT}) {
                String text = format == GraphFile.Format.GRAPHML ? GraphFormats.writeGraphML(drawn)
                        : GraphFormats.writeDot(drawn);
                Scenario back = HostGraphBuilder.imported(GraphFormats.read(text, format, "$.graph"), null, null, -1,
                        GraphFormats.LITERAL, GraphFormats.WEIGHT).scenario();
                assertEquals(drawn.edges().size(), back.edges().size(), name);
                assertEquals(drawn.s(), back.s(), name);
                assertEquals(drawn.t(), back.t(), name);
                for (int i = 0; i < drawn.edges().size(); i++) {
                    Edge a = drawn.edges().get(i);
                    Edge b = back.edges().get(i);
                    assertEquals(a.id(), b.id(), name + " " + format);
                    assertEquals(a.when().toString(), b.when().toString(), name + " " + format);
                    assertEquals(a.weight(), b.weight(), 0, name + " " + format);
                }
                for (int i = 0; i < drawn.vertexCount(); i++) {
                    assertEquals(drawn.vertices().get(i).x(), back.vertices().get(i).x(), 0, name);
                    assertEquals(drawn.vertices().get(i).y(), back.vertices().get(i).y(), 0, name);
                }
                // the graph decides its own connectivity, and W+, W- do not depend on the function
                AnalysisResult r0 = Analysis.run(drawn);
                AnalysisResult r1 = Analysis.run(back);
                assertEquals(Boolean.TRUE, r1.correct(), name);
                if (back.variables().equals(drawn.variables()) && Boolean.TRUE.equals(r0.correct())) {
                    // law: same graph, same conditions, same decided function: same witness sizes
                    assertEquals(r0.maxResistance(), r1.maxResistance(), 1e-12, name);
                    assertEquals(r0.maxCapacitance(), r1.maxCapacitance(), 1e-12, name);
                }
            }
        }
    }

    @Test
    void missingOrEqualEndsAndBadValuesAreRefusedWithTheirPlace() throws IOException {
        GraphFile g = GraphFormats.read(resource("bridge-networkx.graphml"), GraphFile.Format.GRAPHML, "$.graph");
        ScenarioException e = assertThrows(ScenarioException.class,
                () -> HostGraphBuilder.imported(g, null, "t", -1, null, "weight"));
        assertEquals("missing", e.code());
        assertEquals("$.s", e.path());
        assertTrue(e.getMessage().contains("--s") && e.getMessage().contains("s, a, b, t"), e.getMessage());
        e = assertThrows(ScenarioException.class, () -> HostGraphBuilder.imported(g, "a", "a", -1, null, "weight"));
        assertEquals("same-s-t", e.code());
        e = assertThrows(ScenarioException.class, () -> HostGraphBuilder.imported(g, "s", "z", -1, null, "weight"));
        assertEquals("unknown-vertex", e.code());
        assertEquals("$.t", e.path());
        e = assertThrows(ScenarioException.class, () -> HostGraphBuilder.imported(g, "s", "t", -1, "literal", "weight"));
        assertEquals("literal", e.code());
        assertEquals("$.graph.edges[0]", e.path());
        GraphFile bad = GraphFormats.read("source,target,weight\ns,t,0\n", GraphFile.Format.CSV, "$.graph");
        e = assertThrows(ScenarioException.class, () -> HostGraphBuilder.imported(bad, "s", "t", -1, null, "weight"));
        assertEquals("weight", e.code());
        e = assertThrows(ScenarioException.class,
                () -> GraphFormats.read("<graphml><graph><node id=", GraphFile.Format.GRAPHML, "$.graph"));
        assertEquals("graph-file", e.code());
        e = assertThrows(ScenarioException.class,
                () -> GraphFormats.read("graph { a -- ; }", GraphFile.Format.DOT, "$.graph"));
        assertEquals("graph-file", e.code());
        e = assertThrows(ScenarioException.class, () -> GraphFormats.read("a,b\nc,d,1\n", GraphFile.Format.CSV, "$.graph"));
        assertEquals("graph-file", e.code());
        assertTrue(e.getMessage().contains("line 2"), e.getMessage());
    }

    @Test
    void weightKeyAndUnplacedGraphs() {
        // a CSV has no positions: the vertices go on a circle; a named weight column is read
        GraphFile g = GraphFormats.read("source,target,ohms\nx,y,3\ny,z,4\n", GraphFile.Format.CSV, "$.graph");
        Scenario sc = HostGraphBuilder.imported(g, "x", "z", -1, null, "ohms").scenario();
        for (int i = 0; i < 3; i++) {
            assertTrue(sc.vertices().get(i).hasPosition());
        }
        // derived: a path of resistances 3 and 4 in series, one variable each: W+ = 3 + 4; W- = max over
        // the single-edge cuts of 1/w = 1/3
        AnalysisResult r = Analysis.run(sc);
        assertEquals(7, r.maxResistance(), 1e-12);
        assertEquals(1.0 / 3, r.maxCapacitance(), 1e-12);
    }
}
