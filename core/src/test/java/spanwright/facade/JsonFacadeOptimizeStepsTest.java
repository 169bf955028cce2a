package spanwright.facade;

import spanwright.io.Json;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

class JsonFacadeOptimizeStepsTest {
    @Test
    @SuppressWarnings("unchecked")
    void beyondEnumerationTheSameEntriesRunTheWorkingSet() {
        // Common practice, no source: K_7 has 21 edge variables, past enumeration's automatic
        // limit, so the same entries run the working-set optimiser; stepped equals one call, and the
        // start is the derived unit-weight value √((n − 1)·⌊n²/4⌋) = √(6·12) (DESIGN §6).
        Map<String, Object> built = (Map<String, Object>) Json.parse(JsonFacade.build(
                "{\"kind\":\"host\",\"family\":\"complete\",\"size\":[7]}"));
        String text = Json.write(built.get("scenario"));
        String oneCall = JsonFacade.optimize(text, null);
        Map<String, Object> start = (Map<String, Object>) Json.parse(JsonFacade.optimizeStart(text, null));
        assertEquals("working-set", start.get("method"));
        assertEquals(Math.sqrt(72), ((Number) start.get("initialComplexity")).doubleValue(), 1e-12);
        int job = ((Number) start.get("job")).intValue();
        boolean done = false;
        for (int k = 0; k < 10_000 && !done; k++) {
            Map<String, Object> step = (Map<String, Object>) Json.parse(JsonFacade.optimizeStep(job, 1));
            done = (Boolean) step.get("done");
        }
        assertEquals(oneCall, JsonFacade.optimizeFinish(job));
        Map<String, Object> result = (Map<String, Object>) ((Map<String, Object>) Json.parse(oneCall)).get("result");
        assertEquals("working-set", result.get("method"));
        Map<String, Object> ws = (Map<String, Object>) result.get("workingSet");
        assertTrue(((Number) ws.get("rounds")).intValue() >= 1);
        assertTrue(((Number) result.get("complexity")).doubleValue() < Math.sqrt(72));
    }

    @Test
    @SuppressWarnings("unchecked")
    void steppedOptimisationEqualsTheOneCallResult() throws Exception {
        // Common practice, no source: optimize is a loop over the same steps, so the stepped run
        // must give the same text; the trace grows and never increases.
        for (String name : new String[] {"default.json", "inverter-ladder.json"}) {
            String text = Files.readString(Path.of("..", "scenarios", name));
            String options = "{\"starts\": 2, \"seed\": 3}";
            String oneCall = JsonFacade.optimize(text, options);
            Map<String, Object> start = (Map<String, Object>) Json.parse(JsonFacade.optimizeStart(text, options));
            assertEquals(Boolean.TRUE, start.get("ok"));
            int job = ((Number) start.get("job")).intValue();
            int seen = 0;
            boolean done = false;
            for (int k = 0; k < 10_000 && !done; k++) {
                Map<String, Object> step = (Map<String, Object>) Json.parse(JsonFacade.optimizeStep(job, 1));
                assertEquals(Boolean.TRUE, step.get("ok"), step.toString());
                done = (Boolean) step.get("done");
                List<Object> trace = (List<Object>) step.get("trace");
                for (int i = 1; i < trace.size(); i++) {
                    assertTrue(((Number) trace.get(i)).doubleValue() <= ((Number) trace.get(i - 1)).doubleValue() * (1 + 1e-12));
                }
                seen++;
            }
            assertTrue(done && seen > 1, name + ": " + seen + " steps");
            assertEquals(oneCall, JsonFacade.optimizeFinish(job), name);
            Map<String, Object> gone = (Map<String, Object>) Json.parse(JsonFacade.optimizeStep(job, 1));
            assertEquals("no-job", ((Map<String, Object>) gone.get("error")).get("code"));
        }
    }

    @Test
    @SuppressWarnings("unchecked")
    void stoppingEarlyKeepsTheBestPointSoFarAndItsNumbersHold() throws Exception {
        // Two checks of the stopped result: the optimiser's own contract (status cancelled, the
        // bound never above the start or the last step shown; common practice, no source) and an
        // independent one: a fresh analysis of the returned scenario (the network solver on the
        // written weights) gives the same W+, W- and bound, and its max R * max C = bound^2
        // (the definition of the bound).
        String text = Files.readString(Path.of("..", "scenarios", "default.json"));
        Map<String, Object> start = (Map<String, Object>) Json.parse(JsonFacade.optimizeStart(text, "{\"starts\": 3, \"seed\": 5}"));
        int job = ((Number) start.get("job")).intValue();
        double initial = ((Number) start.get("initialComplexity")).doubleValue();
        Map<String, Object> step = null;
        for (int k = 0; k < 2; k++) {
            step = (Map<String, Object>) Json.parse(JsonFacade.optimizeStep(job, 1));
        }
        assertEquals(Boolean.FALSE, step.get("done"), "the search is still running after two steps");
        Map<String, Object> stopped = (Map<String, Object>) Json.parse(JsonFacade.optimizeStop(job));
        assertEquals(Boolean.TRUE, stopped.get("ok"), stopped.toString());
        Map<String, Object> r = (Map<String, Object>) stopped.get("result");
        assertEquals("cancelled", r.get("status"));
        double bound = ((Number) r.get("complexity")).doubleValue();
        assertTrue(bound <= initial * (1 + 1e-12), bound + " vs start " + initial);
        assertTrue(bound <= ((Number) step.get("complexity")).doubleValue() * (1 + 1e-12));
        Object sc = stopped.get("scenario");
        String written = sc instanceof String ? (String) sc : Json.write(sc);
        Map<String, Object> again = (Map<String, Object>) ((Map<String, Object>) Json.parse(JsonFacade.analyze(written, false))).get("result");
        double fresh = ((Number) again.get("complexity")).doubleValue();
        assertEquals(bound, fresh, 1e-9 * bound, "fresh analysis of the stopped weights");
        double wPlus = ((Number) ((Map<String, Object>) again.get("positive")).get("maxResistance")).doubleValue();
        double wMinus = ((Number) ((Map<String, Object>) again.get("negative")).get("maxCapacitance")).doubleValue();
        assertEquals(fresh * fresh, wPlus * wMinus, 1e-9 * fresh * fresh);
        assertEquals("no-job", ((Map<String, Object>) ((Map<String, Object>) Json.parse(JsonFacade.optimizeStep(job, 1))).get("error")).get("code"));
    }
}
