package spanwright.structure;

import java.util.List;
import spanwright.model.Edge;
import spanwright.model.Scenario;

/**
 * A scenario's edges as parallel arrays, the form the structural methods take: endpoints, weight,
 * the literal's variable (−1 for always present) and polarity. Arrays are fresh copies.
 */
public record EdgeArrays(int[] u, int[] v, double[] weight, int[] variable, boolean[] positive) {
    /** The edges of {@code sc}, in file order. O(|E|). */
    public static EdgeArrays of(Scenario sc) {
        List<Edge> edges = sc.edges();
        int m = edges.size();
        EdgeArrays a = new EdgeArrays(new int[m], new int[m], new double[m], new int[m], new boolean[m]);
        for (int i = 0; i < m; i++) {
            Edge e = edges.get(i);
            a.u[i] = e.u();
            a.v[i] = e.v();
            a.weight[i] = e.weight();
            a.variable[i] = e.when().variable();
            a.positive[i] = e.when().positive();
        }
        return a;
    }
}
