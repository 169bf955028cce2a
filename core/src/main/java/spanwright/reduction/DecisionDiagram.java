package spanwright.reduction;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * A decision structure for a Boolean function as a DAG of decision nodes (variable, 0-child,
 * 1-child) over the terminals {@link #FALSE} and {@link #TRUE}, hash-consed so that no two nodes
 * have the same (variable, children) and no node has equal children. Unfolding the DAG gives the
 * decision tree; the DAG itself is the diagram in which nodes computing the same subfunction are
 * merged. Node ids grow from children to parents (a child's id is smaller than its parent's).
 *
 * <p>Two constructions:
 * <ul>
 *   <li>{@link #minimumDepth}: a decision tree of minimum depth D(f), by dynamic programming over
 *       the 3^n subcubes (each variable fixed to 0, fixed to 1, or free): a subcube on which f is
 *       constant has depth 0, otherwise depth = min over free i of 1 + max(depth of the two halves).
 *       The tree queries the first variable (in declaration order) that attains the minimum. Two
 *       subcubes with the same restricted function get the same subtree (the choice depends only on
 *       that function, and a variable it does not depend on is never optimal), so hash-consing
 *       merges exactly the nodes that compute the same subfunction. Cost O(3^n · n) time, 2·3^n
 *       bytes; n ≤ {@link #MAX_MINIMUM_DEPTH_VARIABLES}.</li>
 *   <li>{@link #ordered}: the reduced ordered binary decision diagram for a variable order (Bryant,
 *       "Graph-based algorithms for Boolean function manipulation", IEEE Trans. Computers C-35(8),
 *       1986), built bottom-up from the truth table in O(2^n) time and space; its unfolding is the
 *       decision tree that queries, along the order, each next variable the current subfunction
 *       still depends on. n ≤ {@link TruthTable#MAX_VARIABLES}.</li>
 * </ul>
 *
 * <p>Measures over the reachable part: {@link #depth()} (longest root-to-terminal path, counted in
 * decision nodes), {@link #rank()} (Ehrenfeucht &amp; Haussler, "Learning decision trees from random
 * examples", Information and Computation 82(3), 1989: a leaf has rank 0; a node whose children have
 * ranks a ≠ b has max(a, b), equal ranks a give a + 1) — the fewest wrong guesses G a guessing
 * strategy can guarantee along every path (Cornelissen, Mande &amp; Patro, "Improved quantum query
 * upper bounds based on classical decision trees", arXiv:2203.02968, identify this "guessing
 * complexity" with the rank), and the sizes of the diagram and of its unfolded tree. Immutable
 * after construction.
 */
final class DecisionDiagram {
    static final int FALSE = 0;
    static final int TRUE = 1;
    /** Largest n for the minimum-depth construction (3^14 ≈ 4.8 million subcubes). */
    static final int MAX_MINIMUM_DEPTH_VARIABLES = 14;

    final int n;
    private int[] var = new int[16];
    private int[] low = new int[16];
    private int[] high = new int[16];
    private int count = 2;
    private final Map<Long, Integer> unique = new HashMap<>();
    private int root;

    // measures, computed once by measure()
    private int[] reachable;
    private int[] depthOf;
    private int[] rankOf;
    private long[] treeNodes;
    private long[] treeEdges;

    private DecisionDiagram(int n) {
        this.n = n;
    }

    /** The node (v, lo, hi), or lo when lo == hi. */
    private int mk(int v, int lo, int hi) {
        if (lo == hi) {
            return lo;
        }
        long key = ((long) v << 56) | ((long) lo << 28) | hi;
        Integer done = unique.get(key);
        if (done != null) {
            return done;
        }
        if (count == var.length) {
            var = Arrays.copyOf(var, count * 2);
            low = Arrays.copyOf(low, count * 2);
            high = Arrays.copyOf(high, count * 2);
        }
        var[count] = v;
        low[count] = lo;
        high[count] = hi;
        unique.put(key, count);
        return count++;
    }

    /** A minimum-depth decision tree of {@code f}, as a DAG (see the class comment). */
    static DecisionDiagram minimumDepth(TruthTable f) {
        int n = f.n;
        int[] pow3 = new int[n + 1];
        pow3[0] = 1;
        for (int i = 1; i <= n; i++) {
            pow3[i] = pow3[i - 1] * 3;
        }
        int cubes = pow3[n];
        byte[] value = new byte[cubes]; // 0, 1, or 2 = not constant
        byte[] depth = new byte[cubes];
        int[] digit = new int[n];
        for (int c = 0; c < cubes; c++) {
            if (c > 0) { // base-3 increment of the digits
                for (int i = 0; i < n; i++) {
                    if (++digit[i] < 3) {
                        break;
                    }
                    digit[i] = 0;
                }
            }
            int firstFree = -1;
            long mask = 0;
            for (int i = 0; i < n; i++) {
                if (digit[i] == 2) {
                    if (firstFree < 0) {
                        firstFree = i;
                    }
                } else if (digit[i] == 1) {
                    mask |= 1L << (n - 1 - i);
                }
            }
            if (firstFree < 0) {
                value[c] = (byte) (f.get(mask) ? 1 : 0);
                continue;
            }
            byte a = value[c - 2 * pow3[firstFree]];
            byte b = value[c - pow3[firstFree]];
            value[c] = a == b ? a : 2;
            if (value[c] != 2) {
                continue;
            }
            int best = Integer.MAX_VALUE;
            for (int i = firstFree; i < n; i++) {
                if (digit[i] == 2) {
                    int d = 1 + Math.max(depth[c - 2 * pow3[i]], depth[c - pow3[i]]);
                    best = Math.min(best, d);
                }
            }
            depth[c] = (byte) best;
        }
        DecisionDiagram dd = new DecisionDiagram(n);
        Map<Integer, Integer> memo = new HashMap<>();
        dd.root = dd.fromCube(cubes - 1, value, depth, pow3, memo);
        dd.measure();
        return dd;
    }

    private int fromCube(int c, byte[] value, byte[] depth, int[] pow3, Map<Integer, Integer> memo) {
        if (value[c] != 2) {
            return value[c];
        }
        Integer done = memo.get(c);
        if (done != null) {
            return done;
        }
        int chosen = -1;
        for (int i = 0; i < n && chosen < 0; i++) {
            if ((c / pow3[i]) % 3 == 2
                    && 1 + Math.max(depth[c - 2 * pow3[i]], depth[c - pow3[i]]) == depth[c]) {
                chosen = i;
            }
        }
        int lo = fromCube(c - 2 * pow3[chosen], value, depth, pow3, memo);
        int hi = fromCube(c - pow3[chosen], value, depth, pow3, memo);
        int node = mk(chosen, lo, hi);
        memo.put(c, node);
        return node;
    }

    /**
     * The reduced ordered diagram of {@code f} for {@code order} (a permutation of 0..n−1, the
     * first entry queried first).
     */
    static DecisionDiagram ordered(TruthTable f, int[] order) {
        int n = f.n;
        DecisionDiagram dd = new DecisionDiagram(n);
        int size = 1 << n;
        int[] level = new int[size];
        for (int j = 0; j < size; j++) {
            long mask = 0;
            for (int l = 0; l < n; l++) {
                if (((j >>> (n - 1 - l)) & 1) != 0) {
                    mask |= 1L << (n - 1 - order[l]);
                }
            }
            level[j] = f.get(mask) ? TRUE : FALSE;
        }
        for (int l = n - 1; l >= 0; l--) {
            int half = 1 << l;
            int[] up = new int[half];
            for (int p = 0; p < half; p++) {
                up[p] = dd.mk(order[l], level[2 * p], level[2 * p + 1]);
            }
            level = up;
        }
        dd.root = level[0];
        dd.measure();
        return dd;
    }

    private void measure() {
        boolean[] seen = new boolean[count];
        List<Integer> stack = new ArrayList<>();
        List<Integer> found = new ArrayList<>();
        if (root >= 2) {
            stack.add(root);
            seen[root] = true;
        }
        while (!stack.isEmpty()) {
            int v = stack.remove(stack.size() - 1);
            found.add(v);
            for (int c : new int[] {low[v], high[v]}) {
                if (c >= 2 && !seen[c]) {
                    seen[c] = true;
                    stack.add(c);
                }
            }
        }
        reachable = new int[found.size()];
        for (int i = 0; i < reachable.length; i++) {
            reachable[i] = found.get(i);
        }
        Arrays.sort(reachable); // children before parents
        depthOf = new int[count];
        rankOf = new int[count];
        treeNodes = new long[count];
        treeEdges = new long[count];
        for (int v : reachable) {
            int lo = low[v];
            int hi = high[v];
            depthOf[v] = 1 + Math.max(depthOf[lo], depthOf[hi]);
            rankOf[v] = rankOf[lo] == rankOf[hi] ? rankOf[lo] + 1 : Math.max(rankOf[lo], rankOf[hi]);
            treeNodes[v] = Math.min(AndOrForm.SATURATED, 1 + treeNodes[lo] + treeNodes[hi]);
            treeEdges[v] = Math.min(AndOrForm.SATURATED,
                    (lo != FALSE ? 1 : 0) + (hi != FALSE ? 1 : 0) + treeEdges[lo] + treeEdges[hi]);
        }
    }

    /** The root: a decision node (≥ 2) or a terminal when f is constant. */
    int root() {
        return root;
    }

    boolean isTerminal(int v) {
        return v < 2;
    }

    int variable(int v) {
        return var[v];
    }

    int low(int v) {
        return low[v];
    }

    int high(int v) {
        return high[v];
    }

    /** Reachable decision nodes, children before parents. */
    int[] reachable() {
        return reachable.clone();
    }

    /** Longest root-to-terminal path in decision nodes (0 for a constant). */
    int depth() {
        return root < 2 ? 0 : depthOf[root];
    }

    /** Depth of the sub-diagram at {@code v}. */
    int depth(int v) {
        return v < 2 ? 0 : depthOf[v];
    }

    /** Rank of the unfolded tree (0 for a constant). */
    int rank() {
        return root < 2 ? 0 : rankOf[root];
    }

    /** Rank of the sub-tree at {@code v}. */
    int rank(int v) {
        return v < 2 ? 0 : rankOf[v];
    }

    /** Number of reachable decision nodes. */
    int decisionNodes() {
        return reachable.length;
    }

    /** Edges of the diagram's graph: one per child that is not {@link #FALSE}. */
    int diagramEdges() {
        int e = 0;
        for (int v : reachable) {
            e += (low[v] != FALSE ? 1 : 0) + (high[v] != FALSE ? 1 : 0);
        }
        return e;
    }

    /** Decision nodes of the unfolded tree (saturating). */
    long treeDecisionNodes() {
        return root < 2 ? 0 : treeNodes[root];
    }

    /** Edges of the unfolded tree's graph (saturating). */
    long treeEdges() {
        return root < 2 ? 0 : treeEdges[root];
    }

    /** Decision nodes of the tree unfolded from {@code v}. */
    long treeDecisionNodes(int v) {
        return v < 2 ? 0 : treeNodes[v];
    }
}
