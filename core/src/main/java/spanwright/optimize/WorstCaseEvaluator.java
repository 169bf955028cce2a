package spanwright.optimize;

import spanwright.analysis.CandidateInputs;
import spanwright.analysis.InputEvaluator;
import spanwright.electric.Witness;
import spanwright.model.Deadline;
import spanwright.model.Scenario;

/**
 * Evaluates W₊ = max R and W₋ = max C of one scenario for many weightings, on the inputs that can
 * be worst: by default {@link CandidateInputs#undominated} (Rayleigh monotonicity: for a variable
 * occurring only in positive literals, a positive input whose neighbour with that variable cleared
 * is still positive cannot be worse than it, and a negative input whose neighbour with it set is
 * still negative cannot be worse than that neighbour; mirrored for negated-only variables), or a
 * caller's candidate list (for example one input per orbit of a symmetry, with weights tied by
 * edge orbit).
 *
 * <p>Set-up: that of the candidates. Each {@link #evaluate}: one solve per candidate, through the
 * shared per-input routine {@link InputEvaluator}. <b>Mutable, single-threaded.</b>
 */
final class WorstCaseEvaluator {
    final Scenario scenario;
    final int[] keptEdge; // indices into scenario.edges() of non-self-loop edges
    final long[] positives; // candidate positive inputs (masks), in input order
    final long[] negatives;
    private final InputEvaluator inputs;
    final double domainSize;
    /** The candidates, or null when the time budget ran out while they were listed. */
    final CandidateInputs candidates;
    /** Where the budget ran out while the candidates were listed, or null when they are all there. */
    final String listingCut;

    // last evaluation
    final double[] positiveValue;
    final double[] negativeValue;
    double maxR;
    double maxC;
    int worstPositive;
    int worstNegative;
    long solves;
    /** Candidates the last evaluation reached: all of them unless its deadline ran out. */
    int evaluated;
    /** Did the last evaluation reach every candidate? */
    boolean complete;

    /** Whether the candidates came from the caller (then results are taken over them only). */
    final boolean callerCandidates;

    WorstCaseEvaluator(Scenario sc) {
        this(sc, null, false, Deadline.none());
    }

    /**
     * The undominated candidates, listed within {@code deadline} (one check per input of the
     * domain); when it runs out first, {@link #listingCut} says where and there are no candidates.
     */
    WorstCaseEvaluator(Scenario sc, Deadline deadline) {
        this(sc, null, false, deadline);
    }

    WorstCaseEvaluator(Scenario sc, CandidateInputs candidates) {
        this(sc, candidates, true, Deadline.none());
    }

    private WorstCaseEvaluator(Scenario sc, CandidateInputs given, boolean callerCandidates, Deadline deadline) {
        this.callerCandidates = callerCandidates;
        this.scenario = sc;
        this.inputs = new InputEvaluator(sc);
        this.keptEdge = inputs.keptEdges();
        CandidateInputs c = given;
        String cut = null;
        if (c == null) {
            try {
                c = CandidateInputs.undominated(sc, deadline);
            } catch (Deadline.Expired e) {
                cut = e.getMessage();
            }
        }
        this.candidates = c;
        this.listingCut = cut;
        this.domainSize = c != null ? c.domainSize() : spanwright.domain.InputDomain.of(sc).size();
        this.positives = c == null ? new long[0] : c.positives();
        this.negatives = c == null ? new long[0] : c.negatives();
        positiveValue = new double[positives.length];
        negativeValue = new double[negatives.length];
    }

    /** Present kept edges on input x (a fresh array). */
    boolean[] presentOn(long x) {
        return inputs.fill(x).clone();
    }

    /**
     * Evaluates every candidate input under weights {@code w} (one per kept edge).
     *
     * @return W₊·W₋ (NaN when a side is empty)
     */
    double evaluate(double[] w) {
        return evaluate(w, null);
    }

    /**
     * Evaluates the candidate inputs under weights {@code w} (one per kept edge), positive ones
     * first, asking {@code deadline} (may be null) before each one: when it has passed the pass
     * stops there ({@link #complete} false, {@link #evaluated} inputs done) and the maxima are
     * those of the inputs reached, lower ends of W₊ and W₋.
     *
     * @return W₊·W₋ over the inputs reached (NaN when a side is empty or was not reached)
     */
    double evaluate(double[] w, Deadline deadline) {
        inputs.setWeights(w);
        maxR = Double.NaN;
        maxC = Double.NaN;
        worstPositive = -1;
        worstNegative = -1;
        complete = false;
        evaluated = 0;
        for (int i = 0; i < positives.length; i++) {
            if (deadline != null && deadline.passed()) {
                return maxR * maxC;
            }
            double r = inputs.evaluate(positives[i]);
            positiveValue[i] = r;
            solves++;
            evaluated++;
            if (worstPositive < 0 || r > maxR) {
                maxR = r;
                worstPositive = i;
            }
        }
        for (int i = 0; i < negatives.length; i++) {
            if (deadline != null && deadline.passed()) {
                return maxR * maxC;
            }
            double c = InputEvaluator.value(inputs.evaluate(negatives[i]));
            negativeValue[i] = c;
            solves++;
            evaluated++;
            if (worstNegative < 0 || c > maxC) {
                maxC = c;
                worstNegative = i;
            }
        }
        complete = true;
        return maxR * maxC;
    }

    /** Witness (flow or potential) of a candidate input under the current weights. */
    Witness witness(long x) {
        return inputs.witness(x);
    }
}
