package spanwright.sweep;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.analysis.VariableSymmetry;
import spanwright.reduction.Built;
import spanwright.reduction.CompositionBuilder;
import spanwright.reduction.DecisionTreeBuilder;
import spanwright.reduction.FormulaBuilder;
import spanwright.reduction.HostGraphBuilder;
import spanwright.io.Json;
import spanwright.model.ScenarioException;
import spanwright.io.ScenarioReader;
import spanwright.model.Scenario;

/**
 * The built-in families, each one builder call per size (see {@code docs/sweeps.md}):
 * <ul>
 *   <li>{@code or}, {@code and}: OR_n and AND_n of n variables by the formula builder (n parallel
 *       edges; a path of n edges). Symmetric under every permutation of the variables.</li>
 *   <li>{@code parity}: PARITY_n as the ordered decision diagram (2n − 1 decision vertices).</li>
 *   <li>{@code threshold}: thr(k, n), at least k of n, with k an integer expression in n
 *       (option {@code k}, default {@code (n + 1) / 2}), by the formula builder; monotone.</li>
 *   <li>{@code and-or-tree}: the complete read-once AND/OR tree of depth d and fan-in k (option
 *       {@code fanIn}, default 2), gates alternating from the root (option {@code root},
 *       {@code "or"} or {@code "and"}, default {@code "or"}); n = k^d variables.</li>
 *   <li>{@code majority-tree}: recursive majority of three of depth d, each majority written as
 *       (A ∧ B) ∨ (A ∧ C) ∨ (B ∧ C) of its three sub-trees; n = 3^d.</li>
 *   <li>{@code grid}: st-connectivity on the k × k grid host graph, s and t opposite corners.</li>
 *   <li>{@code complete}: st-connectivity on K_n (s = v1, t = vn).</li>
 *   <li>{@code hypercube}: st-connectivity on the d-cube, s = 0…0 and t = 1…1.</li>
 *   <li>{@code path-one-missing}: a path of n edges with the promise "at most one edge missing".</li>
 *   <li>{@code power}: composition powers F^(d) of a given scenario F (option {@code scenario}):
 *       F^(1) = F, F^(d) = F with each edge replaced by a copy of F^(d−1).</li>
 * </ul>
 * OR, AND, the trees and the majority tree come with the symmetry of their formula's tree
 * ({@link VariableSymmetry}); the others are swept by brute force or Rayleigh dominance, and
 * the host-graph families beyond enumeration by structure. The grid, complete and hypercube
 * families tie their weights by the edge orbits of graph automorphisms fixing {s, t}
 * ({@link EdgeOrbits}: no loss for the optimum, derived there).
 */
public final class BuiltInFamilies {
    /** The names of the built-in families, in the order they are listed. */
    public static final List<String> NAMES = List.of("or", "and", "parity", "threshold", "and-or-tree",
            "majority-tree", "grid", "complete", "hypercube", "path-one-missing", "power");

    private BuiltInFamilies() {}

    /**
     * A family from its spec: {@code {"family": NAME, …options}} for a built-in family, or
     * {@code {"family": "template", "template": {…family file…}}} for a user family.
     *
     * @throws ScenarioException naming the spec key at fault
     */
    @SuppressWarnings("unchecked")
    public static Family fromSpec(Object specJson, String path) {
        if (!(specJson instanceof Map)) {
            throw new ScenarioException("family", path, "a family is an object like {\"family\": \"or\"}");
        }
        Map<String, Object> spec = (Map<String, Object>) specJson;
        Object name = spec.get("family");
        if (!(name instanceof String)) {
            throw new ScenarioException("family", path + ".family", "\"family\" names a family: one of "
                    + String.join(", ", NAMES) + ", or \"template\"");
        }
        String id = (String) name;
        List<String> allowed = new ArrayList<>(List.of("family"));
        Family f;
        switch (id) {
            case "or":
            case "and":
            case "parity":
            case "majority-tree":
            case "grid":
            case "complete":
            case "hypercube":
            case "path-one-missing":
                f = new Simple(id);
                break;
            case "threshold": {
                allowed.add("k");
                Object k = spec.get("k");
                String kText = k == null || k == Json.NULL ? "(n + 1) / 2" : textOrNumber(k, path + ".k");
                TemplateText.evaluate(kText, Map.of("n", 1L), path + ".k"); // syntax check
                f = new Threshold(kText);
                break;
            }
            case "and-or-tree": {
                allowed.add("fanIn");
                allowed.add("root");
                int k = spec.get("fanIn") == null ? 2 : whole(spec.get("fanIn"), path + ".fanIn", 2, 64);
                Object root = spec.get("root");
                String r = root == null ? "or" : String.valueOf(root);
                if (!r.equals("or") && !r.equals("and")) {
                    throw new ScenarioException("family", path + ".root", "\"root\" is \"or\" or \"and\", got "
                            + Json.write(root));
                }
                f = new AndOrTree(k, r.equals("and"));
                break;
            }
            case "power": {
                allowed.add("scenario");
                Object sc = spec.get("scenario");
                if (sc == null) {
                    throw new ScenarioException("missing", path + ".scenario", "the power family needs \"scenario\":"
                            + " the instance F whose composition powers are swept");
                }
                // through JSON text, so that a map built in memory reads like a parsed file
                Object doc = Json.parse(sc instanceof String ? (String) sc : Json.write(sc));
                Scenario base;
                try {
                    base = ScenarioReader.fromJson(doc);
                } catch (ScenarioException e) {
                    throw new ScenarioException(e.code(), path + ".scenario" + e.path().substring(1), e.getMessage());
                }
                f = new Power(doc, base);
                break;
            }
            case "template": {
                allowed.add("template");
                Object t = spec.get("template");
                if (t == null) {
                    throw new ScenarioException("missing", path + ".template", "a user family needs \"template\":"
                            + " the family file's contents");
                }
                f = FamilyTemplate.read(Json.parse(t instanceof String ? (String) t : Json.write(t)));
                break;
            }
            default:
                throw new ScenarioException("family", path + ".family", "unknown family \"" + id + "\" (known: "
                        + String.join(", ", NAMES) + ", or a family file)");
        }
        for (String key : spec.keySet()) {
            if (!allowed.contains(key)) {
                throw new ScenarioException("family", path + "." + key, "the " + id + " family has no option \"" + key
                        + "\"" + (allowed.size() > 1 ? " (options: " + String.join(", ", allowed.subList(1, allowed.size()))
                                + ")" : ""));
            }
        }
        return f;
    }

    private static String textOrNumber(Object o, String path) {
        if (o instanceof String) {
            return (String) o;
        }
        if (o instanceof Double && (Double) o == Math.rint((Double) o)) {
            return Long.toString((long) (double) (Double) o);
        }
        throw new ScenarioException("family", path, "expected an integer expression in n, e.g. \"n / 2\"");
    }

    private static int whole(Object o, String path, int min, int max) {
        if (!(o instanceof Double) || (Double) o != Math.rint((Double) o) || (Double) o < min || (Double) o > max) {
            throw new ScenarioException("family", path, "expected a whole number from " + min + " to " + max + ", got "
                    + Json.write(o));
        }
        return (int) (double) (Double) o;
    }

    /** A family's spec as an ordered map (family first). */
    static Map<String, Object> spec(String id, Object... keyValues) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("family", id);
        for (int i = 0; i + 1 < keyValues.length; i += 2) {
            m.put((String) keyValues[i], keyValues[i + 1]);
        }
        return m;
    }

    static List<String> xs(int n) {
        List<String> v = new ArrayList<>();
        for (int i = 1; i <= n; i++) {
            v.add("x" + i);
        }
        return v;
    }

    static ScenarioException badSize(String family, int size, String why) {
        return new ScenarioException("size", "$.size", family + ": size " + size + " " + why);
    }

    /** The families without options. */
    private static final class Simple implements Family {
        private final String id;

        Simple(String id) {
            this.id = id;
        }

        @Override
        public String id() {
            return id;
        }

        @Override
        public String title() {
            switch (id) {
                case "or": return "OR_n as n parallel edges";
                case "and": return "AND_n as a path of n edges";
                case "parity": return "PARITY_n as an ordered decision diagram";
                case "majority-tree": return "recursive majority of three, depth d";
                case "grid": return "st-connectivity on the k×k grid";
                case "complete": return "st-connectivity on the complete graph K_n";
                case "hypercube": return "st-connectivity on the d-cube, opposite corners";
                default: return "path of n edges, at most one edge missing";
            }
        }

        @Override
        public String parameterName() {
            return id.equals("majority-tree") || id.equals("hypercube") ? "d" : id.equals("grid") ? "k" : "n";
        }

        @Override
        public String parameterMeaning() {
            switch (id) {
                case "majority-tree": return "depth (3^d variables)";
                case "grid": return "side of the grid (2k(k−1) edge variables)";
                case "complete": return "number of vertices (n(n−1)/2 edge variables)";
                case "hypercube": return "dimension (d·2^(d−1) edge variables)";
                case "path-one-missing": return "length of the path (edges = variables)";
                default: return "number of variables";
            }
        }

        @Override
        public String defaultSizes() {
            switch (id) {
                case "parity": return "2..12";
                case "majority-tree": return "1..3";
                case "grid": return "2..4";
                case "complete": return "3..12";
                case "hypercube": return "1..4";
                case "path-one-missing": return "2..20";
                default: return "2..20";
            }
        }

        @Override
        public int minimumSize() {
            return id.equals("grid") || id.equals("complete") ? 2 : 1;
        }

        @Override
        public Map<String, Object> spec() {
            return BuiltInFamilies.spec(id);
        }

        @Override
        public FamilyInstance instance(int size) {
            if (size < minimumSize()) {
                throw badSize(id, size, "is below the smallest, " + minimumSize());
            }
            switch (id) {
                case "or":
                case "and": {
                    if (size > FormulaBuilder.MAX_IN_MEMORY_VARIABLES) {
                        throw badSize(id, size, "has more than " + FormulaBuilder.MAX_IN_MEMORY_VARIABLES + " variables");
                    }
                    String expr = (id.equals("or") ? "any(" : "all(") + String.join(", ", xs(size)) + ")";
                    Built b = FormulaBuilder.buildInMemory(expr, xs(size), FormulaBuilder.Weights.RULE);
                    return new FamilyInstance(size, b.scenario(), "formula builder on " + shortText(expr), b.stats(),
                            VariableSymmetry.all(size, id.equals("or") ? VariableSymmetry.Reason.AUTOMORPHISM
                                    : VariableSymmetry.Reason.SERIES_PARALLEL));
                }
                case "parity": {
                    String expr = "parity(" + String.join(", ", xs(size)) + ")";
                    Built b = DecisionTreeBuilder.build(expr, xs(size), true, xs(size), DecisionTreeBuilder.Weights.GUESS);
                    return new FamilyInstance(size, b.scenario(), "ordered decision diagram of " + shortText(expr),
                            b.stats(), null);
                }
                case "majority-tree": {
                    long n = 1;
                    for (int i = 0; i < size; i++) {
                        n *= 3;
                        if (n > FormulaBuilder.MAX_IN_MEMORY_VARIABLES) {
                            throw badSize(id, size, "has 3^" + size + " variables, more than "
                                    + FormulaBuilder.MAX_IN_MEMORY_VARIABLES);
                        }
                    }
                    int[] next = {1};
                    String expr = majority(size, next);
                    int[] fan = new int[size];
                    java.util.Arrays.fill(fan, 3);
                    Built b = FormulaBuilder.buildInMemory(expr, xs((int) n), FormulaBuilder.Weights.RULE);
                    return new FamilyInstance(size, b.scenario(), "formula builder on the majority tree of depth " + size
                            + ", maj(A, B, C) = (A & B) | (A & C) | (B & C)", b.stats(),
                            VariableSymmetry.tree(fan, VariableSymmetry.Reason.SERIES_PARALLEL));
                }
                case "grid": {
                    Built b = HostGraphBuilder.family("grid", new int[] {size, size}, null, null, 1, -1);
                    return tied(size, b, "host-graph builder, grid " + size + "x" + size, EdgeOrbits.grid(size));
                }
                case "complete": {
                    Built b = HostGraphBuilder.family("complete", new int[] {size}, null, null, 1, -1);
                    return tied(size, b, "host-graph builder, complete " + size, EdgeOrbits.complete(size));
                }
                case "hypercube": {
                    Built b = HostGraphBuilder.family("hypercube", new int[] {size}, null, null, 1, -1);
                    String[] bits = new String[b.scenario().vertexCount()];
                    for (int i = 0; i < bits.length; i++) {
                        bits[i] = b.scenario().vertices().get(i).id().substring(1); // "h0101" → "0101"
                    }
                    return tied(size, b, "host-graph builder, hypercube " + size, EdgeOrbits.hypercube(size, bits));
                }
                default: {
                    Built b = HostGraphBuilder.family("path", new int[] {size + 1}, null, null, 1, 1);
                    return new FamilyInstance(size, b.scenario(), "host-graph builder, path of " + size
                            + " edges, at most one missing", b.stats(), null);
                }
            }
        }
    }

    /** A host-graph instance with weights tied by edge orbit (untied when a generator fails its check). */
    private static FamilyInstance tied(int size, Built b, String construction, List<int[]> generators) {
        Scenario t = EdgeOrbits.tie(b.scenario(), generators);
        if (t == null) {
            return new FamilyInstance(size, b.scenario(), construction, b.stats(), null);
        }
        return new FamilyInstance(size, t, construction + "; weights tied by the " + EdgeOrbits.orbitCount(t)
                + " edge orbit(s) of automorphisms fixing {s, t} (no loss: convex and invariant)", b.stats(), null);
    }

    /** maj of three copies: (A & B) | (A & C) | (B & C), with fresh leaves for every copy of a subtree. */
    private static String majority(int depth, int[] next) {
        if (depth == 0) {
            return "x" + next[0]++;
        }
        String a = majority(depth - 1, next);
        String b = majority(depth - 1, next);
        String c = majority(depth - 1, next);
        if (depth > 1) {
            a = "(" + a + ")";
            b = "(" + b + ")";
            c = "(" + c + ")";
        }
        return "(" + a + " & " + b + ") | (" + a + " & " + c + ") | (" + b + " & " + c + ")";
    }

    static String shortText(String s) {
        return s.length() <= 48 ? s : s.substring(0, 45) + "…";
    }

    /** thr(k(n), x1 … xn). */
    private static final class Threshold implements Family {
        private final String k;

        Threshold(String k) {
            this.k = k;
        }

        @Override
        public String id() {
            return "threshold";
        }

        @Override
        public String title() {
            return "threshold thr(k, n) with k = " + k;
        }

        @Override
        public String parameterName() {
            return "n";
        }

        @Override
        public String parameterMeaning() {
            return "number of variables";
        }

        @Override
        public String defaultSizes() {
            return "2..12";
        }

        @Override
        public int minimumSize() {
            return 1;
        }

        @Override
        public Map<String, Object> spec() {
            return BuiltInFamilies.spec("threshold", "k", k);
        }

        @Override
        public FamilyInstance instance(int size) {
            if (size < 1) {
                throw badSize("threshold", size, "is below the smallest, 1");
            }
            Map<String, Long> vars = new HashMap<>();
            vars.put("n", (long) size);
            long kv = TemplateText.evaluate(k, vars, "$.k");
            if (kv < 0 || kv > size) {
                throw badSize("threshold", size, "gives k = " + kv + ", outside 0 … " + size);
            }
            String expr = "thr(" + kv + ", " + String.join(", ", xs(size)) + ")";
            Built b = FormulaBuilder.build(expr, xs(size), FormulaBuilder.Weights.RULE);
            return new FamilyInstance(size, b.scenario(), "formula builder on " + shortText(expr), b.stats(), null);
        }
    }

    /** Complete read-once AND/OR tree of depth d. */
    private static final class AndOrTree implements Family {
        private final int fanIn;
        private final boolean andRoot;

        AndOrTree(int fanIn, boolean andRoot) {
            this.fanIn = fanIn;
            this.andRoot = andRoot;
        }

        @Override
        public String id() {
            return "and-or-tree";
        }

        @Override
        public String title() {
            return "read-once AND/OR tree, fan-in " + fanIn + ", " + (andRoot ? "AND" : "OR") + " at the root";
        }

        @Override
        public String parameterName() {
            return "d";
        }

        @Override
        public String parameterMeaning() {
            return "depth (" + fanIn + "^d variables)";
        }

        @Override
        public String defaultSizes() {
            return fanIn == 2 ? "1..5" : "1..3";
        }

        @Override
        public int minimumSize() {
            return 1;
        }

        @Override
        public Map<String, Object> spec() {
            return BuiltInFamilies.spec("and-or-tree", "fanIn", fanIn, "root", andRoot ? "and" : "or");
        }

        @Override
        public FamilyInstance instance(int size) {
            if (size < 1) {
                throw badSize("and-or-tree", size, "is below the smallest, 1");
            }
            long n = 1;
            for (int i = 0; i < size; i++) {
                n *= fanIn;
                if (n > FormulaBuilder.MAX_IN_MEMORY_VARIABLES) {
                    throw badSize("and-or-tree", size, "has " + fanIn + "^" + size + " variables, more than "
                            + FormulaBuilder.MAX_IN_MEMORY_VARIABLES);
                }
            }
            int[] next = {1};
            String expr = tree(size, andRoot, next);
            int[] fan = new int[size];
            java.util.Arrays.fill(fan, fanIn);
            Built b = FormulaBuilder.buildInMemory(expr, xs((int) n), FormulaBuilder.Weights.RULE);
            return new FamilyInstance(size, b.scenario(), "formula builder on the read-once tree " + shortText(expr),
                    b.stats(), VariableSymmetry.tree(fan, VariableSymmetry.Reason.SERIES_PARALLEL));
        }

        private String tree(int depth, boolean and, int[] next) {
            if (depth == 0) {
                return "x" + next[0]++;
            }
            StringBuilder sb = new StringBuilder("(");
            for (int i = 0; i < fanIn; i++) {
                if (i > 0) {
                    sb.append(and ? " & " : " | ");
                }
                sb.append(tree(depth - 1, !and, next));
            }
            return sb.append(')').toString();
        }
    }

    /** F^(d) by the composition builder. */
    private static final class Power implements Family {
        private final Object scenarioJson;
        private final Scenario base;

        Power(Object scenarioJson, Scenario base) {
            this.scenarioJson = scenarioJson;
            this.base = base;
        }

        @Override
        public String id() {
            return "power";
        }

        @Override
        public String title() {
            return "composition powers of " + (base.title().isEmpty() ? "the given scenario" : "\"" + base.title() + "\"");
        }

        @Override
        public String parameterName() {
            return "d";
        }

        @Override
        public String parameterMeaning() {
            return "power (" + base.variableCount() + "^d variables)";
        }

        @Override
        public String defaultSizes() {
            return "1..3";
        }

        @Override
        public int minimumSize() {
            return 1;
        }

        @Override
        public Map<String, Object> spec() {
            return BuiltInFamilies.spec("power", "scenario", scenarioJson);
        }

        @Override
        public FamilyInstance instance(int size) {
            if (size < 1) {
                throw badSize("power", size, "is below the smallest, 1");
            }
            Scenario f = base;
            Map<String, Object> stats = new LinkedHashMap<>();
            stats.put("vertices", base.vertexCount());
            stats.put("edges", base.edges().size());
            stats.put("variables", base.variableCount());
            for (int d = 2; d <= size; d++) {
                Built b = CompositionBuilder.compose(base, f);
                f = b.scenario();
                stats = b.stats();
            }
            return new FamilyInstance(size, f, size == 1 ? "the given scenario" : "composition builder, F∘F^(" + (size - 1)
                    + ")", stats, null);
        }
    }
}
