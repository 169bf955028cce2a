package spanwright.analysis;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import spanwright.electric.ElectricalNetwork;
import spanwright.electric.Witness;
import spanwright.expr.Expr;
import spanwright.model.Deadline;
import spanwright.model.Edge;
import spanwright.model.Promise;
import spanwright.model.Scenario;
import spanwright.model.ScenarioException;
import spanwright.structure.BranchAndBound;
import spanwright.structure.DiagramCheck;
import spanwright.structure.EdgeArrays;
import spanwright.structure.Extreme;
import spanwright.structure.HostGraph;
import spanwright.structure.PathsAndBonds;
import spanwright.structure.TooWideException;

/**
 * W₊, W₋ and the reduction check by structure, without enumerating the cube (graph problems with
 * one variable per edge have far too many inputs to list).
 *
 * <p><b>Host-graph instances</b> (every condition a positive literal, no variable on two edges):
 * by Rayleigh monotonicity W₊ is attained on a minimal positive input and W₋ on a maximal negative
 * one (see {@link CandidateInputs}). A minimal positive input is the edge set of a simple s–t path,
 * whose resistance is the sum of its weights (series law), so W₊ is the heaviest simple s–t path. A
 * maximal negative input is "every edge except an s–t bond" (a minimal cut whose two sides are
 * connected); both sides contract to one node each and the bond's edges are capacitors in parallel,
 * so C = Σ 1/w over the bond and W₋ is the heaviest bond. Always-present edges cannot be cut: they are
 * contracted before the bond search; they also make a minimal positive input more than a path, so
 * with always-present edges W₊ comes from branch and bound. Paths and bonds come from
 * {@link PathsAndBonds} (frontier-based search or vertex-subset dynamic programming), with their
 * counts (the number of minimal positive / maximal negative inputs).
 *
 * <p><b>General instances</b> (shared variables, negated literals): {@link BranchAndBound} with
 * Rayleigh bounds; exact when it finishes within its budget, otherwise a certified interval.
 *
 * <p><b>Reduction check</b>: for the connectivity form of the scenario's own graph it holds by
 * construction; otherwise reduced ordered decision diagrams of the graph's connectivity function
 * and of f are compared ({@link DiagramCheck}).
 *
 * <p>Under a promise (at most 63 variables) branch and bound tests every leaf against it; paths
 * and bonds range over the whole cube and are used only without one. Every worst input comes with
 * its witness (currents or potentials) computed by {@link ElectricalNetwork} on that input.
 */
public final class StructuralAnalysis {
    /** Default state budget of the frontier / subset searches (states kept per level). */
    public static final long DEFAULT_STATES = 4_000_000L;
    /** Default time budget of branch and bound, per side, in seconds. */
    public static final double DEFAULT_SECONDS = 30;
    /** Default node budget of branch and bound. */
    public static final long DEFAULT_NODES = 2_000_000L;
    /** Default node budget of the decision diagrams. */
    public static final long DEFAULT_DIAGRAM_NODES = 20_000_000L;

    /**
     * What the structural analysis found. {@code cut} is null when no time budget stopped a pass;
     * otherwise it names, in words, the passes the budget cut (their sides are certified intervals,
     * the reduction "not checked") and how to get the rest. Immutable.
     */
    public record Result(Scenario scenario, String method, Side positive, Side negative, Reduction reduction,
            String cut) {
        /** A result no time budget cut. */
        public Result(Scenario scenario, String method, Side positive, Side negative, Reduction reduction) {
            this(scenario, method, positive, negative, reduction, null);
        }

        /** √(W₊W₋) when both sides are exact (the lower end of the interval otherwise); NaN when a side has no input. */
        public double complexity() {
            return Math.sqrt(positive.value() * negative.value());
        }

        /** The upper end of √(W₊W₋): equal to {@link #complexity} when exact. */
        public double complexityUpper() {
            return Math.sqrt(positive.upper() * negative.upper());
        }

        /** Is every number exact (no side ended on its budget)? */
        public boolean exact() {
            return positive.exact() && negative.exact();
        }
    }

    /**
     * One side: the maximum (W₊ or W₋), its certified interval [value, upper] (equal when exact), one
     * worst input with its witness (null when the side has no input), how many extreme inputs the
     * method saw (minimal positive / maximal negative inputs; null when not counted), and how.
     */
    public record Side(double value, double upper, boolean exact, InputDetail worst, BigInteger extremeInputs,
            String method) {}

    /** The reduction verdict: status "holds", "fails", "by construction" or "not checked". */
    public record Reduction(String status, BigInteger counterexamples, List<String> firstCounterexamples,
            String method) {
        /** Did a time budget stop the check (status "not checked", and {@code method} says so)? */
        public boolean timeCut() {
            return status.equals("not checked") && method.startsWith(DiagramCheck.TIME_CUT);
        }

        public Boolean correct() {
            switch (status) {
                case "holds":
                case "by construction":
                    return Boolean.TRUE;
                case "fails":
                    return Boolean.FALSE;
                default:
                    return null;
            }
        }
    }

    private StructuralAnalysis() {}

    /** Why structure cannot analyse {@code sc}, or null when it can. */
    public static String refusal(Scenario sc) {
        if (sc.promise().kind() != Promise.Kind.NONE && sc.variableCount() > 63) {
            return "a promise over more than 63 variables cannot be tested";
        }
        return null;
    }

    /** Is every condition a positive literal or 1, with no variable on two edges? */
    public static boolean isHostForm(Scenario sc) {
        boolean[] used = new boolean[sc.variableCount()];
        for (Edge e : sc.edges()) {
            if (e.when().isAlways()) {
                continue;
            }
            if (!e.when().positive() || used[e.when().variable()]) {
                return false;
            }
            used[e.when().variable()] = true;
        }
        return true;
    }

    /** Runs with the default budgets. */
    public static Result run(Scenario sc) {
        return run(sc, DEFAULT_SECONDS);
    }

    /** Runs with the default state and node budgets and {@code seconds} for each branch-and-bound side. */
    public static Result run(Scenario sc, double seconds) {
        return run(sc, DEFAULT_STATES, DEFAULT_NODES, DEFAULT_DIAGRAM_NODES, seconds);
    }

    /**
     * Runs with the default state and node budgets within the time budget {@code deadline} for the
     * whole analysis (W₊, then W₋, then the reduction check: each pass may use a share of the time
     * left, and time a pass leaves unused goes to the next); see {@link Result#cut}.
     */
    public static Result run(Scenario sc, Deadline deadline) {
        return run(sc, DEFAULT_STATES, DEFAULT_NODES, DEFAULT_DIAGRAM_NODES, DEFAULT_SECONDS, true, deadline);
    }

    /**
     * Runs with the given budgets, {@code seconds} for each branch-and-bound side at most, within the
     * time budget {@code deadline} for the whole analysis (see {@link #run(Scenario, Deadline)}).
     */
    public static Result run(Scenario sc, long maxStates, long maxNodes, long maxDiagramNodes, double seconds,
            Deadline deadline) {
        return run(sc, maxStates, maxNodes, maxDiagramNodes, seconds, true, deadline);
    }

    /** Runs with the given budgets and {@link #DEFAULT_SECONDS}. */
    public static Result run(Scenario sc, long maxStates, long maxNodes, long maxDiagramNodes) {
        return run(sc, maxStates, maxNodes, maxDiagramNodes, DEFAULT_SECONDS);
    }

    /**
     * Runs the structural analysis.
     *
     * @throws ScenarioException {@code method} when the scenario has a promise (see {@link #refusal})
     */
    public static Result run(Scenario sc, long maxStates, long maxNodes, long maxDiagramNodes, double seconds) {
        return run(sc, maxStates, maxNodes, maxDiagramNodes, seconds, true, Deadline.none());
    }

    /**
     * W₊ and W₋ with their worst inputs and witnesses, without the reduction check (its status is
     * "not checked"): for callers that ask again and again under new weights, such as the weight
     * optimiser's working set. Same cost as {@link #run} less the decision diagrams.
     *
     * @throws ScenarioException {@code method} when the scenario has a promise (see {@link #refusal})
     */
    public static Result worstCases(Scenario sc, long maxStates, long maxNodes) {
        return worstCases(sc, maxStates, maxNodes, Deadline.none());
    }

    /** As {@link #worstCases(Scenario, long, long)} with {@code seconds} for each branch-and-bound side. */
    public static Result worstCases(Scenario sc, long maxStates, long maxNodes, double seconds) {
        return run(sc, maxStates, maxNodes, 0, seconds, false, Deadline.none());
    }

    /**
     * {@link #worstCases(Scenario, long, long)} within the time budget {@code deadline} (W₊ may use
     * half the time left, W₋ the rest); a side the budget cuts is a certified interval (see
     * {@link Result#cut}).
     */
    public static Result worstCases(Scenario sc, long maxStates, long maxNodes, Deadline deadline) {
        return run(sc, maxStates, maxNodes, 0, DEFAULT_SECONDS, false, deadline);
    }

    private static Result run(Scenario sc, long maxStates, long maxNodes, long maxDiagramNodes, double seconds,
            boolean check, Deadline deadline) {
        String refusal = refusal(sc);
        if (refusal != null) {
            throw new ScenarioException("method", "$.promise", refusal);
        }
        List<Edge> edges = sc.edges();
        boolean promised = sc.promise().kind() != Promise.Kind.NONE;
        // paths and bonds range over the whole cube; under a promise branch and bound tests each leaf
        boolean host = isHostForm(sc) && !promised;
        boolean anyAlways = false;
        for (Edge e : edges) {
            anyAlways |= e.when().isAlways() && !e.isSelfLoop();
        }
        String kind;
        if (host) {
            kind = "one positive literal per edge" + (anyAlways ? " (with always-present edges)" : "");
        } else {
            kind = promised ? "a promise: every leaf tested against it" : "shared variables or negated literals";
        }
        List<String> cut = new ArrayList<>();
        // W+ may use a share of the time left, W- a share of what then remains, the check (when it
        // builds diagrams) the rest
        boolean diagrams = check && sc.function() != null && !(sc.connectivity() != null && sc.connectivity().ownGraph());
        Deadline first = deadline.share(diagrams ? 1.0 / 3 : 1.0 / 2);
        Side positive = host && !anyAlways ? pathSide(sc, maxStates, maxNodes, seconds, first, cut)
                : branchAndBound(sc, true, maxNodes, seconds, host ? "always-present edges make minimal positive"
                        + " inputs more than paths: " : "", first, cut);
        Deadline second = deadline.share(diagrams ? 1.0 / 2 : 1.0);
        Side negative = host ? bondSide(sc, maxStates, maxNodes, seconds, second, cut)
                : branchAndBound(sc, false, maxNodes, seconds, "", second, cut);
        Reduction reduction = check ? reduction(sc, maxDiagramNodes, deadline)
                : new Reduction("not checked", null, List.of(), "not asked for");
        if (reduction.timeCut()) {
            cut.add("the reduction check (decision diagrams)");
        }
        String method = "structure (" + kind + "): " + sc.variableCount() + " variables, 2^" + sc.variableCount()
                + " inputs not enumerated";
        String cutText = cut.isEmpty() ? null : "the time budget ran out in " + String.join("; ", cut)
                + (positive.exact() && negative.exact() ? "" : ": W+ and W- are certified intervals [lower, upper]")
                + "; give more time (analyze --seconds) for the rest";
        return new Result(sc, method, positive, negative, reduction, cutText);
    }

    /** The graph without self-loops, as a {@link HostGraph}; {@code index} maps its edges back. */
    private static HostGraph hostGraph(Scenario sc, int[] classOf, int classes, List<Integer> index) {
        List<Edge> edges = sc.edges();
        List<int[]> uv = new ArrayList<>();
        List<Double> w = new ArrayList<>();
        for (int i = 0; i < edges.size(); i++) {
            Edge e = edges.get(i);
            if (e.when().isAlways()) {
                continue;
            }
            int a = classOf[e.u()];
            int b = classOf[e.v()];
            if (a == b) {
                continue; // a self-loop (or an edge inside an always-present component): never on a path or in a bond
            }
            uv.add(new int[] {a, b});
            w.add(e.weight());
            index.add(i);
        }
        int[] u = new int[uv.size()];
        int[] v = new int[uv.size()];
        double[] weight = new double[uv.size()];
        for (int i = 0; i < u.length; i++) {
            u[i] = uv.get(i)[0];
            v[i] = uv.get(i)[1];
            weight[i] = w.get(i);
        }
        return new HostGraph(classes, u, v, weight, classOf[sc.s()], classOf[sc.t()]);
    }

    private static Side pathSide(Scenario sc, long maxStates, long maxNodes, double seconds, Deadline deadline,
            List<String> cut) {
        int n = sc.vertexCount();
        int[] identity = new int[n];
        for (int i = 0; i < n; i++) {
            identity[i] = i;
        }
        List<Integer> index = new ArrayList<>();
        HostGraph g = hostGraph(sc, identity, n, index);
        // any simple path has at most |V| − 1 edges: the heaviest |V| − 1 weights bound W₊
        double[] w = new double[g.edgeCount()];
        for (int k = 0; k < w.length; k++) {
            w[k] = g.weight(k);
        }
        java.util.Arrays.sort(w);
        double cap = 0;
        for (int k = w.length - 1; k >= 0 && k >= w.length - (g.vertexCount() - 1); k--) {
            cap += w[k];
        }
        Extreme path;
        try {
            path = PathsAndBonds.heaviestPath(g, maxStates, PathsAndBonds.Method.AUTO, deadline);
        } catch (TooWideException e) {
            return capped(branchAndBound(sc, true, maxNodes, seconds, e.getMessage() + "; fell back to ", deadline,
                    cut), cap, "the |V| - 1 heaviest edges");
        } catch (Deadline.Expired e) {
            cut.add("W+ (" + e.getMessage() + ")");
            // a lower end: one simple s–t path (fewest edges, by breadth-first search) is a positive input
            boolean[] some = shortestPath(g);
            InputDetail worst = some == null ? null : detail(sc, assignment(sc, some, index, true));
            return new Side(worst == null ? Double.NaN : worst.witness.value, Math.max(cap, worst == null ? 0 : worst.witness.value), false,
                    worst, null, "time budget reached in the " + e.getMessage() + ": certified interval, lower end from"
                    + " one simple s-t path (fewest edges), upper end from the |V| - 1 heaviest edges");
        }
        if (Double.isNaN(path.value())) {
            return new Side(Double.NaN, Double.NaN, true, null, BigInteger.ZERO, "heaviest simple s-t path: "
                    + path.method() + "; s and t are never connected");
        }
        InputDetail worst = detail(sc, assignment(sc, path.edges(), index, true));
        return new Side(worst.witness.value, worst.witness.value, true, worst, path.count(),
                "heaviest simple s-t path (" + path.method() + ")");
    }

    /** The edges of an s–t path with fewest edges in {@code g} (breadth-first search), or null when s and t are apart. */
    private static boolean[] shortestPath(HostGraph g) {
        int n = g.vertexCount();
        List<List<Integer>> adj = new ArrayList<>();
        for (int x = 0; x < n; x++) {
            adj.add(new ArrayList<>());
        }
        for (int e = 0; e < g.edgeCount(); e++) {
            adj.get(g.u(e)).add(e);
            adj.get(g.v(e)).add(e);
        }
        int[] via = new int[n];
        java.util.Arrays.fill(via, -2);
        via[g.s()] = -1;
        int[] queue = new int[n];
        int head = 0;
        int tail = 0;
        queue[tail++] = g.s();
        while (head < tail && via[g.t()] == -2) {
            int a = queue[head++];
            for (int e : adj.get(a)) {
                int b = g.u(e) == a ? g.v(e) : g.u(e);
                if (via[b] == -2) {
                    via[b] = e;
                    queue[tail++] = b;
                }
            }
        }
        if (via[g.t()] == -2) {
            return null;
        }
        boolean[] chosen = new boolean[g.edgeCount()];
        for (int x = g.t(); x != g.s();) {
            int e = via[x];
            chosen[e] = true;
            x = g.u(e) == x ? g.v(e) : g.u(e);
        }
        return chosen;
    }

    private static Side bondSide(Scenario sc, long maxStates, long maxNodes, double seconds, Deadline deadline,
            List<String> cut) {
        int n = sc.vertexCount();
        // contract always-present edges: they cannot be cut
        int[] parent = new int[n];
        for (int i = 0; i < n; i++) {
            parent[i] = i;
        }
        for (Edge e : sc.edges()) {
            if (e.when().isAlways()) {
                int a = find(parent, e.u());
                int b = find(parent, e.v());
                parent[a] = b;
            }
        }
        int[] classOf = new int[n];
        int[] label = new int[n];
        java.util.Arrays.fill(label, -1);
        int classes = 0;
        for (int i = 0; i < n; i++) {
            int r = find(parent, i);
            if (label[r] < 0) {
                label[r] = classes++;
            }
            classOf[i] = label[r];
        }
        if (classOf[sc.s()] == classOf[sc.t()]) {
            return new Side(Double.NaN, Double.NaN, true, null, BigInteger.ZERO,
                    "always-present edges join s and t: no negative input");
        }
        List<Integer> index = new ArrayList<>();
        HostGraph g = hostGraph(sc, classOf, classes, index);
        // a bond is a set of switchable edges: all of them together bound W₋
        double cap = 0;
        for (int k = 0; k < g.edgeCount(); k++) {
            cap += 1 / g.weight(k);
        }
        Extreme bond;
        try {
            bond = PathsAndBonds.heaviestBond(g, maxStates, PathsAndBonds.Method.AUTO, deadline);
        } catch (TooWideException e) {
            return capped(branchAndBound(sc, false, maxNodes, seconds, e.getMessage() + "; fell back to ", deadline,
                    cut), cap, "the sum of 1/w over all switchable edges");
        } catch (Deadline.Expired e) {
            cut.add("W- (" + e.getMessage() + ")");
            // a lower end: every switchable edge absent is a negative input (the always-present
            // edges do not join s and t, checked above)
            InputDetail worst = detail(sc, new boolean[sc.variableCount()]);
            return new Side(worst.witness.value, Math.max(cap, worst.witness.value), false, worst, null,
                    "time budget reached in the " + e.getMessage() + ": certified interval, lower end from the input"
                    + " with every switchable edge absent, upper end from the sum of 1/w over all switchable edges");
        }
        InputDetail worst = detail(sc, assignment(sc, bond.edges(), index, false));
        return new Side(worst.witness.value, worst.witness.value, true, worst, bond.count(),
                "heaviest s-t bond (" + bond.method() + ")");
    }

    /**
     * The input whose variables of the maximiser's edges ({@code chosen}, indices into the host
     * graph, mapped back by {@code index}) are {@code value} and all others {@code !value}: the
     * path's edges present (value true) or the bond's edges absent (value false).
     */
    private static boolean[] assignment(Scenario sc, boolean[] chosen, List<Integer> index, boolean value) {
        boolean[] x = new boolean[sc.variableCount()];
        java.util.Arrays.fill(x, !value);
        for (int k = 0; k < chosen.length; k++) {
            if (chosen[k]) {
                x[sc.edges().get(index.get(k)).when().variable()] = value;
            }
        }
        return x;
    }

    /** The side with its upper end lowered to {@code cap}, a bound valid for every input (derived in the caller). */
    private static Side capped(Side side, double cap, String what) {
        if (side.exact() || !(cap < side.upper())) {
            return side;
        }
        double upper = Double.isNaN(side.value()) ? cap : Math.max(cap, side.value());
        return new Side(side.value(), upper, side.exact(), side.worst(), side.extremeInputs(),
                side.method() + "; upper end from " + what);
    }

    private static int find(int[] p, int x) {
        while (p[x] != x) {
            p[x] = p[p[x]];
            x = p[x];
        }
        return x;
    }

    private static Side branchAndBound(Scenario sc, boolean positiveSide, long maxNodes, double seconds, String why,
            Deadline deadline, List<String> cut) {
        EdgeArrays a = EdgeArrays.of(sc);
        BranchAndBound bb = new BranchAndBound(sc.vertexCount(), sc.s(), sc.t(), a.u(), a.v(), a.weight(),
                sc.variableCount(), a.variable(), a.positive(), branchingOrder(sc), maxNodes, promiseTest(sc));
        bb.setDeadline(System.nanoTime() + (long) Math.min(seconds * 1e9, 9e18));
        bb.setDeadline(deadline);
        BranchAndBound.Outcome o = positiveSide ? bb.maxResistance() : bb.maxCapacitance();
        InputDetail worst = o.bestAssignment() == null ? null : detail(sc, o.bestAssignment());
        double value = worst == null ? Double.NaN : worst.witness.value;
        boolean timeCut = !o.exact() && bb.stoppedByDeadline();
        if (timeCut) {
            cut.add((positiveSide ? "W+" : "W-") + " (branch and bound, after " + o.nodes() + " nodes)");
        }
        String how = why + "branch and bound with Rayleigh bounds, " + o.nodes() + " nodes"
                + (o.exact() ? ", exact" : timeCut ? ", time budget reached: certified interval"
                        : ", node or time budget reached: certified interval");
        Side side = new Side(value, o.exact() ? value : o.upper(), o.exact(), worst, null, how);
        // derived caps, valid for every input: a positive input holds an s–t path of present edges,
        // and the unit flow along it has energy Σ_path w ≤ Σ_all w (Thomson's principle); on a
        // negative input the potential 1 on s's component and 0 elsewhere is admissible, with
        // energy Σ over absent crossing edges of 1/w ≤ Σ over switchable edges of 1/w
        double all = 0;
        for (Edge e : sc.edges()) {
            if (!e.isSelfLoop() && (positiveSide || !e.when().isAlways())) {
                all += positiveSide ? e.weight() : 1 / e.weight();
            }
        }
        return capped(side, all, positiveSide ? "the sum of all weights" : "the sum of 1/w over all switchable edges");
    }

    /** The promise as a test of full assignments (at most 63 variables), or null for the whole cube. */
    private static java.util.function.Predicate<boolean[]> promiseTest(Scenario sc) {
        Promise p = sc.promise();
        if (p.kind() == Promise.Kind.NONE) {
            return null;
        }
        return x -> {
            long mask = 0;
            for (boolean b : x) {
                mask = (mask << 1) | (b ? 1 : 0);
            }
            return p.allows(mask);
        };
    }

    /** Variables in the order of their first edge in a breadth-first walk from s. */
    static int[] branchingOrder(Scenario sc) {
        int n = sc.vertexCount();
        List<List<Integer>> adj = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            adj.add(new ArrayList<>());
        }
        List<Edge> edges = sc.edges();
        for (int i = 0; i < edges.size(); i++) {
            adj.get(edges.get(i).u()).add(i);
            adj.get(edges.get(i).v()).add(i);
        }
        int vars = sc.variableCount();
        int[] order = new int[vars];
        boolean[] placed = new boolean[vars];
        int k = 0;
        boolean[] seen = new boolean[n];
        int[] queue = new int[n];
        int head = 0;
        int tail = 0;
        queue[tail++] = sc.s();
        seen[sc.s()] = true;
        while (head < tail) {
            int a = queue[head++];
            for (int ei : adj.get(a)) {
                Edge e = edges.get(ei);
                int x = e.when().variable();
                if (x >= 0 && !placed[x]) {
                    placed[x] = true;
                    order[k++] = x;
                }
                int b = e.u() == a ? e.v() : e.u();
                if (!seen[b]) {
                    seen[b] = true;
                    queue[tail++] = b;
                }
            }
        }
        for (int x = 0; x < vars; x++) {
            if (!placed[x]) {
                order[k++] = x;
            }
        }
        return order;
    }

    /** The reduction verdict alone (see the class comment). */
    public static Reduction reduction(Scenario sc, long maxDiagramNodes) {
        return reduction(sc, maxDiagramNodes, Deadline.none());
    }

    /**
     * The reduction verdict within a time budget: "not checked", saying that the budget ran out
     * ({@link Reduction#timeCut}), when it does.
     */
    public static Reduction reduction(Scenario sc, long maxDiagramNodes, Deadline deadline) {
        if (sc.function() == null) {
            return new Reduction("not checked", null, List.of(), "no function given");
        }
        if (sc.connectivity() != null && sc.connectivity().ownGraph()) {
            return new Reduction("by construction", BigInteger.ZERO, List.of(),
                    "the function is s-t connectivity of this graph");
        }
        DiagramCheck.Result r = DiagramCheck.check(sc, maxDiagramNodes, deadline);
        if (r.status() != DiagramCheck.Status.CHECKED) {
            return new Reduction("not checked", null, List.of(), r.message());
        }
        List<String> first = new ArrayList<>();
        for (boolean[] x : r.firstCounterexamples()) {
            first.add(inputString(x));
        }
        return new Reduction(r.holds() ? "holds" : "fails", r.counterexamples(), first,
                r.method() + "; " + r.graphNodes() + " + " + r.functionNodes() + " diagram nodes");
    }

    /** The input string of an assignment (variable 0 first). */
    public static String inputString(boolean[] x) {
        char[] c = new char[x.length];
        for (int i = 0; i < x.length; i++) {
            c[i] = x[i] ? '1' : '0';
        }
        return new String(c);
    }

    /** One input's full witness, for any number of variables (see {@link Analysis#detail}). */
    public static InputDetail detail(Scenario sc, boolean[] x) {
        boolean[] present = new boolean[sc.edges().size()];
        for (int i = 0; i < present.length; i++) {
            Edge e = sc.edges().get(i);
            present[i] = e.when().isAlways() || x[e.when().variable()] == e.when().positive();
        }
        Witness w = new ElectricalNetwork(sc).witness(present);
        long mask = -1;
        if (x.length <= 63) {
            mask = 0;
            for (boolean b : x) {
                mask = (mask << 1) | (b ? 1 : 0);
            }
        }
        Expr f = sc.function();
        Boolean fx = null;
        if (f instanceof Expr.Connectivity) {
            fx = ((Expr.Connectivity) f).eval(x);
        } else if (f != null && mask >= 0) {
            fx = f.eval(mask);
        }
        return new InputDetail(mask, inputString(x), present, fx, w);
    }
}
