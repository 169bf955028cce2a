package spanwright.cli;

import java.io.PrintStream;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisRun;
import spanwright.analysis.InputDetail;
import spanwright.analysis.StructuralAnalysis;
import spanwright.analysis.Summary;
import spanwright.facade.ResultJson;
import spanwright.facade.StructureJson;
import spanwright.io.Json;
import spanwright.io.NumberText;
import spanwright.model.Deadline;
import spanwright.model.Edge;
import spanwright.model.Inputs;
import spanwright.model.Normalisation;
import spanwright.model.Scenario;

/**
 * {@code analyze} beyond enumeration: the structural method, one input's witness at any size, and
 * an enumeration cut by {@code --seconds}.
 */
final class AnalyzeMore {
    private AnalyzeMore() {}

    static int structure(Scenario sc, Analysis.Choice choice, boolean json, boolean inputs, double seconds,
            Deadline budget, PrintStream out, PrintStream err, boolean quiet) {
        if (inputs) {
            throw new Main.UsageException("analyze: --inputs lists every input, and this scenario has 2^"
                    + sc.variableCount() + " of them; the structural method shows the worst inputs instead (drop"
                    + " --inputs), and --input BITS shows any one input's witness");
        }
        StructuralAnalysis.Result r;
        try (Progress progress = Progress.start("analyze", err, quiet)) {
            // --seconds bounds the whole analysis; without it, branch and bound's 30 s per side as before
            progress.phase(Double.isInfinite(seconds)
                    ? "structural analysis (heaviest path and bond, branch and bound at most "
                            + spanwright.io.NumberText.sig(StructuralAnalysis.DEFAULT_SECONDS, 4) + " s per side, then the reduction check)"
                    : "structural analysis (heaviest path and bond, then the reduction check; time budget "
                            + spanwright.io.NumberText.sig(seconds, 4) + " s in all)");
            r = StructuralAnalysis.run(sc, StructuralAnalysis.DEFAULT_STATES,
                    StructuralAnalysis.DEFAULT_NODES, StructuralAnalysis.DEFAULT_DIAGRAM_NODES,
                    Double.isInfinite(seconds) ? StructuralAnalysis.DEFAULT_SECONDS : seconds, budget);
        }
        if (json) {
            out.println(Json.writePretty(StructureJson.analysis(r, choice)).trim());
        } else {
            out.print(StructureText.summary(r, choice));
        }
        return Boolean.FALSE.equals(r.reduction().correct()) ? Main.WRONG_REDUCTION : Main.OK;
    }

    /**
     * An enumeration the time budget cut: what the inputs reached (the first ones in input order)
     * show — lower ends of W₊ and W₋ with their worst inputs, derived upper ends, the counterexamples
     * among them — and what was not done, in text or JSON. Exit 1 when a counterexample was found,
     * else 0 (the reduction is then not known to fail).
     */
    static int partial(Scenario sc, AnalysisRun run, double seconds, boolean json, PrintStream out) {
        Summary s = run.soFar();
        int n = sc.variableCount();
        long done = run.processed();
        long total = run.total();
        // derived caps, valid for every input: R ≤ Σ w (the unit flow along one s–t path of present
        // edges, Thomson's principle), C ≤ Σ 1/w over the switchable edges (the potential 1 on s's
        // component and 0 elsewhere is admissible)
        double rCap = 0;
        double cCap = 0;
        for (Edge e : sc.edges()) {
            if (!e.isSelfLoop()) {
                rCap += e.weight();
                cCap += e.when().isAlways() ? 0 : 1 / e.weight();
            }
        }
        boolean checked = sc.function() != null;
        long wrong = s.counterexampleCount();
        String cut = "the time budget of " + NumberText.sig(seconds, 4) + " s ran out after " + done + " of " + total
                + " inputs (in input order): W+ and W- are lower ends over those inputs, with derived upper ends (the"
                + " sum of all weights, the sum of 1/w over the switchable edges)"
                + (checked ? ", and the reduction was checked on those inputs only" : "")
                + "; give more time (--seconds), or drop --seconds";
        double lower = Math.sqrt(s.maxResistance() * s.maxCapacitance());
        if (json) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("title", sc.title());
            m.put("method", "enumerate");
            m.put("complete", false);
            m.put("evaluated", done);
            m.put("domainSize", total);
            Map<String, Object> red = new LinkedHashMap<>();
            red.put("checked", checked);
            red.put("correct", wrong > 0 ? (Object) Boolean.FALSE : Json.NULL);
            red.put("counterexampleCount", wrong);
            List<Object> first = new ArrayList<>();
            for (long x : s.counterexamples()) {
                first.add(Inputs.format(x, n));
            }
            red.put("counterexamples", first);
            m.put("reduction", red);
            m.put("positive", side(s.positiveCount(), s.maxResistance(), rCap, s.worstPositive(), n, "maxResistance"));
            m.put("negative", side(s.negativeCount(), s.maxCapacitance(), cCap, s.worstNegative(), n,
                    "maxCapacitance"));
            m.put("complexity", ResultJson.num(lower));
            m.put("complexityUpper", ResultJson.num(Math.sqrt(rCap * cCap)));
            m.put("exact", false);
            m.put("cut", cut);
            m.put("convention", Normalisation.CONVENTION);
            m.put("caution", Normalisation.CAUTION);
            out.println(Json.writePretty(m).trim());
        } else {
            StringBuilder sb = new StringBuilder();
            sb.append(sc.title().isEmpty() ? "(untitled scenario)" : sc.title()).append('\n');
            sb.append(Main.row("method", 12, "enumeration, cut by the time budget: " + done + " of " + total
                    + " inputs evaluated"));
            if (checked) {
                sb.append(Main.row("reduction", 12, wrong > 0 ? "WRONG on " + wrong + " of the " + done
                        + " inputs evaluated" : "correct on the " + done + " inputs evaluated; the rest not checked"));
            }
            sb.append(Main.row("positive", 12, "W+ = max R in [" + NumberText.sig(s.maxResistance(), 10) + ", "
                    + NumberText.sig(rCap, 10) + "]" + (s.worstPositive() < 0 ? "" : ", worst so far "
                    + Inputs.format(s.worstPositive(), n))));
            sb.append(Main.row("negative", 12, "W- = max C in [" + NumberText.sig(s.maxCapacitance(), 10) + ", "
                    + NumberText.sig(cCap, 10) + "]" + (s.worstNegative() < 0 ? "" : ", worst so far "
                    + Inputs.format(s.worstNegative(), n))));
            sb.append(Main.row("bound", 12, "sqrt(W+ W-) in [" + NumberText.sig(lower, 10) + ", "
                    + NumberText.sig(Math.sqrt(rCap * cCap), 10) + "] (not exact)"));
            sb.append(Main.row("cut", 12, cut));
            sb.append("  note: ").append(Normalisation.CONVENTION).append(".\n");
            sb.append("  caution: ").append(Normalisation.CAUTION).append(".\n");
            out.print(sb);
        }
        return wrong > 0 ? Main.WRONG_REDUCTION : Main.OK;
    }

    private static Map<String, Object> side(long count, double value, double upper, long worst, int n, String key) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("count", count);
        m.put(key, ResultJson.num(value));
        m.put("upper", ResultJson.num(upper));
        m.put("worst", worst < 0 ? Json.NULL : Inputs.format(worst, n));
        return m;
    }

    static int oneInput(Scenario sc, String bits, boolean json, PrintStream out) {
        int n = sc.variableCount();
        if (bits.length() != n || !bits.matches("[01]*")) {
            throw new Main.UsageException("analyze: --input needs " + n + " characters 0/1 (one per variable, in the"
                    + " order of \"variables\"), got " + bits.length() + " characters");
        }
        boolean[] x = new boolean[n];
        for (int i = 0; i < n; i++) {
            x[i] = bits.charAt(i) == '1';
        }
        InputDetail d = StructuralAnalysis.detail(sc, x);
        if (json) {
            Map<String, Object> m = ResultJson.detail(sc, d);
            out.println(Json.writePretty(m).trim());
        } else {
            out.print(StructureText.detail(sc, d));
        }
        return Main.OK;
    }
}
