package spanwright.sweep;

import java.util.List;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * A least-squares power law y ≈ c·x^a through points (x, y), fitted as the straight line
 * log y = log c + a·log x, with the standard error of the exponent: with m points, residual sum of
 * squares RSS and design matrix X = [1, log x], the covariance of the estimates is
 * σ²(XᵀX)⁻¹ with σ² = RSS/(m − 2), the textbook ordinary-least-squares formula (e.g. Draper &amp;
 * Smith, "Applied Regression Analysis", 3rd ed., 1998, ch. 2). Solved with EJML's least-squares
 * solver (QR); two points give the exponent with no error estimate (NaN). Points with x ≤ 0 or a
 * y that is not a positive finite number are left out. Immutable.
 *
 * <p>A fit over small n is evidence about the growth, not a proof of it.
 */
public final class PowerFit {
    public final double exponent;
    public final double standardError;
    public final double prefactor;
    public final int points;
    public final double fromX;
    public final double toX;
    /** Why there is no fit (fewer than two usable points), or null. */
    public final String missing;

    private PowerFit(double exponent, double standardError, double prefactor, int points, double fromX, double toX,
            String missing) {
        this.exponent = exponent;
        this.standardError = standardError;
        this.prefactor = prefactor;
        this.points = points;
        this.fromX = fromX;
        this.toX = toX;
        this.missing = missing;
    }

    /** Fits the usable points among (xs[i], ys[i]). */
    public static PowerFit fit(List<Double> xs, List<Double> ys) {
        int m = 0;
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < xs.size(); i++) {
            if (usable(xs.get(i), ys.get(i))) {
                m++;
                lo = Math.min(lo, xs.get(i));
                hi = Math.max(hi, xs.get(i));
            }
        }
        if (m < 2 || lo == hi) {
            return new PowerFit(Double.NaN, Double.NaN, Double.NaN, m, m == 0 ? Double.NaN : lo, m == 0 ? Double.NaN : hi,
                    m < 2 ? "fewer than two sizes with a finite positive value" : "all sizes have the same n");
        }
        DMatrixRMaj a = new DMatrixRMaj(m, 2);
        DMatrixRMaj b = new DMatrixRMaj(m, 1);
        int k = 0;
        for (int i = 0; i < xs.size(); i++) {
            if (usable(xs.get(i), ys.get(i))) {
                a.set(k, 0, 1.0);
                a.set(k, 1, Math.log(xs.get(i)));
                b.set(k, 0, Math.log(ys.get(i)));
                k++;
            }
        }
        LinearSolverDense<DMatrixRMaj> solver = LinearSolverFactory_DDRM.leastSquares(m, 2);
        DMatrixRMaj design = a.copy();
        if (!solver.setA(design)) {
            return new PowerFit(Double.NaN, Double.NaN, Double.NaN, m, lo, hi, "the fit's design matrix is singular");
        }
        DMatrixRMaj beta = new DMatrixRMaj(2, 1);
        solver.solve(b.copy(), beta);
        double rss = 0;
        for (int i = 0; i < m; i++) {
            double r = b.get(i, 0) - beta.get(0, 0) - beta.get(1, 0) * a.get(i, 1);
            rss += r * r;
        }
        double se = Double.NaN;
        if (m > 2) {
            DMatrixRMaj xtx = new DMatrixRMaj(2, 2);
            CommonOps_DDRM.multTransA(a, a, xtx);
            if (CommonOps_DDRM.invert(xtx)) {
                se = Math.sqrt(rss / (m - 2) * xtx.get(1, 1));
            }
        }
        return new PowerFit(beta.get(1, 0), se, Math.exp(beta.get(0, 0)), m, lo, hi, null);
    }

    private static boolean usable(Double x, Double y) {
        return x != null && y != null && x > 0 && y > 0 && !Double.isInfinite(y) && !Double.isNaN(y);
    }
}
