package spanwright.io;

import spanwright.model.ScenarioException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import spanwright.expr.Expr;
import spanwright.expr.ExprException;
import spanwright.expr.ExprParser;
import spanwright.model.Condition;
import spanwright.model.ConnectivityForm;
import spanwright.model.Edge;
import spanwright.model.Inputs;
import spanwright.model.Promise;
import spanwright.model.Scenario;
import spanwright.model.Vertex;

/**
 * Reads and validates a scenario in format v1 ({@code docs/scenario-format.md}). Every rejection
 * is a {@link ScenarioException} with a code, a plain message and the JSON path at fault.
 *
 * <p>Self-loops carry no current and no charge; they are <b>kept in the file but dropped from the
 * analysis</b> with a warning (so the user's drawing is not changed behind their back).
 */
public final class ScenarioReader {
    /** Format name expected in the {@code format} key. */
    public static final String FORMAT = "spanwright-scenario";
    /** The only version this reader knows. */
    public static final int VERSION = 1;
    /**
     * Largest number of variables whose 2^n inputs are enumerated (2^24 ≈ 16.8 million). A
     * scenario whose promise lists its inputs explicitly may have up to 63 variables.
     */
    public static final int MAX_ENUMERATED_VARIABLES = 24;
    /** Largest number of variables when the promise is an explicit list of inputs. */
    public static final int MAX_LISTED_VARIABLES = 63;
    /**
     * Largest number of variables with no promise (the whole cube): beyond
     * {@link #MAX_ENUMERATED_VARIABLES} such a scenario is analysed by structure, not by
     * enumeration (graph problems have one variable per edge).
     */
    public static final int MAX_VARIABLES = 4096;

    private ScenarioReader() {}

    /** Parses JSON text and validates it. */
    public static Scenario read(String jsonText) {
        return fromJson(Json.parse(jsonText));
    }

    /**
     * Validates a parsed JSON document ({@link Json} values; documents built in code may also use
     * Integer or Long for numbers).
     */
    public static Scenario fromJson(Object doc) {
        Map<String, Object> root = object(doc, "$");
        Object format = root.get("format");
        if (format == null) {
            throw new ScenarioException("format", "$.format",
                    "missing \"format\": a scenario file starts with \"format\": \"" + FORMAT + "\"");
        }
        if (!FORMAT.equals(format)) {
            throw new ScenarioException("format", "$.format", "unknown format " + show(format)
                    + "; expected \"" + FORMAT + "\"");
        }
        Object version = root.get("version");
        if (version == null) {
            throw new ScenarioException("version", "$.version", "missing \"version\" (expected 1)");
        }
        if (!(version instanceof Number) || ((Number) version).doubleValue() != VERSION) {
            throw new ScenarioException("version", "$.version", "unsupported version " + show(version)
                    + "; this program reads version " + VERSION);
        }
        String title = optString(root, "title", "$.title");
        String notes = optString(root, "notes", "$.notes");

        // variables
        Object vs = root.get("variables");
        if (vs == null) {
            throw new ScenarioException("missing", "$.variables", "missing \"variables\" (a list of names)");
        }
        List<Object> varList = array(vs, "$.variables");
        List<String> variables = new ArrayList<>();
        for (int i = 0; i < varList.size(); i++) {
            String p = "$.variables[" + i + "]";
            String name = string(varList.get(i), p);
            if (!ExprParser.isName(name)) {
                throw new ScenarioException("variable-name", p, "\"" + name
                        + "\" is not a valid variable name (a letter or _, then letters, digits, _ or .)");
            }
            if (variables.contains(name)) {
                throw new ScenarioException("duplicate-id", p, "variable \"" + name + "\" is declared twice");
            }
            if (isReserved(name)) {
                throw new ScenarioException("variable-name", p, "\"" + name
                        + "\" is a function name of the expression language; choose another name");
            }
            variables.add(name);
        }
        int n = variables.size();

        // the variable limit depends on the promise's kind; check it before reading the promise, so
        // that well-formed input strings are not blamed for too many variables
        Object po = root.get("promise");
        boolean listed = po instanceof Map && ((Map<?, ?>) po).containsKey("inputs");
        boolean cube = po == null || po == Json.NULL;
        int limit = listed ? MAX_LISTED_VARIABLES : cube ? MAX_VARIABLES : MAX_ENUMERATED_VARIABLES;
        if (n > limit) {
            throw new ScenarioException("too-many-variables", "$.variables", n
                    + " variables is more than the limit of " + limit
                    + (limit == MAX_ENUMERATED_VARIABLES
                            ? " for a promise that is enumerated (2^" + limit + " inputs); drop the promise to analyse"
                                    + " the whole cube by structure, or list the inputs of interest in"
                                    + " \"promise\": {\"inputs\": [...]}"
                            : limit == MAX_VARIABLES ? " variables of a scenario" : ""));
        }
        Promise promise = readPromise(po, variables);

        // function
        String functionText = null;
        Expr function = null;
        Object connectivityHost = null;
        Object fo = root.get("function");
        Object connects = fo instanceof Map ? ((Map<?, ?>) fo).get("connects") : null;
        if (connects != null) {
            connectivityHost = connects;
        } else if (fo != null && fo != Json.NULL) {
            if (fo instanceof Map) {
                throw new ScenarioException("type", "$.function", "\"function\" is an expression (a string) or"
                        + " {\"connects\": \"graph\"} (s-t connectivity of this graph) or {\"connects\": {a graph}}");
            }
            functionText = string(fo, "$.function");
            function = expression(functionText, variables, "$.function");
        }

        // graph
        Object go = root.get("graph");
        if (go == null) {
            throw new ScenarioException("missing", "$.graph", "missing \"graph\"");
        }
        Map<String, Object> graph = object(go, "$.graph");
        Object vo = graph.get("vertices");
        if (vo == null) {
            throw new ScenarioException("missing", "$.graph.vertices", "missing \"vertices\"");
        }
        List<Object> vlist = array(vo, "$.graph.vertices");
        List<Vertex> vertices = new ArrayList<>();
        Map<String, Integer> index = new HashMap<>();
        for (int i = 0; i < vlist.size(); i++) {
            String p = "$.graph.vertices[" + i + "]";
            Map<String, Object> vm = object(vlist.get(i), p);
            Object ido = vm.get("id");
            if (ido == null) {
                throw new ScenarioException("missing", p + ".id", "vertex has no \"id\"");
            }
            String id = string(ido, p + ".id");
            if (id.isEmpty()) {
                throw new ScenarioException("type", p + ".id", "vertex id is empty");
            }
            if (index.containsKey(id)) {
                throw new ScenarioException("duplicate-id", p + ".id", "vertex id \"" + id + "\" is used twice");
            }
            double x = optNumber(vm, "x", p + ".x");
            double y = optNumber(vm, "y", p + ".y");
            index.put(id, i);
            vertices.add(new Vertex(id, x, y));
        }
        int s = endpoint(graph, "s", index);
        int t = endpoint(graph, "t", index);
        if (s == t) {
            throw new ScenarioException("same-s-t", "$.graph.t", "s and t are the same vertex \""
                    + vertices.get(s).id() + "\"; they must differ");
        }

        Object eo = graph.get("edges");
        if (eo == null) {
            throw new ScenarioException("missing", "$.graph.edges", "missing \"edges\"");
        }
        List<Object> elist = array(eo, "$.graph.edges");
        List<Edge> edges = new ArrayList<>();
        List<String> warnings = new ArrayList<>();
        Set<String> edgeIds = new HashSet<>();
        // ids given explicitly, so that a default id ("e" + position) never collides with one
        Set<String> explicitIds = new HashSet<>();
        for (Object o : elist) {
            if (o instanceof Map && ((Map<?, ?>) o).get("id") instanceof String) {
                explicitIds.add((String) ((Map<?, ?>) o).get("id"));
            }
        }
        for (int i = 0; i < elist.size(); i++) {
            String p = "$.graph.edges[" + i + "]";
            Map<String, Object> em = object(elist.get(i), p);
            String id;
            if (em.get("id") != null && em.get("id") != Json.NULL) {
                id = string(em.get("id"), p + ".id");
            } else {
                id = "e" + (i + 1);
                for (int k = 2; explicitIds.contains(id) || edgeIds.contains(id); k++) {
                    id = "e" + (i + 1) + "_" + k;
                }
            }
            if (!edgeIds.add(id)) {
                throw new ScenarioException("duplicate-id", p + ".id", "edge id \"" + id + "\" is used twice");
            }
            int u = vertexRef(em, "u", p, index);
            int v = vertexRef(em, "v", p, index);
            Object wo = em.get("when");
            if (wo == null) {
                throw new ScenarioException("missing", p + ".when",
                        "edge has no \"when\" (a variable, !variable, or 1 for always)");
            }
            Condition when = condition(string(wo, p + ".when"), variables, p + ".when");
            double w = 1.0;
            Object wt = em.get("weight");
            if (wt != null && wt != Json.NULL) {
                if (!(wt instanceof Number)) {
                    throw new ScenarioException("weight", p + ".weight", "weight must be a number, got " + show(wt));
                }
                w = ((Number) wt).doubleValue();
                String problem = Edge.weightProblem(w);
                if (problem != null) {
                    throw new ScenarioException("weight", p + ".weight", "edge \"" + id + "\": "
                            + problem.replace(Double.toString(w), Json.write(wt)));
                }
            } else if (wt == Json.NULL) {
                throw new ScenarioException("weight", p + ".weight", "weight must be a finite number > 0, got null");
            }
            if (u == v) {
                warnings.add("edge \"" + id + "\" (" + p + ") is a self-loop on \"" + vertices.get(u).id()
                        + "\"; it carries no current and is left out of the analysis");
            }
            String group = null;
            Object go2 = em.get("group");
            if (go2 != null && go2 != Json.NULL) {
                group = string(go2, p + ".group");
            }
            boolean locked = false;
            Object lo = em.get("locked");
            if (lo != null && lo != Json.NULL) {
                if (!(lo instanceof Boolean)) {
                    throw new ScenarioException("type", p + ".locked", "\"locked\" is true or false, got " + show(lo));
                }
                locked = (Boolean) lo;
            }
            edges.add(new Edge(id, u, v, when, w, group, locked));
        }
        ConnectivityForm connectivity = connectivityHost == null ? null
                : connectivityForm(connectivityHost, varList);
        return new Scenario(title, notes, variables, functionText, function, promise, vertices, s, t, edges,
                warnings, connectivity);
    }

    /**
     * Reads {@code "connects"}: the string {@code "graph"} (this scenario's own graph) or a graph
     * object with the keys of {@code $.graph}, read by the same code (its paths are reported under
     * {@code $.function.connects}).
     */
    private static ConnectivityForm connectivityForm(Object host, List<Object> variableNames) {
        String path = "$.function.connects";
        if ("graph".equals(host)) {
            return ConnectivityForm.OWN_GRAPH;
        }
        if (!(host instanceof Map)) {
            throw new ScenarioException("type", path, "\"connects\" is \"graph\" (this scenario's graph) or a graph"
                    + " object with s, t, vertices and edges; got " + show(host));
        }
        Map<String, Object> doc = new LinkedHashMap<>();
        doc.put("format", FORMAT);
        doc.put("version", (double) VERSION);
        doc.put("variables", variableNames);
        doc.put("graph", host);
        Scenario h;
        try {
            h = fromJson(doc);
        } catch (ScenarioException e) {
            String p = e.path().startsWith("$.graph") ? path + e.path().substring("$.graph".length()) : path;
            throw new ScenarioException(e.code(), p, "in the host graph: " + e.getMessage());
        }
        return ConnectivityForm.of(h.vertices(), h.s(), h.t(), h.edges());
    }

    private static boolean isReserved(String name) {
        return ExprParser.isFunctionName(name);
    }

    static Expr expression(String text, List<String> variables, String path) {
        try {
            return ExprParser.parse(text, variables);
        } catch (ExprException e) {
            throw new ScenarioException("expression", path, "column " + e.column() + ": " + e.getMessage()
                    + " in \"" + excerpt(text, e.column() - 1) + "\"");
        }
    }

    /** The text, or for a long one about 60 characters around {@code at} with "…" for the rest. */
    static String excerpt(String text, int at) {
        if (text.length() <= 120) {
            return text;
        }
        int from = Math.max(0, Math.min(at - 30, text.length() - 60));
        int to = Math.min(text.length(), from + 60);
        return (from > 0 ? "…" : "") + text.substring(from, to) + (to < text.length() ? "…" : "");
    }

    /** Parses an edge condition: {@code a}, {@code !a} or {@code 1}. */
    public static Condition condition(String text, List<String> variables, String path) {
        String c = text.trim();
        if (c.equals("1")) {
            return Condition.ALWAYS;
        }
        boolean positive = true;
        if (c.startsWith("!")) {
            positive = false;
            c = c.substring(1).trim();
        }
        int idx = variables.indexOf(c);
        if (idx < 0) {
            if (!ExprParser.isName(c)) {
                throw new ScenarioException("condition", path, "\"" + text
                        + "\" is not a condition; write a variable (a), its negation (!a), or 1 for always");
            }
            throw new ScenarioException("unknown-variable", path, "unknown variable \"" + c
                    + "\" (declared: " + String.join(", ", variables) + ")");
        }
        return Condition.literal(idx, c, positive);
    }

    private static Promise readPromise(Object po, List<String> variables) {
        if (po == null || po == Json.NULL) {
            return Promise.NONE;
        }
        int n = variables.size();
        if (po instanceof String) {
            String text = (String) po;
            return Promise.expression(text, expression(text, variables, "$.promise"));
        }
        Map<String, Object> pm = object(po, "$.promise");
        if (pm.size() != 1 || !(pm.containsKey("weights") || pm.containsKey("inputs"))) {
            throw new ScenarioException("promise", "$.promise",
                    "a promise is null, an expression string, {\"weights\": [...]} or {\"inputs\": [...]}");
        }
        if (pm.containsKey("weights")) {
            List<Object> wl = array(pm.get("weights"), "$.promise.weights");
            int[] w = new int[wl.size()];
            Set<Integer> seen = new HashSet<>();
            for (int i = 0; i < w.length; i++) {
                String p = "$.promise.weights[" + i + "]";
                Object o = wl.get(i);
                if (!(o instanceof Number) || ((Number) o).doubleValue() != Math.rint(((Number) o).doubleValue())) {
                    throw new ScenarioException("promise", p, "a Hamming weight is a whole number, got " + show(o));
                }
                double d = ((Number) o).doubleValue();
                if (d < 0 || d > n) {
                    throw new ScenarioException("promise", p, "Hamming weight " + (long) d
                            + " is outside 0.." + n);
                }
                if (!seen.add((int) d)) {
                    throw new ScenarioException("promise", p, "Hamming weight " + (long) d + " is listed twice");
                }
                w[i] = (int) d;
            }
            if (w.length == 0) {
                throw new ScenarioException("empty-domain", "$.promise.weights",
                        "the list of Hamming weights is empty, so no input is allowed");
            }
            return Promise.weights(w);
        }
        List<Object> il = array(pm.get("inputs"), "$.promise.inputs");
        if (il.isEmpty()) {
            throw new ScenarioException("empty-domain", "$.promise.inputs", "the list of inputs is empty");
        }
        long[] x = new long[il.size()];
        Set<Long> seen = new HashSet<>();
        for (int i = 0; i < x.length; i++) {
            String p = "$.promise.inputs[" + i + "]";
            String str = string(il.get(i), p);
            long m = Inputs.parse(str, n);
            if (m < 0) {
                throw new ScenarioException("input-string", p, "\"" + str + "\" is not an input: write "
                        + n + " characters 0 or 1, one per variable (" + String.join(", ", variables) + ")");
            }
            if (!seen.add(m)) {
                throw new ScenarioException("input-string", p, "input \"" + str + "\" is listed twice");
            }
            x[i] = m;
        }
        return Promise.inputs(x);
    }

    private static int endpoint(Map<String, Object> graph, String key, Map<String, Integer> index) {
        String p = "$.graph." + key;
        Object o = graph.get(key);
        if (o == null || o == Json.NULL) {
            throw new ScenarioException("missing", p, "missing \"" + key + "\": name the vertex that is " + key);
        }
        String id = string(o, p);
        Integer i = index.get(id);
        if (i == null) {
            throw new ScenarioException("unknown-vertex", p, key + " is \"" + id + "\", which is not a vertex");
        }
        return i;
    }

    private static int vertexRef(Map<String, Object> em, String key, String p, Map<String, Integer> index) {
        Object o = em.get(key);
        if (o == null) {
            throw new ScenarioException("missing", p + "." + key, "edge has no \"" + key + "\" endpoint");
        }
        String id = string(o, p + "." + key);
        Integer i = index.get(id);
        if (i == null) {
            throw new ScenarioException("unknown-vertex", p + "." + key, "unknown vertex \"" + id + "\"");
        }
        return i;
    }

    // ---------------------------------------------------------------- typed access

    @SuppressWarnings("unchecked")
    /** The entries of an options object (path {@code $options}); none for null or blank text. */
    public static Map<String, Object> options(String optionsJson) {
        if (optionsJson == null || optionsJson.trim().isEmpty()) {
            return java.util.Collections.emptyMap();
        }
        return object(Json.parse(optionsJson), "$options");
    }

    /** The error for an option key nobody knows, naming the ones that exist. */
    public static ScenarioException unknownOption(String key, String known) {
        return new ScenarioException("option", "$options." + key, "unknown option \"" + key + "\" (known: " + known + ")");
    }

    public static Map<String, Object> object(Object o, String path) {
        if (!(o instanceof Map)) {
            throw new ScenarioException("type", path, "expected an object {…}, got " + show(o));
        }
        return (Map<String, Object>) o;
    }

    @SuppressWarnings("unchecked")
    public static List<Object> array(Object o, String path) {
        if (!(o instanceof List)) {
            throw new ScenarioException("type", path, "expected a list […], got " + show(o));
        }
        return (List<Object>) o;
    }

    public static String string(Object o, String path) {
        if (!(o instanceof String)) {
            throw new ScenarioException("type", path, "expected a string, got " + show(o));
        }
        return (String) o;
    }

    private static String optString(Map<String, Object> m, String key, String path) {
        Object o = m.get(key);
        if (o == null || o == Json.NULL) {
            return "";
        }
        return string(o, path);
    }

    private static double optNumber(Map<String, Object> m, String key, String path) {
        Object o = m.get(key);
        if (o == null || o == Json.NULL) {
            return Double.NaN;
        }
        if (!(o instanceof Number)) {
            throw new ScenarioException("type", path, "expected a number, got " + show(o));
        }
        return ((Number) o).doubleValue();
    }

    public static String show(Object o) {
        if (o instanceof Map) {
            return "an object";
        }
        if (o instanceof List) {
            return "a list";
        }
        String s = Json.write(o);
        return s.length() > 40 ? s.substring(0, 40) + "…" : s;
    }
}
