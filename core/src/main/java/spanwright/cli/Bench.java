package spanwright.cli;

import java.io.PrintStream;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.io.NumberText;
import spanwright.model.RandomScenarios;
import spanwright.model.Scenario;

/**
 * {@code bench}: inputs per second of {@link Analysis#run} on one core, over seeded random
 * scenarios (a random spanning tree plus random extra edges; conditions are random literals of
 * both polarities, one edge in ten always present; weights uniform in [0.5, 2]). The first round is
 * a warm-up for the JIT and is not counted.
 */
final class Bench {
    private Bench() {}

    static int run(List<String> args, PrintStream out, PrintStream err) {
        int vars = 14;
        int vertices = 24;
        int edges = 48;
        int scenarios = 8;
        long seed = 1;
        int rounds = 5;
        if (!args.isEmpty() && args.get(0).equals("optimize")) {
            return optimizer(args.subList(1, args.size()), out);
        }
        if (!args.isEmpty() && args.get(0).equals("optimize-structure")) {
            return BenchStructure.optimize(args.subList(1, args.size()), out);
        }
        if (!args.isEmpty() && args.get(0).equals("budget")) {
            return BenchBudget.run(args.subList(1, args.size()), out);
        }
        if (!args.isEmpty() && args.get(0).equals("structure")) {
            return BenchStructure.run(args.subList(1, args.size()), out);
        }
        for (int i = 0; i < args.size(); i++) {
            String a = args.get(i);
            if (i + 1 >= args.size()) {
                throw new Main.UsageException("bench: " + a + " needs a value");
            }
            String v = args.get(++i);
            switch (a) {
                case "--vars": vars = (int) Main.whole("bench", a, v, 1, 24); break;
                case "--vertices": vertices = (int) Main.whole("bench", a, v, 2, 100_000); break;
                case "--edges": edges = (int) Main.whole("bench", a, v, 1, 1_000_000); break;
                case "--scenarios": scenarios = (int) Main.whole("bench", a, v, 1, 10_000); break;
                case "--seed": seed = (int) Main.whole("bench", a, v, Integer.MIN_VALUE, Integer.MAX_VALUE); break;
                case "--rounds": rounds = (int) Main.whole("bench", a, v, 2, 1000); break;
                default: throw new Main.UsageException("bench: unknown option " + a);
            }
        }
        if (edges < vertices - 1) {
            throw new Main.UsageException("bench: --edges must be at least --vertices − 1 = " + (vertices - 1)
                    + " (a spanning tree), got " + edges);
        }
        Random rnd = new Random(seed);
        List<Scenario> list = new ArrayList<>();
        for (int k = 0; k < scenarios; k++) {
            list.add(randomScenario(rnd, vars, vertices, edges));
        }
        out.println("bench: " + scenarios + " seeded random scenarios (seed " + seed + "), " + vars + " variables, "
                + vertices + " vertices, " + edges + " edges, one thread");
        double best = 0;
        double checksum = 0;
        for (int round = 0; round < rounds; round++) {
            long inputs = 0;
            long t0 = System.nanoTime();
            for (Scenario sc : list) {
                AnalysisResult r = Analysis.run(sc);
                inputs += r.domainSize();
                checksum += r.complexity();
            }
            double sec = (System.nanoTime() - t0) / 1e9;
            double rate = inputs / sec;
            if (round > 0) {
                best = Math.max(best, rate);
            }
            out.println("  round " + round + (round == 0 ? " (warm-up)" : "") + ": " + inputs + " inputs in "
                    + NumberText.sig(sec, 4) + " s = " + NumberText.sig(rate, 4) + " inputs/s");
        }
        out.println("best: " + NumberText.sig(best, 4) + " inputs/s (checksum " + NumberText.sig(checksum, 8) + ")");
        return 0;
    }

    /**
     * {@code bench optimize [--leaves 16] [--seed 1] [--rounds 4]}: time for the optimiser to take a
     * seeded random read-once formula from unit weights to √N (the adversary bound of read-once
     * formulas), one thread.
     */
    private static int optimizer(List<String> args, PrintStream out) {
        int leaves = 16;
        long seed = 1;
        int rounds = 4;
        for (int i = 0; i < args.size(); i += 2) {
            String a = args.get(i);
            if (i + 1 >= args.size()) {
                throw new Main.UsageException("bench optimize: " + a + " needs a value");
            }
            String v = args.get(i + 1);
            switch (a) {
                case "--leaves": leaves = (int) Main.whole("bench optimize", a, v, 1, 24); break;
                case "--seed": seed = Main.whole("bench optimize", a, v, Integer.MIN_VALUE, Integer.MAX_VALUE); break;
                case "--rounds": rounds = (int) Main.whole("bench optimize", a, v, 1, 1000); break;
                default: throw new Main.UsageException("bench optimize: unknown option " + a);
            }
        }
        Scenario sc = RandomScenarios.readOnceFormula(new Random(seed), leaves, 1.0);
        out.println("bench optimize: read-once formula on " + leaves + " variables (seed " + seed + "), "
                + sc.edges().size() + " edges, unit weights; target sqrt(N) = " + NumberText.sig(Math.sqrt(leaves), 10));
        for (int round = 0; round < rounds; round++) {
            long t0 = System.nanoTime();
            spanwright.optimize.OptimizationResult r = spanwright.optimize.WeightOptimizer.optimize(sc);
            double sec = (System.nanoTime() - t0) / 1e9;
            out.println("  round " + round + (round == 0 ? " (warm-up)" : "") + ": " + NumberText.sig(sec, 4) + " s, "
                    + r.iterations + " steps, " + r.evaluations + " solves, sqrt(W+W-) = "
                    + NumberText.sig(r.complexity, 12) + ", relative gap to sqrt(N) "
                    + NumberText.sig(r.complexity / Math.sqrt(leaves) - 1, 3) + ", " + r.status);
        }
        return 0;
    }

    /** The benchmark's scenario family (see class javadoc). */
    static Scenario randomScenario(Random rnd, int vars, int vertexCount, int edgeCount) {
        return RandomScenarios.generate(rnd, vars, vertexCount, edgeCount, 0.1, 0.5, 0.5, 2.0);
    }
}
