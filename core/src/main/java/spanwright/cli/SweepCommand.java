package spanwright.cli;

import spanwright.io.NumberText;
import java.io.PrintStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicLong;
import spanwright.analysis.Summary;
import spanwright.io.Json;
import spanwright.model.ScenarioException;
import spanwright.optimize.OptimizerOptions;
import spanwright.sweep.BuiltInFamilies;
import spanwright.sweep.Family;
import spanwright.sweep.FamilyTemplate;
import spanwright.sweep.SizeList;
import spanwright.sweep.SweepDocument;
import spanwright.sweep.SweepOptions;
import spanwright.sweep.SweepSize;
import spanwright.sweep.SweepTables;

/**
 * {@code sweep FAMILY|FILE.json [--n SIZES] …}: a family swept over sizes, on all cores by default
 * (sizes in parallel, and inside a size contiguous input ranges whose summaries merge exactly, so
 * the numbers do not depend on the thread count); {@code --shards N --shard i} computes shard i
 * only (a part file for {@code merge}); {@code --emit-slurm DIR} writes a Slurm job array and the
 * merge job. The output file keeps every finished size, and a restarted sweep skips them.
 *
 * <p>Threads live here, in the command-line tool only; the core's {@link SweepSize} is
 * single-threaded (the page drives it from its worker).
 */
final class SweepCommand {
    /** Smallest input range handed to one thread. */
    static final long CHUNK = 1L << 14;

    private SweepCommand() {}

    /** Parsed command line. */
    static final class Args {
        Family family;
        List<Integer> sizes;
        SweepOptions options = SweepOptions.defaults();
        int threads = Runtime.getRuntime().availableProcessors();
        String output;
        String csv;
        String latex;
        boolean resultsOnly;
        boolean json;
        boolean quiet;
        int shards = 1;
        int shard = -1;
        int fitFrom;
        int fitLast;
        String slurmDir;
        String slurmTime;
        String slurmPartition;
        /** The arguments to repeat in the job script (without -o, shards, slurm options), files absolute. */
        final List<String> repeat = new ArrayList<>();
    }

    static String usage() {
        return "  sweep FAMILY|FILE.json [--n SIZES] [family options] [--method auto|every|undominated|orbits|structure]\n"
                + "        [--iterations N] [--seconds T] [--starts K] [--seed S] [--no-bounds] [--bounds-max-vars N]\n"
                + "        [--max-inputs N] [--fit-from N] [--fit-last K] [--threads K] [-o OUT.json] [--csv OUT.csv]\n"
                + "        [--latex OUT.tex] [--results-only] [--json] [--quiet]\n"
                + "        [--shards N --shard I] [--emit-slurm DIR [--slurm-time HH:MM:SS] [--slurm-partition P]]\n"
                + "      Build, check, optimise (per-size budget), bound and fit a family over sizes SIZES\n"
                + "      (e.g. 2..20, 4..64*2, 3,5,9). Families: " + String.join(", ", BuiltInFamilies.NAMES) + ",\n"
                + "      or a family file; options --k EXPR (threshold), --fan-in K --root and|or (and-or-tree),\n"
                + "      --of FILE (power). -o keeps finished sizes; a rerun skips them.\n"
                + "  merge PARTS... -o OUT.json [--csv OUT.csv] [--latex OUT.tex] [--results-only] [--fit-from N]\n"
                + "        [--fit-last K] [--json]\n"
                + "      Combine the part files of a sharded sweep into the result (bit for bit the unsharded one).\n";
    }

    static String value(List<String> args, int i, String option) {
        if (i >= args.size()) {
            throw new Main.UsageException("sweep: " + option + " needs a value");
        }
        return args.get(i);
    }

    /** As {@link #whole(String, String, int)} with an upper end (the optimiser's ranges). */
    static int whole(String v, String option, int min, long max) {
        return (int) Main.whole("sweep", option, v, min, max);
    }

    static int whole(String v, String option, int min) {
        try {
            int k = Integer.parseInt(v.trim());
            if (k < min) {
                throw new NumberFormatException();
            }
            return k;
        } catch (NumberFormatException e) {
            throw new Main.UsageException("sweep: " + option + " takes a whole number ≥ " + min + ", got " + v);
        }
    }

    static String readFile(String file) {
        return Main.readScenarioText(file);
    }

    static Args parse(List<String> args) {
        Args a = new Args();
        String familyArg = null;
        String ofFile = null;
        String sizes = null;
        Map<String, Object> familyOptions = new LinkedHashMap<>();
        for (int i = 0; i < args.size(); i++) {
            String x = args.get(i);
            switch (x) {
                case "--n": sizes = value(args, ++i, x); a.repeat.add(x); a.repeat.add(sizes); break;
                case "--k": familyOptions.put("k", value(args, ++i, x)); a.repeat.add(x); a.repeat.add(args.get(i)); break;
                case "--fan-in":
                    familyOptions.put("fanIn", (double) whole(value(args, ++i, x), x, 2));
                    a.repeat.add(x);
                    a.repeat.add(args.get(i));
                    break;
                case "--root": familyOptions.put("root", value(args, ++i, x)); a.repeat.add(x); a.repeat.add(args.get(i)); break;
                case "--of": {
                    String f = value(args, ++i, x);
                    ofFile = f;
                    familyOptions.put("scenario", Json.parse(readFile(f)));
                    a.repeat.add(x);
                    a.repeat.add(Path.of(f).toAbsolutePath().toString());
                    break;
                }
                case "--method": {
                    String m = value(args, ++i, x);
                    SweepOptions.Method me = SweepOptions.Method.of(m);
                    if (me == null) {
                        throw new Main.UsageException("sweep: --method is auto, every, undominated, orbits or structure, got " + m);
                    }
                    a.options = a.options.withMethod(me);
                    a.repeat.add(x);
                    a.repeat.add(m);
                    break;
                }
                case "--iterations":
                    a.options = a.options.withOptimizeIterations(whole(value(args, ++i, x), x, 0, OptimizerOptions.MAX_ITERATIONS));
                    a.repeat.add(x);
                    a.repeat.add(args.get(i));
                    break;
                case "--seconds":
                    a.options = a.options.withOptimizeMillis(1000L * whole(value(args, ++i, x), x, 1, OptimizerOptions.MAX_SECONDS));
                    a.repeat.add(x);
                    a.repeat.add(args.get(i));
                    break;
                case "--starts":
                    a.options = a.options.withStarts(whole(value(args, ++i, x), x, 1, OptimizerOptions.MAX_STARTS));
                    a.repeat.add(x);
                    a.repeat.add(args.get(i));
                    break;
                case "--seed":
                    a.options = a.options.withSeed(whole(value(args, ++i, x), x, 0));
                    a.repeat.add(x);
                    a.repeat.add(args.get(i));
                    break;
                case "--no-bounds": a.options = a.options.withBounds(false, a.options.boundsMaxVariables()); a.repeat.add(x); break;
                case "--bounds-max-vars":
                    a.options = a.options.withBounds(a.options.bounds(), whole(value(args, ++i, x), x, 0));
                    a.repeat.add(x);
                    a.repeat.add(args.get(i));
                    break;
                case "--max-inputs": {
                    String v = value(args, ++i, x);
                    long m;
                    try {
                        m = v.startsWith("2^") ? 1L << Integer.parseInt(v.substring(2)) : Long.parseLong(v);
                    } catch (NumberFormatException e) {
                        throw new Main.UsageException("sweep: --max-inputs takes a number or 2^K, got " + v);
                    }
                    a.options = a.options.withMaxInputs(m);
                    a.repeat.add(x);
                    a.repeat.add(v);
                    break;
                }
                case "--fit-from": a.fitFrom = whole(value(args, ++i, x), x, 0); a.repeat.add(x); a.repeat.add(args.get(i)); break;
                case "--fit-last": a.fitLast = whole(value(args, ++i, x), x, 0); a.repeat.add(x); a.repeat.add(args.get(i)); break;
                case "--threads": a.threads = whole(value(args, ++i, x), x, 1); break;
                case "-o": a.output = value(args, ++i, x); break;
                case "--csv": a.csv = value(args, ++i, x); break;
                case "--latex": a.latex = value(args, ++i, x); break;
                case "--results-only": a.resultsOnly = true; a.repeat.add(x); break;
                case "--json": a.json = true; break;
                case "--quiet": a.quiet = true; break;
                case "--shards": a.shards = whole(value(args, ++i, x), x, 1); break;
                case "--shard": a.shard = whole(value(args, ++i, x), x, 0); break;
                case "--emit-slurm": a.slurmDir = value(args, ++i, x); break;
                case "--slurm-time": a.slurmTime = value(args, ++i, x); break;
                case "--slurm-partition": a.slurmPartition = value(args, ++i, x); break;
                default:
                    if (x.startsWith("-")) {
                        throw new Main.UsageException("sweep: unknown option " + x);
                    }
                    if (familyArg != null) {
                        throw new Main.UsageException("sweep: one FAMILY at most (got " + familyArg + " and " + x + ")");
                    }
                    familyArg = x;
            }
        }
        if (familyArg == null) {
            throw new Main.UsageException("sweep: name a FAMILY (" + String.join(", ", BuiltInFamilies.NAMES)
                    + ") or a family file");
        }
        boolean familyFile = familyArg.endsWith(".json") || Files.isRegularFile(Path.of(familyArg));
        OutputFiles.refuseClashes("sweep", java.util.Arrays.asList(familyFile ? familyArg : null, ofFile),
                java.util.Arrays.asList(a.output, a.csv, a.latex));
        Map<String, Object> spec = new LinkedHashMap<>();
        if (familyFile) {
            Object doc = Json.parse(readFile(familyArg));
            if (!FamilyTemplate.isFamilyDocument(doc)) {
                throw new Main.UsageException("sweep: " + familyArg + " is not a family file (\"format\": \""
                        + FamilyTemplate.FORMAT + "\"); see docs/sweeps.md");
            }
            spec.put("family", "template");
            spec.put("template", doc);
            a.repeat.add(0, Path.of(familyArg).toAbsolutePath().toString());
        } else {
            spec.put("family", familyArg);
            a.repeat.add(0, familyArg);
        }
        spec.putAll(familyOptions);
        try {
            a.family = BuiltInFamilies.fromSpec(spec, "$");
        } catch (ScenarioException e) {
            String p = e.path();
            String opt = p.endsWith(".k") ? "--k" : p.endsWith(".fanIn") ? "--fan-in" : p.endsWith(".root") ? "--root"
                    : p.startsWith("$.scenario") ? "--of" : p.equals("$.family") ? "FAMILY" : p;
            throw new Main.UsageException("sweep: " + opt + ": " + e.getMessage() + " [" + e.code() + "]");
        }
        a.sizes = SizeList.parse(sizes == null ? a.family.defaultSizes() : sizes, "--n");
        if (a.shards > 1 && a.shard < 0 && a.slurmDir == null) {
            throw new Main.UsageException("sweep: --shards " + a.shards + " needs --shard I (0 … " + (a.shards - 1)
                    + "), or --emit-slurm DIR to write the job array");
        }
        if (a.shard >= a.shards) {
            throw new Main.UsageException("sweep: --shard " + a.shard + " is not below --shards " + a.shards);
        }
        if (a.shard >= 0 && a.output == null) {
            throw new Main.UsageException("sweep: a shard writes its part with -o PART.json (for merge)");
        }
        return a;
    }

    static int run(List<String> argv, PrintStream out, PrintStream err) {
        Args a = parse(argv);
        if (a.slurmDir != null) {
            return SlurmScript.emit(a, out, err);
        }
        boolean part = a.shard >= 0;
        long start = System.nanoTime();
        // resume: what the output file already holds
        Map<Integer, Map<String, Object>> kept = new TreeMap<>();
        if (a.output != null && Files.exists(Path.of(a.output))) {
            kept = resume(a, part, err);
        }
        Runner r = new Runner(a, part, kept, err);
        r.run();
        Map<String, Object> doc = r.document(true, elapsed(start));
        if (!part) {
            writeTables(a.csv, a.latex, doc);
            if (a.json) {
                out.println(Json.writePretty(a.resultsOnly ? SweepDocument.resultsOnly(doc) : doc).trim());
            } else {
                out.print(SweepTables.text(doc));
            }
        } else if (!a.quiet) {
            err.println("[sweep] shard " + a.shard + " of " + a.shards + " written to " + a.output);
        }
        return r.wrongReduction() ? Main.WRONG_REDUCTION : Main.OK;
    }

    static double elapsed(long start) {
        return (System.nanoTime() - start) / 1e9;
    }

    static void writeTables(String csv, String latex, Map<String, Object> doc) {
        if (csv != null) {
            write(csv, SweepTables.csv(doc));
        }
        if (latex != null) {
            write(latex, SweepTables.latex(doc));
        }
    }

    /** Writes whole or not at all ({@link OutputFiles#write}). */
    static void write(String file, String text) {
        OutputFiles.write("sweep", file, text);
    }

    /** The finished sizes of an earlier run of the same sweep in {@code a.output}. */
    @SuppressWarnings("unchecked")
    static Map<Integer, Map<String, Object>> resume(Args a, boolean part, PrintStream err) {
        Object doc;
        try {
            doc = Json.parse(readFile(a.output));
        } catch (ScenarioException e) {
            throw new Main.UsageException("sweep: " + a.output + " exists but is not readable JSON (" + e.getMessage()
                    + "); delete it or choose another -o");
        }
        Map<String, Object> d = doc instanceof Map ? (Map<String, Object>) doc : Map.of();
        String format = part ? SweepDocument.PART_FORMAT : SweepDocument.FORMAT;
        if (!format.equals(d.get("format"))) {
            throw new Main.UsageException("sweep: " + a.output + " exists and is not a " + (part ? "sweep part" : "sweep result")
                    + "; delete it or choose another -o");
        }
        boolean same = Json.write(d.get("family")).equals(Json.write(a.family.spec()))
                && Json.write(d.get("options")).equals(Json.write(a.options.toJson()))
                && (!part || (Double.valueOf(a.shards).equals(d.get("shards")) && Double.valueOf(a.shard).equals(d.get("shard"))
                        && String.valueOf(d.get("sizes")).equals(SizeList.format(a.sizes))));
        if (!same) {
            throw new Main.UsageException("sweep: " + a.output + " holds another sweep (family, options"
                    + (part ? ", sizes or shard" : "") + " differ); delete it or choose another -o");
        }
        Map<Integer, Map<String, Object>> kept = new TreeMap<>();
        try {
            for (Object o : (List<Object>) d.get(part ? "units" : "rows")) {
                Map<String, Object> row = (Map<String, Object>) o;
                int size = ((Number) row.get("size")).intValue();
                if (a.sizes.contains(size)) {
                    kept.put(size, row);
                }
            }
        } catch (ClassCastException | NullPointerException e) {
            throw new Main.UsageException("sweep: " + a.output + " is damaged (its " + (part ? "units" : "rows")
                    + " cannot be read); delete it or choose another -o");
        }
        if (!kept.isEmpty() && !a.quiet) {
            err.println("[sweep] resuming: " + kept.size() + " finished size(s) kept from " + a.output + ": " + kept.keySet());
        }
        return kept;
    }

    /** Runs the sizes on a thread pool and keeps the output file up to date. */
    static final class Runner {
        final Args a;
        final boolean part;
        final Map<Integer, Map<String, Object>> done;
        final PrintStream err;
        final Object lock = new Object();
        final AtomicInteger finished = new AtomicInteger();
        final long started = System.nanoTime();
        volatile boolean wrong;
        /** The first failure that ends the whole sweep (an Error, a bug, a failed write); guarded by lock. */
        Throwable fatal;
        /** Set when the sweep has ended (or failed): no worker writes the output after that; guarded by lock. */
        boolean stopped;

        Runner(Args a, boolean part, Map<Integer, Map<String, Object>> kept, PrintStream err) {
            this.a = a;
            this.part = part;
            this.done = new TreeMap<>(kept);
            this.err = err;
        }

        boolean wrongReduction() {
            for (Map<String, Object> r : done.values()) {
                Object red = r.get("reduction");
                if (red instanceof Map && Boolean.FALSE.equals(((Map<?, ?>) red).get("correct"))) {
                    return true;
                }
            }
            return wrong;
        }

        /** When the last line was printed (System.nanoTime()); guarded by err. */
        long lastLine = System.nanoTime();

        void log(String s) {
            if (!a.quiet) {
                synchronized (err) {
                    err.println("[sweep] " + s);
                    lastLine = System.nanoTime();
                }
            }
        }

        /**
         * Waits for every size, printing a line when the sweep has been silent for a while (a size
         * optimising or bounding for minutes): the policy of {@link Progress}, at most every 5 s
         * and less often as the sweep grows.
         */
        void await(CountDownLatch latch, int sizes) throws InterruptedException {
            long every = (long) (Progress.DEFAULT_EVERY * 1e9);
            String e = System.getProperty(Progress.EVERY_PROPERTY);
            if (e != null) {
                try {
                    every = (long) (Math.max(0, Double.parseDouble(e)) * 1e9);
                } catch (NumberFormatException x) {
                    every = (long) (Progress.DEFAULT_EVERY * 1e9);
                }
            }
            while (!latch.await(250, java.util.concurrent.TimeUnit.MILLISECONDS)) {
                long now = System.nanoTime();
                long gap = Math.max(every, Math.min(60_000_000_000L, (now - started) / 10));
                boolean quietFor;
                synchronized (err) {
                    quietFor = now - lastLine >= gap;
                }
                if (quietFor) {
                    log("working: " + finished.get() + " of " + sizes + " size(s) finished, " + seconds(now - started)
                            + " so far");
                }
            }
        }

        void run() {
            List<Integer> todo = new ArrayList<>();
            for (int s : a.sizes) {
                if (!done.containsKey(s)) {
                    todo.add(s);
                }
            }
            if (todo.isEmpty()) {
                log("nothing to do: every size is finished");
                return;
            }
            log(a.family.title() + ": " + todo.size() + " size(s) to compute on " + a.threads + " thread(s)"
                    + (part ? ", shard " + a.shard + " of " + a.shards : ""));
            ExecutorService pool = Executors.newFixedThreadPool(a.threads, r -> {
                Thread t = new Thread(r, "sweep");
                t.setDaemon(true);
                return t;
            });
            CountDownLatch latch = new CountDownLatch(todo.size());
            for (int s : todo) {
                int index = a.sizes.indexOf(s);
                pool.execute(guarded(latch, () -> {
                    try {
                        size(pool, index, s, latch);
                    } catch (ScenarioException e) {
                        failed(s, e, latch); // bad input for this size: a row that says so; the others go on
                    }
                }));
            }
            try {
                await(latch, todo.size());
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                abort(e, latch);
            }
            Throwable f;
            synchronized (lock) {
                stopped = true; // a worker still running can no longer write the output
                f = fatal;
            }
            pool.shutdownNow();
            if (f instanceof RuntimeException) {
                throw (RuntimeException) f; // a failed write is exit 2, anything else exit 3 (Main)
            }
            if (f instanceof Error) {
                throw (Error) f;
            }
            if (f != null) {
                throw new IllegalStateException("sweep interrupted", f);
            }
        }

        /**
         * A pool task that cannot die silently: any Throwable (an Error such as a stack overflow or
         * out of memory, a bug, a failed write of the output) ends the whole sweep through
         * {@link #abort}, so the main thread never waits for a size that will not come.
         */
        Runnable guarded(CountDownLatch latch, Runnable body) {
            return () -> {
                try {
                    body.run();
                } catch (Throwable e) { // deliberately everything: see above
                    abort(e, latch);
                }
            };
        }

        /** Records the first fatal failure, stops all writes and releases the main thread. */
        void abort(Throwable e, CountDownLatch latch) {
            synchronized (lock) {
                if (fatal == null) {
                    fatal = e;
                }
                stopped = true;
            }
            while (latch.getCount() > 0) {
                latch.countDown();
            }
        }

        void failed(int size, ScenarioException e, CountDownLatch latch) {
            Map<String, Object> row = new LinkedHashMap<>();
            row.put("size", size);
            row.put("status", "error");
            Map<String, Object> er = new LinkedHashMap<>();
            er.put("code", e.code());
            er.put("message", e.getMessage());
            er.put("path", e.path());
            row.put("error", er);
            log("size " + size + ": " + e.describe() + " [" + e.code() + "]");
            complete(size, row, latch);
        }

        /** Builds, prepares and evaluates one size (its ranges on the pool). */
        void size(ExecutorService pool, int index, int size, CountDownLatch latch) {
            long t0 = System.nanoTime();
            SweepSize s = SweepSize.build(a.family, size, a.options);
            long[] range = SweepDocument.owned(index, s, part ? a.shards : 1, part ? a.shard : 0);
            if (range == null) {
                latch.countDown(); // another shard's size
                return;
            }
            s.prepare();
            heap(s, "prepare");
            if (s.status() != SweepSize.Status.OK) {
                log("size " + size + ": " + s.status().name().toLowerCase() + ": " + reason(s.metadata()));
                finish(s, null, latch);
                return;
            }
            long from = range[0];
            long to = range[1] < 0 ? s.units() : range[1];
            long units = to - from;
            log("size " + size + " (n = " + s.variables() + "): " + s.method().key + ", " + units + " input(s) to evaluate"
                    + (part && range[1] >= 0 ? " (range " + from + " … " + to + " of " + s.units() + ")" : "")
                    + ", prepared in " + seconds(System.nanoTime() - t0));
            int chunks = (int) Math.max(1, Math.min(4L * a.threads, units / CHUNK));
            if (chunks == 1) {
                long te = System.nanoTime();
                Summary sum = s.evaluate(from, to);
                evalTiming(s, te, units, 1);
                finish(s, sum, latch);
                return;
            }
            Summary[] parts = new Summary[chunks];
            AtomicInteger left = new AtomicInteger(chunks);
            AtomicLong evaluated = new AtomicLong();
            long te = System.nanoTime();
            long[] lastPrint = {System.nanoTime()};
            for (int c = 0; c < chunks; c++) {
                long f = from + SweepDocument.split(units, chunks, c);
                long t = from + SweepDocument.split(units, chunks, c + 1);
                int ci = c;
                pool.execute(guarded(latch, () -> {
                    parts[ci] = s.evaluate(f, t);
                    long e2 = evaluated.addAndGet(t - f);
                    synchronized (lastPrint) {
                        if (System.nanoTime() - lastPrint[0] > 5_000_000_000L && e2 < units) {
                            lastPrint[0] = System.nanoTime();
                            log("size " + size + ": " + (100 * e2 / units) + "% of " + units + " inputs");
                        }
                    }
                    if (left.decrementAndGet() == 0) {
                        List<Summary> l = new ArrayList<>();
                        for (Summary p : parts) {
                            l.add(p);
                        }
                        evalTiming(s, te, units, chunks);
                        finish(s, Summary.merge(l), latch);
                    }
                }));
            }
        }

        void evalTiming(SweepSize s, long t0, long units, int ranges) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("ms", (System.nanoTime() - t0) / 1e6);
            m.put("bytes", s.evaluationBytes() * Math.min(ranges, a.threads));
            m.put("units", units);
            m.put("ranges", ranges);
            m.put("threads", Math.min(ranges, a.threads));
            s.timing().put("evaluate", m);
            heap(s, "evaluate");
        }

        void heap(SweepSize s, String step) {
            Runtime rt = Runtime.getRuntime();
            Object m = s.timing().get(step);
            if (m instanceof Map) {
                @SuppressWarnings("unchecked")
                Map<String, Object> mm = (Map<String, Object>) m;
                mm.put("heapBytes", rt.totalMemory() - rt.freeMemory());
            }
        }

        void finish(SweepSize s, Summary summary, CountDownLatch latch) {
            Map<String, Object> entry;
            if (part) {
                entry = SweepDocument.unit(s, summary);
            } else {
                entry = SweepSize.row(s.metadata(), summary);
                entry.put("timing", s.timing());
                Object red = entry.get("reduction");
                if (red instanceof Map && Boolean.FALSE.equals(((Map<?, ?>) red).get("correct"))) {
                    wrong = true;
                }
                log("size " + s.size() + " done: sqrt(W+ W-) = " + entry.get("complexity") + "  ("
                        + (finished.get() + 1) + " finished, " + seconds(System.nanoTime() - started) + ")");
            }
            complete(s.size(), entry, latch);
        }

        void complete(int size, Map<String, Object> entry, CountDownLatch latch) {
            synchronized (lock) {
                if (stopped) {
                    return; // the sweep has failed elsewhere: leave the output as it is
                }
                done.put(size, entry);
                finished.incrementAndGet();
                if (a.output != null) {
                    Map<String, Object> doc = document(false, elapsed(started));
                    write(a.output, Json.writePretty(a.resultsOnly ? SweepDocument.resultsOnly(doc) : doc));
                }
            }
            latch.countDown();
        }

        /** The result (or part) document of what is done; written to -o when {@code last}. */
        Map<String, Object> document(boolean last, double seconds) {
            Map<String, Object> run = new LinkedHashMap<>();
            run.put("threads", a.threads);
            run.put("shards", a.shards);
            run.put("seconds", seconds);
            run.put("finished", done.size());
            run.put("sizes", a.sizes.size());
            Map<String, Object> doc;
            synchronized (lock) {
                if (part) {
                    doc = SweepDocument.head(SweepDocument.PART_FORMAT, a.family, a.sizes, a.options);
                    doc.put("shards", a.shards);
                    doc.put("shard", a.shard);
                    doc.put("units", new ArrayList<Object>(done.values()));
                    doc.put("run", run);
                } else {
                    doc = SweepDocument.result(a.family, a.sizes, a.options, new ArrayList<>(done.values()), a.fitFrom,
                            a.fitLast, run);
                }
                if (last && a.output != null) {
                    write(a.output, Json.writePretty(a.resultsOnly ? SweepDocument.resultsOnly(doc) : doc));
                }
            }
            return doc;
        }
    }

    static String reason(Map<String, Object> m) {
        Object r = m.get("reason");
        if (r == null && m.get("error") instanceof Map) {
            r = ((Map<?, ?>) m.get("error")).get("message");
        }
        return String.valueOf(r);
    }

    static String seconds(long nanos) {
        return spanwright.io.NumberText.sig(nanos / 1e9, 3) + " s";
    }
}
