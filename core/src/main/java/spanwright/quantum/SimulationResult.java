package spanwright.quantum;

import java.util.List;
import spanwright.model.Scenario;

/**
 * The span-program algorithm simulated on every input of a scenario's domain, with its concrete
 * costs under the stated model ({@link Simulation#ASSUMPTIONS}), or on the focused input alone
 * (see {@link #scope}). Immutable (arrays copied out).
 *
 * <p>One run: b-bit phase estimation of U(x) on |0⟩, accept when the estimate is 0. The error ε
 * is the false acceptance: b <em>separates at error ε</em> when every negative input is accepted
 * with probability ≤ ε and every positive input with a larger probability than every negative
 * one. Positive inputs are accepted with probability at least their phase-zero weight
 * α²/(α² + R(x)) ≥ α²/(α² + W₊) for every b (= 1/2 at the default α² = W₊). {@link #repetition()}
 * turns the one-run gap into two-sided error ε by repeating.
 */
public final class SimulationResult {
    /** {@link #scope} of a simulation of every input of the domain. */
    public static final String DOMAIN = "domain";
    /** {@link #scope} of a simulation of the focused input alone. */
    public static final String INPUT = "input";

    /** The textbook choice of precision for comparison: Θ = 1/(2√(W₊W₋)). Immutable. */
    public static final class Textbook {
        /** Θ = 1/(2√(W₊W₋)). */
        public final double theta;
        /** Bits b with 2π/2^b ≤ Θ: the first zero of the acceptance kernel within Θ. */
        public final int bits;
        /** 2^b − 1 controlled-U uses for one run. */
        public final long queries;
        /** The least acceptance of a positive input at these bits (NaN when b &gt; 62). */
        public final double minPositiveAcceptance;
        /** The largest acceptance of a negative input at these bits (NaN when b &gt; 62). */
        public final double maxNegativeAcceptance;
        /**
         * The effective spectral gap lemma's bound (Θ²/4)(1 + α²W₋) on a negative input's weight on
         * phases |θ| ≤ Θ.
         */
        public final double negativeWeightBound;
        /** α²/(α² + W₊): the least phase-zero weight of a positive input. */
        public final double positiveFloor;

        Textbook(double theta, int bits, long queries, double minPositiveAcceptance, double maxNegativeAcceptance,
                double negativeWeightBound, double positiveFloor) {
            this.theta = theta;
            this.bits = bits;
            this.queries = queries;
            this.minPositiveAcceptance = minPositiveAcceptance;
            this.maxNegativeAcceptance = maxNegativeAcceptance;
            this.negativeWeightBound = negativeWeightBound;
            this.positiveFloor = positiveFloor;
        }
    }

    public final Scenario scenario;
    /**
     * What was simulated: {@link #DOMAIN} (every input of the domain, with the costs) or
     * {@link #INPUT} (only the focused input, when the domain is beyond the whole-domain limits;
     * then the domain-wide fields are empty: bits 0, counts −1, no rows).
     */
    public final String scope;
    /** Why only the focused input was simulated (the limit and what to try), or null. */
    public final String scopeReason;
    /** Inputs in the domain; −1 when it was not counted (a one-input run under an expression promise). */
    public final long domainSize;
    /** α² used. */
    public final double alpha2;
    /** Where α² came from: "W+" (the default), "given", or "1 (no positive inputs)". */
    public final String alpha2Source;
    /** Positive inputs in the domain; −1 when not counted (scope {@link #INPUT}). */
    public final long positiveCount;
    /** Negative inputs in the domain; −1 when not counted (scope {@link #INPUT}). */
    public final long negativeCount;
    /** W₊ (NaN when there are no positive inputs). */
    public final double maxResistance;
    /** W₋ (NaN when there are no negative inputs). */
    public final double maxCapacitance;
    /** Does connectivity equal the scenario's function on every input? null when no function is given. */
    public final Boolean reductionCorrect;
    public final double epsilon;
    /** The least b ≤ 16 that separates at error ε; 0 when none (see {@link #bitsReason}). */
    public final int bits;
    /** Why {@link #bits} is 0, or null. */
    public final String bitsReason;
    /** 2^b − 1 controlled-U uses (= queries) for one run at {@link #bits}; −1 when none. */
    public final long queries;
    /** Repetitions for two-sided error ε at {@link #bits}, or null (see {@link #repetitionReason}). */
    public final Repetition repetition;
    public final String repetitionReason;
    /** repetitions × queries, or −1. */
    public final long totalQueries;
    /** Edges in the space (self-loops left out). */
    public final int edges;
    /** ⌈log₂(|E| + 1)⌉. */
    public final int stateQubits;
    /** stateQubits + bits, or −1 when no bits. */
    public final int qubits;
    /** max |U(x)ᵀU(x) − I| (the same for every x). */
    public final double orthogonalityDefect;
    /** Textbook comparison, or null when a side of the domain is empty. */
    public final Textbook textbook;
    /** Smallest weighted phase gap over negative inputs (NaN when none). */
    public final double negativePhaseGap;
    /**
     * max over negative inputs x and phases θ &gt; 0 of |0⟩'s spectral measure of
     * weight(|θ'| ≤ θ) / ((θ²/4)(1 + α²C(x))); at most 1 by the effective spectral gap lemma.
     * NaN when there are no negative inputs.
     */
    public final double lemmaWorstRatio;
    /** Worst positive input (least acceptance) at {@link #bits}, −1 when none. */
    public final long worstPositive;
    /** Worst negative input (largest acceptance) at {@link #bits}, −1 when none. */
    public final long worstNegative;

    private final int[] edgeIndex;
    private final double[] minPositiveAcceptance;
    private final double[] maxNegativeAcceptance;
    private final List<InputSimulation> inputs;
    private final InputSimulation focus;

    SimulationResult(Scenario scenario, double alpha2, String alpha2Source, long positiveCount, long negativeCount,
            double maxResistance, double maxCapacitance, Boolean reductionCorrect, double epsilon, int bits,
            String bitsReason, long queries,
            Repetition repetition, String repetitionReason, long totalQueries, int edges, int stateQubits, int qubits,
            double orthogonalityDefect, Textbook textbook, double negativePhaseGap, double lemmaWorstRatio,
            long worstPositive, long worstNegative, int[] edgeIndex, double[] minPositiveAcceptance,
            double[] maxNegativeAcceptance, List<InputSimulation> inputs, InputSimulation focus, String scope,
            String scopeReason, long domainSize) {
        this.scenario = scenario;
        this.scope = scope;
        this.scopeReason = scopeReason;
        this.domainSize = domainSize;
        this.alpha2 = alpha2;
        this.alpha2Source = alpha2Source;
        this.positiveCount = positiveCount;
        this.negativeCount = negativeCount;
        this.maxResistance = maxResistance;
        this.maxCapacitance = maxCapacitance;
        this.reductionCorrect = reductionCorrect;
        this.epsilon = epsilon;
        this.bits = bits;
        this.bitsReason = bitsReason;
        this.queries = queries;
        this.repetition = repetition;
        this.repetitionReason = repetitionReason;
        this.totalQueries = totalQueries;
        this.edges = edges;
        this.stateQubits = stateQubits;
        this.qubits = qubits;
        this.orthogonalityDefect = orthogonalityDefect;
        this.textbook = textbook;
        this.negativePhaseGap = negativePhaseGap;
        this.lemmaWorstRatio = lemmaWorstRatio;
        this.worstPositive = worstPositive;
        this.worstNegative = worstNegative;
        this.edgeIndex = edgeIndex;
        this.minPositiveAcceptance = minPositiveAcceptance;
        this.maxNegativeAcceptance = maxNegativeAcceptance;
        this.inputs = List.copyOf(inputs);
        this.focus = focus;
    }

    /**
     * Index into {@code scenario.edges()} of coordinate j + 1 of the space (0 ≤ j &lt; {@link #edges});
     * coordinate 0 is |0⟩.
     */
    public int edgeIndex(int j) {
        return edgeIndex[j];
    }

    /** √(W₊W₋), NaN when a side is empty. */
    public double complexity() {
        return Math.sqrt(maxResistance * maxCapacitance);
    }

    /** Least acceptance over positive inputs for b = 1 … 16 (entry b − 1); NaN entries when none. */
    public double[] minPositiveAcceptance() {
        return minPositiveAcceptance.clone();
    }

    /** Largest acceptance over negative inputs for b = 1 … 16; NaN entries when none. */
    public double[] maxNegativeAcceptance() {
        return maxNegativeAcceptance.clone();
    }

    /** Every input of the domain, in input order. */
    public List<InputSimulation> inputs() {
        return inputs;
    }

    /** The focused input with its full spectrum, or null. */
    public InputSimulation focus() {
        return focus;
    }
}
