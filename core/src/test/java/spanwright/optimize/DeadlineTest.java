package spanwright.optimize;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.facade.ResultJson;
import spanwright.io.Json;
import spanwright.model.Deadline;
import spanwright.model.RandomScenarios;
import spanwright.model.Scenario;
import spanwright.reduction.HostGraphBuilder;

/**
 * The optimiser's time budget without wall time: a scripted clock that advances one millisecond
 * per reading (so "time" is the number of checks: one per candidate evaluated, per line-search
 * trial, per Newton iteration, per outer step), or a deadline that expires after a number of
 * checks. Common practice, no source: a budget is honoured when the whole call, the final pass
 * included, ends at most one step past it; a result cut short says what was cut, and its numbers
 * are never presented as exact unless they are.
 */
class DeadlineTest {
    /** A clock that reads 0, 1, 2, … (one millisecond per reading). */
    private static final class CountingClock implements java.util.function.LongSupplier {
        long reads;

        @Override
        public long getAsLong() {
            return reads++;
        }
    }

    /** Runs the stepwise domain optimiser to its result. */
    private static OptimizationResult run(Scenario sc, OptimizerOptions options, Deadline deadline) {
        WeightOptimizer.Run run = new WeightOptimizer.Run(sc, null, options, deadline);
        while (!run.step()) {
            // to the end
        }
        return run.result();
    }

    /** The answer's JSON reads back, with the keys of a result cut short when it was. */
    @SuppressWarnings("unchecked")
    private static Map<String, Object> json(OptimizationResult r) {
        String text = Json.writePretty(ResultJson.optimization(r));
        Map<String, Object> m = (Map<String, Object>) Json.parse(text);
        assertEquals(r.exact, m.get("exact"));
        assertEquals(r.cut, m.get("cut"));
        if (!r.exact) {
            assertTrue(m.containsKey("complexityUpper"), text);
        }
        return m;
    }

    @Test
    void theWholeCallEndsWithinTheBudgetPlusOneStep() {
        Scenario sc = RandomScenarios.readOnceFormula(new Random(3), 8, 1.0);
        // many starts and no tolerance: only the budget can end this search
        OptimizerOptions options = OptimizerOptions.defaults().withStarts(1_000_000).withTolerance(0)
                .withMaxIterations(1_000_000).withMaxMillis(5_000);
        CountingClock clock = new CountingClock();
        Deadline deadline = new Deadline(5_000, clock); // reading 0: the deadline is at 5,000
        OptimizationResult r = run(sc, options, deadline);
        assertEquals(OptimizationResult.Status.BUDGET_REACHED, r.status);
        assertTrue(r.iterations > 3, r.iterations + " steps");
        // the last reading is the check that found the budget spent, or the final pass's last one
        assertTrue(clock.reads - 1 <= 5_000 + 1, "the clock was last read at " + (clock.reads - 1));
        // the reserve was enough for the final pass over the 256 inputs: exact, checked on the domain
        assertTrue(r.exact);
        assertNull(r.cut, r.cut);
        AnalysisResult truth = Analysis.run(r.scenario); // independent computation: enumeration
        assertEquals(truth.complexity(), r.complexity, 1e-12 * truth.complexity());
        json(r);
    }

    @Test
    void anExpiredBudgetGivesTheGivenWeightsAndSaysSoPromptly() {
        // the budget has run out before the first check: nothing is listed, nothing evaluated, the
        // weights are the scenario's own and no number is claimed (derived: nothing was computed)
        Scenario sc = RandomScenarios.readOnceFormula(new Random(4), 6, 1.0);
        Deadline deadline = Deadline.afterChecks(0);
        OptimizationResult r = run(sc, OptimizerOptions.defaults(), deadline);
        assertEquals(OptimizationResult.Status.BUDGET_REACHED, r.status);
        assertFalse(r.exact);
        assertNotNull(r.cut);
        assertTrue(r.cut.contains("listing the inputs that can be worst"), r.cut);
        assertTrue(Double.isNaN(r.complexity));
        assertEquals(sc.edges().get(0).weight(), r.scenario.edges().get(0).weight(), 0.0, "weights unchanged");
        assertTrue(deadline.checks() < 10, deadline.checks() + " checks: it stopped at the first");
        assertEquals(0, r.evaluations);
        json(r);
    }

    @Test
    void everyCutPointGivesAnHonestAnswer() {
        // a budget that expires after k checks, for many k: the call is cut in the listing, in the
        // first evaluation, in the search or in the final pass. Whatever was cut, the numbers hold
        // for the returned weights: exact ones equal enumeration's (independent computation), and
        // otherwise enumeration lies inside [value, upper].
        Scenario sc = RandomScenarios.readOnceFormula(new Random(5), 7, 1.0);
        OptimizerOptions options = OptimizerOptions.defaults().withStarts(3).withTolerance(0).withMaxIterations(40);
        boolean sawExactCut = false;
        boolean sawInterval = false;
        for (long k : new long[] {0, 5, 130, 140, 200, 400, 1_000, 3_000, 10_000}) {
            OptimizationResult r = run(sc, options, Deadline.afterChecks(k));
            AnalysisResult truth = Analysis.run(r.scenario);
            String name = "after " + k + " checks: " + r.cut;
            if (r.exact) {
                assertEquals(truth.maxResistance(), r.maxResistance, 1e-9 * truth.maxResistance(), name);
                assertEquals(truth.maxCapacitance(), r.maxCapacitance, 1e-9 * truth.maxCapacitance(), name);
                sawExactCut |= r.cut != null;
            } else {
                sawInterval = true;
                assertNotNull(r.cut, name);
                if (!Double.isNaN(r.maxResistance)) {
                    assertTrue(r.maxResistance <= truth.maxResistance() * (1 + 1e-12), name);
                }
                if (!Double.isNaN(r.maxCapacitance)) {
                    assertTrue(r.maxCapacitance <= truth.maxCapacitance() * (1 + 1e-12), name);
                }
                assertTrue(r.maxResistanceUpper >= truth.maxResistance() * (1 - 1e-12), name);
                assertTrue(r.maxCapacitanceUpper >= truth.maxCapacitance() * (1 - 1e-12), name);
            }
            for (int i = 1; i < r.trace.size(); i++) {
                assertTrue(r.trace.get(i) <= r.trace.get(i - 1), name + ": the trace never rises");
            }
            json(r);
        }
        assertTrue(sawExactCut, "some budget cut only the final pass");
        assertTrue(sawInterval, "some budget cut before the search");
    }

    @Test
    void theWorkingSetOptimiserHonoursAnExpiredBudget() {
        // 4×4 grid (24 edge variables, beyond enumeration's default): the first engine call is cut,
        // so the weights are unchanged and W+ and W- are certified intervals around the exact values
        // of an unbudgeted structural analysis (independent: the same engine without a budget,
        // itself tested against enumeration and OEIS A007764 in StructuralAnalysisTest)
        Scenario sc = HostGraphBuilder.family("grid", new int[] {4, 4}, null, null, 0, -1).scenario();
        for (long k : new long[] {0, 3, 50}) {
            WorkingSetSearch ws = new WorkingSetSearch(sc, OptimizerOptions.defaults(), Deadline.afterChecks(k));
            while (!ws.step()) {
                // to the end
            }
            OptimizationResult r = ws.result();
            spanwright.analysis.StructuralAnalysis.Result truth = spanwright.analysis.StructuralAnalysis.run(r.scenario);
            String name = "grid 4x4 after " + k + " checks: " + r.cut;
            assertNotNull(r.cut, name);
            assertTrue(r.maxResistance <= truth.positive().value() * (1 + 1e-12) || Double.isNaN(r.maxResistance), name);
            assertTrue(r.maxResistanceUpper >= truth.positive().value() * (1 - 1e-12), name);
            assertTrue(r.maxCapacitanceUpper >= truth.negative().value() * (1 - 1e-12), name);
            if (r.exact) {
                assertEquals(truth.complexity(), r.complexity, 1e-9 * truth.complexity(), name);
            }
            json(r);
        }
        // with time enough nothing is cut and the answer is the engine's exact one
        WorkingSetSearch ws = new WorkingSetSearch(sc, OptimizerOptions.defaults(), Deadline.none());
        while (!ws.step()) {
            // to the end
        }
        OptimizationResult r = ws.result();
        assertTrue(r.exact);
        assertNull(r.cut);
        assertEquals(Boolean.TRUE, r.correct, "by construction: f is s-t connectivity of this graph");
    }
}
