package spanwright.reduction;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import spanwright.expr.Expr;
import spanwright.expr.ExprException;
import spanwright.expr.ExprParser;
import spanwright.model.ScenarioException;
import spanwright.model.Edge;
import spanwright.model.Scenario;

/** Small helpers the builders share: variable lists, parsing with located errors, short texts. */
final class BuildSupport {
    private BuildSupport() {}

    /**
     * The variable list: {@code given} checked (valid, not a function name, unique), or when null
     * the variables of {@code expression} in order of first appearance.
     */
    static List<String> variables(String expression, List<String> given, String expressionPath, String variablesPath) {
        if (given == null) {
            try {
                return ExprParser.variablesOf(expression == null ? "" : expression);
            } catch (ExprException e) {
                throw located(e, expression, expressionPath);
            }
        }
        List<String> out = new ArrayList<>();
        Set<String> seen = new HashSet<>();
        for (int i = 0; i < given.size(); i++) {
            String name = given.get(i);
            String p = variablesPath + "[" + i + "]";
            if (!ExprParser.isName(name)) {
                throw new ScenarioException("variable-name", p, "\"" + name
                        + "\" is not a valid variable name (a letter or _, then letters, digits, _ or .)");
            }
            if (ExprParser.isFunctionName(name)) {
                throw new ScenarioException("variable-name", p, "\"" + name
                        + "\" is a function name of the expression language; choose another name");
            }
            if (!seen.add(name)) {
                throw new ScenarioException("duplicate-id", p, "variable \"" + name + "\" is listed twice");
            }
            out.add(name);
        }
        return out;
    }

    /** Parses against {@code variables}; a syntax error becomes a located {@link ScenarioException}. */
    static Expr parse(String expression, List<String> variables, String path) {
        try {
            return ExprParser.parse(expression == null ? "" : expression, variables);
        } catch (ExprException e) {
            throw located(e, expression, path);
        }
    }

    private static ScenarioException located(ExprException e, String text, String path) {
        return new ScenarioException("expression", path, "column " + e.column() + ": " + e.getMessage()
                + " in \"" + shorten(text) + "\"");
    }

    /**
     * A drawing for a scenario without positions: columns by graph distance from s (ignoring the
     * conditions), vertices of a column stacked in index order, unreachable vertices in a last
     * column. Breadth-first search, O(|V| + |E|).
     */
    static double[][] layeredByDistance(Scenario sc) {
        int n = sc.vertexCount();
        List<List<Integer>> adj = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            adj.add(new ArrayList<>());
        }
        for (Edge e : sc.edges()) {
            adj.get(e.u()).add(e.v());
            adj.get(e.v()).add(e.u());
        }
        int[] dist = new int[n];
        java.util.Arrays.fill(dist, -1);
        int[] queue = new int[n];
        int head = 0;
        int tail = 0;
        dist[sc.s()] = 0;
        queue[tail++] = sc.s();
        int far = 0;
        while (head < tail) {
            int v = queue[head++];
            far = Math.max(far, dist[v]);
            for (int w : adj.get(v)) {
                if (dist[w] < 0) {
                    dist[w] = dist[v] + 1;
                    queue[tail++] = w;
                }
            }
        }
        int[] columnSize = new int[far + 2];
        for (int i = 0; i < n; i++) {
            columnSize[dist[i] < 0 ? far + 1 : dist[i]]++;
        }
        int[] placed = new int[far + 2];
        double[][] xy = new double[n][];
        for (int i = 0; i < n; i++) {
            int c = dist[i] < 0 ? far + 1 : dist[i];
            xy[i] = new double[] {c * 100.0, (placed[c]++ - (columnSize[c] - 1) / 2.0) * 80.0};
        }
        return xy;
    }

    /** At most 60 characters of {@code text}, with an ellipsis when cut. */
    static String shorten(String text) {
        if (text == null) {
            return "";
        }
        return text.length() <= 60 ? text : text.substring(0, 57) + "…";
    }

    /** A count for people: digits grouped by thousands; saturated counts as "more than 10^18". */
    static String count(long v) {
        if (v >= AndOrForm.SATURATED) {
            return "more than 10^18";
        }
        String d = Long.toString(v);
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < d.length(); i++) {
            if (i > 0 && (d.length() - i) % 3 == 0) {
                sb.append(',');
            }
            sb.append(d.charAt(i));
        }
        return sb.toString();
    }
}
