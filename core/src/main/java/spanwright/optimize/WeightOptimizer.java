package spanwright.optimize;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.analysis.CandidateInputs;
import spanwright.analysis.Summary;
import spanwright.electric.Witness;
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
        long deadline = System.currentTimeMillis() + options.maxMillis;
        WorstCaseEvaluator ev = candidates == null ? new WorstCaseEvaluator(scenario)
                : new WorstCaseEvaluator(scenario, candidates);
        int m = ev.keptEdge.length;

        // weight groups over kept edges
        Map<String, Integer> groupOf = new HashMap<>();
        int[] group = new int[m];
        List<Boolean> lockedList = new ArrayList<>();
        for (int k = 0; k < m; k++) {
            Edge e = scenario.edges().get(ev.keptEdge[k]);
            String key;
            if (e.locked()) {
                key = "locked#" + k;
            } else if (e.group() != null) {
                key = "group:" + e.group();
            } else if (options.tie == OptimizerOptions.Tie.LITERAL) {
                key = "literal:" + e.when();
            } else {
                key = "edge#" + k;
            }
            Integer gi = groupOf.get(key);
            if (gi == null) {
                gi = groupOf.size();
                groupOf.put(key, gi);
                lockedList.add(e.locked());
            }
            group[k] = gi;
        }
        int g = groupOf.size();
        boolean[] free = new boolean[g];
        double[] u0 = new double[g];
        int[] members = new int[g];
        boolean anyLocked = false;
        for (int q = 0; q < g; q++) {
            free[q] = !lockedList.get(q);
            anyLocked |= !free[q];
        }
        for (int k = 0; k < m; k++) {
            u0[group[k]] += Math.log(scenario.edges().get(ev.keptEdge[k]).weight());
            members[group[k]]++;
        }
        int freeCount = 0;
        for (int q = 0; q < g; q++) {
            u0[q] /= members[q]; // geometric mean of the members' weights
            if (free[q]) {
                freeCount++;
            }
        }

        double initial = Math.sqrt(ev.evaluate(expand(u0, group)));
        if (Double.isNaN(initial) || freeCount == 0 || initial == 0) {
            return finish(scenario, ev, u0, group, anyLocked, OptimizationResult.Status.NOTHING_TO_DO,
                    initial, List.of(initial), 0, 1, 0);
        }

        SurrogateSolver solver = new SurrogateSolver(g, free, u0);
        SeededRandom rnd = new SeededRandom(options.seed); // java.util.Random ignores seeds under TeaVM
        double bestF = Double.POSITIVE_INFINITY;
        double[] bestU = u0;
        List<Double> bestTrace = null;
        OptimizationResult.Status bestStatus = OptimizationResult.Status.CONVERGED;
        int totalIterations = 0;
        int bestStart = 0;
        boolean cancelled = false;
        for (int start = 0; start < options.starts && !cancelled; start++) {
            double[] u = u0.clone();
            if (start > 0) {
                for (int q = 0; q < g; q++) {
                    if (free[q]) {
                        u[q] += 0.7 * rnd.nextGaussian();
                    }
                }
            }
            u = solver.clamp(u);
            double f = ev.evaluate(expand(u, group));
            List<Double> trace = new ArrayList<>();
            trace.add(Math.sqrt(f));
            Set<Integer> activeP = new LinkedHashSet<>();
            Set<Integer> activeN = new LinkedHashSet<>();
            OptimizationResult.Status status = OptimizationResult.Status.BUDGET_REACHED;
            for (int it = 0; it < options.maxIterations; it++) {
                if (System.currentTimeMillis() > deadline) {
                    status = OptimizationResult.Status.BUDGET_REACHED;
                    break;
                }
                boolean accepted = false;
                double fNew = f;
                double[] uNew = u;
                // When no descent is found, the active sets may lack some of many tied worst
                // inputs: widen them (4×, 16×, 64× more per side) before calling it converged.
                for (int attempt = 0; attempt < 4 && !accepted; attempt++) {
                    if (attempt > 0) {
                        ev.evaluate(expand(u, group)); // the values at u, not at the last trial
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
                    double[] target = solver.minimise(a, b, u);
                    double t = 1.0;
                    for (int ls = 0; ls < 30; ls++) {
                        double[] trial = new double[g];
                        for (int q = 0; q < g; q++) {
                            trial[q] = u[q] + t * (target[q] - u[q]);
                        }
                        double ft = ev.evaluate(expand(trial, group));
                        if (ft < f * (1 - 1e-15)) {
                            accepted = true;
                            fNew = ft;
                            uNew = trial;
                            break;
                        }
                        t *= 0.5;
                    }
                }
                totalIterations++;
                if (!accepted) {
                    ev.evaluate(expand(u, group)); // restore the evaluator's state at u
                    status = OptimizationResult.Status.CONVERGED;
                    break;
                }
                double rel = (Math.sqrt(f) - Math.sqrt(fNew)) / Math.sqrt(f);
                u = uNew;
                f = fNew;
                trace.add(Math.sqrt(f));
                if (listener != null && !listener.progress(start, it + 1, Math.sqrt(f))) {
                    status = OptimizationResult.Status.CANCELLED;
                    cancelled = true;
                    break;
                }
                if (rel < options.tolerance) {
                    status = OptimizationResult.Status.CONVERGED;
                    break;
                }
            }
            if (f < bestF) {
                bestF = f;
                bestU = u;
                bestTrace = trace;
                bestStatus = status;
                bestStart = start;
            }
        }
        return finish(scenario, ev, bestU, group, anyLocked, bestStatus, initial, bestTrace, totalIterations,
                options.starts, bestStart);
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

    private static double[] expand(double[] u, int[] group) {
        double[] w = new double[group.length];
        for (int k = 0; k < group.length; k++) {
            w[k] = Math.exp(u[group[k]]);
        }
        return w;
    }

    private static OptimizationResult finish(Scenario scenario, WorstCaseEvaluator ev, double[] u, int[] group,
            boolean anyLocked, OptimizationResult.Status status, double initial, List<Double> trace,
            int iterations, int starts, int bestStart) {
        double[] w = expand(u, group);
        ev.evaluate(w);
        boolean balanced = false;
        if (!anyLocked && ev.worstPositive >= 0 && ev.worstNegative >= 0 && ev.maxR > 0 && ev.maxC > 0) {
            double lambda = Math.sqrt(ev.maxC / ev.maxR);
            for (int k = 0; k < w.length; k++) {
                w[k] *= lambda;
            }
            balanced = true;
        }
        double[] all = new double[scenario.edges().size()];
        for (int i = 0; i < all.length; i++) {
            all[i] = scenario.edges().get(i).weight();
        }
        for (int k = 0; k < group.length; k++) {
            all[ev.keptEdge[k]] = w[k];
        }
        Scenario out = scenario.withWeights(all);
        if (ev.callerCandidates) {
            // the domain may be far too large for a pass: values and worst inputs over the candidates
            Summary r = Analysis.summarize(out, ev.candidates, 0, ev.candidates.size());
            return new OptimizationResult(status, out, initial, r.complexity(), r.maxResistance(), r.maxCapacitance(),
                    r.worstPositive(), r.worstNegative(),
                    r.worstPositive() < 0 ? null : Analysis.detail(out, r.worstPositive()),
                    r.worstNegative() < 0 ? null : Analysis.detail(out, r.worstNegative()), trace,
                    iterations, ev.solves, starts, bestStart, balanced, ev.positives.length, ev.negatives.length,
                    (long) Math.min(ev.domainSize, Long.MAX_VALUE));
        }
        AnalysisResult r = Analysis.run(out);
        return new OptimizationResult(status, out, initial, r.complexity(), r.maxResistance(), r.maxCapacitance(),
                r.worstPositive(), r.worstNegative(), r.worstPositiveDetail(), r.worstNegativeDetail(), trace,
                iterations, ev.solves, starts, bestStart, balanced, ev.positives.length, ev.negatives.length,
                (long) ev.domainSize);
    }
}
