package spanwright.analysis;

import spanwright.electric.Witness;
import spanwright.model.Inputs;

/** One input with its present edges, f(x) (null if no function) and its witness. Immutable. */
public final class InputDetail {
    public final long mask;
    public final String input;
    public final boolean[] present;
    public final Boolean f;
    public final Witness witness;

    InputDetail(long mask, int n, boolean[] present, Boolean f, Witness witness) {
        this.mask = mask;
        this.input = Inputs.format(mask, n);
        this.present = present;
        this.f = f;
        this.witness = witness;
    }
}
