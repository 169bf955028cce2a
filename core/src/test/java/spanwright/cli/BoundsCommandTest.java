package spanwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import spanwright.io.Json;
import spanwright.facade.JsonFacade;

/**
 * {@code bounds FILE [--json]}: exit codes, the keys the "Lower bounds and classical measures"
 * issue lists, null-with-a-reason for measures beyond the limits, and agreement with
 * {@code JsonFacade.bounds} (the page's entry). Values: the parity ladder of three switches has
 * ADV± = 3 (derived in GeneralAdversaryTest) and D = s = bs = deg = C = 3 (Buhrman & de Wolf 2002).
 */
class BoundsCommandTest {
    @TempDir
    Path dir;

    static final Path LADDER = Path.of("..", "scenarios", "inverter-ladder.json");

    @SuppressWarnings("unchecked")
    static Map<String, Object> object(Object o) {
        return (Map<String, Object>) o;
    }

    @Test
    void jsonHasTheIssuesKeys() {
        MainTest.Run r = MainTest.run("bounds", LADDER.toString(), "--json");
        assertEquals(0, r.status, r.err);
        Map<String, Object> m = r.json();
        Map<String, Object> adv = object(m.get("adversary"));
        for (String k : new String[] {"general", "generalDual", "positive"}) {
            assertTrue(adv.containsKey(k), k);
        }
        assertEquals(3, (Double) adv.get("general"), 1e-6);
        assertEquals(3, (Double) adv.get("generalDual"), 1e-6);
        Map<String, Object> cl = object(m.get("classical"));
        for (String k : new String[] {"D", "C0", "C1", "C", "s", "bs", "deg"}) {
            assertEquals(3.0, (Double) cl.get(k), 0, k);
        }
        assertTrue(m.containsKey("complexity"));
        assertTrue(m.containsKey("optimalityGap"));
        // definition (docs/bounds.md): gap = √(W₊W₋) / the best certified lower bound on ADV±
        double lower = Math.max((Double) adv.get("general"), (Double) adv.get("positive"));
        assertEquals((Double) m.get("complexity") / lower, (Double) m.get("optimalityGap"), 1e-12);
        assertTrue((Double) m.get("optimalityGap") >= 1);
        assertTrue(((String) m.get("caution")).contains("constants not included"));
    }

    @Test
    void humanSummaryShowsTheCaution() {
        MainTest.Run r = MainTest.run("bounds", LADDER.toString());
        assertEquals(0, r.status, r.err);
        assertTrue(r.out.contains("ADV+-"));
        assertTrue(r.out.contains("optimality gap"));
        assertTrue(r.out.contains("constants not included"));
    }

    @Test
    void measuresBeyondTheLimitsAreNullWithAReason() throws IOException {
        StringBuilder vars = new StringBuilder();
        for (int i = 1; i <= 13; i++) {
            vars.append(i > 1 ? ", " : "").append("\"x").append(i).append('"');
        }
        String text = "{\"format\": \"spanwright-scenario\", \"version\": 1, \"variables\": [" + vars
                + "], \"function\": \"x1\", \"graph\": {\"s\": \"s\", \"t\": \"t\", \"vertices\": [{\"id\": \"s\"}, {\"id\": \"t\"}],"
                + " \"edges\": [{\"id\": \"e\", \"u\": \"s\", \"v\": \"t\", \"when\": \"x1\"}]}}";
        Path file = dir.resolve("wide.json");
        Files.writeString(file, text, StandardCharsets.UTF_8);
        MainTest.Run r = MainTest.run("bounds", file.toString(), "--json");
        assertEquals(0, r.status, r.err);
        Map<String, Object> adv = object(r.json().get("adversary"));
        assertEquals(Json.NULL, adv.get("general"));
        assertTrue(((String) object(adv.get("reasons")).get("general")).contains("limit of 8"));
        Map<String, Object> cl = object(r.json().get("classical"));
        assertEquals(Json.NULL, cl.get("D"));
        assertTrue(((String) object(cl.get("reasons")).get("D")).contains("limit of 12"));
    }

    @Test
    void usageAndBadInput() throws IOException {
        // with no FILE, bounds falls back to the built-in default scenario (NotABoundTest checks it)
        assertEquals(Main.INVALID, MainTest.run("bounds", LADDER.toString(), "--fast").status);
        Path file = dir.resolve("nofunction.json");
        Files.writeString(file, Files.readString(LADDER).replace("\"function\": \"a ^ b ^ c\",", ""));
        MainTest.Run r = MainTest.run("bounds", file.toString());
        assertEquals(Main.INVALID, r.status);
        assertTrue(r.err.contains("$.function") && r.err.contains("no-function"), r.err);
        assertTrue(MainTest.run("help").out.contains("bounds [FILE]"));
    }

    @Test
    void wrongReductionExitsOneButStillReports() throws IOException {
        Path file = dir.resolve("wrong.json");
        Files.writeString(file, Files.readString(LADDER).replace("\"a ^ b ^ c\"", "\"a & b & c\""));
        MainTest.Run r = MainTest.run("bounds", file.toString(), "--json");
        assertEquals(Main.WRONG_REDUCTION, r.status);
        assertEquals(Json.NULL, r.json().get("optimalityGap"));
        // AND_3: ADV± = √3 (GeneralAdversaryTest)
        assertEquals(Math.sqrt(3), (Double) object(r.json().get("adversary")).get("general"), 1e-6);
    }

    @Test
    void thePageGetsTheSameObject() throws IOException {
        String text = Files.readString(LADDER, StandardCharsets.UTF_8);
        Map<String, Object> page = object(Json.parse(JsonFacade.bounds(text)));
        assertEquals(Boolean.TRUE, page.get("ok"));
        Map<String, Object> fromPage = object(page.get("result"));
        Map<String, Object> fromCli = MainTest.run("bounds", LADDER.toString(), "--json").json();
        fromPage.remove("limits");
        fromCli.remove("limits");
        assertEquals(fromCli, fromPage);
        Map<String, Object> bad = object(Json.parse(JsonFacade.bounds(text.replace("\"function\": \"a ^ b ^ c\",", ""))));
        assertEquals(Boolean.FALSE, bad.get("ok"));
        assertEquals("no-function", object(bad.get("error")).get("code"));
        assertEquals("$.function", object(bad.get("error")).get("path"));
        assertTrue(List.of("ok", "error").containsAll(bad.keySet()));
    }
}
