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
 * step O(K·G²) for K active inputs and G free groups.
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

    /** Value of the smoothed surrogate and, when {@code grad} non-null, its gradient and Hessian. */
    private double value(double[][] a, double[][] b, double[] u, double[] u0, double tau, double[] grad,
            double[][] hess) {
        int g = groups;
        double[] e = new double[g];
        double[] einv = new double[g];
        for (int k = 0; k < g; k++) {
            e[k] = Math.exp(u[k]);
            einv[k] = 1.0 / e[k];
        }
        double v = side(a, e, tau, 1.0, grad, hess) + side(b, einv, tau, -1.0, grad, hess);
        for (int k = 0; k < g; k++) {
            if (free[k]) {
                double d = u[k] - u0[k];
                v += 0.5 * PROX * d * d;
                double over = Math.abs(u[k] - centre) - BOX;
                if (over > 0) {
                    v += 0.5 * WALL * over * over;
                }
                if (grad != null) {
                    grad[k] += PROX * d;
                    hess[k][k] += PROX;
                    if (over > 0) {
                        grad[k] += WALL * over * Math.signum(u[k] - centre);
                        hess[k][k] += WALL;
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
    private double side(double[][] c, double[] scale, double tau, double sign, double[] grad, double[][] hess) {
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
        LinearSolverDense<DMatrixRMaj> chol = LinearSolverFactory_DDRM.symmPosDef(nf);
        DMatrixRMaj h = new DMatrixRMaj(nf, nf);
        DMatrixRMaj rhs = new DMatrixRMaj(nf, 1);
        DMatrixRMaj step = new DMatrixRMaj(nf, 1);
        double[] grad = new double[g];
        double[][] hess = new double[g][g];
        for (double tau = 5e-2; tau >= 1e-10; tau *= 0.1) {
            for (int it = 0; it < 40; it++) {
                if (deadline != null && deadline.passed()) {
                    return clamp(u); // at most one Newton iteration past the budget
                }
                java.util.Arrays.fill(grad, 0);
                for (double[] row : hess) {
                    java.util.Arrays.fill(row, 0);
                }
                double v = value(a, b, u, u0, tau, grad, hess);
                double damping = 1e-12;
                boolean solved = false;
                for (int attempt = 0; attempt < 8 && !solved; attempt++) {
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
                    double tv = value(a, b, trial, u0, tau, null, null);
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
