package spanwright.sweep;

import java.util.LinkedHashMap;
import java.util.Map;

/**
 * The choices of a sweep that decide its numbers (so they are saved with the results, and a
 * resumed or merged sweep must use the same ones). Immutable; use the with… methods.
 *
 * <p>The per-size optimiser budget is an iteration count (deterministic: the same weights on every
 * machine and in every shard) and a time cap (a safety net; a size stopped by it says so, and its
 * weights then depend on the machine, which the merge of a sharded sweep detects).
 */
public final class SweepOptions {
    /** How the inputs of a size are chosen. */
    public enum Method {
        /** the first that applies of: orbits (symmetric, more than 2^16 inputs), every input (at most
         *  2^16), structure (a host graph, one positive literal per edge, no promise, more than
         *  {@link spanwright.analysis.Analysis#AUTO_ENUMERATION_VARIABLES} variables), undominated (some
         *  single-polarity variable, at most 2^26), every input (at most {@link #maxInputs}), structure
         *  (no promise) */
        AUTO("auto"),
        /** every input of the domain (histograms of all values; shardable by input ranges) */
        EVERY("every"),
        /** the inputs Rayleigh dominance cannot rule out (connectivity tested on every input) */
        UNDOMINATED("undominated"),
        /** one input per symmetry orbit, then Rayleigh dominance */
        ORBITS("orbits"),
        /** no input listed: exact W₊ and W₋ by the structural engine (heaviest paths and bonds on host
         *  graphs, branch and bound otherwise); the optimiser works on a working set of worst inputs */
        STRUCTURE("structure");

        public final String key;

        Method(String key) {
            this.key = key;
        }

        /** The method of a key, or null. */
        public static Method of(String key) {
            for (Method m : values()) {
                if (m.key.equals(key)) {
                    return m;
                }
            }
            return null;
        }
    }

    /** In auto mode, domains up to 2^this are swept input by input. */
    public static final int EVERY_INPUT_BITS = 16;
    /** Largest domain (2^26) for which Rayleigh dominance tests every input's connectivity. */
    public static final long UNDOMINATED_MAX_INPUTS = 1L << 26;
    /** Largest number of candidates (or domain, in every-input mode) the optimiser works on. */
    public static final long OPTIMIZER_MAX_INPUTS = 1L << 20;

    final Method method;
    final int optimizeIterations;
    final long optimizeMillis;
    final int starts;
    final long seed;
    final boolean bounds;
    final int boundsMaxVariables;
    final long maxInputs;

    private SweepOptions(Method method, int optimizeIterations, long optimizeMillis, int starts, long seed, boolean bounds,
            int boundsMaxVariables, long maxInputs) {
        this.method = method;
        this.optimizeIterations = optimizeIterations;
        this.optimizeMillis = optimizeMillis;
        this.starts = starts;
        this.seed = seed;
        this.bounds = bounds;
        this.boundsMaxVariables = boundsMaxVariables;
        this.maxInputs = maxInputs;
    }

    /**
     * Auto method; 100 optimiser iterations and at most 120 s per size, one start, seed 1; lower
     * bounds up to 8 variables; at most 2^34 inputs per size in every-input mode.
     */
    public static SweepOptions defaults() {
        return new SweepOptions(Method.AUTO, 100, 120_000, 1, 1, true, 8, 1L << 34);
    }

    public SweepOptions withMethod(Method m) {
        return new SweepOptions(m, optimizeIterations, optimizeMillis, starts, seed, bounds, boundsMaxVariables, maxInputs);
    }

    /** Optimiser iterations per size; 0 keeps the builder's weights. */
    public SweepOptions withOptimizeIterations(int it) {
        return new SweepOptions(method, Math.max(0, it), optimizeMillis, starts, seed, bounds, boundsMaxVariables, maxInputs);
    }

    public SweepOptions withOptimizeMillis(long ms) {
        return new SweepOptions(method, optimizeIterations, Math.max(1, ms), starts, seed, bounds, boundsMaxVariables,
                maxInputs);
    }

    public SweepOptions withStarts(int k) {
        return new SweepOptions(method, optimizeIterations, optimizeMillis, Math.max(1, k), seed, bounds, boundsMaxVariables,
                maxInputs);
    }

    public SweepOptions withSeed(long s) {
        return new SweepOptions(method, optimizeIterations, optimizeMillis, starts, s, bounds, boundsMaxVariables, maxInputs);
    }

    /** Whether to compute lower bounds, and up to how many variables. */
    public SweepOptions withBounds(boolean on, int maxVariables) {
        return new SweepOptions(method, optimizeIterations, optimizeMillis, starts, seed, on, maxVariables, maxInputs);
    }

    /** Most inputs of one size in every-input mode (beyond: the size is skipped, with the reason). */
    public SweepOptions withMaxInputs(long max) {
        return new SweepOptions(method, optimizeIterations, optimizeMillis, starts, seed, bounds, boundsMaxVariables,
                Math.max(1, max));
    }

    public Method method() {
        return method;
    }

    public int optimizeIterations() {
        return optimizeIterations;
    }

    public long optimizeMillis() {
        return optimizeMillis;
    }

    public int starts() {
        return starts;
    }

    public long seed() {
        return seed;
    }

    public boolean bounds() {
        return bounds;
    }

    public int boundsMaxVariables() {
        return boundsMaxVariables;
    }

    public long maxInputs() {
        return maxInputs;
    }

    /** The options as JSON (keys as read by {@code SweepJson.options}). */
    public Map<String, Object> toJson() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("method", method.key);
        m.put("optimizeIterations", optimizeIterations);
        m.put("optimizeSeconds", optimizeMillis / 1000.0);
        m.put("starts", starts);
        m.put("seed", seed);
        m.put("bounds", bounds);
        m.put("boundsMaxVariables", boundsMaxVariables);
        m.put("maxInputs", maxInputs);
        return m;
    }
}
