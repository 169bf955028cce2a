package spanwright.io;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.model.ConnectivityForm;
import spanwright.model.Edge;
import spanwright.model.Inputs;
import spanwright.model.Promise;
import spanwright.model.Scenario;
import spanwright.model.Vertex;

/**
 * Writes a scenario in format v1 ({@code docs/scenario-format.md}), the inverse of
 * {@link ScenarioReader}: {@code ScenarioReader.read(write(sc))} has the same title, notes,
 * variables, function text, promise, vertices (ids and positions), s, t and edges (ids, endpoints,
 * conditions, weights, groups, locks) as {@code sc}. Keys come in the documented order; a missing
 * position, weight 1, no group and not locked are left out, as the reader's defaults. Numbers are
 * written with Java's shortest round-tripping text, so weights and positions read back bit for
 * bit. Warnings are not written (the reader derives them again). Cost O(size of the scenario).
 */
public final class ScenarioWriter {
    private ScenarioWriter() {}

    /** The scenario as indented JSON text, for files a person reads. */
    public static String write(Scenario sc) {
        return Json.writePretty(toJson(sc));
    }

    /** The scenario as an ordered JSON object (for embedding in an answer). */
    public static Map<String, Object> toJson(Scenario sc) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("format", ScenarioReader.FORMAT);
        m.put("version", ScenarioReader.VERSION);
        m.put("title", sc.title());
        m.put("notes", sc.notes());
        m.put("variables", new ArrayList<Object>(sc.variables()));
        m.put("function", sc.connectivity() != null ? connects(sc.connectivity(), sc.variableCount())
                : sc.functionText() == null ? Json.NULL : sc.functionText());
        m.put("promise", promise(sc.promise(), sc.variableCount()));
        m.put("graph", graph(sc.vertices(), sc.s(), sc.t(), sc.edges()));
        return m;
    }

    /** {@code {"connects": "graph"}} or {@code {"connects": {a graph}}}. */
    private static Map<String, Object> connects(ConnectivityForm c, int n) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("connects", c.ownGraph() ? "graph" : graph(c.vertices(), c.s(), c.t(), c.edges()));
        return m;
    }

    private static Map<String, Object> graph(List<Vertex> vertices, int s, int t, List<Edge> edges) {
        Map<String, Object> g = new LinkedHashMap<>();
        g.put("s", vertices.get(s).id());
        g.put("t", vertices.get(t).id());
        List<Object> vs = new ArrayList<>();
        for (Vertex v : vertices) {
            Map<String, Object> vm = new LinkedHashMap<>();
            vm.put("id", v.id());
            if (!Double.isNaN(v.x())) {
                vm.put("x", v.x());
            }
            if (!Double.isNaN(v.y())) {
                vm.put("y", v.y());
            }
            vs.add(vm);
        }
        g.put("vertices", vs);
        List<Object> es = new ArrayList<>();
        for (Edge e : edges) {
            Map<String, Object> em = new LinkedHashMap<>();
            em.put("id", e.id());
            em.put("u", vertices.get(e.u()).id());
            em.put("v", vertices.get(e.v()).id());
            em.put("when", e.when().toString());
            if (e.weight() != 1.0) {
                em.put("weight", e.weight());
            }
            if (e.group() != null) {
                em.put("group", e.group());
            }
            if (e.locked()) {
                em.put("locked", true);
            }
            es.add(em);
        }
        g.put("edges", es);
        return g;
    }

    private static Object promise(Promise p, int n) {
        switch (p.kind()) {
            case NONE:
                return Json.NULL;
            case EXPRESSION:
                return p.text();
            case WEIGHTS: {
                List<Object> w = new ArrayList<>();
                for (int x : p.weights()) {
                    w.add(x);
                }
                Map<String, Object> m = new LinkedHashMap<>();
                m.put("weights", w);
                return m;
            }
            default: {
                List<Object> xs = new ArrayList<>();
                for (long x : p.inputs()) {
                    xs.add(Inputs.format(x, n));
                }
                Map<String, Object> m = new LinkedHashMap<>();
                m.put("inputs", xs);
                return m;
            }
        }
    }
}
