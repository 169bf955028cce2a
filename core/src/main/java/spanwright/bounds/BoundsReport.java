package spanwright.bounds;

import java.util.Map;
import spanwright.analysis.AnalysisResult;
import spanwright.model.Scenario;
import spanwright.optimize.OptimizationResult;

/**
 * What {@link Bounds#compute} found for a scenario: the analysis (√(W₊W₋)), the adversary bounds,
 * the classical measures, the two ratios, and for every quantity not computed the reason, keyed by
 * its JSON name ({@code general}, {@code positive}, {@code classical}, {@code deg},
 * {@code complexity}, {@code optimalityGap}, {@code speedup}). Immutable.
 */
public final class BoundsReport {
    private final Scenario scenario;
    private final Bounds.Limits limits;
    private final TargetFunction function;
    private final AnalysisResult analysis;
    private final Measured measured;
    private final GeneralAdversary general;
    private final PositiveAdversary positive;
    private final ClassicalMeasures classical;
    private final double optimalityGap;
    private final double speedup;
    private final Map<String, String> reasons;
    private OptimizationResult optimised;
    private double optimisedGap = Double.NaN;

    /**
     * This graph's side of the comparison, by whichever method analysed it: the domain's size, the
     * reduction's verdict, √(W₊W₋) and whether it is exact (a time budget can leave the structural
     * engine with an interval, whose lower end is given).
     */
    public static final class Measured {
        /** "enumerate" or "structure". */
        public final String method;
        /** The number of inputs (2^n for the structural engine), as a double. */
        public final double domainSize;
        /** The same in words: "4096" or "2^66". */
        public final String domainText;
        /** true when the graph decides f, false when not, null when not checked. */
        public final Boolean correct;
        /** How many inputs the graph gets wrong (decimal; "0" when it decides f). */
        public final String counterexamples;
        /** √(W₊W₋), NaN when a side has no input. */
        public final double complexity;
        /** Is {@link #complexity} exact (false: the lower end of a certified interval)? */
        public final boolean exact;
        /** Why {@link #complexity} is NaN, or null. */
        public final String undefined;

        Measured(String method, double domainSize, String domainText, Boolean correct, String counterexamples,
                double complexity, boolean exact, String undefined) {
            this.method = method;
            this.domainSize = domainSize;
            this.domainText = domainText;
            this.correct = correct;
            this.counterexamples = counterexamples;
            this.complexity = complexity;
            this.exact = exact;
            this.undefined = undefined;
        }
    }

    BoundsReport(Scenario scenario, Bounds.Limits limits, TargetFunction function, AnalysisResult analysis,
            Measured measured, GeneralAdversary general, PositiveAdversary positive, ClassicalMeasures classical,
            double optimalityGap, double speedup, Map<String, String> reasons) {
        this.scenario = scenario;
        this.limits = limits;
        this.function = function;
        this.analysis = analysis;
        this.measured = measured;
        this.general = general;
        this.positive = positive;
        this.classical = classical;
        this.optimalityGap = optimalityGap;
        this.speedup = speedup;
        this.reasons = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(reasons));
    }

    public Scenario scenario() {
        return scenario;
    }

    public Bounds.Limits limits() {
        return limits;
    }

    /** f on the domain, or null when n exceeds every limit. */
    public TargetFunction function() {
        return function;
    }

    /** The enumeration's result, or null when the structural engine analysed the graph. */
    public AnalysisResult analysis() {
        return analysis;
    }

    /** This graph's numbers, whichever method computed them. */
    public Measured measured() {
        return measured;
    }

    /** Set once by {@link Bounds#compute}. */
    void setOptimised(OptimizationResult result, double gap) {
        this.optimised = result;
        this.optimisedGap = gap;
    }

    /** The weight optimiser's result on this graph, or null when not run (see reasons). */
    public OptimizationResult optimised() {
        return optimised;
    }

    /** √(W₊W₋) with optimised weights, or NaN. */
    public double optimisedComplexity() {
        return optimised == null ? Double.NaN : optimised.complexity;
    }

    /** √(W₊W₋) with optimised weights / ADV±, or NaN. */
    public double optimisedGap() {
        return optimisedGap;
    }

    /** √(W₊W₋) of the scenario's weights (NaN when a side is empty). */
    public double complexity() {
        return measured.complexity;
    }

    /** ADV±, or null (see {@link #reason}). */
    public GeneralAdversary general() {
        return general;
    }

    /** ADV, or null. */
    public PositiveAdversary positive() {
        return positive;
    }

    /** D, C, s, bs, deg, or null. */
    public ClassicalMeasures classical() {
        return classical;
    }

    /** √(W₊W₋) / ADV± (with the best certified lower bound on ADV±), or NaN. */
    public double optimalityGap() {
        return optimalityGap;
    }

    /** D / √(W₊W₋), or NaN. */
    public double speedup() {
        return speedup;
    }

    /** Why the quantity with this JSON name was not computed, or null. */
    public String reason(String key) {
        return reasons.get(key);
    }

    public Map<String, String> reasons() {
        return reasons;
    }
}
