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
        for (int i = 0; i < args.size(); i++) {
            String a = args.get(i);
            if (i + 1 >= args.size()) {
                throw new Main.UsageException("bench: " + a + " needs a value");
            }
            String v = args.get(++i);
            int value;
            try {
                value = Integer.parseInt(v);
            } catch (NumberFormatException e) {
                throw new Main.UsageException("bench: " + a + " takes a whole number, got " + v);
            }
            switch (a) {
                case "--vars": vars = value; break;
                case "--vertices": vertices = value; break;
                case "--edges": edges = value; break;
                case "--scenarios": scenarios = value; break;
                case "--seed": seed = value; break;
                case "--rounds": rounds = value; break;
                default: throw new Main.UsageException("bench: unknown option " + a);
            }
        }
        if (vars < 1 || vars > 24 || vertices < 2 || edges < vertices - 1 || scenarios < 1 || rounds < 2) {
            throw new Main.UsageException("bench: need 1 ≤ vars ≤ 24, vertices ≥ 2, edges ≥ vertices − 1, rounds ≥ 2");
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

    /** The benchmark's scenario family (see class javadoc). */
    static Scenario randomScenario(Random rnd, int vars, int vertexCount, int edgeCount) {
        return RandomScenarios.generate(rnd, vars, vertexCount, edgeCount, 0.1, 0.5, 0.5, 2.0);
    }
}
