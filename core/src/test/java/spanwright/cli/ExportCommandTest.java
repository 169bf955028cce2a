package spanwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.io.ScenarioReader;
import spanwright.model.Scenario;

/**
 * {@code build host import} and {@code export} through {@link Main#run}: a graph file in, the
 * scenario's GraphML, DOT and TikZ out, the GraphML read back to the same scenario; outputs that
 * name the input are refused. Source of the expected values: HostGraphImportTest (derived there).
 */
class ExportCommandTest {
    @TempDir
    Path dir;

    /** Status, stdout and stderr of one run ({@link MainTest#run}). */
    private static String[] run(String... args) {
        MainTest.Run r = MainTest.run(args);
        return new String[] {Integer.toString(r.status), r.out, r.err};
    }

    @Test
    void importExportAndImportAgain() throws IOException {
        String fixture = "src/test/resources/graphs/bridge-networkx.graphml";
        Path json = dir.resolve("bridge.json");
        String[] r = run("build", "host", "import", fixture, "--s", "s", "--t", "t", "-o", json.toString());
        assertEquals("0", r[0], r[2]);
        Scenario sc = ScenarioReader.read(Files.readString(json));
        AnalysisResult a = Analysis.run(sc);
        // derived in HostGraphImportTest: heaviest path 5, heaviest bond 3
        assertEquals(5, a.maxResistance(), 1e-12);
        assertEquals(3, a.maxCapacitance(), 1e-12);
        Path graphml = dir.resolve("out.graphml");
        Path dot = dir.resolve("out.dot");
        Path tex = dir.resolve("fig.tex");
        Path body = dir.resolve("fig-body.tex");
        r = run("export", json.toString(), "--graphml", graphml.toString(), "--dot", dot.toString(), "--tikz",
                tex.toString(), "--tikz-body", body.toString(), "--input", "01110");
        assertEquals("0", r[0], r[2]);
        assertTrue(Files.readString(tex).contains("\\documentclass"));
        assertTrue(Files.readString(body).startsWith("% Input x = 01110"));
        assertTrue(Files.readString(dot).startsWith("graph spanwright {"));
        // s and t come back from the file (vertex attribute role); the same scenario text
        r = run("build", "host", "import", graphml.toString());
        assertEquals("0", r[0], r[2]);
        assertEquals(Files.readString(json), r[1]);
        try (var files = Files.list(dir)) {
            assertFalse(files.anyMatch(p -> p.toString().endsWith(".tmp")), "no temporary file left");
        }
    }

    @Test
    void refusals() throws IOException {
        Path json = dir.resolve("bridge.json");
        Files.copy(Path.of("src/test/resources/graphs/bridge.json"), json);
        String before = Files.readString(json);
        String[] r = run("export", json.toString(), "--graphml", json.toString());
        assertEquals("2", r[0]);
        assertTrue(r[2].contains("is also an input"), r[2]);
        assertEquals(before, Files.readString(json), "the input is untouched");
        r = run("export", json.toString(), "--dot", dir.resolve("a").toString(), "--graphml", dir.resolve("a").toString());
        assertEquals("2", r[0]);
        assertTrue(r[2].contains("name the same file"), r[2]);
        r = run("export", json.toString());
        assertEquals("2", r[0]);
        assertTrue(r[2].contains("--graphml"), r[2]);
        r = run("export", json.toString(), "--graphml", dir.resolve("b").toString(), "--input", "01");
        assertEquals("2", r[0]);
        r = run("build", "host", "import", "src/test/resources/graphs/bridge.csv", "--t", "t");
        assertEquals("2", r[0]);
        assertTrue(r[2].contains("--s") && r[2].contains("[missing]"), r[2]);
        r = run("build", "host", "import", "src/test/resources/graphs/bridge.csv", "--s", "a", "--t", "a");
        assertEquals("2", r[0]);
        assertTrue(r[2].contains("[same-s-t]"), r[2]);
        Path src = dir.resolve("g.graphml");
        Files.copy(Path.of("src/test/resources/graphs/bridge-networkx.graphml"), src);
        r = run("build", "host", "import", src.toString(), "--s", "s", "--t", "t", "-o", src.toString());
        assertEquals("2", r[0]);
        assertTrue(r[2].contains("is also an input"), r[2]);
        r = run("build", "host", "import", "src/test/resources/graphs/bridge.json", "--s", "s", "--t", "t");
        assertEquals("2", r[0]);
        assertTrue(r[2].contains("--format"), r[2]);
    }
}
