package spanwright.quantum;

/**
 * What {@link Simulation#run} is asked: the error ε, the scale α² (NaN = the default W₊) and an
 * optional focused input whose whole spectrum is kept, as a mask (up to 63 variables) or as bits
 * (any number of variables). Immutable; {@code with…} return copies.
 */
public final class SimulationOptions {
    /** The default error ε. */
    public static final double DEFAULT_EPSILON = 0.1;

    private final double epsilon;
    private final double alpha2;
    private final long focus;
    private final boolean[] focusBits;

    private SimulationOptions(double epsilon, double alpha2, long focus, boolean[] focusBits) {
        this.epsilon = epsilon;
        this.alpha2 = alpha2;
        this.focus = focus;
        this.focusBits = focusBits;
    }

    /** ε = 0.1, α² = W₊, no focused input. */
    public static SimulationOptions defaults() {
        return new SimulationOptions(DEFAULT_EPSILON, Double.NaN, -1, null);
    }

    public SimulationOptions withEpsilon(double e) {
        return new SimulationOptions(e, alpha2, focus, focusBits);
    }

    /** α² &gt; 0; NaN restores the default α² = W₊. */
    public SimulationOptions withAlpha2(double a) {
        return new SimulationOptions(epsilon, a, focus, focusBits);
    }

    /** The input (mask) whose full spectrum is kept; −1 for none. */
    public SimulationOptions withFocus(long mask) {
        return new SimulationOptions(epsilon, alpha2, mask, null);
    }

    /**
     * The input whose full spectrum is kept, one value per variable (for scenarios of more than 63
     * variables, whose inputs have no mask); null for none.
     */
    public SimulationOptions withFocusBits(boolean[] bits) {
        return new SimulationOptions(epsilon, alpha2, -1, bits == null ? null : bits.clone());
    }

    public double epsilon() {
        return epsilon;
    }

    /** α², or NaN for the default W₊. */
    public double alpha2() {
        return alpha2;
    }

    /** Focused input mask, or −1 (also when the focus is given as bits). */
    public long focus() {
        return focus;
    }

    /** Focused input as bits when given that way, or null. */
    public boolean[] focusBits() {
        return focusBits == null ? null : focusBits.clone();
    }

    /** Is an input in focus (as a mask or as bits)? */
    public boolean hasFocus() {
        return focus >= 0 || focusBits != null;
    }
}
