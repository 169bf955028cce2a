package spanwright.model;

/** A vertex: its id and an optional drawing position (NaN when not given). Immutable. */
public final class Vertex {
    private final String id;
    private final double x;
    private final double y;

    public Vertex(String id, double x, double y) {
        this.id = id;
        this.x = x;
        this.y = y;
    }

    public Vertex(String id) {
        this(id, Double.NaN, Double.NaN);
    }

    public String id() {
        return id;
    }

    public double x() {
        return x;
    }

    public double y() {
        return y;
    }

    public boolean hasPosition() {
        return !Double.isNaN(x) && !Double.isNaN(y);
    }
}
