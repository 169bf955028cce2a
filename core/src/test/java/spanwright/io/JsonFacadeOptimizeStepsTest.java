package spanwright.io;

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
}
