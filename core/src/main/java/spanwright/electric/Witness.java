package spanwright.electric;

/**
 * The certificate behind one input's witness size. For a positive input ({@link #connected}):
 * {@link #current} is the unit s→t electrical current on each edge oriented u→v (0 on absent
 * edges), {@link #energy} the energy w_e·i_e² dissipated on each edge (Σ = R, Thomson's
 * principle), {@link #potential} the vertex potentials with φ(t) = 0 and φ(s) = R (NaN off s's
 * component), and {@link #value} = R. For a negative input: {@link #potential} is 1 on s's side,
 * 0 on t's, constant on components of G(x); {@link #energy} is (p_u − p_v)²/w_e on each absent
 * edge; {@link #value} = C, the
 * elimination's value (bit for bit the one {@link ElectricalNetwork#evaluate} gives), which Σ energy
 * matches up to rounding. Arrays are owned by the record; do not modify.
 */
public final class Witness {
    public final boolean connected;
    public final double value;
    public final double[] potential;
    public final double[] current;
    public final double[] energy;

    public Witness(boolean connected, double value, double[] potential, double[] current, double[] energy) {
        this.connected = connected;
        this.value = value;
        this.potential = potential;
        this.current = current;
        this.energy = energy;
    }
}
