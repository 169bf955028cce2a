package spanwright.optimize;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import spanwright.analysis.InputDetail;
import spanwright.analysis.StructuralAnalysis;
import spanwright.electric.ElectricalNetwork;
import spanwright.electric.Witness;
import spanwright.model.Deadline;
import spanwright.model.Scenario;
import spanwright.model.SeededRandom;

/**
 * The weight optimiser beyond enumeration: majorise–minimise on a growing <b>working set</b> of
 * worst inputs, with the structural engine ({@link StructuralAnalysis#worstCases}) as the oracle
 * that finds the input the set is missing. A cutting-plane scheme:
 *
 * <ol>
 *   <li>Start with the engine's worst positive and worst negative input at the starting weights.</li>
 *   <li>Minimise F_S(w) = max_{x∈P} R_w(x) · max_{y∈N} C_w(y) over the set S = P ∪ N by the same
 *       majorise–minimise steps as the whole-domain optimiser ({@link SurrogateSolver} on the
 *       Thomson / Dirichlet rows of the set's inputs, each step accepted only if F_S decreases).</li>
 *   <li>Ask the engine for the exact W₊(w), W₋(w) and their worst inputs; add a worst input whose
 *       value beats the set's maximum on its side by more than the tolerance.</li>
 *   <li>Repeat until the engine finds nothing worse: then F(w) = F_S(w) up to the tolerance.</li>
 * </ol>
 *
 * <p><b>Host-graph instances</b> (one positive literal per edge): the engine's worst positive input
 * is a simple s–t path, whose unit flow is 1 on its edges, so its row is the path's indicator and
 * R_w = Σ_{e∈path} w_e exactly for every w; the worst negative input is "all edges but a bond",
 * whose optimal potential is 0/1, so C_w = Σ_{e∈bond} 1/w_e exactly. Then log F_S is a maximum of
 * log-sum-exp functions of the log-weights, hence convex, and one surrogate solve per round is its
 * minimiser; log F itself is convex (a maximum over all paths and bonds), so this optimiser and the
 * whole-domain one aim at the same global optimum within the solver's box, and F_S ≤ F everywhere
 * makes the converged point a global optimum up to the tolerance and the solver's accuracy.
 * <b>General instances</b> (shared variables, negated literals): the rows are majorisers re-taken
 * at every step, and the problem is not convex; several starts help, as in
 * {@link WeightOptimizer}.
 *
 * <p>The trace records √F with the engine's exact values after each round, as the best so far (so
 * it never increases; F_S-optimal points of successive rounds need not improve F monotonically).
 * Cost per round: one engine call (frontier search, subset DP or branch and bound; see
 * {@link StructuralAnalysis}) plus, per inner step, O(|S|) electrical solves of O(|V|³) and one
 * surrogate solve of O(|S|·G²) per Newton step for G weight groups. Cutting planes follow Kelley,
 * "The cutting-plane method for solving convex programs", J. SIAM 8 (1960); the objective is that
 * of Belovs &amp; Reichardt, ESA 2012, arXiv:1203.2603, and Jarret, Jeffery, Kimmel &amp; Piedrafita,
 * ESA 2018, arXiv:1804.10591.
 *
 * <p><b>Mutable, single-threaded</b>; owns one {@link ElectricalNetwork} and its work arrays.
 */
final class WorkingSetSearch {
    /** Most majorise–minimise steps on one working set per round. */
    static final int INNER_STEPS = 30;

    /** One input of the working set: its present kept edges and side. */
    private static final class Member {
        final boolean[] present;
        final boolean positive;
        /** Is its row exact for every weighting (a path's flow, a bond's 0/1 potential)? */
        boolean linear;

        Member(boolean[] present, boolean positive) {
            this.present = present;
            this.positive = positive;
        }
    }

    /**
     * The engine's answer at one weighting: W₊ and W₋ (lower ends when not exact), their upper
     * ends, the worst inputs with witnesses, and what the time budget cut (null: nothing).
     */
    record Engine(double maxR, double maxC, double upperR, double upperC, InputDetail worstPositive,
            InputDetail worstNegative, boolean exact, String how, String cut) {
        double product() {
            return maxR * maxC;
        }
    }

    private final Scenario scenario;
    private final OptimizerOptions options;
    private final Deadline deadline;
    private final int[] keptEdge;
    private final int[] eu;
    private final int[] ev;
    final WeightGroups groups;
    private final ElectricalNetwork network;
    private final SurrogateSolver solver;
    private final SeededRandom rnd;
    private final List<Member> set = new ArrayList<>();
    private final Set<String> keys = new HashSet<>();
    final double initial;
    final Engine initialEngine;
    long solves;
    int engineCalls;

    // progress
    private boolean finished;
    private boolean cancelled;
    private OptimizationResult.Status finalStatus;
    private int start = -1;
    private boolean inStart;
    private int round;
    private int totalRounds;
    private double[] u;
    private List<Double> trace;
    private double startBest;
    // best over all starts
    private double bestF = Double.POSITIVE_INFINITY;
    private double[] bestU;
    private List<Double> bestTrace;
    private int bestStart;
    private OptimizationResult.Status bestStatus = OptimizationResult.Status.CONVERGED;
    private Engine bestEngine;
    /** What the budget cut before the search could start, or null. */
    private String earlyCut;

    WorkingSetSearch(Scenario scenario, OptimizerOptions options) {
        this(scenario, options, Deadline.after(options.maxMillis));
    }

    /**
     * With a caller's deadline (tests inject one that expires after a number of checks). The
     * budget covers the whole call: every engine call (frontier search, subset DP, branch and
     * bound each check it), every evaluation of the working set, the final check and the
     * reduction's verdict. The search keeps in reserve the first engine call's time (at most half
     * the budget) for the final check of the balanced weights.
     */
    WorkingSetSearch(Scenario scenario, OptimizerOptions options, Deadline deadline) {
        this.scenario = scenario;
        this.options = options;
        this.deadline = deadline;
        List<Integer> kept = new ArrayList<>();
        for (int i = 0; i < scenario.edges().size(); i++) {
            if (!scenario.edges().get(i).isSelfLoop()) {
                kept.add(i);
            }
        }
        keptEdge = new int[kept.size()];
        eu = new int[kept.size()];
        ev = new int[kept.size()];
        double[] w = new double[kept.size()];
        for (int k = 0; k < keptEdge.length; k++) {
            keptEdge[k] = kept.get(k);
            eu[k] = scenario.edges().get(keptEdge[k]).u();
            ev[k] = scenario.edges().get(keptEdge[k]).v();
            w[k] = scenario.edges().get(keptEdge[k]).weight();
        }
        groups = new WeightGroups(scenario, keptEdge, options.tie);
        network = new ElectricalNetwork(scenario.vertexCount(), scenario.s(), scenario.t(), eu, ev, w);
        solver = new SurrogateSolver(groups.count, groups.free, groups.u0);
        rnd = new SeededRandom(options.seed);
        long t0 = deadline.now();
        initialEngine = engine(groups.expand(groups.u0));
        deadline.reserve(Math.min(options.maxMillis / 2, Math.max(0, deadline.now() - t0)));
        initial = Math.sqrt(initialEngine.product());
        bestU = groups.u0;
        bestEngine = initialEngine;
        if (initialEngine.cut != null) {
            finished = true;
            finalStatus = OptimizationResult.Status.BUDGET_REACHED;
            bestTrace = List.of(initial);
            earlyCut = "the time budget ran out in the structural engine's first call, before any weights were tried"
                    + " (" + initialEngine.cut + "): the weights are unchanged and W+ and W- are certified intervals;"
                    + " give more time (--seconds), or analyze the scenario";
        } else if (Double.isNaN(initial) || groups.freeCount == 0 || initial == 0) {
            finished = true;
            finalStatus = OptimizationResult.Status.NOTHING_TO_DO;
            bestTrace = List.of(initial);
        }
    }

    // ------------------------------------------------------------------ the engine

    /** The scenario with kept-edge weights {@code w} (self-loops keep theirs). */
    private Scenario weighted(double[] w) {
        double[] all = new double[scenario.edges().size()];
        for (int i = 0; i < all.length; i++) {
            all[i] = scenario.edges().get(i).weight();
        }
        for (int k = 0; k < keptEdge.length; k++) {
            all[keptEdge[k]] = w[k];
        }
        return scenario.withWeights(all);
    }

    private Engine engine(double[] w) {
        engineCalls++;
        StructuralAnalysis.Result r = StructuralAnalysis.worstCases(weighted(w), StructuralAnalysis.DEFAULT_STATES,
                StructuralAnalysis.DEFAULT_NODES, deadline);
        return new Engine(r.positive().value(), r.negative().value(), r.positive().upper(), r.negative().upper(),
                r.positive().worst(), r.negative().worst(), r.exact(), "W+: " + r.positive().method() + "; W-: "
                        + r.negative().method(), r.cut());
    }

    /** Adds the input of {@code d} to the set unless it is there; true when added. */
    private boolean add(InputDetail d, boolean positive) {
        if (d == null) {
            return false;
        }
        boolean[] present = new boolean[keptEdge.length];
        StringBuilder key = new StringBuilder(positive ? "+" : "-");
        for (int k = 0; k < keptEdge.length; k++) {
            present[k] = d.present[keptEdge[k]];
            key.append(present[k] ? '1' : '0');
        }
        if (!keys.add(key.toString())) {
            return false;
        }
        set.add(new Member(present, positive));
        return true;
    }

    // ------------------------------------------------------------------ the set's objective

    private double setMaxR;
    private double setMaxC;

    /** F_S at kept weights w: max R over P times max C over N (sets setMaxR, setMaxC). */
    private double setObjective(double[] w) {
        network.setWeights(w);
        setMaxR = 0;
        setMaxC = 0;
        for (Member m : set) {
            double v = network.witnessSize(m.present);
            if (m.positive) {
                setMaxR = Math.max(setMaxR, v);
            } else {
                setMaxC = Math.max(setMaxC, v);
            }
        }
        solves += set.size();
        return setMaxR * setMaxC;
    }

    /**
     * Rows of the surrogate at kept weights w (squared currents or squared potential drops per
     * group), and whether every row is exact for all weightings.
     */
    private boolean rows(double[] w, List<double[]> a, List<double[]> b) {
        network.setWeights(w);
        boolean allLinear = true;
        for (Member m : set) {
            Witness wt = network.witness(m.present);
            solves++;
            double[] row = new double[groups.count];
            double sum = 0;
            boolean linear = true;
            for (int k = 0; k < keptEdge.length; k++) {
                double c;
                if (m.positive) {
                    c = m.present[k] ? wt.current[k] * wt.current[k] : 0.0;
                    linear &= c == 0 || Math.abs(c - 1) < 1e-12;
                } else {
                    double d = m.present[k] ? 0.0 : wt.potential[eu[k]] - wt.potential[ev[k]];
                    c = d * d;
                    linear &= c == 0 || Math.abs(c - 1) < 1e-12;
                }
                row[groups.group[k]] += c;
                sum += c;
            }
            m.linear = linear;
            allLinear &= linear;
            if (sum > 0) {
                (m.positive ? a : b).add(row);
            }
        }
        return allLinear;
    }

    // ------------------------------------------------------------------ steps

    boolean done() {
        return finished;
    }

    void cancel() {
        cancelled = true;
    }

    int currentStart() {
        return Math.max(0, start);
    }

    int currentRound() {
        return round;
    }

    double currentComplexity() {
        return inStart ? Math.sqrt(startBest) : Math.sqrt(bestF);
    }

    List<Double> currentTrace() {
        return trace == null ? List.of(initial) : new ArrayList<>(trace);
    }

    int workingSetSize(boolean positive) {
        int c = 0;
        for (Member m : set) {
            c += m.positive == positive ? 1 : 0;
        }
        return c;
    }

    /**
     * One round (or the set-up of the next start); see the class comment.
     *
     * @return true when the search has ended
     */
    boolean step() {
        if (finished) {
            return true;
        }
        if (cancelled) {
            if (inStart) {
                endStart(OptimizationResult.Status.CANCELLED);
            }
            finish(OptimizationResult.Status.CANCELLED);
            return true;
        }
        if (!inStart) {
            if (start > 0 && deadline.passed() || start + 1 >= options.starts) {
                finish(start + 1 >= options.starts ? bestStatus : OptimizationResult.Status.BUDGET_REACHED);
                return true;
            }
            if (!beginStart()) {
                finish(OptimizationResult.Status.BUDGET_REACHED); // the engine call of a new start was cut
                return true;
            }
            return false;
        }
        if (round >= options.maxIterations || deadline.passed()) {
            endStart(OptimizationResult.Status.BUDGET_REACHED);
            return false;
        }
        // minimise F_S by majorise–minimise from u
        double f = setObjective(groups.expand(u));
        for (int inner = 0; inner < INNER_STEPS; inner++) {
            if (inner > 0 && deadline.passed()) {
                break; // one evaluation of the set per check
            }
            List<double[]> a = new ArrayList<>();
            List<double[]> b = new ArrayList<>();
            boolean linear = rows(groups.expand(u), a, b);
            if (a.isEmpty() || b.isEmpty()) {
                break;
            }
            double[] target = solver.minimise(a.toArray(new double[0][]), b.toArray(new double[0][]), u, deadline);
            double t = 1.0;
            double[] next = null;
            double fn = f;
            for (int ls = 0; ls < 30; ls++) {
                if (ls > 0 && deadline.passed()) {
                    break;
                }
                double[] trial = new double[groups.count];
                for (int q = 0; q < groups.count; q++) {
                    trial[q] = u[q] + t * (target[q] - u[q]);
                }
                double ft = setObjective(groups.expand(trial));
                if (ft < f * (1 - 1e-15)) {
                    next = trial;
                    fn = ft;
                    break;
                }
                t *= 0.5;
            }
            if (next == null) {
                break;
            }
            double rel = (Math.sqrt(f) - Math.sqrt(fn)) / Math.sqrt(f);
            u = next;
            f = fn;
            if (linear || rel < options.tolerance) {
                break; // exact rows: the surrogate's minimiser is F_S's
            }
        }
        setObjective(groups.expand(u));
        double maxR = setMaxR;
        double maxC = setMaxC;
        Engine e = engine(groups.expand(u));
        round++;
        totalRounds++;
        if (e.cut != null) {
            // the engine's values at u are not exact: u is not compared, the start ends at its best
            endStart(OptimizationResult.Status.BUDGET_REACHED);
            return false;
        }
        double fe = e.product();
        if (fe < startBest) {
            startBest = fe;
            startU = u;
            startEngine = e;
        }
        trace.add(Math.sqrt(startBest));
        boolean added = false;
        if (e.maxR > maxR * (1 + options.tolerance)) {
            added |= add(e.worstPositive, true);
        }
        if (e.maxC > maxC * (1 + options.tolerance)) {
            added |= add(e.worstNegative, false);
        }
        if (!added) {
            endStart(e.exact ? OptimizationResult.Status.CONVERGED : OptimizationResult.Status.BUDGET_REACHED);
        }
        return false;
    }

    private double[] startU;
    private Engine startEngine;

    /** Begins the next start; false when the time budget cut its engine call (the start is dropped). */
    private boolean beginStart() {
        start++;
        round = 0;
        double[] v = groups.u0.clone();
        if (start > 0) {
            for (int q = 0; q < groups.count; q++) {
                if (groups.free[q]) {
                    v[q] += 0.7 * rnd.nextGaussian();
                }
            }
        }
        u = solver.clamp(v);
        Engine e = start == 0 && java.util.Arrays.equals(u, groups.u0) ? initialEngine : engine(groups.expand(u));
        if (e.cut != null) {
            return false;
        }
        add(e.worstPositive, true);
        add(e.worstNegative, false);
        startBest = e.product();
        startU = u;
        startEngine = e;
        trace = new ArrayList<>();
        trace.add(Math.sqrt(startBest));
        inStart = true;
        return true;
    }

    private void endStart(OptimizationResult.Status s) {
        inStart = false;
        if (startBest < bestF) {
            bestF = startBest;
            bestU = startU;
            bestEngine = startEngine;
            bestTrace = trace;
            bestStatus = s;
            bestStart = start;
        }
    }

    private void finish(OptimizationResult.Status s) {
        finished = true;
        finalStatus = s;
    }

    /**
     * The result; requires {@link #done()}: the best weights, balanced, with the engine's
     * certificates. The engine checks the balanced weights again in the time left; when the budget
     * cuts that check, the values are those the engine found for the best weights in the search,
     * scaled exactly (every R scales with the weights, every C inversely), with the worst inputs'
     * witnesses recomputed, and the result says so.
     */
    OptimizationResult result() {
        if (!finished) {
            throw new IllegalStateException("optimisation not finished");
        }
        boolean nothing = finalStatus == OptimizationResult.Status.NOTHING_TO_DO || earlyCut != null;
        double[] w = groups.expand(nothing ? groups.u0 : bestU);
        Engine e = nothing ? initialEngine : bestEngine;
        boolean balanced = false;
        double lambda = 1;
        if (!groups.anyLocked && e.exact && e.maxR > 0 && e.maxC > 0) {
            lambda = Math.sqrt(e.maxC / e.maxR);
            for (int k = 0; k < w.length; k++) {
                w[k] *= lambda;
            }
            balanced = true;
        }
        Scenario out = weighted(w);
        deadline.reserve(0); // the final check may use what is left
        String cut = earlyCut;
        Engine fin = null;
        if (earlyCut == null && !deadline.passed()) {
            fin = engine(w);
            if (fin.cut != null) {
                cut = "the final check of the balanced weights by the structural engine was cut by the time budget ("
                        + fin.cut + "); W+ and W- are the engine's values for these weights found during the search,"
                        + " scaled exactly (R scales with the weights, C inversely); for a fresh check give more time"
                        + " (--seconds), or analyze the written scenario";
                fin = null;
            }
        } else if (earlyCut == null) {
            cut = "the final check of the balanced weights by the structural engine was skipped: the time budget was"
                    + " spent; W+ and W- are the engine's values for these weights found during the search, scaled"
                    + " exactly (R scales with the weights, C inversely); for a fresh check give more time (--seconds),"
                    + " or analyze the written scenario";
        }
        if (fin == null) {
            // derived: scaling every weight by λ scales every R by λ and every C by 1/λ
            fin = new Engine(e.maxR * lambda, e.maxC / lambda, e.upperR * lambda, e.upperC / lambda,
                    rewitness(out, e.worstPositive), rewitness(out, e.worstNegative), e.exact, e.how, null);
        }
        long xp = fin.worstPositive == null ? -1 : fin.worstPositive.mask;
        long xn = fin.worstNegative == null ? -1 : fin.worstNegative.mask;
        int n = scenario.variableCount();
        StructuralAnalysis.Reduction red = StructuralAnalysis.reduction(scenario, StructuralAnalysis.DEFAULT_DIAGRAM_NODES,
                deadline);
        Boolean correct = red.correct();
        String standing = Boolean.FALSE.equals(correct)
                ? spanwright.analysis.Analysis.notABound(String.valueOf(red.counterexamples())) : null;
        if (red.timeCut()) {
            cut = (cut == null ? "" : cut + "; ") + "the reduction check was cut by the time budget: whether the"
                    + " graph decides f is not known (analyze checks it)";
        }
        return new OptimizationResult(finalStatus, out, initial, Math.sqrt(fin.product()), fin.maxR, fin.maxC, xp, xn,
                fin.worstPositive, fin.worstNegative, nothing ? List.of(initial) : bestTrace, totalRounds, solves,
                nothing ? 1 : options.starts, bestStart, balanced, 0, 0, n <= 62 ? 1L << n : -1, "working-set",
                totalRounds, workingSetSize(true), workingSetSize(false), fin.how)
                .certified(fin.exact, fin.upperR, fin.upperC, cut, correct, standing);
    }

    /** The input of {@code d} with its witness under the weights of {@code sc} (null for null). */
    private static InputDetail rewitness(Scenario sc, InputDetail d) {
        if (d == null) {
            return null;
        }
        boolean[] x = new boolean[d.input.length()];
        for (int i = 0; i < x.length; i++) {
            x[i] = d.input.charAt(i) == '1';
        }
        return StructuralAnalysis.detail(sc, x);
    }
}
