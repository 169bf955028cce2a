package spanwright.structure;

/**
 * The instance is too wide for the exact structural method within the state budget the caller
 * gave: the frontier (or the vertex count, for the vertex-subset method) would need more states
 * than {@link #budget()}. Thrown before the states are allocated, so memory is not exhausted.
 */
public final class TooWideException extends RuntimeException {
    private static final long serialVersionUID = 1L;
    private final int width;
    private final long budget;

    public TooWideException(int width, long budget, String message) {
        super(message);
        this.width = width;
        this.budget = budget;
    }

    /** The frontier width (or vertex count) that was too large. */
    public int width() {
        return width;
    }

    /** The state budget that was exceeded. */
    public long budget() {
        return budget;
    }
}
