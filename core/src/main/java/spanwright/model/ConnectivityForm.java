package spanwright.model;

import java.util.List;
import spanwright.expr.Expr;

/**
 * The target function "s and t are connected" of a host graph, given by structure instead of a
 * list of paths: either the scenario's own graph ({@link #OWN_GRAPH}, the form the host-graph
 * builder writes) or another graph listed in the file, over the same variables. In a scenario file
 * it is {@code "function": {"connects": "graph"}} or {@code "function": {"connects": {"s": …, "t": …,
 * "vertices": […], "edges": […]}}} (docs/scenario-format.md). Immutable.
 */
public final class ConnectivityForm {
    /** s–t connectivity of the scenario's own graph: the reduction holds by construction. */
    public static final ConnectivityForm OWN_GRAPH = new ConnectivityForm(null, -1, -1, null);

    private final List<Vertex> vertices;
    private final int s;
    private final int t;
    private final List<Edge> edges;

    private ConnectivityForm(List<Vertex> vertices, int s, int t, List<Edge> edges) {
        this.vertices = vertices;
        this.s = s;
        this.t = t;
        this.edges = edges;
    }

    /** Connectivity of a listed host graph (vertex indices into {@code vertices}). */
    public static ConnectivityForm of(List<Vertex> vertices, int s, int t, List<Edge> edges) {
        if (s == t) {
            throw new IllegalArgumentException("s and t must differ");
        }
        return new ConnectivityForm(List.copyOf(vertices), s, t, List.copyOf(edges));
    }

    /** Is this the scenario's own graph? */
    public boolean ownGraph() {
        return vertices == null;
    }

    /** The listed host graph's vertices (null for the own graph). */
    public List<Vertex> vertices() {
        return vertices;
    }

    public int s() {
        return s;
    }

    public int t() {
        return t;
    }

    /** The listed host graph's edges (null for the own graph). */
    public List<Edge> edges() {
        return edges;
    }

    /** The words shown where a function's text would be. */
    public String words() {
        return ownGraph() ? "s-t connectivity of this graph"
                : "s-t connectivity of a listed host graph (" + vertices.size() + " vertices, " + edges.size() + " edges)";
    }

    /** The function as an expression node, for the graph it names ({@code own*} when {@link #ownGraph()}). */
    public Expr.Connectivity toExpr(int ownVertexCount, int ownS, int ownT, List<Edge> ownEdges, int variableCount) {
        List<Edge> es = ownGraph() ? ownEdges : edges;
        int n = ownGraph() ? ownVertexCount : vertices.size();
        int[] u = new int[es.size()];
        int[] v = new int[es.size()];
        int[] var = new int[es.size()];
        boolean[] pos = new boolean[es.size()];
        for (int i = 0; i < u.length; i++) {
            Edge e = es.get(i);
            u[i] = e.u();
            v[i] = e.v();
            var[i] = e.when().variable();
            pos[i] = e.when().positive();
        }
        return new Expr.Connectivity(n, ownGraph() ? ownS : s, ownGraph() ? ownT : t, u, v, var, pos, variableCount,
                words());
    }
}
