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

    public Edge(String id, int u, int v, Condition when, double weight) {
        if (!(weight > 0) || Double.isInfinite(weight)) {
            throw new IllegalArgumentException("weight must be finite and > 0, got " + weight);
        }
        this.id = id;
        this.u = u;
        this.v = v;
        this.when = when;
        this.weight = weight;
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
        return new Edge(id, u, v, when, w);
    }
}
