package spanwright.cli;

import spanwright.analysis.Analysis;
import spanwright.analysis.InputDetail;
import spanwright.analysis.StructuralAnalysis;
import spanwright.io.NumberText;
import spanwright.model.Normalisation;
import spanwright.model.Scenario;

/** The human summary of a structural analysis: short, aligned, pasteable into notes. */
final class StructureText {
    private StructureText() {}

    static String summary(StructuralAnalysis.Result r, Analysis.Choice choice) {
        Scenario sc = r.scenario();
        int n = sc.variableCount();
        StringBuilder sb = new StringBuilder();
        sb.append(sc.title().isEmpty() ? "(untitled scenario)" : sc.title()).append('\n');
        sb.append(Main.row("method", 12, choice.reason()));
        sb.append(Main.row("variables", 12, n + " (one per edge: 2^" + n + " inputs, not enumerated)"));
        sb.append(Main.row("graph", 12, sc.vertexCount() + " vertices, " + sc.edges().size() + " edges, s = "
                + sc.vertices().get(sc.s()).id() + ", t = " + sc.vertices().get(sc.t()).id()));
        StructuralAnalysis.Reduction rd = r.reduction();
        if (sc.functionText() != null) {
            sb.append(Main.row("function", 12, sc.functionText()));
        }
        String verdict;
        switch (rd.status()) {
            case "by construction":
                verdict = "correct by construction (" + rd.method() + ")";
                break;
            case "holds":
                verdict = "correct on all 2^" + n + " inputs (" + rd.method() + ")";
                break;
            case "fails":
                verdict = "WRONG on " + rd.counterexamples() + " input(s) (" + rd.method() + "); first: "
                        + String.join(" ", rd.firstCounterexamples());
                break;
            default:
                verdict = "not checked (" + rd.method() + ")";
        }
        sb.append(Main.row("reduction", 12, verdict));
        side(sb, "positive", "W+ = max R = ", r.positive());
        side(sb, "negative", "W- = max C = ", r.negative());
        sb.append(Main.row("bound", 12, "sqrt(W+ W-) = " + (r.exact() ? NumberText.sig(r.complexity(), 10)
                : "in [" + NumberText.sig(r.complexity(), 10) + ", " + NumberText.sig(Math.sqrt(r.positive().upper()
                        * r.negative().upper()), 10) + "] (certified interval: a budget was reached)")
                + (Boolean.FALSE.equals(rd.correct()) ? " — " + Analysis.notABound(String.valueOf(rd.counterexamples()))
                        : "")));
        sb.append(Main.row("how", 12, r.method()));
        if (r.cut() != null) {
            sb.append(Main.row("cut", 12, r.cut()));
        }
        sb.append("  note: ").append(Normalisation.CONVENTION).append(".\n");
        sb.append("  caution: ").append(Normalisation.CAUTION).append(".\n");
        return sb.toString();
    }

    private static void side(StringBuilder sb, String label, String name, StructuralAnalysis.Side s) {
        String value = s.exact() ? NumberText.sig(s.value(), 10)
                : "in [" + NumberText.sig(s.value(), 10) + ", " + NumberText.sig(s.upper(), 10) + "]";
        String count = s.extremeInputs() == null ? "" : " over " + s.extremeInputs() + (label.equals("positive")
                ? " minimal positive inputs (simple s-t paths)" : " maximal negative inputs (s-t bonds)");
        sb.append(Main.row(label, 12, name + value + count));
        sb.append(Main.row("", 12, "how: " + s.method()));
        if (s.worst() != null) {
            sb.append(Main.row("", 12, "worst " + s.worst().input));
        }
    }

    /** One input's witness: its value and the present edges with their currents, or the potentials. */
    static String detail(Scenario sc, InputDetail d) {
        StringBuilder sb = new StringBuilder();
        sb.append(Main.row("input", 12, d.input));
        sb.append(Main.row(d.witness.connected ? "positive" : "negative", 12, (d.witness.connected ? "R = " : "C = ")
                + NumberText.sig(d.witness.value, 12) + (d.f == null ? "" : ", f = " + (d.f ? 1 : 0))));
        for (int i = 0; i < sc.edges().size(); i++) {
            String id = sc.edges().get(i).id();
            if (d.witness.connected) {
                if (d.present[i] && d.witness.current[i] != 0) {
                    sb.append(Main.row("", 12, "edge " + id + ": current " + NumberText.sig(d.witness.current[i], 10)));
                }
            } else if (!d.present[i] && d.witness.energy[i] != 0) {
                sb.append(Main.row("", 12, "edge " + id + " (absent): energy " + NumberText.sig(d.witness.energy[i], 10)));
            }
        }
        if (!d.witness.connected) {
            StringBuilder pot = new StringBuilder();
            for (int v = 0; v < sc.vertexCount(); v++) {
                pot.append(v > 0 ? ", " : "").append(sc.vertices().get(v).id()).append(' ')
                        .append(NumberText.sig(d.witness.potential[v], 6));
            }
            sb.append(Main.row("potentials", 12, pot.toString()));
        }
        return sb.toString();
    }
}
