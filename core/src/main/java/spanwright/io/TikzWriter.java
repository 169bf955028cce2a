package spanwright.io;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import spanwright.model.Condition;
import spanwright.model.Edge;
import spanwright.model.Scenario;
import spanwright.model.Vertex;

/**
 * The scenario's drawing as a TikZ figure (pgf/TikZ, the LaTeX drawing package), in two forms: a
 * {@link #body} to {@code \input} into a paper (needs {@code &#92;usepackage{tikz}}; it loads the
 * libraries {@code arrows.meta} and {@code shapes.geometric} itself) and a {@link #standalone}
 * document that compiles alone with pdflatex (article, geometry and tikz only; a page cut to the
 * figure). What the page's drawing shows: s a diamond, t a square, other vertices circles, each
 * vertex labelled with its id; every edge one {@code \draw} (parallel edges bent apart), labelled
 * with its literal and, when not 1, its weight. With a focused input: present edges solid, absent
 * edges dashed and grey; on a positive input each present edge's width grows with |current| and
 * an arrow points along the unit s→t current; on a negative input the vertices are filled by
 * potential on a two-colour ramp with a colour key. The caption lines (the input, its R or C,
 * the bound, the normalisation) are printed under the drawing and repeated as comments.
 *
 * <p>Coordinates: the scenario's (y grows downwards) mirrored to TikZ's (y upwards), 3 cm per
 * 100 units, shrunk to fit 12 cm × 14 cm; vertices without positions are put on a circle.
 * Numbers go through {@link NumberText}. Cost: O(|V| + |E|). Stateless.
 */
public final class TikzWriter {
    /** Width of the drawing at most (cm). */
    static final double MAX_WIDTH = 12;
    /** Height of the drawing at most (cm). */
    static final double MAX_HEIGHT = 14;
    private static final double CM_PER_UNIT = 3.0 / 100;

    private TikzWriter() {}

    /**
     * One input's witness to draw: which edges are present, the unit s→t current on each edge
     * (oriented u→v; used on a positive input) and the vertex potentials (used on a negative
     * input; NaN where undefined). Arrays are not copied; do not modify.
     */
    public static final class Focus {
        final boolean positive;
        final boolean[] present;
        final double[] current;
        final double[] potential;

        public Focus(boolean positive, boolean[] present, double[] current, double[] potential) {
            this.positive = positive;
            this.present = present;
            this.current = current;
            this.potential = potential;
        }
    }

    /** The standalone document: compiles alone with pdflatex. */
    public static String standalone(Scenario sc, Focus focus, List<String> caption) {
        Layout l = new Layout(sc);
        double width = Math.max(l.width, 8) + 1.6;
        int chars = 0;
        for (String c : caption) {
            chars += c.length();
        }
        double textWidth = Math.max(l.width, 8);
        // caption lines wrapped at about 7 characters per cm (footnotesize), 0.4 cm per line
        double captionHeight = 0.5 + 0.4 * (caption.size() + Math.ceil(chars / (textWidth * 7.0)));
        double height = l.height + 1.6 + captionHeight + (focus != null && !focus.positive ? 1.2 : 0);
        StringBuilder sb = new StringBuilder();
        // \documentclass first, so the file is recognised as a LaTeX document by its first line
        sb.append("\\documentclass{article}\n");
        sb.append("% Spanwright figure: compile with pdflatex; the body between the markers can be \\input on its own.\n");
        sb.append("\\usepackage[paperwidth=").append(num(Math.ceil(width))).append("cm,paperheight=")
                .append(num(Math.ceil(height))).append("cm,margin=0.5cm]{geometry}\n");
        sb.append("\\usepackage{tikz}\n");
        sb.append("\\pagestyle{empty}\n");
        sb.append("\\begin{document}\n\\centering\n");
        sb.append("% --- body ---\n");
        sb.append(body(sc, focus, caption));
        sb.append("% --- end of body ---\n");
        sb.append("\\end{document}\n");
        return sb.toString();
    }

    /** The figure alone, for {@code \input}: one {@code tikzpicture}. */
    public static String body(Scenario sc, Focus focus, List<String> caption) {
        Layout l = new Layout(sc);
        StringBuilder sb = new StringBuilder();
        for (String c : caption) {
            sb.append("% ").append(c.replace('\n', ' ')).append('\n');
        }
        sb.append("% needs \\usepackage{tikz} in the preamble\n");
        sb.append("\\usetikzlibrary{arrows.meta,shapes.geometric}\n");
        sb.append("\\begin{tikzpicture}[\n");
        sb.append("  swvertex/.style={circle, draw, thick, fill=white, inner sep=1.5pt, minimum size=6mm,"
                + " font=\\footnotesize\\sffamily},\n");
        sb.append("  swsource/.style={swvertex, diamond, minimum size=8mm, very thick, font=\\footnotesize\\sffamily\\bfseries},\n");
        sb.append("  swtarget/.style={swvertex, rectangle, minimum size=6.5mm, very thick,"
                + " font=\\footnotesize\\sffamily\\bfseries},\n");
        sb.append("  swedge/.style={draw=black!80, line width=0.8pt},\n");
        sb.append("  swpresent/.style={swedge},\n");
        sb.append("  swabsent/.style={draw=black!40, line width=0.8pt, dashed},\n");
        sb.append("  swlabel/.style={font=\\scriptsize\\sffamily, fill=white, inner sep=1pt},\n");
        sb.append("  swcaption/.style={font=\\footnotesize, align=left, text width=")
                .append(num(Math.max(l.width, 8))).append("cm}]\n");
        sb.append("\\definecolor{swlow}{HTML}{DCE8F5}\n");
        sb.append("\\definecolor{swhigh}{HTML}{F0A95B}\n");
        int n = sc.vertexCount();
        double pmin = Double.POSITIVE_INFINITY;
        double pmax = Double.NEGATIVE_INFINITY;
        boolean ramp = focus != null && !focus.positive && focus.potential != null;
        if (ramp) {
            for (double p : focus.potential) {
                if (!Double.isNaN(p) && !Double.isInfinite(p)) {
                    pmin = Math.min(pmin, p);
                    pmax = Math.max(pmax, p);
                }
            }
            ramp = pmin <= pmax;
        }
        for (int i = 0; i < n; i++) {
            String style = i == sc.s() ? "swsource" : i == sc.t() ? "swtarget" : "swvertex";
            if (ramp && !Double.isNaN(focus.potential[i])) {
                double f = pmax > pmin ? (focus.potential[i] - pmin) / (pmax - pmin) : 1;
                style += ", fill=swhigh!" + Math.round(100 * f) + "!swlow";
            }
            sb.append("\\node[").append(style).append("] (v").append(i).append(") at (").append(num(l.x[i]))
                    .append(",").append(num(l.y[i])).append(") {").append(TexText.escape(sc.vertices().get(i).id())).append("};\n");
        }
        Map<Long, Integer> seen = new HashMap<>();
        Map<Long, Integer> total = new HashMap<>();
        for (Edge e : sc.edges()) {
            total.merge(pair(e), 1, Integer::sum);
        }
        for (int k = 0; k < sc.edges().size(); k++) {
            Edge e = sc.edges().get(k);
            List<String> style = new ArrayList<>();
            List<String> label = new ArrayList<>();
            label.add(literal(e.when()));
            if (e.weight() != 1) {
                label.add("$w$\\,=\\," + number(e.weight()));
            }
            boolean present = focus == null || focus.present[k];
            style.add(present ? "swpresent" : "swabsent");
            if (focus != null && focus.positive && present && focus.current != null) {
                double c = focus.current[k];
                double a = Math.min(1, Math.abs(c));
                style.add("line width=" + num(0.6 + 2.8 * a) + "pt");
                if (c > 1e-12) {
                    style.add("-{Stealth[length=" + num(2 + 3 * a) + "pt]}");
                } else if (c < -1e-12) {
                    style.add("{Stealth[length=" + num(2 + 3 * a) + "pt]}-");
                }
                label.add("$i$\\,=\\," + number(Math.abs(c)));
            }
            long key = pair(e);
            int index = seen.merge(key, 1, Integer::sum) - 1;
            int count = total.get(key);
            String path;
            if (e.isSelfLoop()) {
                path = "to[loop above, looseness=" + num(6 + 2 * index) + "]";
            } else if (count == 1) {
                path = "--";
            } else {
                double bend = (index - (count - 1) / 2.0) * 24;
                // the bend is measured along u→v; parallel edges stored v→u bend the other way
                if (e.u() > e.v()) {
                    bend = -bend;
                }
                path = bend == 0 ? "--" : "to[bend " + (bend > 0 ? "left" : "right") + "=" + num(Math.abs(bend)) + "]";
            }
            sb.append("\\draw[").append(String.join(", ", style)).append("] (v").append(e.u()).append(") ").append(path)
                    .append(" node[swlabel, sloped, above=1pt] {").append(String.join(" \\ ", label)).append("} (v")
                    .append(e.v()).append(");\n");
        }
        double below = l.minY - 0.9;
        if (ramp) {
            double left = l.minX;
            double right = l.minX + Math.min(4, Math.max(2, l.width));
            sb.append("\\shade[left color=swlow, right color=swhigh, draw=black!60] (").append(num(left)).append(",")
                    .append(num(below - 0.3)).append(") rectangle (").append(num(right)).append(",").append(num(below))
                    .append(");\n");
            sb.append("\\node[swlabel, anchor=north] at (").append(num(left)).append(",").append(num(below - 0.3))
                    .append(") {$\\varphi=$\\," + number(pmin) + "};\n");
            sb.append("\\node[swlabel, anchor=north] at (").append(num(right)).append(",").append(num(below - 0.3))
                    .append(") {$\\varphi=$\\," + number(pmax) + "};\n");
            sb.append("\\node[swlabel, anchor=west] at (").append(num(right + 0.2)).append(",").append(num(below - 0.15))
                    .append(") {potential (vertex colour)};\n");
            below -= 1.0;
        }
        if (!caption.isEmpty()) {
            sb.append("\\node[swcaption, anchor=north west] at (").append(num(l.minX)).append(",").append(num(below))
                    .append(") {");
            for (int i = 0; i < caption.size(); i++) {
                sb.append(i > 0 ? "\\\\\n  " : "").append(TexText.escape(caption.get(i)));
            }
            sb.append("};\n");
        }
        sb.append("\\end{tikzpicture}\n");
        return sb.toString();
    }

    private static long pair(Edge e) {
        int a = Math.min(e.u(), e.v());
        int b = Math.max(e.u(), e.v());
        return ((long) a << 32) | b;
    }

    /** The condition for the label: a variable, its negation with ¬, or 1. */
    private static String literal(Condition c) {
        if (c.isAlways()) {
            return "1";
        }
        return (c.positive() ? "" : "$\\neg$") + TexText.escape(c.variableName());
    }

    /** A value for people in TeX: 4 significant digits, ∞ and minus signs as math. */
    static String number(double v) {
        return TexText.escape(NumberText.sig(v, 4));
    }

    /** A coordinate or length: at most 3 decimals, plain notation (TikZ reads no exponents). */
    static String num(double v) {
        double r = Math.round(v * 1000) / 1000.0;
        if (Math.abs(r) < 1e-4) {
            return "0";
        }
        return NumberText.sig(r, 9);
    }

    /** Vertex positions in cm, TikZ's orientation, and the drawing's extent. */
    private static final class Layout {
        final double[] x;
        final double[] y;
        double minX;
        double minY;
        double width;
        double height;

        Layout(Scenario sc) {
            int n = sc.vertexCount();
            double[] px = new double[n];
            double[] py = new double[n];
            boolean placed = true;
            for (Vertex v : sc.vertices()) {
                placed &= v.hasPosition();
            }
            for (int i = 0; i < n; i++) {
                Vertex v = sc.vertices().get(i);
                if (placed) {
                    px[i] = v.x();
                    py[i] = -v.y();
                } else {
                    double a = Math.PI + 2 * Math.PI * i / n;
                    double r = Math.max(100, n * 100 / (2 * Math.PI));
                    px[i] = r * Math.cos(a);
                    py[i] = r * Math.sin(a);
                }
            }
            double x0 = Double.POSITIVE_INFINITY;
            double x1 = Double.NEGATIVE_INFINITY;
            double y0 = Double.POSITIVE_INFINITY;
            double y1 = Double.NEGATIVE_INFINITY;
            for (int i = 0; i < n; i++) {
                x0 = Math.min(x0, px[i]);
                x1 = Math.max(x1, px[i]);
                y0 = Math.min(y0, py[i]);
                y1 = Math.max(y1, py[i]);
            }
            if (n == 0) {
                x0 = x1 = y0 = y1 = 0;
            }
            double scale = CM_PER_UNIT;
            if ((x1 - x0) * scale > MAX_WIDTH) {
                scale = MAX_WIDTH / (x1 - x0);
            }
            if ((y1 - y0) * scale > MAX_HEIGHT) {
                scale = MAX_HEIGHT / (y1 - y0);
            }
            if (x1 - x0 > 0 && (x1 - x0) * scale < 2 && (y1 - y0) * scale < 2) {
                // a layout in small units (networkx's spring layout lies in [-1, 1])
                scale = 6 / Math.max(x1 - x0, y1 - y0);
            }
            x = new double[n];
            y = new double[n];
            for (int i = 0; i < n; i++) {
                x[i] = (px[i] - x0) * scale;
                y[i] = (py[i] - y0) * scale;
            }
            minX = 0;
            minY = 0;
            width = (x1 - x0) * scale;
            height = (y1 - y0) * scale;
        }
    }
}
