package spanwright.model;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;

/**
 * Seeded random scenarios for benchmarks and tests: a random spanning tree (vertex i+1 joined to a
 * random earlier vertex) plus random extra edges (parallel edges allowed, no self-loops); s is the
 * first vertex, t the last. Conditions: with probability {@code alwaysShare} the edge is always
 * present, otherwise a random variable, negated with probability {@code negatedShare}. Weights
 * uniform in [minWeight, maxWeight]. Variables are named x1, x2, …; no function, no promise.
 */
public final class RandomScenarios {
    private RandomScenarios() {}

    public static Scenario generate(Random rnd, int vars, int vertexCount, int edgeCount, double alwaysShare,
            double negatedShare, double minWeight, double maxWeight) {
        List<String> names = new ArrayList<>();
        for (int i = 0; i < vars; i++) {
            names.add("x" + (i + 1));
        }
        List<Vertex> vs = new ArrayList<>();
        for (int i = 0; i < vertexCount; i++) {
            vs.add(new Vertex("v" + i));
        }
        List<Edge> es = new ArrayList<>();
        for (int i = 0; i < edgeCount; i++) {
            int u;
            int v;
            if (i < vertexCount - 1) {
                u = i + 1;
                v = rnd.nextInt(i + 1);
            } else {
                u = rnd.nextInt(vertexCount);
                do {
                    v = rnd.nextInt(vertexCount);
                } while (v == u);
            }
            Condition c;
            if (rnd.nextDouble() < alwaysShare) {
                c = Condition.ALWAYS;
            } else {
                int var = rnd.nextInt(vars);
                c = Condition.literal(var, names.get(var), rnd.nextDouble() >= negatedShare);
            }
            es.add(new Edge("e" + (i + 1), u, v, c, minWeight + (maxWeight - minWeight) * rnd.nextDouble()));
        }
        return new Scenario("random", "", names, null, null, Promise.NONE, vs, 0, vertexCount - 1, es, null);
    }
}
