package spanwright.structure;

/**
 * A decision diagram outgrew the node budget its {@link DecisionDiagrams} manager was given. The
 * message names the budget, what was being built, and what to try instead (a larger budget, a
 * variable order with a smaller frontier, or enumeration when the cube is small). Callers that
 * return results catch it and report a status instead: a missing answer is a value.
 */
public final class TooLargeDiagramException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    private final long budget;

    public TooLargeDiagramException(long budget, String message) {
        super(message);
        this.budget = budget;
    }

    /** The node budget that was exceeded. */
    public long budget() {
        return budget;
    }
}
