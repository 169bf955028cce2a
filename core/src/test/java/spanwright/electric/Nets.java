package spanwright.electric;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import spanwright.model.RandomScenarios;
import spanwright.model.Scenario;

/** Test helpers: small networks built in code. */
final class Nets {
    private Nets() {}

    /** A network with every edge always present, unit weights unless given. */
    static ElectricalNetwork always(int n, int s, int t, int[][] edges, double[] weights) {
        int[] u = new int[edges.length];
        int[] v = new int[edges.length];
        double[] w = new double[edges.length];
        for (int i = 0; i < edges.length; i++) {
            u[i] = edges[i][0];
            v[i] = edges[i][1];
            w[i] = weights == null ? 1.0 : weights[i];
        }
        return new ElectricalNetwork(n, s, t, u, v, w);
    }

    static boolean[] all(int m) {
        boolean[] p = new boolean[m];
        java.util.Arrays.fill(p, true);
        return p;
    }

    /** Edges of the 3-cube on vertices 0..7 (binary labels; an edge flips one bit). */
    static int[][] cube() {
        List<int[]> e = new ArrayList<>();
        for (int a = 0; a < 8; a++) {
            for (int bit = 0; bit < 3; bit++) {
                int b = a ^ (1 << bit);
                if (a < b) {
                    e.add(new int[] {a, b});
                }
            }
        }
        return e.toArray(new int[0][]);
    }

    static int[][] complete(int n) {
        List<int[]> e = new ArrayList<>();
        for (int a = 0; a < n; a++) {
            for (int b = a + 1; b < n; b++) {
                e.add(new int[] {a, b});
            }
        }
        return e.toArray(new int[0][]);
    }

    static int[][] cycle(int n) {
        int[][] e = new int[n][];
        for (int i = 0; i < n; i++) {
            e[i] = new int[] {i, (i + 1) % n};
        }
        return e;
    }

    /**
     * A seeded random connected multigraph scenario: spanning tree + extra edges (parallel edges
     * allowed), random literals over {@code vars} variables (one in eight always present),
     * weights in [0.2, 5].
     */
    static Scenario randomScenario(Random rnd, int vars, int vertexCount, int edgeCount) {
        return RandomScenarios.generate(rnd, vars, vertexCount, edgeCount, 0.125, 0.5, 0.2, 5.0);
    }

    static boolean[] present(Scenario sc, long mask) {
        boolean[] p = new boolean[sc.edges().size()];
        for (int i = 0; i < p.length; i++) {
            p[i] = sc.edges().get(i).when().holds(mask, sc.variableCount());
        }
        return p;
    }
}
