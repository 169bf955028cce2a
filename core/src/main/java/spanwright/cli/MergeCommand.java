package spanwright.cli;

import java.io.PrintStream;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.io.Json;
import spanwright.model.ScenarioException;
import spanwright.sweep.SweepDocument;
import spanwright.sweep.SweepTables;

/**
 * {@code merge PARTS… -o OUT.json [--csv F] [--latex F] [--results-only] [--fit-from N]
 * [--fit-last K] [--json] [--quiet]}: combines the part files of a sharded sweep into its result.
 * The summaries of the input ranges merge exactly, so the result is bit for bit that of the
 * unsharded sweep (apart from times and run facts).
 */
final class MergeCommand {
    private MergeCommand() {}

    static int run(List<String> args, PrintStream out, PrintStream err) {
        List<String> files = new ArrayList<>();
        String output = null;
        String csv = null;
        String latex = null;
        boolean resultsOnly = false;
        boolean json = false;
        boolean quiet = false;
        int fitFrom = 0;
        int fitLast = 0;
        for (int i = 0; i < args.size(); i++) {
            String x = args.get(i);
            switch (x) {
                case "-o": output = SweepCommand.value(args, ++i, x); break;
                case "--csv": csv = SweepCommand.value(args, ++i, x); break;
                case "--latex": latex = SweepCommand.value(args, ++i, x); break;
                case "--results-only": resultsOnly = true; break;
                case "--json": json = true; break;
                case "--quiet": quiet = true; break;
                case "--fit-from": fitFrom = SweepCommand.whole(SweepCommand.value(args, ++i, x), x, 0); break;
                case "--fit-last": fitLast = SweepCommand.whole(SweepCommand.value(args, ++i, x), x, 0); break;
                default:
                    if (x.startsWith("-")) {
                        throw new Main.UsageException("merge: unknown option " + x);
                    }
                    files.add(x);
            }
        }
        if (files.isEmpty()) {
            throw new Main.UsageException("merge: name the part files (written by sweep --shards N --shard I -o PART.json)");
        }
        if (output == null && !json) {
            throw new Main.UsageException("merge: write the result with -o OUT.json (or print it with --json)");
        }
        OutputFiles.refuseClashes("merge", files, java.util.Arrays.asList(output, csv, latex));
        long start = System.nanoTime();
        List<Object> parts = new ArrayList<>();
        for (String f : files) {
            try {
                parts.add(Json.parse(SweepCommand.readFile(f)));
            } catch (ScenarioException e) {
                throw new Main.UsageException("merge: " + f + ": " + e.getMessage());
            }
        }
        Map<String, Object> run = new LinkedHashMap<>();
        run.put("mergedParts", files.size());
        Map<String, Object> doc;
        try {
            doc = SweepDocument.merge(parts, files, fitFrom, fitLast, run);
        } catch (ScenarioException e) {
            throw new Main.UsageException("merge: " + e.path() + ": " + e.getMessage() + " [" + e.code() + "]");
        } catch (ClassCastException | NullPointerException | IllegalArgumentException e) {
            throw new Main.UsageException("merge: a part file is damaged or was edited by hand (a key is missing or of"
                    + " the wrong type: " + e.getMessage() + "); write it again with sweep --shards N --shard I");
        }
        run.put("seconds", SweepCommand.elapsed(start));
        Object written = resultsOnly ? SweepDocument.resultsOnly(doc) : doc;
        if (output != null) {
            SweepCommand.write(output, Json.writePretty(written));
        }
        SweepCommand.writeTables(csv, latex, doc);
        if (json) {
            out.println(Json.writePretty(written).trim());
        } else if (!quiet) {
            out.print(SweepTables.text(doc));
        }
        return Main.OK;
    }
}
