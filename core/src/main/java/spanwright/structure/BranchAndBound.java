package spanwright.structure;

import spanwright.electric.ElectricalNetwork;
import spanwright.model.Deadline;

/**
 * W₊ or W₋ of a general instance (shared variables, negated literals, always-present edges) by
 * branch and bound over partial assignments, without enumerating the cube.
 *
 * <p>The variables are fixed one at a time, in the order given. For a partial assignment ρ let P be
 * the edges present in every completion (always-present edges and literals ρ makes true) and Q the
 * edges present in some completion (P plus the literals ρ leaves open).
 * <ul>
 * <li><b>Positive side (W₊).</b> Every positive completion x has P ⊆ G(x). If s and t are joined
 * in P, Rayleigh's monotonicity law (R is the minimum of Σ w θ² over unit s–t flows, and the flows
 * on P are flows on G(x)) gives R(G(x)) ≤ R(P): an upper bound for the whole branch. If s and t
 * are apart in Q, no completion is positive and the branch is dropped.</li>
 * <li><b>Negative side (W₋).</b> Every negative completion x has G(x) ⊆ Q. If s and t are apart in
 * Q, the capacitance is monotone the other way (C is the minimum of Σ_absent (1/w)(p_u − p_v)²
 * over potentials constant across present edges; potentials admissible for Q are admissible for
 * G(x), and on G(x) the absent set is larger — each extra absent edge adds a non-negative term, and
 * making an edge present only restricts the potentials), so C(G(x)) ≤ C(Q). If s and t are joined
 * in P, no completion is negative and the branch is dropped.</li>
 * </ul>
 * A branch whose bound does not beat the best value found (by more than a relative 1e-12) is
 * pruned. Leaves are full assignments, evaluated exactly by {@link ElectricalNetwork}. Values are
 * tried in the order that moves toward the extreme side first (fewer present edges for W₊, more
 * for W₋), so good incumbents come early. The search is exact when it finishes; when it runs out of
 * its node budget it returns the certified interval [best found, largest bound still open] (the
 * upper end is +∞ when an open branch had no bound yet).
 *
 * <p>Cost: at most {@code maxNodes} nodes, each O(|E| α) for connectivity plus one network
 * evaluation O(|V|³) when a bound is needed. Mutable, single-threaded; reuses its work arrays.
 * Rayleigh's law: Doyle &amp; Snell, "Random Walks and Electric Networks", MAA 1984, §1.4.
 */
public final class BranchAndBound {
    /** The outcome on one side. */
    public record Outcome(double best, boolean[] bestAssignment, double upper, boolean exact, long nodes) {}

    private final int variableCount;
    private final int[] edgeVariable;
    private final boolean[] edgePositive;
    private final ElectricalNetwork network;
    private final int[] order;
    private final int[] assignment; // -1 open, 0, 1
    private final boolean[] inP;
    private final boolean[] inQ;
    private final long maxNodes;
    private long deadlineNanos = Long.MAX_VALUE;
    private Deadline budget = Deadline.none();
    private final int[] polarity; // bit 1: occurs positive, bit 2: occurs negated

    private final java.util.function.Predicate<boolean[]> domain;
    private final boolean[] full;

    private boolean positiveSide;
    private double best;
    private boolean[] bestAssignment;
    private double openUpper;
    private long nodes;
    private boolean outOfBudget;
    private boolean byDeadline;

    /**
     * @param vertexCount vertices 0..vertexCount−1
     * @param edgeVariable per edge, its variable index or −1 for always present
     * @param edgePositive per edge, the literal's polarity
     * @param order the variables in branching order (a permutation of 0..variableCount−1)
     * @param domain the promise as a test of full assignments, or null for the whole cube; with a
     *     promise every leaf is a full assignment tested by it (the bounds stay valid: they hold
     *     for every completion, so for those in the domain too)
     */
    public BranchAndBound(int vertexCount, int s, int t, int[] u, int[] v, double[] weight, int variableCount,
            int[] edgeVariable, boolean[] edgePositive, int[] order, long maxNodes,
            java.util.function.Predicate<boolean[]> domain) {
        this.domain = domain;
        this.full = new boolean[variableCount];
        this.variableCount = variableCount;
        this.edgeVariable = edgeVariable.clone();
        this.edgePositive = edgePositive.clone();
        this.network = new ElectricalNetwork(vertexCount, s, t, u, v, weight);
        this.order = order.clone();
        this.assignment = new int[variableCount];
        this.inP = new boolean[u.length];
        this.inQ = new boolean[u.length];
        this.maxNodes = maxNodes;
        this.polarity = new int[variableCount];
        for (int e = 0; e < u.length; e++) {
            if (edgeVariable[e] >= 0) {
                polarity[edgeVariable[e]] |= edgePositive[e] ? 1 : 2;
            }
        }
    }

    /**
     * Stops the search at {@code System.nanoTime()} ≥ {@code deadline} as if the node budget were
     * spent (the result is then the certified interval). Checked every 64 nodes.
     */
    public void setDeadline(long deadlineNanos) {
        this.deadlineNanos = deadlineNanos;
    }

    /**
     * Stops the search when {@code deadline} has passed, asked once per node (one step: a
     * connectivity test and at most one network evaluation), as if the node budget were spent; the
     * result is then the certified interval. Used together with {@link #setDeadline(long)}: the
     * earlier of the two ends the search.
     */
    public void setDeadline(Deadline deadline) {
        this.budget = deadline;
    }

    /** Did the last search stop on a time limit (rather than finish or spend its nodes)? */
    public boolean stoppedByDeadline() {
        return byDeadline;
    }

    /** W₊: the largest effective resistance over inputs where s and t are connected. */
    public Outcome maxResistance() {
        return run(true);
    }

    /** W₋: the largest effective capacitance over inputs where s and t are apart. */
    public Outcome maxCapacitance() {
        return run(false);
    }

    private Outcome run(boolean positive) {
        positiveSide = positive;
        best = Double.NaN;
        bestAssignment = null;
        openUpper = Double.NEGATIVE_INFINITY;
        nodes = 0;
        outOfBudget = false;
        byDeadline = false;
        java.util.Arrays.fill(assignment, -1);
        search(0);
        double upper = Double.isNaN(best) ? openUpper : Math.max(best, openUpper);
        if (!outOfBudget) {
            upper = best;
        }
        return new Outcome(best, bestAssignment, upper, !outOfBudget, nodes);
    }

    private void fillSets() {
        for (int e = 0; e < inP.length; e++) {
            int x = edgeVariable[e];
            if (x < 0) {
                inP[e] = true;
                inQ[e] = true;
            } else if (assignment[x] < 0) {
                inP[e] = false;
                inQ[e] = true;
            } else {
                boolean holds = (assignment[x] == 1) == edgePositive[e];
                inP[e] = holds;
                inQ[e] = holds;
            }
        }
    }

    private void search(int depth) {
        if (outOfBudget) {
            return;
        }
        nodes++;
        fillSets();
        boolean joinedP = network.connected(inP);
        boolean joinedQ = network.connected(inQ);
        double bound;
        if (positiveSide) {
            if (!joinedQ) {
                return; // no positive completion
            }
            bound = joinedP ? network.witnessSize(inP) : Double.POSITIVE_INFINITY;
        } else {
            if (joinedP) {
                return; // no negative completion
            }
            bound = joinedQ ? Double.POSITIVE_INFINITY : network.witnessSize(inQ);
        }
        if (depth == order.length || domain == null && joinedP == joinedQ && (positiveSide ? joinedP : !joinedQ)
                && isLeafValue()) {
            // every completion has the same present set: the bound is the value
            if (domain != null) {
                for (int i = 0; i < variableCount; i++) {
                    full[i] = assignment[i] == 1;
                }
                if (!domain.test(full)) {
                    return;
                }
            }
            offer(bound);
            return;
        }
        if (!Double.isNaN(best) && bound <= best * (1 + 1e-12)) {
            return;
        }
        if (nodes >= maxNodes || (nodes & 63) == 0 && System.nanoTime() >= deadlineNanos || budget.passed()) {
            outOfBudget = true;
            byDeadline = nodes < maxNodes;
            openUpper = Math.max(openUpper, bound);
            return;
        }
        int x = order[depth];
        int first = firstValue(x);
        for (int k = 0; k < 2; k++) {
            int value = k == 0 ? first : 1 - first;
            assignment[x] = value;
            search(depth + 1);
            assignment[x] = -1;
            if (outOfBudget) {
                // the sibling not yet searched stays open with this node's bound
                openUpper = Math.max(openUpper, bound);
                return;
            }
        }
    }

    /** True when no open variable touches any edge (P = Q), so the node is in effect a leaf. */
    private boolean isLeafValue() {
        for (int e = 0; e < inP.length; e++) {
            if (inP[e] != inQ[e]) {
                return false;
            }
        }
        return true;
    }

    /** The value that removes edges first for W₊ (adds them first for W₋). */
    private int firstValue(int x) {
        boolean onlyPositive = polarity[x] == 1;
        boolean onlyNegative = polarity[x] == 2;
        if (positiveSide) {
            return onlyNegative ? 1 : 0;
        }
        return onlyNegative ? 0 : 1;
    }

    private void offer(double value) {
        if (Double.isNaN(best) || value > best * (1 + 1e-12)) {
            best = value;
            bestAssignment = new boolean[variableCount];
            for (int i = 0; i < variableCount; i++) {
                // variables left open touch no edge: 0 stands for them
                bestAssignment[i] = assignment[i] == 1;
            }
        }
    }
}
