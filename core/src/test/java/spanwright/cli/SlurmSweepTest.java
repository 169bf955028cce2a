package spanwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.condition.EnabledIfSystemProperty;
import org.junit.jupiter.api.io.TempDir;

/**
 * The sharded sweep on a real Slurm: the job array written by {@code --emit-slurm} is submitted
 * with its {@code submit.sh}, the test waits for the merge job, and the merged result must equal
 * the unsharded one byte for byte (the "Beyond one machine" test). Needs a running
 * controller and node: run {@code .ci/slurm-test}, which installs Debian's slurm-wlm and munge,
 * starts a one-node cluster on the loopback address and runs this test with
 * {@code -Dspanwright.slurm=true}. Tagged and disabled otherwise, so {@code mvn verify} skips it.
 */
@Tag("slurm")
@EnabledIfSystemProperty(named = "spanwright.slurm", matches = "true")
class SlurmSweepTest {
    @TempDir
    Path dir;

    /** The sweep: OR_n, every input, size 17 split across the shards (as in SweepCommandTest). */
    static final List<String> SWEEP = List.of("sweep", "or", "--n", "2..5,17", "--method", "every", "--no-bounds",
            "--iterations", "20", "--results-only", "--quiet");

    static String exec(long seconds, String... command) throws IOException, InterruptedException {
        ProcessBuilder pb = new ProcessBuilder(command);
        pb.redirectErrorStream(true);
        Process p = pb.start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(p.waitFor(seconds, TimeUnit.SECONDS), String.join(" ", command) + " timed out");
        assertEquals(0, p.exitValue(), String.join(" ", command) + ":\n" + out);
        return out;
    }

    @Test
    void theJobArrayMergesToTheUnshardedResult() throws Exception {
        long t0 = System.nanoTime();
        Path full = dir.resolve("full.json");
        List<String> a = new ArrayList<>(SWEEP);
        a.add("-o");
        a.add(full.toString());
        MainTest.Run r = MainTest.run(a.toArray(new String[0]));
        assertEquals(0, r.status, r.err);

        Path merged = dir.resolve("merged.json");
        List<String> b = new ArrayList<>(SWEEP);
        b.addAll(List.of("--shards", "3", "--threads", "1", "--emit-slurm", dir.resolve("job").toString(), "-o",
                merged.toString()));
        MainTest.Run e = MainTest.run(b.toArray(new String[0]));
        assertEquals(0, e.status, e.err);

        String submitted = exec(60, "sh", dir.resolve("job/submit.sh").toString());
        Matcher m = Pattern.compile("array job (\\d+), merge job (\\d+)").matcher(submitted);
        assertTrue(m.find(), submitted);
        String mergeJob = m.group(2);
        // wait for the merge job (it starts after every shard succeeded: afterok)
        long deadline = System.currentTimeMillis() + 600_000;
        String state = "";
        while (System.currentTimeMillis() < deadline) {
            String show = exec(30, "scontrol", "show", "job", mergeJob);
            Matcher s = Pattern.compile("JobState=(\\w+)").matcher(show);
            state = s.find() ? s.group(1) : "?";
            if (!state.equals("PENDING") && !state.equals("RUNNING") && !state.equals("CONFIGURING")
                    && !state.equals("COMPLETING")) {
                break;
            }
            Thread.sleep(500);
        }
        String logs = "";
        Path logDir = dir.resolve("job/logs");
        if (Files.isDirectory(logDir)) {
            try (var files = Files.list(logDir)) {
                for (Path p : (Iterable<Path>) files::iterator) {
                    logs += "\n--- " + p.getFileName() + "\n" + Files.readString(p);
                }
            }
        }
        assertEquals("COMPLETED", state, "merge job " + mergeJob + logs);
        assertEquals(Files.readString(full), Files.readString(merged), "merged shards = unsharded, byte for byte");
        for (int i = 0; i < 3; i++) {
            assertTrue(Files.exists(dir.resolve("job/part-" + i + ".json")), "shard " + i + " ran under Slurm");
        }
        System.out.println("[slurm] sweep, 3-task job array and merge on Slurm in "
                + Math.round((System.nanoTime() - t0) / 1e8) / 10.0 + " s");
    }
}
