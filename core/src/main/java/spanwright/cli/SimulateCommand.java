package spanwright.cli;

import java.io.PrintStream;
import java.util.List;
import java.util.Random;
import spanwright.io.Json;
import spanwright.io.NumberText;
import spanwright.facade.ResultJson;
import spanwright.model.ScenarioException;
import spanwright.io.ScenarioReader;
import spanwright.facade.SimulationJson;
import spanwright.model.Inputs;
import spanwright.model.RandomScenarios;
import spanwright.model.Scenario;
import spanwright.quantum.InputSimulation;
import spanwright.quantum.PhaseEstimation;
import spanwright.quantum.Simulation;
import spanwright.quantum.SimulationOptions;
import spanwright.quantum.SimulationResult;

/**
 * {@code simulate [FILE] [--input 0110] [--epsilon 0.1] [--alpha2 A] [--inputs] [--json]}: the
 * span-program algorithm simulated exactly on every input, with its concrete costs; and
 * {@code simulate --bench [--seed S]}: time of a simulation of a seeded random 60-edge scenario
 * on all 1024 inputs of 10 variables (one core; the first round warms up the JIT).
 */
final class SimulateCommand {
    private SimulateCommand() {}

    static String usage() {
        return "  simulate [FILE] [--input 0110] [--epsilon 0.1] [--alpha2 A] [--inputs] [--json] [--quiet]\n"
                + "           | simulate --bench\n"
                + "      Simulate the span-program algorithm exactly (spectrum of U(x), phase estimation) on every\n"
                + "      input: the phase bits and queries for error epsilon, qubits; --input shows one input's\n"
                + "      spectrum, and beyond 65536 inputs simulates that input alone (at any domain size);\n"
                + "      --inputs adds every input's row; --bench times a 60-edge, 1024-input run.\n";
    }

    static int run(List<String> args, PrintStream out, PrintStream err) {
        String file = null;
        String input = null;
        boolean json = false;
        boolean rows = false;
        boolean bench = false;
        boolean quiet = false;
        long seed = 1;
        SimulationOptions opt = SimulationOptions.defaults();
        for (int i = 0; i < args.size(); i++) {
            String a = args.get(i);
            switch (a) {
                case "--json":
                    json = true;
                    break;
                case "--inputs":
                    rows = true;
                    break;
                case "--quiet":
                    quiet = true;
                    break;
                case "--bench":
                    bench = true;
                    break;
                case "--seed":
                    seed = Main.whole("simulate", a, value(args, ++i, a), Long.MIN_VALUE, Long.MAX_VALUE);
                    break;
                case "--input":
                    input = value(args, ++i, a);
                    break;
                case "--epsilon":
                    opt = opt.withEpsilon(number(args, ++i, a));
                    if (!(opt.epsilon() > 0 && opt.epsilon() < 1)) {
                        throw new Main.UsageException("simulate: --epsilon takes a number strictly between 0 and 1, got "
                                + args.get(i));
                    }
                    break;
                case "--alpha2":
                    opt = opt.withAlpha2(number(args, ++i, a));
                    if (!(opt.alpha2() > 0) || Double.isInfinite(opt.alpha2())) {
                        throw new Main.UsageException("simulate: --alpha2 takes a finite number > 0, got " + args.get(i));
                    }
                    break;
                default:
                    if (a.startsWith("-")) {
                        throw new Main.UsageException("simulate: unknown option " + a);
                    }
                    if (file != null) {
                        throw new Main.UsageException("simulate: one FILE at most (got " + file + " and " + a + ")");
                    }
                    file = a;
            }
        }
        if (bench) {
            return bench(seed, opt, out);
        }
        Scenario sc = ScenarioReader.read(Main.readScenarioText(file));
        for (String w : sc.warnings()) {
            err.println("spanwright: warning: " + w);
        }
        if (input != null) {
            try {
                opt = sc.variableCount() <= 63 ? opt.withFocus(SimulationJson.focus(input, sc, "--input"))
                        : opt.withFocusBits(SimulationJson.bits(input, sc, "--input"));
            } catch (ScenarioException e) {
                throw new Main.UsageException("simulate: --input: " + e.getMessage());
            }
        }
        long t0 = System.nanoTime();
        SimulationResult r;
        try (Progress progress = Progress.start("simulate", err, quiet)) {
            progress.phase(opt.hasFocus() ? "analysing the domain (W+ for alpha^2), then simulating"
                    : "analysing the domain, then simulating every input");
            boolean[] first = {true};
            r = Simulation.run(sc, opt, (done, total) -> {
                if (first[0]) {
                    first[0] = false;
                    progress.phase("simulating every input (one dense decomposition each)");
                }
                progress.count(done, total);
            });
        }
        long millis = (System.nanoTime() - t0) / 1_000_000;
        if (json) {
            out.println(Json.writePretty(SimulationJson.result(r)).trim());
        } else {
            out.print(summary(r, rows, millis));
        }
        return 0;
    }

    private static String value(List<String> args, int i, String option) {
        if (i >= args.size()) {
            throw new Main.UsageException("simulate: " + option + " needs a value");
        }
        return args.get(i);
    }

    private static double number(List<String> args, int i, String option) {
        String v = value(args, i, option);
        try {
            return Double.parseDouble(v);
        } catch (NumberFormatException e) {
            throw new Main.UsageException("simulate: " + option + " takes a number, got " + v);
        }
    }

    private static int bench(long seed, SimulationOptions opt, PrintStream out) {
        Scenario sc = RandomScenarios.generate(new Random(seed), 10, 24, 60, 0.0, 0.5, 0.5, 2.0);
        Simulation.run(sc, opt); // warm-up
        int rounds = 3;
        long best = Long.MAX_VALUE;
        SimulationResult r = null;
        for (int k = 0; k < rounds; k++) {
            long t0 = System.nanoTime();
            r = Simulation.run(sc, opt);
            best = Math.min(best, System.nanoTime() - t0);
        }
        out.println("simulate bench: seeded random scenario (seed " + seed + "), 10 variables, 24 vertices, "
                + "60 edges, 1024 inputs");
        out.println("  best of " + rounds + ": " + NumberText.sig(best / 1e6, 4) + " ms ("
                + NumberText.sig(1024 / (best / 1e9), 4) + " inputs/s, one core)");
        out.println("  " + r.positiveCount + " positive, " + r.negativeCount + " negative inputs; bits "
                + (r.bits == 0 ? "none" : String.valueOf(r.bits)) + " at epsilon " + NumberText.sig(r.epsilon, 4));
        return 0;
    }

    private static String line(String label, String text) {
        return Main.row(label, 11, text);
    }

    private static String num(double v) {
        return NumberText.sig(v, 4);
    }

    static String summary(SimulationResult r, boolean rows, long millis) {
        Scenario sc = r.scenario;
        int n = sc.variableCount();
        StringBuilder sb = new StringBuilder();
        sb.append(sc.title().isEmpty() ? "(untitled scenario)" : sc.title()).append('\n');
        boolean one = SimulationResult.INPUT.equals(r.scope);
        sb.append(line("model", "span-program algorithm for st-connectivity, simulated exactly: " + r.edges
                + " edges, " + (one ? "the input " + r.focus().input + " alone" : r.inputs().size() + " inputs")));
        if (one) {
            sb.append(line("scope", "one input: " + r.scopeReason));
        }
        if (Boolean.FALSE.equals(r.reductionCorrect)) {
            sb.append(line("", "note: the graph does not decide the scenario's function; positive = s~t connected"));
        }
        String source = "W+".equals(r.alpha2Source) ? "= W+" : r.alpha2Source;
        sb.append(line("alpha^2", num(r.alpha2) + " (" + source + ")" + (one && Double.isNaN(r.maxResistance)
                && Double.isNaN(r.maxCapacitance) ? "" : ";  W+ = " + num(r.maxResistance) + ", W- = "
                + num(r.maxCapacitance) + ", sqrt(W+ W-) = " + num(r.complexity()))));
        sb.append(line("error", "epsilon = " + num(r.epsilon)
                + " (the largest probability of accepting a negative input in one run)"));
        if (one) {
            sb.append(line("qubits", r.stateQubits + " for the state (ceil log2(|E|+1)) + the phase bits b"));
        } else if (r.bits == 0) {
            sb.append(line("bits", "none: " + r.bitsReason));
        } else {
            int b = r.bits;
            sb.append(line("bits", b + " phase bits: " + r.queries + " queries per run"));
            sb.append(line("", "positive inputs accepted with probability >= " + num(r.minPositiveAcceptance()[b - 1])
                    + " (worst " + Inputs.format(r.worstPositive, n) + "), negative <= "
                    + num(r.maxNegativeAcceptance()[b - 1]) + " (worst " + Inputs.format(r.worstNegative, n) + ")"));
            if (r.repetition != null) {
                sb.append(line("repeat", r.repetition.runs + " run(s), accept when >= " + r.repetition.threshold
                        + " accept: two-sided error <= " + num(r.epsilon) + ", " + r.totalQueries + " queries in all"));
            } else {
                sb.append(line("repeat", "none: " + r.repetitionReason));
            }
            sb.append(line("qubits", r.qubits + " = " + r.stateQubits + " state (ceil log2(|E|+1)) + " + b + " phase"));
        }
        if (r.textbook != null) {
            SimulationResult.Textbook t = r.textbook;
            sb.append(line("textbook", "Theta = 1/(2 sqrt(W+ W-)) = " + num(t.theta) + ": " + t.bits + " bits, "
                    + t.queries + " queries per run; negatives <= " + num(t.maxNegativeAcceptance)
                    + ", positives >= " + num(t.minPositiveAcceptance)));
        }
        sb.append(line("checks", "|U^T U - I| <= " + NumberText.sig(r.orthogonalityDefect, 2)
                + (one ? "" : "; effective spectral gap lemma on negative inputs: worst ratio "
                + (Double.isNaN(r.lemmaWorstRatio) ? "—" : num(r.lemmaWorstRatio)) + " (at most 1)")));
        sb.append(line("time", millis + " ms"));
        sb.append("  assumptions:\n");
        for (String a : Simulation.ASSUMPTIONS) {
            sb.append("    - ").append(a).append('\n');
        }
        sb.append("  note: ").append(ResultJson.CONVENTION).append(".\n");
        sb.append("  caution: ").append(SimulationJson.CAUTION).append(".\n");
        if (r.focus() != null) {
            sb.append(focus(r, r.focus()));
        }
        if (rows && one) {
            sb.append("\n  (--inputs: no rows; only the input in focus was simulated)\n");
        } else if (rows) {
            sb.append('\n').append("  ").append(Main.pad("input", Math.max(6, n + 2))).append("s~t  ")
                    .append(Main.pad("R or C", 12)).append(Main.pad("phase-0 wt", 12)).append(Main.pad("phase gap", 11))
                    .append(r.bits == 0 ? "" : "accept@" + r.bits).append('\n');
            for (InputSimulation x : r.inputs()) {
                sb.append("  ").append(Main.pad(x.input, Math.max(6, n + 2))).append(x.positive ? "yes  " : "no   ")
                        .append(Main.pad(num(x.witnessSize), 12)).append(Main.pad(num(x.phaseZeroWeight), 12))
                        .append(Main.pad(num(x.phaseGap), 11)).append(r.bits == 0 ? "" : num(x.acceptance(r.bits)))
                        .append('\n');
            }
        }
        return sb.toString();
    }

    private static String focus(SimulationResult r, InputSimulation x) {
        StringBuilder sb = new StringBuilder("\n");
        sb.append("  input ").append(x.input).append(x.inDomain ? "" : " (not in the domain)").append(": ")
                .append(x.positive ? "s~t connected, R = " : "not connected, C = ").append(num(x.witnessSize))
                .append(", phase-0 weight ").append(num(x.phaseZeroWeight));
        if (x.positive) {
            sb.append(" (alpha^2/(alpha^2 + R) = ").append(num(r.alpha2 / (r.alpha2 + x.witnessSize))).append(')');
        }
        sb.append(", phase gap ").append(num(x.phaseGap)).append('\n');
        sb.append("    eigenphases |theta| of U(x) carrying |0>'s weight (each stands for e^{+-i theta}):\n");
        double[] p = x.spectrumPhases();
        double[] w = x.spectrumWeights();
        int shown = 0;
        double rest = 0;
        for (int k = 0; k < p.length; k++) {
            if (w[k] >= 1e-12) {
                sb.append("      |theta| = ").append(Main.pad(num(p[k]), 10)).append(" weight ").append(num(w[k]))
                        .append('\n');
                shown++;
            } else {
                rest += w[k];
            }
        }
        sb.append("      (").append(p.length - shown).append(" more eigenvalues with weight < 1e-12, ")
                .append(NumberText.sig(rest, 2)).append(" in all)\n");
        sb.append("    acceptance by phase bits b:");
        for (int b = 1; b <= PhaseEstimation.MAX_BITS; b++) {
            sb.append(b == 1 || b == 9 ? "\n      " : "  ").append("b=").append(b).append(' ')
                    .append(num(x.acceptance(b)));
        }
        sb.append('\n');
        return sb.toString();
    }
}
