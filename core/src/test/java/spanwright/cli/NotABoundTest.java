package spanwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import spanwright.io.Json;

/**
 * Where the graph does not decide f, √(W₊W₋) is shown as not a bound, in the text and the JSON,
 * and the weight search warns. Derived: two parallel s–t edges switched by a and b connect s and t
 * when a | b, so against f = a &amp; b they disagree on inputs 01 and 10 (2 counterexamples).
 */
class NotABoundTest {
    @TempDir
    Path dir;

    private static final String WRONG = "{\"format\":\"spanwright-scenario\",\"version\":1,\"title\":\"wrong\","
            + "\"variables\":[\"a\",\"b\"],\"function\":\"a & b\",\"graph\":{\"s\":\"s\",\"t\":\"t\",\"vertices\":"
            + "[{\"id\":\"s\"},{\"id\":\"t\"}],\"edges\":[{\"u\":\"s\",\"v\":\"t\",\"when\":\"a\"},"
            + "{\"u\":\"s\",\"v\":\"t\",\"when\":\"b\"}]}}";

    /** Status, stdout and stderr of one run ({@link MainTest#run}). */
    private static String[] run(String... args) {
        MainTest.Run r = MainTest.run(args);
        return new String[] {Integer.toString(r.status), r.out, r.err};
    }

    @Test
    @SuppressWarnings("unchecked")
    void aWrongReductionsBoundIsMarkedEverywhere() throws Exception {
        Path f = dir.resolve("wrong.json");
        Files.writeString(f, WRONG);
        String[] text = run("analyze", f.toString());
        assertEquals("1", text[0]);
        assertTrue(text[1].contains("not a bound for f: the graph does not decide f on 2 input(s)"), text[1]);
        String[] json = run("analyze", f.toString(), "--json");
        Map<String, Object> m = (Map<String, Object>) Json.parse(json[1]);
        assertEquals(Boolean.FALSE, m.get("complexityIsBound"));
        assertTrue(String.valueOf(m.get("complexityNote")).contains("2 input(s)"));
        String[] opt = run("optimize", f.toString(), "--starts", "1");
        assertTrue(opt[1].contains("warning: the weights were chosen for a number that is not a bound"), opt[1]);
        // the bounds' JSON (the page's Bounds sheet) carries the same standing
        Map<String, Object> b = (Map<String, Object>) ((Map<String, Object>) Json.parse(
                spanwright.facade.JsonFacade.bounds(WRONG))).get("result");
        assertEquals(Boolean.FALSE, b.get("complexityIsBound"));
        assertTrue(String.valueOf(b.get("complexityNote")).contains("2 input(s)"), String.valueOf(b.get("complexityNote")));
        // a correct reduction carries no such mark
        Path right = dir.resolve("right.json");
        Files.writeString(right, WRONG.replace("a & b", "a | b"));
        Map<String, Object> ok = (Map<String, Object>) Json.parse(run("analyze", right.toString(), "--json")[1]);
        assertEquals(Boolean.TRUE, ok.get("complexityIsBound"));
        assertFalse(run("analyze", right.toString())[1].contains("not a bound"));
    }

    @Test
    void perCommandHelpBritishSpellingsAndBoundsWithNoFile() {
        // Common practice, no source: `COMMAND --help` shows that command's part of the usage.
        String[] help = run("sweep", "--help");
        assertEquals("0", help[0]);
        assertTrue(help[1].contains("sweep FAMILY|FILE.json"), help[1]);
        assertFalse(help[1].contains("simulate"), help[1]);
        assertEquals("0", run("analyse", "--help")[0]);
        String[] opt = run("optimise", "--starts", "1");
        assertEquals("0", opt[0], opt[2]);
        String[] bounds = run("bounds");
        assertEquals("0", bounds[0], bounds[2]);
        assertTrue(bounds[1].contains("Greenhouse"), bounds[1]);
    }
}
