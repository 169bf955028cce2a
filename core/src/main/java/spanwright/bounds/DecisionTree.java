package spanwright.bounds;

/**
 * A deterministic decision tree over the variables of a {@link TargetFunction}: an inner node
 * queries one variable and continues in its 0- or 1-child; a leaf answers 0 or 1. Built by
 * {@link ClassicalMeasures} as the witness of D(f); a test verifies it by running it on every
 * input of the domain and measuring its depth. Immutable.
 */
public final class DecisionTree {
    private final int variable;
    private final boolean answer;
    private final boolean reachable;
    private final DecisionTree zero;
    private final DecisionTree one;
    private final int depth;

    private DecisionTree(int variable, boolean answer, boolean reachable, DecisionTree zero, DecisionTree one) {
        this.variable = variable;
        this.answer = answer;
        this.reachable = reachable;
        this.zero = zero;
        this.one = one;
        this.depth = zero == null ? 0 : 1 + Math.max(zero.depth, one.depth);
    }

    /**
     * A leaf answering {@code answer}; {@code reachable} is false for a leaf no input of the
     * domain reaches (possible under a promise; its answer is then arbitrary).
     */
    public static DecisionTree leaf(boolean answer, boolean reachable) {
        return new DecisionTree(-1, answer, reachable, null, null);
    }

    /** A node querying variable {@code variable} (0-based, input order). */
    public static DecisionTree query(int variable, DecisionTree zero, DecisionTree one) {
        if (variable < 0 || zero == null || one == null) {
            throw new IllegalArgumentException("a query node needs a variable and two children");
        }
        return new DecisionTree(variable, false, true, zero, one);
    }

    public boolean isLeaf() {
        return zero == null;
    }

    /** The queried variable (0-based), or −1 at a leaf. */
    public int variable() {
        return variable;
    }

    /** The leaf's answer (false at inner nodes). */
    public boolean answer() {
        return answer;
    }

    /** False for a leaf that no input of the domain reaches. */
    public boolean reachable() {
        return reachable;
    }

    /** Subtree for variable = 0 (null at a leaf). */
    public DecisionTree zero() {
        return zero;
    }

    /** Subtree for variable = 1 (null at a leaf). */
    public DecisionTree one() {
        return one;
    }

    /** Longest root-to-leaf path: the number of queries in the worst case. */
    public int depth() {
        return depth;
    }

    /** Number of nodes. O(size). */
    public int size() {
        return isLeaf() ? 1 : 1 + zero.size() + one.size();
    }

    /** Runs the tree on {@code mask} of {@code n} variables. O(depth). */
    public boolean evaluate(long mask, int n) {
        DecisionTree t = this;
        while (!t.isLeaf()) {
            t = ((mask >>> (n - 1 - t.variable)) & 1L) != 0 ? t.one : t.zero;
        }
        return t.answer;
    }

    /** Number of queries the tree makes on {@code mask}. O(depth). */
    public int queries(long mask, int n) {
        DecisionTree t = this;
        int q = 0;
        while (!t.isLeaf()) {
            t = ((mask >>> (n - 1 - t.variable)) & 1L) != 0 ? t.one : t.zero;
            q++;
        }
        return q;
    }
}
