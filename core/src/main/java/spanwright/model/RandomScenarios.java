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

    /**
     * A seeded random read-once AND/OR formula on {@code leaves} variables as a series–parallel
     * network (AND = series, OR = parallel, each variable one edge, all weights {@code weight}):
     * every internal node has 2–4 children and alternates between AND and OR. Function text is
     * set, so the reduction is checked.
     */
    public static Scenario readOnceFormula(Random rnd, int leaves, double weight) {
        List<Vertex> vs = new ArrayList<>();
        List<Edge> es = new ArrayList<>();
        List<String> names = new ArrayList<>();
        for (int i = 0; i < leaves; i++) {
            names.add("x" + (i + 1));
        }
        vs.add(new Vertex("s"));
        vs.add(new Vertex("t"));
        StringBuilder f = new StringBuilder();
        int[] next = {0};
        spNode(rnd, 0, 1, leaves, rnd.nextBoolean(), weight, vs, es, names, next, f);
        String text = f.toString();
        return new Scenario("read-once formula", "", names, text,
                spanwright.expr.ExprParser.parse(text, names), Promise.NONE, vs, 0, 1, es, null);
    }

    private static void spNode(Random rnd, int a, int b, int leaves, boolean and, double weight, List<Vertex> vs,
            List<Edge> es, List<String> names, int[] next, StringBuilder f) {
        if (leaves == 1) {
            int var = next[0]++;
            es.add(new Edge("e" + (es.size() + 1), a, b, Condition.literal(var, names.get(var), true), weight));
            f.append(names.get(var));
            return;
        }
        int parts = 2 + rnd.nextInt(Math.min(3, leaves - 1));
        int[] sizes = new int[parts];
        java.util.Arrays.fill(sizes, 1);
        for (int r = leaves - parts; r > 0; r--) {
            sizes[rnd.nextInt(parts)]++;
        }
        f.append('(');
        int from = a;
        for (int i = 0; i < parts; i++) {
            if (i > 0) {
                f.append(and ? " & " : " | ");
            }
            if (and) {
                int to;
                if (i == parts - 1) {
                    to = b;
                } else {
                    vs.add(new Vertex("m" + vs.size()));
                    to = vs.size() - 1;
                }
                spNode(rnd, from, to, sizes[i], false, weight, vs, es, names, next, f);
                from = to;
            } else {
                spNode(rnd, a, b, sizes[i], true, weight, vs, es, names, next, f);
            }
        }
        f.append(')');
    }
}
