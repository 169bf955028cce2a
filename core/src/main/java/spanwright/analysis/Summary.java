package spanwright.analysis;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import spanwright.expr.Expr;
import spanwright.model.Edge;
import spanwright.model.Scenario;

/**
 * A memory-light, exactly mergeable account of a contiguous range of inputs: counts, the largest
 * resistance and capacitance with the inputs that may turn out to be the worst, the reduction's
 * counterexamples, and histograms with fixed bins. Summaries of adjacent ranges {@link #merge}
 * into the summary of their union, bit for bit the same as one pass over the union, so a domain
 * can be split across threads, processes or machines.
 *
 * <p><b>Worst inputs, exactly.</b> The analysis reports W± as the true maximum and the worst
 * input as the first input (in input order) whose value is at least M − {@link AnalysisRun#TIE}·M,
 * M the maximum. That input is always a prefix-maximum record of its range (every earlier input of
 * the range is below the threshold, hence below it), and its value is at least
 * M_range − TIE·M_range since M ≥ M_range. So each side keeps its records (inputs larger than all
 * before them in the range) whose value is within that window of the range's own maximum — a few
 * at most: their values increase strictly inside a relative window of 10⁻¹², which holds fewer
 * than 5000 doubles. Merging keeps the first part's records and those of the second that exceed
 * the first part's maximum, then narrows the window to the new maximum; the operation is
 * associative, and the first record inside the final window is the answer one pass would give.
 *
 * <p><b>Counts and counterexamples</b> add; the first {@link AnalysisRun#KEPT_COUNTEREXAMPLES}
 * counterexamples of the union are the first of the concatenation. <b>Histograms</b> use bins
 * fixed in advance, independent of the data, so that they add: a bin is [2^e(1 + j/8),
 * 2^e(1 + (j+1)/8)) for an exponent e and j = 0…7 (eight bins per octave, read off the bits of the
 * double, so every engine agrees), plus one bin for 0.
 *
 * <p>A summary covers either ordinals [from, to) of the scenario's domain
 * ({@link Coverage#DOMAIN}) or indices [from, to) into a {@link CandidateInputs} list
 * ({@link Coverage#CANDIDATES}); it carries a fingerprint of the scenario (graph, conditions,
 * weights, variables, function) so that parts of different instances are never merged.
 * Immutable.
 */
public final class Summary {
    /** What the range [from, to) indexes. */
    public enum Coverage {
        /** ordinals of the scenario's input domain, in input order */
        DOMAIN,
        /** indices into a list of candidate inputs (kept in input order) */
        CANDIDATES
    }

    /** Smallest histogram bin key (the bin of 0). */
    public static final int ZERO_BIN = -1023 * 8 - 1;
    /** Number of histogram bins: 0, and eight per binary exponent −1023 … 1024. */
    static final int BINS = 2048 * 8 + 1;

    private final Coverage coverage;
    private final long fingerprint;
    private final int variableCount;
    private final boolean checked;
    private final long from;
    private final long to;
    private final long positiveCount;
    private final long negativeCount;
    private final Side positive;
    private final Side negative;
    private final long counterexampleCount;
    private final long[] counterexamples;
    private final int[] histogramKeys;
    private final long[] positiveHistogram;
    private final long[] negativeHistogram;

    private Summary(Coverage coverage, long fingerprint, int variableCount, boolean checked, long from, long to,
            long positiveCount, long negativeCount, Side positive, Side negative, long counterexampleCount,
            long[] counterexamples, int[] histogramKeys, long[] positiveHistogram, long[] negativeHistogram) {
        this.coverage = coverage;
        this.fingerprint = fingerprint;
        this.variableCount = variableCount;
        this.checked = checked;
        this.from = from;
        this.to = to;
        this.positiveCount = positiveCount;
        this.negativeCount = negativeCount;
        this.positive = positive;
        this.negative = negative;
        this.counterexampleCount = counterexampleCount;
        this.counterexamples = counterexamples;
        this.histogramKeys = histogramKeys;
        this.positiveHistogram = positiveHistogram;
        this.negativeHistogram = negativeHistogram;
    }

    /**
     * Rebuilds a summary from its parts (for readers of saved summaries). The records of each side
     * are (input mask, value) pairs in input order with increasing values; the histogram is given
     * as bin keys (increasing) with the count of each side per key.
     *
     * @throws IllegalArgumentException when the parts are inconsistent (with what is wrong)
     */
    public static Summary restore(Coverage coverage, long fingerprint, int variableCount, boolean checked, long from,
            long to, long positiveCount, long negativeCount, double maxResistance, long[] positiveRecordInputs,
            double[] positiveRecordValues, double maxCapacitance, long[] negativeRecordInputs,
            double[] negativeRecordValues, long counterexampleCount, long[] counterexamples, int[] histogramKeys,
            long[] positiveHistogram, long[] negativeHistogram) {
        if (from < 0 || to < from) {
            throw new IllegalArgumentException("range [" + from + ", " + to + ") is not a range");
        }
        if (positiveCount < 0 || negativeCount < 0 || positiveCount + negativeCount != to - from) {
            throw new IllegalArgumentException("counts " + positiveCount + " + " + negativeCount
                    + " do not add up to the range's " + (to - from) + " inputs");
        }
        Side p = Side.restore(positiveCount, maxResistance, positiveRecordInputs, positiveRecordValues, "positive");
        Side q = Side.restore(negativeCount, maxCapacitance, negativeRecordInputs, negativeRecordValues, "negative");
        if (histogramKeys.length != positiveHistogram.length || histogramKeys.length != negativeHistogram.length) {
            throw new IllegalArgumentException("histogram keys and counts differ in length");
        }
        for (int i = 0; i < histogramKeys.length; i++) {
            if (histogramKeys[i] < ZERO_BIN || histogramKeys[i] >= ZERO_BIN + BINS
                    || (i > 0 && histogramKeys[i] <= histogramKeys[i - 1])) {
                throw new IllegalArgumentException("histogram bin keys must increase within ["
                        + ZERO_BIN + ", " + (ZERO_BIN + BINS) + ")");
            }
        }
        if (counterexamples.length > AnalysisRun.KEPT_COUNTEREXAMPLES || counterexamples.length > counterexampleCount) {
            throw new IllegalArgumentException("more counterexamples listed than kept or counted");
        }
        return new Summary(coverage, fingerprint, variableCount, checked, from, to, positiveCount, negativeCount, p, q,
                counterexampleCount, counterexamples.clone(), histogramKeys.clone(), positiveHistogram.clone(),
                negativeHistogram.clone());
    }

    // ------------------------------------------------------------------ accessors

    public Coverage coverage() {
        return coverage;
    }

    /** 64-bit fingerprint of the scenario the inputs were evaluated on ({@link #fingerprint(Scenario)}). */
    public long fingerprint() {
        return fingerprint;
    }

    public int variableCount() {
        return variableCount;
    }

    /** Whether a target function was checked on every input of the range. */
    public boolean checked() {
        return checked;
    }

    public long from() {
        return from;
    }

    public long to() {
        return to;
    }

    /** Inputs evaluated: to − from. */
    public long evaluated() {
        return to - from;
    }

    public long positiveCount() {
        return positiveCount;
    }

    public long negativeCount() {
        return negativeCount;
    }

    /** Largest effective resistance over the positive inputs of the range; NaN when there are none. */
    public double maxResistance() {
        return positive.max();
    }

    /** Largest effective capacitance over the negative inputs; NaN when there are none. */
    public double maxCapacitance() {
        return negative.max();
    }

    /** The first positive input (mask) within the tie tolerance of W₊; −1 when there is none. */
    public long worstPositive() {
        return positive.worst();
    }

    /** The first negative input within the tie tolerance of W₋; −1 when there is none. */
    public long worstNegative() {
        return negative.worst();
    }

    /** √(W₊W₋), NaN when a side is empty. */
    public double complexity() {
        if (positiveCount == 0 || negativeCount == 0) {
            return Double.NaN;
        }
        return Math.sqrt(positive.max() * negative.max());
    }

    /** The kept records of one side: input masks, in input order. */
    public long[] recordInputs(boolean positiveSide) {
        return (positiveSide ? positive : negative).inputs.clone();
    }

    /** The kept records' values, increasing. */
    public double[] recordValues(boolean positiveSide) {
        return (positiveSide ? positive : negative).values.clone();
    }

    public long counterexampleCount() {
        return counterexampleCount;
    }

    /** The first {@link AnalysisRun#KEPT_COUNTEREXAMPLES} counterexamples (masks, input order). */
    public long[] counterexamples() {
        return counterexamples.clone();
    }

    /** Non-empty histogram bins (keys, increasing); see {@link #binLow} for their edges. */
    public int[] histogramKeys() {
        return histogramKeys.clone();
    }

    /** Counts per key of {@link #histogramKeys()} for one side. */
    public long[] histogramCounts(boolean positiveSide) {
        return (positiveSide ? positiveHistogram : negativeHistogram).clone();
    }

    // ------------------------------------------------------------------ bins

    /** The fixed bin of a value ≥ 0: eight per octave, from the bits of the double. */
    public static int bin(double v) {
        if (!(v > 0)) {
            return ZERO_BIN;
        }
        long bits = Double.doubleToLongBits(v);
        int exponent = (int) ((bits >>> 52) & 0x7ff) - 1023;
        int sub = (int) ((bits >>> 49) & 7);
        return exponent * 8 + sub;
    }

    /** Lower edge of bin {@code key} (0 for the zero bin). Exact: built from the bits. */
    public static double binLow(int key) {
        return key <= ZERO_BIN ? 0.0 : edge(key >> 3, key & 7);
    }

    /** Upper edge (exclusive) of bin {@code key} (0 for the zero bin, which holds only 0). */
    public static double binHigh(int key) {
        if (key <= ZERO_BIN) {
            return 0.0;
        }
        int e = key >> 3;
        int j = (key & 7) + 1;
        return j == 8 ? edge(e + 1, 0) : edge(e, j);
    }

    /** 2^e (1 + j/8) from its bits; the subnormal octave (e = −1023) is read as 2^−1022 · j/8. */
    private static double edge(int e, int j) {
        if (e > 1023) {
            return Double.POSITIVE_INFINITY;
        }
        if (e <= -1023) {
            return Double.longBitsToDouble((long) j << 49);
        }
        return Double.longBitsToDouble(((long) (e + 1023) << 52) | ((long) j << 49));
    }

    // ------------------------------------------------------------------ merging

    /**
     * The summary of the union of adjacent parts (given in any order; sorted by {@link #from()}).
     * Bit for bit the summary one pass over the union would give.
     *
     * @throws IllegalArgumentException when the parts are empty, cover different kinds of range,
     *     belong to different scenarios, overlap or leave a gap (naming the ranges)
     */
    public static Summary merge(List<Summary> parts) {
        if (parts.isEmpty()) {
            throw new IllegalArgumentException("nothing to merge");
        }
        List<Summary> sorted = new ArrayList<>(parts);
        sorted.sort((a, b) -> a.from != b.from ? Long.compare(a.from, b.from) : Long.compare(a.to, b.to));
        Summary acc = sorted.get(0);
        for (int i = 1; i < sorted.size(); i++) {
            acc = merge(acc, sorted.get(i));
        }
        return acc;
    }

    /** The summary of {@code a} followed by {@code b}; requires a.to() == b.from(). */
    public static Summary merge(Summary a, Summary b) {
        if (a.coverage != b.coverage) {
            throw new IllegalArgumentException("cannot merge a " + a.coverage + " range with a " + b.coverage + " range");
        }
        if (a.fingerprint != b.fingerprint || a.variableCount != b.variableCount || a.checked != b.checked) {
            throw new IllegalArgumentException("the parts [" + a.from + ", " + a.to + ") and [" + b.from + ", " + b.to
                    + ") were computed on different scenarios (fingerprints " + Long.toHexString(a.fingerprint)
                    + " and " + Long.toHexString(b.fingerprint) + ")");
        }
        if (a.to != b.from) {
            throw new IllegalArgumentException(a.to < b.from
                    ? "inputs [" + a.to + ", " + b.from + ") are missing between the parts"
                    : "the parts [" + a.from + ", " + a.to + ") and [" + b.from + ", " + b.to + ") overlap");
        }
        long count = a.counterexampleCount + b.counterexampleCount;
        int keep = (int) Math.min(AnalysisRun.KEPT_COUNTEREXAMPLES, a.counterexamples.length + b.counterexamples.length);
        long[] ce = Arrays.copyOf(a.counterexamples, keep);
        for (int i = a.counterexamples.length; i < keep; i++) {
            ce[i] = b.counterexamples[i - a.counterexamples.length];
        }
        // histograms: union of keys
        int[] keys = new int[a.histogramKeys.length + b.histogramKeys.length];
        long[] hp = new long[keys.length];
        long[] hn = new long[keys.length];
        int i = 0;
        int j = 0;
        int k = 0;
        while (i < a.histogramKeys.length || j < b.histogramKeys.length) {
            int ka = i < a.histogramKeys.length ? a.histogramKeys[i] : Integer.MAX_VALUE;
            int kb = j < b.histogramKeys.length ? b.histogramKeys[j] : Integer.MAX_VALUE;
            int key = Math.min(ka, kb);
            keys[k] = key;
            if (ka == key) {
                hp[k] += a.positiveHistogram[i];
                hn[k] += a.negativeHistogram[i];
                i++;
            }
            if (kb == key) {
                hp[k] += b.positiveHistogram[j];
                hn[k] += b.negativeHistogram[j];
                j++;
            }
            k++;
        }
        return new Summary(a.coverage, a.fingerprint, a.variableCount, a.checked, a.from, b.to,
                a.positiveCount + b.positiveCount, a.negativeCount + b.negativeCount,
                Side.merge(a.positive, b.positive), Side.merge(a.negative, b.negative), count, ce,
                Arrays.copyOf(keys, k), Arrays.copyOf(hp, k), Arrays.copyOf(hn, k));
    }

    // ------------------------------------------------------------------ fingerprint

    /**
     * A 64-bit FNV-1a hash of what the witness sizes depend on: variables, s, t, every edge's
     * endpoints, condition and weight bits, the function's text and the promise's description.
     * Equal scenarios have equal fingerprints; different ones collide with probability ~2⁻⁶⁴.
     */
    public static long fingerprint(Scenario sc) {
        StringBuilder sb = new StringBuilder();
        sb.append(String.join(",", sc.variables())).append('|').append(sc.s()).append('|').append(sc.t())
                .append('|').append(sc.vertexCount()).append('|');
        for (Edge e : sc.edges()) {
            sb.append(e.u()).append(' ').append(e.v()).append(' ').append(e.when()).append(' ')
                    .append(Long.toHexString(Double.doubleToLongBits(e.weight()))).append(';');
        }
        sb.append('|').append(sc.functionText()).append('|').append(sc.promise().describe(sc.variables()));
        long h = 0xcbf29ce484222325L;
        for (int i = 0; i < sb.length(); i++) {
            h ^= sb.charAt(i);
            h *= 0x100000001b3L;
        }
        return h;
    }

    // ------------------------------------------------------------------ one side

    /** Maximum and kept prefix-maximum records of one side. Immutable. */
    static final class Side {
        final long count;
        final long[] inputs;
        final double[] values;

        Side(long count, long[] inputs, double[] values) {
            this.count = count;
            this.inputs = inputs;
            this.values = values;
        }

        static Side restore(long count, double max, long[] inputs, double[] values, String name) {
            if (inputs.length != values.length) {
                throw new IllegalArgumentException(name + " records: inputs and values differ in length");
            }
            if ((count == 0) != (inputs.length == 0)) {
                throw new IllegalArgumentException(name + " records: " + inputs.length + " records for " + count + " inputs");
            }
            for (int i = 1; i < values.length; i++) {
                if (!(values[i] > values[i - 1])) {
                    throw new IllegalArgumentException(name + " records must increase");
                }
            }
            if (count > 0 && Double.doubleToLongBits(values[values.length - 1]) != Double.doubleToLongBits(max)) {
                throw new IllegalArgumentException(name + " maximum " + max + " is not the last record's value "
                        + values[values.length - 1]);
            }
            return new Side(count, inputs.clone(), values.clone());
        }

        double max() {
            return values.length == 0 ? Double.NaN : values[values.length - 1];
        }

        long worst() {
            if (values.length == 0) {
                return -1;
            }
            double max = values[values.length - 1];
            double threshold = max - AnalysisRun.TIE * max;
            for (int i = 0; i < values.length; i++) {
                if (values[i] >= threshold) {
                    return inputs[i];
                }
            }
            return inputs[inputs.length - 1];
        }

        static Side merge(Side a, Side b) {
            if (b.values.length == 0) {
                return new Side(a.count + b.count, a.inputs, a.values);
            }
            if (a.values.length == 0) {
                return new Side(a.count + b.count, b.inputs, b.values);
            }
            double maxA = a.values[a.values.length - 1];
            int firstB = 0;
            while (firstB < b.values.length && !(b.values[firstB] > maxA)) {
                firstB++;
            }
            double max = firstB < b.values.length ? b.values[b.values.length - 1] : maxA;
            double threshold = max - AnalysisRun.TIE * max;
            int n = 0;
            long[] in = new long[a.values.length + b.values.length - firstB];
            double[] va = new double[in.length];
            for (int i = 0; i < a.values.length; i++) {
                if (a.values[i] >= threshold) {
                    in[n] = a.inputs[i];
                    va[n++] = a.values[i];
                }
            }
            for (int i = firstB; i < b.values.length; i++) {
                if (b.values[i] >= threshold) {
                    in[n] = b.inputs[i];
                    va[n++] = b.values[i];
                }
            }
            return new Side(a.count + b.count, Arrays.copyOf(in, n), Arrays.copyOf(va, n));
        }
    }

    // ------------------------------------------------------------------ accumulation

    /**
     * Accumulates inputs in input order into a summary: the one per-input routine of every
     * enumeration ({@link AnalysisRun} uses it too). <b>Mutable, single-threaded</b>; owns an
     * {@link InputEvaluator}.
     */
    public static final class Builder {
        private final InputEvaluator evaluator;
        private final Expr function;
        private final Coverage coverage;
        private final long fingerprint;
        private final int variableCount;
        private final long from;
        private final boolean histogram;
        private long added;
        private long positiveCount;
        private long negativeCount;
        private final Records positive = new Records();
        private final Records negative = new Records();
        private long counterexampleCount;
        private final List<Long> counterexamples = new ArrayList<>();
        private final long[] positiveBins;
        private final long[] negativeBins;
        private boolean lastF;

        /**
         * A builder for the range starting at {@code from}.
         *
         * @param histogram whether to count the fixed-bin histograms (2 × 131 KB of counters)
         */
        public Builder(Scenario scenario, Coverage coverage, long from, boolean histogram) {
            this.evaluator = new InputEvaluator(scenario);
            this.function = scenario.function();
            this.coverage = coverage;
            this.fingerprint = fingerprint(scenario);
            this.variableCount = scenario.variableCount();
            this.from = from;
            this.histogram = histogram;
            this.positiveBins = histogram ? new long[BINS] : null;
            this.negativeBins = histogram ? new long[BINS] : null;
        }

        /**
         * Evaluates input {@code x} (the next of the range, in input order), checks f(x) against
         * connectivity and records it. Returns the evaluator's code: R ≥ 0 for a positive input,
         * −(C + ε) for a negative one (decode with
         * {@link InputEvaluator#value}).
         */
        public double add(long x) {
            double code = evaluator.evaluate(x);
            boolean connected = InputEvaluator.positive(code);
            double v = InputEvaluator.value(code);
            added++;
            if (connected) {
                positiveCount++;
                positive.offer(x, v);
                if (histogram) {
                    positiveBins[bin(v) - ZERO_BIN]++;
                }
            } else {
                negativeCount++;
                negative.offer(x, v);
                if (histogram) {
                    negativeBins[bin(v) - ZERO_BIN]++;
                }
            }
            if (function != null) {
                boolean f = function.eval(x);
                lastF = f;
                if (f != connected) {
                    counterexampleCount++;
                    if (counterexamples.size() < AnalysisRun.KEPT_COUNTEREXAMPLES) {
                        counterexamples.add(x);
                    }
                }
            }
            return code;
        }

        /** f of the last input added (false when no function is given). */
        public boolean lastF() {
            return lastF;
        }

        /** Inputs added so far. */
        public long added() {
            return added;
        }

        /** The summary of the inputs added so far: range [from, from + added). */
        public Summary build() {
            long[] ce = new long[counterexamples.size()];
            for (int i = 0; i < ce.length; i++) {
                ce[i] = counterexamples.get(i);
            }
            int nonEmpty = 0;
            if (histogram) {
                for (int i = 0; i < BINS; i++) {
                    if (positiveBins[i] != 0 || negativeBins[i] != 0) {
                        nonEmpty++;
                    }
                }
            }
            int[] keys = new int[nonEmpty];
            long[] hp = new long[nonEmpty];
            long[] hn = new long[nonEmpty];
            if (histogram) {
                int k = 0;
                for (int i = 0; i < BINS; i++) {
                    if (positiveBins[i] != 0 || negativeBins[i] != 0) {
                        keys[k] = i + ZERO_BIN;
                        hp[k] = positiveBins[i];
                        hn[k++] = negativeBins[i];
                    }
                }
            }
            return new Summary(coverage, fingerprint, variableCount, function != null, from, from + added,
                    positiveCount, negativeCount, positive.side(positiveCount), negative.side(negativeCount),
                    counterexampleCount, ce, keys, hp, hn);
        }
    }

    /** Prefix-maximum records inside the tie window of the running maximum. Mutable. */
    private static final class Records {
        private long[] inputs = new long[4];
        private double[] values = new double[4];
        private int start;
        private int end;

        void offer(long x, double v) {
            if (end > start && !(v > values[end - 1])) {
                return;
            }
            double threshold = v - AnalysisRun.TIE * v;
            while (start < end && values[start] < threshold) {
                start++;
            }
            if (end == inputs.length) {
                int live = end - start;
                if (live * 2 < inputs.length) {
                    System.arraycopy(inputs, start, inputs, 0, live);
                    System.arraycopy(values, start, values, 0, live);
                } else {
                    inputs = Arrays.copyOfRange(inputs, start, start + live * 2 + 4);
                    values = Arrays.copyOfRange(values, start, start + live * 2 + 4);
                }
                start = 0;
                end = live;
            }
            inputs[end] = x;
            values[end++] = v;
        }

        Side side(long count) {
            return new Side(count, Arrays.copyOfRange(inputs, start, end), Arrays.copyOfRange(values, start, end));
        }
    }
}
