package spanwright.cli;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.io.Json;
import spanwright.io.NumberText;
import spanwright.facade.ResultJson;
import spanwright.model.ScenarioException;
import spanwright.io.ScenarioReader;
import spanwright.model.Inputs;
import spanwright.model.Scenario;

/**
 * The command-line tool: {@code java -jar core/target/spanwright.jar <command> …}.
 * Exit status: 0 success, 1 the reduction is wrong on some input, 2 invalid scenario, usage or a
 * file that cannot be read or written, 3 internal error (a bug or the machine's limits: any other
 * exception or Error, on any thread, ends the command with one line on stderr and no stack trace).
 */
public final class Main {
    /** Classpath location of the built-in default scenario (a copy of scenarios/default.json). */
    public static final String DEFAULT_SCENARIO = "/spanwright/scenarios/default.json";

    static final int OK = 0;
    static final int WRONG_REDUCTION = 1;
    static final int INVALID = 2;
    static final int INTERNAL = 3;

    private Main() {}

    public static void main(String[] args) {
        System.exit(run(args, System.out, System.err));
    }

    /** Runs a command; returns the exit status. Never throws for bad input. */
    public static int run(String[] args, PrintStream out, PrintStream err) {
        if (args.length == 0) {
            err.print(usage());
            return INVALID;
        }
        if (args[0].equals("help") || args[0].equals("--help") || args[0].equals("-h")) {
            out.print(usage());
            return OK;
        }
        List<String> rest = new ArrayList<>(List.of(args).subList(1, args.length));
        // the prose of the docs uses British spellings too
        String command = args[0].equals("analyse") ? "analyze" : args[0].equals("optimise") ? "optimize" : args[0];
        if (rest.contains("--help") || rest.contains("-h")) {
            String help = commandHelp(command);
            if (help != null) {
                out.print(help);
                return OK;
            }
        }
        try {
            switch (command) {
                case "analyze":
                    return analyze(rest, out, err);
                case "optimize":
                    return OptimizeCommand.run(rest, out, err);
                case "bench":
                    return Bench.run(rest, out, err);
                case "build": return BuildCommand.run(rest, out, err);
                case "bounds": return BoundsCommand.run(rest, out, err);
                case "sweep": return SweepCommand.run(rest, out, err);
                case "merge": return MergeCommand.run(rest, out, err);
                case "simulate": return SimulateCommand.run(rest, out, err);
                case "export": return ExportCommand.run(rest, out, err);
                default:
                    err.println("spanwright: unknown command \"" + args[0] + "\"");
                    err.print(usage());
                    return INVALID;
            }
        } catch (UsageException e) {
            err.println("spanwright: " + e.getMessage());
            return INVALID;
        } catch (ScenarioException e) {
            if (e.path() != null && e.path().startsWith("$options.")) {
                // an option the command passed on to the engine: name the option, not the scenario
                err.println("spanwright: " + command + ": " + optionName(e.path()) + ": " + e.getMessage() + " ["
                        + e.code() + "]");
                return INVALID;
            }
            err.println("spanwright: invalid scenario: " + e.describe() + " [" + e.code() + "]");
            return INVALID;
        } catch (Throwable e) { // deliberately everything else: no stack trace reaches a user
            err.println("spanwright: " + internal(e));
            return INTERNAL;
        }
    }

    /** The command-line option behind an engine option path: {@code $options.maxInputs} → {@code --max-inputs}. */
    static String optionName(String path) {
        String key = path.substring("$options.".length());
        StringBuilder sb = new StringBuilder("--");
        for (char c : key.toCharArray()) {
            if (Character.isUpperCase(c)) {
                sb.append('-').append(Character.toLowerCase(c));
            } else {
                sb.append(c);
            }
        }
        return sb.toString();
    }

    /**
     * The whole number {@code value} of {@code option}, within [min, max]; otherwise a usage error
     * that names the command, the option and the accepted range.
     */
    static long whole(String command, String option, String value, long min, long max) {
        long v;
        try {
            v = Long.parseLong(value.trim());
        } catch (NumberFormatException e) {
            throw new UsageException(command + ": " + option + " takes a whole number" + range(min, max) + ", got \""
                    + value + "\"");
        }
        if (v < min || v > max) {
            throw new UsageException(command + ": " + option + " takes a whole number" + range(min, max) + ", got "
                    + v);
        }
        return v;
    }

    private static String range(long min, long max) {
        if (max == Long.MAX_VALUE) {
            return min == Long.MIN_VALUE ? "" : " >= " + min;
        }
        return " from " + min + " to " + max;
    }

    /** One line for an unexpected failure: what it was and what to do. */
    static String internal(Throwable e) {
        String what = e instanceof StackOverflowError ? "the input is nested too deeply for this program (stack overflow)"
                : e instanceof OutOfMemoryError ? "out of memory (try a smaller input, or more memory with java -Xmx…)"
                : String.valueOf(e).replace('\n', ' ');
        return "internal error: " + what + "; please report it with the command and its input files";
    }

    /**
     * The part of {@link #usage} about {@code command}: its lines (two-space indent) and their
     * explanation (deeper indent), or null for an unknown command.
     */
    static String commandHelp(String command) {
        StringBuilder sb = new StringBuilder();
        boolean in = false;
        for (String line : usage().split("\n")) {
            if (line.startsWith("  ") && !line.startsWith("   ")) {
                in = line.startsWith("  " + command + " ") || line.equals("  " + command);
            } else if (!line.startsWith("   ")) {
                in = false;
            }
            if (in) {
                sb.append(line).append('\n');
            }
        }
        return sb.length() == 0 ? null : "usage: java -jar spanwright.jar " + command + " …\n" + sb;
    }

    static String usage() {
        return "usage: java -jar spanwright.jar <command> [options]\n"
                + "\n"
                + "  analyze [FILE] [--json] [--inputs] [--method auto|enumerate|structure] [--input BITS]\n"
                + "          [--seconds S] [--quiet]\n"
                + "      Check the reduction, find the worst inputs with their witnesses (R on positive inputs,\n"
                + "      C on negative inputs) and the bound sqrt(W+ W-). Up to 20 variables every input is\n"
                + "      enumerated; beyond, W+ and W- come from the graph's structure (heaviest path and bond,\n"
                + "      branch and bound, decision diagrams). With no FILE, the built-in default scenario.\n"
                + "      --json: machine-readable; --inputs: every input's row (enumeration only);\n"
                + "      --input BITS: one input's witness, at any size; --seconds: time budget of the whole\n"
                + "      analysis; what it cuts is reported as such (certified intervals, inputs not reached).\n"
                + "      Runs longer than 2 s print progress lines on stderr (every 5 s or so); --quiet: none\n"
                + "      (the same for optimize, bounds, build and simulate).\n"
                + "  optimize [FILE] [--starts K] [--seed S] [--iterations N] [--seconds T] [--tie literal]\n"
                + "           [--json] [-o OUT.json] [--quiet]\n"
                + "      Choose edge weights that lower sqrt(W+ W-) (monotone descent, with certificates);\n"
                + "      -o writes the scenario with the new weights.\n"
                + "  bench [--vars 14] [--vertices 24] [--edges 48] [--scenarios 8] [--seed 1] [--rounds 5]\n"
                + "      Inputs per second of the analysis on seeded random scenarios (one core).\n"
                + "  bench structure [\"grid 8x8\" \"complete 16\" ...]\n"
                + "      Seconds of the structural analysis (exact W+ and W- with witnesses) on grids and complete\n"
                + "      graphs, and of the reduction check by decision diagrams (one core).\n"
                + BuildCommand.usage()
                + BoundsCommand.usage()
                + SweepCommand.usage()
                + SimulateCommand.usage()
                + ExportCommand.usage()
                + "\n"
                + "exit status: 0 ok, 1 reduction wrong on some input, 2 invalid scenario or usage, or a file\n"
                + "  that cannot be read or written (an output may not name an input), 3 internal error\n";
    }

    /** Reads a scenario file, or the built-in default when {@code file} is null. */
    static String readScenarioText(String file) {
        if (file == null) {
            try (InputStream in = Main.class.getResourceAsStream(DEFAULT_SCENARIO)) {
                if (in == null) {
                    throw new UsageException("the built-in default scenario is missing from the jar");
                }
                return new String(in.readAllBytes(), StandardCharsets.UTF_8);
            } catch (IOException e) {
                throw new UsageException("cannot read the built-in default scenario: " + e.getMessage());
            }
        }
        try {
            return spanwright.io.TextFile.readUtf8(Path.of(file));
        } catch (spanwright.io.TextFile.NotUtf8Exception e) {
            throw new UsageException(e.getMessage());
        } catch (NoSuchFileException e) {
            throw new UsageException("no such file: " + file);
        } catch (IOException e) {
            throw new UsageException("cannot read " + file + ": " + e.getMessage());
        }
    }

    /** Inputs enumerated between two progress reports (a few milliseconds of work). */
    private static final long ENUMERATION_CHUNK = 1 << 14;

    private static int analyze(List<String> args, PrintStream out, PrintStream err) {
        boolean json = false;
        boolean inputs = false;
        boolean quiet = false;
        String file = null;
        Analysis.Method method = Analysis.Method.AUTO;
        String input = null;
        double seconds = Double.POSITIVE_INFINITY; // no budget for the whole analysis unless asked
        for (int i = 0; i < args.size(); i++) {
            String a = args.get(i);
            if (a.equals("--json")) {
                json = true;
            } else if (a.equals("--inputs")) {
                inputs = true;
            } else if (a.equals("--quiet")) {
                quiet = true;
            } else if (a.equals("--seconds")) {
                if (i + 1 >= args.size()) {
                    throw new UsageException("analyze: --seconds needs a value");
                }
                String value = args.get(++i);
                try {
                    seconds = Double.parseDouble(value);
                } catch (NumberFormatException e) {
                    seconds = Double.NaN;
                }
                if (!(seconds > 0) || Double.isInfinite(seconds)) {
                    throw new UsageException("analyze: --seconds takes a positive number of seconds, got \"" + value + "\"");
                }
            } else if (a.equals("--method") || a.equals("--input")) {
                if (i + 1 >= args.size()) {
                    throw new UsageException("analyze: " + a + " needs a value");
                }
                String value = args.get(++i);
                if (a.equals("--input")) {
                    input = value;
                } else {
                    method = Analysis.Method.of(value);
                    if (method == null) {
                        throw new UsageException("analyze: --method is auto, enumerate or structure, got \"" + value + "\"");
                    }
                }
            } else if (a.startsWith("-")) {
                throw new UsageException("analyze: unknown option " + a);
            } else if (file == null) {
                file = a;
            } else {
                throw new UsageException("analyze: one FILE at most (got " + file + " and " + a + ")");
            }
        }
        // --seconds counts from here: reading the scenario is part of the command's time
        spanwright.model.Deadline budget = spanwright.model.Deadline.afterSeconds(seconds);
        Scenario sc = ScenarioReader.read(readScenarioText(file));
        for (String w : sc.warnings()) {
            err.println("spanwright: warning: " + w);
        }
        if (input != null) {
            return AnalyzeMore.oneInput(sc, input, json, out);
        }
        Analysis.Choice choice = Analysis.choose(sc, method);
        if (choice.method() == Analysis.Method.STRUCTURE) {
            return AnalyzeMore.structure(sc, choice, json, inputs, seconds, budget, out, err, quiet);
        }
        if (inputs) {
            Analysis.checkListable(spanwright.domain.InputDomain.of(sc).size()); // before the work
        }
        spanwright.analysis.AnalysisRun run;
        try (Progress progress = Progress.start("analyze", err, quiet)) {
            progress.phase("listing the domain");
            run = Analysis.start(sc);
            progress.phase("enumerating inputs (R or C of each)");
            progress.count(0, run.total());
            while (!run.done() && !budget.passed()) {
                // one deadline check per input (as stepWithin), a progress line per chunk
                long chunkEnd = run.processed() + ENUMERATION_CHUNK;
                while (!run.done() && run.processed() < chunkEnd && !budget.passed()) {
                    run.step(1);
                }
                progress.count(run.processed(), run.total());
            }
        }
        if (!run.done()) {
            return AnalyzeMore.partial(sc, run, seconds, json, out);
        }
        AnalysisResult r = run.result();
        if (json) {
            Map<String, Object> m = ResultJson.analysis(r, inputs);
            out.println(Json.writePretty(m).trim());
        } else {
            out.print(summary(r, inputs));
        }
        return Boolean.FALSE.equals(r.correct()) ? WRONG_REDUCTION : OK;
    }

    /** One aligned summary line: two spaces, the label padded to {@code width}, the text. */
    static String row(String label, int width, String text) {
        return "  " + pad(label, width) + text + "\n";
    }

    static String pad(String s, int width) {
        StringBuilder sb = new StringBuilder(s);
        while (sb.length() < width) {
            sb.append(' ');
        }
        return sb.toString();
    }

    /** The human summary: short, aligned, pasteable into notes. */
    static String summary(AnalysisResult r, boolean inputs) {
        Scenario sc = r.scenario();
        int n = sc.variableCount();
        StringBuilder sb = new StringBuilder();
        String title = sc.title().isEmpty() ? "(untitled scenario)" : sc.title();
        sb.append(title).append('\n');
        sb.append("  ").append(pad("variables", 12)).append(n).append(" (")
                .append(String.join(", ", sc.variables())).append(")\n");
        sb.append("  ").append(pad("domain", 12)).append(r.domainSize()).append(" inputs, ")
                .append(sc.promise().describe(sc.variables())).append('\n');
        sb.append("  ").append(pad("graph", 12)).append(sc.vertexCount()).append(" vertices, ")
                .append(sc.edges().size()).append(" edges, s = ").append(sc.vertices().get(sc.s()).id())
                .append(", t = ").append(sc.vertices().get(sc.t()).id()).append('\n');
        if (r.reductionChecked()) {
            sb.append("  ").append(pad("function", 12)).append(sc.functionText()).append('\n');
            if (r.counterexampleCount() == 0) {
                sb.append("  ").append(pad("reduction", 12)).append("correct: s~t connected exactly when f = 1, on all ")
                        .append(r.domainSize()).append(" inputs\n");
            } else {
                sb.append("  ").append(pad("reduction", 12)).append("WRONG on ").append(r.counterexampleCount())
                        .append(" input(s); first:");
                int shown = 0;
                for (long x : r.counterexamples()) {
                    if (shown++ == 5) {
                        sb.append(" …");
                        break;
                    }
                    sb.append(' ').append(Inputs.format(x, n)).append(sc.function().eval(x) ? " (f=1, not connected)" : " (f=0, connected)");
                }
                sb.append('\n');
            }
        } else {
            sb.append("  ").append(pad("reduction", 12)).append("not checked (no function given)\n");
        }
        sb.append("  ").append(pad("positive", 12)).append(pad(r.positiveCount() + " inputs", 14))
                .append(pad("W+ = max R = " + NumberText.sig(r.maxResistance(), 10), 28))
                .append(r.worstPositive() < 0 ? "" : "worst " + Inputs.format(r.worstPositive(), n)).append('\n');
        sb.append("  ").append(pad("negative", 12)).append(pad(r.negativeCount() + " inputs", 14))
                .append(pad("W- = max C = " + NumberText.sig(r.maxCapacitance(), 10), 28))
                .append(r.worstNegative() < 0 ? "" : "worst " + Inputs.format(r.worstNegative(), n)).append('\n');
        sb.append("  ").append(pad("bound", 12)).append("sqrt(W+ W-) = ").append(NumberText.sig(r.complexity(), 10));
        if (Double.isNaN(r.complexity())) {
            sb.append(" (undefined: ").append(r.positiveCount() == 0 ? "no positive inputs" : "no negative inputs").append(')');
        }
        if (Boolean.FALSE.equals(r.correct())) {
            sb.append(" — ").append(Analysis.notABound(Long.toString(r.counterexampleCount())));
        }
        sb.append('\n');
        sb.append("  note: ").append(ResultJson.CONVENTION).append(".\n");
        sb.append("  caution: ").append(ResultJson.CAUTION).append(".\n");
        if (inputs) {
            sb.append('\n').append("  input").append(" ".repeat(Math.max(1, n - 3))).append("f  s~t  value\n");
            for (int i = 0; i < r.domainSize(); i++) {
                sb.append("  ").append(r.inputString(i)).append("  ")
                        .append(r.reductionChecked() ? (r.f(i) ? "1" : "0") : "-").append("  ")
                        .append(r.connected(i) ? "yes  R = " : "no   C = ")
                        .append(NumberText.sig(r.value(i), 10)).append('\n');
            }
        }
        return sb.toString();
    }

    /** Bad command-line usage. */
    static final class UsageException extends RuntimeException {
        private static final long serialVersionUID = 1L;

        UsageException(String message) {
            super(message);
        }
    }
}
