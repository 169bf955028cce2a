package spanwright.bounds;

/**
 * A certificate of an input x: a set S of variables such that every input of the domain that
 * agrees with x on S has the same value f(x). {@code fixed} is S as a mask (same bit order as
 * inputs); the certificate's size |S| is what C₀, C₁ and C maximise over inputs (of the smallest
 * certificate per input). Immutable.
 *
 * @param input x, as a mask
 * @param value f(x)
 * @param fixed the variables of S, as a mask
 */
public record Certificate(long input, boolean value, long fixed) {
    /** |S|. */
    public int size() {
        return Long.bitCount(fixed);
    }
}
