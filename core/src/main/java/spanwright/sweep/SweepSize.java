package spanwright.sweep;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.analysis.Analysis;
import spanwright.analysis.CandidateInputs;
import spanwright.analysis.StructuralAnalysis;
import spanwright.analysis.Summary;
import spanwright.analysis.VariableSymmetry;
import spanwright.domain.InputDomain;
import spanwright.model.Deadline;
import spanwright.model.ScenarioException;
import spanwright.model.Edge;
import spanwright.model.Inputs;
import spanwright.model.Promise;
import spanwright.model.Scenario;
import spanwright.optimize.OptimizationResult;
import spanwright.optimize.OptimizerOptions;
import spanwright.optimize.WeightOptimizer;

/**
 * One size of a sweep, step by step, so that a caller can report progress, split the evaluation
 * over threads or machines, and resume: {@link #build} (build the instance, choose how its inputs
 * are evaluated), {@link #prepare} (check the reduction, choose the candidate inputs, optimise the
 * weights within the per-size budget, lower bounds where the size allows), {@link #evaluate} over
 * ranges of {@link #units()} (each range a {@link Summary}; summaries of adjacent ranges merge
 * exactly), and {@link #row} (the table row from the metadata and the merged summary).
 *
 * <p>The metadata are deterministic (no times): equal on every machine and in every shard for the
 * same family, size and options, so a merged sharded sweep is bit for bit the unsharded one. Times
 * and memory per step are kept apart in {@link #timing()}: {@code ms} measured, {@code bytes} an
 * estimate of the step's main arrays.
 *
 * <p><b>Single-threaded, mutable</b>; no threads here (the page calls it from its worker). Bad
 * input never throws: a size that cannot be built becomes a row with status {@code error}, one
 * that is too large a row with status {@code skipped} and the reason.
 */
public final class SweepSize {
    /** Outcome of a size. */
    public enum Status { OK, SKIPPED, ERROR }

    private final Family family;
    private final int size;
    private final SweepOptions options;
    private final Map<String, Object> metadata = new LinkedHashMap<>();
    private final Map<String, Object> timing = new LinkedHashMap<>();
    private Status status = Status.OK;
    private FamilyInstance instance;
    private SweepOptions.Method method;
    private VariableSymmetry symmetry;
    private String symmetryDetail;
    private double domainSize;
    private CandidateInputs candidates;
    private Scenario scenario;
    private boolean prepared;
    /** The per-size time budgets (--seconds): a fresh deadline for a number of milliseconds. */
    private final java.util.function.LongFunction<Deadline> budget;

    private SweepSize(Family family, int size, SweepOptions options, java.util.function.LongFunction<Deadline> budget) {
        this.budget = budget;
        this.family = family;
        this.size = size;
        this.options = options;
    }

    /** Builds the instance of {@code size} and decides how its inputs will be evaluated. Cheap. */
    public static SweepSize build(Family family, int size, SweepOptions options) {
        return build(family, size, options, Deadline::after);
    }

    /** With the deadlines of the budgeted steps made by {@code budget} (tests expire them by checks). */
    static SweepSize build(Family family, int size, SweepOptions options, java.util.function.LongFunction<Deadline> budget) {
        SweepSize s = new SweepSize(family, size, options, budget);
        s.metadata.put("size", size);
        long t0 = System.nanoTime();
        try {
            s.instance = family.instance(size);
        } catch (ScenarioException e) {
            s.fail(e);
            s.step("build", t0, 0);
            return s;
        }
        Scenario sc = s.instance.scenario();
        s.scenario = sc;
        int n = sc.variableCount();
        s.metadata.put("variables", n);
        s.metadata.put("vertices", sc.vertexCount());
        s.metadata.put("edges", sc.edges().size());
        s.metadata.put("construction", s.instance.construction());
        s.metadata.put("builder", new LinkedHashMap<>(s.instance.stats()));
        s.metadata.put("function", sc.functionText());
        s.metadata.put("promise", sc.promise().describe(sc.variables()));
        if (sc.promise().kind() == Promise.Kind.NONE) {
            s.domainSize = Math.pow(2, n);
        } else {
            s.domainSize = InputDomain.of(sc).size();
        }
        s.metadata.put("domainSize", s.domainSize);
        s.decide();
        s.step("build", t0, 64L * sc.vertexCount() + 96L * sc.edges().size());
        return s;
    }

    private void fail(ScenarioException e) {
        status = Status.ERROR;
        metadata.put("status", "error");
        Map<String, Object> err = new LinkedHashMap<>();
        err.put("code", e.code());
        err.put("message", e.getMessage());
        err.put("path", e.path());
        metadata.put("error", err);
    }

    private void skip(String reason) {
        status = Status.SKIPPED;
        metadata.put("status", "skipped");
        metadata.put("reason", reason);
    }

    private void step(String name, long t0, long bytes) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("ms", (System.nanoTime() - t0) / 1e6);
        m.put("bytes", bytes);
        timing.put(name, m);
    }

    private static String power(double d) {
        double e = Math.log(d) / Math.log(2);
        return Math.abs(e - Math.rint(e)) < 1e-9 ? "2^" + (long) Math.rint(e) : Long.toString((long) d);
    }

    /** Chooses the evaluation method (see {@link SweepOptions.Method#AUTO}). */
    private void decide() {
        Scenario sc = scenario;
        int n = sc.variableCount();
        VariableSymmetry sym = instance.symmetry();
        if (sym != null) {
            CandidateInputs.SymmetryCheck check = CandidateInputs.check(sc, sym, options.seed);
            metadata.put("symmetry", sym.describe());
            metadata.put("symmetryCheck", (check.holds ? "holds: " : "fails: ") + check.detail);
            if (check.holds) {
                symmetry = sym;
                symmetryDetail = check.detail;
            }
        }
        boolean unate = false;
        for (int o : CandidateInputs.occurrences(sc)) {
            unate |= o != 3;
        }
        boolean orbitsFit = symmetry != null && symmetry.orbitCount() <= VariableSymmetry.MAX_ORBITS;
        SweepOptions.Method m = options.method;
        String why = null;
        boolean structureFits = StructuralAnalysis.refusal(sc) == null && sc.promise().kind() == Promise.Kind.NONE;
        boolean hostBeyond = structureFits && StructuralAnalysis.isHostForm(sc)
                && n > Analysis.AUTO_ENUMERATION_VARIABLES;
        if (m == SweepOptions.Method.AUTO) {
            if (orbitsFit && domainSize > Math.pow(2, SweepOptions.EVERY_INPUT_BITS)) {
                m = SweepOptions.Method.ORBITS;
            } else if (domainSize <= Math.pow(2, SweepOptions.EVERY_INPUT_BITS)) {
                m = SweepOptions.Method.EVERY;
            } else if (hostBeyond) {
                m = SweepOptions.Method.STRUCTURE;
            } else if (unate && domainSize <= SweepOptions.UNDOMINATED_MAX_INPUTS) {
                m = SweepOptions.Method.UNDOMINATED;
            } else if (domainSize <= options.maxInputs) {
                m = SweepOptions.Method.EVERY;
            } else if (structureFits) {
                m = SweepOptions.Method.STRUCTURE;
            } else {
                why = power(domainSize) + " inputs: more than the every-input limit of " + power(options.maxInputs)
                        + (symmetry == null ? ", and no symmetry is known that would reduce them" : "")
                        + (unate ? "" : "; no variable has a single polarity, so Rayleigh dominance does not apply")
                        + " (raise --max-inputs and shard the sweep to go on)";
            }
        } else if (m == SweepOptions.Method.EVERY && domainSize > options.maxInputs) {
            why = power(domainSize) + " inputs: more than the every-input limit of " + power(options.maxInputs);
        } else if (m == SweepOptions.Method.UNDOMINATED && domainSize > SweepOptions.UNDOMINATED_MAX_INPUTS) {
            why = power(domainSize) + " inputs: Rayleigh dominance tests every input's connectivity, at most "
                    + power(SweepOptions.UNDOMINATED_MAX_INPUTS);
        } else if (m == SweepOptions.Method.STRUCTURE && !structureFits) {
            why = "the structural engine does not run under a promise in a sweep (use every, undominated or orbits)";
        } else if (m == SweepOptions.Method.ORBITS && !orbitsFit) {
            why = symmetry == null ? (sym == null ? "the family declares no symmetry" : "the declared symmetry "
                    + metadata.get("symmetryCheck")) : "more than " + VariableSymmetry.MAX_ORBITS + " orbits";
        }
        if (why != null) {
            skip(why);
            return;
        }
        method = m;
        metadata.put("method", m.key);
    }

    public Status status() {
        return status;
    }

    public int size() {
        return size;
    }

    /** The chosen method (null when skipped or failed). */
    public SweepOptions.Method method() {
        return method;
    }

    /** The instance's number of variables (0 when it could not be built). */
    public int variables() {
        return scenario == null ? 0 : scenario.variableCount();
    }

    /** Size of the domain (exact below 2^53). */
    public double domainSize() {
        return domainSize;
    }

    /**
     * Checks the reduction, chooses candidates, optimises, computes lower bounds. Cost: that of the
     * method's set-up plus the optimiser's budget plus the bounds.
     */
    public void prepare() {
        if (prepared) {
            return;
        }
        prepared = true;
        if (status != Status.OK) {
            return;
        }
        Scenario sc = scenario;
        // candidates (their set-up checks the reduction on every input or orbit)
        long t0 = System.nanoTime();
        if (method == SweepOptions.Method.UNDOMINATED) {
            candidates = CandidateInputs.undominated(sc);
        } else if (method == SweepOptions.Method.ORBITS) {
            try {
                candidates = CandidateInputs.orbits(sc, symmetry, symmetryDetail);
            } catch (IllegalStateException e) {
                skip(e.getMessage());
                return;
            }
        }
        if (method == SweepOptions.Method.STRUCTURE) {
            // the diagram check gets the per-size time (--seconds) of its own, like the optimiser
            StructuralAnalysis.Reduction red = StructuralAnalysis.reduction(sc, StructuralAnalysis.DEFAULT_DIAGRAM_NODES,
                    budget.apply(options.optimizeMillis));
            Map<String, Object> rm = new LinkedHashMap<>();
            rm.put("checked", red.correct() != null);
            rm.put("correct", red.correct());
            rm.put("counterexampleCount", red.counterexamples() == null ? null : (Object) count(red.counterexamples()));
            rm.put("counterexamples", new ArrayList<Object>(red.firstCounterexamples()));
            rm.put("how", red.method());
            metadata.put("reduction", rm);
            metadata.put("explanation", "No input was listed: the structural engine computes W+ and W- exactly. On a"
                    + " host graph (one positive literal per edge) Rayleigh monotonicity puts W+ on a minimal positive"
                    + " input, a simple s-t path (R = sum of its weights), and W- on a maximal negative input, all"
                    + " edges but an s-t bond (C = sum of 1/w over the bond); the heaviest path and bond come from"
                    + " frontier search or dynamic programming over vertex subsets. Other instances: branch and bound"
                    + " with Rayleigh bounds. The reduction is checked by decision diagrams (or holds by"
                    + " construction).");
            step("check", t0, 0);
        } else if (candidates != null) {
            metadata.put("explanation", candidates.explanation());
            Map<String, Object> in = new LinkedHashMap<>();
            in.put("tested", candidates.tested());
            in.put("candidates", candidates.size());
            in.put("positive", candidates.representedPositive());
            in.put("negative", candidates.representedNegative());
            metadata.put("inputs", in);
            Map<String, Object> red = new LinkedHashMap<>();
            red.put("checked", candidates.checked());
            red.put("correct", candidates.checked() ? (Object) (candidates.counterexampleCount() == 0) : null);
            red.put("counterexampleCount", candidates.counterexampleCount());
            red.put("counterexamples", inputStrings(candidates.counterexamples(), sc.variableCount()));
            metadata.put("reduction", red);
            step("check", t0, (method == SweepOptions.Method.UNDOMINATED ? (long) domainSize : 40L * candidates.tested())
                    + 40L * candidates.size());
        } else {
            metadata.put("explanation", "Every one of the " + (long) domainSize + " inputs of the domain was evaluated"
                    + " (connectivity, f and the witness size), so the maxima are exact.");
        }
        optimise();
        if (method == SweepOptions.Method.STRUCTURE) {
            long ts = System.nanoTime();
            structural();
            step("structure", ts, 0);
        }
        metadata.put("fingerprint", Long.toHexString(Summary.fingerprint(scenario)));
        long tb = System.nanoTime();
        metadata.put("bounds", LowerBounds.compute(scenario, options));
        step("bounds", tb, 0);
    }

    private void optimise() {
        Map<String, Object> o = new LinkedHashMap<>();
        metadata.put("optimizer", o);
        long units = method == SweepOptions.Method.STRUCTURE ? 0 : candidates == null ? (long) domainSize
                : candidates.size();
        if (options.optimizeIterations == 0) {
            o.put("status", "skipped");
            o.put("reason", "no optimiser budget (0 iterations): the builder's weights are kept");
            return;
        }
        if (units > SweepOptions.OPTIMIZER_MAX_INPUTS) {
            o.put("status", "skipped");
            o.put("reason", units + (candidates == null ? " inputs" : " candidate inputs") + ": more than the optimiser's"
                    + " limit of 2^20; the builder's weights are kept");
            return;
        }
        long t0 = System.nanoTime();
        Scenario sc = scenario;
        if (method == SweepOptions.Method.ORBITS) {
            sc = tieByOrbit(sc);
        }
        OptimizerOptions opt = OptimizerOptions.defaults().withMaxIterations(options.optimizeIterations)
                .withMaxMillis(options.optimizeMillis).withStarts(options.starts).withSeed(options.seed)
                .withMode(method == SweepOptions.Method.STRUCTURE ? OptimizerOptions.Mode.WORKING_SET
                        : OptimizerOptions.Mode.DOMAIN);
        long deadline = System.currentTimeMillis() + options.optimizeMillis;
        OptimizationResult r = WeightOptimizer.optimize(sc, candidates, opt, null, budget.apply(options.optimizeMillis));
        boolean timeUp = (System.currentTimeMillis() >= deadline || r.cut != null)
                && r.status == OptimizationResult.Status.BUDGET_REACHED && r.iterations < options.optimizeIterations;
        o.put("status", timeUp ? "time-budget-reached" : r.status.name().toLowerCase().replace('_', '-'));
        o.put("iterations", r.iterations);
        o.put("evaluations", r.evaluations);
        o.put("starts", r.starts);
        o.put("initialComplexity", r.initialComplexity);
        o.put("complexity", r.complexity);
        if (!r.exact) {
            o.put("exact", false);
            o.put("complexityUpper", r.complexityUpper());
        }
        if (r.cut != null) {
            o.put("cut", r.cut);
        }
        o.put("weightGroups", groups(sc));
        if (r.method.equals("working-set")) {
            o.put("mode", "working set");
            o.put("rounds", r.rounds);
            o.put("workingSet", r.workingSetPositive + r.workingSetNegative);
        }
        if (method == SweepOptions.Method.ORBITS) {
            o.put("tied", "weights tied by edge orbit, so that they stay invariant under the symmetry (the bound is"
                    + " valid; an untied optimum could only be lower)");
        }
        if (timeUp) {
            o.put("note", "stopped by the time cap: these weights depend on the machine's speed");
        }
        scenario = r.scenario;
        step("optimize", t0, 16L * units + 64L * sc.edges().size());
    }

    /**
     * Exact W₊, W₋ of the final weights by the structural engine, into the metadata (key
     * {@code structure}), within the per-size time (--seconds) of its own; when that runs out the
     * sides are certified intervals and {@code cut} says what was cut.
     */
    private void structural() {
        StructuralAnalysis.Result r = StructuralAnalysis.worstCases(scenario, StructuralAnalysis.DEFAULT_STATES,
                StructuralAnalysis.DEFAULT_NODES, budget.apply(options.optimizeMillis));
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("exact", r.exact());
        m.put("positive", side(r.positive()));
        m.put("negative", side(r.negative()));
        m.put("complexity", Double.isNaN(r.complexity()) ? null : (Object) r.complexity());
        if (!r.exact()) {
            double up = r.complexityUpper();
            m.put("complexityUpper", Double.isNaN(up) || Double.isInfinite(up) ? null : (Object) up);
        }
        if (r.cut() != null) {
            m.put("cut", r.cut() + " (this size's numbers then depend on the machine's speed)");
        }
        metadata.put("structure", m);
    }

    private static Map<String, Object> side(StructuralAnalysis.Side s) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("count", s.extremeInputs() == null ? null : (Object) count(s.extremeInputs()));
        m.put("value", Double.isNaN(s.value()) ? null : (Object) s.value());
        m.put("upper", Double.isNaN(s.upper()) ? null : (Object) s.upper());
        m.put("worst", s.worst() == null ? null : s.worst().input);
        m.put("how", s.method());
        return m;
    }

    /** A count as a long when it fits, else as a double. */
    private static Object count(java.math.BigInteger b) {
        return b.bitLength() < 63 ? (Object) b.longValue() : (Object) b.doubleValue();
    }

    /** Number of weight groups the optimiser saw (group keys, or one per edge). */
    private static int groups(Scenario sc) {
        java.util.Set<String> g = new java.util.HashSet<>();
        for (int i = 0; i < sc.edges().size(); i++) {
            Edge e = sc.edges().get(i);
            g.add(e.group() != null ? "g:" + e.group() : "e:" + i);
        }
        return g.size();
    }

    /**
     * Ties weights so that they stay invariant under the symmetry: edges keep their group keys when
     * the scenario gives any; otherwise all edges form one group (every built-in symmetric family
     * acts transitively on its edges: leaves of a uniform tree, or the parallel edges of OR_n).
     */
    private static Scenario tieByOrbit(Scenario sc) {
        for (Edge e : sc.edges()) {
            if (e.group() != null) {
                return sc;
            }
        }
        List<Edge> out = new ArrayList<>();
        for (Edge e : sc.edges()) {
            out.add(new Edge(e.id(), e.u(), e.v(), e.when(), e.weight(), "orbit", e.locked()));
        }
        return sc.withEdges(out);
    }

    /** What {@link #evaluate} ranges over: the domain, or the candidate list. */
    public Summary.Coverage coverage() {
        return candidates == null ? Summary.Coverage.DOMAIN : Summary.Coverage.CANDIDATES;
    }

    /** Number of inputs to evaluate after {@link #prepare} (0 when skipped or failed). */
    public long units() {
        if (status != Status.OK || !prepared || method == SweepOptions.Method.STRUCTURE) {
            return 0;
        }
        return candidates == null ? (long) domainSize : candidates.size();
    }

    /**
     * Evaluates units [from, to) with the final weights. Requires {@link #prepare}. Null for the
     * structural method (its results are in the metadata; it has no units).
     */
    public Summary evaluate(long from, long to) {
        if (!prepared || status != Status.OK) {
            throw new IllegalStateException("size " + size + " is not prepared");
        }
        if (method == SweepOptions.Method.STRUCTURE) {
            return null;
        }
        return candidates == null ? Analysis.summarize(scenario, from, to)
                : Analysis.summarize(scenario, candidates, (int) from, (int) to);
    }

    /** Estimated bytes of one evaluation range (the network's matrix and the histograms). */
    public long evaluationBytes() {
        int v = scenario == null ? 0 : scenario.vertexCount();
        return 8L * v * v + 2L * 8 * 16385;
    }

    /** The deterministic facts of this size so far (a live map: read it after the steps you need). */
    public Map<String, Object> metadata() {
        return metadata;
    }

    /** Times (ms, measured) and memory (bytes, estimated) per step; callers may add keys. */
    public Map<String, Object> timing() {
        return timing;
    }

    /** The instance (null when it could not be built). */
    public FamilyInstance instance() {
        return instance;
    }

    /** The scenario with the final (optimised) weights. */
    public Scenario scenario() {
        return scenario;
    }

    static List<Object> inputStrings(long[] masks, int n) {
        List<Object> l = new ArrayList<>();
        for (long x : masks) {
            l.add(Inputs.format(x, n));
        }
        return l;
    }

    // ------------------------------------------------------------------ the row

    /**
     * The table row of a size: its metadata with the results of the merged summary (null when
     * the size was skipped or failed). Deterministic; the same for any split of the evaluation.
     */
    public static Map<String, Object> row(Map<String, Object> metadata, Summary summary) {
        Map<String, Object> row = new LinkedHashMap<>();
        row.put("size", metadata.get("size"));
        Object status = metadata.get("status");
        row.put("status", status == null ? "ok" : status);
        for (Map.Entry<String, Object> e : metadata.entrySet()) {
            if (!e.getKey().equals("size") && !e.getKey().equals("status")) {
                row.put(e.getKey(), e.getValue());
            }
        }
        if (summary == null) {
            Object st = metadata.get("structure");
            if (st instanceof Map) { // the structural method: exact values without listed inputs
                Map<?, ?> sm = (Map<?, ?>) st;
                Map<?, ?> sp = (Map<?, ?>) sm.get("positive");
                Map<?, ?> sn = (Map<?, ?>) sm.get("negative");
                row.put("evaluated", 0L);
                Map<String, Object> pos = new LinkedHashMap<>();
                pos.put("count", sp.get("count"));
                pos.put("maxResistance", sp.get("value"));
                pos.put("worst", sp.get("worst"));
                row.put("positive", pos);
                Map<String, Object> neg = new LinkedHashMap<>();
                neg.put("count", sn.get("count"));
                neg.put("maxCapacitance", sn.get("value"));
                neg.put("worst", sn.get("worst"));
                row.put("negative", neg);
                row.put("complexity", sm.get("complexity"));
                if (Boolean.FALSE.equals(sm.get("exact"))) {
                    row.put("exact", false);
                    row.put("complexityUpper", sm.get("complexityUpper"));
                }
                return row;
            }
            row.put("complexity", null);
            return row;
        }
        int n = summary.variableCount();
        boolean candidateMode = summary.coverage() == Summary.Coverage.CANDIDATES;
        if (!candidateMode) {
            Map<String, Object> red = new LinkedHashMap<>();
            red.put("checked", summary.checked());
            red.put("correct", summary.checked() ? (Object) (summary.counterexampleCount() == 0) : null);
            red.put("counterexampleCount", summary.counterexampleCount());
            red.put("counterexamples", inputStrings(summary.counterexamples(), n));
            row.put("reduction", red);
        }
        row.put("evaluated", summary.evaluated());
        Map<String, Object> pos = new LinkedHashMap<>();
        Map<?, ?> inputs = (Map<?, ?>) metadata.get("inputs");
        pos.put("count", candidateMode ? inputs.get("positive") : (Object) summary.positiveCount());
        pos.put("maxResistance", summary.maxResistance());
        pos.put("worst", summary.worstPositive() < 0 ? null : Inputs.format(summary.worstPositive(), n));
        row.put("positive", pos);
        Map<String, Object> neg = new LinkedHashMap<>();
        neg.put("count", candidateMode ? inputs.get("negative") : (Object) summary.negativeCount());
        neg.put("maxCapacitance", summary.maxCapacitance());
        neg.put("worst", summary.worstNegative() < 0 ? null : Inputs.format(summary.worstNegative(), n));
        row.put("negative", neg);
        row.put("complexity", summary.complexity());
        if (!candidateMode) {
            List<Object> bins = new ArrayList<>();
            int[] keys = summary.histogramKeys();
            long[] hp = summary.histogramCounts(true);
            long[] hn = summary.histogramCounts(false);
            for (int i = 0; i < keys.length; i++) {
                Map<String, Object> b = new LinkedHashMap<>();
                b.put("low", Summary.binLow(keys[i]));
                b.put("high", Summary.binHigh(keys[i]));
                b.put("positive", hp[i]);
                b.put("negative", hn[i]);
                bins.add(b);
            }
            row.put("histogram", bins);
        }
        return row;
    }
}
