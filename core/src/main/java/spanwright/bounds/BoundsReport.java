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
    private final GeneralAdversary general;
    private final PositiveAdversary positive;
    private final ClassicalMeasures classical;
    private final double optimalityGap;
    private final double speedup;
    private final Map<String, String> reasons;
    private OptimizationResult optimised;
    private double optimisedGap = Double.NaN;

    BoundsReport(Scenario scenario, Bounds.Limits limits, TargetFunction function, AnalysisResult analysis,
            GeneralAdversary general, PositiveAdversary positive, ClassicalMeasures classical, double optimalityGap,
            double speedup, Map<String, String> reasons) {
        this.scenario = scenario;
        this.limits = limits;
        this.function = function;
        this.analysis = analysis;
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

    public AnalysisResult analysis() {
        return analysis;
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
        return analysis.complexity();
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
