package spanwright.optimize;

import spanwright.analysis.CandidateInputs;
import spanwright.analysis.InputEvaluator;
import spanwright.electric.Witness;
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
    final CandidateInputs candidates;

    // last evaluation
    final double[] positiveValue;
    final double[] negativeValue;
    double maxR;
    double maxC;
    int worstPositive;
    int worstNegative;
    long solves;

    /** Whether the candidates came from the caller (then results are taken over them only). */
    final boolean callerCandidates;

    WorstCaseEvaluator(Scenario sc) {
        this(sc, CandidateInputs.undominated(sc), false);
    }

    WorstCaseEvaluator(Scenario sc, CandidateInputs candidates) {
        this(sc, candidates, true);
    }

    private WorstCaseEvaluator(Scenario sc, CandidateInputs candidates, boolean callerCandidates) {
        this.callerCandidates = callerCandidates;
        this.scenario = sc;
        this.candidates = candidates;
        this.inputs = new InputEvaluator(sc);
        this.keptEdge = inputs.keptEdges();
        this.domainSize = candidates.domainSize();
        this.positives = candidates.positives();
        this.negatives = candidates.negatives();
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
        inputs.setWeights(w);
        maxR = Double.NaN;
        maxC = Double.NaN;
        worstPositive = -1;
        worstNegative = -1;
        for (int i = 0; i < positives.length; i++) {
            double r = inputs.evaluate(positives[i]);
            positiveValue[i] = r;
            if (worstPositive < 0 || r > maxR) {
                maxR = r;
                worstPositive = i;
            }
        }
        for (int i = 0; i < negatives.length; i++) {
            double c = InputEvaluator.value(inputs.evaluate(negatives[i]));
            negativeValue[i] = c;
            if (worstNegative < 0 || c > maxC) {
                maxC = c;
                worstNegative = i;
            }
        }
        solves += positives.length + negatives.length;
        return maxR * maxC;
    }

    /** Witness (flow or potential) of a candidate input under the current weights. */
    Witness witness(long x) {
        return inputs.witness(x);
    }
}
