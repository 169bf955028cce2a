package spanwright.analysis;

import java.util.ArrayList;
import java.util.List;
import spanwright.domain.InputDomain;
import spanwright.model.Scenario;

/**
 * An enumeration of a scenario's domain that can be advanced in steps, for callers that report
 * progress or may cancel (the page's worker). {@link Analysis#run} drives one to the end.
 *
 * <p>For every input it records connectivity, the witness size (R or C) and, when a function is
 * given, f(x); the maxima with their first maximiser in input order and the first
 * {@link #KEPT_COUNTEREXAMPLES} counterexamples come from a {@link Summary.Builder}, the per-input
 * routine every enumeration shares. Memory: one double and one byte per input, for at most
 * {@link Analysis#MAX_ENUMERATED_INPUTS} inputs (refused before allocation beyond). Cost: one
 * {@link spanwright.electric.ElectricalNetwork#evaluate} per input.
 *
 * <p><b>Mutable and single-threaded.</b>
 */
public final class AnalysisRun {
    /** Counterexamples kept in the result (all are counted). */
    public static final int KEPT_COUNTEREXAMPLES = 100;

    /**
     * Relative tolerance for ties between witness sizes: a later input replaces the current worst
     * only if it is larger by more than this fraction, so rounding noise cannot reorder inputs
     * whose values are equal in exact arithmetic ("first in input order" among maximisers).
     */
    public static final double TIE = 1e-12;

    static final byte CONNECTED = 1;
    static final byte F_TRUE = 2;

    private final Scenario scenario;
    private final InputDomain domain;
    private final Summary.Builder summary;
    private final double[] values;
    private final byte[] flags;
    private long cursor;

    AnalysisRun(Scenario scenario) {
        this.scenario = scenario;
        this.domain = InputDomain.of(scenario);
        this.summary = new Summary.Builder(scenario, Summary.Coverage.DOMAIN, 0, false);
        Analysis.checkEnumerable(domain.size()); // before the per-input arrays are allocated
        this.values = new double[(int) domain.size()];
        this.flags = new byte[(int) domain.size()];
    }

    /** Number of inputs in the domain. */
    public long total() {
        return domain.size();
    }

    /** Inputs processed so far. */
    public long processed() {
        return cursor;
    }

    public boolean done() {
        return cursor >= domain.size();
    }

    /**
     * Processes up to {@code maxInputs} more inputs.
     *
     * @return true when the whole domain has been processed
     */
    public boolean step(long maxInputs) {
        // written so that cursor + maxInputs cannot overflow (finish calls step(Long.MAX_VALUE))
        long end = cursor + Math.min(Math.max(0, maxInputs), domain.size() - cursor);
        boolean checked = scenario.function() != null;
        for (long k = cursor; k < end; k++) {
            double code = summary.add(domain.get(k));
            int idx = (int) k;
            boolean connected = InputEvaluator.positive(code);
            values[idx] = InputEvaluator.value(code);
            flags[idx] = (byte) ((connected ? CONNECTED : 0) | (checked && summary.lastF() ? F_TRUE : 0));
        }
        cursor = end;
        return done();
    }

    /**
     * Processes inputs one at a time until the domain is done or {@code deadline} has passed (one
     * check per input).
     *
     * @return true when the whole domain has been processed
     */
    public boolean stepWithin(spanwright.model.Deadline deadline) {
        while (!done() && !deadline.passed()) {
            step(1);
        }
        return done();
    }

    /**
     * The {@link Summary} of the inputs processed so far (the first {@link #processed} in input
     * order): for a run its time budget cut, what is known — maxima over those inputs (lower ends
     * of W₊ and W₋) and the counterexamples among them.
     */
    public Summary soFar() {
        return summary.build();
    }

    /**
     * The result; requires {@link #done()}. W± is the true maximum; the worst input is the first
     * (in input order) whose value is within the relative tie tolerance of it (see {@link Summary}).
     */
    public AnalysisResult result() {
        if (!done()) {
            throw new IllegalStateException("analysis not finished: " + cursor + " of " + domain.size());
        }
        Summary s = summary.build();
        List<Long> counterexamples = new ArrayList<>();
        for (long x : s.counterexamples()) {
            counterexamples.add(x);
        }
        return new AnalysisResult(scenario, domain, values, flags, s.positiveCount(), s.negativeCount(),
                s.maxResistance(), s.worstPositive(), s.maxCapacitance(), s.worstNegative(),
                s.counterexampleCount(), counterexamples);
    }
}
