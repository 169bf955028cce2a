package spanwright.sweep;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Competing growth models for a series y(n) over a sweep's sizes, so that an offset or a log factor
 * is not read as a larger exponent: a·n^b (straight line in log–log), a·n^b + c (an offset), and
 * a·n^b·log n (a log factor), each fitted by least squares, with the relative residuals
 * (ŷ − y)/y of every point, and the local exponents log(y₂/y₁)/log(n₂/n₁) between consecutive
 * sizes. The model the text reports is the one with the smallest corrected Akaike criterion
 * AICc = m·ln(RSS/m) + 2k + 2k(k+1)/(m−k−1) on the relative residuals (Hurvich &amp; Tsai,
 * Biometrika 76, 1989), among the models with m ≥ k + 2 points; with fewer points, the plain
 * power law. Immutable results; O(m) per trial exponent.
 *
 * <p>Why: y = √2·n − 0.83 over n = 2…6 (2, 3.41, 4.83, 6.24, 7.66) is linear, yet a pure power law
 * fits it with b ≈ 1.22; the offset model recovers b = 1. A fitted exponent over small sizes is
 * evidence, not proof, whichever model is reported.
 */
public final class GrowthModels {
    /** One fitted model. */
    public record Model(String name, String formula, int parameters, double a, double b, double c, double rss,
            double aicc, double[] residuals) {}

    /** The models, the local exponents, and the one reported (by name). */
    public record Result(List<Model> models, double[] localExponents, String reported, String why) {
        /** The reported model. */
        public Model reportedModel() {
            for (Model m : models) {
                if (m.name().equals(reported)) {
                    return m;
                }
            }
            return null;
        }
    }

    private GrowthModels() {}

    /** Fits the usable points (n > 0, y positive and finite; n > 1 for the log model). */
    public static Result fit(List<Double> ns, List<Double> ys) {
        List<double[]> pts = new ArrayList<>();
        for (int i = 0; i < ns.size(); i++) {
            Double n = ns.get(i);
            Double y = ys.get(i);
            if (n != null && y != null && n > 0 && y > 0 && !y.isNaN() && !y.isInfinite()) {
                pts.add(new double[] {n, y});
            }
        }
        pts.sort((p, q) -> Double.compare(p[0], q[0]));
        int m = pts.size();
        double[] n = new double[m];
        double[] y = new double[m];
        for (int i = 0; i < m; i++) {
            n[i] = pts.get(i)[0];
            y[i] = pts.get(i)[1];
        }
        double[] local = new double[Math.max(0, m - 1)];
        for (int i = 0; i + 1 < m; i++) {
            local[i] = n[i + 1] == n[i] ? Double.NaN : Math.log(y[i + 1] / y[i]) / Math.log(n[i + 1] / n[i]);
        }
        List<Model> models = new ArrayList<>();
        if (m >= 2) {
            models.add(power(n, y));
            if (m >= 3) {
                models.add(offset(n, y));
            }
            boolean logOk = true;
            for (double v : n) {
                logOk &= v > 1;
            }
            if (logOk) {
                models.add(powerLog(n, y));
            }
        }
        String reported = models.isEmpty() ? null : models.get(0).name();
        String why = models.isEmpty() ? "fewer than two usable sizes" : "the only model with enough points";
        double best = Double.POSITIVE_INFINITY;
        for (Model md : models) {
            if (m >= md.parameters() + 2 && md.aicc() < best) {
                best = md.aicc();
                reported = md.name();
                why = "smallest AICc on relative residuals";
            }
        }
        return new Result(models, local, reported, why);
    }

    /** y = a·n^b by least squares of log y on log n. */
    static Model power(double[] n, double[] y) {
        double[] line = line(log(n), log(y));
        double a = Math.exp(line[0]);
        double b = line[1];
        return finish("power", "a n^b", 2, a, b, 0, n, y, k -> a * Math.pow(n[k], b));
    }

    /** y = a·n^b·log n by least squares of log(y / log n) on log n. */
    static Model powerLog(double[] n, double[] y) {
        double[] ly = new double[y.length];
        for (int i = 0; i < y.length; i++) {
            ly[i] = Math.log(y[i] / Math.log(n[i]));
        }
        double[] line = line(log(n), ly);
        double a = Math.exp(line[0]);
        double b = line[1];
        return finish("power-log", "a n^b log n", 2, a, b, 0, n, y, k -> a * Math.pow(n[k], b) * Math.log(n[k]));
    }

    /**
     * y = a·n^b + c: for each trial b the best (a, c) is a weighted linear least-squares problem
     * (weights 1/y², so the residuals are relative); b is found by a scan of [−1, 8] in steps of
     * 0.01 refined by golden-section search on the bracketing interval.
     */
    static Model offset(double[] n, double[] y) {
        double bestB = 0;
        double bestR = Double.POSITIVE_INFINITY;
        for (double b = -1; b <= 8 + 1e-9; b += 0.01) {
            double r = offsetFit(n, y, b)[2];
            if (r < bestR) {
                bestR = r;
                bestB = b;
            }
        }
        double lo = bestB - 0.01;
        double hi = bestB + 0.01;
        double g = (Math.sqrt(5) - 1) / 2;
        for (int it = 0; it < 60; it++) {
            double x1 = hi - g * (hi - lo);
            double x2 = lo + g * (hi - lo);
            if (offsetFit(n, y, x1)[2] < offsetFit(n, y, x2)[2]) {
                hi = x2;
            } else {
                lo = x1;
            }
        }
        double b = (lo + hi) / 2;
        if (offsetFit(n, y, b)[2] > bestR) {
            b = bestB;
        }
        double[] ac = offsetFit(n, y, b);
        double fb = b;
        return finish("offset", "a n^b + c", 3, ac[0], fb, ac[1], n, y, k -> ac[0] * Math.pow(n[k], fb) + ac[1]);
    }

    /** The (a, c, relative RSS) minimising Σ ((a·n^b + c − y)/y)² for fixed b. */
    private static double[] offsetFit(double[] n, double[] y, double b) {
        double s11 = 0;
        double s12 = 0;
        double s22 = 0;
        double t1 = 0;
        double t2 = 0;
        for (int i = 0; i < n.length; i++) {
            double w = 1 / (y[i] * y[i]);
            double u = Math.pow(n[i], b);
            s11 += w * u * u;
            s12 += w * u;
            s22 += w;
            t1 += w * u * y[i];
            t2 += w * y[i];
        }
        double det = s11 * s22 - s12 * s12;
        if (!(Math.abs(det) > 1e-300)) {
            return new double[] {Double.NaN, Double.NaN, Double.POSITIVE_INFINITY};
        }
        double a = (t1 * s22 - t2 * s12) / det;
        double c = (s11 * t2 - s12 * t1) / det;
        double rss = 0;
        for (int i = 0; i < n.length; i++) {
            double r = (a * Math.pow(n[i], b) + c - y[i]) / y[i];
            rss += r * r;
        }
        return new double[] {a, c, rss};
    }

    private static Model finish(String name, String formula, int k, double a, double b, double c, double[] n,
            double[] y, java.util.function.IntToDoubleFunction model) {
        int m = n.length;
        double[] res = new double[m];
        double rss = 0;
        for (int i = 0; i < m; i++) {
            res[i] = (model.applyAsDouble(i) - y[i]) / y[i];
            rss += res[i] * res[i];
        }
        double aicc = Double.NaN;
        if (m >= k + 2) {
            // a perfect fit has RSS 0; a floor keeps the criterion finite and ranks perfect fits by k
            aicc = m * Math.log(Math.max(rss, 1e-24) / m) + 2 * k + 2.0 * k * (k + 1) / (m - k - 1);
        }
        return new Model(name, formula, k, a, b, c, rss, aicc, res);
    }

    private static double[] log(double[] v) {
        double[] r = new double[v.length];
        for (int i = 0; i < v.length; i++) {
            r[i] = Math.log(v[i]);
        }
        return r;
    }

    /** Intercept and slope of the least-squares line through (x, y). */
    private static double[] line(double[] x, double[] y) {
        int m = x.length;
        double mx = 0;
        double my = 0;
        for (int i = 0; i < m; i++) {
            mx += x[i] / m;
            my += y[i] / m;
        }
        double sxy = 0;
        double sxx = 0;
        for (int i = 0; i < m; i++) {
            sxy += (x[i] - mx) * (y[i] - my);
            sxx += (x[i] - mx) * (x[i] - mx);
        }
        double slope = sxx == 0 ? Double.NaN : sxy / sxx;
        return new double[] {my - slope * mx, slope};
    }

    /** The result as JSON-ready maps (keys: models, localExponents, reported, why). */
    public static Map<String, Object> toJson(Result r) {
        Map<String, Object> out = new LinkedHashMap<>();
        List<Object> ms = new ArrayList<>();
        for (Model md : r.models()) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("name", md.name());
            m.put("formula", md.formula());
            m.put("a", md.a());
            m.put("b", md.b());
            if (md.parameters() == 3) {
                m.put("c", md.c());
            }
            m.put("relativeRss", md.rss());
            m.put("aicc", md.aicc());
            List<Object> res = new ArrayList<>();
            for (double v : md.residuals()) {
                res.add(v);
            }
            m.put("relativeResiduals", res);
            ms.add(m);
        }
        out.put("models", ms);
        List<Object> loc = new ArrayList<>();
        for (double v : r.localExponents()) {
            loc.add(v);
        }
        out.put("localExponents", loc);
        out.put("reported", r.reported());
        out.put("why", r.why());
        return out;
    }
}
