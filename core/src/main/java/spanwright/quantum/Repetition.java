package spanwright.quantum;

/**
 * Error reduction by repetition: run the one-run test k times independently and accept when at
 * least τ runs accept. With every positive input accepted with probability ≥ p₊ and every negative
 * input with probability ≤ p₋ &lt; p₊, the number of accepting runs is Binomial(k, p) and its upper
 * tail grows with p, so the test has two-sided error ≤ ε on every input exactly when
 * P[Bin(k, p₊) ≥ τ] ≥ 1 − ε and P[Bin(k, p₋) ≥ τ] ≤ ε. Both tails are computed exactly (log-space
 * recurrence for the probability mass function; common practice, no source).
 *
 * <p>Search: the least k, by trying k = k₀, k₀ + 1, … from a lower bound k₀ that no test can beat:
 * a test with two-sided error ε has total-variation distance ≥ 1 − 2ε between the two binomials,
 * and by Pinsker's inequality TV ≤ √(k·KL(p₊‖p₋)/2), so k ≥ 2(1 − 2ε)²/KL(p₊‖p₋) (Pinsker 1964;
 * e.g. Cover &amp; Thomas, "Elements of Information Theory", Lemma 11.6.1). For each k the least τ
 * with P[Bin(k, p₋) ≥ τ] ≤ ε is the best threshold. Cost O(k) per k tried.
  */
public final class Repetition {
    /** The largest number of runs searched. */
    public static final int MAX_RUNS = 1 << 14;

    /** Number of independent runs k. */
    public final int runs;
    /** Accept when at least this many runs accept. */
    public final int threshold;
    /** P[Bin(k, p₊) ≥ τ]: the least probability of accepting a positive input. */
    public final double positiveAcceptance;
    /** P[Bin(k, p₋) ≥ τ]: the largest probability of accepting a negative input. */
    public final double negativeAcceptance;

    private Repetition(int runs, int threshold, double positiveAcceptance, double negativeAcceptance) {
        this.runs = runs;
        this.threshold = threshold;
        this.positiveAcceptance = positiveAcceptance;
        this.negativeAcceptance = negativeAcceptance;
    }

    /**
     * A repetition count and threshold with two-sided error ≤ ε, or null when p₊ ≤ p₋ or more than
     * {@link #MAX_RUNS} runs would be needed.
     */
    public static Repetition find(double pPositive, double pNegative, double epsilon) {
        if (!(pPositive > pNegative) || !(epsilon > 0) || !(epsilon < 1)) {
            return null;
        }
        int k = (int) Math.max(1, Math.min(MAX_RUNS + 1.0, lowerBound(pPositive, pNegative, epsilon)));
        for (; k <= MAX_RUNS; k++) {
            Repetition r = test(k, pPositive, pNegative, epsilon);
            if (r != null) {
                return r;
            }
        }
        return null;
    }

    /** ⌈2(1 − 2ε)²/KL(p₊‖p₋)⌉ (Pinsker), at least 1; KL in nats. */
    static double lowerBound(double pPositive, double pNegative, double epsilon) {
        if (epsilon >= 0.5) {
            return 1;
        }
        double kl = klTerm(pPositive, pNegative) + klTerm(1 - pPositive, 1 - pNegative);
        if (!(kl > 0) || Double.isInfinite(kl)) {
            return 1;
        }
        double gap = 1 - 2 * epsilon;
        // a hair below the bound, so rounding cannot skip the least k
        return Math.ceil(2 * gap * gap / kl * (1 - 1e-12));
    }

    private static double klTerm(double p, double q) {
        if (p <= 0) {
            return 0;
        }
        return p * Math.log(p / q);
    }

    /** The best threshold for k runs if it achieves error ε, else null. O(k). */
    static Repetition test(int k, double pPositive, double pNegative, double epsilon) {
        double[] neg = upperTails(k, pNegative);
        double[] pos = upperTails(k, pPositive);
        int tau = 0;
        while (tau <= k && neg[tau] > epsilon) {
            tau++;
        }
        if (pos[tau] >= 1 - epsilon) {
            return new Repetition(k, tau, pos[tau], neg[tau]);
        }
        return null;
    }

    /** tail[j] = P[Bin(k, p) ≥ j] for j = 0 … k + 1. O(k). */
    static double[] upperTails(int k, double p) {
        double[] tail = new double[k + 2];
        if (p <= 0) {
            tail[0] = 1;
            return tail;
        }
        if (p >= 1) {
            for (int j = 0; j <= k; j++) {
                tail[j] = 1;
            }
            return tail;
        }
        double[] logPmf = new double[k + 1];
        logPmf[0] = k * Math.log1p(-p);
        double odds = Math.log(p) - Math.log1p(-p);
        double max = logPmf[0];
        for (int j = 0; j < k; j++) {
            logPmf[j + 1] = logPmf[j] + Math.log((double) (k - j) / (j + 1)) + odds;
            max = Math.max(max, logPmf[j + 1]);
        }
        double total = 0;
        for (int j = 0; j <= k; j++) {
            total += Math.exp(logPmf[j] - max);
        }
        double acc = 0;
        for (int j = k; j >= 0; j--) {
            acc += Math.exp(logPmf[j] - max);
            tail[j] = Math.min(1.0, acc / total);
        }
        tail[0] = 1;
        return tail;
    }
}
