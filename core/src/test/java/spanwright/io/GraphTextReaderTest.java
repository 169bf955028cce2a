package spanwright.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.model.RandomScenarios;
import spanwright.model.Scenario;
import spanwright.model.ScenarioException;
import spanwright.reduction.HostGraphBuilder;

/**
 * The page's GraphML and DOT readers ({@link GraphTextReader}) against an independent reference,
 * JGraphT's jgrapht-io (through {@link GraphFormats#read}, the command line's path): on every
 * GraphML and DOT fixture in src/test/resources/graphs, on the GraphML and DOT exports of the
 * bundled scenarios and of seeded random ones, both give the same {@link GraphFile} (vertex ids in
 * order, positions, every attribute, edge ends, ids and attributes, graph attributes) and the same
 * scenario through {@code HostGraphBuilder.imported}. Malformed files are refused with the line
 * and column; entities and escapes decode as the XML 1.0 and DOT specifications say.
 */
class GraphTextReaderTest {
    private static String resource(String name) throws IOException {
        try (InputStream in = GraphTextReaderTest.class.getResourceAsStream("/graphs/" + name)) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
    }

    /** The GraphML and DOT fixtures, found by listing the folder (a new fixture is checked too). */
    private static List<String> fixtures() throws IOException {
        List<String> out = new ArrayList<>();
        try (Stream<Path> files = Files.list(Path.of("src/test/resources/graphs"))) {
            files.map(p -> p.getFileName().toString()).filter(f -> f.endsWith(".graphml") || f.endsWith(".dot"))
                    .sorted().forEach(out::add);
        }
        assertTrue(out.size() >= 4, "fixtures found: " + out);
        return out;
    }

    /** Asserts that two graph files hold the same graph, attribute for attribute. */
    static void assertSameGraph(GraphFile expected, GraphFile actual, String what) {
        assertEquals(expected.format(), actual.format(), what);
        assertEquals(expected.vertexIds(), actual.vertexIds(), what + ": vertex ids in order");
        for (int i = 0; i < expected.vertexCount(); i++) {
            String v = what + ": vertex " + expected.vertexIds().get(i);
            assertEquals(expected.x(i), actual.x(i), 0, v + " x");
            assertEquals(expected.y(i), actual.y(i), 0, v + " y");
            assertEquals(expected.vertexAttributes(i), actual.vertexAttributes(i), v + " attributes");
        }
        assertEquals(expected.edges().size(), actual.edges().size(), what + ": edge count");
        for (int i = 0; i < expected.edges().size(); i++) {
            GraphFile.Link a = expected.edges().get(i);
            GraphFile.Link b = actual.edges().get(i);
            String e = what + ": edge " + i;
            assertEquals(a.u(), b.u(), e + " u");
            assertEquals(a.v(), b.v(), e + " v");
            assertEquals(a.id(), b.id(), e + " id");
            assertEquals(a.attributes(), b.attributes(), e + " attributes");
        }
        assertEquals(expected.graphAttributes(), actual.graphAttributes(), what + ": graph attributes");
    }

    /** Both readers on one text: the same graph file, and the same scenario when s and t can be had. */
    private static void agree(String text, GraphFile.Format format, String what, String literalKey) {
        GraphFile reference = GraphFormats.read(text, format, "$.graph");
        GraphFile ours = GraphTextReader.read(text, format, "$.graph");
        assertSameGraph(reference, ours, what);
        if (reference.vertexCount() < 2) {
            return;
        }
        String s = reference.vertexWith(GraphFile.ROLE, "s") == null ? reference.vertexIds().get(0) : null;
        String t = reference.vertexWith(GraphFile.ROLE, "t") == null
                ? reference.vertexIds().get(reference.vertexCount() - 1) : null;
        Scenario a = HostGraphBuilder.imported(reference, s, t, -1, literalKey, GraphFormats.WEIGHT).scenario();
        Scenario b = HostGraphBuilder.imported(ours, s, t, -1, literalKey, GraphFormats.WEIGHT).scenario();
        assertEquals(ScenarioWriter.write(a), ScenarioWriter.write(b), what + ": the scenario");
    }

    @Test
    void everyFixtureReadsAsJgraphtIoReadsIt() throws IOException {
        for (String f : fixtures()) {
            agree(resource(f), GraphFile.Format.ofFileName(f), f, null);
        }
    }

    @Test
    void theFeatureFixturesHoldWhatTheirMarkupSays() throws IOException {
        // GraphML: values decoded by XML 1.0 (W3C Recommendation, section 4.6 predefined entities,
        // 4.1 character references, 2.7 CDATA sections); data text kept as written
        GraphFile g = GraphTextReader.read(resource("harbour-features.graphml"), GraphFile.Format.GRAPHML, "$");
        assertEquals(List.of("quay & slip", "isle", "lamp", "lighthouse", "far shore"), g.vertexIds(),
                "nodes in the order their elements end, the nested graph's node before its holder");
        assertEquals("Tom's \"old\" quay \u2014 \u2192 east", g.vertexAttributes(0).get("note"));
        assertEquals("<b>rocky</b> & windy", g.vertexAttributes(1).get("note"));
        assertEquals("none", g.vertexAttributes(2).get("note"), "the key's default");
        assertEquals("white", g.vertexAttributes(3).get("note"), "text of foreign markup inside data");
        assertNull(g.vertexAttributes(3).get("unknown"), "data of an undeclared key is dropped");
        assertEquals("ferry1", g.edges().get(0).id());
        assertEquals("1.5", g.edges().get(1).attributes().get("weight"), "edge default");
        assertEquals("none", g.edges().get(3).attributes().get("note"), "empty data counts as absent");
        assertEquals(80, g.y(3), 0);
        // DOT (graphviz.org, "The DOT Language"): \" is the only escape in a quoted string
        GraphFile d = GraphTextReader.read(resource("harbour-features.dot"), GraphFile.Format.DOT, "$");
        assertEquals(List.of("quay & slip", "isle", "lighthouse", "far shore", "7", "-2.5", "buoy"), d.vertexIds());
        assertEquals("Ferries \"and\" bridges", d.graphAttributes().get("label"));
        assertEquals("harbour", d.graphAttributes().get("ID"));
        assertEquals("rocky\\nwindy", d.vertexAttributes(1).get("note"), "the backslash stays for Graphviz's label escapes");
        assertEquals("rock", d.vertexAttributes(4).get("note"), "a subgraph's node default");
        assertEquals("none", d.vertexAttributes(6).get("note"), "the subgraph's default stays in it");
        assertEquals("4", d.edges().get(5).attributes().get("weight"), "a subgraph's edge default");
        assertEquals("1.5", d.edges().get(1).attributes().get("weight"), "the graph's edge default");
        assertEquals(-40, d.y(1), 0, "pos y is upwards in Graphviz: negated");
        // both files are the same harbour: the same witness sizes (law: same network, same values)
        Scenario fromXml = HostGraphBuilder.imported(GraphTextReader.read(resource("harbour-features.graphml"),
                GraphFile.Format.GRAPHML, "$"), null, null, -1, null, "weight").scenario();
        AnalysisResult r = Analysis.run(fromXml);
        assertEquals(Boolean.TRUE, r.correct());
        // derived: one variable per edge, W+ = heaviest simple s-t path by resistance:
        // quay-isle-lighthouse-far = 2 + 0.5 + 1 = 3.5, quay-lighthouse-isle-far = 1.5 + 0.5 + 3 = 5,
        // quay-isle-far = 5, quay-lighthouse-far = 2.5: max 5
        assertEquals(5, r.maxResistance(), 1e-12);
    }

    @Test
    void exportsOfEveryBundledAndRandomScenarioReadAsJgraphtIoReadsThem() throws IOException {
        List<Scenario> scenarios = new ArrayList<>();
        try (Stream<Path> files = Files.list(Path.of("../scenarios"))) {
            for (Path p : (Iterable<Path>) files.filter(p -> p.toString().endsWith(".json")).sorted()::iterator) {
                scenarios.add(ScenarioReader.read(Files.readString(p)));
            }
        }
        Random rnd = new Random(20240917L);
        for (int i = 0; i < 12; i++) {
            scenarios.add(RandomScenarios.generate(rnd, 2 + rnd.nextInt(4), 3 + rnd.nextInt(5), 3 + rnd.nextInt(8), 0.2,
                    0.3, 0.5, 3));
        }
        assertTrue(scenarios.size() >= 15);
        for (Scenario sc : scenarios) {
            agree(GraphFormats.writeGraphML(sc), GraphFile.Format.GRAPHML, sc.title() + " (GraphML)", GraphFormats.LITERAL);
            agree(GraphFormats.writeDot(sc), GraphFile.Format.DOT, sc.title() + " (DOT)", GraphFormats.LITERAL);
        }
    }

    @Test
    void backslashesAndQuotesInIdsAndTitleComeBackAsWritten() {
        // DOT language (graphviz.org/doc/info/lang.html): in a quoted string the only escaped character
        // is the double quote; a backslash before anything else stays as it is
        // vertex ids s\1, m"x and t\"2; title back\slash "quoted" (JSON escapes below)
        String json = """
                {"format": "spanwright-scenario", "version": 1, "title": "back\\\\slash \\"quoted\\"",
                 "variables": ["a", "b"],
                 "graph": {"s": "s\\\\1", "t": "t\\\\\\"2",
                  "vertices": [{"id": "s\\\\1"}, {"id": "m\\"x"}, {"id": "t\\\\\\"2"}],
                  "edges": [{"u": "s\\\\1", "v": "m\\"x", "when": "a"}, {"u": "m\\"x", "v": "t\\\\\\"2", "when": "b"}]}}
                """;
        Scenario sc = ScenarioReader.read(json);
        assertEquals(List.of("s\\1", "m\"x", "t\\\"2"), List.of(sc.vertices().get(0).id(), sc.vertices().get(1).id(),
                sc.vertices().get(2).id()), "the scenario as meant");
        String dot = GraphFormats.writeDot(sc);
        for (GraphFile g : List.of(GraphFormats.read(dot, GraphFile.Format.DOT, "$"),
                GraphTextReader.read(dot, GraphFile.Format.DOT, "$"))) {
            assertEquals(List.of("s\\1", "m\"x", "t\\\"2"), g.vertexIds(), dot);
        }
        agree(dot, GraphFile.Format.DOT, "backslashes (DOT)", GraphFormats.LITERAL);
        agree(GraphFormats.writeGraphML(sc), GraphFile.Format.GRAPHML, "backslashes (GraphML)", GraphFormats.LITERAL);
        // a trailing backslash would escape the closing quote: refused by name, GraphML offered
        ScenarioException e = assertThrows(ScenarioException.class,
                () -> GraphFormats.writeDot(ScenarioReader.read(json.replace("s\\\\1", "z\\\\"))));
        assertTrue(e.getMessage().contains("vertex \"z\\\"") && e.getMessage().contains("GraphML"), e.getMessage());
    }

    @Test
    void smallCasesAgreeWithJgraphtIo() {
        String[] graphml = {
            "<graphml><graph edgedefault=\"directed\"><node id=\"a\"/><node id=\"b\"/><edge source=\"b\" target=\"a\"/></graph></graphml>",
            "<?xml version='1.0'?>\r\n<graphml>\r\n<key id='k' for='edge' attr.name='weight'/>\r\n<graph>"
                    + "<node id='a'/><node id='b'/><edge source='a' target='b'><data key='k'> 2 </data></edge>"
                    + "<edge source='a' target='a'/></graph></graphml>",
            "<graphml><key id='k' attr.name='note'/><key id='m' for='node'/><graph><node id='a'><data key='k'>x</data>"
                    + "<data key='m'>y</data></node><node id='b'/></graph></graphml>",
            "<graphml><key id='k' for='node' attr.name='note'/><graph><node id='a'><data key='k'>line 1\r\nline 2"
                    + "</data></node><node id='a&#x26;b'/></graph></graphml>",
            "<graphml><graph><node id='&#65;&#x42;'/><node id='tab\tand\nnewline'/></graph></graphml>",
        };
        for (String t : graphml) {
            agree(t, GraphFile.Format.GRAPHML, t, null);
        }
        String[] dot = {
            "graph { a -- b -- c -- a }",
            "digraph D { a -> b; b -> c [weight=2]; }",
            "strict graph { a -- b; a -- b }",
            "GRAPH { Node [color=red]; a; EDGE [w=1]; a -- b }",
            "graph { a -- {b c} [weight=3]; }",
            "graph { \"a\\\"b\" -- \"c\\\\d\"; e:p -- f:q:sw }",
            "graph { 1 -- 2.5 -- .5 -- -3 }",
            "graph { a [x=1]; a [x=2, y=3]; b }",
            "graph { rankdir = LR; a -- b }",
        };
        for (String t : dot) {
            agree(t, GraphFile.Format.DOT, t, null);
        }
    }

    /** The error for {@code text}: code graph-file at the given path, the place and words in the message. */
    private static void refused(String text, GraphFile.Format format, String place, String... words) {
        ScenarioException e = assertThrows(ScenarioException.class, () -> GraphTextReader.read(text, format, "$.text"),
                text);
        assertEquals("graph-file", e.code(), text);
        assertEquals("$.text", e.path(), text);
        assertTrue(e.getMessage().contains(place), text + " -> " + e.getMessage());
        for (String w : words) {
            assertTrue(e.getMessage().contains(w), text + " -> " + e.getMessage() + " (wanted: " + w + ")");
        }
    }

    @Test
    void malformedGraphMLIsRefusedWithItsPlaceAndWhatToDo() {
        GraphFile.Format f = GraphFile.Format.GRAPHML;
        refused("<graphml><graph><node id=\"a\">\n</graph></graphml>", f, "line 2, column 1", "</node>", "line 1, column 17");
        refused("<graphml>\n<graph>\n<node id=\"a\"/>", f, "line 3, column 15", "ends inside <graph>", "</graph>");
        refused("<graphml><graph><node id=a/></graph></graphml>", f, "line 1, column 26", "quotes");
        refused("<graphml><graph><node id=\"a &nbsp; b\"/></graph></graphml>", f, "line 1, column 29", "&nbsp;", "&amp;");
        refused("<graphml><graph><node id=\"AT&T\"/></graph></graphml>", f, "line 1, column 29", "&amp;");
        refused("<graphml><graph><node id=\"&#xZZ;\"/></graph></graphml>", f, "column 27", "character reference");
        refused("<graphml><graph><node id=\"a\" id=\"b\"/></graph></graphml>", f, "column 30", "twice");
        refused("<graphml><graph><node/></graph></graphml>", f, "column 17", "without id");
        refused("<graphml><graph><node id='a'/><node id='a'/></graph></graphml>", f, "column 31", "second node",
                "column 17");
        refused("<graphml><graph><node id='a'/><edge source='a' target='zz'/></graph></graphml>", f, "column 31",
                "\"zz\"", "<node id=\"zz\"/>");
        refused("<graphml><graph><node id='a'/><edge target='a'/></graph></graphml>", f, "column 31", "without source");
        refused("<graphml><graph edgedefault='sideways'/></graphml>", f, "column 10", "directed");
        refused("<graphml><graph><hyperedge/></graph></graphml>", f, "column 17", "<edge>");
        refused("<svg></svg>", f, "line 1, column 1", "not GraphML");
        refused("<graphml/><graphml/>", f, "column 11", "second root");
        refused("<graphml/>\nstray", f, "line 2, column 1", "outside the root");
        refused("<graphml><!-- open", f, "column 10", "-->");
        refused("<graphml><data><![CDATA[x</data></graphml>", f, "column 16", "]]>");
        refused("<!DOCTYPE g [<!ENTITY x 'y'>]><graphml/>", f, "column 13", "DOCTYPE");
        refused("  \n", f, "line 2, column 1", "no element");
        refused("<graphml>\r\n<graph>\r\n<node id=\"a\" <", f, "line 3, column 14", "not closed", "line 3, column 1");
        refused("<graphml><graph><node id='a'x='1'/></graph></graphml>", f, "column 29", "separate attributes");
        refused("<graphml><graph></graph></graphml></graphml>", f, "column 35", "closes nothing");
    }

    @Test
    void malformedDotIsRefusedWithItsPlaceAndWhatToDo() {
        GraphFile.Format f = GraphFile.Format.DOT;
        refused("graph {\n  a -- ;\n}", f, "line 2, column 8", "after '--'", "a -- b");
        refused("graph { a -- b", f, "column 15", "'}'");
        refused("graph { a [color] }", f, "column 17", "no value", "color=");
        refused("graph { a [color=red }", f, "column 22", "']' that closes the list opened at line 1, column 11");
        refused("graph { a [label=<b>x</b>] }", f, "column 18", "HTML", "double quotes");
        refused("graph { \"open -- b }", f, "column 9", "never ends");
        refused("graph { 1a -- b }", f, "column 9", "\"1a\"");
        refused("graph { node -- b }", f, "column 9", "keyword", "double quotes");
        refused("graph { a -- edge }", f, "column 14", "after '--'");
        refused("graph { a } graph { b }", f, "column 13", "one graph per file");
        refused("network { a }", f, "column 1", "graph or digraph", ".graphml");
        refused("graph { /* never closed", f, "column 9", "*/");
        refused("graph { a = }", f, "column 13", "a value");
        refused("graph { a @ b }", f, "column 11", "'@'");
        refused("graph { subgraph s a }", f, "column 20", "'{'");
        refused("graph { \"a\" + b }", f, "column 15", "'+'");
        StringBuilder deep = new StringBuilder("graph { ");
        for (int i = 0; i <= DotText.MAX_DEPTH; i++) {
            deep.append("{ ");
        }
        refused(deep.toString(), f, "line 1", "nested more than");
    }

    @Test
    void entitiesAndEscapesDecodeAsTheirSpecificationsSay() {
        // XML 1.0 (W3C), 4.6: the five predefined entities; 4.1: decimal and hexadecimal character
        // references, including one beyond the BMP (a surrogate pair in Java); 3.3.3: line ends
        // and tabs in an attribute value become spaces, character references keep theirs
        GraphFile g = GraphTextReader.read("<graphml><key id='n' for='node' attr.name='note'/><graph>"
                + "<node id='&lt;&gt;&amp;&quot;&apos;'><data key='n'>&#233;&#xE9;&#x1F6A2;&#10;x</data></node>"
                + "<node id=\"two\r\nlines\ttab&#9;kept\"/></graph></graphml>", GraphFile.Format.GRAPHML, "$");
        assertEquals("<>&\"'", g.vertexIds().get(0));
        assertEquals("\u00e9\u00e9\uD83D\uDEA2\nx", g.vertexAttributes(0).get("note"));
        assertEquals("two lines tab\tkept", g.vertexIds().get(1));
        // DOT: "\"" is a quote; "\\" and "\n" stay as written; backslash-newline joins lines;
        // "+" joins quoted strings (graphviz.org, "The DOT Language", IDs)
        GraphFile d = GraphTextReader.read("graph { \"say \\\"hi\\\"\" -- \"c:\\\\dir\"; \"one \\\nline\" -- \"a\" + \"b\" }",
                GraphFile.Format.DOT, "$");
        assertEquals(List.of("say \"hi\"", "c:\\\\dir", "one line", "ab"), d.vertexIds());
        // numerals and non-ASCII names are ids
        GraphFile n = GraphTextReader.read("graph { -.5 -- 3. -- Zürich_2 }", GraphFile.Format.DOT, "$");
        assertEquals(List.of("-.5", "3.", "Zürich_2"), n.vertexIds());
    }

    @Test
    void theFormatComesFromItsNameTheFileEndingOrTheText() {
        assertEquals(GraphFile.Format.DOT, GraphTextReader.formatOf("gv", "x.graphml", "", "$"));
        assertEquals(GraphFile.Format.GRAPHML, GraphTextReader.formatOf(null, "HARBOUR.XML", "", "$"));
        assertEquals(GraphFile.Format.DOT, GraphTextReader.formatOf(null, "h.gv", "", "$"));
        assertEquals(GraphFile.Format.GRAPHML, GraphTextReader.formatOf(null, "h.txt", "\uFEFF  <?xml?><graphml/>", "$"));
        assertEquals(GraphFile.Format.DOT, GraphTextReader.formatOf(null, null, "// c\n/* d */ Strict Digraph {}", "$"));
        ScenarioException e = assertThrows(ScenarioException.class,
                () -> GraphTextReader.formatOf(null, "h.txt", "hello", "$.text"));
        assertEquals("format", e.code());
        assertTrue(e.getMessage().contains(".graphml"), e.getMessage());
        e = assertThrows(ScenarioException.class, () -> GraphTextReader.formatOf("svg", null, "", "$.text"));
        assertEquals("$.format", e.path());
        e = assertThrows(ScenarioException.class, () -> GraphTextReader.read("a,b\n", GraphFile.Format.CSV, "$.text"));
        assertEquals("format", e.code());
        assertTrue(e.getMessage().contains("build host import"), e.getMessage());
    }
}
