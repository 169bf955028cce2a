package spanwright.cli;

import java.io.PrintStream;
import java.util.ArrayList;
import java.util.List;
import spanwright.bounds.Bounds;
import spanwright.bounds.BoundsReport;
import spanwright.bounds.Certificate;
import spanwright.bounds.ClassicalMeasures;
import spanwright.bounds.GeneralAdversary;
import spanwright.bounds.PositiveAdversary;
import spanwright.bounds.SensitiveBlocks;
import spanwright.bounds.TargetFunction;
import spanwright.facade.BoundsJson;
import spanwright.io.Json;
import spanwright.io.NumberText;
import spanwright.facade.ResultJson;
import spanwright.io.ScenarioReader;
import spanwright.model.Scenario;
import spanwright.model.SeededRandom;

/**
 * {@code bounds FILE [--json]}: the general and positive adversary bounds, the classical measures
 * with their witnesses, and how the scenario's √(W₊W₋) compares (optimality gap, speed-up over
 * classical), with the command-line size limits ({@link Bounds.Limits#CLI}). Exit status as
 * {@code analyze}, plus {@link #BOUND_VIOLATED} when a certified bound contradicts a theorem.
 */
final class BoundsCommand {
    /** Exit status when √(W₊W₋) &lt; ADV± or ADV &gt; ADV± beyond tolerance: a bug, reported loudly. */
    static final int BOUND_VIOLATED = 3;

    private BoundsCommand() {}

    static String usage() {
        return "  bounds [FILE] [--json] [--quiet] | bounds --bench [--seed S] [--large] | bounds --doc-table FILE...\n"
                + "      Lower bounds for the scenario's function: the general adversary ADV+- (an SDP, with its\n"
                + "      certified interval; up to " + GeneralAdversary.CLI_MAX_VARIABLES
                + " variables, minutes beyond 6), the positive adversary ADV, and D, C0, C1,\n"
                + "      s, bs, deg with witnesses; the optimality gap sqrt(W+ W-)/ADV+- and the speed-up D/sqrt(W+ W-).\n"
                + "      --bench times ADV+- and ADV for seeded random 5- and 6-variable functions, ADV and the\n"
                + "      classical measures for 10 variables; --large adds ADV+- for 7- and 8-variable functions and\n"
                + "      ADV for the 7-variable ones (minutes).\n"
                + "      --doc-table prints the demo table of docs/bounds.md for the given scenarios.\n";
    }

    static int run(List<String> args, PrintStream out, PrintStream err) {
        boolean json = false;
        boolean bench = false;
        boolean large = false;
        boolean docTable = false;
        boolean quiet = false;
        List<String> files = new ArrayList<>();
        long seed = 1;
        String file = null;
        for (int i = 0; i < args.size(); i++) {
            String a = args.get(i);
            if (a.equals("--json")) {
                json = true;
            } else if (a.equals("--bench")) {
                bench = true;
            } else if (a.equals("--quiet")) {
                quiet = true;
            } else if (a.equals("--large")) {
                large = true;
            } else if (a.equals("--doc-table")) {
                docTable = true;
            } else if (a.equals("--seed")) {
                if (i + 1 >= args.size()) {
                    throw new Main.UsageException("bounds: --seed needs a whole number");
                }
                try {
                    seed = Long.parseLong(args.get(++i));
                } catch (NumberFormatException e) {
                    throw new Main.UsageException("bounds: --seed needs a whole number, not " + args.get(i));
                }
            } else if (a.startsWith("-")) {
                throw new Main.UsageException("bounds: unknown option " + a);
            } else if (docTable) {
                files.add(a);
            } else if (file == null) {
                file = a;
            } else {
                throw new Main.UsageException("bounds: one FILE at most (got " + file + " and " + a + ")");
            }
        }
        if (bench) {
            bench(seed, large, out);
            return Main.OK;
        }
        if (docTable) {
            docTable(files, out);
            return Main.OK;
        }
        // with no FILE, the built-in default scenario, as analyze, optimize and simulate do
        Scenario sc = ScenarioReader.read(Main.readScenarioText(file));
        for (String w : sc.warnings()) {
            err.println("spanwright: warning: " + w);
        }
        if (sc.variableCount() > GeneralAdversary.PAGE_MAX_VARIABLES
                && sc.variableCount() <= GeneralAdversary.CLI_MAX_VARIABLES) {
            err.println("spanwright: note: the general adversary SDP for " + sc.variableCount()
                    + " variables may take minutes");
        }
        long start = System.nanoTime();
        BoundsReport r;
        try (Progress progress = Progress.start("bounds", err, quiet)) {
            progress.phase("lower bounds and classical measures (the general adversary SDP takes longest)");
            r = Bounds.compute(sc, Bounds.Limits.CLI);
        } catch (Bounds.BoundViolation e) {
            err.println("spanwright: BOUND VIOLATED (a bug in Spanwright, please report it): " + e.getMessage());
            return BOUND_VIOLATED;
        }
        double seconds = (System.nanoTime() - start) / 1e9;
        if (json) {
            out.println(Json.writePretty(BoundsJson.report(r)).trim());
        } else {
            out.print(summary(r, seconds));
        }
        return Boolean.FALSE.equals(r.measured().correct) ? Main.WRONG_REDUCTION : Main.OK;
    }

    /** A seeded random function on the whole cube of n variables (balanced in expectation). */
    static TargetFunction randomFunction(int n, long seed) {
        SeededRandom r = new SeededRandom(seed);
        long[] x = new long[1 << n];
        boolean[] v = new boolean[x.length];
        for (int k = 0; k < x.length; k++) {
            x[k] = k;
            v[k] = r.nextDouble() < 0.5;
        }
        return new TargetFunction(TargetFunction.names("x", n), x, v);
    }

    /**
     * The demo table of docs/bounds.md, one row per scenario file, from the same computation as
     * {@code bounds FILE} (so the document cannot drift from the code).
     */
    private static void docTable(List<String> files, PrintStream out) {
        out.println("| scenario | ADV± certified interval | relative width | status | ADV certified interval | relative width | √(W₊W₋) (optimised) | gap | D | speed-up |");
        out.println("|---|---|---|---|---|---|---|---|---|---|");
        for (String file : files) {
            Scenario sc = ScenarioReader.read(Main.readScenarioText(file));
            BoundsReport r = Bounds.compute(sc, Bounds.Limits.CLI);
            GeneralAdversary g = r.general();
            PositiveAdversary p = r.positive();
            String name = file.replaceAll(".*/", "").replace(".json", "");
            out.println("| " + name + " (" + sc.variableCount() + " variables) | "
                    + (g == null ? "—" : "[" + NumberText.sig(g.lower(), 7) + ", " + NumberText.sig(g.upper(), 7) + "]") + " | "
                    + (g == null ? "—" : relativeWidth(g.lower(), g.upper())) + " | "
                    + (g == null ? "—" : describe(g)) + " | "
                    + (p == null ? "—" : "[" + NumberText.sig(p.lower(), 7) + ", " + NumberText.sig(p.upper(), 7) + "]") + " | "
                    + (p == null ? "—" : relativeWidth(p.lower(), p.upper())) + " | "
                    + NumberText.sig(r.complexity(), 6)
                    + (r.optimised() == null ? "" : " (" + NumberText.sig(r.optimisedComplexity(), 6) + ")") + " | "
                    + NumberText.sig(r.optimalityGap(), 5) + " | "
                    + (r.classical() == null ? "—" : String.valueOf(r.classical().decisionTreeDepth())) + " | "
                    + NumberText.sig(r.speedup(), 3) + " |");
        }
    }

    /** (upper − lower) / upper to two figures; "0" for a point, "below 1e-9" under the solvers' tolerance. */
    private static String relativeWidth(double lower, double upper) {
        double w = upper > 0 ? (upper - lower) / upper : 0;
        return w <= 0 ? "0" : w < 1e-9 ? "below 1e-9" : NumberText.sig(w, 2);
    }

    /** Wall-clock seconds of each computation on three seeded random functions (one core). */
    private static void bench(long seed, boolean large, PrintStream out) {
        out.println("bounds benchmark (seeded random functions on the whole cube; one core; seconds per function)");
        // warm up the JIT on a small case
        GeneralAdversary.compute(randomFunction(4, seed));
        for (int n : new int[] {5, 6}) {
            for (int k = 0; k < 3; k++) {
                TargetFunction f = randomFunction(n, seed + k);
                long t = System.nanoTime();
                GeneralAdversary g = GeneralAdversary.compute(f);
                out.println("  ADV+-  n = " + n + "  seed " + (seed + k) + "  " + Main.pad(NumberText.sig((System.nanoTime() - t) / 1e9, 3) + " s", 10)
                        + "m = " + g.constraintCount() + ", " + g.iterations() + " iterations, ADV+- in ["
                        + NumberText.sig(g.lower(), 9) + ", " + NumberText.sig(g.upper(), 9) + "]");
                t = System.nanoTime();
                PositiveAdversary p = PositiveAdversary.compute(f);
                out.println("  ADV    n = " + n + "  seed " + (seed + k) + "  " + Main.pad(NumberText.sig((System.nanoTime() - t) / 1e9, 3) + " s", 10)
                        + (p.solvedBySdp() ? "minimax and SDP" : "minimax") + ", ADV in [" + NumberText.sig(p.lower(), 9) + ", "
                        + NumberText.sig(p.upper(), 9) + "], relative width " + NumberText.sig((p.upper() - p.lower()) / p.upper(), 2)
                        + " (minimax alone: upper " + NumberText.sig(p.minimaxUpper(), 9) + ")");
            }
        }
        if (large) {
            List<TargetFunction> fs = new ArrayList<>();
            List<String> names = new ArrayList<>();
            fs.add(TargetFunction.parse(TargetFunction.names("x", 7), "(x1 & x2) | (x3 & (x4 | x5)) | (x6 & x7)", null));
            names.add("read-once (x1&x2)|(x3&(x4|x5))|(x6&x7), ADV+- = sqrt 7");
            fs.add(TargetFunction.parse(TargetFunction.names("x", 7), "x1 ^ (x2 & x3) ^ (x4 | x5) ^ (x6 & !x7)", null));
            names.add("x1^(x2&x3)^(x4|x5)^(x6&!x7)");
            fs.add(randomFunction(7, seed));
            names.add("random, seed " + seed);
            fs.add(TargetFunction.parse(TargetFunction.names("x", 8), "x1 ^ (x2 & x3) ^ (x4 | x5) ^ maj(x6, x7, x8)", null));
            names.add("x1^(x2&x3)^(x4|x5)^maj(x6,x7,x8)");
            fs.add(randomFunction(8, seed));
            names.add("random, seed " + seed);
            for (int k = 0; k < fs.size(); k++) {
                TargetFunction f = fs.get(k);
                java.lang.management.ThreadMXBean mx = java.lang.management.ManagementFactory.getThreadMXBean();
                long cpu = mx.getCurrentThreadCpuTime();
                long t = System.nanoTime();
                GeneralAdversary g = GeneralAdversary.compute(f);
                double wall = (System.nanoTime() - t) / 1e9;
                double used = (mx.getCurrentThreadCpuTime() - cpu) / 1e9;
                out.println("  ADV+-  n = " + f.variableCount() + "  " + names.get(k) + ": " + NumberText.sig(wall, 3) + " s wall, "
                        + NumberText.sig(used, 3) + " s CPU; m = " + g.constraintCount()
                        + (g.schurOrder() > 0 ? ", Schur order " + g.schurOrder() : "") + ", " + g.eigenBlocks() + " of "
                        + 2 * f.variableCount() + " blocks decomposed, " + describe(g)
                        + "; [" + NumberText.sig(g.lower(), 9) + ", " + NumberText.sig(g.upper(), 9) + "], relative width "
                        + NumberText.sig(g.gap() / g.upper(), 2));
                if (f.variableCount() <= PositiveAdversary.SDP_MAX_VARIABLES) {
                    cpu = mx.getCurrentThreadCpuTime();
                    t = System.nanoTime();
                    PositiveAdversary p = PositiveAdversary.compute(f);
                    out.println("  ADV    n = " + f.variableCount() + "  " + names.get(k) + ": " + NumberText.sig((System.nanoTime() - t) / 1e9, 3)
                            + " s wall, " + NumberText.sig((mx.getCurrentThreadCpuTime() - cpu) / 1e9, 3) + " s CPU; "
                            + (p.solvedBySdp() ? "minimax and SDP" : "minimax") + ", ADV in [" + NumberText.sig(p.lower(), 9) + ", "
                            + NumberText.sig(p.upper(), 9) + "], relative width " + NumberText.sig((p.upper() - p.lower()) / p.upper(), 2)
                            + " (minimax alone: upper " + NumberText.sig(p.minimaxUpper(), 9) + ")");
                }
            }
        }
        for (int k = 0; k < 3; k++) {
            TargetFunction f = randomFunction(10, seed + k);
            long t = System.nanoTime();
            PositiveAdversary p = PositiveAdversary.compute(f);
            double tp = (System.nanoTime() - t) / 1e9;
            t = System.nanoTime();
            ClassicalMeasures c = ClassicalMeasures.compute(f);
            double tc = (System.nanoTime() - t) / 1e9;
            out.println("  ADV    n = 10 seed " + (seed + k) + "  " + Main.pad(NumberText.sig(tp, 3) + " s", 10) + "ADV in ["
                    + NumberText.sig(p.lower(), 6) + ", " + NumberText.sig(p.upper(), 6) + "]");
            out.println("  D..deg n = 10 seed " + (seed + k) + "  " + Main.pad(NumberText.sig(tc, 3) + " s", 10) + "D = "
                    + c.decisionTreeDepth() + ", C = " + c.c() + ", s = " + c.sensitivity() + ", bs = " + c.blockSensitivity()
                    + ", deg = " + c.degree());
        }
    }

    private static String line(String label, String text) {
        return Main.row(label, 16, text);
    }

    /** The human summary: short, aligned, pasteable into notes. */
    static String summary(BoundsReport r, double seconds) {
        Scenario sc = r.scenario();
        StringBuilder sb = new StringBuilder();
        sb.append(sc.title().isEmpty() ? "(untitled scenario)" : sc.title()).append('\n');
        sb.append(line("function", sc.functionText()));
        sb.append(line("domain", r.measured().domainText + " inputs, " + sc.promise().describe(sc.variables())
                + (r.measured().method.equals("structure") ? " (not enumerated: W+ and W- by the structural engine)" : "")));
        GeneralAdversary g = r.general();
        if (g == null) {
            sb.append(line("ADV+-", "not computed: " + r.reason("general")));
        } else {
            sb.append(line("ADV+-", NumberText.sig(g.lower(), 8) + "   certified in [" + NumberText.sig(g.lower(), 10)
                    + ", " + NumberText.sig(g.upper(), 10) + "]; " + describe(g)));
        }
        PositiveAdversary p = r.positive();
        if (p == null) {
            sb.append(line("ADV", "not computed: " + r.reason("positive")));
        } else {
            sb.append(line("ADV", NumberText.sig(p.lower(), 8) + "   certified in [" + NumberText.sig(p.lower(), 10)
                    + ", " + NumberText.sig(p.upper(), 10) + "]; "
                    + (p.solvedBySdp() ? "minimax form and the SDP with Gamma >= 0" : "minimax form")));
        }
        ClassicalMeasures c = r.classical();
        if (c == null) {
            sb.append(line("classical", "not computed: " + r.reason("classical")));
        } else {
            TargetFunction f = c.function();
            sb.append(line("D", c.decisionTreeDepth() + "   optimal decision tree with " + c.decisionTree().size()
                    + " nodes (--json prints it)"));
            sb.append(line("C0 / C1 / C", c.c0() + " / " + c.c1() + " / " + c.c()
                    + certificateText(c.zeroCertificate(), f) + certificateText(c.oneCertificate(), f)));
            sb.append(line("s", c.sensitivity() + blocksText(c.sensitiveInput(), f)));
            sb.append(line("bs", c.blockSensitivity() + blocksText(c.sensitiveBlocks(), f)));
            if (c.hasDegree()) {
                List<String> names = f.names(c.topMonomial().variables());
                sb.append(line("deg", c.degree() + "   top monomial " + (names.isEmpty() ? "1" : String.join("·", names))
                        + " with coefficient " + c.topMonomial().coefficient()));
            } else {
                sb.append(line("deg", "not computed: " + r.reason("deg")));
            }
        }
        sb.append(line("sqrt(W+ W-)", Double.isNaN(r.complexity()) ? "undefined: " + r.reason("complexity")
                : (r.measured().exact ? "" : ">= ") + NumberText.sig(r.complexity(), 10) + "   (this graph, current weights"
                        + (r.measured().exact ? ")" : "; a time budget left a certified interval, its lower end shown)")));
        sb.append(line("optimality gap", Double.isNaN(r.optimalityGap()) ? "not computed: " + r.reason("optimalityGap")
                : NumberText.sig(r.optimalityGap(), 6) + "   sqrt(W+ W-) / ADV+- (1 = optimal graph)"));
        if (r.optimised() != null) {
            sb.append(line("optimised", NumberText.sig(r.optimisedComplexity(), 10) + "   sqrt(W+ W-) of this graph with "
                    + "optimised weights (" + r.optimised().status.name().toLowerCase().replace('_', ' ') + ")"
                    + (Double.isNaN(r.optimisedGap()) ? "" : ", gap " + NumberText.sig(r.optimisedGap(), 6))));
        }
        sb.append(line("speed-up", Double.isNaN(r.speedup()) ? "not computed: " + r.reason("speedup")
                : NumberText.sig(r.speedup(), 6) + "   D / sqrt(W+ W-) over the best deterministic algorithm"));
        sb.append("  computed in ").append(NumberText.sig(seconds, 3)).append(" s\n");
        sb.append("  note: ").append(ResultJson.CONVENTION).append(".\n");
        sb.append("  caution: ").append(Bounds.CAUTION).append(".\n");
        return sb.toString();
    }

    private static String describe(GeneralAdversary g) {
        String method = g.method() == GeneralAdversary.Method.INTERIOR_POINT ? "interior point"
                : g.method() == GeneralAdversary.Method.SPLITTING ? "splitting method" : "no SDP needed";
        String status = g.status() == GeneralAdversary.Status.CONSTANT ? "f is constant"
                : g.status() == GeneralAdversary.Status.CONVERGED ? "converged" : "stopped early (interval still valid)";
        return method + ", " + g.iterations() + " iterations, " + status;
    }

    private static String certificateText(Certificate c, TargetFunction f) {
        if (c == null) {
            return "";
        }
        List<String> fixed = new ArrayList<>();
        for (int i = 0; i < f.variableCount(); i++) {
            if ((c.fixed() & f.variableMask(i)) != 0) {
                fixed.add(f.variables().get(i) + "=" + (f.bit(c.input(), i) ? 1 : 0));
            }
        }
        return "   " + (c.value() ? "1" : "0") + "-certificate of " + f.format(c.input()) + ": "
                + (fixed.isEmpty() ? "(none needed)" : String.join(" ", fixed));
    }

    private static String blocksText(SensitiveBlocks b, TargetFunction f) {
        if (b.count() == 0) {
            return "";
        }
        StringBuilder sb = new StringBuilder("   at ").append(f.format(b.input())).append(':');
        for (long block : b.blocks()) {
            sb.append(" {").append(String.join(", ", f.names(block))).append('}');
        }
        return sb.toString();
    }
}
