package spanwright.cli;

import java.io.PrintStream;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.io.Json;
import spanwright.facade.JsonFacade;
import spanwright.io.NumberText;
import spanwright.facade.ResultJson;
import spanwright.io.ScenarioReader;
import spanwright.model.Deadline;
import spanwright.model.Edge;
import spanwright.model.Inputs;
import spanwright.model.Scenario;
import spanwright.optimize.OptimizationResult;
import spanwright.optimize.OptimizerOptions;
import spanwright.optimize.WeightOptimizer;

/**
 * {@code optimize [FILE] [--starts K] [--seed S] [--iterations N] [--seconds T] [--tie literal]
 * [--mode auto|domain|working-set] [--json] [-o OUT.json]}: better edge weights with a certificate
 * (beyond enumeration, by a working set of worst inputs from the structural engine).
 */
final class OptimizeCommand {
    /** Accepted ranges: {@link OptimizerOptions}'s, shared with sweep and the JSON facade. */
    static final long MAX_STARTS = OptimizerOptions.MAX_STARTS;
    static final long MAX_ITERATIONS = OptimizerOptions.MAX_ITERATIONS;
    static final long MAX_SECONDS = OptimizerOptions.MAX_SECONDS;
    static final long MAX_SEED = OptimizerOptions.MAX_SEED;

    private OptimizeCommand() {}

    static int run(List<String> args, PrintStream out, PrintStream err) {
        String file = null;
        String output = null;
        boolean json = false;
        boolean quiet = false;
        Map<String, Object> options = new LinkedHashMap<>();
        for (int i = 0; i < args.size(); i++) {
            String a = args.get(i);
            switch (a) {
                case "--json":
                    json = true;
                    break;
                case "--quiet":
                    quiet = true;
                    break;
                case "-o":
                    output = value(args, ++i, a);
                    break;
                case "--tie":
                    options.put("tie", value(args, ++i, a));
                    break;
                case "--mode":
                    options.put("mode", value(args, ++i, a));
                    break;
                case "--starts":
                    options.put("starts", (double) Main.whole("optimize", a, value(args, ++i, a), 1, MAX_STARTS));
                    break;
                case "--seed":
                    options.put("seed", (double) Main.whole("optimize", a, value(args, ++i, a), 1, MAX_SEED));
                    break;
                case "--iterations":
                    options.put("iterations", (double) Main.whole("optimize", a, value(args, ++i, a), 1, MAX_ITERATIONS));
                    break;
                case "--seconds":
                    options.put("seconds", (double) Main.whole("optimize", a, value(args, ++i, a), 1, MAX_SECONDS));
                    break;
                default:
                    if (a.startsWith("-")) {
                        throw new Main.UsageException("optimize: unknown option " + a);
                    }
                    if (file != null) {
                        throw new Main.UsageException("optimize: one FILE at most");
                    }
                    file = a;
            }
        }
        OutputFiles.refuseClashes("optimize", java.util.Arrays.asList(file), java.util.Arrays.asList(output));
        OptimizerOptions opt = JsonFacade.optimizerOptions(Json.write(options));
        // the budget counts from here: reading the scenario is part of the command's time
        Deadline deadline = Deadline.after(opt.maxMillis());
        String text = Main.readScenarioText(file);
        Scenario sc = ScenarioReader.read(text);
        OptimizationResult r;
        String standing;
        try (Progress progress = Progress.start("optimize", err, quiet)) {
            Object k = options.get("starts");
            Object t = options.get("seconds");
            String of = k == null ? "" : " of " + Math.round((Double) k);
            progress.phase("optimising edge weights" + (t == null ? "" : " (time budget " + Math.round((Double) t) + " s)"));
            r = WeightOptimizer.optimize(sc, null, opt, (start, iteration, complexity) -> {
                progress.detail("start " + (start + 1) + of + ", step " + iteration
                        + ", sqrt(W+ W-) = " + NumberText.sig(complexity, 6));
                return true;
            }, deadline);
            standing = r.standing; // from the optimiser's own check: no second, unbudgeted pass
        }
        if (output != null) {
            OutputFiles.write("optimize", output, ResultJson.withWeights(text, r.scenario));
        }
        if (json) {
            java.util.Map<String, Object> m = ResultJson.optimization(r);
            m.put("complexityIsBound", standing == null);
            if (standing != null) {
                m.put("complexityNote", standing);
            }
            out.println(Json.writePretty(m).trim());
        } else {
            out.print(summary(r, output));
        }
        return 0;
    }

    private static String value(List<String> args, int i, String option) {
        if (i >= args.size()) {
            throw new Main.UsageException("optimize: " + option + " needs a value");
        }
        return args.get(i);
    }

    private static String interval(double value, double upper, boolean exact) {
        return exact ? NumberText.sig(value, 10) : "in [" + NumberText.sig(value, 10) + ", " + NumberText.sig(upper, 10) + "]";
    }

    private static String inputText(long mask, spanwright.analysis.InputDetail cert, int n) {
        return mask >= 0 ? Inputs.format(mask, n) : cert == null ? "—" : cert.input;
    }

    static String summary(OptimizationResult r, String output) {
        String standing = r.standing;
        Scenario sc = r.scenario;
        int n = sc.variableCount();
        StringBuilder sb = new StringBuilder();
        sb.append(sc.title().isEmpty() ? "(untitled scenario)" : sc.title()).append('\n');
        sb.append("  status      ").append(r.status.name().toLowerCase().replace('_', ' ')).append(" after ")
                .append(r.iterations).append(" step(s), ").append(r.evaluations).append(" solves, best of ")
                .append(r.starts).append(" start(s)\n");
        if (r.method.equals("working-set")) {
            sb.append("  method      working set: ").append(r.rounds).append(" round(s) of the structural engine, ")
                    .append(r.workingSetPositive).append(" worst positive + ").append(r.workingSetNegative)
                    .append(" worst negative input(s) kept\n");
            sb.append("  engine      ").append(r.engine).append('\n');
        }
        sb.append("  bound       sqrt(W+ W-) = ").append(NumberText.sig(r.initialComplexity, 10)).append("  ->  ")
                .append(r.exact ? NumberText.sig(r.complexity, 10) : "in [" + NumberText.sig(r.complexity, 10) + ", "
                        + NumberText.sig(r.complexityUpper(), 10) + "] (not exact: see \"cut\")").append('\n');
        sb.append("  W+ = ").append(interval(r.maxResistance, r.maxResistanceUpper, r.exact)).append(" at ")
                .append(inputText(r.worstPositive, r.worstPositiveCertificate, n))
                .append(",  W- = ").append(interval(r.maxCapacitance, r.maxCapacitanceUpper, r.exact)).append(" at ")
                .append(inputText(r.worstNegative, r.worstNegativeCertificate, n))
                .append(r.balanced ? "  (balanced)" : "").append('\n');
        if (r.cut != null) {
            sb.append("  cut         ").append(r.cut).append('\n');
        }
        sb.append("  weights\n");
        for (Edge e : sc.edges()) {
            sb.append("    ").append(e.id()).append(" (").append(e.when()).append(")  ")
                    .append(NumberText.sig(e.weight(), 8)).append('\n');
        }
        if (output != null) {
            sb.append("  written to ").append(output).append('\n');
        }
        if (standing != null) {
            sb.append("  warning: the weights were chosen for a number that is ").append(standing).append(".\n");
        }
        sb.append("  note: a local optimum of a non-convex problem; try --starts K for more starts.\n");
        sb.append("  caution: ").append(ResultJson.CAUTION).append(".\n");
        return sb.toString();
    }
}
