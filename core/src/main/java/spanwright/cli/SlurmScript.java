package spanwright.cli;

import java.io.IOException;
import java.io.PrintStream;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import spanwright.io.AtomicFile;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.ArrayList;
import java.util.List;

/**
 * {@code sweep … --shards N --emit-slurm DIR}: writes a Slurm job array that runs shard
 * {@code $SLURM_ARRAY_TASK_ID} of the sweep per array task, a merge job, and {@code submit.sh},
 * which submits the array and then the merge with {@code --dependency=afterok} on it. Array jobs
 * and {@code afterok} dependencies are standard Slurm ({@code sbatch --array},
 * {@code sbatch --dependency}; Slurm documentation, "Job Array Support"). The scripts call this
 * jar with this Java, by absolute paths, so they run from any directory on the cluster's shared
 * file system.
 */
final class SlurmScript {
    private SlurmScript() {}

    static String quote(String s) {
        return "'" + s.replace("'", "'\\''") + "'";
    }

    /**
     * How the job scripts start this tool: {@code java -jar spanwright.jar} when running from the
     * jar, otherwise (classes in a directory, as in the tests) {@code java -cp CLASSPATH Main}.
     */
    static String command() {
        Path p;
        try {
            p = Path.of(SlurmScript.class.getProtectionDomain().getCodeSource().getLocation().toURI()).toAbsolutePath();
        } catch (URISyntaxException | SecurityException | NullPointerException e) {
            throw new Main.UsageException("sweep: cannot tell where spanwright.jar is (" + e + ")");
        }
        if (Files.isRegularFile(p)) {
            return quote(java()) + " -jar " + quote(p.toString());
        }
        StringBuilder cp = new StringBuilder();
        for (String part : System.getProperty("java.class.path").split(java.io.File.pathSeparator)) {
            cp.append(cp.length() > 0 ? java.io.File.pathSeparator : "").append(Path.of(part).toAbsolutePath());
        }
        return quote(java()) + " -cp " + quote(cp.toString()) + " spanwright.cli.Main";
    }

    static String java() {
        return Path.of(System.getProperty("java.home"), "bin", "java").toAbsolutePath().toString();
    }

    static int emit(SweepCommand.Args a, PrintStream out, PrintStream err) {
        Path dir = Path.of(a.slurmDir).toAbsolutePath();
        String command = command();
        List<String> rep = new ArrayList<>(a.repeat);
        StringBuilder sweepArgs = new StringBuilder();
        for (String r : rep) {
            sweepArgs.append(' ').append(quote(r));
        }
        String result = a.output != null ? Path.of(a.output).toAbsolutePath().toString()
                : dir.resolve("result.json").toString();
        String logs = dir.resolve("logs").toString();
        StringBuilder arr = new StringBuilder();
        arr.append("#!/bin/bash\n");
        arr.append("# Spanwright sweep, one shard per array task (written by sweep --emit-slurm).\n");
        arr.append("#SBATCH --job-name=spanwright-sweep\n");
        arr.append("#SBATCH --array=0-").append(a.shards - 1).append('\n');
        arr.append("#SBATCH --ntasks=1\n");
        arr.append("#SBATCH --cpus-per-task=").append(a.threads).append('\n');
        arr.append("#SBATCH --output=").append(logs).append("/shard-%a.out\n");
        if (a.slurmTime != null) {
            arr.append("#SBATCH --time=").append(a.slurmTime).append('\n');
        }
        if (a.slurmPartition != null) {
            arr.append("#SBATCH --partition=").append(a.slurmPartition).append('\n');
        }
        arr.append("set -euo pipefail\n");
        arr.append("exec ").append(command).append(" sweep").append(sweepArgs)
                .append(" --shards ").append(a.shards).append(" --shard \"$SLURM_ARRAY_TASK_ID\" --threads ")
                .append(a.threads).append(" -o ").append(quote(dir.toString())).append("/part-\"$SLURM_ARRAY_TASK_ID\".json\n");

        StringBuilder merge = new StringBuilder();
        merge.append("#!/bin/bash\n");
        merge.append("# Spanwright sweep: merge the shards' parts (written by sweep --emit-slurm).\n");
        merge.append("#SBATCH --job-name=spanwright-merge\n");
        merge.append("#SBATCH --ntasks=1\n");
        merge.append("#SBATCH --cpus-per-task=1\n");
        merge.append("#SBATCH --output=").append(logs).append("/merge.out\n");
        if (a.slurmTime != null) {
            merge.append("#SBATCH --time=").append(a.slurmTime).append('\n');
        }
        if (a.slurmPartition != null) {
            merge.append("#SBATCH --partition=").append(a.slurmPartition).append('\n');
        }
        merge.append("set -euo pipefail\n");
        merge.append("exec ").append(command).append(" merge ").append(quote(dir.toString())).append("/part-*.json -o ")
                .append(quote(result));
        if (a.csv != null) {
            merge.append(" --csv ").append(quote(Path.of(a.csv).toAbsolutePath().toString()));
        }
        if (a.latex != null) {
            merge.append(" --latex ").append(quote(Path.of(a.latex).toAbsolutePath().toString()));
        }
        if (a.resultsOnly) {
            merge.append(" --results-only");
        }
        if (a.fitFrom > 0) {
            merge.append(" --fit-from ").append(a.fitFrom);
        }
        if (a.fitLast > 0) {
            merge.append(" --fit-last ").append(a.fitLast);
        }
        merge.append(" --quiet\n");

        String submit = "#!/bin/sh\n"
                + "# Submits the sweep's job array, then the merge once every shard has succeeded.\n"
                + "set -eu\n"
                + "array=$(sbatch --parsable " + quote(dir.resolve("sweep-array.sbatch").toString()) + ")\n"
                + "array=${array%%;*}\n"
                + "merge=$(sbatch --parsable --dependency=afterok:\"$array\" "
                + quote(dir.resolve("merge.sbatch").toString()) + ")\n"
                + "merge=${merge%%;*}\n"
                + "echo \"array job $array, merge job $merge; result: " + result.replace("\"", "\\\"") + "\"\n";
        try {
            Files.createDirectories(dir.resolve("logs"));
            writeScript(dir.resolve("sweep-array.sbatch"), arr.toString());
            writeScript(dir.resolve("merge.sbatch"), merge.toString());
            writeScript(dir.resolve("submit.sh"), submit);
        } catch (IOException e) {
            throw new Main.UsageException("sweep: cannot write the Slurm scripts in " + dir + ": " + e.getMessage());
        }
        out.println("wrote " + dir.resolve("sweep-array.sbatch") + " (array of " + a.shards + " shard(s)), "
                + dir.resolve("merge.sbatch") + " and " + dir.resolve("submit.sh"));
        out.println("submit with: sh " + dir.resolve("submit.sh") + "   (the result goes to " + result + ")");
        return Main.OK;
    }

    private static void writeScript(Path p, String text) throws IOException {
        AtomicFile.write(p, text);
        try {
            Files.setPosixFilePermissions(p, PosixFilePermissions.fromString("rwxr-xr-x"));
        } catch (UnsupportedOperationException e) {
            // not a POSIX file system: the scripts are run with sh / sbatch anyway
        }
    }
}
