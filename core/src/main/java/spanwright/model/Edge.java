package spanwright.model;

/**
 * An undirected edge between vertex indices {@code u} and {@code v} with a presence condition and
 * a weight. Convention used everywhere in Spanwright: <b>the weight is a resistance</b>; a present
 * edge is a resistor of resistance {@code weight}, an absent one a capacitor of capacitance
 * {@code 1/weight}. Immutable.
 */
public final class Edge {
    /**
     * The smallest accepted weight. With weights in [1e-100, 1e100], every conductance 1/w, every
     * sum of |E| ≤ 1e6 of them, every R, C, W₊·W₋, square and energy Spanwright forms stays a
     * normal double (|x| between 1e-300 and 1e300 with room to spare), so witness sizes keep
     * their full relative accuracy; the ratio max/min = 1e200 covers any sensible design.
     * Subnormal weights (below 2.2e-308) would give an infinite conductance. Derived; common
     * practice, no source.
     */
    public static final double MIN_WEIGHT = 1e-100;
    /** The largest accepted weight (see {@link #MIN_WEIGHT}). */
    public static final double MAX_WEIGHT = 1e100;

    /**
     * Null when {@code w} is an accepted weight (a number in [{@link #MIN_WEIGHT},
     * {@link #MAX_WEIGHT}]), else what is wrong with it, for a person: the value, the range and
     * what to do instead.
     */
    public static String weightProblem(double w) {
        if (w >= MIN_WEIGHT && w <= MAX_WEIGHT) {
            return null;
        }
        String what = Double.isNaN(w) ? "not a number"
                : Double.isInfinite(w) ? (w > 0 ? "" : "-") + "infinity (a number too large)"
                : Double.toString(w);
        if (!(w > 0) || Double.isInfinite(w)) {
            return "weight must be a finite number > 0, got " + what;
        }
        return "weight " + what + " is outside the accepted range [1e-100, 1e100]; scale all weights"
                + " by one factor to bring them inside (R scales with it and C inversely, so"
                + " √(W₊W₋) does not change)";
    }
    private final String id;
    private final int u;
    private final int v;
    private final Condition when;
    private final double weight;
    private final String group;
    private final boolean locked;

    public Edge(String id, int u, int v, Condition when, double weight) {
        this(id, u, v, when, weight, null, false);
    }

    /**
     * An edge with optimiser hints: edges with the same non-null {@code group} share one weight;
     * a {@code locked} edge keeps its weight.
     */
    public Edge(String id, int u, int v, Condition when, double weight, String group, boolean locked) {
        String problem = weightProblem(weight);
        if (problem != null) {
            throw new ScenarioException("weight", "$", "edge \"" + id + "\": " + problem);
        }
        this.id = id;
        this.u = u;
        this.v = v;
        this.when = when;
        this.weight = weight;
        this.group = group;
        this.locked = locked;
    }

    /** Name of the weight group this edge belongs to, or null. */
    public String group() {
        return group;
    }

    /** Whether the optimiser must keep this edge's weight. */
    public boolean locked() {
        return locked;
    }

    public String id() {
        return id;
    }

    public int u() {
        return u;
    }

    public int v() {
        return v;
    }

    public Condition when() {
        return when;
    }

    /** Resistance of the edge (> 0). */
    public double weight() {
        return weight;
    }

    public boolean isSelfLoop() {
        return u == v;
    }

    public Edge withWeight(double w) {
        return new Edge(id, u, v, when, w, group, locked);
    }
}
