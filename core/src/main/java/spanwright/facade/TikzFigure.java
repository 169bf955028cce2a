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

    /** The two forms of the figure. */
    public static final class Text {
        /** A document that compiles alone with pdflatex. */
        public final String standalone;
        /** The {@code tikzpicture} alone, for {@code \input}. */
        public final String body;

        Text(String standalone, String body) {
            this.standalone = standalone;
            this.body = body;
        }
    }

    /**
     * @param mask the focused input, or −1 for none (every edge drawn solid)
     * @param bound {W₊, W₋} when the caller has them (NaN for a side with no input), or null to
     *     have them computed (see {@link #draw(Scenario, boolean[], double[])})
     */
    public static Text draw(Scenario sc, long mask, double[] bound) {
        if (mask < 0) {
            return draw(sc, (boolean[]) null, bound);
        }
        int n = sc.variableCount();
        boolean[] x = new boolean[n];
        for (int i = 0; i < n; i++) {
            x[i] = Inputs.bit(mask, i, n);
        }
        return draw(sc, x, bound);
    }

    /**
     * @param x the focused input (variable 0 first; any number of variables), or null for none
     * @param bound {W₊, W₋} when the caller has them (NaN for a side with no input), or null to
     *     have them computed by the method {@link Analysis#choose} picks (enumeration, or the
     *     structural engine beyond it)
     */
    public static Text draw(Scenario sc, boolean[] x, double[] bound) {
        List<String> caption = new ArrayList<>();
        TikzWriter.Focus focus = null;
        if (x != null) {
            InputDetail d = StructuralAnalysis.detail(sc, x);
            boolean connected = d.witness.connected;
            focus = new TikzWriter.Focus(connected, d.present, d.witness.current, d.witness.potential);
            caption.add("Input x = " + d.input + " (" + String.join(", ", sc.variables()) + "): "
                    + (connected ? "s and t connected, R = " + NumberText.sig(d.witness.value, 6)
                            + " (effective resistance; arrows: the unit s-t current, width by its size)"
                            : "s and t not connected, C = " + NumberText.sig(d.witness.value, 6)
                            + " (effective capacitance; vertex colour: potential)")
                    + (d.mask < 0 || sc.promise().allows(d.mask) ? "" : "; this input is outside the promise")
                    + ". Solid: present in G(x); dashed: absent.");
        } else {
            caption.add("No input focused: every edge drawn with its literal (and its weight when not 1).");
        }
        double wp;
        double wn;
        if (bound != null) {
            wp = bound[0];
            wn = bound[1];
        } else if (Analysis.choose(sc, Analysis.Method.AUTO).method() == Analysis.Method.STRUCTURE) {
            StructuralAnalysis.Result r = StructuralAnalysis.run(sc);
            wp = r.positive().worst() == null ? Double.NaN : r.positive().value();
            wn = r.negative().worst() == null ? Double.NaN : r.negative().value();
        } else {
            AnalysisResult r = Analysis.run(sc);
            wp = r.worstPositive() < 0 ? Double.NaN : r.maxResistance();
            wn = r.worstNegative() < 0 ? Double.NaN : r.maxCapacitance();
        }
        caption.add("W+ = " + side(wp, "no positive input") + ", W- = " + side(wn, "no negative input")
                + (Double.isNaN(wp) || Double.isNaN(wn) ? "" : ", bound sqrt(W+ W-) = "
                        + NumberText.sig(Math.sqrt(wp * wn), 6)) + ".");
        caption.add("Normalisation: " + Normalisation.CONVENTION + ".");
        caption.add("Caution: " + Normalisation.CAUTION + ".");
        return new Text(TikzWriter.standalone(sc, focus, caption), TikzWriter.body(sc, focus, caption));
    }

    private static String side(double v, String none) {
        return Double.isNaN(v) ? "none (" + none + ")" : NumberText.sig(v, 6);
    }
}
