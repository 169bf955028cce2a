package spanwright.bounds;

import java.util.List;

/**
 * The witness of a (block) sensitivity: an input x and disjoint blocks B₁…B_k of variables such
 * that flipping any one block gives an input of the domain with the other value of f. For
 * sensitivity every block is a single variable. Immutable.
 *
 * @param input x, as a mask
 * @param value f(x)
 * @param blocks the blocks, as masks (pairwise disjoint, non-empty)
 */
public record SensitiveBlocks(long input, boolean value, List<Long> blocks) {
    public SensitiveBlocks {
        blocks = List.copyOf(blocks);
    }

    /** k, the number of blocks. */
    public int count() {
        return blocks.size();
    }
}
