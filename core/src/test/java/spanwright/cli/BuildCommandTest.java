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
import spanwright.io.ScenarioReader;
import spanwright.model.Scenario;

/**
 * {@code build} through {@link Main#run}: the syntax of the "Builders" issue, output to stdout or
 * {@code -o}, exit status 2 with a message naming the argument. Source: the "Where it
 * lives" section and docs/builders.md; the built scenarios are checked by the analysis.
 */
class BuildCommandTest {
    @TempDir
    Path dir;

    /** Status, stdout and stderr of one run ({@link MainTest#run}). */
    private static String[] run(String... args) {
        MainTest.Run r = MainTest.run(args);
        return new String[] {Integer.toString(r.status), r.out, r.err};
    }

    @Test
    void everyKindWritesAReadableCorrectScenario() throws IOException {
        String[][] cases = {{"build", "formula", "a & (b | !c)"}, {"build", "tree", "maj(a, b, c)", "--diagram"},
            {"build", "tree", "01101001", "--order", "x3,x1"}, {"build", "host", "grid", "2x3", "--s", "r1c1", "--t", "r2c3"},
            {"build", "host", "random", "6x7", "--seed", "9", "--at-most-missing", "2"}};
        for (String[] c : cases) {
            String[] r = run(c);
            assertEquals("0", r[0], String.join(" ", c) + "\n" + r[2]);
            Scenario sc = ScenarioReader.read(r[1]);
            assertEquals(Boolean.TRUE, Analysis.run(sc).correct(), String.join(" ", c));
            // the summary speaks the words of the options and docs, not the JSON keys (readOnce,
            // wrongGuesses, …): no camelCase word and no quoted JSON value on stderr
            assertTrue(r[2].startsWith("spanwright: built a scenario of " + sc.vertexCount() + " vertices, "
                    + sc.edges().size() + " edges and " + sc.variableCount() + " variables"), r[2]);
            assertFalse(java.util.regex.Pattern.compile("\\b[a-z]+[A-Z][a-zA-Z]*\\b").matcher(r[2]).find(), r[2]);
            assertFalse(r[2].contains("\""), r[2]);
        }
        // compose two files, output with -o
        Path outer = dir.resolve("outer.json");
        Path inner = dir.resolve("inner.json");
        Files.writeString(outer, run("build", "formula", "y1 | y2")[1]);
        Files.writeString(inner, run("build", "formula", "a & b")[1]);
        Path out = dir.resolve("both.json");
        String[] r = run("build", "compose", outer.toString(), inner.toString(), "-o", out.toString());
        assertEquals("0", r[0], r[2]);
        assertEquals("", r[1]);
        Scenario sc = ScenarioReader.read(Files.readString(out));
        assertEquals(4, sc.variableCount());
        assertEquals(Boolean.TRUE, Analysis.run(sc).correct());
        // a given host from a file
        String[] h = run("build", "host", "given", out.toString());
        assertEquals("0", h[0], h[2]);
        assertEquals(Boolean.TRUE, Analysis.run(ScenarioReader.read(h[1])).correct());
    }

    @Test
    void badInputExitsWithTwoAndNamesTheArgument() throws IOException {
        String[] op = run("build", "formula", "a $ b");
        assertEquals("2", op[0]);
        assertTrue(op[2].contains("build formula: EXPR: column 3"), op[2]);
        assertFalse(op[2].contains("Exception"), op[2]);
        String[] grid = run("build", "host", "grid", "1x4");
        assertEquals("2", grid[0]);
        assertTrue(grid[2].contains("SIZE: grid: needs at least 2 rows"), grid[2]);
        String[] size = run("build", "host", "grid", "threebyfour");
        assertEquals("2", size[0]);
        assertTrue(size[2].contains("SIZE is whole numbers"), size[2]);
        String[] order = run("build", "tree", "a & b", "--order", "a,q");
        assertEquals("2", order[0]);
        assertTrue(order[2].contains("--order: unknown variable \"q\""), order[2]);
        String[] option = run("build", "formula", "a", "--diagram");
        assertEquals("2", option[0]);
        assertTrue(option[2].contains("unknown option --diagram"), option[2]);
        String[] kind = run("build", "circuit", "a");
        assertEquals("2", kind[0]);
        Path broken = dir.resolve("broken.json");
        Files.writeString(broken, "{\"format\":\"spanwright-scenario\",\"version\":1,\"variables\":[],\"graph\":{\"s\":\"s\","
                + "\"t\":\"t\",\"vertices\":[{\"id\":\"s\"},{\"id\":\"t\"}],\"edges\":[{\"u\":\"s\",\"v\":\"nowhere\",\"when\":\"1\"}]}}");
        String[] c = run("build", "compose", broken.toString(), broken.toString());
        assertEquals("2", c[0]);
        assertTrue(c[2].contains("broken.json at $.graph.edges[0].v"), c[2]);
        String[] missing = run("build", "compose", dir.resolve("none.json").toString(), broken.toString());
        assertEquals("2", missing[0]);
        assertTrue(missing[2].contains("no such file"), missing[2]);
    }

    @Test
    void usageListsTheBuildCommand() {
        assertTrue(run("help")[1].contains("build formula EXPR"));
    }
}
