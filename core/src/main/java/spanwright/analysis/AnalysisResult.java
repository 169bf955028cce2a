package spanwright.analysis;

import java.util.List;
import spanwright.domain.InputDomain;
import spanwright.model.Inputs;
import spanwright.model.Scenario;

/**
 * The outcome of analysing a scenario on its whole domain: counts, maxima with their maximisers,
 * the reduction verdict with counterexamples, the bound, and every input's value (for the inputs
 * list and histograms). Witnesses of the worst inputs are available from {@link #worstPositiveDetail()}
 * and {@link #worstNegativeDetail()}. Immutable by contract (arrays are not exposed).
 */
public final class AnalysisResult {
    private final Scenario scenario;
    private final InputDomain domain;
    private final double[] values;
    private final byte[] flags;
    private final long positiveCount;
    private final long negativeCount;
    private final double maxResistance;
    private final long worstPositive;
    private final double maxCapacitance;
    private final long worstNegative;
    private final long counterexampleCount;
    private final List<Long> counterexamples;

    AnalysisResult(Scenario scenario, InputDomain domain, double[] values, byte[] flags, long positiveCount,
            long negativeCount, double maxResistance, long worstPositive, double maxCapacitance,
            long worstNegative, long counterexampleCount, List<Long> counterexamples) {
        this.scenario = scenario;
        this.domain = domain;
        this.values = values;
        this.flags = flags;
        this.positiveCount = positiveCount;
        this.negativeCount = negativeCount;
        this.maxResistance = maxResistance;
        this.worstPositive = worstPositive;
        this.maxCapacitance = maxCapacitance;
        this.worstNegative = worstNegative;
        this.counterexampleCount = counterexampleCount;
        this.counterexamples = List.copyOf(counterexamples);
    }

    public Scenario scenario() {
        return scenario;
    }

    public long domainSize() {
        return domain.size();
    }

    public long positiveCount() {
        return positiveCount;
    }

    public long negativeCount() {
        return negativeCount;
    }

    /** W₊ = max effective resistance over positive inputs; NaN when there are none. */
    public double maxResistance() {
        return maxResistance;
    }

    /** W₋ = max effective capacitance over negative inputs; NaN when there are none. */
    public double maxCapacitance() {
        return maxCapacitance;
    }

    /** First positive input (in input order) attaining W₊, as a mask; −1 when none. */
    public long worstPositive() {
        return worstPositive;
    }

    /** First negative input attaining W₋, as a mask; −1 when none. */
    public long worstNegative() {
        return worstNegative;
    }

    /** √(W₊W₋), or NaN when a side is empty. */
    public double complexity() {
        if (worstPositive < 0 || worstNegative < 0) {
            return Double.NaN;
        }
        return Math.sqrt(maxResistance * maxCapacitance);
    }

    /** Whether a target function was given (and so the reduction was checked). */
    public boolean reductionChecked() {
        return scenario.function() != null;
    }

    /** Does connectivity equal f on every input? null when no function is given. */
    public Boolean correct() {
        return reductionChecked() ? Boolean.valueOf(counterexampleCount == 0) : null;
    }

    public long counterexampleCount() {
        return counterexampleCount;
    }

    /** The first {@link AnalysisRun#KEPT_COUNTEREXAMPLES} counterexamples, as masks. */
    public List<Long> counterexamples() {
        return counterexamples;
    }

    // ------------------------------------------------------------- per input

    /** Input mask of the input with this ordinal (input order). */
    public long input(int ordinal) {
        return domain.get(ordinal);
    }

    /** Input string of the input with this ordinal. */
    public String inputString(int ordinal) {
        return Inputs.format(domain.get(ordinal), scenario.variableCount());
    }

    public boolean connected(int ordinal) {
        return (flags[ordinal] & AnalysisRun.CONNECTED) != 0;
    }

    /** f(x) for this input; meaningful only when {@link #reductionChecked()}. */
    public boolean f(int ordinal) {
        return (flags[ordinal] & AnalysisRun.F_TRUE) != 0;
    }

    /** R(x) when connected, C(x) otherwise. */
    public double value(int ordinal) {
        return values[ordinal];
    }

    /** Detail (witness) of the worst positive input, or null. */
    public InputDetail worstPositiveDetail() {
        return worstPositive < 0 ? null : Analysis.detail(scenario, worstPositive);
    }

    /** Detail (witness) of the worst negative input, or null. */
    public InputDetail worstNegativeDetail() {
        return worstNegative < 0 ? null : Analysis.detail(scenario, worstNegative);
    }

    /**
     * Histogram of R over positive inputs ({@code positive = true}) or C over negative inputs:
     * {@code bins} equal-width bins over [min, max]; a value equal to max goes in the last bin.
     */
    public Histogram histogram(boolean positive, int bins) {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < values.length; i++) {
            if (connected(i) == positive) {
                lo = Math.min(lo, values[i]);
                hi = Math.max(hi, values[i]);
            }
        }
        long[] counts = new long[bins];
        if (lo > hi) {
            return new Histogram(Double.NaN, Double.NaN, new long[0]);
        }
        double width = (hi - lo) / bins;
        for (int i = 0; i < values.length; i++) {
            if (connected(i) == positive) {
                int b = width <= 0 ? 0 : (int) ((values[i] - lo) / width);
                counts[Math.min(bins - 1, Math.max(0, b))]++;
            }
        }
        if (width <= 0) {
            return new Histogram(lo, hi, new long[] {counts[0]});
        }
        return new Histogram(lo, hi, counts);
    }

    /** Equal-width histogram over [min, max]. */
    public static final class Histogram {
        public final double min;
        public final double max;
        private final long[] counts;

        Histogram(double min, double max, long[] counts) {
            this.min = min;
            this.max = max;
            this.counts = counts;
        }

        public long[] counts() {
            return counts.clone();
        }
    }
}
