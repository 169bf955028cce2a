package spanwright.structure;

import java.util.List;
import spanwright.model.Edge;
import spanwright.model.Scenario;

/**
 * The independent computation the diagram tests compare against: s–t connectivity of G(x) by
 * union–find over the present edges, one input at a time, and the translation between masks (input
 * order: variable i is bit n − 1 − i) and assignments.
 */
final class ConnectivityBruteForce {
    private ConnectivityBruteForce() {}

    /** Are s and t joined by present edges; edge i present when x[var[i]] == positive[i] or var[i] = -1. */
    static boolean connected(int vertexCount, int s, int t, int[] u, int[] v, int[] var, boolean[] positive,
            boolean[] x) {
        int[] parent = new int[vertexCount];
        for (int i = 0; i < vertexCount; i++) {
            parent[i] = i;
        }
        for (int e = 0; e < u.length; e++) {
            if (var[e] < 0 || x[var[e]] == positive[e]) {
                parent[find(parent, u[e])] = find(parent, v[e]);
            }
        }
        return find(parent, s) == find(parent, t);
    }

    /** s–t connectivity of the scenario's graph on the input {@code mask}. */
    static boolean connected(Scenario sc, long mask) {
        int n = sc.variableCount();
        int[] parent = new int[sc.vertexCount()];
        for (int i = 0; i < parent.length; i++) {
            parent[i] = i;
        }
        List<Edge> edges = sc.edges();
        for (Edge e : edges) {
            if (e.when().holds(mask, n)) {
                parent[find(parent, e.u())] = find(parent, e.v());
            }
        }
        return find(parent, sc.s()) == find(parent, sc.t());
    }

    private static int find(int[] parent, int i) {
        while (parent[i] != i) {
            i = parent[i];
        }
        return i;
    }

    static boolean[] assignment(long mask, int n) {
        boolean[] x = new boolean[n];
        for (int i = 0; i < n; i++) {
            x[i] = ((mask >>> (n - 1 - i)) & 1L) != 0;
        }
        return x;
    }

    static long mask(boolean[] x) {
        long m = 0;
        for (boolean b : x) {
            m = (m << 1) | (b ? 1 : 0);
        }
        return m;
    }

    /** Ends of the edges of the k×k grid of {@link DiagramBench#grid}, in its order: {u[], v[]}. */
    static int[][] grid(int k) {
        List<Edge> edges = DiagramBench.grid(k, false, -1).edges();
        int[] u = new int[edges.size()];
        int[] v = new int[edges.size()];
        for (int i = 0; i < u.length; i++) {
            u[i] = edges.get(i).u();
            v[i] = edges.get(i).v();
        }
        return new int[][] {u, v};
    }
}
