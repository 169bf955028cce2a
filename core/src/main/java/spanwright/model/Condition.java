package spanwright.model;

/**
 * When an edge is present: always ({@code 1}), when a variable is 1 ({@code a}) or when it is 0
 * ({@code !a}). Immutable.
 */
public final class Condition {
    /** The edge that is always present. */
    public static final Condition ALWAYS = new Condition(-1, true, null);

    private final int variable;
    private final boolean positive;
    private final String name;

    private Condition(int variable, boolean positive, String name) {
        this.variable = variable;
        this.positive = positive;
        this.name = name;
    }

    /** Present when variable {@code index} (named {@code name}) equals {@code positive ? 1 : 0}. */
    public static Condition literal(int index, String name, boolean positive) {
        if (index < 0) {
            throw new IllegalArgumentException("variable index must be ≥ 0");
        }
        return new Condition(index, positive, name);
    }

    public boolean isAlways() {
        return variable < 0;
    }

    /** Index of the variable, or −1 for {@link #ALWAYS}. */
    public int variable() {
        return variable;
    }

    /** True for {@code a}, false for {@code !a}. */
    public boolean positive() {
        return positive;
    }

    /** Name of the variable, or null for {@link #ALWAYS}. */
    public String variableName() {
        return name;
    }

    /** Is the edge present on the input {@code mask} of {@code n} variables (input order). */
    public boolean holds(long mask, int n) {
        if (variable < 0) {
            return true;
        }
        boolean bit = ((mask >>> (n - 1 - variable)) & 1L) != 0;
        return bit == positive;
    }

    /** Text form: {@code 1}, {@code a} or {@code !a}. */
    @Override
    public String toString() {
        return variable < 0 ? "1" : (positive ? name : "!" + name);
    }
}
