package spanwright.sweep;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.model.Normalisation;

/**
 * The table of a sweep and its fitted exponents: rows (one per size, from {@link SweepSize#row}),
 * and least-squares power laws ({@link PowerFit}) of each measured series against the number of
 * variables n, over a chosen tail of the sizes. Deterministic: the same rows give the same report.
 */
public final class SweepReport {
    /** The caution shown with every fitted exponent. */
    public static final String FIT_CAUTION = "a least-squares exponent over small n is evidence about the growth, not a"
            + " proof of it; the values are asymptotic query-complexity bounds for the span-program algorithm (weight ="
            + " resistance, each edge once), not run-time estimates for real hardware";

    /** The series fitted, as (key, what it is, path into a row). */
    static final String[][] SERIES = {
        {"complexity", "sqrt(W+ W-) with the sweep's weights", "complexity"},
        {"initialComplexity", "sqrt(W+ W-) with the builder's weights", "optimizer.initialComplexity"},
        {"maxResistance", "W+ (balanced weights)", "positive.maxResistance"},
        {"maxCapacitance", "W- (balanced weights)", "negative.maxCapacitance"},
        {"adversaryGeneralLower", "ADV± (certified lower end)", "bounds.adversaryGeneral.lower"},
        {"adversary", "ADV (certified lower end)", "bounds.adversary.lower"},
        {"decisionTree", "D, the deterministic query complexity", "bounds.decisionTree"},
    };

    private SweepReport() {}

    /**
     * The fits of {@code rows} (status ok) against the number of variables, over the rows with
     * n ≥ {@code fromN} (0 for no lower limit) and then the last {@code last} of those (0 for all).
     */
    public static Map<String, Object> fits(List<Map<String, Object>> rows, int fromN, int last) {
        return fits(rows, fromN, last, "variables");
    }

    /**
     * The same fits over the same tail, against {@code against}: {@code "variables"} (as
     * {@link #fits(List, int, int)}) or {@code "size"}, the family parameter (K_n's n, a grid's side),
     * the variable in which graph-problem bounds are stated; keys {@code fromSize}, {@code toSize}.
     */
    public static Map<String, Object> fits(List<Map<String, Object>> rows, int fromN, int last, String against) {
        boolean bySize = against.equals("size");
        List<Map<String, Object>> tail = new ArrayList<>();
        for (Map<String, Object> r : rows) {
            Object n = r.get("variables");
            if ("ok".equals(r.get("status")) && n instanceof Number && ((Number) n).intValue() >= fromN) {
                tail.add(r);
            }
        }
        if (last > 0 && tail.size() > last) {
            tail = tail.subList(tail.size() - last, tail.size());
        }
        Map<String, Object> out = new LinkedHashMap<>();
        out.put("against", bySize ? "size" : "variables");
        Map<String, Object> t = new LinkedHashMap<>();
        t.put("fromVariables", fromN);
        t.put("last", last);
        t.put("sizes", sizesOf(tail));
        out.put("tail", t);
        Map<String, Object> series = new LinkedHashMap<>();
        for (String[] s : SERIES) {
            List<Double> xs = new ArrayList<>();
            List<Double> ys = new ArrayList<>();
            for (Map<String, Object> r : tail) {
                Object y = at(r, s[2]);
                if (y instanceof Number) {
                    xs.add(((Number) r.get(bySize ? "size" : "variables")).doubleValue());
                    ys.add(((Number) y).doubleValue());
                }
            }
            if (xs.isEmpty()) {
                continue;
            }
            PowerFit f = PowerFit.fit(xs, ys);
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("what", s[1]);
            m.put("exponent", f.exponent);
            m.put("standardError", f.standardError);
            m.put("prefactor", f.prefactor);
            m.put("points", f.points);
            m.put(bySize ? "fromSize" : "fromVariables", f.fromX);
            m.put(bySize ? "toSize" : "toVariables", f.toX);
            if (f.missing != null) {
                m.put("missing", f.missing);
            }
            // competing models (offset, log factor), residuals and local exponents: the plain
            // exponent alone misreads an offset or a log factor as faster growth
            m.put("growth", GrowthModels.toJson(GrowthModels.fit(xs, ys)));
            series.put(s[0], m);
        }
        out.put("series", series);
        out.put("caution", FIT_CAUTION);
        out.put("convention", Normalisation.CONVENTION);
        return out;
    }

    private static List<Object> sizesOf(List<Map<String, Object>> rows) {
        List<Object> l = new ArrayList<>();
        for (Map<String, Object> r : rows) {
            Object s = r.get("size");
            l.add(s instanceof Number ? (Object) ((Number) s).intValue() : s);
        }
        return l;
    }

    /** The value at a dotted path of nested maps, or null. */
    static Object at(Map<String, Object> row, String path) {
        Object cur = row;
        int start = 0;
        while (start <= path.length()) {
            int dot = path.indexOf('.', start);
            String part = dot < 0 ? path.substring(start) : path.substring(start, dot);
            if (!(cur instanceof Map)) {
                return null;
            }
            cur = ((Map<?, ?>) cur).get(part);
            if (dot < 0) {
                break;
            }
            start = dot + 1;
        }
        return cur;
    }
}
