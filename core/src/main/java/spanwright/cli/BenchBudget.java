package spanwright.cli;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import spanwright.analysis.Analysis;
import spanwright.io.Json;
import spanwright.io.NumberText;
import spanwright.io.ScenarioWriter;
import spanwright.model.RandomScenarios;
import spanwright.model.Scenario;
import spanwright.reduction.HostGraphBuilder;

/**
 * {@code bench budget [--seconds 2,5]}: does a time budget hold at any graph size? Runs the real
 * commands ({@code optimize --seconds T --json}, {@code analyze --seconds T --json}) in this JVM
 * on scenarios written to a temporary folder, and prints the requested and the actual seconds
 * (wall, and this thread's CPU time, which shows how much of the wall time other processes took),
 * the time of one step (one input's solve: the unit the budget may be overrun by), whether the
 * call ended within budget × 1.1 + one step, and what the answer says was cut.
 *
 * <p>Scenarios: seeded random graphs of the {@code bench} family made monotone (a random spanning
 * tree plus extra edges, 14 variables in positive literals, one edge in ten always present,
 * weights in [0.5, 2]; s the first vertex, t the last) with 1,000 vertices / 1,006 edges and
 * 5,000 vertices / 5,006 edges (the whole-domain optimiser: 2^14 inputs, each solve on the whole
 * graph); the 2×336 ladder (1,006 edge variables), K16 and the 8×8 grid, one weight per edge (the
 * working-set optimiser, the structural engine each round); and for {@code analyze}, K30 (435
 * edge variables: frontier search too wide to finish) and the 5,006-edge random graph
 * (enumeration of 2^14 inputs). One thread.
 */
final class BenchBudget {
    private BenchBudget() {}

    /** One benchmark scenario. */
    private record Case(String name, Scenario scenario) {}

    static int run(List<String> args, PrintStream out) {
        List<Double> budgets = List.of(2.0, 5.0);
        for (int i = 0; i < args.size(); i++) {
            if (args.get(i).equals("--seconds") && i + 1 < args.size()) {
                budgets = new ArrayList<>();
                for (String p : args.get(++i).split(",")) {
                    try {
                        budgets.add(Double.parseDouble(p));
                    } catch (NumberFormatException e) {
                        throw new Main.UsageException("bench budget: --seconds takes whole seconds like 2,5, got " + p);
                    }
                }
            } else {
                throw new Main.UsageException("bench budget: the one option is --seconds LIST (e.g. 2,5)");
            }
        }
        for (double b : budgets) {
            if (!(b >= 1) || b != Math.rint(b)) {
                throw new Main.UsageException("bench budget: optimize takes whole seconds ≥ 1, got " + b);
            }
        }
        Path dir;
        try {
            dir = Files.createTempDirectory("spanwright-bench-budget");
        } catch (IOException e) {
            throw new Main.UsageException("bench budget: cannot make a temporary folder: " + e.getMessage());
        }
        try {
            List<Case> optimize = List.of(
                    new Case("random 1,006 edges", random(1000, 1006)),
                    new Case("random 5,006 edges", random(5000, 5006)),
                    new Case("ladder 2x336", host("grid", 2, 336)),
                    new Case("complete 16", host("complete", 16)),
                    new Case("grid 8x8", host("grid", 8, 8)));
            out.println("time budgets, one thread (" + Runtime.getRuntime().availableProcessors()
                    + " processors); actual = wall seconds of the whole command in this JVM (reading the file and"
                    + " writing the answer included); cpu = this thread's CPU seconds");
            out.println(Main.pad("command", 10) + Main.pad("scenario", 22) + Main.pad("edges", 7) + Main.pad("asked", 7)
                    + Main.pad("actual", 8) + Main.pad("cpu", 7) + Main.pad("step", 10) + Main.pad("within", 8)
                    + "answer");
            for (Case c : optimize) {
                Path file = write(dir, c);
                for (double b : budgets) {
                    measure(out, "optimize", c, file, b, new String[] {"optimize", file.toString(), "--seconds",
                            Long.toString((long) b), "--json"});
                }
            }
            List<Case> analyze = List.of(new Case("complete 30", host("complete", 30)), optimize.get(1));
            for (Case c : analyze) {
                Path file = write(dir, c);
                double b = budgets.get(0);
                measure(out, "analyze", c, file, b, new String[] {"analyze", file.toString(), "--seconds",
                        NumberText.sig(b, 6), "--json"});
            }
            out.println("within: actual <= asked x 1.1 + one step (one input's solve on the whole graph, the unit a"
                    + " budget may be overrun by; measured here, so it varies with the load)");
        } finally {
            try (var files = Files.list(dir)) {
                for (Path p : (Iterable<Path>) files::iterator) {
                    Files.deleteIfExists(p);
                }
                Files.deleteIfExists(dir);
            } catch (IOException e) {
                out.println("(could not remove " + dir + ": " + e.getMessage() + ")");
            }
        }
        return Main.OK;
    }

    /** The bench family (see {@link Bench}) with positive literals only, so both sides have inputs. */
    private static Scenario random(int vertices, int edges) {
        return RandomScenarios.generate(new Random(1), 14, vertices, edges, 0.1, 0.0, 0.5, 2.0);
    }

    private static Scenario host(String family, int... size) {
        return HostGraphBuilder.family(family, size, null, null, 1, -1).scenario();
    }

    private static Path write(Path dir, Case c) {
        Path file = dir.resolve(c.name().replaceAll("[^a-z0-9]+", "-") + ".json");
        try {
            Files.writeString(file, ScenarioWriter.write(c.scenario()));
        } catch (IOException e) {
            throw new Main.UsageException("bench budget: cannot write " + file + ": " + e.getMessage());
        }
        return file;
    }

    /** Seconds of one input's solve on the whole graph (the budget's step), the median of 5. */
    private static double stepSeconds(Scenario sc) {
        double[] t = new double[5];
        long all = sc.variableCount() >= 63 ? -1 : (1L << sc.variableCount()) - 1;
        for (int k = 0; k < t.length; k++) {
            long t0 = System.nanoTime();
            if (all >= 0) {
                Analysis.detail(sc, k % 2 == 0 ? all : 0);
            } else {
                boolean[] x = new boolean[sc.variableCount()];
                java.util.Arrays.fill(x, k % 2 == 0);
                spanwright.analysis.StructuralAnalysis.detail(sc, x);
            }
            t[k] = (System.nanoTime() - t0) / 1e9;
        }
        java.util.Arrays.sort(t);
        return t[2];
    }

    @SuppressWarnings("unchecked")
    private static void measure(PrintStream out, String command, Case c, Path file, double budget, String[] args) {
        ThreadMXBean mx = ManagementFactory.getThreadMXBean();
        ByteArrayOutputStream text = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        long cpu0 = mx.isCurrentThreadCpuTimeSupported() ? mx.getCurrentThreadCpuTime() : -1;
        long t0 = System.nanoTime();
        int code = Main.run(args, new PrintStream(text, true, StandardCharsets.UTF_8),
                new PrintStream(err, true, StandardCharsets.UTF_8));
        double wall = (System.nanoTime() - t0) / 1e9;
        double cpu = cpu0 < 0 ? Double.NaN : (mx.getCurrentThreadCpuTime() - cpu0) / 1e9;
        double step = stepSeconds(c.scenario());
        String answer;
        try {
            Map<String, Object> m = (Map<String, Object>) Json.parse(text.toString(StandardCharsets.UTF_8));
            answer = "exit " + code + ", " + (m.get("status") != null ? m.get("status") + ", " : "")
                    + (Boolean.FALSE.equals(m.get("exact")) ? "not exact" : "exact")
                    + (m.get("cut") != null ? "; cut: " + shorten((String) m.get("cut")) : "");
        } catch (RuntimeException e) {
            answer = "exit " + code + ", no JSON answer: " + err.toString(StandardCharsets.UTF_8).trim();
        }
        boolean within = wall <= budget * 1.1 + step;
        out.println(Main.pad(command, 10) + Main.pad(c.name(), 22)
                + Main.pad(Integer.toString(c.scenario().edges().size()), 7) + Main.pad(NumberText.sig(budget, 3), 7)
                + Main.pad(NumberText.sig(wall, 3), 8) + Main.pad(NumberText.sig(cpu, 3), 7)
                + Main.pad(NumberText.sig(step * 1000, 2) + " ms", 10) + Main.pad(within ? "yes" : "NO", 8) + answer);
    }

    /** The cut's first clause. */
    private static String shorten(String cut) {
        int end = cut.indexOf(':');
        String s = end > 0 ? cut.substring(0, end) : cut;
        return s.length() > 110 ? s.substring(0, 107) + "..." : s;
    }
}
