package spanwright.bounds;

/**
 * A bound known only up to a certified interval: both ends are evaluated from explicit witnesses
 * (feasible solutions of the two sides of a min–max problem), so the true value lies in
 * [{@link #lower()}, {@link #upper()}] whatever the solver that produced the witnesses did.
 */
public interface CertifiedBound {
    /** The function the bound is for. */
    TargetFunction function();

    /** Certified lower end. */
    double lower();

    /** Certified upper end. */
    double upper();

    /** upper − lower (≥ 0 up to rounding). */
    default double gap() {
        return upper() - lower();
    }
}
