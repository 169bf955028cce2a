package spanwright.bounds;

import java.util.LinkedHashMap;
import java.util.Map;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.analysis.StructuralAnalysis;
import spanwright.model.ScenarioException;
import spanwright.model.Scenario;
import spanwright.optimize.OptimizationResult;
import spanwright.optimize.OptimizerOptions;
import spanwright.optimize.WeightOptimizer;

/**
 * The one entry for lower bounds and classical measures, called by the command-line tool
 * ({@code bounds}) and the page (through {@code JsonFacade.bounds}): for the scenario's
 * {@code function} on its domain it computes ADV± ({@link GeneralAdversary}), ADV
 * ({@link PositiveAdversary}) and D, C₀, C₁, C, s, bs, deg ({@link ClassicalMeasures}), each
 * within the size limits of the caller, and compares them with the scenario's √(W₊W₋) from
 * {@link Analysis#run}:
 * <ul>
 *   <li>optimality gap = √(W₊W₋) / ADV± ≥ 1 (with the best certified lower bound on ADV±, see
 *       {@link #adversaryLower}) for every graph deciding f (every st-connectivity
 *       graph is a span program, whose witness size is at least ADV±: Reichardt, SODA 2011,
 *       arXiv:1005.1601); a certified ADV± above √(W₊W₋) by more than {@link #GAP_TOLERANCE} is
 *       a bug and raises {@link BoundViolation};</li>
 *   <li>speed-up over classical = D / √(W₊W₋).</li>
 * </ul>
 * Both are ratios of asymptotic query complexities with constants not included
 * ({@link #CAUTION}). A measure that is not computed is null in the report with a reason.
 */
public final class Bounds {
    /** Relative tolerance of the checks √(W₊W₋) ≥ ADV± and ADV ≤ ADV±. */
    public static final double GAP_TOLERANCE = 1e-6;
    /** Time budget for the weight optimiser run that the comparison includes. */
    public static final long OPTIMISER_MILLIS = 20_000;

    /** The caution shown wherever these bounds are shown. */
    public static final String CAUTION = "asymptotic query-complexity bounds for the span-program algorithm "
            + "(weight = resistance, each edge once); constants not included; not run-time estimates for real hardware";

    private Bounds() {}

    /** Size limits of a caller: how many variables each computation accepts. Immutable. */
    public static final class Limits {
        /** The page: ADV± by SDP up to 6 variables, ADV up to 8, classical measures up to 10. */
        public static final Limits PAGE = new Limits("the page", GeneralAdversary.PAGE_MAX_VARIABLES, 8, 10);
        /** The command-line tool: ADV± up to 8, ADV up to 10, classical measures up to 12. */
        public static final Limits CLI = new Limits("the command-line tool", GeneralAdversary.CLI_MAX_VARIABLES,
                PositiveAdversary.MAX_VARIABLES, ClassicalMeasures.MAX_VARIABLES);

        private final String where;
        private final int general;
        private final int positive;
        private final int classical;

        public Limits(String where, int general, int positive, int classical) {
            this.where = where;
            this.general = Math.min(general, GeneralAdversary.CLI_MAX_VARIABLES);
            this.positive = Math.min(positive, PositiveAdversary.MAX_VARIABLES);
            this.classical = Math.min(classical, ClassicalMeasures.MAX_VARIABLES);
        }

        /** Who the limits are for ("the page"), for messages. */
        public String where() {
            return where;
        }

        public int general() {
            return general;
        }

        public int positive() {
            return positive;
        }

        public int classical() {
            return classical;
        }
    }

    /** A computed bound contradicts a theorem: a bug in Spanwright, reported loudly. */
    public static final class BoundViolation extends IllegalStateException {
        private static final long serialVersionUID = 1L;

        BoundViolation(String message) {
            super(message);
        }
    }

    /**
     * Computes everything the limits allow for the scenario's function on its domain.
     *
     * @throws ScenarioException {@code no-function} when the scenario has no {@code function}
     *     (and as {@link spanwright.io.ScenarioReader}/{@link Analysis} for bad scenarios)
     * @throws BoundViolation when √(W₊W₋) &lt; ADV±·(1 − tol) or ADV &gt; ADV±·(1 + tol)
     */
    public static BoundsReport compute(Scenario scenario, Limits limits) {
        if (scenario.function() == null) {
            throw new ScenarioException("no-function", "$.function",
                    "lower bounds and classical measures need the function the graph should decide: add \"function\" to the scenario");
        }
        int n = scenario.variableCount();
        Map<String, String> reasons = new LinkedHashMap<>();
        // beyond enumeration (a host graph with one variable per edge) this graph's side comes from
        // the structural engine; the lower bounds of f then need more variables than their limits
        boolean structure = Analysis.choose(scenario, Analysis.Method.AUTO).method() == Analysis.Method.STRUCTURE;
        AnalysisResult analysis = structure ? null : Analysis.run(scenario);
        BoundsReport.Measured measured = structure ? measured(StructuralAnalysis.run(scenario)) : measured(analysis);
        int widest = Math.max(limits.general(), Math.max(limits.positive(), limits.classical()));
        TargetFunction f = n <= widest ? TargetFunction.of(scenario) : null;

        GeneralAdversary general = null;
        if (n > limits.general()) {
            reasons.put("general", tooMany(n, limits.general(), Limits.CLI.general(), "the general adversary SDP", limits));
        } else {
            general = GeneralAdversary.compute(f);
        }
        PositiveAdversary positive = null;
        if (n > limits.positive()) {
            reasons.put("positive", tooMany(n, limits.positive(), Limits.CLI.positive(), "the positive adversary", limits));
        } else {
            positive = PositiveAdversary.compute(f,
                    // the SDP only where the caller affords ADV±'s SDP too (same order of cost)
                    limits == Limits.PAGE ? PositiveAdversary.PAGE_SDP_MAX_VARIABLES
                            : Math.min(limits.general(), PositiveAdversary.SDP_MAX_VARIABLES));
        }
        ClassicalMeasures classical = null;
        if (n > limits.classical()) {
            reasons.put("classical", tooMany(n, limits.classical(), Limits.CLI.classical(), "the classical measures", limits));
        } else {
            classical = ClassicalMeasures.compute(f);
            if (!classical.hasDegree()) {
                reasons.put("deg", "the exact degree of a promise (partial) function depends on how it is "
                        + "extended outside the domain; computed for total functions only");
            }
        }

        double complexity = measured.complexity;
        boolean decides = Boolean.TRUE.equals(measured.correct);
        if (Double.isNaN(complexity)) {
            reasons.put("complexity", measured.undefined);
        }
        double gap = Double.NaN;
        double speedup = Double.NaN;
        if (!decides) {
            String why = measured.correct == null
                    ? "the reduction was not checked (" + measured.method + "), so sqrt(W+ W-) is not known to bound f"
                    : "the graph does not decide the function (" + measured.counterexamples
                            + " counterexample(s)), so sqrt(W+ W-) is not a bound for it";
            reasons.put("optimalityGap", why);
            reasons.put("speedup", why);
        } else if (Double.isNaN(complexity)) {
            reasons.put("optimalityGap", reasons.get("complexity"));
            reasons.put("speedup", reasons.get("complexity"));
        } else {
            if (general == null) {
                reasons.put("optimalityGap", "ADV± was not computed: " + reasons.get("general"));
            } else if (!(general.lower() > 0)) {
                reasons.put("optimalityGap", "ADV± is 0 (the function is constant on the domain)");
            } else {
                gap = optimalityGap(complexity, adversaryLower(general, positive));
            }
            if (classical == null) {
                reasons.put("speedup", "D was not computed: " + reasons.get("classical"));
            } else {
                speedup = classical.decisionTreeDepth() / complexity;
            }
        }
        if (general != null && positive != null) {
            checkOrder(positive.lower(), general.upper());
        }
        // The same graph with optimised weights: how much of the gap is the weights' fault.
        OptimizationResult opt = null;
        double optGap = Double.NaN;
        if (decides && !Double.isNaN(complexity)) {
            opt = WeightOptimizer.optimize(scenario, OptimizerOptions.defaults().withMaxMillis(OPTIMISER_MILLIS), null);
            if (general != null && general.lower() > 0) {
                optGap = optimalityGap(opt.complexity, adversaryLower(general, positive));
            }
        } else {
            reasons.put("optimisedComplexity", reasons.containsKey("optimalityGap") ? reasons.get("optimalityGap")
                    : "sqrt(W+ W-) is undefined");
        }
        BoundsReport report = new BoundsReport(scenario, limits, f, analysis, measured, general, positive, classical,
                gap, speedup, reasons);
        report.setOptimised(opt, optGap);
        return report;
    }

    private static final String NO_POSITIVE = "no input of the domain connects s and t, so W+ and sqrt(W+ W-) are undefined";
    private static final String NO_NEGATIVE = "every input of the domain connects s and t, so W- and sqrt(W+ W-) are undefined";

    private static BoundsReport.Measured measured(AnalysisResult a) {
        double c = a.complexity();
        return new BoundsReport.Measured("enumerate", a.domainSize(), Long.toString(a.domainSize()), a.correct(),
                Long.toString(a.counterexampleCount()), c, true,
                Double.isNaN(c) ? (a.positiveCount() == 0 ? NO_POSITIVE : NO_NEGATIVE) : null);
    }

    private static BoundsReport.Measured measured(StructuralAnalysis.Result r) {
        int n = r.scenario().variableCount();
        boolean noPositive = r.positive().worst() == null;
        boolean noNegative = r.negative().worst() == null;
        double c = noPositive || noNegative ? Double.NaN : r.complexity();
        java.math.BigInteger wrong = r.reduction().counterexamples();
        return new BoundsReport.Measured("structure", Math.pow(2, n), "2^" + n, r.reduction().correct(),
                wrong == null ? "0" : wrong.toString(), c, r.positive().exact() && r.negative().exact(),
                noPositive ? NO_POSITIVE : noNegative ? NO_NEGATIVE : null);
    }

    /**
     * The best certified lower bound on ADV±: the SDP's primal value, or ADV's certified lower
     * bound when that is larger (ADV ≤ ADV±; the splitting method can stop with a looser primal).
     */
    static double adversaryLower(GeneralAdversary general, PositiveAdversary positive) {
        return positive == null ? general.lower() : Math.max(general.lower(), positive.lower());
    }

    /**
     * √(W₊W₋) / ADV± for a graph that decides f, failing loudly when the ratio is below 1 by more
     * than {@link #GAP_TOLERANCE}: every st-connectivity graph deciding f is a span program of
     * witness size √(W₊W₋) ≥ ADV±, so a smaller value means a bug in the analysis or the certificate.
     *
     * @throws BoundViolation when complexity &lt; adversaryLower·(1 − tol)
     */
    static double optimalityGap(double complexity, double adversaryLower) {
        if (complexity < adversaryLower * (1 - GAP_TOLERANCE)) {
            throw new BoundViolation("sqrt(W+ W-) = " + complexity + " is below the certified ADV± ≥ "
                    + adversaryLower + ": every st-connectivity graph deciding f has sqrt(W+ W-) ≥ ADV±, "
                    + "so the analysis or the adversary certificate is wrong");
        }
        return complexity / adversaryLower;
    }

    /**
     * Fails loudly when the certified ADV lower bound exceeds the certified ADV± upper bound:
     * ADV ≤ ADV± (Høyer, Lee &amp; Špalek, STOC 2007).
     */
    static void checkOrder(double positiveLower, double generalUpper) {
        if (positiveLower > generalUpper * (1 + GAP_TOLERANCE)) {
            throw new BoundViolation("the certified ADV ≥ " + positiveLower + " exceeds the certified ADV± ≤ "
                    + generalUpper + ", against ADV ≤ ADV± (Høyer, Lee & Špalek 2007)");
        }
    }

    private static String tooMany(int n, int limit, int cliLimit, String what, Limits limits) {
        return n + " variables is more than the limit of " + limit + " for " + what + " in " + limits.where()
                + (cliLimit > limit ? " (the command-line tool allows " + cliLimit + ")" : "");
    }
}
