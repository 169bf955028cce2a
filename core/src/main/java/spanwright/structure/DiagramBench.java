package spanwright.structure;

import java.io.PrintStream;
import java.util.ArrayList;
import java.util.List;
import spanwright.io.NumberText;
import spanwright.model.Condition;
import spanwright.model.Edge;
import spanwright.model.Scenario;
import spanwright.model.Vertex;

/**
 * Speed of the reduction check without enumeration ({@link DiagramCheck}) on k×k grids with one
 * variable per edge, numbered as {@code build host grid kxk} numbers them (vertices row by row,
 * edges sorted by their ends: right, then down). Each grid is checked against its own
 * connectivity written as a second graph, the same edges listed in reverse order over vertices
 * numbered backwards with s and t swapped (so the check must hold), and against that second graph
 * with one edge's literal negated (so it must fail). One core, one run per row, no warm-up: the
 * times include the JIT.
 */
public final class DiagramBench {
    private DiagramBench() {}

    public static void main(String[] args) {
        int[] sizes = {6, 7, 8};
        if (args.length > 0) {
            sizes = new int[args.length];
            for (int i = 0; i < args.length; i++) {
                sizes[i] = Integer.parseInt(args[i]);
            }
        }
        run(sizes, DiagramCheck.DEFAULT_NODE_BUDGET, System.out);
    }

    /** Prints one table row per size and function; see the class comment. */
    public static void run(int[] sizes, long budget, PrintStream out) {
        out.println("reduction check by decision diagrams, k×k grid, one variable per edge (budget "
                + budget + " nodes)");
        out.println(pad("grid", 6) + pad("vars", 6) + pad("f", 22) + pad("graph nodes", 13)
                + pad("f nodes", 10) + pad("counterexamples", 34) + "seconds");
        for (int k : sizes) {
            Scenario grid = grid(k, false, -1);
            for (int wrong = -1; wrong <= 0; wrong++) {
                Scenario host = grid(k, true, wrong < 0 ? -1 : grid.edges().size() / 2);
                long start = System.nanoTime();
                DiagramCheck.Result r = DiagramCheck.checkAgainstConnectivity(grid, host, budget);
                double seconds = (System.nanoTime() - start) / 1e9;
                out.println(pad(k + "x" + k, 6) + pad(Integer.toString(grid.variableCount()), 6)
                        + pad(wrong < 0 ? "its own connectivity" : "one literal negated", 22)
                        + pad(Long.toString(r.graphNodes()), 13) + pad(Long.toString(r.functionNodes()), 10)
                        + pad(r.status() == DiagramCheck.Status.CHECKED ? r.counterexamples().toString()
                                : r.status().name(), 34)
                        + NumberText.sig(seconds, 3));
            }
        }
    }

    /**
     * The k×k grid of {@code build host grid}; with {@code reversed} the same graph with its
     * edges listed in reverse order, vertices numbered backwards and s, t swapped; the edge at
     * {@code negate} (in the unreversed order; −1 for none) gets the negated literal.
     */
    static Scenario grid(int k, boolean reversed, int negate) {
        int count = k * k;
        List<String> names = new ArrayList<>();
        List<int[]> pairs = new ArrayList<>();
        for (int i = 0; i < count; i++) {
            int r = i / k;
            int c = i % k;
            if (c + 1 < k) {
                pairs.add(new int[] {i, i + 1});
                names.add("r" + (r + 1) + "c" + (c + 1) + "_r" + (r + 1) + "c" + (c + 2));
            }
            if (r + 1 < k) {
                pairs.add(new int[] {i, i + k});
                names.add("r" + (r + 1) + "c" + (c + 1) + "_r" + (r + 2) + "c" + (c + 1));
            }
        }
        List<Vertex> vertices = new ArrayList<>();
        for (int i = 0; i < count; i++) {
            int at = reversed ? count - 1 - i : i;
            vertices.add(new Vertex("r" + (at / k + 1) + "c" + (at % k + 1)));
        }
        List<Edge> edges = new ArrayList<>();
        int m = pairs.size();
        for (int j = 0; j < m; j++) {
            int e = reversed ? m - 1 - j : j;
            int[] p = pairs.get(e);
            int u = reversed ? count - 1 - p[1] : p[0];
            int v = reversed ? count - 1 - p[0] : p[1];
            edges.add(new Edge(names.get(e), u, v, Condition.literal(e, names.get(e), e != negate), 1.0));
        }
        // index 0 is the top-left corner, or the bottom-right one when reversed: s and t swap
        return new Scenario("grid " + k + "x" + k, "", names, null, null, null, vertices, 0, count - 1, edges,
                null);
    }

    private static String pad(String s, int width) {
        StringBuilder sb = new StringBuilder(s);
        while (sb.length() < width) {
            sb.append(' ');
        }
        return sb.append(' ').toString();
    }
}
