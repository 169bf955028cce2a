package spanwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import spanwright.io.Json;
import spanwright.sweep.SweepDocument;
import spanwright.sweep.SweepTables;

/**
 * The sweep and merge commands: sharded and unsharded results identical bit for bit (the issue's
 * test), independent of the thread count; a stopped sweep resumes without recomputing finished
 * sizes; the Slurm scripts; the tables; clear usage errors. Expectations come from the issue's
 * "Beyond one machine" and "Tests" sections.
 */
class SweepCommandTest {
    @TempDir
    Path dir;

    /** Runs the tool in-process (the harness of {@link MainTest}). */
    static MainTest.Run run(String... args) {
        return MainTest.run(args);
    }

    String path(String name) {
        return dir.resolve(name).toString();
    }

    String read(String name) throws IOException {
        return Files.readString(dir.resolve(name), StandardCharsets.UTF_8);
    }

    @SuppressWarnings("unchecked")
    Map<String, Object> json(String name) throws IOException {
        return (Map<String, Object>) Json.parse(read(name));
    }

    /** OR_n with every input evaluated: size 17 has 2^17 > 2^16 inputs, so it is split across shards. */
    static final String[] SWEEP = {"sweep", "or", "--n", "2..5,17", "--method", "every", "--no-bounds", "--iterations",
        "20", "--results-only", "--quiet"};

    static String[] with(String[] base, String... more) {
        List<String> l = new ArrayList<>(List.of(base));
        l.addAll(List.of(more));
        return l.toArray(new String[0]);
    }

    @Test
    @SuppressWarnings("unchecked")
    void shardedAndUnshardedResultsAreIdenticalBitForBit() throws IOException {
        MainTest.Run full = run(with(SWEEP, "--threads", "2", "-o", path("full.json")));
        assertEquals(0, full.status, full.err);
        MainTest.Run one = run(with(SWEEP, "--threads", "1", "-o", path("one.json")));
        assertEquals(0, one.status, one.err);
        assertEquals(read("full.json"), read("one.json"), "the thread count does not change a bit");
        List<String> parts = new ArrayList<>(List.of("merge"));
        for (int i = 0; i < 3; i++) {
            MainTest.Run r = run(with(SWEEP, "--shards", "3", "--shard", String.valueOf(i), "--threads", "1", "-o",
                    path("part-" + i + ".json")));
            assertEquals(0, r.status, r.err);
            parts.add(path("part-" + i + ".json"));
        }
        // the large size is split: every part holds a third of its inputs
        for (int i = 0; i < 3; i++) {
            List<Object> units = (List<Object>) json("part-" + i + ".json").get("units");
            boolean has17 = false;
            for (Object u : units) {
                Map<String, Object> m = (Map<String, Object>) u;
                if (((Number) m.get("size")).intValue() == 17) {
                    has17 = true;
                    Map<String, Object> s = (Map<String, Object>) m.get("summary");
                    long from = ((Number) s.get("from")).longValue();
                    long to = ((Number) s.get("to")).longValue();
                    assertEquals(SweepDocument.split(1L << 17, 3, i), from);
                    assertEquals(SweepDocument.split(1L << 17, 3, i + 1), to);
                }
            }
            assertTrue(has17, "shard " + i + " evaluates a range of size 17");
        }
        parts.add("-o");
        parts.add(path("merged.json"));
        parts.add("--results-only");
        parts.add("--quiet");
        MainTest.Run m = run(parts.toArray(new String[0]));
        assertEquals(0, m.status, m.err);
        assertEquals(read("full.json"), read("merged.json"), "merged parts = unsharded result, byte for byte");
        // and the numbers are right: OR_n optimum sqrt(n) (derived; see SweepFamiliesTest)
        for (Object o : (List<Object>) json("merged.json").get("rows")) {
            Map<String, Object> row = (Map<String, Object>) o;
            double n = ((Number) row.get("variables")).doubleValue();
            assertEquals(Math.sqrt(n), ((Number) row.get("complexity")).doubleValue(), 1e-6 * Math.sqrt(n));
        }
    }

    @Test
    void mergeRefusesIncompleteOrForeignParts() throws IOException {
        for (int i = 0; i < 2; i++) {
            assertEquals(0, run(with(SWEEP, "--shards", "2", "--shard", String.valueOf(i), "-o", path("p" + i + ".json")))
                    .status);
        }
        MainTest.Run missing = run("merge", path("p0.json"), "-o", path("m.json"));
        assertEquals(2, missing.status);
        assertTrue(missing.err.contains("missing"), missing.err);
        MainTest.Run twice = run("merge", path("p0.json"), path("p0.json"), "-o", path("m.json"));
        assertEquals(2, twice.status);
        assertTrue(twice.err.contains("given twice"), twice.err);
        assertEquals(0, run("sweep", "and", "--n", "2", "--shards", "2", "--shard", "1", "--quiet", "-o", path("q1.json"))
                .status);
        MainTest.Run foreign = run("merge", path("p0.json"), path("q1.json"), "-o", path("m.json"));
        assertEquals(2, foreign.status);
        assertTrue(foreign.err.contains("another sweep"), foreign.err);
        Files.writeString(dir.resolve("junk.json"), "{\"format\": \"spanwright-scenario\"}");
        MainTest.Run junk = run("merge", path("junk.json"), "-o", path("m.json"));
        assertEquals(2, junk.status);
        assertTrue(junk.err.contains("not a sweep part"), junk.err);
    }

    @Test
    @SuppressWarnings("unchecked")
    void aRestartedSweepKeepsFinishedSizes() throws IOException {
        MainTest.Run first = run("sweep", "parity", "--n", "2..4", "--no-bounds", "-o", path("out.json"), "--quiet");
        assertEquals(0, first.status, first.err);
        List<Object> before = (List<Object>) json("out.json").get("rows");
        MainTest.Run second = run("sweep", "parity", "--n", "2..6", "--no-bounds", "-o", path("out.json"));
        assertEquals(0, second.status, second.err);
        assertTrue(second.err.contains("resuming: 3 finished size(s) kept"), second.err);
        List<Object> after = (List<Object>) json("out.json").get("rows");
        assertEquals(5, after.size());
        for (int i = 0; i < 3; i++) {
            // the kept rows are the old ones, timing included: not recomputed
            assertEquals(Json.write(before.get(i)), Json.write(after.get(i)));
        }
        // another sweep into the same file is refused rather than mixed
        MainTest.Run other = run("sweep", "parity", "--n", "2..6", "--iterations", "3", "--no-bounds", "-o", path("out.json"));
        assertEquals(2, other.status);
        assertTrue(other.err.contains("holds another sweep"), other.err);
    }

    @Test
    @Tag("slow")
    @SuppressWarnings("unchecked")
    void aKilledSweepResumesWithoutRecomputingFinishedSizes() throws Exception {
        // A real kill: a separate JVM runs the sweep; once two sizes are in the file it is killed;
        // the rerun keeps them (same timing entries) and computes the rest.
        Path out = dir.resolve("killed.json");
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        ProcessBuilder pb = new ProcessBuilder(java, "-cp", System.getProperty("java.class.path"), "spanwright.cli.Main",
                "sweep", "parity", "--n", "2..15", "--no-bounds", "--iterations", "5", "--threads", "1", "-o", out.toString(),
                "--quiet");
        pb.redirectErrorStream(true);
        pb.redirectOutput(dir.resolve("log.txt").toFile());
        Process p = pb.start();
        List<Object> seen = null;
        long deadline = System.currentTimeMillis() + 120_000;
        while (System.currentTimeMillis() < deadline) {
            if (Files.exists(out)) {
                try {
                    List<Object> rows = (List<Object>) ((Map<String, Object>) Json.parse(Files.readString(out))).get("rows");
                    if (rows.size() >= 2) {
                        seen = rows;
                        break;
                    }
                } catch (RuntimeException e) {
                    // being replaced; read again
                }
            }
            Thread.sleep(20);
        }
        p.destroyForcibly();
        p.waitFor(30, TimeUnit.SECONDS);
        assertTrue(seen != null, "the sweep wrote two finished sizes: " + Files.readString(dir.resolve("log.txt")));
        List<Object> kept = (List<Object>) json("killed.json").get("rows");
        assertTrue(kept.size() < 14, "killed before the end (" + kept.size() + " rows)");
        MainTest.Run rest = run("sweep", "parity", "--n", "2..15", "--no-bounds", "--iterations", "5", "-o", out.toString());
        assertEquals(0, rest.status, rest.err);
        assertTrue(rest.err.contains("resuming: " + kept.size() + " finished size(s) kept"), rest.err);
        List<Object> all = (List<Object>) json("killed.json").get("rows");
        assertEquals(14, all.size());
        for (int i = 0; i < kept.size(); i++) {
            assertEquals(Json.write(kept.get(i)), Json.write(all.get(i)), "size kept, not recomputed");
        }
        // and the resumed result equals a fresh one
        run("sweep", "parity", "--n", "2..15", "--no-bounds", "--iterations", "5", "--results-only", "--quiet", "-o",
                path("fresh.json"));
        assertEquals(Json.write(SweepDocument.resultsOnly(((Map<String, Object>) json("fresh.json")).get("rows"))),
                Json.write(SweepDocument.resultsOnly(json("killed.json").get("rows"))));
    }

    @Test
    void slurmScriptsRunTheShardsThenTheMerge() throws IOException {
        MainTest.Run r = run("sweep", "or", "--n", "2..6", "--shards", "3", "--threads", "2", "--emit-slurm", path("slurm"),
                "--slurm-time", "00:10:00", "-o", path("result.json"));
        assertEquals(0, r.status, r.err);
        String array = read("slurm/sweep-array.sbatch");
        assertTrue(array.startsWith("#!/bin/bash\n"));
        assertTrue(array.contains("#SBATCH --array=0-2"), array);
        assertTrue(array.contains("#SBATCH --cpus-per-task=2"), array);
        assertTrue(array.contains("#SBATCH --time=00:10:00"), array);
        assertTrue(array.contains("--shards 3 --shard \"$SLURM_ARRAY_TASK_ID\""), array);
        assertTrue(array.contains("'sweep'") || array.contains(" sweep 'or'"), array);
        String merge = read("slurm/merge.sbatch");
        assertTrue(merge.contains(" merge ") && merge.contains("/part-*.json -o ") && merge.contains("result.json"), merge);
        String submit = read("slurm/submit.sh");
        assertTrue(submit.contains("sbatch --parsable --dependency=afterok:\"$array\""), submit);
        assertTrue(Files.isDirectory(dir.resolve("slurm/logs")));
    }

    @Test
    @SuppressWarnings("unchecked")
    void tablesForPapersAndSpreadsheets() throws IOException {
        MainTest.Run r = run("sweep", "and-or-tree", "--n", "1..3", "--bounds-max-vars", "4", "--csv", path("t.csv"), "--latex",
                path("t.tex"), "-o", path("t.json"), "--quiet");
        assertEquals(0, r.status, r.err);
        List<String> csv = Files.readAllLines(dir.resolve("t.csv"));
        assertEquals(String.join(",", SweepTables.CSV_COLUMNS), csv.get(0));
        assertEquals(4, csv.size());
        // read-once trees: sqrt(W+W-) = sqrt(N) (Barnum & Saks 2004): N = 2, 4, 8
        assertEquals(Math.sqrt(8), Double.parseDouble(csv.get(3).split(",")[11]), 1e-9);
        String tex = read("t.tex");
        assertTrue(tex.contains("\\begin{tabular}") && tex.contains("\\end{tabular}"), tex);
        assertTrue(tex.contains("fitted exponent of $\\sqrt{W_+W_-}$ in $n$: $0.5"), tex);
        assertTrue(tex.contains("% caution: a least-squares exponent over small n is evidence"), tex);
        assertTrue(r.out.contains("evidence about the growth, not a proof"), r.out);
        Map<String, Object> doc = json("t.json");
        Map<String, Object> fits = (Map<String, Object>) doc.get("fits");
        assertTrue(String.valueOf(fits.get("caution")).contains("not run-time estimates for real hardware"));
        Map<String, Object> rows0 = (Map<String, Object>) ((List<Object>) doc.get("rows")).get(0);
        Map<String, Object> timing = (Map<String, Object>) rows0.get("timing");
        for (String step : List.of("build", "optimize", "bounds", "evaluate")) {
            Map<String, Object> t = (Map<String, Object>) timing.get(step);
            assertTrue(t.get("ms") instanceof Double && t.get("bytes") instanceof Double, step + ": " + t);
        }
    }

    @Test
    void badUsageIsAClearMessage() {
        MainTest.Run unknown = run("sweep", "spiral");
        assertEquals(2, unknown.status);
        assertTrue(unknown.err.contains("unknown family \"spiral\""), unknown.err);
        MainTest.Run shards = run("sweep", "or", "--shards", "3");
        assertEquals(2, shards.status);
        assertTrue(shards.err.contains("needs --shard"), shards.err);
        MainTest.Run sizes = run("sweep", "or", "--n", "5..2");
        assertEquals(2, sizes.status);
        assertTrue(sizes.err.contains("ends before it starts"), sizes.err);
        MainTest.Run k = run("sweep", "threshold", "--k", "n /");
        assertEquals(2, k.status);
        assertTrue(k.err.contains("--k"), k.err);
        MainTest.Run partOut = run("sweep", "or", "--shards", "2", "--shard", "0");
        assertEquals(2, partOut.status);
        assertTrue(partOut.err.contains("-o PART.json"), partOut.err);
        assertNotEquals("", run("help").out);
        assertTrue(run("help").out.contains("sweep FAMILY|FILE.json"));
    }
}
