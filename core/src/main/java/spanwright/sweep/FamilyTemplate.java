package spanwright.sweep;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.analysis.VariableSymmetry;
import spanwright.reduction.Built;
import spanwright.reduction.BuildRequest;
import spanwright.io.Json;
import spanwright.model.ScenarioException;
import spanwright.io.ScenarioReader;
import spanwright.model.Scenario;

/**
 * A user family: a file of format {@code "spanwright-family"} (our own; documented in
 * {@code docs/sweeps.md}) holding a template of a builder request ({@code "build"}, as sent to
 * {@code JsonFacade.build}) or of a whole scenario ({@code "scenario"}, format v1), in which the
 * size parameter appears through {@link TemplateText} placeholders:
 * <pre>
 * {"format": "spanwright-family", "version": 1, "title": "…", "notes": "…",
 *  "parameter": {"name": "n", "meaning": "…", "sizes": "2..12", "minimum": 1},
 *  "symmetry": {"tree": [ … fan-ins … ], "reason": "automorphism" | "series-parallel"},
 *  "build": { … request … }            or            "scenario": { … scenario … }}
 * </pre>
 * {@code symmetry} is optional; {@code "tree": ["$n"]} declares every permutation of the
 * variables. A declared symmetry is checked before it is used (exactly for automorphisms, on seeded
 * inputs otherwise; see {@link spanwright.analysis.CandidateInputs#check}). Immutable.
 */
public final class FamilyTemplate implements Family {
    /** The format name of a family file. */
    public static final String FORMAT = "spanwright-family";
    public static final int VERSION = 1;

    private final Map<String, Object> doc;
    private final String title;
    private final String name;
    private final String meaning;
    private final String sizes;
    private final int minimum;
    private final Object symmetry;
    private final String symmetryReason;
    private final Object build;
    private final Object scenario;

    private FamilyTemplate(Map<String, Object> doc, String title, String name, String meaning, String sizes, int minimum,
            Object symmetry, String symmetryReason, Object build, Object scenario) {
        this.doc = doc;
        this.title = title;
        this.name = name;
        this.meaning = meaning;
        this.sizes = sizes;
        this.minimum = minimum;
        this.symmetry = symmetry;
        this.symmetryReason = symmetryReason;
        this.build = build;
        this.scenario = scenario;
    }

    /** Whether a parsed JSON document is a family file (by its {@code format}). */
    public static boolean isFamilyDocument(Object doc) {
        return doc instanceof Map && FORMAT.equals(((Map<?, ?>) doc).get("format"));
    }

    /**
     * Reads a family file (parsed JSON).
     *
     * @throws ScenarioException with the JSON path at fault
     */
    @SuppressWarnings("unchecked")
    public static FamilyTemplate read(Object json) {
        if (!(json instanceof Map)) {
            throw new ScenarioException("type", "$", "a family file is a JSON object");
        }
        Map<String, Object> d = (Map<String, Object>) json;
        if (!FORMAT.equals(d.get("format"))) {
            throw new ScenarioException("format", "$.format", "a family file has \"format\": \"" + FORMAT + "\", got "
                    + Json.write(d.get("format")));
        }
        if (!(d.get("version") instanceof Double) || (Double) d.get("version") != VERSION) {
            throw new ScenarioException("version", "$.version", "this Spanwright reads family files of version " + VERSION
                    + ", got " + Json.write(d.get("version")));
        }
        List<String> known = List.of("format", "version", "title", "notes", "parameter", "symmetry", "build", "scenario");
        for (String k : d.keySet()) {
            if (!known.contains(k)) {
                throw new ScenarioException("unknown-key", "$." + k, "a family file has no key \"" + k + "\" (keys: "
                        + String.join(", ", known) + ")");
            }
        }
        String title = d.get("title") instanceof String ? (String) d.get("title") : "user family";
        String name = "n";
        String meaning = "size";
        String sizes = "1..8";
        int minimum = 1;
        Object po = d.get("parameter");
        if (po != null && po != Json.NULL) {
            if (!(po instanceof Map)) {
                throw new ScenarioException("type", "$.parameter", "\"parameter\" is an object {\"name\", \"meaning\","
                        + " \"sizes\", \"minimum\"}");
            }
            Map<String, Object> p = (Map<String, Object>) po;
            for (String k : p.keySet()) {
                if (!List.of("name", "meaning", "sizes", "minimum").contains(k)) {
                    throw new ScenarioException("unknown-key", "$.parameter." + k, "\"parameter\" has the keys name,"
                            + " meaning, sizes, minimum; not \"" + k + "\"");
                }
            }
            if (p.containsKey("name")) {
                name = text(p.get("name"), "$.parameter.name");
                if (!isName(name)) {
                    throw new ScenarioException("template", "$.parameter.name", "the parameter's name is a letter or _,"
                            + " then letters, digits or _; got \"" + name + "\"");
                }
            }
            if (p.containsKey("meaning")) {
                meaning = text(p.get("meaning"), "$.parameter.meaning");
            }
            if (p.containsKey("sizes")) {
                sizes = text(p.get("sizes"), "$.parameter.sizes");
                SizeList.parse(sizes, "$.parameter.sizes");
            }
            if (p.containsKey("minimum")) {
                Object m = p.get("minimum");
                if (!(m instanceof Double) || (Double) m != Math.rint((Double) m) || (Double) m < 0) {
                    throw new ScenarioException("type", "$.parameter.minimum", "\"minimum\" is a whole number ≥ 0");
                }
                minimum = (int) (double) (Double) m;
            }
        }
        boolean hasBuild = d.get("build") != null && d.get("build") != Json.NULL;
        boolean hasScenario = d.get("scenario") != null && d.get("scenario") != Json.NULL;
        if (hasBuild == hasScenario) {
            throw new ScenarioException("missing", "$", "a family file has exactly one of \"build\" (a builder request"
                    + " template) and \"scenario\" (a scenario template)");
        }
        Object sym = null;
        String reason = null;
        Object so = d.get("symmetry");
        if (so != null && so != Json.NULL) {
            if (!(so instanceof Map) || !((Map<String, Object>) so).containsKey("tree")) {
                throw new ScenarioException("type", "$.symmetry", "\"symmetry\" is {\"tree\": [fan-ins…], \"reason\":"
                        + " \"automorphism\" | \"series-parallel\"}");
            }
            Map<String, Object> s = (Map<String, Object>) so;
            for (String k : s.keySet()) {
                if (!k.equals("tree") && !k.equals("reason")) {
                    throw new ScenarioException("unknown-key", "$.symmetry." + k, "\"symmetry\" has the keys tree and"
                            + " reason; not \"" + k + "\"");
                }
            }
            sym = s.get("tree");
            Object r = s.get("reason");
            reason = r == null ? "automorphism" : String.valueOf(r);
            if (!reason.equals("automorphism") && !reason.equals("series-parallel")) {
                throw new ScenarioException("type", "$.symmetry.reason", "\"reason\" is \"automorphism\" or"
                        + " \"series-parallel\", got " + Json.write(r));
            }
        }
        FamilyTemplate t = new FamilyTemplate(d, title, name, meaning, sizes, minimum, sym, reason,
                hasBuild ? d.get("build") : null, hasScenario ? d.get("scenario") : null);
        return t;
    }

    private static boolean isName(String s) {
        if (s.isEmpty()) {
            return false;
        }
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            boolean letter = (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || c == '_';
            if (!letter && (i == 0 || c < '0' || c > '9')) {
                return false;
            }
        }
        return true;
    }

    private static String text(Object o, String path) {
        if (!(o instanceof String)) {
            throw new ScenarioException("type", path, "expected a text, got " + Json.write(o));
        }
        return (String) o;
    }

    @Override
    public String id() {
        return "template";
    }

    @Override
    public String title() {
        return title;
    }

    @Override
    public String parameterName() {
        return name;
    }

    @Override
    public String parameterMeaning() {
        return meaning;
    }

    @Override
    public String defaultSizes() {
        return sizes;
    }

    @Override
    public int minimumSize() {
        return minimum;
    }

    @Override
    public Map<String, Object> spec() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("family", "template");
        m.put("template", doc);
        return m;
    }

    /** The expanded builder request or scenario for {@code size} (for inspection and tests). */
    public Object expanded(int size) {
        Map<String, Long> vars = new HashMap<>();
        vars.put(name, (long) size);
        return build != null ? TemplateText.expand(build, vars, "$.build") : TemplateText.expand(scenario, vars, "$.scenario");
    }

    @Override
    public FamilyInstance instance(int size) {
        if (size < minimum) {
            throw new ScenarioException("size", "$.parameter.minimum", title + ": size " + size + " is below the smallest, "
                    + minimum);
        }
        Object x = expanded(size);
        Scenario sc;
        Map<String, Object> stats;
        String construction;
        if (build != null) {
            Built b;
            try {
                b = BuildRequest.run(x);
            } catch (ScenarioException e) {
                throw new ScenarioException(e.code(), "$.build" + e.path().substring(1), "at " + name + " = " + size + ": "
                        + e.getMessage());
            }
            sc = b.scenario();
            stats = b.stats();
            Object kind = ((Map<?, ?>) x).get("kind");
            construction = "template, " + kind + " builder";
        } else {
            try {
                sc = ScenarioReader.fromJson(x);
            } catch (ScenarioException e) {
                throw new ScenarioException(e.code(), "$.scenario" + e.path().substring(1), "at " + name + " = " + size
                        + ": " + e.getMessage());
            }
            stats = new LinkedHashMap<>();
            stats.put("vertices", sc.vertexCount());
            stats.put("edges", sc.edges().size());
            stats.put("variables", sc.variableCount());
            construction = "template scenario";
        }
        VariableSymmetry vs = null;
        if (symmetry != null) {
            Map<String, Long> vars = new HashMap<>();
            vars.put(name, (long) size);
            Object fans = TemplateText.expand(symmetry, vars, "$.symmetry.tree");
            if (!(fans instanceof List) || ((List<?>) fans).isEmpty()) {
                throw new ScenarioException("type", "$.symmetry.tree", "\"tree\" is a list of fan-ins, e.g. [\"$n\"]");
            }
            List<Integer> f = new ArrayList<>();
            long product = 1;
            for (Object o : (List<?>) fans) {
                if (!(o instanceof Double) || (Double) o != Math.rint((Double) o) || (Double) o < 1 || (Double) o > 64) {
                    throw new ScenarioException("type", "$.symmetry.tree", "at " + name + " = " + size
                            + ", a fan-in is not a whole number from 1 to 64: " + Json.write(o));
                }
                f.add((int) (double) (Double) o);
                product *= f.get(f.size() - 1);
            }
            if (product != sc.variableCount()) {
                throw new ScenarioException("symmetry", "$.symmetry.tree", "at " + name + " = " + size + ", the fan-ins "
                        + f + " multiply to " + product + ", but the scenario has " + sc.variableCount() + " variables");
            }
            int[] fi = new int[f.size()];
            for (int i = 0; i < fi.length; i++) {
                fi[i] = f.get(i);
            }
            vs = VariableSymmetry.tree(fi, symmetryReason.equals("automorphism") ? VariableSymmetry.Reason.AUTOMORPHISM
                    : VariableSymmetry.Reason.SERIES_PARALLEL);
        }
        return new FamilyInstance(size, sc, construction, stats, vs);
    }
}
