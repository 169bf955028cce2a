package spanwright.quantum;

/**
 * Exact outcome probabilities of textbook b-bit phase estimation, from the eigenphases of the
 * unitary and the weights of the initial state on them; no sampling.
 *
 * <p>Phase estimation with a b-qubit phase register (M = 2^b), Hadamards, controlled-U^(2^j) from
 * qubit j and an inverse quantum Fourier transform, applied to an eigenvector with eigenvalue
 * e^{iθ}, outputs y ∈ {0, …, M−1} with probability
 * <pre>
 *   P(y | θ) = | (1/M) Σ_{k=0}^{M−1} e^{ik(θ − 2πy/M)} |² = F_M(θ − 2πy/M),
 *   F_M(φ)   = sin²(Mφ/2) / (M² sin²(φ/2)),   F_M(0) = 1,
 * </pre>
 * the (normalised) Fejér kernel. For an initial state with weight w_k on eigenphase θ_k the
 * probability of the outcome 0 ("accept") is Σ_k w_k F_M(θ_k). Source: Cleve, Ekert, Macchiavello
 * &amp; Mosca, "Quantum algorithms revisited", Proc. R. Soc. Lond. A 454 (1998), arXiv:quant-ph/9708016
 * (the phase-estimation circuit); the kernel identity is the geometric sum above.
 *
 * <p>Written here rather than taken from a library because it is a closed form of a few lines;
 * the tests check it against a brute-force state-vector simulation of the circuit. Pure functions,
 * thread-safe.
 */
public final class PhaseEstimation {
    /** The largest phase register the tables cover (b = 1 … 16). */
    public static final int MAX_BITS = 16;

    private static final double TWO_PI = 2 * Math.PI;

    private PhaseEstimation() {}

    /**
     * F_M(φ) with M = 2^bits: the probability that b-bit phase estimation of an eigenvector of
     * eigenphase φ outputs 0. O(1). Precondition: 1 ≤ bits ≤ 62.
     */
    public static double fejer(double phi, int bits) {
        if (bits < 1 || bits > 62) {
            throw new IllegalArgumentException("bits must be in 1..62, got " + bits);
        }
        // reduce to [−π, π] by rounding to the nearest multiple of 2π (TeaVM 0.16's
        // Math.IEEEremainder truncates instead, so it is not used)
        double r = phi - TWO_PI * Math.rint(phi / TWO_PI);
        double m = (double) (1L << bits);
        double half = 0.5 * r;
        if (Math.abs(m * half) < 1e-4) {
            // sin(Mx)/(M sin x) = 1 − (M² − 1)x²/6 + O((Mx)⁴), x = φ/2 (Taylor; derived)
            double ratio = 1 - (m * m - 1) * half * half / 6;
            return ratio * ratio;
        }
        double num = Math.sin(m * half);
        double den = m * Math.sin(half);
        double ratio = num / den;
        return Math.min(1.0, ratio * ratio);
    }

    /**
     * Probability that b-bit phase estimation of an eigenvector of eigenphase θ outputs y
     * (0 ≤ y &lt; 2^bits): F_M(θ − 2πy/M). O(1).
     */
    public static double outcomeProbability(double theta, int bits, long y) {
        double m = (double) (1L << bits);
        return fejer(theta - TWO_PI * y / m, bits);
    }

    /**
     * Acceptance probability Σ_k weights[k] · F_M(phases[k]) of b-bit phase estimation ("accept"
     * = outcome 0) for an initial state with these weights on these eigenphases. O(k).
     */
    public static double acceptance(double[] phases, double[] weights, int bits) {
        double p = 0;
        for (int k = 0; k < phases.length; k++) {
            if (weights[k] != 0) {
                p += weights[k] * fejer(phases[k], bits);
            }
        }
        return p;
    }

    /** {@link #acceptance} for b = 1 … {@link #MAX_BITS}; entry b − 1 is b bits. O(16k). */
    public static double[] acceptanceByBits(double[] phases, double[] weights) {
        double[] a = new double[MAX_BITS];
        for (int b = 1; b <= MAX_BITS; b++) {
            a[b - 1] = acceptance(phases, weights, b);
        }
        return a;
    }

    /**
     * Uses of controlled-U in one run of b-bit phase estimation when controlled-U^(2^j) is applied
     * as 2^j controlled-U's: Σ_{j&lt;b} 2^j = 2^b − 1.
     */
    public static long controlledUses(int bits) {
        return (1L << bits) - 1;
    }
}
