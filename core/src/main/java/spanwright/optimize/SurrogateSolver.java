package spanwright.optimize;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;
import spanwright.model.Deadline;

/**
 * Minimises the majorising surrogate of log(W₊·W₋) over log-weights u of the free groups:
 *
 * <pre>  S(u) = max_i log(Σ_g a_ig e^{u_g}) + max_j log(Σ_g b_jg e^{−u_g})</pre>
 *
 * where a_i are the squared currents of the optimal flows of the active positive inputs and b_j
 * the squared potential differences of the optimal potentials of the active negative inputs,
 * summed per weight group, both taken at the current weights (Thomson's and Dirichlet's principles
 * make a_i·w ≥ R_w(x_i) and b_j·(1/w) ≥ C_w(y_j) for every w, with equality at the current w).
 * Each term is a log-sum-exp of affine functions of u, so S is convex. The maxima are smoothed by
 * τ·log Σ exp(·/τ) and τ is lowered from 5·10⁻² to 10⁻¹⁰ (continuation); each stage runs damped
 * Newton steps (EJML Cholesky) with Armijo backtracking. A tiny proximal term 10⁻¹⁰·|u − u₀|²/2
 * keeps the minimiser finite along directions that do not change S (the common scale, groups that
 * carry neither current nor charge). Steps are capped at 3 in each coordinate. Cost per Newton
 * step O(K·G² + G³) for K active inputs and G free groups with the dense Cholesky; from
 * {@link #LOW_RANK_MIN_GROUPS} groups, when K is below G/2, O(G·K² + K³) with the Hessian kept as
 * a diagonal plus rank-one terms (see {@link LowRank}).
 *
 * <p><b>Mutable, single-threaded</b> (owns its EJML workspaces).
 */
final class SurrogateSolver {
    private static final double PROX = 1e-10;
    /**
     * Free log-weights are kept within ±BOX of the mean starting log-weight (a factor 10³ either
     * way): beyond that the Laplacians become too ill-conditioned for 1e-9 accuracy, and the gain
     * from an edge of nearly infinite or nearly zero resistance is at most of the order of 10⁻³
     * relative. A quadratic penalty outside the box, then a clamp.
     */
    static final double BOX = Math.log(1e3);
    private static final double WALL = 50.0;

    private final int groups;
    private final boolean[] free;
    private final double[] fixedU;

    SurrogateSolver(int groups, boolean[] free, double[] fixedU) {
        this.groups = groups;
        this.free = free.clone();
        this.fixedU = fixedU.clone();
        double sum = 0;
        int count = 0;
        for (int k = 0; k < groups; k++) {
            if (free[k]) {
                sum += fixedU[k];
                count++;
            }
        }
        this.centre = count == 0 ? 0 : sum / count;
    }

    private final double centre;

    /** The starting point's free log-weights moved into the box. */
    double[] clamp(double[] u) {
        double[] r = u.clone();
        for (int k = 0; k < groups; k++) {
            if (free[k]) {
                r[k] = Math.max(centre - BOX, Math.min(centre + BOX, r[k]));
            }
        }
        return r;
    }

    /**
     * Value of the smoothed surrogate and, when {@code grad} non-null, its gradient and its Hessian:
     * dense into {@code hess}, or as a diagonal plus rank-one terms into {@code lr} (one of the two).
     */
    private double value(double[][] a, double[][] b, double[] u, double[] u0, double tau, double[] grad,
            double[][] hess, LowRank lr) {
        int g = groups;
        double[] e = new double[g];
        double[] einv = new double[g];
        for (int k = 0; k < g; k++) {
            e[k] = Math.exp(u[k]);
            einv[k] = 1.0 / e[k];
        }
        double v = side(a, e, tau, 1.0, grad, hess, lr) + side(b, einv, tau, -1.0, grad, hess, lr);
        for (int k = 0; k < g; k++) {
            if (free[k]) {
                double d = u[k] - u0[k];
                v += 0.5 * PROX * d * d;
                double over = Math.abs(u[k] - centre) - BOX;
                if (over > 0) {
                    v += 0.5 * WALL * over * over;
                }
                if (grad != null) {
                    double[] diag = lr != null ? lr.diag : hess[k]; // entry k: lr.diag[k] or hess[k][k]
                    grad[k] += PROX * d;
                    diag[k] += PROX;
                    if (over > 0) {
                        grad[k] += WALL * over * Math.signum(u[k] - centre);
                        diag[k] += WALL;
                    }
                }
            }
        }
        return v;
    }

    /**
     * τ·LSE over rows r of log(Σ_g c_rg · scale_g)/τ; adds gradient (sign ±1 for e^{±u}) and
     * Hessian contributions.
     */
    private double side(double[][] c, double[] scale, double tau, double sign, double[] grad, double[][] hess,
            LowRank lr) {
        int rows = c.length;
        int g = groups;
        double[] l = new double[rows];
        double lmax = Double.NEGATIVE_INFINITY;
        for (int r = 0; r < rows; r++) {
            double s = 0;
            for (int k = 0; k < g; k++) {
                s += c[r][k] * scale[k];
            }
            l[r] = Math.log(s);
            lmax = Math.max(lmax, l[r]);
        }
        double z = 0;
        double[] sigma = new double[rows];
        for (int r = 0; r < rows; r++) {
            sigma[r] = Math.exp((l[r] - lmax) / tau);
            z += sigma[r];
        }
        double value = lmax + tau * Math.log(z);
        if (grad == null) {
            return value;
        }
        double[] mean = new double[g];
        double[] pi = new double[g];
        for (int r = 0; r < rows; r++) {
            double w = sigma[r] / z;
            if (w < 1e-16) {
                continue;
            }
            double s = Math.exp(l[r]);
            for (int k = 0; k < g; k++) {
                pi[k] = c[r][k] * scale[k] / s;
            }
            if (lr != null) {
                // the same Hessian as below, kept as diagonal + w (1/τ − 1) π πᵀ
                double[] col = new double[g];
                for (int k = 0; k < g; k++) {
                    if (free[k] && pi[k] != 0) {
                        mean[k] += w * pi[k];
                        lr.diag[k] += w * pi[k];
                        col[k] = pi[k];
                    }
                }
                lr.add(col, w * (1.0 / tau - 1.0));
                continue;
            }
            for (int k = 0; k < g; k++) {
                if (!free[k] || pi[k] == 0) {
                    continue;
                }
                mean[k] += w * pi[k];
                hess[k][k] += w * pi[k];
                for (int q = 0; q < g; q++) {
                    if (free[q]) {
                        // −π πᵀ (the log-sum-exp Hessian) + π πᵀ/τ (the smoothed max)
                        hess[k][q] += w * pi[k] * pi[q] * (1.0 / tau - 1.0);
                    }
                }
            }
        }
        if (lr != null) {
            double[] col = new double[g];
            for (int k = 0; k < g; k++) {
                if (free[k]) {
                    grad[k] += sign * mean[k];
                    col[k] = mean[k];
                }
            }
            lr.add(col, -1.0 / tau);
            return value;
        }
        for (int k = 0; k < g; k++) {
            if (!free[k]) {
                continue;
            }
            grad[k] += sign * mean[k];
            for (int q = 0; q < g; q++) {
                if (free[q]) {
                    hess[k][q] -= mean[k] * mean[q] / tau;
                }
            }
        }
        return value;
    }

    /**
     * The Hessian as a diagonal plus a sum of rank-one terms c_j v_j v_jᵀ (one per row that carries
     * weight in the smoothed maximum, and one for each side's mean): the form the Hessian of a
     * log-sum-exp of affine functions has (Boyd &amp; Vandenberghe, "Convex Optimization", 2004,
     * §3.1.5). With K terms and G groups a Newton step then costs O(G·K² + K³) by the Woodbury
     * identity (Golub &amp; Van Loan, "Matrix Computations", 4th ed., 2013, §2.1.4) instead of
     * O(G³) for the dense Cholesky, so one Newton iteration stays short at thousands of groups.
     */
    private static final class LowRank {
        final double[] diag;
        final java.util.List<double[]> cols = new java.util.ArrayList<>();
        final java.util.List<Double> coef = new java.util.ArrayList<>();

        LowRank(int g) {
            diag = new double[g];
        }

        void add(double[] col, double c) {
            cols.add(col);
            coef.add(c);
        }
    }

    /**
     * Solves (D + damping·I + Σ c_j v_j v_jᵀ) s = −grad over the free groups by the Woodbury
     * identity in the form (I + C Vᵀ D⁻¹ V) y = C Vᵀ D⁻¹ r, s = D⁻¹ (r − V y), which needs no 1/c_j.
     *
     * @return false when the small system is singular or the step is not finite
     */
    private static boolean solveLowRank(LowRank lr, double[] grad, int[] freeIdx, int nf, double damping,
            DMatrixRMaj step) {
        int k = lr.cols.size();
        double[] dinv = new double[nf];
        double[] r = new double[nf];
        for (int i = 0; i < nf; i++) {
            dinv[i] = 1.0 / (lr.diag[freeIdx[i]] + damping);
            r[i] = -grad[freeIdx[i]];
        }
        DMatrixRMaj m = new DMatrixRMaj(k, k);
        DMatrixRMaj rhs = new DMatrixRMaj(k, 1);
        DMatrixRMaj y = new DMatrixRMaj(k, 1);
        for (int p = 0; p < k; p++) {
            double[] vp = lr.cols.get(p);
            double cp = lr.coef.get(p);
            double t = 0;
            for (int i = 0; i < nf; i++) {
                t += vp[freeIdx[i]] * dinv[i] * r[i];
            }
            rhs.set(p, 0, cp * t);
            for (int q = 0; q < k; q++) {
                double[] vq = lr.cols.get(q);
                double dot = 0;
                for (int i = 0; i < nf; i++) {
                    double x = vp[freeIdx[i]];
                    if (x != 0) {
                        dot += x * dinv[i] * vq[freeIdx[i]];
                    }
                }
                m.set(p, q, (p == q ? 1 : 0) + cp * dot);
            }
        }
        LinearSolverDense<DMatrixRMaj> lu = LinearSolverFactory_DDRM.lu(k);
        if (k > 0) {
            if (!lu.setA(m)) {
                return false;
            }
            lu.solve(rhs, y);
        }
        for (int i = 0; i < nf; i++) {
            double t = r[i];
            for (int p = 0; p < k; p++) {
                t -= lr.cols.get(p)[freeIdx[i]] * y.get(p, 0);
            }
            double si = dinv[i] * t;
            if (!Double.isFinite(si)) {
                return false;
            }
            step.set(i, 0, si);
        }
        return true;
    }

    /** Forces the dense (false) or the low-rank (true) Newton solve, or lets the size choose (null). For tests. */
    void forceForm(Boolean lowRank) {
        this.forcedLowRank = lowRank;
    }

    private Boolean forcedLowRank;
    /** Free groups from which the low-rank Newton solve is used when it has few enough terms. */
    static final int LOW_RANK_MIN_GROUPS = 200;

    /**
     * Minimiser of the surrogate, starting from {@code u0} (fixed groups keep their values). When
     * {@code deadline} (may be null) has passed, returns the current iterate at the next Newton
     * iteration: its surrogate value is no higher than at {@code u0}, and the caller's line
     * search checks the true objective anyway.
     */
    double[] minimise(double[][] a, double[][] b, double[] u0, Deadline deadline) {
        int g = groups;
        double[] u = u0.clone();
        for (int k = 0; k < g; k++) {
            if (!free[k]) {
                u[k] = fixedU[k];
            }
        }
        int[] freeIdx = new int[g];
        int nf = 0;
        for (int k = 0; k < g; k++) {
            if (free[k]) {
                freeIdx[nf++] = k;
            }
        }
        if (nf == 0) {
            return u;
        }
        // at most one rank-one term per row plus one mean per side
        int terms = a.length + b.length + 2;
        boolean lowRank = forcedLowRank != null ? forcedLowRank : nf >= LOW_RANK_MIN_GROUPS && 2 * terms < nf;
        LinearSolverDense<DMatrixRMaj> chol = lowRank ? null : LinearSolverFactory_DDRM.symmPosDef(nf);
        DMatrixRMaj h = lowRank ? null : new DMatrixRMaj(nf, nf);
        DMatrixRMaj rhs = lowRank ? null : new DMatrixRMaj(nf, 1);
        DMatrixRMaj step = new DMatrixRMaj(nf, 1);
        double[] grad = new double[g];
        double[][] hess = lowRank ? null : new double[g][g];
        for (double tau = 5e-2; tau >= 1e-10; tau *= 0.1) {
            for (int it = 0; it < 40; it++) {
                if (deadline != null && deadline.passed()) {
                    return clamp(u); // at most one Newton iteration past the budget
                }
                java.util.Arrays.fill(grad, 0);
                double v;
                LowRank lr = null;
                if (lowRank) {
                    lr = new LowRank(g);
                    v = value(a, b, u, u0, tau, grad, null, lr);
                } else {
                    for (double[] row : hess) {
                        java.util.Arrays.fill(row, 0);
                    }
                    v = value(a, b, u, u0, tau, grad, hess, null);
                }
                double damping = 1e-12;
                boolean solved = false;
                for (int attempt = 0; attempt < 8 && !solved && lowRank; attempt++) {
                    solved = solveLowRank(lr, grad, freeIdx, nf, damping, step);
                    damping = Math.max(damping * 100, 1e-8);
                }
                for (int attempt = 0; attempt < 8 && !solved && !lowRank; attempt++) {
                    for (int i = 0; i < nf; i++) {
                        for (int j = 0; j < nf; j++) {
                            h.set(i, j, hess[freeIdx[i]][freeIdx[j]] + (i == j ? damping : 0));
                        }
                        rhs.set(i, 0, -grad[freeIdx[i]]);
                    }
                    if (chol.setA(h)) {
                        chol.solve(rhs, step);
                        solved = true;
                    } else {
                        damping = Math.max(damping * 100, 1e-8);
                    }
                }
                if (!solved) {
                    for (int i = 0; i < nf; i++) {
                        step.set(i, 0, -grad[freeIdx[i]]);
                    }
                }
                double maxStep = 0;
                double slope = 0;
                for (int i = 0; i < nf; i++) {
                    maxStep = Math.max(maxStep, Math.abs(step.get(i, 0)));
                    slope += step.get(i, 0) * grad[freeIdx[i]];
                }
                if (slope >= 0 || -slope < 1e-18) {
                    break;
                }
                double scale = maxStep > 3 ? 3 / maxStep : 1.0;
                double[] trial = u.clone();
                boolean moved = false;
                for (int ls = 0; ls < 40; ls++) {
                    for (int i = 0; i < nf; i++) {
                        trial[freeIdx[i]] = u[freeIdx[i]] + scale * step.get(i, 0);
                    }
                    double tv = value(a, b, trial, u0, tau, null, null, null);
                    if (tv <= v + 1e-4 * scale * slope) {
                        moved = true;
                        break;
                    }
                    scale *= 0.5;
                }
                if (!moved) {
                    break;
                }
                System.arraycopy(trial, 0, u, 0, g);
                if (-slope < 1e-16) {
                    break;
                }
            }
        }
        return clamp(u);
    }
}
