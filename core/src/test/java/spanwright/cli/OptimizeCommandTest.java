package spanwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import spanwright.analysis.Analysis;
import spanwright.io.Json;
import spanwright.facade.JsonFacade;
import spanwright.io.ScenarioReader;

class OptimizeCommandTest {

    private static int run(ByteArrayOutputStream out, ByteArrayOutputStream err, String... args) {
        return Main.run(args, new PrintStream(out, true, StandardCharsets.UTF_8),
                new PrintStream(err, true, StandardCharsets.UTF_8));
    }

    @Test
    @SuppressWarnings("unchecked")
    void jsonKeysAndTheDefaultScenarioOptimum(@TempDir Path dir) throws Exception {
        // Published: the default scenario decides (n1 & n2) | (s1 & s2) | (p & q), a read-once
        // formula on 6 variables, whose adversary bound is √6 (Barnum & Saks 2004; Høyer, Lee &
        // Špalek 2005, arXiv:quant-ph/0509067); no weighting can beat it, and series–parallel
        // weights reach it, so the optimiser ends at √6.
        Path outFile = dir.resolve("opt.json");
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int code = run(out, err, "optimize", "--json", "-o", outFile.toString());
        assertEquals(0, code, err.toString());
        Map<String, Object> m = (Map<String, Object>) Json.parse(out.toString(StandardCharsets.UTF_8));
        for (String k : List.of("status", "iterations", "complexity", "initialComplexity", "positive", "negative",
                "weights", "trace", "certificate", "caution")) {
            assertTrue(m.containsKey(k), "key " + k);
        }
        assertTrue(((Map<String, Object>) m.get("positive")).containsKey("maxResistance"));
        assertTrue(((Map<String, Object>) m.get("positive")).containsKey("worst"));
        assertTrue(((Map<String, Object>) m.get("negative")).containsKey("maxCapacitance"));
        assertEquals("converged", m.get("status"));
        assertEquals(Math.sqrt(6), (Double) m.get("complexity"), 1e-8);
        assertEquals(Math.sqrt(8), (Double) m.get("initialComplexity"), 1e-12); // derived: W+ = 2, W- = 4
        // the written scenario reads back and analyses to the reported bound
        double again = Analysis.run(ScenarioReader.read(Files.readString(outFile))).complexity();
        assertEquals((Double) m.get("complexity"), again, 1e-12);
        // weights by edge id
        assertEquals(6, ((Map<String, Object>) m.get("weights")).size());
    }

    @Test
    void badOptionsAreUsageErrors() {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        assertEquals(2, run(out, err, "optimize", "--starts", "many"));
        assertTrue(err.toString().contains("--starts"), err.toString());
        assertEquals(2, run(out, err, "optimize", "--tie", "colour"));
        assertTrue(err.toString().contains("tie"), err.toString());
    }

    @Test
    @SuppressWarnings("unchecked")
    void facadeOptimizeEnvelope() throws Exception {
        String text = Files.readString(Path.of("..", "scenarios", "inverter-ladder.json"));
        Map<String, Object> ok = (Map<String, Object>) Json.parse(JsonFacade.optimize(text, "{\"starts\": 2}"));
        assertEquals(Boolean.TRUE, ok.get("ok"));
        Map<String, Object> result = (Map<String, Object>) ok.get("result");
        assertTrue((Double) result.get("complexity") <= (Double) result.get("initialComplexity") * (1 + 1e-12));
        // the returned scenario text carries the new weights and keeps the title
        String scenario = (String) ok.get("scenario");
        assertEquals(ScenarioReader.read(text).title(), ScenarioReader.read(scenario).title());
        Map<String, Object> bad = (Map<String, Object>) Json.parse(JsonFacade.optimize(text, "{\"speed\": 3}"));
        assertEquals(Boolean.FALSE, bad.get("ok"));
        assertEquals("$options.speed", ((Map<String, Object>) bad.get("error")).get("path"));
    }
}
