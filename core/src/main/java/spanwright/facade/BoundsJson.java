package spanwright.facade;

import spanwright.io.Json;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.bounds.Bounds;
import spanwright.bounds.BoundsReport;
import spanwright.bounds.Certificate;
import spanwright.bounds.ClassicalMeasures;
import spanwright.bounds.DecisionTree;
import spanwright.bounds.GeneralAdversary;
import spanwright.bounds.PositiveAdversary;
import spanwright.bounds.SensitiveBlocks;
import spanwright.bounds.TargetFunction;
import spanwright.bounds.TopMonomial;

/**
 * The JSON form of a {@link BoundsReport}, shared by {@code bounds --json} and the page
 * ({@code JsonFacade.bounds}). Keys (documented in {@code docs/bounds.md}; added to, never renamed):
 * {@code adversary: {general, generalDual, generalGap, positive, positiveUpper, …, reasons}},
 * {@code classical: {D, C0, C1, C, s, bs, deg, witnesses, reasons}}, {@code complexity},
 * {@code optimalityGap}, {@code speedup}, {@code reasons}, {@code caution}. A quantity not
 * computed is null and its reason is under the {@code reasons} of its group.
 */
public final class BoundsJson {
    /** At most this many adversary-matrix entries and input weights are listed (largest first). */
    public static final int LISTED_ENTRIES = 64;

    private BoundsJson() {}

    public static Map<String, Object> report(BoundsReport r) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("title", r.scenario().title());
        m.put("variables", new ArrayList<Object>(r.scenario().variables()));
        m.put("function", r.scenario().functionText());
        m.put("promise", r.scenario().promise().describe(r.scenario().variables()));
        m.put("domainSize", ResultJson.num(r.measured().domainSize));
        m.put("method", r.measured().method);
        m.put("complexityExact", r.measured().exact);
        m.put("adversary", adversary(r));
        m.put("classical", classical(r));
        m.put("complexity", ResultJson.num(r.complexity()));
        m.put("optimalityGap", ResultJson.num(r.optimalityGap()));
        m.put("speedup", ResultJson.num(r.speedup()));
        m.put("optimisedComplexity", ResultJson.num(r.optimisedComplexity()));
        m.put("optimisedGap", ResultJson.num(r.optimisedGap()));
        m.put("optimiserStatus", r.optimised() == null ? Json.NULL
                : r.optimised().status.name().toLowerCase().replace('_', '-'));
        Map<String, Object> reasons = new LinkedHashMap<>();
        for (String k : new String[] {"complexity", "optimalityGap", "speedup", "optimisedComplexity"}) {
            if (r.reason(k) != null) {
                reasons.put(k, r.reason(k));
            }
        }
        m.put("reasons", reasons);
        Map<String, Object> limits = new LinkedHashMap<>();
        limits.put("for", r.limits().where());
        limits.put("general", r.limits().general());
        limits.put("positive", r.limits().positive());
        limits.put("classical", r.limits().classical());
        m.put("limits", limits);
        m.put("reductionCorrect", r.measured().correct == null ? Json.NULL : r.measured().correct);
        // as in the analysis (ResultJson): where the graph does not decide f, √(W₊W₋) and the
        // comparisons built on it are no bound for f
        boolean wrong = Boolean.FALSE.equals(r.measured().correct);
        m.put("complexityIsBound", !wrong);
        if (wrong) {
            m.put("complexityNote", spanwright.analysis.Analysis.notABound(r.measured().counterexamples));
        }
        m.put("convention", ResultJson.CONVENTION);
        m.put("caution", Bounds.CAUTION);
        return m;
    }

    private static Map<String, Object> adversary(BoundsReport r) {
        Map<String, Object> a = new LinkedHashMap<>();
        Map<String, Object> reasons = new LinkedHashMap<>();
        GeneralAdversary g = r.general();
        if (g == null) {
            for (String k : new String[] {"general", "generalDual", "generalGap"}) {
                a.put(k, Json.NULL);
                reasons.put(k, r.reason("general"));
            }
        } else {
            TargetFunction f = g.function();
            a.put("general", g.lower());
            a.put("generalDual", g.upper());
            a.put("generalGap", g.gap());
            a.put("generalStatus", lower(g.status().name()));
            a.put("generalMethod", lower(g.method().name()));
            a.put("generalIterations", g.iterations());
            a.put("generalConstraints", g.constraintCount());
            a.put("adversaryMatrix", matrixEntries(g, f));
            a.put("inputWeights", inputWeights(g, f));
        }
        PositiveAdversary p = r.positive();
        if (p == null) {
            a.put("positive", Json.NULL);
            a.put("positiveUpper", Json.NULL);
            a.put("positiveMinimax", Json.NULL);
            a.put("positiveMethod", Json.NULL);
            reasons.put("positive", r.reason("positive"));
            reasons.put("positiveUpper", r.reason("positive"));
        } else {
            a.put("positive", p.lower());
            a.put("positiveUpper", p.upper());
            a.put("positiveMinimax", p.minimaxUpper());
            a.put("positiveMethod", p.solvedBySdp() ? "minimax+sdp" : "minimax");
            if (p.tightZero() >= 0) {
                TargetFunction f = p.function();
                Map<String, Object> tight = new LinkedHashMap<>();
                tight.put("x", f.format(f.input(p.tightZero())));
                tight.put("y", f.format(f.input(p.tightOne())));
                tight.put("px", distribution(f, p.distribution(p.tightZero())));
                tight.put("py", distribution(f, p.distribution(p.tightOne())));
                a.put("tightPair", tight);
            }
        }
        a.put("reasons", reasons);
        return a;
    }

    private static List<Object> matrixEntries(GeneralAdversary g, TargetFunction f) {
        Integer[] order = new Integer[g.pairCount()];
        for (int q = 0; q < order.length; q++) {
            order[q] = q;
        }
        Arrays.sort(order, (a, b) -> Double.compare(Math.abs(g.pairWeight(b)), Math.abs(g.pairWeight(a))));
        List<Object> l = new ArrayList<>();
        for (int i = 0; i < Math.min(LISTED_ENTRIES, order.length); i++) {
            int q = order[i];
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("x", f.format(f.input(g.pairZero(q))));
            e.put("y", f.format(f.input(g.pairOne(q))));
            e.put("weight", g.pairWeight(q));
            l.add(e);
        }
        return l;
    }

    private static List<Object> inputWeights(GeneralAdversary g, TargetFunction f) {
        Integer[] order = new Integer[f.size()];
        for (int k = 0; k < order.length; k++) {
            order[k] = k;
        }
        Arrays.sort(order, (a, b) -> Double.compare(g.inputWeight(b), g.inputWeight(a)));
        List<Object> l = new ArrayList<>();
        for (int i = 0; i < Math.min(LISTED_ENTRIES, order.length); i++) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("x", f.format(f.input(order[i])));
            e.put("weight", g.inputWeight(order[i]));
            l.add(e);
        }
        return l;
    }

    private static Map<String, Object> distribution(TargetFunction f, double[] p) {
        Map<String, Object> m = new LinkedHashMap<>();
        for (int i = 0; i < p.length; i++) {
            m.put(f.variables().get(i), p[i]);
        }
        return m;
    }

    private static Map<String, Object> classical(BoundsReport r) {
        Map<String, Object> c = new LinkedHashMap<>();
        Map<String, Object> reasons = new LinkedHashMap<>();
        ClassicalMeasures cm = r.classical();
        String[] keys = {"D", "C0", "C1", "C", "s", "bs", "deg"};
        if (cm == null) {
            for (String k : keys) {
                c.put(k, Json.NULL);
                reasons.put(k, r.reason("classical"));
            }
            c.put("reasons", reasons);
            return c;
        }
        TargetFunction f = cm.function();
        c.put("D", cm.decisionTreeDepth());
        c.put("C0", cm.c0());
        c.put("C1", cm.c1());
        c.put("C", cm.c());
        c.put("s", cm.sensitivity());
        c.put("bs", cm.blockSensitivity());
        if (cm.hasDegree()) {
            c.put("deg", cm.degree());
        } else {
            c.put("deg", Json.NULL);
            reasons.put("deg", r.reason("deg"));
        }
        Map<String, Object> w = new LinkedHashMap<>();
        w.put("decisionTree", tree(cm.decisionTree(), f));
        w.put("certificate0", certificate(cm.zeroCertificate(), f));
        w.put("certificate1", certificate(cm.oneCertificate(), f));
        w.put("sensitivity", blocks(cm.sensitiveInput(), f));
        w.put("blockSensitivity", blocks(cm.sensitiveBlocks(), f));
        TopMonomial t = cm.topMonomial();
        if (t == null) {
            w.put("degree", Json.NULL);
        } else {
            Map<String, Object> mono = new LinkedHashMap<>();
            mono.put("monomial", new ArrayList<Object>(f.names(t.variables())));
            mono.put("coefficient", t.coefficient());
            w.put("degree", mono);
        }
        c.put("witnesses", w);
        c.put("reasons", reasons);
        return c;
    }

    /** {"query": name, "when0": …, "when1": …} or {"answer": 0|1, "reachable": bool}. */
    static Map<String, Object> tree(DecisionTree t, TargetFunction f) {
        Map<String, Object> m = new LinkedHashMap<>();
        if (t.isLeaf()) {
            m.put("answer", t.answer() ? 1 : 0);
            m.put("reachable", t.reachable());
        } else {
            m.put("query", f.variables().get(t.variable()));
            m.put("when0", tree(t.zero(), f));
            m.put("when1", tree(t.one(), f));
        }
        return m;
    }

    private static Object certificate(Certificate c, TargetFunction f) {
        if (c == null) {
            return Json.NULL;
        }
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("x", f.format(c.input()));
        m.put("f", c.value() ? 1 : 0);
        Map<String, Object> fixed = new LinkedHashMap<>();
        for (int i = 0; i < f.variableCount(); i++) {
            if ((c.fixed() & f.variableMask(i)) != 0) {
                fixed.put(f.variables().get(i), f.bit(c.input(), i) ? 1 : 0);
            }
        }
        m.put("fixed", fixed);
        return m;
    }

    private static Map<String, Object> blocks(SensitiveBlocks b, TargetFunction f) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("x", f.format(b.input()));
        m.put("f", b.value() ? 1 : 0);
        List<Object> l = new ArrayList<>();
        for (long block : b.blocks()) {
            l.add(new ArrayList<Object>(f.names(block)));
        }
        m.put("blocks", l);
        return m;
    }

    private static String lower(String enumName) {
        return enumName.toLowerCase().replace('_', '-');
    }
}
