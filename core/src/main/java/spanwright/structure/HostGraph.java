package spanwright.structure;

import java.util.Arrays;
import spanwright.model.ScenarioException;

/**
 * An undirected multigraph given by edge endpoints, with two distinct terminals s and t and a
 * positive finite weight (resistance) per edge. Parallel edges are separate edges; self-loops are
 * allowed (they are never on a simple path and never in a bond). Vertices are {@code 0..n−1},
 * edges {@code 0..m−1} in the order given. <b>Immutable</b>: the constructor copies its arrays.
 */
public final class HostGraph {
    private final int n;
    private final int[] u;
    private final int[] v;
    private final double[] w;
    private final int s;
    private final int t;

    /**
     * Checks and copies the edge arrays.
     *
     * @throws ScenarioException (code {@code host-graph}) when the arrays differ in length, an
     *     endpoint or terminal is out of range, s = t, or a weight is not positive and finite
     */
    public HostGraph(int vertexCount, int[] u, int[] v, double[] weight, int s, int t) {
        if (vertexCount < 2) {
            throw bad("$.graph.vertices", "a host graph needs at least 2 vertices (s and t), got " + vertexCount);
        }
        if (u == null || v == null || weight == null || u.length != v.length || u.length != weight.length) {
            throw bad("$.graph.edges", "the endpoint and weight arrays must be given and of one length");
        }
        if (s < 0 || s >= vertexCount || t < 0 || t >= vertexCount) {
            throw bad("$.graph.s", "s = " + s + " and t = " + t + " must be vertices 0.." + (vertexCount - 1));
        }
        if (s == t) {
            throw bad("$.graph.t", "s and t are the same vertex " + s + "; choose two different terminals");
        }
        for (int e = 0; e < u.length; e++) {
            if (u[e] < 0 || u[e] >= vertexCount || v[e] < 0 || v[e] >= vertexCount) {
                throw bad("$.graph.edges[" + e + "]", "edge " + e + " joins " + u[e] + " and " + v[e]
                        + ", but the vertices are 0.." + (vertexCount - 1));
            }
            if (!(weight[e] > 0) || Double.isInfinite(weight[e])) {
                throw bad("$.graph.edges[" + e + "].weight", "edge " + e + " has weight " + weight[e]
                        + "; a weight is a resistance: give a positive finite number");
            }
        }
        this.n = vertexCount;
        this.u = u.clone();
        this.v = v.clone();
        this.w = weight.clone();
        this.s = s;
        this.t = t;
    }

    private static ScenarioException bad(String path, String message) {
        return new ScenarioException("host-graph", path, message);
    }

    /**
     * The rows × cols grid of vertices, numbered row-major ({@code r·cols + c}), with unit weights,
     * s the top-left and t the bottom-right corner. Edges: each row's horizontal edges left to
     * right, then the vertical edges below it.
     */
    public static HostGraph grid(int rows, int cols) {
        if (rows < 1 || cols < 1 || rows * cols < 2) {
            throw bad("$.graph", "a grid needs at least two vertices, got " + rows + " × " + cols);
        }
        int m = rows * (cols - 1) + (rows - 1) * cols;
        int[] a = new int[m];
        int[] b = new int[m];
        int e = 0;
        for (int r = 0; r < rows; r++) {
            for (int c = 0; c + 1 < cols; c++) {
                a[e] = r * cols + c;
                b[e++] = r * cols + c + 1;
            }
            if (r + 1 < rows) {
                for (int c = 0; c < cols; c++) {
                    a[e] = r * cols + c;
                    b[e++] = (r + 1) * cols + c;
                }
            }
        }
        double[] ones = new double[m];
        Arrays.fill(ones, 1.0);
        return new HostGraph(rows * cols, a, b, ones, 0, rows * cols - 1);
    }

    /** The complete graph K_n (n ≥ 2) with unit weights, s = 0, t = n − 1; edges (i, j), i &lt; j, lexicographic. */
    public static HostGraph complete(int n) {
        if (n < 2) {
            throw bad("$.graph", "K_n needs n ≥ 2, got " + n);
        }
        int m = n * (n - 1) / 2;
        int[] a = new int[m];
        int[] b = new int[m];
        int e = 0;
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                a[e] = i;
                b[e++] = j;
            }
        }
        double[] ones = new double[m];
        Arrays.fill(ones, 1.0);
        return new HostGraph(n, a, b, ones, 0, n - 1);
    }

    /** The same graph and terminals with new weights (checked like the constructor's). */
    public HostGraph withWeights(double[] weight) {
        return new HostGraph(n, u, v, weight, s, t);
    }

    public int vertexCount() {
        return n;
    }

    public int edgeCount() {
        return u.length;
    }

    public int s() {
        return s;
    }

    public int t() {
        return t;
    }

    /** First endpoint of edge e. */
    public int u(int e) {
        return u[e];
    }

    /** Second endpoint of edge e. */
    public int v(int e) {
        return v[e];
    }

    /** Weight (resistance) of edge e. */
    public double weight(int e) {
        return w[e];
    }
}
