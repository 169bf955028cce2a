package spanwright.optimize;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.analysis.AnalysisRun;
import spanwright.analysis.CandidateInputs;
import spanwright.analysis.InputDetail;
import spanwright.analysis.Summary;
import spanwright.electric.Witness;
import spanwright.model.Deadline;
import spanwright.model.Edge;
import spanwright.model.Scenario;
import spanwright.model.SeededRandom;

/**
 * Chooses edge weights that minimise √(W₊W₋) for a fixed graph, by majorise–minimise.
 *
 * <p>At the current weights w take, for each active worst input, its optimal object: for a
 * positive input x the electrical unit flow θ_x, for a negative input y the optimal potential p_y.
 * By Thomson's principle R_{w'}(x) ≤ Σ w'_e θ_{x,e}² for every w', and by Dirichlet's principle
 * C_{w'}(y) ≤ Σ_absent (p_u − p_v)²/w'_e, both with equality at w' = w. So
 * S(w') = max_x a_x·w' · max_y b_y·(1/w') majorises the true objective on the active inputs and
 * touches it at w. {@link SurrogateSolver} minimises log S (convex in log-weights); the step from w
 * towards the surrogate's minimiser is accepted only if the <b>true</b> objective, evaluated on all
 * inputs that can be worst ({@link WorstCaseEvaluator}), decreases — halving the step otherwise —
 * so the objective trace never increases. Near-worst inputs join the active set as they appear.
 * The problem is not convex in general: several starts (the given weights, then seeded random
 * log-normal perturbations) and the best is kept; the result says so.
 *
 * <p>Weights are tied by group ({@link Edge#group()}, or by literal with {@link OptimizerOptions.Tie#LITERAL});
 * locked edges ({@link Edge#locked()}) keep their weight and are never tied to others. When nothing
 * is locked the result is balanced (scaled so W₊ = W₋; √(W₊W₋) is scale-free).
 *
 * <p>The method follows the standard electrical facts (Thomson's principle; Doyle &amp; Snell,
 * "Random Walks and Electric Networks", 1984); the witness-size objective is that of Belovs &amp;
 * Reichardt, ESA 2012, arXiv:1203.2603, and Jarret, Jeffery, Kimmel &amp; Piedrafita, ESA 2018,
 * arXiv:1804.10591. Cost per outer step: one solve per candidate input per line-search trial, plus
 * the surrogate solve.
 *
 * <p>Beyond enumeration ({@link Analysis#choose} picks structure, or {@link OptimizerOptions.Mode#WORKING_SET})
 * the same entry points run {@link WorkingSetSearch}: the same steps on a growing working set of
 * worst inputs that the structural engine supplies; one outer step is then one working-set round.
 */
public final class WeightOptimizer {
    /** Most inputs added to each side's active set per outer step. */
    static final int ADD_PER_STEP = 32;
    /** Inputs within this fraction of the maximum count as near-worst. */
    static final double NEAR = 0.02;

    private WeightOptimizer() {}

    /** Optimises with default options. */
    public static OptimizationResult optimize(Scenario scenario) {
        return optimize(scenario, OptimizerOptions.defaults(), null);
    }

    /**
     * Optimises {@code scenario}'s weights.
     *
     * @param listener called after each outer step; may be null; return false to cancel
     */
    public static OptimizationResult optimize(Scenario scenario, OptimizerOptions options,
            OptimizationResult.Listener listener) {
        return optimize(scenario, null, options, listener);
    }

    /**
     * Optimises {@code scenario}'s weights on a caller's candidate inputs: the inputs that can be
     * worst, for example one per orbit of a symmetry ({@link CandidateInputs#orbits}). With orbit
     * candidates the weights must stay invariant under the symmetry: tie them by edge orbit with
     * the edges' {@code group} keys. The result's values and worst inputs are then taken over the
     * candidates (no pass over the whole domain, which may be far too large); with candidates by
     * Rayleigh dominance the worst negative input is the first among them (see {@link CandidateInputs}).
     *
     * @param candidates null for {@link CandidateInputs#undominated} of the whole domain
     * @param listener called after each outer step; may be null; return false to cancel
     */
    public static OptimizationResult optimize(Scenario scenario, CandidateInputs candidates, OptimizerOptions options,
            OptimizationResult.Listener listener) {
        return optimize(scenario, candidates, options, listener, Deadline.after(options.maxMillis));
    }

    /**
     * {@link #optimize(Scenario, CandidateInputs, OptimizerOptions, OptimizationResult.Listener)}
     * within the caller's {@code deadline} for the whole call (instead of the options' time
     * budget, which still sizes the reserve for the final pass).
     */
    public static OptimizationResult optimize(Scenario scenario, CandidateInputs candidates, OptimizerOptions options,
            OptimizationResult.Listener listener, Deadline deadline) {
        Run run = start(scenario, candidates, options, deadline);
        while (!run.step()) {
            if (run.accepted && listener != null
                    && !listener.progress(run.start, run.iteration, Math.sqrt(run.f))) {
                run.cancel();
            }
        }
        return run.result();
    }

    /** Starts a stepwise optimisation (for callers that show progress): see {@link Run}. */
    public static Run start(Scenario scenario, CandidateInputs candidates, OptimizerOptions options) {
        return start(scenario, candidates, options, Deadline.after(options.maxMillis));
    }

    /** {@link #start(Scenario, CandidateInputs, OptimizerOptions)} within the caller's deadline for the whole run. */
    public static Run start(Scenario scenario, CandidateInputs candidates, OptimizerOptions options, Deadline deadline) {
        if (candidates == null && usesWorkingSet(scenario, options)) {
            return new Run(new WorkingSetSearch(scenario, options, deadline));
        }
        return new Run(scenario, candidates, options, deadline);
    }

    /**
     * Whether {@link #start} (without caller candidates) runs the working-set optimiser: when asked
     * to, or in {@link OptimizerOptions.Mode#AUTO} when {@link Analysis#choose} picks structure.
     */
    public static boolean usesWorkingSet(Scenario scenario, OptimizerOptions options) {
        switch (options.mode) {
            case WORKING_SET:
                return true;
            case DOMAIN:
                return false;
            default:
                return Analysis.choose(scenario, Analysis.Method.AUTO).method() == Analysis.Method.STRUCTURE;
        }
    }

    /**
     * One optimisation, advanced one outer step per {@link #step} call; {@link #optimize} is a loop
     * over these steps, so a stepped run and a one-call run are the same computation.
     *
     * <p><b>Time budget.</b> One {@link Deadline} covers the whole call: the listing of the
     * candidate inputs (one check per input of the domain), every evaluation (one check per
     * candidate), the surrogate's Newton iterations, the outer steps, and the final pass over the
     * domain. The search keeps in reserve the final pass's time, estimated from the first
     * evaluation, when that is at most half the budget; otherwise the final pass is skipped. When
     * the budget runs out before the search could start, the result keeps the given weights with
     * the values reached (lower ends) and says so ({@link OptimizationResult#cut}).
     * <b>Mutable, single-threaded.</b>
     */
    public static final class Run {
        private final Scenario scenario;
        private final OptimizerOptions options;
        private final Deadline deadline;
        private final WorstCaseEvaluator ev;
        private final int[] group;
        private final int g;
        private final boolean[] free;
        private final double[] u0;
        private final boolean anyLocked;
        private final double initial;
        private final SurrogateSolver solver;
        private final SeededRandom rnd;
        private double bestF = Double.POSITIVE_INFINITY;
        private double[] bestU;
        private List<Double> bestTrace;
        private OptimizationResult.Status bestStatus = OptimizationResult.Status.CONVERGED;
        private int totalIterations;
        private int bestStart;
        private boolean cancelled;
        private boolean finished;
        private OptimizationResult.Status finalStatus;
        /** What the budget cut before the search could start, or null. */
        private String earlyCut;
        /** Did the first evaluation reach every candidate of a complete list? */
        private final boolean initialExact;
        /** The final pass over the domain (or the caller's candidates) fits in half the budget. */
        private final boolean finalPassPlanned;
        private final long finalPassMillis;
        // the values at the current point and at the best point: W₊, W₋, worst candidate indices
        private final Values cur = new Values();
        private final Values best = new Values();
        // the start in progress
        int start = -1;
        int iteration;
        boolean accepted;
        double f;
        private double[] u;
        private List<Double> trace;
        private Set<Integer> activeP;
        private Set<Integer> activeN;
        private boolean inStart;
        private OptimizationResult.Status status;
        /** The working-set optimiser this run delegates to, or null for the whole domain. */
        private final WorkingSetSearch ws;

        Run(WorkingSetSearch ws) {
            this.ws = ws;
            this.scenario = null;
            this.options = null;
            this.deadline = null;
            this.ev = null;
            this.group = null;
            this.g = 0;
            this.free = null;
            this.u0 = null;
            this.anyLocked = false;
            this.initial = ws.initial;
            this.solver = null;
            this.rnd = null;
            this.initialExact = true;
            this.finalPassPlanned = false;
            this.finalPassMillis = 0;
        }

        /** With a caller's deadline (tests inject a clock, or one that expires after a number of checks). */
        Run(Scenario scenario, CandidateInputs candidates, OptimizerOptions options, Deadline deadline) {
            this.ws = null;
            this.scenario = scenario;
            this.options = options;
            this.deadline = deadline;
            long t0 = deadline.now();
            this.ev = candidates == null ? new WorstCaseEvaluator(scenario, deadline)
                    : new WorstCaseEvaluator(scenario, candidates);
            WeightGroups wg = new WeightGroups(scenario, ev.keptEdge, options.tie);
            group = wg.group;
            g = wg.count;
            free = wg.free;
            u0 = wg.u0;
            anyLocked = wg.anyLocked;
            int freeCount = wg.freeCount;
            long t1 = deadline.now();
            initial = Math.sqrt(ev.evaluate(expand(u0, group), deadline));
            cur.take(ev);
            best.take(ev);
            initialExact = ev.listingCut == null && ev.complete;
            // the final pass: one solve per input of the domain (or per caller candidate), estimated
            // from this evaluation's time; kept in reserve when it fits in half the budget
            long evalMillis = Math.max(0, deadline.now() - t1);
            double candidateCount = Math.max(1, ev.positives.length + ev.negatives.length);
            double domainShare = ev.callerCandidates ? 1 : Math.min(1e6, ev.domainSize / candidateCount);
            finalPassMillis = (long) Math.ceil(evalMillis * domainShare);
            finalPassPlanned = finalPassMillis <= options.maxMillis / 2;
            long certificates = (long) Math.ceil(2 * evalMillis / candidateCount) + 1;
            deadline.reserve(finalPassPlanned ? finalPassMillis + certificates : certificates);
            bestU = u0;
            bestTrace = List.of(initial);
            solver = new SurrogateSolver(g, free, u0);
            rnd = new SeededRandom(options.seed); // java.util.Random ignores seeds under TeaVM
            if (ev.listingCut != null) {
                finished = true;
                finalStatus = OptimizationResult.Status.BUDGET_REACHED;
                earlyCut = "the time budget ran out while " + ev.listingCut + ", before any weights were tried"
                        + " (after " + seconds(deadline.now() - t0) + "): the weights are unchanged and W+ and W- were"
                        + " not computed (the upper ends shown are derived: the sum of all weights bounds W+, the sum"
                        + " of 1/w over the switchable edges bounds W-); give more time (--seconds), or analyze the"
                        + " scenario";
            } else if (!ev.complete) {
                finished = true;
                finalStatus = OptimizationResult.Status.BUDGET_REACHED;
                earlyCut = "the time budget ran out in the first evaluation of the candidate inputs (" + ev.evaluated
                        + " of " + (ev.positives.length + ev.negatives.length) + " evaluated), before any weights were"
                        + " tried: the weights are unchanged; W+ and W- are lower ends over the inputs evaluated, with"
                        + " derived upper ends; give more time (--seconds), or analyze the scenario";
            } else if (Double.isNaN(initial) || freeCount == 0 || initial == 0) {
                finished = true;
                finalStatus = OptimizationResult.Status.NOTHING_TO_DO;
                bestTrace = List.of(initial);
            }
        }

        /** "working-set" (beyond enumeration) or "domain": which optimiser this run is. */
        public String method() {
            return ws != null ? "working-set" : "domain";
        }

        /** Worst inputs in the working set so far (0 for the whole-domain optimiser). */
        public int workingSetSize() {
            return ws == null ? 0 : ws.workingSetSize(true) + ws.workingSetSize(false);
        }

        /** Solves so far (for tests that measure the budget in evaluations). */
        long solves() {
            return ev.solves;
        }

        /** √(W₊W₋) with the starting weights. */
        public double initialComplexity() {
            return initial;
        }

        /** √(W₊W₋) at the current point of the start in progress (or the best so far). */
        public double currentComplexity() {
            if (ws != null) {
                return ws.currentComplexity();
            }
            return inStart ? Math.sqrt(f) : Math.sqrt(bestF);
        }

        /** Index of the start in progress (0 = the given weights). */
        public int currentStart() {
            if (ws != null) {
                return ws.currentStart();
            }
            return Math.max(0, start);
        }

        /** Outer steps taken in the start in progress. */
        public int currentIteration() {
            if (ws != null) {
                return ws.currentRound();
            }
            return iteration;
        }

        /** The objective trace of the start in progress (a copy). */
        public List<Double> currentTrace() {
            if (ws != null) {
                return ws.currentTrace();
            }
            return trace == null ? List.of(initial) : new ArrayList<>(trace);
        }

        /** Ends the search at the best point found so far (status cancelled). */
        public void cancel() {
            if (ws != null) {
                ws.cancel();
            }
            cancelled = true;
        }

        public boolean done() {
            if (ws != null) {
                return ws.done();
            }
            return finished;
        }

        /**
         * One outer step (or the set-up of the next start).
         *
         * @return true when the search has ended
         */
        public boolean step() {
            accepted = false;
            if (ws != null) {
                boolean end = ws.step();
                accepted = !end;
                f = Math.pow(ws.currentComplexity(), 2);
                start = ws.currentStart();
                iteration = ws.currentRound();
                return end;
            }
            if (finished) {
                return true;
            }
            if (cancelled) {
                if (inStart) {
                    endStart(OptimizationResult.Status.CANCELLED);
                }
                finishSearch(OptimizationResult.Status.CANCELLED);
                return true;
            }
            if (!inStart) {
                if (deadline.passed()) {
                    finishSearch(OptimizationResult.Status.BUDGET_REACHED); // no new start past the budget
                    return true;
                }
                if (start + 1 >= options.starts) {
                    finishSearch(bestStatus);
                    return true;
                }
                if (!beginStart()) {
                    finishSearch(OptimizationResult.Status.BUDGET_REACHED); // its first evaluation was cut
                    return true;
                }
                return false;
            }
            if (iteration >= options.maxIterations || deadline.passed()) {
                endStart(OptimizationResult.Status.BUDGET_REACHED);
                return false;
            }
            double fNew = f;
            double[] uNew = u;
            // When no descent is found, the active sets may lack some of many tied worst
            // inputs: widen them (4×, 16×, 64× more per side) before calling it converged.
            boolean outOfTime = false;
            for (int attempt = 0; attempt < 4 && !accepted && !outOfTime; attempt++) {
                if (attempt > 0 && (outOfTime = deadline.passed())) {
                    break;
                }
                if (attempt > 0) {
                    ev.evaluate(expand(u, group), deadline); // the values at u, not at the last trial
                    if (!ev.complete) {
                        outOfTime = true;
                        break;
                    }
                }
                int before = activeP.size() + activeN.size();
                int cap = ADD_PER_STEP << (2 * attempt);
                addNearWorst(ev.positiveValue, ev.maxR, ev.worstPositive, activeP, cap);
                addNearWorst(ev.negativeValue, ev.maxC, ev.worstNegative, activeN, cap);
                if (attempt > 0 && activeP.size() + activeN.size() == before) {
                    break; // nothing new to add: no descent from here
                }
                double[][] a = rows(ev, activeP, true, group, g);
                double[][] b = rows(ev, activeN, false, group, g);
                double[] target = solver.minimise(a, b, u, deadline);
                double t = 1.0;
                for (int ls = 0; ls < 30; ls++) {
                    if (ls > 0 && (outOfTime = deadline.passed())) {
                        break; // at most one evaluation past the budget
                    }
                    double[] trial = new double[g];
                    for (int q = 0; q < g; q++) {
                        trial[q] = u[q] + t * (target[q] - u[q]);
                    }
                    double ft = ev.evaluate(expand(trial, group), deadline);
                    if (!ev.complete) {
                        outOfTime = true; // a trial not evaluated on every candidate is not compared
                        break;
                    }
                    if (ft < f * (1 - 1e-15)) {
                        accepted = true;
                        fNew = ft;
                        uNew = trial;
                        cur.take(ev);
                        break;
                    }
                    t *= 0.5;
                }
            }
            totalIterations++;
            iteration++;
            if (!accepted && outOfTime) {
                endStart(OptimizationResult.Status.BUDGET_REACHED); // the next start re-evaluates
                return false;
            }
            if (!accepted) {
                endStart(OptimizationResult.Status.CONVERGED);
                return false;
            }
            double rel = (Math.sqrt(f) - Math.sqrt(fNew)) / Math.sqrt(f);
            u = uNew;
            f = fNew;
            trace.add(Math.sqrt(f));
            if (rel < options.tolerance) {
                endStart(OptimizationResult.Status.CONVERGED);
            }
            return false;
        }

        /** Begins the next start; false when the budget cut its first evaluation (the start is dropped). */
        private boolean beginStart() {
            start++;
            iteration = 0;
            double[] v = u0.clone();
            if (start > 0) {
                for (int q = 0; q < g; q++) {
                    if (free[q]) {
                        v[q] += 0.7 * rnd.nextGaussian();
                    }
                }
            }
            u = solver.clamp(v);
            f = ev.evaluate(expand(u, group), deadline);
            if (!ev.complete) {
                return false;
            }
            cur.take(ev);
            trace = new ArrayList<>();
            trace.add(Math.sqrt(f));
            activeP = new LinkedHashSet<>();
            activeN = new LinkedHashSet<>();
            inStart = true;
            return true;
        }

        private void endStart(OptimizationResult.Status s) {
            inStart = false;
            if (f < bestF) {
                bestF = f;
                bestU = u;
                bestTrace = trace;
                bestStatus = s;
                bestStart = start;
                best.copy(cur);
            }
        }

        private void finishSearch(OptimizationResult.Status s) {
            finished = true;
            finalStatus = s;
        }

        /**
         * The result; requires {@link #done()}. Runs the final pass over the domain (or the caller's
         * candidates) with the returned weights when the budget leaves time for it.
         */
        public OptimizationResult result() {
            if (ws != null) {
                return ws.result();
            }
            if (!finished) {
                throw new IllegalStateException("optimisation not finished");
            }
            if (finalStatus == OptimizationResult.Status.NOTHING_TO_DO || earlyCut != null) {
                return finish(u0, best, initialExact, List.of(initial), 0, 1, 0);
            }
            return finish(bestU, best, true, bestTrace, totalIterations, options.starts, bestStart);
        }

        private OptimizationResult finish(double[] u, Values v, boolean exact, List<Double> trace, int iterations,
                int starts, int bestStartIndex) {
            double[] w = expand(u, group);
            double maxR = v.maxR;
            double maxC = v.maxC;
            boolean balanced = false;
            if (exact && !anyLocked && v.worstPositive >= 0 && v.worstNegative >= 0 && maxR > 0 && maxC > 0) {
                double lambda = Math.sqrt(maxC / maxR);
                double lo = 0;
                double hi = Double.POSITIVE_INFINITY;
                for (double x : w) {
                    lo = Math.max(lo, Edge.MIN_WEIGHT / x);
                    hi = Math.min(hi, Edge.MAX_WEIGHT / x);
                }
                // balance only as far as the accepted weight range allows (always, unless the
                // weights already span nearly the whole range)
                balanced = lambda >= lo && lambda <= hi;
                lambda = Math.max(lo, Math.min(hi, lambda));
                for (int k = 0; k < w.length; k++) {
                    w[k] = Math.max(Edge.MIN_WEIGHT, Math.min(Edge.MAX_WEIGHT, w[k] * lambda));
                }
                // derived: scaling every weight by λ scales every R by λ and every C by 1/λ
                maxR *= lambda;
                maxC /= lambda;
            }
            double[] all = new double[scenario.edges().size()];
            for (int i = 0; i < all.length; i++) {
                all[i] = scenario.edges().get(i).weight();
            }
            for (int k = 0; k < group.length; k++) {
                all[ev.keptEdge[k]] = w[k];
            }
            Scenario out = scenario.withWeights(all);
            deadline.reserve(0); // the final pass may use what is left
            long domain = (long) Math.min(ev.domainSize, Long.MAX_VALUE);
            Boolean correct = ev.candidates == null || !ev.candidates.checked() ? null
                    : ev.candidates.counterexampleCount() == 0;
            String standing = Boolean.FALSE.equals(correct)
                    ? Analysis.notABound(Long.toString((long) ev.candidates.counterexampleCount())) : null;
            String cut = earlyCut;
            if (exact) {
                String pass = ev.callerCandidates ? "the final pass over the " + ev.candidates.size()
                        + " candidate inputs" : "the final pass over all " + domain + " inputs of the domain";
                if (!finalPassPlanned) {
                    cut = pass + " (a re-check of the returned weights) was skipped: by the first evaluation's time it"
                            + " takes about " + seconds(finalPassMillis) + ", more than half the budget";
                } else if (ev.callerCandidates) {
                    Summary.Builder b = new Summary.Builder(out, Summary.Coverage.CANDIDATES, 0, true);
                    int k = 0;
                    for (; k < ev.candidates.size() && !deadline.passed(); k++) {
                        b.add(ev.candidates.input(k));
                    }
                    if (k == ev.candidates.size()) {
                        // the domain may be far too large for a pass: values and worst inputs over the candidates
                        Summary r = b.build();
                        return new OptimizationResult(finalStatus, out, initial, r.complexity(), r.maxResistance(),
                                r.maxCapacitance(), r.worstPositive(), r.worstNegative(),
                                r.worstPositive() < 0 ? null : Analysis.detail(out, r.worstPositive()),
                                r.worstNegative() < 0 ? null : Analysis.detail(out, r.worstNegative()), trace,
                                iterations, ev.solves, starts, bestStartIndex, balanced, ev.positives.length,
                                ev.negatives.length, domain).certified(true, 0, 0, null, correct, standing);
                    }
                    cut = pass + " (a re-check of the returned weights) was cut by the time budget after " + k
                            + " inputs";
                } else {
                    AnalysisRun run = Analysis.start(out);
                    if (run.stepWithin(deadline)) {
                        AnalysisResult r = run.result();
                        Boolean ok = r.correct();
                        return new OptimizationResult(finalStatus, out, initial, r.complexity(), r.maxResistance(),
                                r.maxCapacitance(), r.worstPositive(), r.worstNegative(), r.worstPositiveDetail(),
                                r.worstNegativeDetail(), trace, iterations, ev.solves, starts, bestStartIndex, balanced,
                                ev.positives.length, ev.negatives.length, domain).certified(true, 0, 0, null, ok,
                                        Boolean.FALSE.equals(ok) ? Analysis.notABound(Long.toString(
                                                r.counterexampleCount())) : null);
                    }
                    cut = pass + " (a re-check of the returned weights, which also picks the first worst input in"
                            + " input order) was cut by the time budget after " + run.processed() + " inputs";
                }
                cut += ": W+ and W- are exact all the same, computed on the " + (ev.positives.length
                        + ev.negatives.length) + " candidate inputs that can be worst ("
                        + (ev.callerCandidates ? "the caller's candidates" : "by Rayleigh monotonicity")
                        + ") with these weights; for the full pass give more time (--seconds), or analyze the"
                        + " written scenario";
            }
            long xp = v.worstPositive < 0 ? -1 : ev.positives[v.worstPositive];
            long xn = v.worstNegative < 0 ? -1 : ev.negatives[v.worstNegative];
            InputDetail dp = xp < 0 ? null : Analysis.detail(out, xp);
            InputDetail dn = xn < 0 ? null : Analysis.detail(out, xn);
            double rUpper = maxR;
            double cUpper = maxC;
            if (!exact) {
                // derived caps, valid for every input (see StructuralAnalysis): R ≤ Σ w (the unit flow
                // along one s–t path of present edges), C ≤ Σ 1/w over the switchable edges
                rUpper = 0;
                cUpper = 0;
                for (Edge e : out.edges()) {
                    if (!e.isSelfLoop()) {
                        rUpper += e.weight();
                        cUpper += e.when().isAlways() ? 0 : 1 / e.weight();
                    }
                }
            }
            return new OptimizationResult(finalStatus, out, initial, Math.sqrt(maxR * maxC), maxR, maxC, xp, xn, dp, dn,
                    trace, iterations, ev.solves, starts, bestStartIndex, balanced, ev.positives.length,
                    ev.negatives.length, domain).certified(exact, rUpper, cUpper, cut, correct, standing);
        }
    }

    /** W₊, W₋ and their worst candidates (indices) at one point. */
    private static final class Values {
        double maxR = Double.NaN;
        double maxC = Double.NaN;
        int worstPositive = -1;
        int worstNegative = -1;

        void take(WorstCaseEvaluator ev) {
            maxR = ev.maxR;
            maxC = ev.maxC;
            worstPositive = ev.worstPositive;
            worstNegative = ev.worstNegative;
        }

        void copy(Values o) {
            maxR = o.maxR;
            maxC = o.maxC;
            worstPositive = o.worstPositive;
            worstNegative = o.worstNegative;
        }
    }

    /** Milliseconds as seconds in words ("2.5 s"). */
    static String seconds(long millis) {
        return spanwright.io.NumberText.sig(millis / 1000.0, 3) + " s";
    }

    private static void addNearWorst(double[] values, double max, int worst, Set<Integer> active, int cap) {
        if (worst >= 0) {
            active.add(worst);
        }
        int added = 0;
        for (int i = 0; i < values.length && added < cap; i++) {
            if (values[i] >= (1 - NEAR) * max && active.add(i)) {
                added++;
            }
        }
    }

    /** Per active input: squared currents (positive) or squared potential drops (negative) per group. */
    private static double[][] rows(WorstCaseEvaluator ev, Set<Integer> active, boolean positive, int[] group, int g) {
        List<double[]> out = new ArrayList<>();
        for (int idx : active) {
            long x = positive ? ev.positives[idx] : ev.negatives[idx];
            Witness w = ev.witness(x);
            boolean[] present = ev.presentOn(x);
            double[] row = new double[g];
            double sum = 0;
            for (int k = 0; k < group.length; k++) {
                double c;
                if (positive) {
                    c = present[k] ? w.current[k] * w.current[k] : 0.0;
                } else {
                    int u = ev.scenario.edges().get(ev.keptEdge[k]).u();
                    int v = ev.scenario.edges().get(ev.keptEdge[k]).v();
                    double d = present[k] ? 0.0 : w.potential[u] - w.potential[v];
                    c = d * d;
                }
                row[group[k]] += c;
                sum += c;
            }
            if (sum > 0) {
                out.add(row);
            }
        }
        return out.toArray(new double[0][]);
    }

    /** Weights e^u, held inside the accepted range [Edge.MIN_WEIGHT, Edge.MAX_WEIGHT]. */
    private static double[] expand(double[] u, int[] group) {
        double[] w = new double[group.length];
        for (int k = 0; k < group.length; k++) {
            w[k] = Math.min(Edge.MAX_WEIGHT, Math.max(Edge.MIN_WEIGHT, Math.exp(u[group[k]])));
        }
        return w;
    }
}
