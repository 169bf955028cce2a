package spanwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import spanwright.io.Json;
import spanwright.io.ScenarioWriter;
import spanwright.model.Deadline;
import spanwright.model.RandomScenarios;
import spanwright.model.Scenario;
import spanwright.optimize.OptimizationResult;
import spanwright.optimize.OptimizerOptions;
import spanwright.optimize.WeightOptimizer;
import spanwright.reduction.HostGraphBuilder;

/**
 * {@code analyze --seconds} and the optimiser's text when a time budget cuts the work: the output
 * is whole (JSON that parses, text with the cut in words), numbers that are not exact are shown as
 * intervals, and the exit status is the documented one (0, or 1 only for a counterexample found).
 * These tests do not time anything: wherever the budget happens to run out, the answer must be
 * honest. Common practice, no source.
 */
class BudgetCommandTest {
    private static int run(ByteArrayOutputStream out, String... args) {
        return Main.run(args, new PrintStream(out, true, StandardCharsets.UTF_8),
                new PrintStream(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8));
    }

    @Test
    @SuppressWarnings("unchecked")
    void structureUnderATinyBudgetReportsWhatWasCut(@TempDir Path dir) throws Exception {
        // 8×8 grid (112 edge variables): its frontier search takes far longer than a millisecond
        Scenario grid = HostGraphBuilder.family("grid", new int[] {8, 8}, null, null, 0, -1).scenario();
        Path file = dir.resolve("grid.json");
        Files.writeString(file, ScenarioWriter.write(grid));
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        assertEquals(0, run(out, "analyze", file.toString(), "--seconds", "0.001", "--json"));
        Map<String, Object> m = (Map<String, Object>) Json.parse(out.toString(StandardCharsets.UTF_8));
        if (Boolean.FALSE.equals(m.get("exact"))) {
            assertTrue(m.get("cut") instanceof String, "a cut answer says what was cut");
            assertTrue(((Number) m.get("complexityUpper")).doubleValue() >= ((Number) m.get("complexity")).doubleValue());
        }
        ByteArrayOutputStream text = new ByteArrayOutputStream();
        assertEquals(0, run(text, "analyze", file.toString(), "--seconds", "0.001"));
        String t = text.toString(StandardCharsets.UTF_8);
        assertTrue(t.contains("caution:"), t);
        if (t.contains("  cut ")) {
            assertTrue(t.contains("in ["), "not exact, so shown as an interval: " + t);
        }
    }

    @Test
    @SuppressWarnings("unchecked")
    void enumerationUnderATinyBudgetGivesLowerEndsAndTheInputsReached(@TempDir Path dir) throws Exception {
        // 18 variables (262,144 inputs) on 300 vertices: far more than a millisecond to enumerate
        Scenario sc = RandomScenarios.generate(new Random(2), 18, 300, 320, 0.1, 0.0, 0.5, 2.0);
        Path file = dir.resolve("random.json");
        Files.writeString(file, ScenarioWriter.write(sc));
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        assertEquals(0, run(out, "analyze", file.toString(), "--seconds", "0.001", "--json"));
        Map<String, Object> m = (Map<String, Object>) Json.parse(out.toString(StandardCharsets.UTF_8));
        assertEquals(false, m.get("complete"), "262,144 inputs in a millisecond");
        assertEquals(false, m.get("exact"));
        long evaluated = ((Number) m.get("evaluated")).longValue();
        assertTrue(evaluated < 262_144, "" + evaluated);
        assertTrue(((String) m.get("cut")).contains(evaluated + " of 262144 inputs"), (String) m.get("cut"));
        ByteArrayOutputStream text = new ByteArrayOutputStream();
        assertEquals(0, run(text, "analyze", file.toString(), "--seconds", "0.001"));
        String t = text.toString(StandardCharsets.UTF_8);
        assertTrue(t.contains("cut by the time budget") && t.contains("in ["), t);
    }

    @Test
    void theOptimisersTextShowsACutAnswer() {
        // an expired budget: nothing was computed, the text says so and claims no exact number
        Scenario sc = RandomScenarios.readOnceFormula(new Random(4), 6, 1.0);
        OptimizationResult r = WeightOptimizer.optimize(sc, null, OptimizerOptions.defaults(), null,
                Deadline.afterChecks(0));
        String t = OptimizeCommand.summary(r, null);
        assertTrue(t.contains("budget reached"), t);
        assertTrue(t.contains("  cut ") && t.contains("listing the inputs that can be worst"), t);
        assertTrue(t.contains("in ["), t);
        assertFalse(r.exact);
    }
}
