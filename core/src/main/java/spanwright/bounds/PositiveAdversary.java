package spanwright.bounds;

import java.util.Arrays;

/**
 * The positive-weight adversary bound ADV(f) of f on its domain D, by its minimax form
 * <pre>
 *   ADV(f) = min over probability vectors p_x on the variables (one per input x ∈ D) of
 *            max over pairs f(x) ≠ f(y) of  1 / Σ_{i: x_i ≠ y_i} √(p_x(i) p_y(i)),
 * </pre>
 * R. Špalek and M. Szegedy, "All quantum adversary methods are equivalent", Theory of Computing
 * 2(1), 2006, arXiv:quant-ph/0409116 (the minimax and the spectral forms coincide). The inner sum
 * is concave in p, so 1/ADV = max_p min_pairs Σ √(p_x p_y) is a concave maximisation.
 *
 * <p><b>Method.</b> The minimum over pairs is smoothed, −μ log Σ exp(−g/μ), and maximised over
 * p_x = softmax(θ_x) by L-BFGS (Nocedal &amp; Wright, "Numerical Optimization", 2nd ed. 2006,
 * Algorithm 7.5) with Armijo backtracking, for a decreasing sequence of μ (continuation). Cost per
 * evaluation O(|pairs| · n); the number of evaluations is bounded by a work budget. Beyond
 * 30,000 pairs the optimisation starts on the nearest pairs (Hamming distance at most one more
 * than the smallest) and adds, round by round, every pair the current distributions leave within
 * 2% of the active minimum (an active-set method); the bounds below are always evaluated on all
 * pairs, so restricting the optimisation never makes them invalid.
 *
 * <p><b>Certificates.</b> The upper bound is 1/min_pairs Σ√(p_x p_y) of the final p, evaluated
 * exactly. The lower bound is the spectral adversary ‖Γ‖ / max_i ‖Γ∘Δ_i‖ (Barnum, Saks &amp;
 * Szegedy, CCC 2003) of the non-negative matrix Γ_xy = w_xy / √(α_x α_y) built from the smoothed
 * minimum's pair weights w (the Lagrange multipliers) and α_x = Σ_y w_xy g_xy, or of the
 * unit-weight sensitivity graph (pairs at Hamming distance 1, where every Γ∘Δ_i is a matching),
 * whichever is larger; ‖Γ‖ is bounded
 * below by a Rayleigh quotient and each ‖Γ∘Δ_i‖ above by the Collatz–Wielandt bound
 * max_x (Av)_x / v_x for a positive vector v improved by power iteration — both valid for any
 * v, so the interval always contains ADV(f).
 *
 * <p><b>SDP.</b> Up to {@link #SDP_MAX_VARIABLES} variables (the page: {@link #PAGE_SDP_MAX_VARIABLES})
 * the adversary SDP restricted to Γ ≥ 0 is solved as well by the interior-point method
 * ({@link GeneralAdversary#positiveWeights}); its spectral certificate raises the lower end and
 * its repaired witness may lower the upper end, closing the interval to about the solver's
 * tolerance. The interval reported is the intersection of both.
 *
 * <p>Written here because neither dependency has a nonlinear optimiser. Immutable result; the
 * computation is single-threaded and allocates its work arrays once.
 */
public final class PositiveAdversary implements CertifiedBound {
    /**
     * Up to this many variables {@link #compute(TargetFunction)} also solves the SDP with Γ ≥ 0:
     * by the interior-point method while m ≤ {@link GeneralAdversary#INTERIOR_POINT_MAX_CONSTRAINTS}
     * (about 2 s on one JVM core at 6 variables; the interval then closes to about 1e-9 relative,
     * where the minimax optimisation alone leaves its lower end 0.1–0.4 % low and its upper end up
     * to 1e-5 high, measured on seeded random functions of 5 and 6 variables), beyond that as ADV±
     * is solved beyond six variables (interior point over constraint orbits, else splitting) when
     * the minimax interval is wider than 1e-6 relative: the mine-rescue demo's width falls from
     * 8 % to 3.5e-7 (figures for 7-variable functions: docs/bounds.md).
     */
    public static final int SDP_MAX_VARIABLES = 7;
    /**
     * The page's limit for the SDP: 5 variables (at 6 the SDP would roughly double the page's
     * bounds time, which is already 13–17 s there for ADV±).
     */
    public static final int PAGE_SDP_MAX_VARIABLES = 5;
    /** Largest number of variables handled (2^10 inputs, up to 2^18 pairs). */
    public static final int MAX_VARIABLES = 10;
    /** Work budget: pair-variable operations spent in the optimisation (about a second). */
    private static final double WORK_BUDGET = 2e8;
    private static final int HISTORY = 12;
    /** Up to this many pairs are all optimised over from the start; beyond, an active set grows. */
    private static final int ALL_PAIRS_AT_ONCE = 30000;
    /** Active-set rounds at most. */
    private static final int MAX_ROUNDS = 6;
    /** A pair joins the active set when its sum is below (1 + this) × the active minimum. */
    private static final double NEAR_ACTIVE = 0.02;

    private final TargetFunction function;
    private final double lower;
    private final double upper;
    private final double[][] distributions;
    private final int tightZero;
    private final int tightOne;
    private final int evaluations;
    private double minimaxUpper;
    private boolean bySdp;

    private PositiveAdversary(TargetFunction function, double lower, double upper, double[][] distributions,
            int tightZero, int tightOne, int evaluations) {
        this.function = function;
        this.lower = lower;
        this.upper = upper;
        this.distributions = distributions;
        this.tightZero = tightZero;
        this.tightOne = tightOne;
        this.evaluations = evaluations;
    }

    /**
     * Computes the certified interval, with the SDP up to {@link #SDP_MAX_VARIABLES} variables.
     * Preconditions: n ≤ {@link #MAX_VARIABLES}.
     */
    public static PositiveAdversary compute(TargetFunction f) {
        return compute(f, SDP_MAX_VARIABLES);
    }

    /**
     * Computes the certified interval; the SDP ({@link GeneralAdversary#positiveWeights}) is solved
     * too when n ≤ {@code sdpMaxVariables} and it fits the interior-point method. Preconditions:
     * n ≤ {@link #MAX_VARIABLES}.
     */
    public static PositiveAdversary compute(TargetFunction f, int sdpMaxVariables) {
        int n = f.variableCount();
        if (n > MAX_VARIABLES) {
            throw new IllegalArgumentException(n + " variables: the positive adversary is limited to " + MAX_VARIABLES);
        }
        int size = f.size();
        double[][] uniform = new double[size][n];
        for (double[] row : uniform) {
            Arrays.fill(row, 1.0 / n);
        }
        if (f.isConstant()) {
            return new PositiveAdversary(f, 0, 0, uniform, -1, -1, 0);
        }
        int zeros = f.zerosCount();
        int ones = f.onesCount();
        int[] zeroInputs = new int[zeros];
        int[] oneInputs = new int[ones];
        int a = 0;
        int b = 0;
        for (int k = 0; k < size; k++) {
            if (f.value(k)) {
                oneInputs[b++] = k;
            } else {
                zeroInputs[a++] = k;
            }
        }
        // all pairs, q = (index among 0-inputs)·ones + (index among 1-inputs)
        int total = zeros * ones;
        int[] allX = new int[total];
        int[] allY = new int[total];
        int minDistance = n;
        for (int q = 0; q < total; q++) {
            allX[q] = zeroInputs[q / ones];
            allY[q] = oneInputs[q % ones];
            minDistance = Math.min(minDistance, Long.bitCount(f.input(allX[q]) ^ f.input(allY[q])));
        }
        // active pairs: all of them when few; else the nearest ones, then those the optimum violates
        boolean[] active = new boolean[total];
        int activeCount = 0;
        for (int q = 0; q < total; q++) {
            if (total <= ALL_PAIRS_AT_ONCE || Long.bitCount(f.input(allX[q]) ^ f.input(allY[q])) <= minDistance + 1) {
                active[q] = true;
                activeCount++;
            }
        }
        double[] theta = new double[size * n];
        double bestLower = 0;
        int evaluations = 0;
        double budget = WORK_BUDGET;
        double[] u = null;
        double[] p = null;
        for (int round = 0; round < MAX_ROUNDS; round++) {
            int[] px = new int[activeCount];
            int[] py = new int[activeCount];
            int c = 0;
            for (int q = 0; q < total; q++) {
                if (active[q]) {
                    px[c] = allX[q];
                    py[c] = allY[q];
                    c++;
                }
            }
            Minimax mm = new Minimax(f, px, py, theta);
            boolean lastRound = activeCount == total || round == MAX_ROUNDS - 1;
            mm.optimise(lastRound ? budget : budget / 2, total <= ALL_PAIRS_AT_ONCE);
            budget -= mm.work;
            evaluations += mm.evaluations;
            bestLower = Math.max(bestLower, mm.bestLower);
            theta = mm.theta;
            u = mm.u;
            p = mm.p;
            if (activeCount == total) {
                break;
            }
            // pairs outside the active set that the current distributions leave at or below the active minimum
            double activeMin = mm.pairSums();
            int added = 0;
            for (int q = 0; q < total; q++) {
                if (!active[q] && pairSum(f, u, allX[q], allY[q]) < activeMin * (1 + NEAR_ACTIVE)) {
                    active[q] = true;
                    added++;
                }
            }
            if (added == 0) {
                break;
            }
            activeCount += added;
        }
        // a second lower bound, good where the optimisation is short of budget: the unit-weight
        // sensitivity graph (pairs at Hamming distance 1) has every Γ∘Δ_i a matching
        if (minDistance == 1) {
            int count = 0;
            for (int q = 0; q < total; q++) {
                if (Long.bitCount(f.input(allX[q]) ^ f.input(allY[q])) == 1) {
                    count++;
                }
            }
            int[] sx = new int[count];
            int[] sy = new int[count];
            int c = 0;
            for (int q = 0; q < total; q++) {
                if (Long.bitCount(f.input(allX[q]) ^ f.input(allY[q])) == 1) {
                    sx[c] = allX[q];
                    sy[c] = allY[q];
                    c++;
                }
            }
            Minimax graph = new Minimax(f, sx, sy, theta);
            double[] unit = new double[count];
            double[] flat = new double[size];
            Arrays.fill(unit, 1);
            Arrays.fill(flat, 1);
            bestLower = Math.max(bestLower, graph.spectralLowerBound(unit, flat, true));
        }
        // upper bound over every pair, exactly
        double min = Double.POSITIVE_INFINITY;
        int tight = 0;
        for (int q = 0; q < total; q++) {
            double g = pairSum(f, u, allX[q], allY[q]);
            if (g < min) {
                min = g;
                tight = q;
            }
        }
        double upper = 1 / min;
        double minimaxUpper = upper;
        boolean bySdp = false;
        // beyond the interior-point size the splitting method runs (minutes at 7 variables), so
        // only when the minimax interval is wider than the splitting method's own stop rule
        boolean wide = upper - bestLower > GeneralAdversary.SPLITTING_RELATIVE_GAP * upper;
        GeneralAdversary sdp = n <= sdpMaxVariables ? GeneralAdversary.positiveWeights(f, wide) : null;
        if (sdp != null) {
            bestLower = Math.max(bestLower, sdp.lower());
            if (sdp.upper() < upper) {
                upper = sdp.upper();
            }
            bySdp = true;
        }
        double[][] dist = new double[size][n];
        for (int k = 0; k < size; k++) {
            System.arraycopy(p, k * n, dist[k], 0, n);
        }
        PositiveAdversary result = new PositiveAdversary(f, Math.min(bestLower, upper), upper, dist, allX[tight], allY[tight],
                evaluations);
        result.minimaxUpper = minimaxUpper;
        result.bySdp = bySdp;
        return result;
    }

    /** Σ_{i: x_i≠y_i} u_x,i u_y,i for input ordinals x, y (u = √p, row-major by input). */
    private static double pairSum(TargetFunction f, double[] u, int x, int y) {
        int n = f.variableCount();
        long d = f.input(x) ^ f.input(y);
        double s = 0;
        for (int i = 0; i < n; i++) {
            if ((d & f.variableMask(i)) != 0) {
                s += u[x * n + i] * u[y * n + i];
            }
        }
        return s;
    }

    // ------------------------------------------------------------------ results

    @Override
    public TargetFunction function() {
        return function;
    }

    /** Certified lower bound on ADV(f) (spectral adversary of the dual weights). */
    @Override
    public double lower() {
        return lower;
    }

    /**
     * Certified upper bound on ADV(f): the smaller of the minimax value of the final distributions
     * ({@link #minimaxUpper()}) and, when the SDP ran ({@link #solvedBySdp()}), the value of its
     * repaired witness (PSD X_i with Σ_{i: x_i≠y_i} X_i[x,y] ≥ 1 on every pair).
     */
    @Override
    public double upper() {
        return upper;
    }

    /** The minimax value of {@link #distribution}s: ≥ {@link #upper()}, attained at the tight pair. */
    public double minimaxUpper() {
        return minimaxUpper;
    }

    /** Whether the SDP with Γ ≥ 0 was solved as well (and its certificates used). */
    public boolean solvedBySdp() {
        return bySdp;
    }

    /** p_x, the distribution on the variables of the input with ordinal k (a copy). */
    public double[] distribution(int k) {
        return distributions[k].clone();
    }

    /** Ordinal of the 0-input of a pair attaining the minimax value (−1 when f is constant). */
    public int tightZero() {
        return tightZero;
    }

    /** Ordinal of the 1-input of that pair. */
    public int tightOne() {
        return tightOne;
    }

    /** Objective evaluations used. */
    public int evaluations() {
        return evaluations;
    }

    /**
     * 1 / Σ_{i: x_i≠y_i} √(p_x(i) p_y(i)) for given distributions: the minimax objective of one
     * pair (for tests that check the upper bound independently).
     */
    public static double pairValue(TargetFunction f, double[] px, double[] py, long x, long y) {
        double s = 0;
        for (int i = 0; i < f.variableCount(); i++) {
            if (((x ^ y) & f.variableMask(i)) != 0) {
                s += Math.sqrt(px[i] * py[i]);
            }
        }
        return 1 / s;
    }

    /** The optimisation state: pairs, parameters, L-BFGS memory. Mutable, single use. */
    private static final class Minimax {
        final TargetFunction f;
        final int n;
        final int size;
        final int pairs;
        final int[] px;
        final int[] py;
        /** Differing variables of each pair, as a list of variable indices. */
        final int[] diffStart;
        final int[] diffVar;
        /** Pairs differing in variable i: {@code byVariable[byVariableStart[i] .. byVariableStart[i+1]-1]}. */
        final int[] byVariableStart;
        final int[] byVariable;
        final double[] theta;
        final double[] u;
        final double[] p;
        final double[] g;
        final double[] w;
        final double[] gradU;
        int evaluations;
        double mu;

        Minimax(TargetFunction f, int[] pairX, int[] pairY, double[] start) {
            this.f = f;
            n = f.variableCount();
            size = f.size();
            pairs = pairX.length;
            px = pairX;
            py = pairY;
            diffStart = new int[pairs + 1];
            int total = 0;
            int q;
            for (q = 0; q < pairs; q++) {
                total += Long.bitCount(f.input(px[q]) ^ f.input(py[q]));
            }
            diffVar = new int[total];
            int e = 0;
            for (q = 0; q < pairs; q++) {
                diffStart[q] = e;
                long d = f.input(px[q]) ^ f.input(py[q]);
                for (int i = 0; i < n; i++) {
                    if ((d & f.variableMask(i)) != 0) {
                        diffVar[e++] = i;
                    }
                }
            }
            diffStart[pairs] = e;
            byVariableStart = new int[n + 1];
            for (int d = 0; d < diffVar.length; d++) {
                byVariableStart[diffVar[d] + 1]++;
            }
            for (int i = 0; i < n; i++) {
                byVariableStart[i + 1] += byVariableStart[i];
            }
            byVariable = new int[diffVar.length];
            int[] fill = byVariableStart.clone();
            for (q = 0; q < pairs; q++) {
                for (int d = diffStart[q]; d < diffStart[q + 1]; d++) {
                    byVariable[fill[diffVar[d]]++] = q;
                }
            }
            theta = start.clone();
            u = new double[size * n];
            p = new double[size * n];
            g = new double[pairs];
            w = new double[pairs];
            gradU = new double[size * n];
        }

        /** p = softmax(θ) per input, u = √p. */
        void distributions(double[] th) {
            for (int k = 0; k < size; k++) {
                double max = Double.NEGATIVE_INFINITY;
                for (int i = 0; i < n; i++) {
                    max = Math.max(max, th[k * n + i]);
                }
                double s = 0;
                for (int i = 0; i < n; i++) {
                    double e = Math.exp(th[k * n + i] - max);
                    p[k * n + i] = e;
                    s += e;
                }
                for (int i = 0; i < n; i++) {
                    p[k * n + i] /= s;
                    u[k * n + i] = Math.sqrt(p[k * n + i]);
                }
            }
        }

        /** g_q = Σ_{i∈Δ_q} u_x,i u_y,i for the current u; returns min g. */
        double pairSums() {
            double min = Double.POSITIVE_INFINITY;
            for (int q = 0; q < pairs; q++) {
                int bx = px[q] * n;
                int by = py[q] * n;
                double s = 0;
                for (int e = diffStart[q]; e < diffStart[q + 1]; e++) {
                    int i = diffVar[e];
                    s += u[bx + i] * u[by + i];
                }
                g[q] = s;
                min = Math.min(min, s);
            }
            return min;
        }

        /** −F_μ(θ) (to minimise) and its gradient into {@code grad}. */
        double evaluate(double[] th, double[] grad) {
            evaluations++;
            work += costOfEvaluation();
            distributions(th);
            double min = pairSums();
            double s = 0;
            for (int q = 0; q < pairs; q++) {
                w[q] = Math.exp(-(g[q] - min) / mu);
                s += w[q];
            }
            double value = min - mu * Math.log(s);
            Arrays.fill(gradU, 0);
            for (int q = 0; q < pairs; q++) {
                double wq = w[q] / s;
                w[q] = wq;
                int bx = px[q] * n;
                int by = py[q] * n;
                for (int e = diffStart[q]; e < diffStart[q + 1]; e++) {
                    int i = diffVar[e];
                    gradU[bx + i] += wq * u[by + i];
                    gradU[by + i] += wq * u[bx + i];
                }
            }
            // chain rule through u = √softmax(θ): ∂u_i/∂θ_j = (u_i/2)(δ_ij − p_j)
            for (int k = 0; k < size; k++) {
                double dot = 0;
                for (int i = 0; i < n; i++) {
                    dot += gradU[k * n + i] * u[k * n + i];
                }
                for (int j = 0; j < n; j++) {
                    int idx = k * n + j;
                    grad[idx] = -0.5 * (gradU[idx] * u[idx] - p[idx] * dot);
                }
            }
            return -value;
        }

        /** The best certified lower bound found so far (see {@link #certify}). */
        double bestLower;

        /** Work spent so far, in the units of {@link #costOfEvaluation}. */
        double work;

        /**
         * Operations of one evaluation with its L-BFGS step: the pair sums and gradient (one per
         * differing variable, plus an exponential per pair) and the softmax and two-loop recursion
         * over the θ vector (about 2·history + 4 per coordinate).
         */
        double costOfEvaluation() {
            return diffVar.length + 4.0 * pairs + (double) size * n * (2 * HISTORY + 4);
        }

        /**
         * Continuation over μ within {@code workBudget} pair-variable operations; certifies the
         * lower bound at the last stage, and also every other stage from μ = 10⁻³ on when
         * {@code certifyOften} (cheap for small problems, where it often gives the best bound).
         */
        void optimise(double workBudget, boolean certifyOften) {
            int budget = (int) Math.max(100, Math.min(20000, workBudget / costOfEvaluation()));
            distributions(theta);
            double v0 = pairSums();
            double[] muSchedule = {0.1, 0.03, 1e-2, 3e-3, 1e-3, 3e-4, 1e-4, 3e-5, 1e-5, 3e-6, 1e-6, 3e-7};
            int stages = muSchedule.length;
            for (int st = 0; st < stages; st++) {
                mu = muSchedule[st] * v0;
                int stageBudget = (budget - evaluations) / (stages - st);
                lbfgs(Math.max(10, stageBudget));
                boolean last = st == stages - 1 || evaluations >= budget;
                // certify where the smoothed problem is well solved: every other stage from 1e-3 on
                if (last || (certifyOften && st >= 4 && st % 2 == 0)) {
                    evaluate(theta, new double[theta.length]);
                    bestLower = Math.max(bestLower, certify());
                }
                if (last) {
                    break;
                }
            }
        }

        /** Minimises −F_μ from θ with at most {@code maxEvaluations} evaluations. */
        void lbfgs(int maxEvaluations) {
            int dim = theta.length;
            double[][] sHist = new double[HISTORY][dim];
            double[][] yHist = new double[HISTORY][dim];
            double[] rho = new double[HISTORY];
            double[] alpha = new double[HISTORY];
            double[] grad = new double[dim];
            double[] gradNew = new double[dim];
            double[] dir = new double[dim];
            double[] trial = new double[dim];
            int used = 0;
            int head = 0;
            int start = evaluations;
            double value = evaluate(theta, grad);
            while (evaluations - start < maxEvaluations) {
                // two-loop recursion
                System.arraycopy(grad, 0, dir, 0, dim);
                for (int h = 0; h < used; h++) {
                    int idx = (head - 1 - h + HISTORY) % HISTORY;
                    alpha[idx] = rho[idx] * dot(sHist[idx], dir);
                    axpy(-alpha[idx], yHist[idx], dir);
                }
                if (used > 0) {
                    int last = (head - 1 + HISTORY) % HISTORY;
                    double scale = dot(sHist[last], yHist[last]) / dot(yHist[last], yHist[last]);
                    for (int i = 0; i < dim; i++) {
                        dir[i] *= scale;
                    }
                } else {
                    double gn = Math.sqrt(dot(grad, grad));
                    if (gn == 0) {
                        return;
                    }
                    for (int i = 0; i < dim; i++) {
                        dir[i] /= gn;
                    }
                }
                for (int h = used - 1; h >= 0; h--) {
                    int idx = (head - 1 - h + HISTORY) % HISTORY;
                    double beta = rho[idx] * dot(yHist[idx], dir);
                    axpy(alpha[idx] - beta, sHist[idx], dir);
                }
                for (int i = 0; i < dim; i++) {
                    dir[i] = -dir[i];
                }
                double slope = dot(grad, dir);
                if (!(slope < 0)) {
                    // not a descent direction: restart from steepest descent
                    used = 0;
                    double gn = Math.sqrt(dot(grad, grad));
                    if (gn == 0) {
                        return;
                    }
                    for (int i = 0; i < dim; i++) {
                        dir[i] = -grad[i] / gn;
                    }
                    slope = dot(grad, dir);
                }
                double step = 1;
                double newValue = Double.NaN;
                boolean accepted = false;
                for (int ls = 0; ls < 30; ls++) {
                    for (int i = 0; i < dim; i++) {
                        trial[i] = theta[i] + step * dir[i];
                    }
                    newValue = evaluate(trial, gradNew);
                    if (newValue <= value + 1e-4 * step * slope) {
                        accepted = true;
                        break;
                    }
                    step *= 0.5;
                }
                if (!accepted) {
                    return;
                }
                double sy = 0;
                for (int i = 0; i < dim; i++) {
                    double si = trial[i] - theta[i];
                    double yi = gradNew[i] - grad[i];
                    sHist[head][i] = si;
                    yHist[head][i] = yi;
                    sy += si * yi;
                }
                System.arraycopy(trial, 0, theta, 0, dim);
                System.arraycopy(gradNew, 0, grad, 0, dim);
                double improvement = value - newValue;
                value = newValue;
                if (sy > 1e-300) {
                    rho[head] = 1 / sy;
                    head = (head + 1) % HISTORY;
                    used = Math.min(used + 1, HISTORY);
                }
                if (improvement <= 1e-15 * Math.abs(value)) {
                    return;
                }
            }
        }

        /**
         * The spectral adversary of Γ = D^{-1/2} w D^{-1/2} for the current smoothed-minimum weights w
         * and α_x = Σ_y w_xy g_xy (at an exact smoothed optimum D_u·√p_·(i) is an eigenvector of
         * Γ∘Δ_i with eigenvalue 1), bounded from below as {@link #spectralLowerBound} says.
         */
        double certify() {
            double[] alphaW = new double[size];
            for (int q = 0; q < pairs; q++) {
                alphaW[px[q]] += w[q] * g[q];
                alphaW[py[q]] += w[q] * g[q];
            }
            double[] gamma = new double[pairs];
            for (int q = 0; q < pairs; q++) {
                double d = Math.sqrt(alphaW[px[q]] * alphaW[py[q]]);
                gamma[q] = d > 0 ? w[q] / d : 0;
            }
            return spectralLowerBound(gamma, alphaW);
        }

        /**
         * ‖Γ‖ / max_i ‖Γ∘Δ_i‖ bounded from below: Rayleigh quotient for the numerator and the
         * Collatz–Wielandt bound for each denominator, each vector improved by power iteration.
         */
        double spectralLowerBound(double[] gamma, double[] alphaW) {
            return spectralLowerBound(gamma, alphaW, false);
        }

        /** As above; {@code flatStart} starts every power iteration from the all-ones vector. */
        double spectralLowerBound(double[] gamma, double[] alphaW, boolean flatStart) {
            int steps = (int) Math.max(15, Math.min(400, 2e7 / Math.max(1, diffVar.length + pairs)));
            double[] v = new double[size];
            for (int k = 0; k < size; k++) {
                v[k] = Math.sqrt(Math.max(alphaW[k], 0)) + 1e-12;
            }
            double norm = rayleighAfterPower(gamma, -1, v, steps);
            if (!(norm > 0)) {
                return 0;
            }
            double worst = 0;
            for (int i = 0; i < n; i++) {
                double[] vi = new double[size];
                double max = 0;
                for (int k = 0; k < size; k++) {
                    vi[k] = flatStart ? 1 : Math.sqrt(Math.max(alphaW[k], 0)) * u[k * n + i];
                    max = Math.max(max, vi[k]);
                }
                for (int k = 0; k < size; k++) {
                    vi[k] += 1e-9 * (max > 0 ? max : 1);
                }
                worst = Math.max(worst, collatzWielandtAfterPower(gamma, i, vi, steps));
            }
            return worst > 0 ? norm / worst : 0;
        }

        /** out = (Γ∘Δ_i) v, or Γ v when i &lt; 0. O(pairs of i). */
        void multiply(double[] gamma, int i, double[] v, double[] out) {
            Arrays.fill(out, 0);
            if (i < 0) {
                for (int q = 0; q < pairs; q++) {
                    out[px[q]] += gamma[q] * v[py[q]];
                    out[py[q]] += gamma[q] * v[px[q]];
                }
                return;
            }
            for (int e = byVariableStart[i]; e < byVariableStart[i + 1]; e++) {
                int q = byVariable[e];
                out[px[q]] += gamma[q] * v[py[q]];
                out[py[q]] += gamma[q] * v[px[q]];
            }
        }

        /** Largest Rayleigh quotient seen along power iteration on Γ + cI: a lower bound on ‖Γ‖. */
        double rayleighAfterPower(double[] gamma, int i, double[] v, int steps) {
            double[] av = new double[size];
            double best = 0;
            double shift = 0;
            for (int s = 0; s < steps; s++) {
                multiply(gamma, i, v, av);
                double vv = dot(v, v);
                double rq = dot(v, av) / vv;
                best = Math.max(best, rq);
                shift = Math.max(shift, rq);
                double nn = 0;
                for (int k = 0; k < size; k++) {
                    av[k] += shift * v[k];
                    nn += av[k] * av[k];
                }
                nn = Math.sqrt(nn);
                if (!(nn > 0)) {
                    break;
                }
                for (int k = 0; k < size; k++) {
                    v[k] = av[k] / nn;
                }
            }
            return best;
        }

        /** Smallest max_x (Av)_x / v_x seen along power iteration: an upper bound on ‖Γ∘Δ_i‖. */
        double collatzWielandtAfterPower(double[] gamma, int i, double[] v, int steps) {
            double[] av = new double[size];
            double best = Double.POSITIVE_INFINITY;
            double lowerEstimate = 0;
            for (int s = 0; s < steps; s++) {
                multiply(gamma, i, v, av);
                double ratio = 0;
                for (int k = 0; k < size; k++) {
                    ratio = Math.max(ratio, av[k] / v[k]);
                }
                best = Math.min(best, ratio);
                lowerEstimate = Math.max(lowerEstimate, dot(v, av) / dot(v, v));
                if (best - lowerEstimate <= 1e-12 * best) {
                    break;
                }
                double nn = 0;
                for (int k = 0; k < size; k++) {
                    av[k] += lowerEstimate * v[k];
                    nn = Math.max(nn, av[k]);
                }
                if (!(nn > 0)) {
                    break;
                }
                for (int k = 0; k < size; k++) {
                    // keep every entry positive so the bound stays valid
                    v[k] = Math.max(av[k] / nn, 1e-300);
                }
            }
            return best;
        }

        static double dot(double[] a, double[] b) {
            double s = 0;
            for (int i = 0; i < a.length; i++) {
                s += a[i] * b[i];
            }
            return s;
        }

        static void axpy(double a, double[] x, double[] y) {
            for (int i = 0; i < x.length; i++) {
                y[i] += a * x[i];
            }
        }
    }
}
