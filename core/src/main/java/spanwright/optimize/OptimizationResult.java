package spanwright.optimize;

import java.util.List;
import spanwright.analysis.InputDetail;
import spanwright.model.Scenario;

/**
 * The outcome of {@link WeightOptimizer#optimize}: the scenario with the best weights found
 * (balanced so that W₊ = W₋ when no weight is locked), the values, the worst inputs with their
 * certificates (optimal flow for the worst positive input, optimal potential for the worst
 * negative input, under the returned weights), the objective trace of the best start (√(W₊W₋)
 * after each accepted outer step; never increasing), counts and a status. Immutable.
 *
 * <p>Which optimiser ran is in {@link #method}: {@code "domain"} (every input that can be worst is
 * evaluated) or {@code "working-set"} (beyond enumeration: {@link #rounds} rounds of the structural
 * engine, {@link #workingSetPositive} + {@link #workingSetNegative} worst inputs kept; the values are
 * then the engine's exact W₊ and W₋, {@link #worstPositive}/{@link #worstNegative} are −1 when the
 * input does not fit a 63-bit mask, and the certificates carry the input strings).
 */
public final class OptimizationResult {
    /** Why the optimiser stopped. */
    public enum Status {
        /** an outer step improved by less than the tolerance, or no descent was found */
        CONVERGED,
        /** the iteration or time budget ran out first */
        BUDGET_REACHED,
        /** the caller cancelled through the progress listener */
        CANCELLED,
        /** nothing to optimise: a side of the domain is empty, or every weight is locked */
        NOTHING_TO_DO
    }

    public final Status status;
    public final Scenario scenario;
    public final double initialComplexity;
    public final double complexity;
    public final double maxResistance;
    public final double maxCapacitance;
    public final long worstPositive;
    public final long worstNegative;
    public final InputDetail worstPositiveCertificate;
    public final InputDetail worstNegativeCertificate;
    public final List<Double> trace;
    public final int iterations;
    public final long evaluations;
    public final int starts;
    public final int bestStart;
    public final boolean balanced;
    public final int candidatePositive;
    public final int candidateNegative;
    public final long domainSize;
    /** "domain" or "working-set". */
    public final String method;
    /** Working-set rounds (engine calls after the first); 0 for the whole-domain optimiser. */
    public final int rounds;
    /** Worst positive / negative inputs in the working set at the end; 0 for the whole-domain optimiser. */
    public final int workingSetPositive;
    public final int workingSetNegative;
    /** How the engine computed the final W₊ and W₋ (one line each side), or null for the whole domain. */
    public final String engine;
    /**
     * Are {@link #maxResistance} and {@link #maxCapacitance} exact for the returned weights? When
     * false they are lower ends (values of inputs that were evaluated) and {@link #maxResistanceUpper},
     * {@link #maxCapacitanceUpper} certified upper ends (+∞ when nothing bounds them).
     */
    public final boolean exact;
    public final double maxResistanceUpper;
    public final double maxCapacitanceUpper;
    /**
     * What the time budget cut beyond the search itself (the listing of candidates, an evaluation,
     * an engine call, the final check of the returned weights), what the numbers then are, and how
     * to get the rest; null when nothing but the search was cut. In words, for people.
     */
    public final String cut;
    /** Does the graph decide f on the domain: true, false, or null (no function, or not checked)? */
    public final Boolean correct;
    /** {@link spanwright.analysis.Analysis#notABound} when the graph does not decide f, else null. */
    public final String standing;

    OptimizationResult(Status status, Scenario scenario, double initialComplexity, double complexity,
            double maxResistance, double maxCapacitance, long worstPositive, long worstNegative,
            InputDetail worstPositiveCertificate, InputDetail worstNegativeCertificate, List<Double> trace,
            int iterations, long evaluations, int starts, int bestStart, boolean balanced,
            int candidatePositive, int candidateNegative, long domainSize) {
        this(status, scenario, initialComplexity, complexity, maxResistance, maxCapacitance, worstPositive,
                worstNegative, worstPositiveCertificate, worstNegativeCertificate, trace, iterations, evaluations, starts,
                bestStart, balanced, candidatePositive, candidateNegative, domainSize, "domain", 0, 0, 0, null);
    }

    OptimizationResult(Status status, Scenario scenario, double initialComplexity, double complexity,
            double maxResistance, double maxCapacitance, long worstPositive, long worstNegative,
            InputDetail worstPositiveCertificate, InputDetail worstNegativeCertificate, List<Double> trace,
            int iterations, long evaluations, int starts, int bestStart, boolean balanced,
            int candidatePositive, int candidateNegative, long domainSize, String method, int rounds,
            int workingSetPositive, int workingSetNegative, String engine) {
        this(status, scenario, initialComplexity, complexity, maxResistance, maxCapacitance, worstPositive,
                worstNegative, worstPositiveCertificate, worstNegativeCertificate, trace, iterations, evaluations, starts,
                bestStart, balanced, candidatePositive, candidateNegative, domainSize, method, rounds, workingSetPositive,
                workingSetNegative, engine, true, maxResistance, maxCapacitance, null, null, null);
    }

    private OptimizationResult(Status status, Scenario scenario, double initialComplexity, double complexity,
            double maxResistance, double maxCapacitance, long worstPositive, long worstNegative,
            InputDetail worstPositiveCertificate, InputDetail worstNegativeCertificate, List<Double> trace,
            int iterations, long evaluations, int starts, int bestStart, boolean balanced,
            int candidatePositive, int candidateNegative, long domainSize, String method, int rounds,
            int workingSetPositive, int workingSetNegative, String engine, boolean exact, double maxResistanceUpper,
            double maxCapacitanceUpper, String cut, Boolean correct, String standing) {
        this.exact = exact;
        this.maxResistanceUpper = maxResistanceUpper;
        this.maxCapacitanceUpper = maxCapacitanceUpper;
        this.cut = cut;
        this.correct = correct;
        this.standing = standing;
        this.method = method;
        this.rounds = rounds;
        this.workingSetPositive = workingSetPositive;
        this.workingSetNegative = workingSetNegative;
        this.engine = engine;
        this.status = status;
        this.scenario = scenario;
        this.initialComplexity = initialComplexity;
        this.complexity = complexity;
        this.maxResistance = maxResistance;
        this.maxCapacitance = maxCapacitance;
        this.worstPositive = worstPositive;
        this.worstNegative = worstNegative;
        this.worstPositiveCertificate = worstPositiveCertificate;
        this.worstNegativeCertificate = worstNegativeCertificate;
        this.trace = List.copyOf(trace);
        this.iterations = iterations;
        this.evaluations = evaluations;
        this.starts = starts;
        this.bestStart = bestStart;
        this.balanced = balanced;
        this.candidatePositive = candidatePositive;
        this.candidateNegative = candidateNegative;
        this.domainSize = domainSize;
    }

    /**
     * This result with its certainty: whether the values are exact, their upper ends, what the time
     * budget cut (null: nothing beyond the search), and the reduction's verdict and standing.
     */
    OptimizationResult certified(boolean isExact, double rUpper, double cUpper, String cutText, Boolean isCorrect,
            String standingText) {
        return new OptimizationResult(status, scenario, initialComplexity, complexity, maxResistance, maxCapacitance,
                worstPositive, worstNegative, worstPositiveCertificate, worstNegativeCertificate, trace, iterations,
                evaluations, starts, bestStart, balanced, candidatePositive, candidateNegative, domainSize, method,
                rounds, workingSetPositive, workingSetNegative, engine, isExact, isExact ? maxResistance : rUpper,
                isExact ? maxCapacitance : cUpper, cutText, isCorrect, standingText);
    }

    /** The upper end of √(W₊W₋): {@link #complexity} itself when {@link #exact}. */
    public double complexityUpper() {
        return exact ? complexity : Math.sqrt(maxResistanceUpper * maxCapacitanceUpper);
    }

    /** Progress callback; return false to cancel. */
    public interface Listener {
        boolean progress(int start, int iteration, double complexity);
    }
}
