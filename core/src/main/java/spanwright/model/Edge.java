package spanwright.model;

/**
 * An undirected edge between vertex indices {@code u} and {@code v} with a presence condition and
 * a weight. Convention used everywhere in Spanwright: <b>the weight is a resistance</b>; a present
 * edge is a resistor of resistance {@code weight}, an absent one a capacitor of capacitance
 * {@code 1/weight}. Immutable.
 */
public final class Edge {
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
        if (!(weight > 0) || Double.isInfinite(weight)) {
            throw new IllegalArgumentException("weight must be finite and > 0, got " + weight);
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
