package spanwright.reduction;

import spanwright.model.ScenarioException;
import spanwright.io.GraphFile;
import spanwright.io.GraphTextReader;
import spanwright.io.Json;
import spanwright.io.ScenarioReader;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import spanwright.reduction.Built;
import spanwright.reduction.CompositionBuilder;
import spanwright.reduction.DecisionTreeBuilder;
import spanwright.reduction.FormulaBuilder;
import spanwright.reduction.HostGraphBuilder;
import spanwright.model.Scenario;

/**
 * Reads a build request (a JSON object, format in {@link JsonFacade#build}) and runs the builder it
 * names. The command-line {@code build} command and the page both come through here, so they build
 * the same scenario from the same request. Every bad value is a {@link ScenarioException} naming
 * the request path ({@code $.expression}, {@code $.size[1]}, {@code $.outer.graph.edges[2].u}, …).
 */
public final class BuildRequest {
    private BuildRequest() {}

    /** Runs the request. */
    public static Built run(Object request) {
        Map<String, Object> r = ScenarioReader.object(request, "$");
        String kind = requiredString(r, "kind");
        switch (kind) {
            case "formula": {
                FormulaBuilder.Weights weights = choice(r, "weights", "formula", "rule", "unit").equals("unit")
                        ? FormulaBuilder.Weights.UNIT : FormulaBuilder.Weights.RULE;
                return FormulaBuilder.build(requiredString(r, "expression"), optStrings(r, "variables"), weights);
            }
            case "tree": {
                DecisionTreeBuilder.Weights weights = choice(r, "weights", "tree", "guess", "unit").equals("unit")
                        ? DecisionTreeBuilder.Weights.UNIT : DecisionTreeBuilder.Weights.GUESS;
                boolean diagram = false;
                Object d = r.get("diagram");
                if (d != null && d != Json.NULL) {
                    if (!(d instanceof Boolean)) {
                        throw new ScenarioException("type", "$.diagram", "\"diagram\" is true or false, got "
                                + ScenarioReader.show(d));
                    }
                    diagram = (Boolean) d;
                }
                return DecisionTreeBuilder.build(requiredString(r, "function"), optStrings(r, "variables"), diagram,
                        optStrings(r, "order"), weights);
            }
            case "host": {
                String family = requiredString(r, "family");
                String s = optString(r, "s", null);
                String t = optString(r, "t", null);
                int missing = -1;
                if (r.get("atMostMissing") != null && r.get("atMostMissing") != Json.NULL) {
                    missing = wholeNumber(r.get("atMostMissing"), "$.atMostMissing", 0);
                }
                if (family.equals("import")) {
                    return imported(r, graphFile(r), s, t, missing);
                }
                if (family.equals("given")) {
                    Object sc = r.get("scenario");
                    if (sc == null) {
                        throw new ScenarioException("missing", "$.scenario", "a given host needs \"scenario\": the graph,"
                                + " as a scenario whose edge conditions are replaced");
                    }
                    return HostGraphBuilder.given(scenario(sc, "$.scenario"), s, t, missing);
                }
                Object so = r.get("size");
                if (so == null || so == Json.NULL) {
                    throw new ScenarioException("missing", "$.size", "missing \"size\" (e.g. [3, 4] for a 3x4 grid)");
                }
                int[] size;
                if (so instanceof Double) {
                    size = new int[] {wholeNumber(so, "$.size", 0)};
                } else {
                    List<Object> l = ScenarioReader.array(so, "$.size");
                    size = new int[l.size()];
                    for (int i = 0; i < size.length; i++) {
                        size[i] = wholeNumber(l.get(i), "$.size[" + i + "]", 0);
                    }
                }
                long seed = 1;
                if (r.get("seed") != null && r.get("seed") != Json.NULL) {
                    Object o = r.get("seed");
                    if (!(o instanceof Double) || (Double) o != Math.rint((Double) o) || Math.abs((Double) o) > 9e15) {
                        throw new ScenarioException("type", "$.seed", "the seed is a whole number, got " + ScenarioReader.show(o));
                    }
                    seed = (long) (double) (Double) o;
                }
                return HostGraphBuilder.family(family, size, s, t, seed, missing);
            }
            case "compose": {
                Object outer = r.get("outer");
                Object inner = r.get("inner");
                if (outer == null) {
                    throw new ScenarioException("missing", "$.outer", "missing \"outer\" (the outer scenario)");
                }
                if (inner == null) {
                    throw new ScenarioException("missing", "$.inner", "missing \"inner\" (the inner scenario, or the name"
                            + " of a built-in gadget: " + String.join(", ", Gadgets.names()) + ")");
                }
                Scenario out = scenario(outer, "$.outer"); // read first: its errors come first
                Scenario in = inner instanceof String ? Gadgets.scenario((String) inner, "$.inner")
                        : scenario(inner, "$.inner");
                return CompositionBuilder.compose(out, in);
            }
            default:
                throw new ScenarioException("kind", "$.kind", "unknown build kind \"" + kind
                        + "\" (known: formula, tree, host, compose)");
        }
    }

    /**
     * The graph file of an import request ({@code "text"}, and {@code "format"} or
     * {@code "fileName"} or neither: then the format is told from the text), read by
     * {@link GraphTextReader} (GraphML or DOT; never jgrapht-io, which the page cannot run).
     *
     * @throws ScenarioException {@code missing} ({@code $.text}), {@code format}, {@code graph-file}
     *     ({@code $.text}, the message naming line and column)
     */
    public static GraphFile graphFile(Map<String, Object> r) {
        Object text = r.get("text");
        if (text == null || text == Json.NULL) {
            throw new ScenarioException("missing", "$.text", "an imported host needs \"text\": the GraphML or DOT"
                    + " file's contents");
        }
        String body = ScenarioReader.string(text, "$.text");
        GraphFile.Format format = GraphTextReader.formatOf(optString(r, "format", null), optString(r, "fileName", null),
                body, "$.text");
        return GraphTextReader.read(body, format, "$.text");
    }

    /**
     * Builds the host of an import request from its graph file: s and t as given (or the vertices
     * the file marks {@code role = s}, {@code t}), literals from the edge attribute
     * {@code "literalKey"} (or one variable per edge), weights from {@code "weightKey"} (default
     * {@code weight}; {@code ""} for every weight 1), the promise from {@code atMostMissing}.
     */
    public static Built imported(Map<String, Object> r, GraphFile file, String s, String t, int atMostMissing) {
        return HostGraphBuilder.imported(file, s, t, atMostMissing, optString(r, "literalKey", null),
                optString(r, "weightKey", "weight"));
    }

    /** Reads an embedded scenario, its error paths placed under {@code prefix}. */
    static Scenario scenario(Object doc, String prefix) {
        try {
            return ScenarioReader.fromJson(doc);
        } catch (ScenarioException e) {
            throw new ScenarioException(e.code(), prefix + e.path().substring(1), e.getMessage());
        }
    }

    /** The value of {@code key}: one of {@code allowed}, the first being the default. */
    private static String choice(Map<String, Object> r, String key, String what, String... allowed) {
        String v = optString(r, key, allowed[0]);
        for (String a : allowed) {
            if (a.equals(v)) {
                return v;
            }
        }
        throw new ScenarioException(key, "$." + key, what + " " + key + " are \"" + String.join("\" or \"", allowed)
                + "\", got \"" + v + "\"");
    }

    private static String requiredString(Map<String, Object> r, String key) {
        Object o = r.get(key);
        if (o == null || o == Json.NULL) {
            throw new ScenarioException("missing", "$." + key, "missing \"" + key + "\"");
        }
        return ScenarioReader.string(o, "$." + key);
    }

    private static String optString(Map<String, Object> r, String key, String fallback) {
        Object o = r.get(key);
        if (o == null || o == Json.NULL) {
            return fallback;
        }
        return ScenarioReader.string(o, "$." + key);
    }

    private static List<String> optStrings(Map<String, Object> r, String key) {
        Object o = r.get(key);
        if (o == null || o == Json.NULL) {
            return null;
        }
        List<Object> l = ScenarioReader.array(o, "$." + key);
        List<String> out = new ArrayList<>();
        for (int i = 0; i < l.size(); i++) {
            out.add(ScenarioReader.string(l.get(i), "$." + key + "[" + i + "]"));
        }
        return out;
    }

    private static int wholeNumber(Object o, String path, int min) {
        if (!(o instanceof Double) || (Double) o != Math.rint((Double) o)) {
            throw new ScenarioException("type", path, "expected a whole number, got " + ScenarioReader.show(o));
        }
        double d = (Double) o;
        if (d < min || d > 1e6) {
            throw new ScenarioException("size", path, "expected a whole number between " + min + " and 1000000, got "
                    + (long) d);
        }
        return (int) d;
    }
}
