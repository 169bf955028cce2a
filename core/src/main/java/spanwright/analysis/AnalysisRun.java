package spanwright.analysis;

import java.util.ArrayList;
import java.util.List;
import spanwright.domain.InputDomain;
import spanwright.electric.ElectricalNetwork;
import spanwright.expr.Expr;
import spanwright.model.Edge;
import spanwright.model.Scenario;

/**
 * An enumeration of a scenario's domain that can be advanced in steps, for callers that report
 * progress or may cancel (the page's worker). {@link Analysis#run} drives one to the end.
 *
 * <p>For every input it records connectivity, the witness size (R or C) and, when a function is
 * given, f(x); it keeps the maxima with their first maximiser in input order and the first
 * {@link #KEPT_COUNTEREXAMPLES} counterexamples. Memory: one double and one byte per input.
 * Cost: one {@link ElectricalNetwork#evaluate} per input.
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
    private final ElectricalNetwork network;
    private final int n;
    private final int edgeCount;
    private final int[] shift;
    private final boolean[] polarity;
    private final boolean[] always;
    private final boolean[] present;
    private final Expr function;
    private final double[] values;
    private final byte[] flags;
    private long cursor;

    private long positiveCount;
    private long negativeCount;
    private double maxR = Double.NEGATIVE_INFINITY;
    private long worstPositive = -1;
    private double maxC = Double.NEGATIVE_INFINITY;
    private long worstNegative = -1;
    private long counterexampleCount;
    private final List<Long> counterexamples = new ArrayList<>();

    AnalysisRun(Scenario scenario) {
        this.scenario = scenario;
        this.domain = InputDomain.of(scenario);
        this.n = scenario.variableCount();
        // self-loops carry neither current nor charge: leave them out
        List<Edge> kept = new ArrayList<>();
        for (Edge e : scenario.edges()) {
            if (!e.isSelfLoop()) {
                kept.add(e);
            }
        }
        this.edgeCount = kept.size();
        int[] u = new int[edgeCount];
        int[] v = new int[edgeCount];
        double[] w = new double[edgeCount];
        shift = new int[edgeCount];
        polarity = new boolean[edgeCount];
        always = new boolean[edgeCount];
        for (int i = 0; i < edgeCount; i++) {
            Edge e = kept.get(i);
            u[i] = e.u();
            v[i] = e.v();
            w[i] = e.weight();
            always[i] = e.when().isAlways();
            shift[i] = always[i] ? 0 : n - 1 - e.when().variable();
            polarity[i] = e.when().positive();
        }
        this.network = new ElectricalNetwork(scenario.vertexCount(), scenario.s(), scenario.t(), u, v, w);
        this.present = new boolean[edgeCount];
        this.function = scenario.function();
        if (domain.size() > Integer.MAX_VALUE - 16) {
            throw new IllegalStateException("domain too large to store");
        }
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
        for (long k = cursor; k < end; k++) {
            long x = domain.get(k);
            if (n <= 31) {
                // int arithmetic: 64-bit longs are emulated, and slow, in the page's JavaScript engine
                int xi = (int) x;
                for (int e = 0; e < edgeCount; e++) {
                    present[e] = always[e] || (((xi >>> shift[e]) & 1) != 0) == polarity[e];
                }
            } else {
                for (int e = 0; e < edgeCount; e++) {
                    present[e] = always[e] || (((x >>> shift[e]) & 1L) != 0) == polarity[e];
                }
            }
            double r = network.evaluate(present);
            int idx = (int) k;
            byte fl = 0;
            boolean connected = r >= 0;
            if (connected) {
                fl |= CONNECTED;
                values[idx] = r;
                positiveCount++;
                if (worstPositive < 0 || r > maxR) {
                    maxR = r;
                    worstPositive = x;
                }
            } else {
                double c = -r - 1.0;
                values[idx] = c;
                negativeCount++;
                if (worstNegative < 0 || c > maxC) {
                    maxC = c;
                    worstNegative = x;
                }
            }
            if (function != null) {
                boolean f = function.eval(x);
                if (f) {
                    fl |= F_TRUE;
                }
                if (f != connected) {
                    counterexampleCount++;
                    if (counterexamples.size() < KEPT_COUNTEREXAMPLES) {
                        counterexamples.add(x);
                    }
                }
            }
            flags[idx] = fl;
        }
        cursor = end;
        return done();
    }

    private long firstNear(boolean positive, double max, long fallback) {
        if (fallback < 0) {
            return fallback;
        }
        double threshold = max - TIE * max;
        for (int i = 0; i < values.length; i++) {
            if (((flags[i] & CONNECTED) != 0) == positive && values[i] >= threshold) {
                return domain.get(i);
            }
        }
        return fallback;
    }

    /** The result; requires {@link #done()}. Witnesses of the worst inputs are computed here. */
    public AnalysisResult result() {
        if (!done()) {
            throw new IllegalStateException("analysis not finished: " + cursor + " of " + domain.size());
        }
        // W± is the true maximum; the worst input is the first (in input order) whose value is
        // within the relative tie tolerance of it.
        worstPositive = firstNear(true, maxR, worstPositive);
        worstNegative = firstNear(false, maxC, worstNegative);
        return new AnalysisResult(scenario, domain, values, flags, positiveCount, negativeCount,
                worstPositive < 0 ? Double.NaN : maxR, worstPositive,
                worstNegative < 0 ? Double.NaN : maxC, worstNegative,
                counterexampleCount, counterexamples);
    }
}
