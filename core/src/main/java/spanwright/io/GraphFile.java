package spanwright.io;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A graph as a graph file holds it, before it becomes a scenario: vertex ids in file order with
 * their positions (NaN when the file has none) and attributes, edges in file order with their
 * end points, ids (null when the file gives none) and attributes, and the graph's own attributes.
 * Every attribute value is kept as text. Undirected: a directed file's arcs are read as edges.
 * Immutable; made by {@link GraphFormats#read} (or by hand in tests).
 */
public final class GraphFile {
    /** The vertex attribute that marks s and t (values {@code s}, {@code t}). */
    public static final String ROLE = "role";

    /** The formats {@link GraphFormats} reads. */
    public enum Format {
        GRAPHML("GraphML", ".graphml", ".xml"),
        DOT("DOT (Graphviz)", ".dot", ".gv"),
        GML("GML", ".gml"),
        CSV("CSV edge list", ".csv");

        private final String title;
        private final List<String> endings;

        Format(String title, String... endings) {
            this.title = title;
            this.endings = List.of(endings);
        }

        /** The format's name for people. */
        public String title() {
            return title;
        }

        /** File name endings that mean this format. */
        public List<String> endings() {
            return endings;
        }

        /** The format a file name's ending names (case-insensitive), or null. */
        public static Format ofFileName(String name) {
            String lower = name.toLowerCase(java.util.Locale.ROOT);
            for (Format f : values()) {
                for (String e : f.endings) {
                    if (lower.endsWith(e)) {
                        return f;
                    }
                }
            }
            return null;
        }

        /** The format named by {@code word} ({@code graphml}, {@code dot}, {@code gml}, {@code csv}), or null. */
        public static Format named(String word) {
            for (Format f : values()) {
                if (f.name().equalsIgnoreCase(word) || (f == DOT && word.equalsIgnoreCase("gv"))) {
                    return f;
                }
            }
            return null;
        }
    }

    /** One edge of the file: vertex indices, the file's id for it or null, its attributes. */
    public static final class Link {
        private final int u;
        private final int v;
        private final String id;
        private final Map<String, String> attributes;

        public Link(int u, int v, String id, Map<String, String> attributes) {
            this.u = u;
            this.v = v;
            this.id = id;
            this.attributes = Collections.unmodifiableMap(new LinkedHashMap<>(attributes));
        }

        public int u() {
            return u;
        }

        public int v() {
            return v;
        }

        /** The file's id of this edge, or null. */
        public String id() {
            return id;
        }

        /** Attribute values as text, keyed by the file's attribute names. */
        public Map<String, String> attributes() {
            return attributes;
        }
    }

    private final Format format;
    private final List<String> vertexIds;
    private final double[] x;
    private final double[] y;
    private final List<Map<String, String>> vertexAttributes;
    private final List<Link> edges;
    private final Map<String, String> graphAttributes;

    /**
     * @param x, y positions per vertex (NaN for none); copied
     */
    public GraphFile(Format format, List<String> vertexIds, double[] x, double[] y,
            List<Map<String, String>> vertexAttributes, List<Link> edges, Map<String, String> graphAttributes) {
        if (x.length != vertexIds.size() || y.length != vertexIds.size() || vertexAttributes.size() != vertexIds.size()) {
            throw new IllegalArgumentException("one position and one attribute map per vertex");
        }
        this.format = format;
        this.vertexIds = List.copyOf(vertexIds);
        this.x = x.clone();
        this.y = y.clone();
        List<Map<String, String>> va = new ArrayList<>();
        for (Map<String, String> m : vertexAttributes) {
            va.add(Collections.unmodifiableMap(new LinkedHashMap<>(m)));
        }
        this.vertexAttributes = Collections.unmodifiableList(va);
        this.edges = List.copyOf(edges);
        this.graphAttributes = Collections.unmodifiableMap(new LinkedHashMap<>(graphAttributes));
    }

    /** The format the graph was read from. */
    public Format format() {
        return format;
    }

    public List<String> vertexIds() {
        return vertexIds;
    }

    public int vertexCount() {
        return vertexIds.size();
    }

    /** x of vertex {@code i}, NaN when the file gives none. */
    public double x(int i) {
        return x[i];
    }

    /** y of vertex {@code i} (the scenario's convention: grows downwards), NaN when none. */
    public double y(int i) {
        return y[i];
    }

    public Map<String, String> vertexAttributes(int i) {
        return vertexAttributes.get(i);
    }

    public List<Link> edges() {
        return edges;
    }

    /** The graph's own attributes (GraphML's graph-level data is not read by JGraphT's importer). */
    public Map<String, String> graphAttributes() {
        return graphAttributes;
    }

    /** The finite number in {@code text} (surrounding spaces allowed), or NaN. */
    public static double number(String text) {
        if (text == null) {
            return Double.NaN;
        }
        try {
            double v = Double.parseDouble(text.trim());
            return Double.isInfinite(v) ? Double.NaN : v;
        } catch (NumberFormatException e) {
            return Double.NaN;
        }
    }

    /**
     * A vertex's position from its attributes as the file keeps it: DOT's {@code pos}, GraphML's and
     * GML's {@code x} and {@code y} (a CSV edge list has none); {@code {NaN, NaN}} when it has none
     * or only half of one. Both readers (jgrapht-io's and ours) place vertices through here.
     */
    public static double[] position(Format format, Map<String, String> attrs) {
        if (format == Format.DOT) {
            double[] pos = dotPosition(attrs.get("pos"));
            return pos != null ? pos : new double[] {Double.NaN, Double.NaN};
        }
        if (format != Format.CSV) {
            double x = number(attrs.get("x"));
            double y = number(attrs.get("y"));
            if (!Double.isNaN(x) && !Double.isNaN(y)) {
                return new double[] {x, y};
            }
        }
        return new double[] {Double.NaN, Double.NaN};
    }

    /**
     * Graphviz's {@code pos} of a node, {@code "x,y"} or {@code "x,y!"} (points, y upwards), as
     * the scenario's x and y (y grows downwards, so it is negated); null when absent or not two
     * numbers.
     */
    public static double[] dotPosition(String pos) {
        if (pos == null) {
            return null;
        }
        String p = pos.trim();
        if (p.endsWith("!")) {
            p = p.substring(0, p.length() - 1);
        }
        int comma = p.indexOf(',');
        if (comma < 0 || p.indexOf(',', comma + 1) >= 0) {
            return null;
        }
        double x = number(p.substring(0, comma));
        double y = number(p.substring(comma + 1));
        return Double.isNaN(x) || Double.isNaN(y) ? null : new double[] {x, y == 0 ? 0 : -y};
    }

    /**
     * The id of the vertex whose attribute {@code key} is {@code value} ({@code role} = {@code s}
     * as {@link GraphFormats} writes it), or null when none; {@code "?"} + the ids when several are.
     */
    public String vertexWith(String key, String value) {
        String found = null;
        for (int i = 0; i < vertexIds.size(); i++) {
            if (value.equals(vertexAttributes.get(i).get(key))) {
                if (found != null) {
                    return "?" + found + ", " + vertexIds.get(i);
                }
                found = vertexIds.get(i);
            }
        }
        return found;
    }
}
