package spanwright.quantum;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.SingularValueDecomposition_F64;

/**
 * Eigenphases of U(x) and the weight of |0⟩ on each, for one {@link SpanProgramUnitary}.
 *
 * <p>Method: U = U(x) is real orthogonal, hence normal; its symmetric part U + Uᵀ has eigenvalue
 * 2cos θ on the real invariant subspace of each pair e^{±iθ}. We take EJML's SVD of I − U:
 * (I − U)ᵀ(I − U) = 2I − U − Uᵀ, so the right singular vectors are an orthonormal eigenbasis of the
 * symmetric part and the singular values are |1 − e^{iθ}| = 2|sin(θ/2)|, giving |θ| =
 * 2 arcsin(σ/2). This is the symmetric-part method, arranged so that small phases — the ones that
 * decide acceptance and the phase gap — come out with absolute accuracy about (|E|+1)·10⁻¹⁶
 * (an eigenvalue of U + Uᵀ near 2 would give θ only to about 10⁻⁸). |0⟩'s weight on a basis
 * vector v_k is (v_k)₀², shared evenly within each ±θ pair ({@link #evenPairWeights}); phases
 * above π/3 are taken from |cos(θ/2)| as well, so a phase of π comes out as π to rounding
 * ({@link #phaseOf}). Cost: one dense SVD with right vectors, O((|E|+1)³), per input.
 *
 * <p><b>Mutable and single-threaded</b>: the instance owns the work matrix and the EJML
 * decomposition and reuses them on every call. One instance per thread.
 */
public final class SpectrumSolver {
    /**
     * Phases |θ| at most this (radians) count as eigenphase 0. The SVD gives |θ| to about
     * (|E|+1)·10⁻¹⁶ absolute; and no b ≤ 16 can tell such a phase from 0 (F_{2^16}(10⁻⁹) &gt; 1 − 10⁻⁹).
     */
    public static final double ZERO_PHASE = 1e-9;
    /** Spectral weights of |0⟩ below this are dropped from the kept measure (not from the tables). */
    public static final double WEIGHT_FLOOR = 1e-15;

    private final SpanProgramUnitary unitary;
    private final int dim;
    private final int variableCount;
    /**
     * Phases closer than this (radians) form one group whose weights are shared evenly: far above
     * the phases' rounding (about (|E|+1)·10⁻¹⁶), far below any gap b ≤ 16 bits can resolve.
     */
    public static final double PAIR_TOLERANCE = 1e-10;

    private final DMatrixRMaj work;
    private final DMatrixRMaj operator;
    private final DMatrixRMaj right;
    private final SingularValueDecomposition_F64<DMatrixRMaj> svd;

    public SpectrumSolver(SpanProgramUnitary unitary) {
        this.unitary = unitary;
        this.dim = unitary.dimension();
        this.variableCount = unitary.scenario().variableCount();
        this.work = new DMatrixRMaj(dim, dim);
        this.right = new DMatrixRMaj(dim, dim);
        this.operator = new DMatrixRMaj(dim, dim);
        this.svd = DecompositionFactory_DDRM.svd(dim, dim, false, true, false);
    }

    public SpanProgramUnitary unitary() {
        return unitary;
    }

    /**
     * Simulates one input.
     *
     * @param mask the input
     * @param present presence of every scenario edge on this input (file order)
     * @param inDomain whether the input is in the domain (recorded only)
     * @param positive whether s and t are connected in G(x) (from the analysis)
     * @param witnessSize R(x) or C(x) (from the analysis; recorded only)
     * @param keepSpectrum keep all |E|+1 phases and weights (for a focused input)
     */
    public InputSimulation solve(long mask, boolean[] present, boolean inDomain, boolean positive,
            double witnessSize, boolean keepSpectrum) {
        return solve(mask, spanwright.model.Inputs.format(mask, variableCount), present, inDomain, positive,
                witnessSize, keepSpectrum);
    }

    /**
     * Simulates one input given also as its string (for inputs of more than 63 variables, whose
     * {@code mask} is −1); otherwise as {@link #solve(long, boolean[], boolean, boolean, double, boolean)}.
     */
    public InputSimulation solve(long mask, String input, boolean[] present, boolean inDomain, boolean positive,
            double witnessSize, boolean keepSpectrum) {
        double[] d = unitary.querySigns(present);
        double[] a = work.data;
        for (int i = 0; i < dim; i++) {
            int row = i * dim;
            for (int j = 0; j < dim; j++) {
                a[row + j] = (i == j ? 1.0 : 0.0) - unitary.reflectionEntry(i, j) * d[j];
            }
        }
        operator.setTo(work);
        if (!svd.decompose(work)) {
            double nan = Double.NaN;
            double[] none = new double[PhaseEstimation.MAX_BITS];
            java.util.Arrays.fill(none, nan);
            return new InputSimulation(mask, input, inDomain, positive, witnessSize, nan, nan, nan, false,
                    new double[0], new double[0], none, new double[dim], null, null);
        }
        double[] sv = svd.getSingularValues();
        svd.getV(right, false);
        double[] phase = new double[dim];
        double[] weight = new double[dim];
        for (int k = 0; k < dim; k++) {
            phase[k] = phaseOf(k, sv[k]);
            double v0 = right.get(0, k);
            weight[k] = v0 * v0;
        }
        int[] order = sortedOrder(phase);
        evenPairWeights(order, phase, weight);
        double zeroWeight = 0;
        double gap = Double.NaN;
        double weightedGap = Double.NaN;
        double[] zeroVector = new double[dim];
        int kept = 0;
        for (int k : order) {
            if (phase[k] <= ZERO_PHASE) {
                zeroWeight += weight[k];
                double v0 = right.get(0, k);
                for (int i = 0; i < dim; i++) {
                    zeroVector[i] += v0 * right.get(i, k);
                }
            } else {
                if (Double.isNaN(gap)) {
                    gap = phase[k];
                }
                if (Double.isNaN(weightedGap) && weight[k] >= WEIGHT_FLOOR) {
                    weightedGap = phase[k];
                }
            }
            if (weight[k] >= WEIGHT_FLOOR) {
                kept++;
            }
        }
        double[] mp = new double[kept];
        double[] mw = new double[kept];
        double[] sp = keepSpectrum ? new double[dim] : null;
        double[] sw = keepSpectrum ? new double[dim] : null;
        int c = 0;
        for (int r = 0; r < dim; r++) {
            int k = order[r];
            if (weight[k] >= WEIGHT_FLOOR) {
                mp[c] = phase[k];
                mw[c] = weight[k];
                c++;
            }
            if (keepSpectrum) {
                sp[r] = phase[k];
                sw[r] = weight[k];
            }
        }
        double[] accept = PhaseEstimation.acceptanceByBits(phase, weight);
        return new InputSimulation(mask, input, inDomain, positive, witnessSize, zeroWeight, gap,
                weightedGap, true, mp, mw, accept, zeroVector, sp, sw);
    }

    /**
     * |θ| of right singular vector k with singular value σ = 2|sin(θ/2)|. Below σ = 1 (|θ| &lt; π/3)
     * 2 arcsin(σ/2) is accurate to about (|E|+1)·10⁻¹⁶; above, arcsin's slope blows up near σ = 2,
     * so |cos(θ/2)| = ‖(I + U)v‖/2 = ‖2v − (I − U)v‖/2 (same eigenvector: (I + U)ᵀ(I + U) = 2I + U + Uᵀ)
     * is computed too and |θ| = 2 atan2(σ/2, |cos(θ/2)|), exact to rounding up to |θ| = π. O(dim²).
     */
    private double phaseOf(int k, double sigma) {
        if (sigma <= 1) {
            return 2 * Math.asin(sigma / 2);
        }
        double[] a = operator.data;
        double sum = 0;
        for (int i = 0; i < dim; i++) {
            double av = 0;
            int row = i * dim;
            for (int j = 0; j < dim; j++) {
                av += a[row + j] * right.get(j, k);
            }
            double c = 2 * right.get(i, k) - av;
            sum += c * c;
        }
        return 2 * Math.atan2(sigma / 2, Math.sqrt(sum) / 2);
    }

    /**
     * Splits |0⟩'s weight evenly over each group of equal phases 0 &lt; |θ| &lt; π (within
     * {@link #PAIR_TOLERANCE}). Such a group spans the real planes of pairs e^{±iθ}; the SVD's
     * real basis of a plane divides the weight arbitrarily between its two vectors, while the
     * complex eigenvectors of e^{iθ} and e^{−iθ} carry equal weight (|0⟩ is real), so each entry
     * gets the group's mean. The group's total — all that acceptance and the phase gap use — is
     * unchanged. O(dim).
     */
    private static void evenPairWeights(int[] order, double[] phase, double[] weight) {
        int r = 0;
        while (r < order.length) {
            int end = r + 1;
            while (end < order.length && phase[order[end]] - phase[order[end - 1]] <= PAIR_TOLERANCE) {
                end++;
            }
            double theta = phase[order[r]];
            if (end - r > 1 && theta > ZERO_PHASE && phase[order[end - 1]] < Math.PI - ZERO_PHASE) {
                double total = 0;
                for (int q = r; q < end; q++) {
                    total += weight[order[q]];
                }
                for (int q = r; q < end; q++) {
                    weight[order[q]] = total / (end - r);
                }
            }
            r = end;
        }
    }

    /** Indices of {@code v} in ascending order of value (insertion sort; dim is at most a few hundred). */
    private static int[] sortedOrder(double[] v) {
        int n = v.length;
        int[] idx = new int[n];
        for (int i = 0; i < n; i++) {
            idx[i] = i;
        }
        for (int i = 1; i < n; i++) {
            int x = idx[i];
            int j = i - 1;
            while (j >= 0 && v[idx[j]] > v[x]) {
                idx[j + 1] = idx[j];
                j--;
            }
            idx[j + 1] = x;
        }
        return idx;
    }
}
