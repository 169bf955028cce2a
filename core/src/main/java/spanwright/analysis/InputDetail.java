package spanwright.analysis;

import spanwright.electric.Witness;
import spanwright.model.Inputs;

/** One input (mask −1 beyond 63 variables) with its present edges, f(x) (null if no function) and its witness. Immutable. */
public final class InputDetail {
    public final long mask;
    public final String input;
    public final boolean[] present;
    public final Boolean f;
    public final Witness witness;

    InputDetail(long mask, int n, boolean[] present, Boolean f, Witness witness) {
        this(mask, Inputs.format(mask, n), present, f, witness);
    }

    /** An input of any number of variables; {@code mask} is −1 when it has more than 63. */
    InputDetail(long mask, String input, boolean[] present, Boolean f, Witness witness) {
        this.mask = mask;
        this.input = input;
        this.present = present;
        this.f = f;
        this.witness = witness;
    }
}
