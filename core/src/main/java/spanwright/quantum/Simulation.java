package spanwright.quantum;

import java.util.ArrayList;
import java.util.List;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.domain.InputDomain;
import spanwright.electric.Witness;
import spanwright.model.ScenarioException;
import spanwright.model.Scenario;

/**
 * One entry (for the command-line tool and the page alike) to the exact simulation of the
 * span-program algorithm for st-connectivity on every input of a scenario's domain, and its
 * concrete costs.
 *
 * <p>The algorithm (Belovs &amp; Reichardt, "Span programs and quantum algorithms for
 * st-connectivity and claw detection", ESA 2012, arXiv:1203.2603; analysis as in Ito &amp; Jeffery,
 * "Approximate span programs", Algorithmica 81 (2019), arXiv:1507.00432, with the effective
 * spectral gap lemma of Lee, Mittal, Reichardt, Špalek &amp; Szegedy, "Quantum query complexity of
 * state conversion", FOCS 2011, arXiv:1011.3020): start in |0⟩, run b-bit phase estimation on
 * U(x) = (2Π_{ker Ã} − I)(2Π_{H̃(x)} − I) ({@link SpanProgramUnitary}), accept when the estimate is 0.
 * Positive inputs: α|0⟩ − Σ θ_e√w_e|e⟩ (θ the unit electrical flow) is fixed by U(x), so |0⟩ has
 * weight α²/(α² + R(x)) on eigenphase 0. Negative inputs: |0⟩'s weight on phases |θ| ≤ Θ is at most
 * (Θ²/4)(1 + α²C(x)). docs/simulation.md derives both.
 *
 * <p>Per input: the spectrum from one dense SVD ({@link SpectrumSolver}), acceptance for b = 1 … 16
 * from the Fejér kernel ({@link PhaseEstimation}). Cost: the analysis, plus O(|V|(|E|+1)²) once,
 * plus |domain| × O((|E|+1)³). Size guard: {@link #MAX_EDGES}, {@link #MAX_INPUTS},
 * {@link #MAX_WORK}. Single-threaded, allocation per input; no threads.
 *
 * <p>Numbers are simulated query counts of this algorithm under our normalisation (weight =
 * resistance, each edge once) and {@link #ASSUMPTIONS}; not run-time estimates for real hardware.
 */
public final class Simulation {
    /** At most this many (non-loop) edges: the matrices are (|E|+1)² dense. */
    public static final int MAX_EDGES = 400;
    /** At most this many inputs in the domain. */
    public static final long MAX_INPUTS = 1L << 16;
    /**
     * At most this much work, counted as |domain| × (|E|+1)³ (one dense SVD per input); measured
     * 10–30 s on one core of the JVM at the limit (e.g. 17,000 inputs of a 60-edge graph), several
     * times that in the page.
     */
    public static final double MAX_WORK = 4.0e9;

    /** The cost model behind every count (also printed and put in the JSON). */
    public static final List<String> ASSUMPTIONS = List.of(
            "one query = one application of the reflection 2Π_H̃(x) − I, a phase oracle that flips the sign of "
                    + "|e⟩ for every absent edge; a controlled application also counts as one query",
            "one run of b-bit phase estimation applies controlled-U^(2^j) as 2^j controlled-U's (no "
                    + "fast-forwarding): 2^b − 1 queries",
            "the input-independent reflection 2Π_ker Ã − I, the Hadamards and the inverse quantum Fourier "
                    + "transform make no queries; their gates and ancillas are not counted",
            "qubits = ⌈log₂(|E| + 1)⌉ for the state register (basis |0⟩ and one |e⟩ per edge; self-loops left out) "
                    + "+ b phase qubits; the oracle's workspace and the reflections' ancillas are not counted",
            "an ideal noiseless circuit, simulated exactly from the spectrum of U(x) (no sampling)",
            "error ε = the largest probability of accepting a negative input in one run; positive inputs are "
                    + "accepted with probability at least α²/(α² + W₊) at every b; repetitions give two-sided error ε");

    private Simulation() {}

    /**
     * Simulates the algorithm on every input of the domain.
     *
     * @throws ScenarioException {@code too-large-to-simulate} beyond the size guard; {@code option}
     *         for ε outside (0, 1) or α² not finite and &gt; 0
     */
    public static SimulationResult run(Scenario scenario, SimulationOptions options) {
        double epsilon = options.epsilon();
        if (!(epsilon > 0 && epsilon < 1)) {
            throw new ScenarioException("option", "$options.epsilon",
                    "epsilon must be a number strictly between 0 and 1, got " + epsilon);
        }
        if (!Double.isNaN(options.alpha2()) && (!(options.alpha2() > 0) || Double.isInfinite(options.alpha2()))) {
            throw new ScenarioException("option", "$options.alpha2",
                    "alpha2 must be a finite number > 0, got " + options.alpha2());
        }
        int m = 0;
        for (int i = 0; i < scenario.edges().size(); i++) {
            if (!scenario.edges().get(i).isSelfLoop()) {
                m++;
            }
        }
        checkSize(scenario, m);

        AnalysisResult analysis = Analysis.run(scenario);
        double wPlus = analysis.maxResistance();
        double wMinus = analysis.maxCapacitance();
        double alpha2;
        String source;
        if (!Double.isNaN(options.alpha2())) {
            alpha2 = options.alpha2();
            source = "given";
        } else if (analysis.positiveCount() > 0) {
            alpha2 = wPlus;
            source = "W+";
        } else {
            alpha2 = 1;
            source = "1 (no positive inputs)";
        }
        SpanProgramUnitary unitary = new SpanProgramUnitary(scenario, alpha2);
        SpectrumSolver solver = new SpectrumSolver(unitary);

        int size = (int) analysis.domainSize();
        List<InputSimulation> rows = new ArrayList<>(size);
        int nb = PhaseEstimation.MAX_BITS;
        double[] minPos = new double[nb];
        double[] maxNeg = new double[nb];
        java.util.Arrays.fill(minPos, Double.POSITIVE_INFINITY);
        java.util.Arrays.fill(maxNeg, Double.NEGATIVE_INFINITY);
        double negativeGap = Double.POSITIVE_INFINITY;
        double lemmaRatio = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < size; i++) {
            long mask = analysis.input(i);
            InputSimulation r = solver.solve(mask, Analysis.presentEdges(scenario, mask), true, analysis.connected(i),
                    analysis.value(i), false);
            rows.add(r);
            for (int b = 0; b < nb; b++) {
                double p = r.acceptance(b + 1);
                if (r.positive) {
                    minPos[b] = Math.min(minPos[b], p);
                } else {
                    maxNeg[b] = Math.max(maxNeg[b], p);
                }
            }
            if (!r.positive) {
                if (!Double.isNaN(r.weightedPhaseGap)) {
                    negativeGap = Math.min(negativeGap, r.weightedPhaseGap);
                }
                lemmaRatio = Math.max(lemmaRatio, lemmaRatio(r, alpha2));
            }
        }
        long positives = analysis.positiveCount();
        long negatives = analysis.negativeCount();
        for (int b = 0; b < nb; b++) {
            if (positives == 0) {
                minPos[b] = Double.NaN;
            }
            if (negatives == 0) {
                maxNeg[b] = Double.NaN;
            }
        }

        int bits = 0;
        String reason = null;
        if (positives == 0 || negatives == 0) {
            reason = "the domain has no " + (positives == 0 ? "positive" : "negative") + " inputs: nothing to separate";
        } else {
            for (int b = 1; b <= nb && bits == 0; b++) {
                if (maxNeg[b - 1] <= epsilon && minPos[b - 1] > maxNeg[b - 1]) {
                    bits = b;
                }
            }
            if (bits == 0) {
                reason = "no b ≤ " + nb + " accepts every negative input with probability ≤ " + epsilon
                        + " (at b = " + nb + " the largest is " + maxNeg[nb - 1]
                        + "); try a larger epsilon or a smaller alpha2";
            }
        }
        long queries = bits == 0 ? -1 : PhaseEstimation.controlledUses(bits);
        Repetition rep = null;
        String repReason = null;
        long worstPositive = -1;
        long worstNegative = -1;
        if (bits > 0) {
            rep = Repetition.find(minPos[bits - 1], maxNeg[bits - 1], epsilon);
            if (rep == null) {
                repReason = "more than " + Repetition.MAX_RUNS + " runs would be needed";
            }
            // the first input in input order within rounding (AnalysisRun.TIE) of the extreme
            double tie = spanwright.analysis.AnalysisRun.TIE;
            for (InputSimulation r : rows) {
                double p = r.acceptance(bits);
                if (r.positive && worstPositive < 0 && p <= minPos[bits - 1] + tie) {
                    worstPositive = r.mask;
                }
                if (!r.positive && worstNegative < 0 && p >= maxNeg[bits - 1] - tie) {
                    worstNegative = r.mask;
                }
            }
        } else {
            repReason = reason;
        }
        long total = rep == null ? -1 : rep.runs * queries;
        int stateQubits = ceilLog2(m + 1);

        SimulationResult.Textbook textbook = null;
        if (positives > 0 && negatives > 0) {
            textbook = textbook(rows, wPlus, wMinus, alpha2);
        }
        InputSimulation focus = null;
        if (options.focus() >= 0) {
            focus = focus(scenario, solver, options.focus());
        }
        return new SimulationResult(scenario, alpha2, source, positives, negatives,
                positives == 0 ? Double.NaN : wPlus, negatives == 0 ? Double.NaN : wMinus, analysis.correct(),
                epsilon, bits, reason, queries, rep, repReason, total, m, stateQubits,
                bits == 0 ? -1 : stateQubits + bits, unitary.orthogonalityDefect(), textbook,
                negatives == 0 || negativeGap == Double.POSITIVE_INFINITY ? Double.NaN : negativeGap,
                negatives == 0 ? Double.NaN : lemmaRatio, worstPositive, worstNegative, edgeIndices(unitary),
                minPos, maxNeg, rows, focus);
    }

    /**
     * Refuses instances beyond the size guard, with a message that says what to change.
     *
     * @throws ScenarioException code {@code too-large-to-simulate}
     */
    public static void checkSize(Scenario scenario, int edges) {
        if (edges > MAX_EDGES) {
            throw new ScenarioException("too-large-to-simulate", "$.graph.edges", "the simulation handles at most "
                    + MAX_EDGES + " edges (dense matrices of size (|E|+1)²); this scenario has " + edges);
        }
        long size = InputDomain.of(scenario).size();
        String path = scenario.promise().kind() == spanwright.model.Promise.Kind.NONE ? "$.variables" : "$.promise";
        if (size > MAX_INPUTS) {
            throw new ScenarioException("too-large-to-simulate", path, "the simulation handles at most " + MAX_INPUTS
                    + " inputs; this domain has " + size + " (restrict it with a promise)");
        }
        double d = edges + 1.0;
        double work = size * d * d * d;
        if (work > MAX_WORK) {
            throw new ScenarioException("too-large-to-simulate", path, "too much work to simulate: " + size
                    + " inputs × (" + edges + " edges + 1)³ = " + (long) work + " > " + (long) MAX_WORK
                    + " (one dense decomposition per input); restrict the domain with a promise or use fewer edges");
        }
    }

    private static InputSimulation focus(Scenario scenario, SpectrumSolver solver, long mask) {
        Witness w = Analysis.detail(scenario, mask).witness;
        boolean inDomain = InputDomain.of(scenario).contains(mask);
        return solver.solve(mask, Analysis.presentEdges(scenario, mask), inDomain, w.connected, w.value, true);
    }

    /**
     * max over phases θ &gt; 0 of |0⟩'s measure of weight(≤ θ) / ((θ²/4)(1 + α²C)): at most 1 by the
     * effective spectral gap lemma. The supremum over Θ is reached at a phase of the measure,
     * because the weight jumps only there and the bound grows with Θ.
     */
    static double lemmaRatio(InputSimulation r, double alpha2) {
        double[] p = r.measurePhases();
        double[] w = r.measureWeights();
        double cumulative = 0;
        double worst = 0;
        double scale = 1 + alpha2 * r.witnessSize;
        for (int k = 0; k < p.length; k++) {
            cumulative += w[k];
            if (p[k] > SpectrumSolver.ZERO_PHASE) {
                worst = Math.max(worst, cumulative / (p[k] * p[k] / 4 * scale));
            }
        }
        return worst;
    }

    private static SimulationResult.Textbook textbook(List<InputSimulation> rows, double wPlus, double wMinus,
            double alpha2) {
        double theta = 1 / (2 * Math.sqrt(wPlus * wMinus));
        int b = 1;
        while (b < 62 && 2 * Math.PI / (double) (1L << b) > theta) {
            b++;
        }
        double minPos = Double.POSITIVE_INFINITY;
        double maxNeg = Double.NEGATIVE_INFINITY;
        for (InputSimulation r : rows) {
            double p = r.acceptance(b);
            if (r.positive) {
                minPos = Math.min(minPos, p);
            } else {
                maxNeg = Math.max(maxNeg, p);
            }
        }
        return new SimulationResult.Textbook(theta, b, PhaseEstimation.controlledUses(b), minPos, maxNeg,
                theta * theta / 4 * (1 + alpha2 * wMinus), alpha2 / (alpha2 + wPlus));
    }

    private static int[] edgeIndices(SpanProgramUnitary u) {
        int[] idx = new int[u.edgeCount()];
        for (int j = 0; j < idx.length; j++) {
            idx[j] = u.edgeIndex(j);
        }
        return idx;
    }

    /** ⌈log₂ n⌉ for n ≥ 1. */
    static int ceilLog2(int n) {
        int b = 0;
        while ((1L << b) < n) {
            b++;
        }
        return b;
    }
}
