package spanwright.optimize;

/** Budgets and choices for {@link WeightOptimizer}. Immutable; use the with… methods. */
public final class OptimizerOptions {
    /** Accepted ranges, the same for the command line (optimize, sweep) and the JSON facade. */
    public static final int MAX_STARTS = 1000;
    /** Most optimiser steps (or working-set rounds) a caller may ask for. */
    public static final int MAX_ITERATIONS = 100_000;
    /** Longest time budget a caller may give, in seconds (a day). */
    public static final long MAX_SECONDS = 86_400;
    /** Largest seed: 2^53, the largest whole number a JSON number holds exactly. */
    public static final long MAX_SEED = 1L << 53;

    /** How edges share weights. */
    public enum Tie {
        /** every edge has its own weight (edges' {@code group} keys are still honoured) */
        GROUPS,
        /** edges with the same condition (literal) share one weight, on top of group keys */
        LITERAL
    }

    /** Which optimiser runs. */
    public enum Mode {
        /** the working set when {@link spanwright.analysis.Analysis#choose} picks structure, else the whole domain */
        AUTO("auto"),
        /** every input that can be worst is evaluated at every step (enumerable domains only) */
        DOMAIN("domain"),
        /** a growing working set of worst inputs found by the structural engine */
        WORKING_SET("working-set");

        /** The name on the command line and in JSON. */
        public final String word;

        Mode(String word) {
            this.word = word;
        }

        /** The mode named {@code word}, or null. */
        public static Mode of(String word) {
            for (Mode m : values()) {
                if (m.word.equals(word)) {
                    return m;
                }
            }
            return null;
        }
    }

    final int starts;
    final long seed;
    final int maxIterations;
    final long maxMillis;
    final double tolerance;
    final Tie tie;
    final Mode mode;

    private OptimizerOptions(int starts, long seed, int maxIterations, long maxMillis, double tolerance, Tie tie) {
        this(starts, seed, maxIterations, maxMillis, tolerance, tie, Mode.AUTO);
    }

    private OptimizerOptions(int starts, long seed, int maxIterations, long maxMillis, double tolerance, Tie tie,
            Mode mode) {
        this.mode = mode;
        this.starts = starts;
        this.seed = seed;
        this.maxIterations = maxIterations;
        this.maxMillis = maxMillis;
        this.tolerance = tolerance;
        this.tie = tie;
    }

    /** One start from the scenario's weights, 200 outer iterations, 60 s, tolerance 1e-10. */
    public static OptimizerOptions defaults() {
        return new OptimizerOptions(1, 1, 200, 60_000, 1e-10, Tie.GROUPS);
    }

    /** Number of starts: the scenario's weights, then random log-normal perturbations of them. */
    public OptimizerOptions withStarts(int k) {
        return new OptimizerOptions(Math.max(1, k), seed, maxIterations, maxMillis, tolerance, tie, mode);
    }

    public OptimizerOptions withSeed(long s) {
        return new OptimizerOptions(starts, s, maxIterations, maxMillis, tolerance, tie, mode);
    }

    public OptimizerOptions withMaxIterations(int it) {
        return new OptimizerOptions(starts, seed, Math.max(1, it), maxMillis, tolerance, tie, mode);
    }

    /**
     * Time budget of the whole call, the final analysis included: the search keeps time for it
     * (estimated from the first evaluation) and checks the clock in the outer step, the line search
     * and the surrogate's Newton loop, so it overruns by at most one evaluation of the candidate
     * inputs or one Newton iteration.
     */
    public OptimizerOptions withMaxMillis(long ms) {
        return new OptimizerOptions(starts, seed, maxIterations, Math.max(1, ms), tolerance, tie, mode);
    }

    /** Stop when one outer step lowers √(W₊W₋) by less than this fraction. */
    public OptimizerOptions withTolerance(double tol) {
        return new OptimizerOptions(starts, seed, maxIterations, maxMillis, tol, tie, mode);
    }

    public OptimizerOptions withTie(Tie t) {
        return new OptimizerOptions(starts, seed, maxIterations, maxMillis, tolerance, t, mode);
    }

    /** Which optimiser runs (default {@link Mode#AUTO}). */
    public OptimizerOptions withMode(Mode m) {
        return new OptimizerOptions(starts, seed, maxIterations, maxMillis, tolerance, tie, m);
    }

    public Mode mode() {
        return mode;
    }

    /** The time budget of the whole call, in milliseconds. */
    public long maxMillis() {
        return maxMillis;
    }
}
