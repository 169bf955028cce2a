package spanwright.quantum;

/**
 * What {@link Simulation#run} is asked: the error ε, the scale α² (NaN = the default W₊) and an
 * optional focused input whose whole spectrum is kept. Immutable; {@code with…} return copies.
 */
public final class SimulationOptions {
    /** The default error ε. */
    public static final double DEFAULT_EPSILON = 0.1;

    private final double epsilon;
    private final double alpha2;
    private final long focus;

    private SimulationOptions(double epsilon, double alpha2, long focus) {
        this.epsilon = epsilon;
        this.alpha2 = alpha2;
        this.focus = focus;
    }

    /** ε = 0.1, α² = W₊, no focused input. */
    public static SimulationOptions defaults() {
        return new SimulationOptions(DEFAULT_EPSILON, Double.NaN, -1);
    }

    public SimulationOptions withEpsilon(double e) {
        return new SimulationOptions(e, alpha2, focus);
    }

    /** α² &gt; 0; NaN restores the default α² = W₊. */
    public SimulationOptions withAlpha2(double a) {
        return new SimulationOptions(epsilon, a, focus);
    }

    /** The input (mask) whose full spectrum is kept; −1 for none. */
    public SimulationOptions withFocus(long mask) {
        return new SimulationOptions(epsilon, alpha2, mask);
    }

    public double epsilon() {
        return epsilon;
    }

    /** α², or NaN for the default W₊. */
    public double alpha2() {
        return alpha2;
    }

    /** Focused input mask, or −1. */
    public long focus() {
        return focus;
    }
}
