package spanwright.structure;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import spanwright.expr.Expr;
import spanwright.model.Deadline;

/**
 * Manager of reduced ordered binary decision diagrams (ROBDDs; Bryant, "Graph-based algorithms for
 * Boolean function manipulation", IEEE Transactions on Computers C-35(8), 1986) over the variables
 * 0 … n−1, tested in index order (variable 0 on top). A diagram is an {@code int} handle into this
 * manager's node table: {@link #FALSE} = 0 and {@link #TRUE} = 1 are the two sinks. Every node is
 * made through a unique table, so two handles are equal exactly when their functions are equal
 * (canonicity), and no node tests a variable whose two branches agree (reduction).
 *
 * <p><b>Input order.</b> An assignment is a {@code boolean[n]} with entry i the value of variable
 * i. This is Spanwright's input order ({@code spanwright.model.Inputs}, {@code Expr.Var}): as a
 * mask, variable i is bit (n − 1 − i), so the input string reads variable 0 first; listing
 * assignments lexicographically by variable 0, 1, … with false before true is listing masks in
 * increasing order, the order in which the enumerator visits inputs (for n ≤ 30 it visits masks
 * 0, 1, …, 2^n − 1).
 *
 * <p><b>Cost.</b> {@link #and}, {@link #or}, {@link #xor}, {@link #not}: O(|f|·|g|) nodes visited
 * at worst (Bryant 1986), usually far less thanks to the operation cache; recursion depth at most
 * n + 1. {@link #satCount}, {@link #nodeCount}: O(|f|) with an explicit stack.
 * {@link #firstSatisfying}: O(n·k) after O(1) set-up, because every node other than FALSE has a
 * satisfying completion. {@link #fromExpr}: iterative over the expression tree, so a
 * million-term DNF does not overflow the stack. {@link #connectivity}: see there.
 *
 * <p><b>Not thread-safe; mutable.</b> The node table, the unique table and the operation cache
 * only grow (no garbage collection); work arrays for traversals are reused between calls. Every
 * operation that would make the table hold more than {@code maxNodes} nodes (sinks included)
 * throws {@link TooLargeDiagramException}; the handles made before stay valid.
 *
 * <p>Written for Spanwright rather than taken from a library: the Java BDD packages on Maven
 * Central either use reflection and a shutdown-hook thread (which the page's TeaVM build cannot
 * compile) or carry a licence the MIT-licensed page cannot bundle, and none offers the
 * frontier-based construction of {@link #connectivity} directly.
 */
public final class DecisionDiagrams {
    public static final int FALSE = 0;
    public static final int TRUE = 1;

    private static final int OP_AND = 0;
    private static final int OP_OR = 1;
    private static final int OP_XOR = 2;
    private static final int MIN_CACHE = 1 << 14;
    private static final int MAX_CACHE = 1 << 22;

    private final int n;
    private final long maxNodes;

    private int[] var;
    private int[] lo;
    private int[] hi;
    private int[] next;
    private int size;
    private int[] buckets;

    private int[] cacheF;
    private int[] cacheG;
    private int[] cacheOp;
    private int[] cacheR;

    private int[] stamp = new int[0];
    private int stampValue;
    private int[] stack = new int[64];
    private Deadline deadline = Deadline.none();
    private long work;

    /**
     * An empty manager over {@code variableCount} variables.
     *
     * @param maxNodes the most nodes (the two sinks included) the table may hold; at least 2
     * @throws IllegalArgumentException when {@code variableCount} &lt; 0 or {@code maxNodes} &lt; 2
     */
    public DecisionDiagrams(int variableCount, long maxNodes) {
        if (variableCount < 0) {
            throw new IllegalArgumentException("variable count must be ≥ 0, got " + variableCount);
        }
        if (maxNodes < 2) {
            throw new IllegalArgumentException("the node budget must be at least 2 (the two sinks), got " + maxNodes);
        }
        this.n = variableCount;
        this.maxNodes = maxNodes;
        int cap = 1024;
        var = new int[cap];
        lo = new int[cap];
        hi = new int[cap];
        next = new int[cap];
        buckets = new int[cap];
        var[FALSE] = n;
        var[TRUE] = n;
        lo[TRUE] = TRUE;
        hi[TRUE] = TRUE;
        size = 2;
        allocateCache(MIN_CACHE);
    }

    /**
     * A time budget for every later operation, checked once per 4096 node requests (each apply
     * step makes one) and every 256 frontier states of {@link #connectivity}; when it runs out the
     * operation throws {@link Deadline.Expired} (the handles made before stay valid).
     */
    public void setDeadline(Deadline deadline) {
        this.deadline = deadline;
    }

    /** Number of variables n. */
    public int variableCount() {
        return n;
    }

    /** Nodes in the table, the two sinks included. */
    public long tableSize() {
        return size;
    }

    /** The node budget given at construction. */
    public long budget() {
        return maxNodes;
    }

    /** The variable tested at the top of {@code f}, or n for a sink. */
    public int topVariable(int f) {
        return var[f];
    }

    /** The branch of {@code f} for its top variable = 0 ({@code f} itself for a sink). */
    public int low(int f) {
        return lo[f];
    }

    /** The branch of {@code f} for its top variable = 1 ({@code f} itself for a sink). */
    public int high(int f) {
        return hi[f];
    }

    /** The function "variable {@code index} is 1". */
    public int variable(int index) {
        if (index < 0 || index >= n) {
            throw new IllegalArgumentException("variable " + index + " is not among 0 … " + (n - 1));
        }
        return mk(index, FALSE, TRUE);
    }

    public int not(int f) {
        return apply(OP_XOR, f, TRUE);
    }

    public int and(int f, int g) {
        return apply(OP_AND, f, g);
    }

    public int or(int f, int g) {
        return apply(OP_OR, f, g);
    }

    public int xor(int f, int g) {
        return apply(OP_XOR, f, g);
    }

    /** If {@code f} then {@code g} else {@code h}. */
    public int ite(int f, int g, int h) {
        if (f == TRUE) {
            return g;
        }
        if (f == FALSE) {
            return h;
        }
        return or(and(f, g), and(not(f), h));
    }

    /** The value of {@code f} on an assignment (entry i = variable i). O(n). */
    public boolean evaluate(int f, boolean[] assignment) {
        int p = f;
        while (p > TRUE) {
            p = assignment[var[p]] ? hi[p] : lo[p];
        }
        return p == TRUE;
    }

    /**
     * The node testing {@code v} with branches {@code l} (v = 0) and {@code h} (v = 1), through
     * the unique table; {@code l} itself when the branches agree. Precondition: both branches test
     * only variables after {@code v}.
     */
    private int mk(int v, int l, int h) {
        if ((++work & 4095) == 0) {
            deadline.check("building a decision diagram (" + size + " nodes so far)");
        }
        if (l == h) {
            return l;
        }
        int b = hash(v, l, h) & (buckets.length - 1);
        for (int p = buckets[b]; p != 0; p = next[p]) {
            if (var[p] == v && lo[p] == l && hi[p] == h) {
                return p;
            }
        }
        if (size >= maxNodes) {
            throw new TooLargeDiagramException(maxNodes, "the decision diagram needs more than " + maxNodes
                    + " nodes (the budget); give a larger node budget, or, when the graph is wide, "
                    + "number the variables so that the edges sweep the graph with a small frontier; "
                    + "with at most 30 variables enumeration is exact too");
        }
        if (size == var.length) {
            int cap = (int) Math.min((long) var.length * 2, Integer.MAX_VALUE - 8);
            var = java.util.Arrays.copyOf(var, cap);
            lo = java.util.Arrays.copyOf(lo, cap);
            hi = java.util.Arrays.copyOf(hi, cap);
            next = java.util.Arrays.copyOf(next, cap);
        }
        int p = size++;
        var[p] = v;
        lo[p] = l;
        hi[p] = h;
        next[p] = buckets[b];
        buckets[b] = p;
        if (size > buckets.length - (buckets.length >>> 2)) {
            rehash(buckets.length * 2);
        }
        if (size > cacheR.length && cacheR.length < MAX_CACHE) {
            allocateCache(cacheR.length * 2);
        }
        return p;
    }

    private static int hash(int v, int l, int h) {
        int x = v * 0x9E3779B1 + l * 0x85EBCA77 + h * 0xC2B2AE3D;
        return x ^ (x >>> 15);
    }

    private void rehash(int cap) {
        buckets = new int[cap];
        for (int p = 2; p < size; p++) {
            int b = hash(var[p], lo[p], hi[p]) & (cap - 1);
            next[p] = buckets[b];
            buckets[b] = p;
        }
    }

    private void allocateCache(int cap) {
        cacheF = new int[cap];
        cacheG = new int[cap];
        cacheOp = new int[cap];
        cacheR = new int[cap];
        java.util.Arrays.fill(cacheF, -1);
    }

    private int apply(int op, int f, int g) {
        switch (op) {
            case OP_AND:
                if (f == FALSE || g == FALSE) {
                    return FALSE;
                }
                if (f == TRUE || f == g) {
                    return g;
                }
                if (g == TRUE) {
                    return f;
                }
                break;
            case OP_OR:
                if (f == TRUE || g == TRUE) {
                    return TRUE;
                }
                if (f == FALSE || f == g) {
                    return g;
                }
                if (g == FALSE) {
                    return f;
                }
                break;
            default:
                if (f == g) {
                    return FALSE;
                }
                if (f == FALSE) {
                    return g;
                }
                if (g == FALSE) {
                    return f;
                }
                if (f == TRUE && g == TRUE) {
                    return FALSE;
                }
        }
        if (f > g) {
            int x = f;
            f = g;
            g = x;
        }
        int slot = (hash(op, f, g) & (cacheR.length - 1));
        if (cacheF[slot] == f && cacheG[slot] == g && cacheOp[slot] == op) {
            return cacheR[slot];
        }
        int vf = var[f];
        int vg = var[g];
        int v = Math.min(vf, vg);
        int r0 = apply(op, vf == v ? lo[f] : f, vg == v ? lo[g] : g);
        int r1 = apply(op, vf == v ? hi[f] : f, vg == v ? hi[g] : g);
        int r = mk(v, r0, r1);
        slot = hash(op, f, g) & (cacheR.length - 1); // the cache may have grown meanwhile
        cacheF[slot] = f;
        cacheG[slot] = g;
        cacheOp[slot] = op;
        cacheR[slot] = r;
        return r;
    }

    /**
     * The function "the Hamming weight of the input is in {@code weights}" (weights outside
     * 0 … n are ignored). Built level by level from the counts, O(n²) nodes and time.
     */
    public int hammingWeightIn(int[] weights) {
        boolean[] allowed = new boolean[n + 1];
        for (int w : weights) {
            if (w >= 0 && w <= n) {
                allowed[w] = true;
            }
        }
        int[] level = new int[n + 1];
        for (int c = 0; c <= n; c++) {
            level[c] = allowed[c] ? TRUE : FALSE;
        }
        for (int i = n - 1; i >= 0; i--) {
            for (int c = 0; c <= i; c++) {
                level[c] = mk(i, level[c], level[c + 1]);
            }
        }
        return level[0];
    }

    /**
     * The diagram of an expression: constants, variables, {@code !}, the binary operators
     * ({@code & | ^ -> <->}) and the counting forms {@code thr/exactly/atmost(k, …)} (the parser
     * writes {@code maj} as {@code thr}, {@code parity}, {@code any}, {@code all} as chains of
     * binary operators). A counting form over m arguments is built by dynamic programming over
     * "how many of the first j arguments are 1", capped at k + 1: O(m·k) operations. The tree is
     * walked with an explicit stack, so expression depth costs heap, not stack.
     *
     * @throws IllegalArgumentException when a variable index is not below n
     */
    public int fromExpr(Expr e) {
        List<Expr> todo = new ArrayList<>();
        List<Boolean> expanded = new ArrayList<>();
        int[] results = new int[16];
        int top = 0;
        todo.add(e);
        expanded.add(Boolean.FALSE);
        while (!todo.isEmpty()) {
            int last = todo.size() - 1;
            Expr x = todo.get(last);
            boolean done = expanded.get(last);
            if (x instanceof Expr.Const) {
                todo.remove(last);
                expanded.remove(last);
                results = push(results, top++, ((Expr.Const) x).value ? TRUE : FALSE);
            } else if (x instanceof Expr.Var) {
                todo.remove(last);
                expanded.remove(last);
                results = push(results, top++, variable(((Expr.Var) x).index));
            } else if (!done) {
                expanded.set(last, Boolean.TRUE);
                List<Expr> kids = children(x);
                for (int i = kids.size() - 1; i >= 0; i--) {
                    todo.add(kids.get(i));
                    expanded.add(Boolean.FALSE);
                }
            } else {
                todo.remove(last);
                expanded.remove(last);
                int r;
                if (x instanceof Expr.Not) {
                    r = not(results[--top]);
                } else if (x instanceof Expr.Binary) {
                    int b = results[--top];
                    int a = results[--top];
                    r = binary(((Expr.Binary) x).op, a, b);
                } else {
                    Expr.Counting c = (Expr.Counting) x;
                    int m = c.args.size();
                    top -= m;
                    r = counting(c.kind, c.k, results, top, m);
                }
                results = push(results, top++, r);
            }
        }
        return results[0];
    }

    private static int[] push(int[] a, int at, int value) {
        if (at == a.length) {
            a = java.util.Arrays.copyOf(a, a.length * 2);
        }
        a[at] = value;
        return a;
    }

    private static List<Expr> children(Expr x) {
        if (x instanceof Expr.Not) {
            return List.of(((Expr.Not) x).operand);
        }
        if (x instanceof Expr.Binary) {
            Expr.Binary b = (Expr.Binary) x;
            return List.of(b.left, b.right);
        }
        if (x instanceof Expr.Counting) {
            return ((Expr.Counting) x).args;
        }
        throw new IllegalArgumentException("an expression kind the decision diagrams do not know: " + x);
    }

    private int binary(Expr.Op op, int a, int b) {
        switch (op) {
            case AND:
                return and(a, b);
            case OR:
                return or(a, b);
            case XOR:
                return xor(a, b);
            case IMPLIES:
                return or(not(a), b);
            default:
                return not(xor(a, b));
        }
    }

    /** thr/exactly/atmost over args[from … from+m−1]; counts above cap are lumped into cap. */
    private int counting(Expr.Count kind, int k, int[] args, int from, int m) {
        int cap;
        switch (kind) {
            case AT_LEAST:
                if (k <= 0) {
                    return TRUE;
                }
                if (k > m) {
                    return FALSE;
                }
                cap = k;
                break;
            case EXACTLY:
                if (k < 0 || k > m) {
                    return FALSE;
                }
                cap = k + 1;
                break;
            default:
                if (k < 0) {
                    return FALSE;
                }
                if (k >= m) {
                    return TRUE;
                }
                cap = k + 1;
        }
        // c[j] = "exactly j of the arguments so far are 1" for j < cap, c[cap] = "at least cap"
        int[] c = new int[cap + 1];
        c[0] = TRUE;
        for (int i = 0; i < m; i++) {
            int a = args[from + i];
            for (int j = cap; j >= 0; j--) {
                int stay = j == cap ? or(c[cap], and(a, c[cap - 1])) : and(not(a), c[j]);
                if (j < cap && j > 0) {
                    stay = or(stay, and(a, c[j - 1]));
                }
                c[j] = stay;
            }
        }
        switch (kind) {
            case AT_LEAST:
                return c[cap];
            case EXACTLY:
                return c[k];
            default:
                return not(c[cap]);
        }
    }

    /**
     * The s–t connectivity function of a graph whose edges are switched by literals: edge i joins
     * {@code u[i]}–{@code v[i]} and is present when variable {@code var[i]} equals
     * {@code positive[i]}; {@code var[i] = -1} means always present. The function is 1 on an
     * assignment when s and t are joined by a path of present edges.
     *
     * <p>Built by frontier-based search (Knuth, The Art of Computer Programming 4A, §7.1.4;
     * Sekine, Imai &amp; Tani, "Computing the Tutte polynomial of a graph of moderate size", ISAAC
     * 1995), never through a truth table. The edges are processed in groups, always-present edges
     * first, then the edges of each variable in index order. A state is the partition of the
     * frontier (vertices met by an edge already processed and by one still to come) into the
     * components the present edges have made so far, each marked "contains s" / "contains t". A
     * merge that puts s and t in one component goes to TRUE; a component marked with s or t whose
     * last frontier vertex leaves goes to FALSE (nothing can reach it any more), and so does every
     * state left after the last edge. Equal states at a level are merged (hashing), and the nodes
     * are made bottom-up through the unique table, so the result is the reduced diagram.
     *
     * <p>Cost: O(Σ_levels states·(w + edges of the level)) time, where w is the largest frontier;
     * the number of states grows with the frontier (for a planar graph swept along a line, with
     * the non-crossing partitions of the frontier), so a k×k grid numbered row by row is cheap and
     * a complete graph is not. The states kept count against the node budget. Self-loops are
     * ignored; s = t gives TRUE.
     *
     * @throws IllegalArgumentException when the arrays differ in length or hold an index out of range
     * @throws TooLargeDiagramException when states or nodes exceed the budget
     */
    public int connectivity(int vertexCount, int s, int t, int[] u, int[] v, int[] var, boolean[] positive) {
        int m = u.length;
        if (v.length != m || var.length != m || positive.length != m) {
            throw new IllegalArgumentException("u, v, var and positive must have one entry per edge");
        }
        if (s < 0 || s >= vertexCount || t < 0 || t >= vertexCount) {
            throw new IllegalArgumentException("s and t must be vertices 0 … " + (vertexCount - 1));
        }
        for (int e = 0; e < m; e++) {
            if (u[e] < 0 || u[e] >= vertexCount || v[e] < 0 || v[e] >= vertexCount) {
                throw new IllegalArgumentException("edge " + e + " joins a vertex outside 0 … " + (vertexCount - 1));
            }
            if (var[e] < -1 || var[e] >= n) {
                throw new IllegalArgumentException("edge " + e + " is switched by variable " + var[e]
                        + ", not among -1 (always), 0 … " + (n - 1));
            }
        }
        if (s == t) {
            return TRUE;
        }
        return new FrontierSearch(vertexCount, s, t, u, v, var, positive).run();
    }

    /** One run of the frontier-based search of {@link #connectivity}; its work arrays are its own. */
    private final class FrontierSearch {
        final int s;
        final int t;
        final int[] u;
        final int[] v;
        final boolean[] positive;
        /** group 0 = always-present edges; group g ≥ 1 = the edges of variable groupVar[g] */
        final int groups;
        final int[] groupVar;
        final int[][] groupEdges;
        final int[] first;
        final int[] last;
        /** vertices present during group g (first ≤ g ≤ last), increasing */
        final int[][] during;
        long states;

        // work arrays, reused for every state
        final int[] label;
        final int[] parent;
        final int[] flags;
        final int[] remaining;
        final int[] renumber;
        final int[] positionOf;

        FrontierSearch(int vertexCount, int s, int t, int[] u, int[] v, int[] var, boolean[] positive) {
            this.s = s;
            this.t = t;
            this.u = u;
            this.v = v;
            this.positive = positive;
            int m = u.length;
            int[] groupOfVar = new int[n];
            java.util.Arrays.fill(groupOfVar, -1);
            boolean[] used = new boolean[n];
            for (int e = 0; e < m; e++) {
                if (u[e] != v[e] && var[e] >= 0) {
                    used[var[e]] = true;
                }
            }
            int g = 1;
            for (int x = 0; x < n; x++) {
                if (used[x]) {
                    groupOfVar[x] = g++;
                }
            }
            groups = g;
            groupVar = new int[groups];
            groupVar[0] = -1;
            for (int x = 0; x < n; x++) {
                if (used[x]) {
                    groupVar[groupOfVar[x]] = x;
                }
            }
            int[] count = new int[groups];
            int[] groupOf = new int[m];
            for (int e = 0; e < m; e++) {
                groupOf[e] = u[e] == v[e] ? -1 : var[e] < 0 ? 0 : groupOfVar[var[e]];
                if (groupOf[e] >= 0) {
                    count[groupOf[e]]++;
                }
            }
            groupEdges = new int[groups][];
            for (int k = 0; k < groups; k++) {
                groupEdges[k] = new int[count[k]];
                count[k] = 0;
            }
            first = new int[vertexCount];
            last = new int[vertexCount];
            java.util.Arrays.fill(first, Integer.MAX_VALUE);
            java.util.Arrays.fill(last, -1);
            for (int e = 0; e < m; e++) {
                int k = groupOf[e];
                if (k < 0) {
                    continue;
                }
                groupEdges[k][count[k]++] = e;
                for (int w : new int[] {u[e], v[e]}) {
                    first[w] = Math.min(first[w], k);
                    last[w] = Math.max(last[w], k);
                }
            }
            int[] size = new int[groups];
            for (int w = 0; w < vertexCount; w++) {
                for (int k = Math.max(first[w], 0); k <= last[w]; k++) {
                    size[k]++;
                }
            }
            during = new int[groups][];
            int widest = 0;
            for (int k = 0; k < groups; k++) {
                during[k] = new int[size[k]];
                widest = Math.max(widest, size[k]);
                size[k] = 0;
            }
            for (int w = 0; w < vertexCount; w++) {
                for (int k = Math.max(first[w], 0); k <= last[w]; k++) {
                    during[k][size[k]++] = w;
                }
            }
            label = new int[widest];
            parent = new int[widest];
            flags = new int[widest];
            remaining = new int[widest];
            renumber = new int[widest];
            positionOf = new int[vertexCount];
        }

        int run() {
            // level 0: the always-present edges, from the empty state; both "values" agree
            Object start = transition(0, "", true, true);
            if (start instanceof Integer) {
                return (Integer) start;
            }
            if (groups == 1) {
                return FALSE;
            }
            // top-down: the states of each level and where their two branches lead
            // (child codes: -1 FALSE, -2 TRUE, ≥ 0 a state of the next level)
            int[][] loChild = new int[groups][];
            int[][] hiChild = new int[groups][];
            List<String> level = new ArrayList<>();
            level.add((String) start);
            states = 1;
            for (int g = 1; g < groups; g++) {
                Map<String, Integer> nextStates = new HashMap<>();
                List<String> nextLevel = new ArrayList<>();
                int[] los = new int[level.size()];
                int[] his = new int[level.size()];
                for (int i = 0; i < level.size(); i++) {
                    if ((i & 255) == 0) {
                        deadline.check("the frontier search for the connectivity diagram, variable group " + g
                                + " of " + (groups - 1));
                    }
                    String st = level.get(i);
                    los[i] = child(transition(g, st, false, false), nextStates, nextLevel);
                    his[i] = child(transition(g, st, true, false), nextStates, nextLevel);
                }
                loChild[g] = los;
                hiChild[g] = his;
                level = nextLevel;
            }
            // bottom-up: nodes through the unique table
            int[] below = new int[0];
            for (int g = groups - 1; g >= 1; g--) {
                int[] los = loChild[g];
                int[] his = hiChild[g];
                int[] nodes = new int[los.length];
                for (int i = 0; i < los.length; i++) {
                    nodes[i] = mk(groupVar[g], resolve(los[i], below), resolve(his[i], below));
                }
                loChild[g] = null;
                hiChild[g] = null;
                below = nodes;
            }
            return below[0];
        }

        private int resolve(int code, int[] below) {
            return code == -1 ? FALSE : code == -2 ? TRUE : below[code];
        }

        private int child(Object r, Map<String, Integer> nextStates, List<String> nextLevel) {
            if (r instanceof Integer) {
                return (Integer) r == TRUE ? -2 : -1;
            }
            String key = (String) r;
            Integer at = nextStates.get(key);
            if (at != null) {
                return at;
            }
            if (++states > maxNodes) {
                throw new TooLargeDiagramException(maxNodes, "the frontier search for the connectivity "
                        + "diagram passed " + maxNodes + " states (the node budget); give a larger budget, "
                        + "or number the variables so that the edges sweep the graph with a small frontier "
                        + "(grids row by row are cheap, complete graphs are not); with at most 30 variables "
                        + "enumeration is exact too");
            }
            nextStates.put(key, nextLevel.size());
            nextLevel.add(key);
            return nextLevel.size() - 1;
        }

        /**
         * The state after group {@code g} from {@code state} (a char per vertex of the frontier
         * before g: component label × 4 + flags, 1 = s, 2 = t), with the group's edges present
         * when their literal holds for {@code value} (all of them when {@code all}): TRUE, FALSE
         * or the next state's key.
         */
        private Object transition(int g, String state, boolean value, boolean all) {
            int[] dom = during[g];
            int d = dom.length;
            for (int i = 0; i < d; i++) {
                positionOf[dom[i]] = i;
                parent[i] = i;
                renumber[i] = -1;
            }
            // each old component is represented by its first vertex; new vertices are singletons
            int read = 0;
            for (int i = 0; i < d; i++) {
                int w = dom[i];
                if (first[w] < g) {
                    int code = state.charAt(read++);
                    int l = code >> 2;
                    if (renumber[l] < 0) {
                        renumber[l] = i;
                        flags[i] = code & 3;
                    } else {
                        parent[i] = renumber[l];
                        flags[i] = 0;
                    }
                } else {
                    flags[i] = (w == s ? 1 : 0) | (w == t ? 2 : 0);
                }
            }
            int[] edges = groupEdges[g];
            for (int e : edges) {
                if (!all && positive[e] != value) {
                    continue;
                }
                int a = find(positionOf[u[e]]);
                int b = find(positionOf[v[e]]);
                if (a != b) {
                    parent[b] = a;
                    flags[a] |= flags[b];
                    if (flags[a] == 3) {
                        return TRUE;
                    }
                }
            }
            for (int i = 0; i < d; i++) {
                remaining[i] = 0;
            }
            for (int i = 0; i < d; i++) {
                if (last[dom[i]] > g) {
                    remaining[find(i)]++;
                }
            }
            for (int i = 0; i < d; i++) {
                if (last[dom[i]] == g) {
                    int r = find(i);
                    if (remaining[r] == 0 && flags[r] != 0) {
                        return FALSE;
                    }
                }
            }
            if (g == groups - 1) {
                return FALSE;
            }
            for (int i = 0; i < d; i++) {
                renumber[i] = -1;
            }
            StringBuilder key = new StringBuilder();
            int labels = 0;
            for (int i = 0; i < d; i++) {
                if (last[dom[i]] > g) {
                    int r = find(i);
                    if (renumber[r] < 0) {
                        renumber[r] = labels++;
                    }
                    key.append((char) (renumber[r] * 4 + flags[r]));
                }
            }
            return key.toString();
        }

        private int find(int i) {
            while (parent[i] != i) {
                parent[i] = parent[parent[i]];
                i = parent[i];
            }
            return i;
        }
    }

    /** Counts (and, when {@code out} is given, lists) the nodes reachable from {@code f}, sinks included. */
    private int reachable(int f, int[] out) {
        if (stamp.length < size) {
            stamp = new int[Math.max(size, stamp.length * 2)];
            stampValue = 0;
        }
        if (++stampValue == Integer.MAX_VALUE) {
            java.util.Arrays.fill(stamp, 0);
            stampValue = 1;
        }
        int count = 0;
        int sp = 0;
        stack[sp++] = f;
        stamp[f] = stampValue;
        while (sp > 0) {
            int p = stack[--sp];
            if (out != null) {
                out[count] = p;
            }
            count++;
            if (p > TRUE) {
                if (sp + 2 > stack.length) {
                    stack = java.util.Arrays.copyOf(stack, stack.length * 2);
                }
                if (stamp[lo[p]] != stampValue) {
                    stamp[lo[p]] = stampValue;
                    stack[sp++] = lo[p];
                }
                if (stamp[hi[p]] != stampValue) {
                    stamp[hi[p]] = stampValue;
                    stack[sp++] = hi[p];
                }
            }
        }
        return count;
    }

    /**
     * Nodes reachable from {@code f}, the sinks it reaches included (Knuth's B(f): a single
     * variable has 3, a constant 1). O(|f|).
     */
    public long nodeCount(int f) {
        return reachable(f, null);
    }

    /**
     * The number of assignments of all n variables on which {@code f} is 1. O(|f|) big-integer
     * additions: a node's count over the variables from its own on is its children's counts,
     * each times 2 to the number of variables its edge skips.
     */
    public BigInteger satCount(int f) {
        int count = reachable(f, null);
        int[] nodes = new int[count];
        reachable(f, nodes);
        java.util.Arrays.sort(nodes); // a node's children were made before it
        Map<Integer, BigInteger> memo = new HashMap<>();
        for (int p : nodes) {
            BigInteger c;
            if (p == FALSE) {
                c = BigInteger.ZERO;
            } else if (p == TRUE) {
                c = BigInteger.ONE;
            } else {
                c = memo.get(lo[p]).shiftLeft(var[lo[p]] - var[p] - 1)
                        .add(memo.get(hi[p]).shiftLeft(var[hi[p]] - var[p] - 1));
            }
            memo.put(p, c);
        }
        return memo.get(f).shiftLeft(var[f]);
    }

    /**
     * The first {@code k} assignments (fewer when there are fewer) on which {@code f} is 1, in
     * input order: lexicographic by variable 0, 1, …, n−1 with false before true, which is
     * increasing mask order (see the class comment). Depth-first, 0-branch first; a variable the
     * path skips takes 0 then 1. O(n·k).
     */
    public List<boolean[]> firstSatisfying(int f, int k) {
        List<boolean[]> out = new ArrayList<>();
        if (k <= 0 || f == FALSE) {
            return out;
        }
        int[] nodeAt = new int[n + 1];
        int[] value = new int[n + 1];
        nodeAt[0] = f;
        value[0] = -1;
        int i = 0;
        while (i >= 0) {
            if (i == n) {
                boolean[] x = new boolean[n];
                for (int j = 0; j < n; j++) {
                    x[j] = value[j] == 1;
                }
                out.add(x);
                if (out.size() == k) {
                    break;
                }
                i--;
                continue;
            }
            if (value[i] >= 1) {
                i--;
                continue;
            }
            value[i]++;
            int p = nodeAt[i];
            int c = var[p] == i ? (value[i] == 1 ? hi[p] : lo[p]) : p;
            if (c != FALSE) {
                nodeAt[i + 1] = c;
                i++;
                value[i] = -1;
            }
        }
        return out;
    }
}
