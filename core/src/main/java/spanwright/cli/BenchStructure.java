package spanwright.cli;

import java.io.PrintStream;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import spanwright.analysis.StructuralAnalysis;
import spanwright.io.NumberText;
import spanwright.model.ConnectivityForm;
import spanwright.model.Edge;
import spanwright.model.Scenario;
import spanwright.optimize.OptimizationResult;
import spanwright.optimize.OptimizerOptions;
import spanwright.optimize.WeightOptimizer;
import spanwright.reduction.HostGraphBuilder;

/**
 * {@code bench structure}: wall time of the structural analysis end to end (exact W₊ and W₋ with
 * their worst inputs and witnesses, path and bond counts, reduction verdict) on grids and complete
 * graphs with unit and seeded random weights (uniform in [0.5, 2], seed 1), and of the reduction
 * check of a grid against its connectivity function given as a second, independently listed graph
 * (the same grid with its edges in reverse order), so that both decision diagrams are built and
 * compared. One thread.
 */
final class BenchStructure {
    private BenchStructure() {}

    static int run(List<String> args, PrintStream out) {
        List<String> cases = args.isEmpty() ? List.of("grid 6x6", "grid 8x8", "complete 12", "complete 16") : args;
        out.println("structural analysis, one core (" + Runtime.getRuntime().availableProcessors() + " available)");
        out.println(Main.pad("instance", 16) + Main.pad("weights", 9) + Main.pad("edges", 7) + Main.pad("seconds", 9)
                + Main.pad("W+", 14) + Main.pad("W-", 14) + Main.pad("paths", 14) + Main.pad("bonds", 14) + "exact");
        for (String c : cases) {
            for (boolean random : new boolean[] {false, true}) {
                Scenario sc = instance(c);
                if (random) {
                    Random rnd = new Random(1);
                    double[] w = new double[sc.edges().size()];
                    for (int i = 0; i < w.length; i++) {
                        w[i] = 0.5 + 1.5 * rnd.nextDouble();
                    }
                    sc = sc.withWeights(w);
                }
                long t0 = System.nanoTime();
                StructuralAnalysis.Result r = StructuralAnalysis.run(sc);
                double sec = (System.nanoTime() - t0) / 1e9;
                out.println(Main.pad(c, 16) + Main.pad(random ? "random" : "unit", 9)
                        + Main.pad(Integer.toString(sc.edges().size()), 7) + Main.pad(NumberText.sig(sec, 3), 9)
                        + Main.pad(NumberText.sig(r.positive().value(), 8), 14)
                        + Main.pad(NumberText.sig(r.negative().value(), 8), 14)
                        + Main.pad(String.valueOf(r.positive().extremeInputs()), 14)
                        + Main.pad(String.valueOf(r.negative().extremeInputs()), 14) + r.exact());
            }
        }
        out.println();
        out.println("reduction check by decision diagrams (function = the same grid listed in reverse edge order)");
        for (int k : new int[] {6, 7, 8}) {
            Scenario sc = instance("grid " + k + "x" + k);
            List<Edge> reversed = new ArrayList<>(sc.edges());
            Collections.reverse(reversed);
            Scenario checked = new Scenario(sc.title(), "", sc.variables(), null, null, sc.promise(), sc.vertices(),
                    sc.s(), sc.t(), sc.edges(), null, ConnectivityForm.of(sc.vertices(), sc.s(), sc.t(), reversed));
            long t0 = System.nanoTime();
            StructuralAnalysis.Reduction red = StructuralAnalysis.reduction(checked,
                    StructuralAnalysis.DEFAULT_DIAGRAM_NODES);
            double sec = (System.nanoTime() - t0) / 1e9;
            out.println("  grid " + k + "x" + k + " (" + sc.edges().size() + " edge variables): " + red.status() + " in "
                    + NumberText.sig(sec, 3) + " s; " + red.method());
        }
        return Main.OK;
    }

    /**
     * {@code bench optimize-structure [INSTANCE …]}: wall time of the weight optimiser beyond
     * enumeration (working set of worst paths and bonds, structural engine each round) from unit
     * weights, every edge its own weight, one start, default budget; with the rounds and the
     * working-set size. One thread.
     */
    static int optimize(List<String> args, PrintStream out) {
        List<String> cases = args.isEmpty() ? List.of("complete 12", "grid 6x6") : args;
        out.println("weight optimiser beyond enumeration (working set), unit start, one weight per edge, one core ("
                + Runtime.getRuntime().availableProcessors() + " available)");
        out.println(Main.pad("instance", 16) + Main.pad("edges", 7) + Main.pad("seconds", 9) + Main.pad("unit", 14)
                + Main.pad("optimised", 14) + Main.pad("rounds", 8) + Main.pad("paths+bonds", 13) + "status");
        for (String c : cases) {
            Scenario sc = instance(c);
            long t0 = System.nanoTime();
            OptimizationResult r = WeightOptimizer.optimize(sc, OptimizerOptions.defaults(), null);
            double sec = (System.nanoTime() - t0) / 1e9;
            out.println(Main.pad(c, 16) + Main.pad(Integer.toString(sc.edges().size()), 7)
                    + Main.pad(NumberText.sig(sec, 3), 9) + Main.pad(NumberText.sig(r.initialComplexity, 10), 14)
                    + Main.pad(NumberText.sig(r.complexity, 10), 14) + Main.pad(Integer.toString(r.rounds), 8)
                    + Main.pad(r.workingSetPositive + "+" + r.workingSetNegative, 13)
                    + r.status.name().toLowerCase().replace('_', ' ') + " (" + r.method + ")");
        }
        return Main.OK;
    }

    static Scenario instance(String spec) {
        String[] parts = spec.trim().split("\\s+");
        if (parts.length != 2) {
            throw new Main.UsageException("bench structure: an instance is \"grid KxL\" or \"complete N\", got \"" + spec + "\"");
        }
        String[] dims = parts[1].split("x");
        int[] size = new int[dims.length];
        try {
            for (int i = 0; i < dims.length; i++) {
                size[i] = Integer.parseInt(dims[i]);
            }
        } catch (NumberFormatException e) {
            throw new Main.UsageException("bench structure: sizes are whole numbers, got \"" + parts[1] + "\"");
        }
        return HostGraphBuilder.family(parts[0], size, null, null, 1, -1).scenario();
    }
}
