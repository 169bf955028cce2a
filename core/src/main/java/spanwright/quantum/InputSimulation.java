package spanwright.quantum;

/**
 * The simulated span-program algorithm on one input x: the spectrum of U(x) as seen from the
 * initial state |0⟩, the acceptance probabilities of phase estimation, and the certificate behind
 * the phase-zero weight. Immutable (arrays are copied out).
 *
 * <p>U(x) is real orthogonal, so its eigenvalues come in conjugate pairs e^{±iθ} (plus ±1), and a
 * real vector such as |0⟩ has equal weight on e^{iθ} and e^{−iθ}. Phases are therefore reported
 * as |θ| ∈ [0, π], one entry per eigenvalue (a pair e^{±iθ} gives two entries with the same |θ|);
 * the weight of an entry is |0⟩'s weight on that eigenvector of the symmetric part U + Uᵀ, and the
 * weights of all entries sum to 1. A drawing of the unit circle may put half of each weight at +|θ|
 * and half at −|θ|.
 *
 * <p>Certificate: {@link #phaseZeroVector()} is P₀|0⟩, the projection of |0⟩ onto the eigenphase-0
 * eigenspace of U(x) (coordinates: |0⟩, then the non-loop edges in file order); its |0⟩
 * coordinate equals {@link #phaseZeroWeight} (P₀ is a projection, ⟨0|P₀|0⟩ = ‖P₀|0⟩‖²). On a
 * positive input it is (α/(α² + R)) (α|0⟩ − Σ_e θ_e √w_e |e⟩) with θ the unit electrical flow, so
 * it lies in ker Ã and vanishes on absent edges (derived in docs/simulation.md).
 */
public final class InputSimulation {
    /** The input, as a mask (first variable = most significant bit); −1 beyond 63 variables. */
    public final long mask;
    /** The input string. */
    public final String input;
    /** Whether the input belongs to the scenario's domain. */
    public final boolean inDomain;
    /** Are s and t connected in G(x)? */
    public final boolean positive;
    /** R(x) on a positive input, C(x) on a negative one (weight = resistance, each edge once). */
    public final double witnessSize;
    /** |0⟩'s weight on eigenphase 0 (phases |θ| ≤ {@link SpectrumSolver#ZERO_PHASE}). */
    public final double phaseZeroWeight;
    /** Smallest |θ| &gt; {@link SpectrumSolver#ZERO_PHASE} in the whole spectrum of U(x); NaN if none. */
    public final double phaseGap;
    /**
     * Smallest |θ| &gt; {@link SpectrumSolver#ZERO_PHASE} among eigenvectors on which |0⟩ has weight
     * ≥ {@link SpectrumSolver#WEIGHT_FLOOR}; NaN if none.
     */
    public final double weightedPhaseGap;
    /** Whether EJML's decomposition converged; when false every number is NaN. */
    public final boolean converged;

    private final double[] measurePhases;
    private final double[] measureWeights;
    private final double[] acceptanceByBits;
    private final double[] phaseZeroVector;
    private final double[] spectrumPhases;
    private final double[] spectrumWeights;

    InputSimulation(long mask, String input, boolean inDomain, boolean positive, double witnessSize,
            double phaseZeroWeight, double phaseGap, double weightedPhaseGap, boolean converged,
            double[] measurePhases, double[] measureWeights, double[] acceptanceByBits, double[] phaseZeroVector,
            double[] spectrumPhases, double[] spectrumWeights) {
        this.mask = mask;
        this.input = input;
        this.inDomain = inDomain;
        this.positive = positive;
        this.witnessSize = witnessSize;
        this.phaseZeroWeight = phaseZeroWeight;
        this.phaseGap = phaseGap;
        this.weightedPhaseGap = weightedPhaseGap;
        this.converged = converged;
        this.measurePhases = measurePhases;
        this.measureWeights = measureWeights;
        this.acceptanceByBits = acceptanceByBits;
        this.phaseZeroVector = phaseZeroVector;
        this.spectrumPhases = spectrumPhases;
        this.spectrumWeights = spectrumWeights;
    }

    /**
     * Probability that one run of b-bit phase estimation on U(x) from |0⟩ outputs 0 ("accept"):
     * Σ_k w_k F_{2^b}(θ_k). Exact from the spectrum; b ≤ 16 from the table, larger b from the
     * kept spectral measure. Precondition 1 ≤ bits ≤ 62.
     */
    public double acceptance(int bits) {
        if (bits >= 1 && bits <= PhaseEstimation.MAX_BITS) {
            return acceptanceByBits[bits - 1];
        }
        return PhaseEstimation.acceptance(measurePhases, measureWeights, bits);
    }

    /** Acceptance for b = 1 … 16 (entry b − 1). */
    public double[] acceptanceByBits() {
        return acceptanceByBits.clone();
    }

    /** |0⟩'s weight on eigenphases |θ| ≤ theta. O(k) over the kept spectral measure. */
    public double weightWithin(double theta) {
        double w = 0;
        for (int k = 0; k < measurePhases.length; k++) {
            if (measurePhases[k] <= theta) {
                w += measureWeights[k];
            }
        }
        return w;
    }

    /**
     * |0⟩'s spectral measure: the phases |θ| (ascending) of the eigenvectors on which |0⟩ has weight
     * ≥ {@link SpectrumSolver#WEIGHT_FLOOR}; the rest (at most (|E|+1) · 1e-15 in all) is dropped.
     */
    public double[] measurePhases() {
        return measurePhases.clone();
    }

    /** Weights aligned with {@link #measurePhases()}. */
    public double[] measureWeights() {
        return measureWeights.clone();
    }

    /** P₀|0⟩ in coordinates (|0⟩, non-loop edges in file order); the witness of the phase-0 weight. */
    public double[] phaseZeroVector() {
        return phaseZeroVector.clone();
    }

    /** Whether the full spectrum was kept (only for a focused input). */
    public boolean hasSpectrum() {
        return spectrumPhases != null;
    }

    /** All |E|+1 phases |θ| of U(x), ascending, or null when not kept. */
    public double[] spectrumPhases() {
        return spectrumPhases == null ? null : spectrumPhases.clone();
    }

    /** |0⟩'s weight on each entry of {@link #spectrumPhases()} (sum 1), or null. */
    public double[] spectrumWeights() {
        return spectrumWeights == null ? null : spectrumWeights.clone();
    }
}
