package spanwright.reduction;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import spanwright.expr.Expr;
import spanwright.expr.ExprException;
import spanwright.expr.ExprParser;
import spanwright.model.ScenarioException;
import spanwright.io.ScenarioReader;
import spanwright.model.Condition;
import spanwright.model.ConnectivityForm;
import spanwright.model.Edge;
import spanwright.model.Promise;
import spanwright.model.Scenario;
import spanwright.model.Vertex;

/**
 * The builders' common workbench: a growing list of vertices (with positions) and edges that is
 * turned into an immutable {@link Scenario} at the end. It enforces the limits every built
 * scenario must respect so that {@code ScenarioReader} reads the written file back: at most
 * {@link ScenarioReader#MAX_ENUMERATED_VARIABLES} variables, at most {@link #MAX_EDGES} edges and
 * {@link #MAX_VERTICES} vertices, unique vertex ids. Mutable, single use.
 */
final class ScenarioDraft {
    /**
     * Largest number of edges a builder produces. A larger graph could still be analysed in
     * principle, but each input then costs seconds (a dense factorisation per input), so a
     * construction that explodes is refused with its size instead.
     */
    static final int MAX_EDGES = 20000;
    /** Largest number of vertices a builder produces (see {@link #MAX_EDGES}). */
    static final int MAX_VERTICES = 20000;

    private final List<String> ids = new ArrayList<>();
    private final List<double[]> positions = new ArrayList<>();
    private final Map<String, Integer> index = new HashMap<>();
    private final List<Edge> edges = new ArrayList<>();
    private final java.util.Set<String> edgeIds = new java.util.HashSet<>();
    /** Most variables {@link #build} accepts: the reader's limit unless widened for in-memory use. */
    private int maxVariables = ScenarioReader.MAX_ENUMERATED_VARIABLES;

    /**
     * Accepts up to {@code max} (≤ 64) variables: for scenarios that stay in memory (family
     * sweeps); a file of more than the reader's limit would not read back.
     */
    void allowVariables(int max) {
        maxVariables = max;
    }

    /** Adds a vertex with a position (NaN for none); returns its index. */
    int vertex(String id, double x, double y) {
        if (index.containsKey(id)) {
            throw new IllegalStateException("duplicate vertex id " + id);
        }
        if (ids.size() >= MAX_VERTICES) {
            throw new ScenarioException("too-large", "$", "the construction needs more than "
                    + MAX_VERTICES + " vertices, the builders' limit");
        }
        index.put(id, ids.size());
        ids.add(id);
        positions.add(new double[] {x, y});
        return ids.size() - 1;
    }

    int vertexCount() {
        return ids.size();
    }

    String id(int v) {
        return ids.get(v);
    }

    /** Index of the vertex with this id, or −1. */
    int indexOf(String id) {
        Integer i = index.get(id);
        return i == null ? -1 : i;
    }

    void move(int v, double x, double y) {
        positions.get(v)[0] = x;
        positions.get(v)[1] = y;
    }

    double x(int v) {
        return positions.get(v)[0];
    }

    double y(int v) {
        return positions.get(v)[1];
    }

    /** Adds an edge with the next automatic id {@code e1, e2, …}. */
    int edge(int u, int v, Condition when, double weight) {
        return edge("e" + (edges.size() + 1), u, v, when, weight);
    }

    /** Adds an edge; an id already taken gets primes appended until it is free. */
    int edge(String id, int u, int v, Condition when, double weight) {
        if (edges.size() >= MAX_EDGES) {
            throw new ScenarioException("too-large", "$", "the construction needs more than " + MAX_EDGES
                    + " edges, the builders' limit");
        }
        String free = id;
        while (!edgeIds.add(free)) {
            free = free + "'";
        }
        edges.add(new Edge(free, u, v, when, weight));
        return edges.size() - 1;
    }

    int edgeCount() {
        return edges.size();
    }

    /**
     * The scenario. {@code functionText} (may be null) is parsed against {@code variables}, as the
     * reader would.
     *
     * @param path JSON path or argument named when the variables are too many
     */
    Scenario build(String title, String notes, List<String> variables, String functionText, Promise promise,
            int s, int t, String path) {
        return build(title, notes, variables, functionText, null, promise, s, t, path);
    }

    /** The scenario with the connectivity form as its function. */
    Scenario build(String title, String notes, List<String> variables, ConnectivityForm connectivity,
            Promise promise, int s, int t, String path) {
        return build(title, notes, variables, null, connectivity, promise, s, t, path);
    }

    private Scenario build(String title, String notes, List<String> variables, String functionText,
            ConnectivityForm connectivity, Promise promise, int s, int t, String path) {
        if (maxVariables > ScenarioReader.MAX_ENUMERATED_VARIABLES) {
            if (variables.size() > maxVariables) {
                throw new ScenarioException("too-many-variables", path, "the construction has " + variables.size()
                        + " variables, more than the in-memory limit of " + maxVariables);
            }
        } else {
            checkVariableCount(variables.size(), path);
        }
        Expr function = null;
        if (functionText != null) {
            try {
                function = ExprParser.parse(functionText, variables);
            } catch (ExprException e) {
                throw new IllegalStateException("built function does not parse: " + e.getMessage(), e);
            }
        }
        List<Vertex> vs = new ArrayList<>(ids.size());
        for (int i = 0; i < ids.size(); i++) {
            vs.add(new Vertex(ids.get(i), positions.get(i)[0], positions.get(i)[1]));
        }
        return new Scenario(title, notes, variables, functionText, function, promise, vs, s, t, edges, null,
                connectivity);
    }

    /** Refuses more variables than the reader enumerates, naming {@code path}. */
    static void checkVariableCount(int n, String path) {
        if (n > ScenarioReader.MAX_ENUMERATED_VARIABLES) {
            throw new ScenarioException("too-many-variables", path, "the construction has " + n
                    + " variables, more than the enumeration limit of " + ScenarioReader.MAX_ENUMERATED_VARIABLES);
        }
    }
}
