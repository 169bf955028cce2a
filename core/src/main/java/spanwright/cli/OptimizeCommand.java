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
import spanwright.model.Edge;
import spanwright.model.Inputs;
import spanwright.model.Scenario;
import spanwright.optimize.OptimizationResult;
import spanwright.optimize.OptimizerOptions;
import spanwright.optimize.WeightOptimizer;

/**
 * {@code optimize [FILE] [--starts K] [--seed S] [--iterations N] [--seconds T] [--tie literal]
 * [--json] [-o OUT.json]}: better edge weights with a certificate.
 */
final class OptimizeCommand {
    private OptimizeCommand() {}

    static int run(List<String> args, PrintStream out, PrintStream err) {
        String file = null;
        String output = null;
        boolean json = false;
        Map<String, Object> options = new LinkedHashMap<>();
        for (int i = 0; i < args.size(); i++) {
            String a = args.get(i);
            switch (a) {
                case "--json":
                    json = true;
                    break;
                case "-o":
                    output = value(args, ++i, a);
                    break;
                case "--tie":
                    options.put("tie", value(args, ++i, a));
                    break;
                case "--starts":
                case "--seed":
                case "--iterations":
                case "--seconds":
                    String v = value(args, ++i, a);
                    try {
                        options.put(a.substring(2), (double) Long.parseLong(v));
                    } catch (NumberFormatException e) {
                        throw new Main.UsageException("optimize: " + a + " takes a whole number, got " + v);
                    }
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
        String text = Main.readScenarioText(file);
        Scenario sc = ScenarioReader.read(text);
        OptimizerOptions opt = JsonFacade.optimizerOptions(Json.write(options));
        OptimizationResult r = WeightOptimizer.optimize(sc, opt, null);
        if (output != null) {
            OutputFiles.write("optimize", output, ResultJson.withWeights(text, r.scenario));
        }
        if (json) {
            out.println(Json.writePretty(ResultJson.optimization(r)).trim());
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

    private static String summary(OptimizationResult r, String output) {
        Scenario sc = r.scenario;
        int n = sc.variableCount();
        StringBuilder sb = new StringBuilder();
        sb.append(sc.title().isEmpty() ? "(untitled scenario)" : sc.title()).append('\n');
        sb.append("  status      ").append(r.status.name().toLowerCase().replace('_', ' ')).append(" after ")
                .append(r.iterations).append(" step(s), ").append(r.evaluations).append(" solves, best of ")
                .append(r.starts).append(" start(s)\n");
        sb.append("  bound       sqrt(W+ W-) = ").append(NumberText.sig(r.initialComplexity, 10)).append("  ->  ")
                .append(NumberText.sig(r.complexity, 10)).append('\n');
        sb.append("  W+ = ").append(NumberText.sig(r.maxResistance, 10)).append(" at ")
                .append(r.worstPositive < 0 ? "—" : Inputs.format(r.worstPositive, n))
                .append(",  W- = ").append(NumberText.sig(r.maxCapacitance, 10)).append(" at ")
                .append(r.worstNegative < 0 ? "—" : Inputs.format(r.worstNegative, n))
                .append(r.balanced ? "  (balanced)" : "").append('\n');
        sb.append("  weights\n");
        for (Edge e : sc.edges()) {
            sb.append("    ").append(e.id()).append(" (").append(e.when()).append(")  ")
                    .append(NumberText.sig(e.weight(), 8)).append('\n');
        }
        if (output != null) {
            sb.append("  written to ").append(output).append('\n');
        }
        sb.append("  note: a local optimum of a non-convex problem; try --starts K for more starts.\n");
        sb.append("  caution: ").append(ResultJson.CAUTION).append(".\n");
        return sb.toString();
    }
}
