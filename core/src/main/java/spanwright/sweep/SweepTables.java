package spanwright.sweep;

import spanwright.io.Json;
import java.util.List;
import java.util.Map;
import spanwright.io.NumberText;

/**
 * A sweep result as text: CSV (full precision, one row per size, for spreadsheets and plotting
 * scripts), a LaTeX {@code tabular} a paper can {@code \input} (rounded, with the fitted
 * exponents and the cautions beneath), and the aligned table the command-line tool prints.
 * Column names are our own; listed in {@code docs/sweeps.md}.
 */
public final class SweepTables {
    /** CSV columns, in order. */
    public static final List<String> CSV_COLUMNS = List.of("size", "variables", "vertices", "edges", "status", "method",
            "domain_inputs", "evaluated_inputs", "reduction_correct", "w_plus", "w_minus", "sqrt_w_plus_w_minus",
            "builder_sqrt_w_plus_w_minus", "optimizer_status", "adv_general_lower", "adv_general_upper", "adv_lower",
            "decision_tree_depth", "reason");

    private SweepTables() {}

    private static Object at(Map<String, Object> row, String path) {
        return SweepReport.at(row, path);
    }

    private static String full(Object v) {
        if (v == null || v == spanwright.io.Json.NULL) {
            return "";
        }
        if (v instanceof Double) {
            double d = (Double) v;
            if (Double.isNaN(d) || Double.isInfinite(d)) {
                return "";
            }
            return d == Math.rint(d) && Math.abs(d) < 1e15 ? Long.toString((long) d) : Double.toString(d);
        }
        return String.valueOf(v);
    }

    private static String csvField(String s) {
        if (s.indexOf(',') < 0 && s.indexOf('"') < 0 && s.indexOf('\n') < 0) {
            return s;
        }
        return "\"" + s.replace("\"", "\"\"") + "\"";
    }

    /** The rows of a result document as CSV (header line first, RFC 4180 quoting). */
    @SuppressWarnings("unchecked")
    public static String csv(Map<String, Object> result) {
        StringBuilder sb = new StringBuilder(String.join(",", CSV_COLUMNS)).append('\n');
        for (Object o : (List<Object>) result.get("rows")) {
            Map<String, Object> r = (Map<String, Object>) o;
            Object reason = r.get("reason") != null ? r.get("reason") : at(r, "error.message");
            String[] f = {full(r.get("size")), full(r.get("variables")), full(r.get("vertices")), full(r.get("edges")),
                full(r.get("status")), full(r.get("method")), full(r.get("domainSize")), full(r.get("evaluated")),
                full(at(r, "reduction.correct")), full(at(r, "positive.maxResistance")),
                full(at(r, "negative.maxCapacitance")), full(r.get("complexity")), full(at(r, "optimizer.initialComplexity")),
                full(at(r, "optimizer.status")), full(at(r, "bounds.adversaryGeneral.lower")),
                full(at(r, "bounds.adversaryGeneral.upper")), full(at(r, "bounds.adversary.lower")),
                full(at(r, "bounds.decisionTree")), full(reason)};
            for (int i = 0; i < f.length; i++) {
                sb.append(i > 0 ? "," : "").append(csvField(f[i]));
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    private static String sig(Object v, int digits) {
        if (!(v instanceof Number)) {
            return "--";
        }
        double d = ((Number) v).doubleValue();
        return Double.isNaN(d) ? "--" : NumberText.sig(d, digits);
    }

    private static String latexNumber(Object v) {
        String m = latexMath(sig(v, 6));
        return m.indexOf('\\') < 0 ? m : "$" + m + "$";
    }

    /** A number from {@link NumberText#sig} in math-mode notation: 1.7e-10 → 1.7\cdot 10^{-10}. */
    private static String latexMath(String s) {
        int e = s.indexOf('e');
        return e < 0 ? s : s.substring(0, e) + "\\cdot 10^{" + s.substring(e + 1) + "}";
    }

    /** Text for a LaTeX comment or a \multicolumn cell: no line breaks, special characters escaped. */
    private static String latexText(String s) {
        return spanwright.io.TexText.escape(s);
    }

    /** A LaTeX {@code tabular} of the rows with the fitted exponents and the cautions. */
    @SuppressWarnings("unchecked")
    public static String latex(Map<String, Object> result) {
        Map<String, Object> param = (Map<String, Object>) result.get("parameter");
        String p = String.valueOf(param.get("name"));
        StringBuilder sb = new StringBuilder();
        sb.append("% Spanwright sweep: ").append(latexText(String.valueOf(result.get("title")))).append('\n');
        sb.append("% ").append(latexText(String.valueOf(result.get("convention")))).append('\n');
        sb.append("\\begin{tabular}{rrrrrrrrr}\n\\hline\n");
        sb.append("$").append(p.length() == 1 ? p : "\\mathit{" + latexText(p) + "}")
                .append("$ & $n$ & $|V|$ & $|E|$ & $W_+$ & $W_-$ & $\\sqrt{W_+W_-}$ & $\\mathrm{ADV}^{\\pm}$ & $D$ \\\\\n");
        sb.append("\\hline\n");
        for (Object o : (List<Object>) result.get("rows")) {
            Map<String, Object> r = (Map<String, Object>) o;
            boolean ok = "ok".equals(r.get("status"));
            sb.append(full(r.get("size"))).append(" & ").append(full(r.get("variables"))).append(" & ")
                    .append(full(r.get("vertices"))).append(" & ").append(full(r.get("edges"))).append(" & ");
            if (ok) {
                sb.append(latexNumber(at(r, "positive.maxResistance"))).append(" & ")
                        .append(latexNumber(at(r, "negative.maxCapacitance"))).append(" & ")
                        .append(latexNumber(r.get("complexity"))).append(" & ")
                        .append(latexNumber(at(r, "bounds.adversaryGeneral.lower"))).append(" & ")
                        .append(latexNumber(at(r, "bounds.decisionTree"))).append(" \\\\\n");
            } else {
                sb.append("\\multicolumn{5}{l}{").append(latexText(String.valueOf(r.get("status")))).append("} \\\\\n");
            }
        }
        sb.append("\\hline\n");
        Map<String, Object> fits = (Map<String, Object>) result.get("fits");
        Map<String, Object> series = fits == null ? null : (Map<String, Object>) fits.get("series");
        if (series != null) {
            for (String key : List.of("complexity", "adversaryGeneralLower", "decisionTree")) {
                Map<String, Object> f = (Map<String, Object>) series.get(key);
                if (f == null || !(f.get("exponent") instanceof Number)
                        || Double.isNaN(((Number) f.get("exponent")).doubleValue())) {
                    continue;
                }
                String label = key.equals("complexity") ? "$\\sqrt{W_+W_-}$" : key.equals("decisionTree") ? "$D$"
                        : "$\\mathrm{ADV}^{\\pm}$";
                sb.append("\\multicolumn{9}{l}{fitted exponent of ").append(label).append(" in $n$: $")
                        .append(latexMath(sig(f.get("exponent"), 4)));
                Object se = f.get("standardError");
                if (se instanceof Number && !Double.isNaN(((Number) se).doubleValue())) {
                    sb.append(" \\pm ").append(latexMath(sig(se, 2)));
                }
                sb.append("$ (").append(full(f.get("points"))).append(" sizes, $n = ").append(full(f.get("fromVariables")))
                        .append("\\ldots ").append(full(f.get("toVariables"))).append("$)} \\\\\n");
            }
        }
        sb.append("\\end{tabular}\n");
        sb.append("% caution: ").append(latexText(String.valueOf(result.get("caution")))).append('\n');
        return sb.toString();
    }

    private static String pad(String s, int w, boolean right) {
        StringBuilder sb = new StringBuilder();
        if (right) {
            for (int i = s.length(); i < w; i++) {
                sb.append(' ');
            }
        }
        sb.append(s);
        if (!right) {
            for (int i = s.length(); i < w; i++) {
                sb.append(' ');
            }
        }
        return sb.toString();
    }

    /** The aligned table for people: rows, fitted exponents, cautions. */
    @SuppressWarnings("unchecked")
    public static String text(Map<String, Object> result) {
        Map<String, Object> param = (Map<String, Object>) result.get("parameter");
        StringBuilder sb = new StringBuilder();
        sb.append(result.get("title")).append("  (").append(param.get("name")).append(" = ").append(param.get("meaning"))
                .append(")\n");
        sb.append(pad(String.valueOf(param.get("name")), 6, true)).append(pad("n", 5, true)).append("  ")
                .append(pad("method", 12, false)).append(pad("evaluated", 11, true)).append(pad("W+", 14, true))
                .append(pad("W-", 14, true)).append(pad("sqrt(W+W-)", 14, true)).append(pad("ADV±", 10, true))
                .append(pad("D", 4, true)).append("  status\n");
        for (Object o : (List<Object>) result.get("rows")) {
            Map<String, Object> r = (Map<String, Object>) o;
            String status = String.valueOf(r.get("status"));
            if (!status.equals("ok")) {
                Object why = r.get("reason") != null ? r.get("reason") : at(r, "error.message");
                status += ": " + why;
            } else if (Boolean.FALSE.equals(at(r, "reduction.correct"))) {
                status = "ok, but the reduction is WRONG on " + full(at(r, "reduction.counterexampleCount")) + " input(s)";
            }
            sb.append(pad(full(r.get("size")), 6, true)).append(pad(full(r.get("variables")), 5, true)).append("  ")
                    .append(pad(r.get("method") == null ? "-" : String.valueOf(r.get("method")), 12, false))
                    .append(pad(full(r.get("evaluated")), 11, true))
                    .append(pad(sig(at(r, "positive.maxResistance"), 8), 14, true))
                    .append(pad(sig(at(r, "negative.maxCapacitance"), 8), 14, true))
                    .append(pad(sig(r.get("complexity"), 8), 14, true))
                    .append(pad(sig(at(r, "bounds.adversaryGeneral.lower"), 5), 10, true))
                    .append(pad(full(at(r, "bounds.decisionTree")), 4, true)).append("  ").append(status).append('\n');
        }
        Map<String, Object> fits = (Map<String, Object>) result.get("fits");
        if (fits != null) {
            Map<String, Object> tail = (Map<String, Object>) fits.get("tail");
            sb.append("fitted growth in n (first: the power law a n^b by least squares of log value on log n, with its"
                    + " standard error; then competing models with an offset or a log factor, * = the one reported;"
                    + " sizes ").append(tail.get("sizes")).append("):\n");
            for (Map.Entry<String, Object> e : ((Map<String, Object>) fits.get("series")).entrySet()) {
                Map<String, Object> f = (Map<String, Object>) e.getValue();
                sb.append("  ").append(pad(String.valueOf(f.get("what")), 40, false));
                if (f.get("missing") != null) {
                    sb.append("no fit: ").append(f.get("missing")).append('\n');
                    continue;
                }
                sb.append(sig(f.get("exponent"), 4));
                Object se = f.get("standardError");
                sb.append(se instanceof Number && !Double.isNaN(((Number) se).doubleValue()) ? " ± " + sig(se, 2)
                        : " (two points: no error estimate)");
                sb.append("  over n = ").append(full(f.get("fromVariables"))).append(" … ").append(full(f.get("toVariables")))
                        .append('\n');
                growth(sb, (Map<String, Object>) f.get("growth"));
            }
        }
        Map<String, Object> bySize = (Map<String, Object>) result.get("fitsBySize");
        boolean sizeDiffers = false;
        for (Object o : (List<Object>) result.get("rows")) {
            Map<String, Object> r = (Map<String, Object>) o;
            sizeDiffers |= r.get("variables") instanceof Number && r.get("size") instanceof Number
                    && ((Number) r.get("variables")).doubleValue() != ((Number) r.get("size")).doubleValue();
        }
        if (bySize != null && sizeDiffers) {
            Object name = result.get("parameter") instanceof Map ? ((Map<String, Object>) result.get("parameter"))
                    .get("name") : "size";
            Map<String, Object> series = (Map<String, Object>) bySize.get("series");
            for (String key : new String[] {"complexity", "initialComplexity"}) {
                Map<String, Object> f = (Map<String, Object>) series.get(key);
                if (f == null || f.get("missing") != null) {
                    continue;
                }
                Object se = f.get("standardError");
                sb.append("  in the parameter ").append(name).append(": ").append(pad(String.valueOf(f.get("what")), 40,
                        false)).append(sig(f.get("exponent"), 4))
                        .append(se instanceof Number && !Double.isNaN(((Number) se).doubleValue()) ? " ± " + sig(se, 2)
                                : " (two points: no error estimate)")
                        .append("  over ").append(name).append(" = ").append(full(f.get("fromSize"))).append(" … ")
                        .append(full(f.get("toSize"))).append('\n');
                growth(sb, (Map<String, Object>) f.get("growth"));
            }
        }
        sb.append("caution: ").append(result.get("caution")).append(".\n");
        sb.append("convention: ").append(result.get("convention")).append(".\n");
        return sb.toString();
    }

    /** The competing models of one series, the reported one marked, and the local exponents. */
    @SuppressWarnings("unchecked")
    private static void growth(StringBuilder sb, Map<String, Object> g) {
        if (g == null) {
            return;
        }
        for (Object o : (List<Object>) g.get("models")) {
            Map<String, Object> md = (Map<String, Object>) o;
            boolean reported = md.get("name").equals(g.get("reported"));
            sb.append("    ").append(reported ? "* " : "  ").append(pad(String.valueOf(md.get("formula")), 13, false))
                    .append("b = ").append(sig(md.get("b"), 4));
            if (md.get("c") != null) {
                sb.append(", c = ").append(sig(md.get("c"), 4));
            }
            double worst = 0;
            for (Object r : (List<Object>) md.get("relativeResiduals")) {
                worst = Math.max(worst, Math.abs(((Number) r).doubleValue()));
            }
            sb.append("  (largest relative residual ").append(sig(worst, 2)).append(')').append('\n');
        }
        List<Object> local = (List<Object>) g.get("localExponents");
        if (!local.isEmpty()) {
            StringBuilder l = new StringBuilder();
            for (Object v : local) {
                l.append(l.length() > 0 ? ", " : "").append(sig(v, 3));
            }
            sb.append("      local exponents between consecutive sizes: ").append(l).append('\n');
        }
        sb.append("      * reported: ").append(g.get("why")).append('\n');
    }
}
