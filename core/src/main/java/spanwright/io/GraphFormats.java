package spanwright.io;

import java.io.StringReader;
import java.io.StringWriter;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.jgrapht.Graph;
import org.jgrapht.graph.builder.GraphTypeBuilder;
import org.jgrapht.nio.Attribute;
import org.jgrapht.nio.AttributeType;
import org.jgrapht.nio.BaseEventDrivenImporter;
import org.jgrapht.nio.DefaultAttribute;
import org.jgrapht.nio.GraphImporter;
import org.jgrapht.nio.csv.CSVFormat;
import org.jgrapht.nio.csv.CSVImporter;
import org.jgrapht.nio.dot.DOTExporter;
import org.jgrapht.nio.dot.DOTImporter;
import org.jgrapht.nio.gml.GmlImporter;
import org.jgrapht.nio.graphml.GraphMLExporter;
import org.jgrapht.nio.graphml.GraphMLImporter;
import spanwright.model.Edge;
import spanwright.model.Scenario;
import spanwright.model.ScenarioException;
import spanwright.model.Vertex;

/**
 * Graph files in and out, through JGraphT's jgrapht-io module (importers and exporters by the
 * JGraphT project, https://jgrapht.org): GraphML, DOT (Graphviz), GML and CSV edge lists are read
 * into a {@link GraphFile}; a scenario's graph is written as GraphML or DOT with each edge's
 * literal and weight as attributes and s, t marked by the vertex attribute {@code role}, so networkx or Graphviz users
 * can take it back and {@code build host import} reads it again unchanged.
 *
 * <p><b>Not for the page.</b> jgrapht-io parses with ANTLR (DOT, GML) and the JDK's SAX and XML
 * transformer (GraphML), which TeaVM's class library does not provide; nothing the page calls may
 * reach this class.
 *
 * <p>Positions: GraphML and GML keep the vertex attributes {@code x} and {@code y} as they are
 * (the scenario's y grows downwards; a layout with y upwards shows mirrored). DOT's {@code pos}
 * ({@code "x,y"} or {@code "x,y!"}, points, y upwards in Graphviz) is read with y negated and
 * written the same way. CSV has no positions.
 *
 * <p>Cost: O(file size) for reading, O(|V| + |E|) for writing. Stateless: every call makes its
 * own importer or exporter.
 */
public final class GraphFormats {
    /** The attribute names Spanwright writes and reads back by default. */
    public static final String LITERAL = "literal";
    /** @see #LITERAL */
    public static final String WEIGHT = "weight";
    /** The vertex attribute that marks s and t (values {@code s}, {@code t}). */
    public static final String ROLE = GraphFile.ROLE;

    private GraphFormats() {}

    /**
     * Reads {@code text} as {@code format}.
     *
     * @param path the JSON path or argument named in errors
     * @throws ScenarioException {@code graph-file} when the text is not a graph of that format
     */
    public static GraphFile read(String text, GraphFile.Format format, String path) {
        int[] nextEdge = {0};
        Graph<String, Integer> g = GraphTypeBuilder.<String, Integer>undirected().allowingMultipleEdges(true)
                .allowingSelfLoops(true).weighted(true).edgeSupplier(() -> nextEdge[0]++).buildGraph();
        Map<String, Map<String, String>> vertexAttributes = new HashMap<>();
        Map<Integer, Map<String, String>> edgeAttributes = new HashMap<>();
        Map<String, String> graphAttributes = new LinkedHashMap<>();
        String body = text;
        String csvWeightName = null;
        boolean copied = false;
        BaseEventDrivenImporter<String, Integer> importer;
        switch (format) {
            case GRAPHML: {
                GraphMLImporter<String, Integer> i = new GraphMLImporter<>();
                i.setVertexFactory(id -> id);
                // a file's own schema location need not be reachable; yEd and others add extensions
                i.setSchemaValidation(false);
                importer = i;
                break;
            }
            case DOT: {
                DOTImporter<String, Integer> i = new DOTImporter<>();
                i.setVertexFactory(id -> id);
                importer = i;
                break;
            }
            case GML: {
                GmlImporter<String, Integer> i = new GmlImporter<>();
                i.setVertexFactory(id -> Integer.toString(id));
                importer = i;
                break;
            }
            default: {
                String[] csv = csvBody(text, path);
                body = csv[0];
                csvWeightName = csv[1];
                copied = csv[2] != null;
                CSVImporter<String, Integer> i = new CSVImporter<>(CSVFormat.EDGE_LIST, ',');
                i.setParameter(CSVFormat.Parameter.EDGE_WEIGHTS, csvWeightName != null);
                i.setVertexFactory(id -> id);
                importer = i;
            }
        }
        importer.addVertexAttributeConsumer((p, a) -> vertexAttributes
                .computeIfAbsent(p.getFirst(), k -> new LinkedHashMap<>()).put(p.getSecond(), a.getValue()));
        importer.addEdgeAttributeConsumer((p, a) -> edgeAttributes
                .computeIfAbsent(p.getFirst(), k -> new LinkedHashMap<>()).put(p.getSecond(), a.getValue()));
        importer.addGraphAttributeConsumer((k, a) -> graphAttributes.put(k, a.getValue()));
        try {
            @SuppressWarnings("unchecked")
            GraphImporter<String, Integer> gi = (GraphImporter<String, Integer>) importer;
            gi.importGraph(g, new StringReader(body));
        } catch (RuntimeException e) {
            throw new ScenarioException("graph-file", path, "this is not a graph in " + format.title() + ": "
                    + reason(e) + "; check the file, or name its format with --format (graphml, dot, gml, csv)");
        }
        List<String> ids = new ArrayList<>(g.vertexSet());
        Map<String, Integer> index = new HashMap<>();
        List<String> names = new ArrayList<>();
        List<Map<String, String>> attrs = new ArrayList<>();
        double[] x = new double[ids.size()];
        double[] y = new double[ids.size()];
        boolean labelsAreIds = format == GraphFile.Format.GML;
        Set<String> labels = new HashSet<>();
        for (int i = 0; i < ids.size(); i++) {
            Map<String, String> a = new LinkedHashMap<>(vertexAttributes.getOrDefault(ids.get(i), Map.of()));
            a.remove(GraphMLImporter.DEFAULT_VERTEX_ID_KEY);
            String label = a.get("label");
            labelsAreIds &= label != null && !label.isEmpty() && labels.add(label);
            attrs.add(a);
            index.put(ids.get(i), i);
            double[] p = GraphFile.position(format, a);
            x[i] = p[0];
            y[i] = p[1];
        }
        for (int i = 0; i < ids.size(); i++) {
            // a GML node's id is a number; networkx writes the vertex's name as its label
            names.add(labelsAreIds ? attrs.get(i).remove("label") : ids.get(i));
        }
        List<GraphFile.Link> links = new ArrayList<>();
        for (Integer e : g.edgeSet()) {
            if (copied && e > 0) {
                break;
            }
            Map<String, String> a = new LinkedHashMap<>(edgeAttributes.getOrDefault(e, Map.of()));
            String id = a.remove(GraphMLImporter.DEFAULT_VERTEX_ID_KEY);
            if (id == null) {
                // DOT's id attribute; in GraphML the edge's data "id" (JGraphT does not report the
                // XML attribute, so writeGraphML writes both)
                id = a.remove("id");
            }
            if (csvWeightName != null) {
                a.put(csvWeightName, Double.toString(g.getEdgeWeight(e)));
            }
            links.add(new GraphFile.Link(index.get(g.getEdgeSource(e)), index.get(g.getEdgeTarget(e)), id, a));
        }
        return new GraphFile(format, names, x, y, attrs, links, graphAttributes);
    }

    /** The importer's message and, when it adds something, its cause's. */
    private static String reason(Throwable e) {
        String m = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
        Throwable c = e.getCause();
        if (c != null && c.getMessage() != null && !m.contains(c.getMessage())) {
            m = m + " (" + c.getMessage() + ")";
        }
        return m;
    }

    /**
     * A CSV edge list for JGraphT's importer: one edge per line, {@code u,v} or {@code u,v,weight};
     * an optional first line {@code source,target[,NAME]} (the columns pandas writes for
     * networkx's {@code to_pandas_edgelist}) is dropped, its third column naming the weight
     * attribute. Returns the body, the weight attribute's name (null when there is no weight
     * column) and a non-null third entry when the single record was doubled.
     */
    private static String[] csvBody(String text, String path) {
        String[] lines = text.replace("\r\n", "\n").replace('\r', '\n').split("\n", -1);
        StringBuilder body = new StringBuilder();
        String weightName = null;
        int fields = -1;
        for (int i = 0; i < lines.length; i++) {
            String line = lines[i].trim();
            if (line.isEmpty()) {
                continue;
            }
            String[] parts = line.split(",", -1);
            if (fields < 0 && body.length() == 0 && parts.length >= 2 && parts[0].trim().equalsIgnoreCase("source")
                    && parts[1].trim().equalsIgnoreCase("target")) {
                if (parts.length == 3) {
                    weightName = parts[2].trim().isEmpty() ? WEIGHT : parts[2].trim();
                }
                fields = parts.length;
                if (fields > 3) {
                    throw new ScenarioException("graph-file", path, "a CSV edge list has the columns source, target and"
                            + " at most one more (the weight); the header names " + fields);
                }
                continue;
            }
            if (parts.length < 2 || parts.length > 3) {
                throw new ScenarioException("graph-file", path, "line " + (i + 1) + " of the CSV edge list has "
                        + parts.length + " field" + (parts.length == 1 ? "" : "s") + "; write one edge per line as"
                        + " u,v or u,v,weight");
            }
            if (fields < 0) {
                fields = parts.length;
            } else if (parts.length != fields) {
                throw new ScenarioException("graph-file", path, "line " + (i + 1) + " of the CSV edge list has "
                        + parts.length + " fields, earlier lines " + fields + "; give every edge a weight or none");
            }
            body.append(line).append('\n');
        }
        if (fields == 3 && weightName == null) {
            weightName = WEIGHT;
        }
        boolean single = body.length() > 0 && body.indexOf("\n") == body.length() - 1;
        if (single) {
            // JGraphT 1.5.3's CSV grammar refuses a file of one record ("mismatched input <EOF>"):
            // the record is given twice and the copy dropped after reading (see read)
            body.append(body);
        }
        return new String[] {body.toString(), weightName, single ? "copied" : null};
    }

    /** The finite number in {@code text}, or NaN (see {@link GraphFile#number}). */
    public static double number(String text) {
        return GraphFile.number(text);
    }

    /**
     * The scenario's graph as GraphML: vertex attributes {@code x}, {@code y} (when placed), edge
     * ids (as the XML attribute and as the data {@code id}), edge attributes {@code literal} (the condition as text: {@code a}, {@code !a}, {@code 1}) and
     * {@code weight} (the resistance; JGraphT leaves out 1, the key's default), vertex attribute
     * {@code role} = {@code s} or {@code t} on s and t, graph attribute {@code title}.
     * networkx reads it with {@code nx.read_graphml} (as a MultiGraph when there are parallel edges).
     */
    public static String writeGraphML(Scenario sc) {
        GraphMLExporter<Integer, Integer> x = new GraphMLExporter<>(v -> sc.vertices().get(v).id());
        // JGraphT reserves "weight" for the graph's own edge weights: the resistance goes there
        x.setExportEdgeWeights(true);
        x.setEdgeWeightAttributeName(WEIGHT);
        x.registerAttribute("title", GraphMLExporter.AttributeCategory.GRAPH, AttributeType.STRING);
        x.registerAttribute(ROLE, GraphMLExporter.AttributeCategory.NODE, AttributeType.STRING);
        x.registerAttribute("x", GraphMLExporter.AttributeCategory.NODE, AttributeType.DOUBLE);
        x.registerAttribute("y", GraphMLExporter.AttributeCategory.NODE, AttributeType.DOUBLE);
        x.registerAttribute("id", GraphMLExporter.AttributeCategory.EDGE, AttributeType.STRING);
        x.registerAttribute(LITERAL, GraphMLExporter.AttributeCategory.EDGE, AttributeType.STRING);
        x.setGraphAttributeProvider(() -> graphAttributes(sc));
        x.setVertexAttributeProvider(v -> {
            Vertex vx = sc.vertices().get(v);
            Map<String, Attribute> m = new LinkedHashMap<>();
            if (vx.hasPosition()) {
                m.put("x", DefaultAttribute.createAttribute(vx.x()));
                m.put("y", DefaultAttribute.createAttribute(vx.y()));
            }
            role(sc, v, m);
            return m;
        });
        x.setEdgeIdProvider(e -> sc.edges().get(e).id());
        x.setEdgeAttributeProvider(e -> {
            Map<String, Attribute> m = new LinkedHashMap<>();
            m.put("id", DefaultAttribute.createAttribute(sc.edges().get(e).id()));
            m.put(LITERAL, DefaultAttribute.createAttribute(sc.edges().get(e).when().toString()));
            return m;
        });
        return export(sc, (g, w) -> x.exportGraph(g, w));
    }

    /**
     * The scenario's graph in Graphviz's DOT language: an undirected {@code graph}; vertices with
     * {@code pos="x,y!"} (y negated, see the class comment) when placed, s and t drawn as double
     * circles; edges with {@code literal}, {@code weight} and a {@code label} showing the literal;
     * {@code role} on s and t; graph attribute {@code title}. Ids are quoted where DOT needs it.
     */
    public static String writeDot(Scenario sc) {
        DOTExporter<Integer, Integer> x = new DOTExporter<>(v -> dotId(sc.vertices().get(v).id()));
        x.setGraphIdProvider(() -> "spanwright");
        x.setGraphAttributeProvider(() -> {
            // JGraphT writes graph attribute values as they are: quote them as DOT strings here
            Map<String, Attribute> m = new LinkedHashMap<>();
            for (Map.Entry<String, Attribute> a : graphAttributes(sc).entrySet()) {
                m.put(a.getKey(), DefaultAttribute.createAttribute(dotString(a.getValue().getValue(), "the title")));
            }
            return m;
        });
        x.setVertexAttributeProvider(v -> {
            Vertex vx = sc.vertices().get(v);
            Map<String, Attribute> m = new LinkedHashMap<>();
            if (vx.hasPosition()) {
                double y = vx.y() == 0 ? 0 : -vx.y();
                m.put("pos", DefaultAttribute.createAttribute(plain(vx.x()) + "," + plain(y) + "!"));
            }
            if (v == sc.s() || v == sc.t()) {
                m.put("shape", DefaultAttribute.createAttribute("doublecircle"));
            }
            role(sc, v, m);
            return m;
        });
        x.setEdgeAttributeProvider(e -> {
            Edge ed = sc.edges().get(e);
            Map<String, Attribute> m = edgeAttributes(ed);
            m.put("label", DefaultAttribute.createAttribute(ed.when().toString()));
            m.put("id", DefaultAttribute.createAttribute(ed.id()));
            return m;
        });
        return export(sc, (g, w) -> x.exportGraph(g, w));
    }

    private interface Exporter {
        void write(Graph<Integer, Integer> g, StringWriter w);
    }

    /** A JGraphT multigraph of vertex and edge indices with the scenario's edges, handed to {@code exporter}. */
    private static String export(Scenario sc, Exporter exporter) {
        int[] next = {0};
        Graph<Integer, Integer> g = GraphTypeBuilder.<Integer, Integer>undirected().allowingMultipleEdges(true)
                .allowingSelfLoops(true).weighted(true).edgeSupplier(() -> next[0]++).buildGraph();
        for (int i = 0; i < sc.vertexCount(); i++) {
            g.addVertex(i);
        }
        for (Edge e : sc.edges()) {
            g.setEdgeWeight(g.addEdge(e.u(), e.v()), e.weight());
        }
        StringWriter w = new StringWriter();
        exporter.write(g, w);
        return w.toString();
    }

    private static Map<String, Attribute> graphAttributes(Scenario sc) {
        Map<String, Attribute> m = new LinkedHashMap<>();
        m.put("title", DefaultAttribute.createAttribute(sc.title()));
        return m;
    }

    private static void role(Scenario sc, int v, Map<String, Attribute> m) {
        if (v == sc.s() || v == sc.t()) {
            m.put(ROLE, DefaultAttribute.createAttribute(v == sc.s() ? "s" : "t"));
        }
    }

    private static Map<String, Attribute> edgeAttributes(Edge e) {
        Map<String, Attribute> m = new LinkedHashMap<>();
        m.put(LITERAL, DefaultAttribute.createAttribute(e.when().toString()));
        m.put(WEIGHT, DefaultAttribute.createAttribute(e.weight()));
        return m;
    }

    /** A number without a needless ".0" (full precision). */
    private static String plain(double v) {
        return v == Math.rint(v) && Math.abs(v) < 1e15 ? Long.toString((long) v) : Double.toString(v);
    }

    /** {@code id} as a DOT id: bare when it is a DOT name, otherwise quoted. */
    static String dotId(String id) {
        boolean bare = !id.isEmpty() && !(id.charAt(0) >= '0' && id.charAt(0) <= '9');
        for (int i = 0; i < id.length() && bare; i++) {
            char c = id.charAt(i);
            bare = (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9') || c == '_';
        }
        if (bare && !List.of("graph", "digraph", "node", "edge", "strict", "subgraph").contains(id.toLowerCase(
                java.util.Locale.ROOT))) {
            return id;
        }
        return dotString(id, "vertex \"" + id + "\"");
    }

    /**
     * {@code text} as a quoted DOT string. In DOT the only escape in a quoted string is {@code \"}
     * (graphviz.org/doc/info/lang.html): a backslash before anything else stays as written, so
     * backslashes are not doubled. A text ending in a backslash cannot be written (its closing
     * quote would read as escaped) and is refused, naming {@code what}.
     */
    static String dotString(String text, String what) {
        if (text.endsWith("\\")) {
            throw new ScenarioException("export", "$", what + " ends with a backslash, which DOT cannot quote:"
                    + " rename it, or export GraphML (--graphml), which can");
        }
        return "\"" + text.replace("\"", "\\\"") + "\"";
    }
}
