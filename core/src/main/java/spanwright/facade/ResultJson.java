package spanwright.facade;

import spanwright.io.Json;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.analysis.InputDetail;
import spanwright.model.Edge;
import spanwright.model.Inputs;
import spanwright.model.Normalisation;
import spanwright.model.Scenario;

/**
 * The JSON form of analysis results, shared by {@code analyze --json} and the page. Keys are
 * documented in {@code docs/cli.md}; they may be added to, never renamed.
 */
public final class ResultJson {
    /** Normalisation stated with every number (see {@link Normalisation}). */
    public static final String CONVENTION = Normalisation.CONVENTION;
    /** The caution shown with every bound (see {@link Normalisation}). */
    public static final String CAUTION = Normalisation.CAUTION;

    private ResultJson() {}

    /** The result as an ordered JSON object. */
    public static Map<String, Object> analysis(AnalysisResult r, boolean withInputs) {
        Scenario sc = r.scenario();
        int n = sc.variableCount();
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("title", sc.title());
        m.put("variables", new ArrayList<Object>(sc.variables()));
        m.put("vertices", sc.vertexCount());
        m.put("edges", sc.edges().size());
        m.put("domainSize", r.domainSize());
        m.put("promise", sc.promise().describe(sc.variables()));

        Map<String, Object> red = new LinkedHashMap<>();
        red.put("checked", r.reductionChecked());
        red.put("correct", r.correct() == null ? Json.NULL : r.correct());
        red.put("counterexampleCount", r.counterexampleCount());
        List<Object> ce = new ArrayList<>();
        for (long x : r.counterexamples()) {
            Map<String, Object> c = new LinkedHashMap<>();
            c.put("x", Inputs.format(x, n));
            boolean f = sc.function().eval(x);
            c.put("f", f ? 1 : 0);
            c.put("connected", !f);
            ce.add(c);
        }
        red.put("counterexamples", ce);
        m.put("reduction", red);

        Map<String, Object> pos = new LinkedHashMap<>();
        pos.put("count", r.positiveCount());
        pos.put("maxResistance", num(r.maxResistance()));
        pos.put("worst", r.worstPositive() < 0 ? Json.NULL : Inputs.format(r.worstPositive(), n));
        m.put("positive", pos);
        Map<String, Object> neg = new LinkedHashMap<>();
        neg.put("count", r.negativeCount());
        neg.put("maxCapacitance", num(r.maxCapacitance()));
        neg.put("worst", r.worstNegative() < 0 ? Json.NULL : Inputs.format(r.worstNegative(), n));
        m.put("negative", neg);
        m.put("complexity", num(r.complexity()));
        boolean wrong = Boolean.FALSE.equals(r.correct());
        m.put("complexityIsBound", !wrong);
        if (wrong) {
            m.put("complexityNote", Analysis.notABound(Long.toString(r.counterexampleCount())));
        }
        m.put("convention", CONVENTION);
        m.put("caution", CAUTION);
        List<Object> warnings = new ArrayList<Object>(sc.warnings());
        m.put("warnings", warnings);

        Map<String, Object> hist = new LinkedHashMap<>();
        hist.put("positive", histogram(r.histogram(true, 20)));
        hist.put("negative", histogram(r.histogram(false, 20)));
        m.put("histogram", hist);

        if (withInputs) {
            Analysis.checkListable(r.domainSize());
            List<Object> inputs = new ArrayList<>();
            boolean checked = r.reductionChecked();
            for (int i = 0; i < r.domainSize(); i++) {
                Map<String, Object> row = new LinkedHashMap<>();
                row.put("x", r.inputString(i));
                row.put("connected", r.connected(i));
                row.put("f", checked ? (Object) Integer.valueOf(r.f(i) ? 1 : 0) : Json.NULL);
                row.put("value", r.value(i));
                inputs.add(row);
            }
            m.put("inputs", inputs);
        }
        return m;
    }

    private static Map<String, Object> histogram(AnalysisResult.Histogram h) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("min", num(h.min));
        m.put("max", num(h.max));
        List<Object> c = new ArrayList<>();
        for (long x : h.counts()) {
            c.add(x);
        }
        m.put("counts", c);
        return m;
    }

    /** One input's witness: edges with presence, current and energy; vertex potentials. */
    public static Map<String, Object> detail(Scenario sc, InputDetail d) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("x", d.input);
        m.put("connected", d.witness.connected);
        m.put("f", d.f == null ? Json.NULL : (Object) Integer.valueOf(d.f ? 1 : 0));
        m.put("value", num(d.witness.value));
        m.put("kind", d.witness.connected ? "resistance" : "capacitance");
        List<Object> edges = new ArrayList<>();
        for (int i = 0; i < sc.edges().size(); i++) {
            Edge e = sc.edges().get(i);
            Map<String, Object> em = new LinkedHashMap<>();
            em.put("id", e.id());
            em.put("present", d.present[i]);
            em.put("current", d.witness.current[i]);
            em.put("energy", d.witness.energy[i]);
            edges.add(em);
        }
        m.put("edges", edges);
        Map<String, Object> pot = new LinkedHashMap<>();
        for (int v = 0; v < sc.vertexCount(); v++) {
            pot.put(sc.vertices().get(v).id(), num(d.witness.potential[v]));
        }
        m.put("potentials", pot);
        return m;
    }

    /** The optimiser's result (keys documented in docs/cli.md, {@code optimize --json}). */
    public static Map<String, Object> optimization(spanwright.optimize.OptimizationResult r) {
        Scenario sc = r.scenario;
        int n = sc.variableCount();
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("status", r.status.name().toLowerCase().replace('_', '-'));
        m.put("iterations", r.iterations);
        m.put("evaluations", r.evaluations);
        m.put("starts", r.starts);
        m.put("bestStart", r.bestStart);
        m.put("initialComplexity", num(r.initialComplexity));
        m.put("complexity", num(r.complexity));
        m.put("exact", r.exact);
        if (!r.exact) {
            m.put("complexityUpper", num(r.complexityUpper()));
        }
        if (r.cut != null) {
            m.put("cut", r.cut);
        }
        Map<String, Object> pos = new LinkedHashMap<>();
        pos.put("maxResistance", num(r.maxResistance));
        if (!r.exact) {
            pos.put("upper", num(r.maxResistanceUpper));
        }
        pos.put("worst", worst(r.worstPositive, r.worstPositiveCertificate, n));
        m.put("positive", pos);
        Map<String, Object> neg = new LinkedHashMap<>();
        neg.put("maxCapacitance", num(r.maxCapacitance));
        if (!r.exact) {
            neg.put("upper", num(r.maxCapacitanceUpper));
        }
        neg.put("worst", worst(r.worstNegative, r.worstNegativeCertificate, n));
        m.put("negative", neg);
        Map<String, Object> w = new LinkedHashMap<>();
        for (Edge e : sc.edges()) {
            w.put(e.id(), e.weight());
        }
        m.put("weights", w);
        m.put("balanced", r.balanced);
        List<Object> trace = new ArrayList<>();
        for (double d : r.trace) {
            trace.add(d);
        }
        m.put("trace", trace);
        m.put("method", r.method);
        if (r.method.equals("working-set")) {
            Map<String, Object> ws = new LinkedHashMap<>();
            ws.put("rounds", r.rounds);
            ws.put("positive", r.workingSetPositive);
            ws.put("negative", r.workingSetNegative);
            ws.put("engine", r.engine);
            ws.put("why", "beyond enumeration the weights are optimised against a growing working set of worst inputs"
                    + " (paths and bonds on host graphs); after each round the structural engine finds the worst input"
                    + " under the new weights, and the search ends when it finds none worse than the set; the final"
                    + " W+ and W- are the engine's values (exact unless \"exact\" is false)");
            m.put("workingSet", ws);
        }
        Map<String, Object> cand = new LinkedHashMap<>();
        cand.put("domainSize", r.domainSize < 0 ? (Object) Math.pow(2, n) : (Object) r.domainSize);
        cand.put("positive", r.candidatePositive);
        cand.put("negative", r.candidateNegative);
        cand.put("why", r.method.equals("working-set") ? "only the working set's inputs are evaluated during the"
                + " search; the structural engine searches the whole domain by paths and bonds (or branch and bound)"
                : "inputs dominated by a neighbour under Rayleigh monotonicity cannot be worst and are skipped "
                + "during the search; the final numbers come from the full analysis"
                + (r.cut == null ? "" : " unless the time budget cut it (see \"cut\")"));
        m.put("evaluated", cand);
        Map<String, Object> cert = new LinkedHashMap<>();
        cert.put("positive", r.worstPositiveCertificate == null ? Json.NULL : detail(sc, r.worstPositiveCertificate));
        cert.put("negative", r.worstNegativeCertificate == null ? Json.NULL : detail(sc, r.worstNegativeCertificate));
        m.put("certificate", cert);
        m.put("note", "the weight problem is not convex in general: the best of " + r.starts
                + " start(s) is reported, a local optimum, not a proof of optimality");
        m.put("convention", CONVENTION);
        m.put("caution", CAUTION);
        return m;
    }

    /** An input as text: from its mask, else from its certificate (more than 63 variables), else null. */
    private static Object worst(long mask, InputDetail cert, int n) {
        if (mask >= 0) {
            return Inputs.format(mask, n);
        }
        return cert == null ? Json.NULL : cert.input;
    }

    /**
     * The scenario JSON text with new edge weights, by edge position; every other key, including
     * unknown ones, is kept as it was.
     */
    @SuppressWarnings("unchecked")
    public static String withWeights(String scenarioJson, Scenario weighted) {
        Map<String, Object> doc = (Map<String, Object>) Json.parse(scenarioJson);
        Map<String, Object> graph = (Map<String, Object>) doc.get("graph");
        List<Object> edges = (List<Object>) graph.get("edges");
        for (int i = 0; i < edges.size(); i++) {
            ((Map<String, Object>) edges.get(i)).put("weight", weighted.edges().get(i).weight());
        }
        return Json.writePretty(doc);
    }

    public static Object num(double v) {
        return Double.isNaN(v) || Double.isInfinite(v) ? Json.NULL : (Object) Double.valueOf(v);
    }
}
