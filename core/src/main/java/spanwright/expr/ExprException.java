package spanwright.expr;

/** A parse or resolution error in an expression, with the 1-based column where it was found. */
public final class ExprException extends RuntimeException {
    private static final long serialVersionUID = 1L;
    private final int column;

    public ExprException(int column, String message) {
        super(message);
        this.column = column;
    }

    /** 1-based column in the expression text. */
    public int column() {
        return column;
    }
}
