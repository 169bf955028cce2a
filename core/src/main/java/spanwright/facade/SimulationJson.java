package spanwright.facade;

import spanwright.model.ScenarioException;
import spanwright.io.Json;
import spanwright.io.ScenarioReader;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.model.Inputs;
import spanwright.model.Scenario;
import spanwright.quantum.InputSimulation;
import spanwright.quantum.PhaseEstimation;
import spanwright.quantum.SimulationOptions;
import spanwright.quantum.SimulationResult;
import spanwright.quantum.SpectrumSolver;

/**
 * The JSON form of a simulation of the span-program algorithm ({@code simulate --json} and
 * {@link JsonFacade#simulate}), and the parsing of its options. Keys are documented in
 * docs/simulation.md; they may be added to, never renamed.
 */
public final class SimulationJson {
    /** The caution shown with every simulated count. */
    public static final String CAUTION = "simulated query counts of the span-program algorithm under our "
            + "normalisation (weight = resistance, each edge once) and the stated model assumptions; "
            + "not run-time estimates for real hardware";

    private SimulationJson() {}

    /**
     * Options {@code {"epsilon": 0.1, "alpha2": 2.5 | null, "input": "0110" | null}}, every key
     * optional; null or blank text gives the defaults. The input string is checked against the
     * scenario's variables.
     *
     * @throws ScenarioException code {@code option} or {@code input-string}, path {@code $options.…}
     */
    public static SimulationOptions options(String optionsJson, Scenario scenario) {
        SimulationOptions opt = SimulationOptions.defaults();
        for (Map.Entry<String, Object> e : ScenarioReader.options(optionsJson).entrySet()) {
            String path = "$options." + e.getKey();
            Object v = e.getValue();
            switch (e.getKey()) {
                case "epsilon":
                    opt = opt.withEpsilon(number(v, path));
                    break;
                case "alpha2":
                    opt = opt.withAlpha2(v == Json.NULL ? Double.NaN : number(v, path));
                    if (v != Json.NULL && !(opt.alpha2() > 0)) {
                        throw new ScenarioException("option", path, "alpha2 must be a finite number > 0, got "
                                + ScenarioReader.show(v));
                    }
                    break;
                case "input":
                    if (v == Json.NULL) {
                        break;
                    }
                    String text = ScenarioReader.string(v, path);
                    opt = scenario.variableCount() <= 63 ? opt.withFocus(focus(text, scenario, path))
                            : opt.withFocusBits(bits(text, scenario, path));
                    break;
                default:
                    throw ScenarioReader.unknownOption(e.getKey(), "epsilon, alpha2, input");
            }
        }
        return opt;
    }

    /**
     * The mask of an input string for this scenario.
     *
     * @throws ScenarioException code {@code input-string} at {@code path}
     */
    public static long focus(String input, Scenario scenario, String path) {
        long mask = Inputs.parse(input, scenario.variableCount());
        if (mask < 0) {
            throw notAnInput(input, scenario, path);
        }
        return mask;
    }

    /**
     * The values of an input string for this scenario, for any number of variables.
     *
     * @throws ScenarioException code {@code input-string} at {@code path}
     */
    public static boolean[] bits(String input, Scenario scenario, String path) {
        boolean[] x = Inputs.parseBits(input, scenario.variableCount());
        if (x == null) {
            throw notAnInput(input, scenario, path);
        }
        return x;
    }

    private static ScenarioException notAnInput(String input, Scenario scenario, String path) {
        int n = scenario.variableCount();
        List<String> names = scenario.variables();
        String shown = n <= 12 ? String.join(", ", names)
                : String.join(", ", names.subList(0, 6)) + ", …, " + names.get(n - 1);
        String got = input == null ? "nothing" : input.length() <= 80 ? "\"" + input + "\""
                : "a string of " + input.length() + " characters";
        return new ScenarioException("input-string", path, got + " is not an input: write " + n
                + " characters 0 or 1 (" + shown + ")");
    }

    private static double number(Object v, String path) {
        if (!(v instanceof Double)) {
            throw new ScenarioException("option", path, "expected a number, got " + ScenarioReader.show(v));
        }
        return (Double) v;
    }

    /** The result as an ordered JSON object. */
    public static Map<String, Object> result(SimulationResult r) {
        Scenario sc = r.scenario;
        int n = sc.variableCount();
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("title", sc.title());
        m.put("scope", r.scope);
        m.put("scopeReason", r.scopeReason == null ? Json.NULL : r.scopeReason);
        m.put("alpha2", r.alpha2);
        m.put("alpha2Source", r.alpha2Source);
        m.put("epsilon", r.epsilon);
        m.put("bits", r.bits == 0 ? Json.NULL : (Object) r.bits);
        m.put("bitsReason", r.bitsReason == null ? Json.NULL : r.bitsReason);
        m.put("queries", r.queries < 0 ? Json.NULL : (Object) r.queries);
        m.put("qubits", r.qubits < 0 ? Json.NULL : (Object) r.qubits);
        m.put("stateQubits", r.stateQubits);
        m.put("phaseQubits", r.bits == 0 ? Json.NULL : (Object) r.bits);
        if (r.repetition == null) {
            m.put("repetitions", Json.NULL);
        } else {
            Map<String, Object> rep = new LinkedHashMap<>();
            rep.put("runs", r.repetition.runs);
            rep.put("threshold", r.repetition.threshold);
            rep.put("positiveAcceptance", r.repetition.positiveAcceptance);
            rep.put("negativeAcceptance", r.repetition.negativeAcceptance);
            m.put("repetitions", rep);
        }
        m.put("repetitionReason", r.repetitionReason == null ? Json.NULL : r.repetitionReason);
        m.put("totalQueries", r.totalQueries < 0 ? Json.NULL : (Object) r.totalQueries);
        m.put("edges", r.edges);
        m.put("domainSize", r.domainSize < 0 ? Json.NULL : (Object) r.domainSize);
        m.put("reductionCorrect", r.reductionCorrect == null ? Json.NULL : r.reductionCorrect);

        Map<String, Object> pos = new LinkedHashMap<>();
        pos.put("count", r.positiveCount < 0 ? Json.NULL : (Object) r.positiveCount);
        pos.put("maxResistance", ResultJson.num(r.maxResistance));
        pos.put("minAcceptance", r.bits == 0 ? Json.NULL : ResultJson.num(r.minPositiveAcceptance()[r.bits - 1]));
        pos.put("worst", r.worstPositive < 0 ? Json.NULL : Inputs.format(r.worstPositive, n));
        m.put("positive", pos);
        Map<String, Object> neg = new LinkedHashMap<>();
        neg.put("count", r.negativeCount < 0 ? Json.NULL : (Object) r.negativeCount);
        neg.put("maxCapacitance", ResultJson.num(r.maxCapacitance));
        neg.put("maxAcceptance", r.bits == 0 ? Json.NULL : ResultJson.num(r.maxNegativeAcceptance()[r.bits - 1]));
        neg.put("worst", r.worstNegative < 0 ? Json.NULL : Inputs.format(r.worstNegative, n));
        neg.put("phaseGap", ResultJson.num(r.negativePhaseGap));
        m.put("negative", neg);
        m.put("complexity", ResultJson.num(r.complexity()));

        Map<String, Object> curves = new LinkedHashMap<>();
        List<Object> bits = new ArrayList<>();
        for (int b = 1; b <= PhaseEstimation.MAX_BITS; b++) {
            bits.add(b);
        }
        curves.put("bits", bits);
        curves.put("minPositive", list(r.minPositiveAcceptance()));
        curves.put("maxNegative", list(r.maxNegativeAcceptance()));
        m.put("curves", curves);

        if (r.textbook == null) {
            m.put("textbook", Json.NULL);
        } else {
            SimulationResult.Textbook t = r.textbook;
            Map<String, Object> tb = new LinkedHashMap<>();
            tb.put("theta", t.theta);
            tb.put("bits", t.bits);
            tb.put("queries", t.queries);
            tb.put("minPositiveAcceptance", ResultJson.num(t.minPositiveAcceptance));
            tb.put("maxNegativeAcceptance", ResultJson.num(t.maxNegativeAcceptance));
            tb.put("negativeWeightBound", t.negativeWeightBound);
            tb.put("positiveFloor", t.positiveFloor);
            m.put("textbook", tb);
        }
        Map<String, Object> checks = new LinkedHashMap<>();
        checks.put("orthogonalityDefect", r.orthogonalityDefect);
        checks.put("lemmaWorstRatio", ResultJson.num(r.lemmaWorstRatio));
        checks.put("zeroPhaseTolerance", SpectrumSolver.ZERO_PHASE);
        m.put("checks", checks);

        List<Object> rows = new ArrayList<>();
        for (InputSimulation x : r.inputs()) {
            Map<String, Object> row = row(x, r.bits);
            rows.add(row);
        }
        m.put("inputs", rows);
        m.put("focus", r.focus() == null ? Json.NULL : focus(r, r.focus()));
        m.put("assumptions", new ArrayList<Object>(spanwright.quantum.Simulation.ASSUMPTIONS));
        m.put("convention", ResultJson.CONVENTION);
        m.put("caution", CAUTION);
        return m;
    }

    private static Map<String, Object> row(InputSimulation x, int bits) {
        Map<String, Object> row = new LinkedHashMap<>();
        row.put("x", x.input);
        row.put("positive", x.positive);
        row.put("witnessSize", ResultJson.num(x.witnessSize));
        row.put("phaseZeroWeight", ResultJson.num(x.phaseZeroWeight));
        row.put("acceptance", bits == 0 ? Json.NULL : ResultJson.num(x.acceptance(bits)));
        row.put("phaseGap", ResultJson.num(x.phaseGap));
        row.put("acceptanceByBits", list(x.acceptanceByBits()));
        return row;
    }

    private static Map<String, Object> focus(SimulationResult r, InputSimulation x) {
        Map<String, Object> f = row(x, r.bits);
        f.put("inDomain", x.inDomain);
        f.put("converged", x.converged);
        List<Object> spectrum = new ArrayList<>();
        if (x.hasSpectrum()) {
            double[] p = x.spectrumPhases();
            double[] w = x.spectrumWeights();
            for (int k = 0; k < p.length; k++) {
                Map<String, Object> e = new LinkedHashMap<>();
                e.put("phase", p[k]);
                e.put("weight", w[k]);
                spectrum.add(e);
            }
        }
        f.put("spectrum", spectrum);
        double[] z = x.phaseZeroVector();
        Map<String, Object> zv = new LinkedHashMap<>();
        zv.put("start", z[0]);
        Map<String, Object> edges = new LinkedHashMap<>();
        for (int j = 0; j < r.edges; j++) {
            edges.put(r.scenario.edges().get(r.edgeIndex(j)).id(), z[j + 1]);
        }
        zv.put("edges", edges);
        f.put("phaseZeroVector", zv);
        return f;
    }

    private static List<Object> list(double[] v) {
        List<Object> l = new ArrayList<>(v.length);
        for (double d : v) {
            l.add(ResultJson.num(d));
        }
        return l;
    }
}
