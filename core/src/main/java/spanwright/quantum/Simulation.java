package spanwright.quantum;

import java.util.ArrayList;
import java.util.List;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.domain.InputDomain;
import spanwright.electric.Witness;
import spanwright.model.ScenarioException;
import spanwright.model.Promise;
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
    /** Time per side for the structural W₊ that scales a one-input simulation (α² not given). */
    public static final double ALPHA_SECONDS = 5;

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

    /** Progress of a simulation: inputs simulated so far out of all to simulate. */
    public interface Listener {
        /** Called after each simulated input (and once before the first, with done = 0). */
        void progress(long done, long total);
    }

    /**
     * Simulates the algorithm on every input of the domain; or, when an input is in focus and the
     * domain is beyond the whole-domain limits ({@link #MAX_INPUTS}, {@link #MAX_WORK}), on that
     * input alone (scope {@link SimulationResult#INPUT}, see {@link #runInput}).
     *
     * @throws ScenarioException {@code too-large-to-simulate} beyond the size guard; {@code option}
     *         for ε outside (0, 1) or α² not finite and &gt; 0
     */
    public static SimulationResult run(Scenario scenario, SimulationOptions options) {
        return run(scenario, options, null);
    }

    /** As {@link #run(Scenario, SimulationOptions)}, reporting progress to {@code listener} (may be null). */
    public static SimulationResult run(Scenario scenario, SimulationOptions options, Listener listener) {
        checkOptions(options);
        double epsilon = options.epsilon();
        int m = edgeCount(scenario);
        checkEdges(m, options.hasFocus());
        String refusal = wholeDomainRefusal(scenario, m, !options.hasFocus());
        if (refusal != null) {
            if (options.hasFocus()) {
                return runInput(scenario, options, refusal + ": only the input in focus is simulated. Bits, queries"
                        + " and repetitions for the whole domain need a smaller domain (restrict it with a promise)");
            }
            throw new ScenarioException("too-large-to-simulate", domainPath(scenario), refusal
                    + "; restrict the domain with a promise, or simulate one input (put it in focus in the page;"
                    + " simulate --input BITS on the command line), which works at any domain size");
        }
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
        if (listener != null) {
            listener.progress(0, size);
        }
        for (int i = 0; i < size; i++) {
            if (listener != null && i > 0) {
                listener.progress(i, size);
            }
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
                minPos, maxNeg, rows, focus, SimulationResult.DOMAIN, null, size);
    }

    private static void checkOptions(SimulationOptions options) {
        double epsilon = options.epsilon();
        if (!(epsilon > 0 && epsilon < 1)) {
            throw new ScenarioException("option", "$options.epsilon",
                    "epsilon must be a number strictly between 0 and 1, got " + epsilon);
        }
        if (!Double.isNaN(options.alpha2()) && (!(options.alpha2() > 0) || Double.isInfinite(options.alpha2()))) {
            throw new ScenarioException("option", "$options.alpha2",
                    "alpha2 must be a finite number > 0, got " + options.alpha2());
        }
    }

    private static int edgeCount(Scenario scenario) {
        int m = 0;
        for (int i = 0; i < scenario.edges().size(); i++) {
            if (!scenario.edges().get(i).isSelfLoop()) {
                m++;
            }
        }
        return m;
    }

    /**
     * Refuses a graph beyond {@link #MAX_EDGES}, for one input as for the whole domain: the state
     * register is small (⌈log₂(|E|+1)⌉ qubits) but its exact simulation is dense (|E|+1)² matrices.
     */
    private static void checkEdges(int edges, boolean oneInput) {
        if (edges > MAX_EDGES) {
            throw new ScenarioException("too-large-to-simulate", "$.graph.edges", "the simulation handles at most "
                    + MAX_EDGES + " edges" + (oneInput ? ", even for one input" : "") + ": the state register is only "
                    + ceilLog2(edges + 1) + " qubits (ceil log2(|E|+1)), but simulating it exactly takes dense"
                    + " (|E|+1)×(|E|+1) matrices and one decomposition of that size per input; this graph has " + edges
                    + " edges. Try a smaller graph (fewer edges, e.g. a smaller size of the family), or look at the"
                    + " input's witness without simulating (the Summary and analyze --input BITS work at this size)");
        }
    }

    private static String domainPath(Scenario scenario) {
        return scenario.promise().kind() == Promise.Kind.NONE ? "$.variables" : "$.promise";
    }

    /**
     * The domain's size when it is known without listing it (the whole cube, a listed promise,
     * Hamming weights: a sum of binomial coefficients), saturating at {@link Long#MAX_VALUE}; −1 for
     * an expression promise.
     */
    static long domainSizeWithoutListing(Scenario scenario) {
        int n = scenario.variableCount();
        Promise p = scenario.promise();
        switch (p.kind()) {
            case NONE:
                return n >= 63 ? Long.MAX_VALUE : 1L << n;
            case INPUTS:
                return p.inputs().length;
            case WEIGHTS: {
                long total = 0;
                for (int k : p.weights()) {
                    long c = binomial(n, k);
                    total = c == Long.MAX_VALUE || total > Long.MAX_VALUE - c ? Long.MAX_VALUE : total + c;
                }
                return total;
            }
            default:
                return -1;
        }
    }

    /** C(n, k), saturating at {@link Long#MAX_VALUE}. */
    private static long binomial(int n, int k) {
        if (k < 0 || k > n) {
            return 0;
        }
        k = Math.min(k, n - k);
        long c = 1;
        for (int i = 1; i <= k; i++) {
            // c · (n − k + i) / i stays whole; refuse before overflow
            long f = n - k + i;
            if (c > Long.MAX_VALUE / f) {
                return Long.MAX_VALUE;
            }
            c = c * f / i;
        }
        return c;
    }

    /**
     * Why the whole domain cannot be simulated ({@link #MAX_INPUTS}, {@link #MAX_WORK}), or null when
     * it can. An expression promise's domain is counted by listing it only when {@code mayList} or
     * when its cube is within {@link #MAX_INPUTS} (a one-input run never lists a large domain).
     */
    static String wholeDomainRefusal(Scenario scenario, int edges, boolean mayList) {
        long size = domainSizeWithoutListing(scenario);
        int n = scenario.variableCount();
        if (size < 0) {
            if (!mayList && n > 16) {
                return "the promise's domain would have to be listed from 2^" + n + " inputs to be counted, and"
                        + " the simulation of every input handles at most " + MAX_INPUTS + " inputs";
            }
            size = InputDomain.of(scenario).size();
        }
        if (size > MAX_INPUTS) {
            return "the simulation of every input handles at most " + MAX_INPUTS + " inputs (one dense decomposition"
                    + " each); this domain has " + (size == Long.MAX_VALUE ? "more than 2^62" : String.valueOf(size));
        }
        double d = edges + 1.0;
        double work = size * d * d * d;
        if (work > MAX_WORK) {
            return "too much work to simulate every input: " + size + " inputs × (" + edges + " edges + 1)³ = "
                    + (long) work + " > " + (long) MAX_WORK + " (one dense decomposition per input; use fewer edges)";
        }
        return null;
    }

    /**
     * Simulates the focused input alone: its spectrum, phase-zero weight and acceptance for b = 1 …
     * 16, without listing the domain. α² is the given one, or else W₊ of the domain from the
     * structural analysis (the heaviest worst case, within {@link #ALPHA_SECONDS} per side; its
     * certified lower end when the budget runs out) or, where structure cannot run, from the
     * enumeration. Domain-wide fields are empty (bits 0 with {@code bitsReason} = the scope reason).
     * Cost: that analysis (none when α² is given), O(|V|(|E|+1)²) once and one dense SVD.
     */
    static SimulationResult runInput(Scenario scenario, SimulationOptions options, String reason) {
        int n = scenario.variableCount();
        boolean[] x = options.focusBits();
        long mask = options.focus();
        if (x == null) {
            x = new boolean[n];
            for (int i = 0; i < n; i++) {
                x[i] = spanwright.model.Inputs.bit(mask, i, n);
            }
        } else if (x.length != n) {
            throw new ScenarioException("input-string", "$options.input", "the input has " + x.length
                    + " values; this scenario has " + n + " variables");
        } else if (n <= 63) {
            mask = 0;
            for (boolean b : x) {
                mask = (mask << 1) | (b ? 1 : 0);
            }
        }
        int m = edgeCount(scenario);
        double alpha2 = options.alpha2();
        String source = "given";
        double wPlus = Double.NaN;
        double wMinus = Double.NaN;
        if (Double.isNaN(alpha2)) {
            if (spanwright.analysis.StructuralAnalysis.refusal(scenario) == null) {
                spanwright.analysis.StructuralAnalysis.Result r = spanwright.analysis.StructuralAnalysis.worstCases(
                        scenario, spanwright.analysis.StructuralAnalysis.DEFAULT_STATES,
                        spanwright.analysis.StructuralAnalysis.DEFAULT_NODES, ALPHA_SECONDS);
                if (r.positive().worst() != null) {
                    wPlus = r.positive().value();
                }
                if (r.negative().worst() != null) {
                    wMinus = r.negative().value();
                }
                source = r.positive().exact() ? "W+ by structure"
                        : "W+ at least, by structure (its search stopped at its time budget)";
            } else {
                AnalysisResult a = Analysis.run(scenario);
                wPlus = a.positiveCount() > 0 ? a.maxResistance() : Double.NaN;
                wMinus = a.negativeCount() > 0 ? a.maxCapacitance() : Double.NaN;
                source = "W+";
            }
            if (wPlus > 0) {
                alpha2 = wPlus;
            } else {
                alpha2 = 1;
                source = "1 (no positive inputs)";
            }
        }
        spanwright.analysis.InputDetail d = spanwright.analysis.StructuralAnalysis.detail(scenario, x);
        boolean inDomain = n <= 63 ? scenario.promise().allows(mask) : scenario.promise().kind() == Promise.Kind.NONE;
        SpanProgramUnitary unitary = new SpanProgramUnitary(scenario, alpha2);
        SpectrumSolver solver = new SpectrumSolver(unitary);
        InputSimulation focus = solver.solve(n <= 63 ? mask : -1, d.input, d.present, inDomain, d.witness.connected,
                d.witness.value, true);
        int nb = PhaseEstimation.MAX_BITS;
        double[] none = new double[nb];
        java.util.Arrays.fill(none, Double.NaN);
        return new SimulationResult(scenario, alpha2, source, -1, -1, wPlus, wMinus, null, options.epsilon(), 0,
                reason, -1, null, reason, -1, m, ceilLog2(m + 1), -1, unitary.orthogonalityDefect(), null, Double.NaN,
                Double.NaN, -1, -1, edgeIndices(unitary), none, none, List.of(), focus, SimulationResult.INPUT, reason,
                domainSizeWithoutListing(scenario) == Long.MAX_VALUE ? -1 : domainSizeWithoutListing(scenario));
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
