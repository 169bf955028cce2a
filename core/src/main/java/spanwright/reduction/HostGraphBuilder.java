package spanwright.reduction;

import spanwright.io.ScenarioReader;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.Supplier;
import org.jgrapht.Graph;
import org.jgrapht.generate.CompleteBipartiteGraphGenerator;
import org.jgrapht.generate.CompleteGraphGenerator;
import org.jgrapht.generate.GraphGenerator;
import org.jgrapht.generate.GridGraphGenerator;
import org.jgrapht.generate.HyperCubeGraphGenerator;
import org.jgrapht.generate.LinearGraphGenerator;
import org.jgrapht.generate.RingGraphGenerator;
import org.jgrapht.graph.builder.GraphTypeBuilder;
import spanwright.expr.ExprParser;
import spanwright.model.ScenarioException;
import spanwright.model.Condition;
import spanwright.model.ConnectivityForm;
import spanwright.model.Edge;
import spanwright.model.Promise;
import spanwright.model.Scenario;
import spanwright.model.Vertex;

/**
 * st-connectivity itself: a host graph H with s and t, one variable per host edge (1 = the edge is
 * present). Hosts: the named families below (generated with JGraphT's generators, except the random
 * one), or a user's graph. Variable names derive from the edge's endpoints ({@code u_v}; a second
 * parallel edge gets {@code u_v.2}). The scenario's function is s–t connectivity written as the OR
 * over the simple s–t paths of the AND of their edges, when there are at most
 * {@link #MAX_PATHS_IN_FUNCTION} paths; otherwise it is left out (the graph is then its own
 * definition) and {@code functionOmitted} says why. An optional promise "at most k edges missing"
 * becomes the Hamming-weight promise {m−k, …, m}.
 *
 * <table>
 *   <caption>Families (size parameters, vertices, default s and t)</caption>
 *   <tr><th>family</th><th>size</th><th>vertices</th><th>s, t</th></tr>
 *   <tr><td>path</td><td>n ≥ 2</td><td>v1 … vn</td><td>v1, vn</td></tr>
 *   <tr><td>cycle</td><td>n ≥ 3</td><td>v1 … vn</td><td>v1, v(⌊n/2⌋+1)</td></tr>
 *   <tr><td>grid</td><td>k × l, both ≥ 2</td><td>r1c1 … rkcl</td><td>opposite corners</td></tr>
 *   <tr><td>complete</td><td>n ≥ 2</td><td>v1 … vn</td><td>v1, vn</td></tr>
 *   <tr><td>bipartite</td><td>a × b, both ≥ 1</td><td>p1 … pa, q1 … qb</td><td>p1, qb</td></tr>
 *   <tr><td>hypercube</td><td>d ≥ 1</td><td>h0…0 … h1…1 (bit strings)</td><td>h0…0, h1…1</td></tr>
 *   <tr><td>random</td><td>n ≥ 2, m edges</td><td>v1 … vn</td><td>v1, vn</td></tr>
 * </table>
 * The random host is the uniform G(n, m) graph (m distinct vertex pairs), sampled with a
 * SplitMix64 stream from the seed. It is written here rather than taken from JGraphT's
 * {@code GnmRandomGraphGenerator} because that takes a {@code java.util.Random}, and TeaVM's
 * {@code Random} ignores its seed (checked in TeaVM's class library source), so the page would
 * build a different graph than the command line for the same seed.
 *
 * <p>A family is refused with its edge count when it has more edges than a scenario may have
 * variables ({@link spanwright.io.ScenarioReader#MAX_VARIABLES}): graphs beyond enumeration (an 8×8
 * grid, K₁₆) are built and then analysed by structure. Only with the promise "at most k edges
 * missing", which is enumerated, the limit is {@link spanwright.io.ScenarioReader#MAX_ENUMERATED_VARIABLES}.
 * Cost: O(|E| + |V|) plus the path enumeration (capped).
 * Stats: {@code family}, {@code size}, {@code s}, {@code t}, {@code paths} (number of simple s–t
 * paths, or null beyond the cap), {@code promise}.
 */
public final class HostGraphBuilder {
    /** Most simple s–t paths written into the function. */
    static final int MAX_PATHS_IN_FUNCTION = 256;
    /** Work cap of the path enumeration (steps of the depth-first search). */
    private static final int MAX_PATH_STEPS = 200000;
    private static final double GAP = 100;

    /** Names of the families, for messages and the command line. */
    public static final List<String> FAMILIES = List.of("path", "cycle", "grid", "complete", "bipartite",
            "hypercube", "random");

    private HostGraphBuilder() {}

    /** A host before variables are attached. */
    private static final class Host {
        final List<String> ids = new ArrayList<>();
        final List<double[]> xy = new ArrayList<>();
        final List<int[]> edges = new ArrayList<>();
        final List<String> edgeIds = new ArrayList<>();
        final List<Double> weights = new ArrayList<>();
        /** Each edge's condition as text ({@code a}, {@code !a}, {@code 1}), or null: one fresh variable per edge. */
        List<String> literals;
        String s;
        String t;
        String description;
    }

    /**
     * A named family.
     *
     * @param size the family's parameters (see the class comment)
     * @param s the id of s, or null for the family's default; likewise {@code t}
     * @param seed for {@code random} only
     * @param atMostMissing the promise "at most k host edges are missing", or −1 for none
     * @throws ScenarioException {@code family} ({@code $.family}), {@code size} ({@code $.size}),
     *     {@code too-many-variables}, {@code unknown-vertex} ({@code $.s}, {@code $.t}), {@code promise}
     */
    public static Built family(String family, int[] size, String s, String t, long seed, int atMostMissing) {
        Host h = generate(family, size, seed);
        return finish(h, s, t, atMostMissing, family, size);
    }

    /**
     * A user's host: the vertices, positions, edges (their ids and weights) of {@code host}; its
     * conditions are replaced by one fresh variable per edge, self-loops are dropped.
     */
    public static Built given(Scenario host, String s, String t, int atMostMissing) {
        Host h = new Host();
        for (Vertex v : host.vertices()) {
            h.ids.add(v.id());
            h.xy.add(new double[] {v.x(), v.y()});
        }
        for (Edge e : host.edges()) {
            if (!e.isSelfLoop()) {
                h.edges.add(new int[] {e.u(), e.v()});
                h.edgeIds.add(e.id());
                h.weights.add(e.weight());
            }
        }
        h.s = host.vertices().get(host.s()).id();
        h.t = host.vertices().get(host.t()).id();
        h.description = "a given graph (" + h.ids.size() + " vertices, " + h.edges.size() + " edges)";
        placeOnCircleUnlessPlaced(h);
        return finish(h, s, t, atMostMissing, "given", null);
    }

    /**
     * A host read from a graph file ({@code spanwright.io.GraphFormats} for the command line,
     * {@code spanwright.io.GraphTextReader} for the page): its vertices (positions
     * kept when every vertex has one, otherwise all on a circle), its edges (the file's edge ids
     * when given) with self-loops dropped. By default one fresh variable per edge, as
     * {@link #given}; with {@code literalKey}, each edge's condition is the text of that edge
     * attribute ({@code a}, {@code !a} or {@code 1}) and the variables are the names met, in file
     * order. The weight is the number in the attribute {@code weightKey} (1 where an edge lacks it).
     * s and t are {@code s}, {@code t}, or else the vertices whose attribute {@code role} is
     * {@code s}, {@code t} (as {@code GraphFormats} writes them). The function is the connectivity form, as for every host.
     * Cost: O(|V| + |E|) plus the capped path count of {@link #given}.
     *
     * @param s the id of s, or null for the vertex the file marks {@code role = s}; likewise {@code t}
     * @param literalKey the edge attribute holding the literal, or null for one variable per edge
     * @param weightKey the edge attribute holding the weight (resistance)
     * @throws ScenarioException {@code missing} ({@code $.s}, {@code $.t}: neither given nor in the
     *     file), {@code ambiguous} (two vertices marked alike), {@code unknown-vertex}, {@code same-s-t}, {@code weight} ({@code $.graph.edges[i]}:
     *     not a number &gt; 0), {@code literal} ({@code $.graph.edges[i]}: missing or not a literal),
     *     {@code promise} (a promise on edges missing with literals from the file)
     */
    public static Built imported(spanwright.io.GraphFile file, String s, String t, int atMostMissing,
            String literalKey, String weightKey) {
        Host h = new Host();
        for (int i = 0; i < file.vertexCount(); i++) {
            h.ids.add(file.vertexIds().get(i));
            h.xy.add(new double[] {file.x(i), file.y(i)});
        }
        if (literalKey != null) {
            h.literals = new ArrayList<>();
            if (atMostMissing >= 0) {
                throw new ScenarioException("promise", "$.atMostMissing", "\"at most k edges missing\" needs one variable"
                        + " per edge; with literals taken from the file's \"" + literalKey + "\" attribute, state a"
                        + " promise in the scenario file instead");
            }
        }
        List<spanwright.io.GraphFile.Link> links = file.edges();
        for (int i = 0; i < links.size(); i++) {
            spanwright.io.GraphFile.Link l = links.get(i);
            if (l.u() == l.v()) {
                continue;
            }
            String where = "$.graph.edges[" + i + "]";
            String name = "edge " + (l.id() != null ? "\"" + l.id() + "\" " : "") + h.ids.get(l.u()) + " – " + h.ids.get(l.v());
            double w = 1;
            String wt = l.attributes().get(weightKey);
            if (wt != null) {
                w = spanwright.io.GraphFile.number(wt);
                if (!(w > 0)) {
                    throw new ScenarioException("weight", where, name + " has " + weightKey + " = \"" + wt
                            + "\"; a weight is a resistance, a finite number > 0");
                }
            }
            if (h.literals != null) {
                String lit = l.attributes().get(literalKey);
                if (lit == null || lit.trim().isEmpty()) {
                    throw new ScenarioException("literal", where, name + " has no \"" + literalKey + "\" attribute;"
                            + " give every edge one (a, !a or 1), or import with one variable per edge (no literal attribute:"
                            + " leave out --literal-key)");
                }
                h.literals.add(lit.trim());
            }
            h.edges.add(new int[] {l.u(), l.v()});
            h.edgeIds.add(l.id());
            h.weights.add(w);
        }
        h.s = file.vertexWith(spanwright.io.GraphFile.ROLE, "s");
        h.t = file.vertexWith(spanwright.io.GraphFile.ROLE, "t");
        for (String[] end : new String[][] {{"s", s, h.s}, {"t", t, h.t}}) {
            if (end[1] == null && end[2] != null && end[2].startsWith("?")) {
                throw new ScenarioException("ambiguous", "$." + end[0], "vertices " + end[2].substring(1) + " are both"
                        + " marked role = " + end[0] + " in the file; name " + end[0] + " with --" + end[0] + " ID");
            }
        }
        if (s == null && h.s == null) {
            throw new ScenarioException("missing", "$.s", "the graph file does not say which vertex is s; name it with"
                    + " --s ID (vertices: " + sample(h.ids) + ")");
        }
        if (t == null && h.t == null) {
            throw new ScenarioException("missing", "$.t", "the graph file does not say which vertex is t; name it with"
                    + " --t ID (vertices: " + sample(h.ids) + ")");
        }
        h.description = "a " + file.format().title() + " graph (" + h.ids.size() + " vertices, " + h.edges.size()
                + " edges)";
        placeOnCircleUnlessPlaced(h);
        return finish(h, s, t, atMostMissing, "import", null);
    }

    private static void placeOnCircleUnlessPlaced(Host h) {
        boolean placed = true;
        for (double[] p : h.xy) {
            placed &= !Double.isNaN(p[0]) && !Double.isNaN(p[1]);
        }
        if (!placed) {
            circle(h);
        }
    }

    private static int param(int[] size, int i, int arity, String family) {
        if (size == null || size.length != arity) {
            throw new ScenarioException("size", "$.size", family + " takes " + (arity == 1 ? "one size" : "two sizes")
                    + " (" + sizeHelp(family) + ")" + (size == null ? "" : ", got " + size.length));
        }
        return size[i];
    }

    private static String sizeHelp(String family) {
        switch (family) {
            case "path":
            case "cycle":
            case "complete":
                return "the number of vertices n";
            case "grid":
                return "rows × columns, e.g. 3x4";
            case "bipartite":
                return "the two side sizes a × b";
            case "hypercube":
                return "the dimension d";
            default:
                return "vertices × edges, e.g. 8x12";
        }
    }

    private static void require(boolean ok, String family, String what) {
        if (!ok) {
            throw new ScenarioException("size", "$.size", family + ": " + what);
        }
    }

    private static Host generate(String family, int[] size, long seed) {
        if (family == null || !FAMILIES.contains(family)) {
            throw new ScenarioException("family", "$.family", "unknown host family \"" + family + "\" (known: "
                    + String.join(", ", FAMILIES) + ", or a given graph)");
        }
        Host h = new Host();
        long edgeCount;
        int n;
        switch (family) {
            case "path":
                n = param(size, 0, 1, family);
                require(n >= 2, family, "needs at least 2 vertices, got " + n);
                edgeCount = n - 1L;
                break;
            case "cycle":
                n = param(size, 0, 1, family);
                require(n >= 3, family, "needs at least 3 vertices, got " + n);
                edgeCount = n;
                break;
            case "complete":
                n = param(size, 0, 1, family);
                require(n >= 2, family, "needs at least 2 vertices, got " + n);
                edgeCount = (long) n * (n - 1) / 2;
                break;
            case "grid": {
                int k = param(size, 0, 2, family);
                int l = param(size, 1, 2, family);
                require(k >= 2 && l >= 2, family, "needs at least 2 rows and 2 columns, got " + k + "x" + l
                        + (k == 1 || l == 1 ? " (a single row is a path)" : ""));
                edgeCount = (long) k * (l - 1) + (long) l * (k - 1);
                n = k * l;
                break;
            }
            case "bipartite": {
                int a = param(size, 0, 2, family);
                int b = param(size, 1, 2, family);
                require(a >= 1 && b >= 1, family, "needs at least one vertex on each side, got " + a + "x" + b);
                edgeCount = (long) a * b;
                n = a + b;
                break;
            }
            case "hypercube": {
                int dim = param(size, 0, 1, family);
                require(dim >= 1, family, "needs dimension at least 1, got " + dim);
                edgeCount = dim >= 40 ? Long.MAX_VALUE : (long) dim << (dim - 1);
                n = dim;
                break;
            }
            default: { // random
                n = param(size, 0, 2, family);
                int m = param(size, 1, 2, family);
                require(n >= 2, family, "needs at least 2 vertices, got " + n);
                require(n <= ScenarioDraft.MAX_VERTICES, family, "at most " + ScenarioDraft.MAX_VERTICES + " vertices, got " + n);
                long pairs = (long) n * (n - 1) / 2;
                require(m >= 1 && m <= pairs, family, "the number of edges must be between 1 and n(n-1)/2 = " + pairs
                        + " for n = " + n + ", got " + m);
                edgeCount = m;
            }
        }
        if (edgeCount > spanwright.io.ScenarioReader.MAX_VARIABLES) {
            throw new ScenarioException("too-many-variables", "$.size", family + " " + show(size) + " has "
                    + (edgeCount == Long.MAX_VALUE ? "too many" : Long.toString(edgeCount)) + " edges, so "
                    + "as many variables, more than the limit of " + spanwright.io.ScenarioReader.MAX_VARIABLES
                    + "; choose a smaller size");
        }
        h.description = family + " " + show(size);
        if (family.equals("random")) {
            randomHost(h, n, (int) edgeCount, seed);
            return h;
        }
        int[] next = {0};
        Supplier<Integer> vertexSupplier = () -> next[0]++;
        int[] nextEdge = {0};
        Supplier<Integer> edgeSupplier = () -> nextEdge[0]++;
        Graph<Integer, Integer> g = GraphTypeBuilder.<Integer, Integer>undirected().allowingMultipleEdges(false)
                .allowingSelfLoops(false).vertexSupplier(vertexSupplier).edgeSupplier(edgeSupplier).buildGraph();
        Map<String, Integer> roles = new HashMap<>();
        GraphGenerator<Integer, Integer, Integer> gen;
        switch (family) {
            case "path":
                gen = new LinearGraphGenerator<>(n);
                break;
            case "cycle":
                gen = new RingGraphGenerator<>(n);
                break;
            case "complete":
                gen = new CompleteGraphGenerator<>(n);
                break;
            case "grid":
                gen = new GridGraphGenerator<>(size[0], size[1]);
                break;
            case "bipartite":
                gen = new CompleteBipartiteGraphGenerator<>(size[0], size[1]);
                break;
            default:
                gen = new HyperCubeGraphGenerator<>(size[0]);
        }
        gen.generateGraph(g, roles);
        int count = g.vertexSet().size();
        String[] names = new String[count];
        double[][] xy = new double[count][];
        switch (family) {
            case "grid": // vertices are created row by row, left to right
                for (int i = 0; i < count; i++) {
                    int r = i / size[1];
                    int c = i % size[1];
                    names[i] = "r" + (r + 1) + "c" + (c + 1);
                    xy[i] = new double[] {c * GAP, r * GAP};
                }
                h.s = names[0];
                h.t = names[count - 1];
                break;
            case "bipartite": // the first side is created first
                for (int i = 0; i < count; i++) {
                    boolean first = i < size[0];
                    int k = first ? i : i - size[0];
                    names[i] = (first ? "p" : "q") + (k + 1);
                    int side = first ? size[0] : size[1];
                    xy[i] = new double[] {first ? 0 : 2 * GAP, (k - (side - 1) / 2.0) * GAP};
                }
                h.s = "p1";
                h.t = "q" + size[1];
                break;
            case "hypercube": { // the generator names each vertex by its bit string
                int dim = size[0];
                for (Map.Entry<String, Integer> e : roles.entrySet()) {
                    String bits = e.getKey();
                    int i = e.getValue();
                    names[i] = "h" + bits;
                    double x = 0;
                    double y = 0;
                    for (int b = 0; b < dim; b++) {
                        if (bits.charAt(b) == '1') {
                            double angle = Math.PI * b / dim;
                            double len = GAP * (1 + 0.3 * b);
                            x += len * Math.cos(angle);
                            y += len * Math.sin(angle);
                        }
                    }
                    xy[i] = new double[] {x, y};
                }
                StringBuilder zeros = new StringBuilder("h");
                StringBuilder ones = new StringBuilder("h");
                for (int b = 0; b < dim; b++) {
                    zeros.append('0');
                    ones.append('1');
                }
                h.s = zeros.toString();
                h.t = ones.toString();
                break;
            }
            default: // path, cycle, complete: v1 … vn in creation order
                for (int i = 0; i < count; i++) {
                    names[i] = "v" + (i + 1);
                }
                h.s = "v1";
                h.t = family.equals("cycle") ? "v" + (count / 2 + 1) : "v" + count;
                if (family.equals("path")) {
                    for (int i = 0; i < count; i++) {
                        xy[i] = new double[] {i * GAP, 0};
                    }
                }
        }
        for (int i = 0; i < count; i++) {
            h.ids.add(names[i]);
            h.xy.add(xy[i] == null ? new double[] {Double.NaN, Double.NaN} : xy[i]);
        }
        List<int[]> pairs = new ArrayList<>();
        for (Integer e : g.edgeSet()) {
            int u = g.getEdgeSource(e);
            int v = g.getEdgeTarget(e);
            pairs.add(new int[] {Math.min(u, v), Math.max(u, v)});
        }
        pairs.sort((a, b) -> a[0] != b[0] ? Integer.compare(a[0], b[0]) : Integer.compare(a[1], b[1]));
        for (int[] p : pairs) {
            h.edges.add(p);
            h.edgeIds.add(null);
            h.weights.add(1.0);
        }
        if (family.equals("cycle") || family.equals("complete")) {
            circle(h);
        }
        return h;
    }

    private static String show(int[] size) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < size.length; i++) {
            sb.append(i > 0 ? "x" : "").append(size[i]);
        }
        return sb.toString();
    }

    /** Uniform G(n, m): m distinct pairs, from a SplitMix64 stream (see the class comment). */
    private static void randomHost(Host h, int n, int m, long seed) {
        long[] state = {seed};
        long pairs = (long) n * (n - 1) / 2;
        Set<Long> chosen = new HashSet<>();
        List<int[]> picked = new ArrayList<>();
        boolean complement = m > pairs / 2;
        long want = complement ? pairs - m : m;
        while (chosen.size() < want) {
            long p = (splitMix(state) >>> 1) % pairs;
            chosen.add(p);
        }
        for (long p = 0, u = 0; u < n; u++) {
            for (long v = u + 1; v < n; v++, p++) {
                if (chosen.contains(p) != complement) {
                    picked.add(new int[] {(int) u, (int) v});
                }
            }
        }
        for (int i = 0; i < n; i++) {
            h.ids.add("v" + (i + 1));
            h.xy.add(new double[] {Double.NaN, Double.NaN});
        }
        for (int[] p : picked) {
            h.edges.add(p);
            h.edgeIds.add(null);
            h.weights.add(1.0);
        }
        h.s = "v1";
        h.t = "v" + n;
        circle(h);
    }

    /** SplitMix64 (Steele, Lea &amp; Flood, OOPSLA 2014): the next value of the stream. */
    static long splitMix(long[] state) {
        return spanwright.model.SeededRandom.mix(state);
    }

    /** Vertices on a circle, in order, the first at the left. */
    private static void circle(Host h) {
        int n = h.ids.size();
        double r = Math.max(GAP, n * GAP / (2 * Math.PI));
        for (int i = 0; i < n; i++) {
            double a = Math.PI + 2 * Math.PI * i / n;
            h.xy.set(i, new double[] {r * Math.cos(a), r * Math.sin(a)});
        }
    }

    private static Built finish(Host h, String sId, String tId, int atMostMissing, String family, int[] size) {
        String sName = sId == null ? h.s : sId;
        String tName = tId == null ? h.t : tId;
        int s = h.ids.indexOf(sName);
        int t = h.ids.indexOf(tName);
        if (s < 0) {
            throw new ScenarioException("unknown-vertex", "$.s", "s = \"" + sName + "\" is not a vertex of " + h.description
                    + " (vertices: " + sample(h.ids) + ")");
        }
        if (t < 0) {
            throw new ScenarioException("unknown-vertex", "$.t", "t = \"" + tName + "\" is not a vertex of " + h.description
                    + " (vertices: " + sample(h.ids) + ")");
        }
        if (s == t) {
            throw new ScenarioException("same-s-t", "$.t", "s and t are the same vertex \"" + sName + "\"; they must differ");
        }
        int m = h.edges.size();
        ScenarioDraft d = new ScenarioDraft();
        for (int i = 0; i < h.ids.size(); i++) {
            d.vertex(h.ids.get(i), h.xy.get(i)[0], h.xy.get(i)[1]);
        }
        List<String> vars = new ArrayList<>();
        Set<String> used = new HashSet<>();
        Set<String> edgeIds = new HashSet<>();
        if (h.literals != null) {
            given(h, d, vars);
        }
        for (int i = 0; i < m && h.literals == null; i++) {
            int[] e = h.edges.get(i);
            String base = sanitize(h.ids.get(e[0])) + "_" + sanitize(h.ids.get(e[1]));
            String name = base;
            for (int k = 2; used.contains(name) || ExprParser.isFunctionName(name); k++) {
                name = base + "." + k;
            }
            used.add(name);
            vars.add(name);
            String id = h.edgeIds.get(i) == null ? name : h.edgeIds.get(i);
            edgeIds.add(id);
            d.edge(id, e[0], e[1], Condition.literal(i, name, true), h.weights.get(i));
        }
        Promise promise = Promise.NONE;
        String promiseText = "all inputs";
        if (atMostMissing >= 0) {
            if (atMostMissing > m) {
                throw new ScenarioException("promise", "$.atMostMissing", "at most " + atMostMissing
                        + " edges missing is no promise: the host has only " + m + " edges");
            }
            int[] weights = new int[atMostMissing + 1];
            for (int k = 0; k <= atMostMissing; k++) {
                weights[k] = m - atMostMissing + k;
            }
            promise = Promise.weights(weights);
            promiseText = "at most " + atMostMissing + " of the " + m + " edges missing";
        }
        // the number of simple s-t paths, a statistic only (capped); the function is the
        // connectivity form, never a list of paths
        List<List<Integer>> paths = simplePaths(h.ids.size(), h.edges, s, t);
        Map<String, Object> stats = new LinkedHashMap<>();
        stats.put("family", family);
        if (size != null) {
            List<Object> sz = new ArrayList<>();
            for (int x : size) {
                sz.add(x);
            }
            stats.put("size", sz);
        }
        stats.put("s", sName);
        stats.put("t", tName);
        stats.put("paths", paths == null ? null : (Object) paths.size());
        stats.put("promise", promiseText);
        String title = "st-connectivity on " + h.description + ", s = " + sName + ", t = " + tName;
        String notes = (h.literals == null ? "One variable per host edge (1 = the edge is present)."
                : "Each edge's literal as the file gives it.") + " The function is s-t connectivity"
                + " of this graph." + (atMostMissing >= 0 ? " Promise: " + promiseText + "." : "");
        d.allowVariables(atMostMissing >= 0 ? spanwright.io.ScenarioReader.MAX_ENUMERATED_VARIABLES
                : spanwright.io.ScenarioReader.MAX_VARIABLES);
        Scenario sc = d.build(title, notes, vars, ConnectivityForm.OWN_GRAPH, promise, s, t, "$.size");
        return new Built(sc, stats);
    }

    /**
     * Edges with the conditions the host lists ({@link Host#literals}); the variables are the
     * names met, in edge order. Each text is read as the scenario reader reads an edge's {@code when}.
     */
    private static void given(Host h, ScenarioDraft d, List<String> vars) {
        for (int i = 0; i < h.literals.size(); i++) {
            String lit = h.literals.get(i);
            String name = lit.startsWith("!") ? lit.substring(1).trim() : lit;
            if (!name.equals("1") && !vars.contains(name) && ExprParser.isName(name) && !ExprParser.isFunctionName(name)) {
                vars.add(name);
            }
        }
        for (int i = 0; i < h.literals.size(); i++) {
            int[] e = h.edges.get(i);
            Condition when = ScenarioReader.condition(h.literals.get(i), vars, "$.graph.edges[" + i + "]");
            String id = h.edgeIds.get(i) == null ? "e" + (i + 1) : h.edgeIds.get(i);
            d.edge(id, e[0], e[1], when, h.weights.get(i));
        }
    }

    private static String sample(List<String> ids) {
        return ids.size() <= 8 ? String.join(", ", ids)
                : String.join(", ", ids.subList(0, 8)) + ", … (" + ids.size() + " in all)";
    }

    /** A valid variable-name piece from a vertex id. */
    private static String sanitize(String id) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < id.length(); i++) {
            char c = id.charAt(i);
            boolean ok = (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9') || c == '_';
            sb.append(ok ? c : '_');
        }
        if (sb.length() == 0 || !((sb.charAt(0) >= 'a' && sb.charAt(0) <= 'z') || (sb.charAt(0) >= 'A' && sb.charAt(0) <= 'Z')
                || sb.charAt(0) == '_')) {
            sb.insert(0, 'v');
        }
        return sb.toString();
    }

    /**
     * The simple s–t paths as lists of edge indices, by depth-first search; null when there are
     * more than {@link #MAX_PATHS_IN_FUNCTION} or the search exceeds its work cap.
     */
    static List<List<Integer>> simplePaths(int vertexCount, List<int[]> edges, int s, int t) {
        List<List<int[]>> adj = new ArrayList<>();
        for (int i = 0; i < vertexCount; i++) {
            adj.add(new ArrayList<>());
        }
        for (int i = 0; i < edges.size(); i++) {
            int[] e = edges.get(i);
            adj.get(e[0]).add(new int[] {e[1], i});
            adj.get(e[1]).add(new int[] {e[0], i});
        }
        List<List<Integer>> out = new ArrayList<>();
        boolean[] onPath = new boolean[vertexCount];
        List<Integer> path = new ArrayList<>();
        int[] steps = {0};
        onPath[s] = true;
        boolean complete = search(adj, s, t, onPath, path, out, steps);
        return complete ? out : null;
    }

    private static boolean search(List<List<int[]>> adj, int v, int t, boolean[] onPath, List<Integer> path,
            List<List<Integer>> out, int[] steps) {
        for (int[] next : adj.get(v)) {
            if (++steps[0] > MAX_PATH_STEPS) {
                return false;
            }
            int w = next[0];
            if (onPath[w]) {
                continue;
            }
            path.add(next[1]);
            if (w == t) {
                if (out.size() == MAX_PATHS_IN_FUNCTION) {
                    return false;
                }
                out.add(new ArrayList<>(path));
            } else {
                onPath[w] = true;
                boolean ok = search(adj, w, t, onPath, path, out, steps);
                onPath[w] = false;
                if (!ok) {
                    return false;
                }
            }
            path.remove(path.size() - 1);
        }
        return true;
    }
}
