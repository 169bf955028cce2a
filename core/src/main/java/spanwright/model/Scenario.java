package spanwright.model;

import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import spanwright.expr.Expr;

/**
 * An st-connectivity instance over Boolean variables: a multigraph with distinguished vertices s
 * and t, each edge carrying a presence condition and a weight (a resistance), an optional target
 * function and an optional promise. Immutable; built by {@code spanwright.io.ScenarioReader} (which
 * validates) or by the builders.
 */
public final class Scenario {
    private final String title;
    private final String notes;
    private final List<String> variables;
    private final String functionText;
    private final Expr function;
    private final Promise promise;
    private final List<Vertex> vertices;
    private final int s;
    private final int t;
    private final List<Edge> edges;
    private final List<String> warnings;
    private final Map<String, Integer> vertexIndex;
    private final ConnectivityForm connectivity;

    public Scenario(String title, String notes, List<String> variables, String functionText,
            Expr function, Promise promise, List<Vertex> vertices, int s, int t, List<Edge> edges,
            List<String> warnings) {
        this(title, notes, variables, functionText, function, promise, vertices, s, t, edges, warnings, null);
    }

    /**
     * A scenario whose target function is the s–t connectivity form {@code connectivity} (which
     * replaces {@code functionText} and {@code function} when not null).
     */
    public Scenario(String title, String notes, List<String> variables, String functionText,
            Expr function, Promise promise, List<Vertex> vertices, int s, int t, List<Edge> edges,
            List<String> warnings, ConnectivityForm connectivity) {
        if (s == t) {
            throw new IllegalArgumentException("s and t must differ");
        }
        this.title = title == null ? "" : title;
        this.notes = notes == null ? "" : notes;
        this.variables = List.copyOf(variables);
        this.connectivity = connectivity;
        this.functionText = connectivity == null ? functionText : connectivity.words();
        this.function = connectivity == null ? function
                : connectivity.toExpr(vertices.size(), s, t, edges, variables.size());
        this.promise = promise == null ? Promise.NONE : promise;
        this.vertices = List.copyOf(vertices);
        this.s = s;
        this.t = t;
        this.edges = List.copyOf(edges);
        this.warnings = warnings == null ? List.of() : List.copyOf(warnings);
        Map<String, Integer> idx = new HashMap<>();
        for (int i = 0; i < this.vertices.size(); i++) {
            idx.put(this.vertices.get(i).id(), i);
        }
        this.vertexIndex = Collections.unmodifiableMap(idx);
    }

    public String title() {
        return title;
    }

    public String notes() {
        return notes;
    }

    public List<String> variables() {
        return variables;
    }

    public int variableCount() {
        return variables.size();
    }

    /** The target function's text, or null when none is given. */
    public String functionText() {
        return functionText;
    }

    /** The target function, or null when none is given. */
    public Expr function() {
        return function;
    }

    /**
     * The target function's structural form (s–t connectivity of a host graph), or null when the
     * function is an expression or absent.
     */
    public ConnectivityForm connectivity() {
        return connectivity;
    }

    public Promise promise() {
        return promise;
    }

    public List<Vertex> vertices() {
        return vertices;
    }

    public int vertexCount() {
        return vertices.size();
    }

    /** Index of s in {@link #vertices()}. */
    public int s() {
        return s;
    }

    /** Index of t in {@link #vertices()}. */
    public int t() {
        return t;
    }

    public List<Edge> edges() {
        return edges;
    }

    /** Non-fatal remarks from validation (for example dropped self-loops). */
    public List<String> warnings() {
        return warnings;
    }

    /** Index of the vertex with this id, or −1. */
    public int vertexIndex(String id) {
        Integer i = vertexIndex.get(id);
        return i == null ? -1 : i;
    }

    /** A copy with new edge weights (same order as {@link #edges()}). */
    public Scenario withWeights(double[] weights) {
        List<Edge> e = new ArrayList<>(edges.size());
        for (int i = 0; i < edges.size(); i++) {
            e.add(edges.get(i).withWeight(weights[i]));
        }
        return new Scenario(title, notes, variables, functionText, function, promise, vertices, s, t,
                e, warnings, connectivity);
    }

    /** A copy with a new list of edges. */
    public Scenario withEdges(List<Edge> newEdges) {
        return new Scenario(title, notes, variables, functionText, function, promise, vertices, s, t,
                newEdges, warnings, connectivity);
    }
}
