package spanwright.structure;

import java.io.PrintStream;
import spanwright.io.NumberText;
import spanwright.model.SeededRandom;

/**
 * Speed of {@link PathsAndBonds} on one core: the heaviest s–t path (W₊) and the heaviest bond
 * (W₋), each with a witness and a count, on the 6×6 and 8×8 grids (corner to corner) and on K12
 * and K16, with unit weights and with seeded random weights uniform in [0.5, 2]. Targets: 6×6 and
 * K12 under 10 s, 8×8 and K16 under 60 s, per row. One small warm-up instance runs first, untimed.
 * Prints a table; {@link #run} is what a command-line {@code bench} sub-command calls.
 */
public final class StructureBench {
    private StructureBench() {}

    /** State budget used by the bench (per frontier level, or for the subset DP). */
    public static final long BUDGET = 5_000_000L;

    public static void main(String[] args) {
        run(System.out, 1L);
    }

    /** Runs the table with weights drawn from {@code seed}; returns the total time in seconds. */
    public static double run(PrintStream out, long seed) {
        PathsAndBonds.heaviestPath(HostGraph.grid(5, 5), BUDGET);
        PathsAndBonds.heaviestBond(HostGraph.grid(5, 5), BUDGET);
        PathsAndBonds.heaviestPath(HostGraph.complete(9), BUDGET);
        out.println("exact heaviest path (W+) and heaviest bond (W-), witness and count, one core; "
                + "state budget " + BUDGET);
        out.println(pad("graph", 10) + pad("edges", 7) + pad("weights", 16) + pad("object", 8)
                + pad("max", 12) + pad("count", 22) + pad("seconds", 9) + "method");
        double total = 0;
        SeededRandom rnd = new SeededRandom(seed);
        HostGraph[] graphs = {HostGraph.grid(6, 6), HostGraph.grid(8, 8), HostGraph.complete(12), HostGraph.complete(16)};
        String[] names = {"6×6 grid", "8×8 grid", "K12", "K16"};
        for (int k = 0; k < graphs.length; k++) {
            for (int weighting = 0; weighting < 2; weighting++) {
                HostGraph g = graphs[k];
                String wname = "unit";
                if (weighting == 1) {
                    double[] w = new double[g.edgeCount()];
                    for (int e = 0; e < w.length; e++) {
                        w[e] = 0.5 + 1.5 * rnd.nextDouble();
                    }
                    g = g.withWeights(w);
                    wname = "U[0.5,2] seed " + seed;
                }
                for (int bond = 0; bond < 2; bond++) {
                    long t0 = System.nanoTime();
                    Extreme r = bond == 0 ? PathsAndBonds.heaviestPath(g, BUDGET) : PathsAndBonds.heaviestBond(g, BUDGET);
                    double sec = (System.nanoTime() - t0) * 1e-9;
                    total += sec;
                    out.println(pad(names[k], 10) + pad(String.valueOf(g.edgeCount()), 7) + pad(wname, 16)
                            + pad(bond == 0 ? "path" : "bond", 8) + pad(NumberText.sig(r.value(), 8), 12)
                            + pad(r.count().toString(), 22) + pad(NumberText.sig(sec, 3), 9) + r.method());
                }
            }
        }
        out.println("total " + NumberText.sig(total, 3) + " s");
        return total;
    }

    private static String pad(String s, int width) {
        StringBuilder b = new StringBuilder(s);
        while (b.length() < width) {
            b.append(' ');
        }
        return b.append(' ').toString();
    }
}
