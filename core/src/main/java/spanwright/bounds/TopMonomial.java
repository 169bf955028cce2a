package spanwright.bounds;

/**
 * The witness of the exact degree: a monomial ∏_{i∈S} x_i of largest size with a non-zero
 * coefficient in the unique multilinear polynomial that equals f on {0,1}^n. Immutable.
 *
 * @param variables S, as a mask (same bit order as inputs)
 * @param coefficient its integer coefficient (0 only for f ≡ 0, where S is empty)
 */
public record TopMonomial(long variables, long coefficient) {
    /** |S| = deg(f). */
    public int degree() {
        return Long.bitCount(variables);
    }
}
