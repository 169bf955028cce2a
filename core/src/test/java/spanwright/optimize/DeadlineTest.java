package spanwright.optimize;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.Test;
import spanwright.model.Deadline;
import spanwright.model.RandomScenarios;
import spanwright.model.Scenario;

/**
 * The optimiser's time budget with an injected clock (no wall time): the clock says the initial
 * evaluation took 10 ms and every later reading is 1 ms later, so "time" is the number of
 * checks. Common practice, no source: a budget is honoured when the search stops at the first
 * check past it, leaving the time the final analysis needs.
 */
class DeadlineTest {
    /**
     * A clock: readings 0 and 1 (the deadline's start, the run's start of the initial evaluation)
     * → 0, reading 2 (its end) → 10, then +1 per reading.
     */
    private static final class ScriptedClock implements java.util.function.LongSupplier {
        long reads;
        long last;

        @Override
        public long getAsLong() {
            long r = reads++;
            last = r <= 1 ? 0 : 8 + r;
            return last;
        }
    }

    @Test
    void theSearchStopsAtTheFirstCheckPastTheBudgetAndKeepsTheReserve() {
        Scenario sc = RandomScenarios.readOnceFormula(new Random(3), 8, 1.0);
        // many starts and no tolerance: only the budget can end this search
        OptimizerOptions options = OptimizerOptions.defaults().withStarts(1_000_000).withTolerance(0)
                .withMaxIterations(1_000_000);
        ScriptedClock clock = new ScriptedClock();
        Deadline deadline = new Deadline(1_000, clock); // reading 0: the deadline is at 1,000
        WeightOptimizer.Run run = new WeightOptimizer.Run(sc, null, options, deadline);
        // the run's constructor read the clock at 0 and 10: the reserve is at least 2 × 10 (one more
        // evaluation and the analysis of the domain, which is at least as large as the candidates)
        int steps = 0;
        long lastChecks = deadline.checks();
        int stepsWithInnerChecks = 0;
        while (!run.step()) {
            steps++;
            if (deadline.checks() - lastChecks > 1) {
                stepsWithInnerChecks++; // checks inside the line search or the surrogate's Newton loop
            }
            lastChecks = deadline.checks();
        }
        long now = clock.last;
        assertTrue(now <= 1_000 - 20 + 1, "stopped at " + now + ", leaving the reserve of ≥ 20 before 1,000");
        assertTrue(steps > 3 && stepsWithInnerChecks > 0, steps + " steps, " + stepsWithInnerChecks + " checked inside");
        OptimizationResult r = run.result();
        assertEquals(OptimizationResult.Status.BUDGET_REACHED, r.status);
        // the clock is not read after the search ended: the final analysis runs in the reserve
        assertEquals(now, clock.last);
    }

    @Test
    void aBudgetSpentBeforeTheFirstStartReturnsTheGivenWeights() {
        // the clock jumps past the deadline during the initial evaluation: no start is begun, and
        // the result is the scenario's own weights (derived: nothing else was tried)
        Scenario sc = RandomScenarios.readOnceFormula(new Random(4), 6, 1.0);
        long[] t = {0};
        Deadline deadline = new Deadline(10, () -> t[0]++ == 0 ? 0 : 1_000);
        WeightOptimizer.Run run = new WeightOptimizer.Run(sc, null, OptimizerOptions.defaults(), deadline);
        int steps = 0;
        while (!run.step()) {
            steps++;
        }
        assertEquals(0, steps);
        OptimizationResult r = run.result();
        assertEquals(OptimizationResult.Status.BUDGET_REACHED, r.status);
        assertEquals(r.initialComplexity, r.complexity, 1e-12 * r.initialComplexity, "derived: the weights are unchanged up to scale");
    }
}
