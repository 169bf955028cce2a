package spanwright.facade;

import java.util.ArrayList;
import java.util.List;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.analysis.InputDetail;
import spanwright.analysis.StructuralAnalysis;
import spanwright.io.NumberText;
import spanwright.io.TikzWriter;
import spanwright.model.Inputs;
import spanwright.model.Normalisation;
import spanwright.model.Scenario;

/**
 * The drawing as a TikZ figure, with one input's witness and the caption line: the input and
 * its R or C ({@link StructuralAnalysis#detail}, any number of variables), the bound W₊, W₋,
 * √(W₊W₋) (by the method {@link Analysis#choose} picks, unless the caller passes them), the normalisation and the caution ({@link Normalisation}). The
 * command line's {@code export --tikz} and {@link JsonFacade#tikz} both come here, so the page
 * and the command line write the same figure. Text by {@link TikzWriter}. Cost: that of the
 * analysis (skipped when W₊ and W₋ are given) plus O(|V|³) for the input's witness. No threads,
 * no reflection (the page calls it).
 */
public final class TikzFigure {
    private TikzFigure() {}

    /** The two forms of the figure, and its caption lines. */
    public static final class Text {
        /** A document that compiles alone with pdflatex. */
        public final String standalone;
        /** The {@code tikzpicture} alone, for {@code \input}. */
        public final String body;
        /** The caption lines the figure carries (the page's PNG and SVG exports show the same). */
        public final List<Line> caption;

        Text(String standalone, String body, List<Line> caption) {
            this.standalone = standalone;
            this.body = body;
            this.caption = caption;
        }
    }

    /** One caption line: its role ({@code input}, {@code value}, {@code bound}, {@code normalisation}, {@code caution}) and text (ASCII). */
    public static final class Line {
        public final String role;
        public final String text;

        Line(String role, String text) {
            this.role = role;
            this.text = text;
        }
    }

    /**
     * @param mask the focused input, or −1 for none (every edge drawn solid)
     * @param bound {W₊, W₋} when the caller has them (NaN for a side with no input), or null to
     *     have them computed (see {@link #draw(Scenario, boolean[], double[], String)})
     */
    public static Text draw(Scenario sc, long mask, double[] bound) {
        if (mask < 0) {
            return draw(sc, (boolean[]) null, bound, null);
        }
        int n = sc.variableCount();
        boolean[] x = new boolean[n];
        for (int i = 0; i < n; i++) {
            x[i] = Inputs.bit(mask, i, n);
        }
        return draw(sc, x, bound, null);
    }

    /**
     * @param x the focused input (variable 0 first; any number of variables), or null for none
     * @param bound {W₊, W₋} when the caller has them (NaN for a side with no input), or null to
     *     have them computed by the method {@link Analysis#choose} picks (enumeration, or the
     *     structural engine beyond it), which also checks the reduction
     * @param note with a given {@code bound}: why √(W₊W₋) is not a bound for f (the analysis's
     *     {@code complexityNote}), or null when it is one
     */
    public static Text draw(Scenario sc, boolean[] x, double[] bound, String note) {
        List<Line> lines = new ArrayList<>();
        TikzWriter.Focus focus = null;
        if (x != null) {
            InputDetail d = StructuralAnalysis.detail(sc, x);
            boolean connected = d.witness.connected;
            focus = new TikzWriter.Focus(connected, d.present, d.witness.current, d.witness.potential);
            lines.add(new Line("input", "Input x = " + d.input + " (" + variablesOf(sc, d.input) + ")"));
            boolean bad = d.f != null && d.f != connected;
            lines.add(new Line("value", (connected ? "positive, s and t connected: effective resistance R = "
                    + NumberText.sig(d.witness.value, 6) + " (arrows: the unit s-t current, width by its size)"
                    : "negative, s and t apart: effective capacitance C = " + NumberText.sig(d.witness.value, 6)
                            + " (vertex colour: potential)")
                    + (d.f == null ? "" : "; f(x) = " + (d.f ? 1 : 0)) + (bad ? ", a counterexample" : "")
                    + (d.mask < 0 || sc.promise().allows(d.mask) ? "" : "; this input is outside the promise")
                    + ". Solid: present in G(x); dashed: absent."));
        } else {
            lines.add(new Line("input", "No input focused: every edge drawn with its literal (and its weight when not 1)."));
        }
        double wp;
        double wn;
        String why = note;
        if (bound != null) {
            wp = bound[0];
            wn = bound[1];
        } else if (Analysis.choose(sc, Analysis.Method.AUTO).method() == Analysis.Method.STRUCTURE) {
            StructuralAnalysis.Result r = StructuralAnalysis.run(sc);
            wp = r.positive().worst() == null ? Double.NaN : r.positive().value();
            wn = r.negative().worst() == null ? Double.NaN : r.negative().value();
            why = Boolean.FALSE.equals(r.reduction().correct())
                    ? Analysis.notABound(String.valueOf(r.reduction().counterexamples())) : null;
        } else {
            AnalysisResult r = Analysis.run(sc);
            wp = r.worstPositive() < 0 ? Double.NaN : r.maxResistance();
            wn = r.worstNegative() < 0 ? Double.NaN : r.maxCapacitance();
            why = Boolean.FALSE.equals(r.correct()) ? Analysis.notABound(Long.toString(r.counterexampleCount())) : null;
        }
        lines.add(new Line("bound", "W+ = " + side(wp, "no positive input") + ", W- = " + side(wn, "no negative input")
                + (Double.isNaN(wp) || Double.isNaN(wn) ? "" : ", bound sqrt(W+ W-) = "
                        + NumberText.sig(Math.sqrt(wp * wn), 6)) + (why == null ? "" : "; " + why) + "."));
        lines.add(new Line("normalisation", "Normalisation: " + Normalisation.CONVENTION + "."));
        lines.add(new Line("caution", "Caution: " + Normalisation.CAUTION + "."));
        List<String> caption = new ArrayList<>();
        for (Line l : lines) {
            caption.add(l.text);
        }
        return new Text(TikzWriter.standalone(sc, focus, caption), TikzWriter.body(sc, focus, caption), lines);
    }

    /** "a=0, b=1, …" for up to 16 variables; beyond, the first and last names in order. */
    private static String variablesOf(Scenario sc, String input) {
        List<String> v = sc.variables();
        int n = v.size();
        if (n > 16 || input.length() != n) {
            return "variables " + v.get(0) + ", " + v.get(1) + ", ..., " + v.get(n - 1) + " in this order";
        }
        List<String> pairs = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            pairs.add(v.get(i) + "=" + input.charAt(i));
        }
        return String.join(", ", pairs);
    }

    private static String side(double v, String none) {
        return Double.isNaN(v) ? "none (" + none + ")" : NumberText.sig(v, 6);
    }
}
