package spanwright.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;
import spanwright.analysis.StructuralAnalysis;
import spanwright.io.Json;
import spanwright.model.Deadline;

/**
 * A sweep size whose per-size time budgets (optimiser, diagram check, structure step) have run out
 * before their first check: the size still ends promptly with a whole row that says what was cut,
 * and its numbers are certified intervals around the exact ones. Common practice, no source.
 */
class SweepBudgetTest {
    @Test
    @SuppressWarnings("unchecked")
    void aSizeWithExpiredBudgetsGivesAnHonestRow() {
        Family grid = BuiltInFamilies.fromSpec(Map.of("family", "grid"), "$");
        SweepOptions o = SweepOptions.defaults().withBounds(false, 0);
        // 5×5 grid: 40 edge variables, beyond enumeration: the structural method
        SweepSize s = SweepSize.build(grid, 5, o, ms -> Deadline.afterChecks(0));
        assertEquals(SweepOptions.Method.STRUCTURE, s.method());
        s.prepare();
        Map<String, Object> meta = s.metadata();
        Map<String, Object> opt = (Map<String, Object>) meta.get("optimizer");
        assertEquals("time-budget-reached", opt.get("status"), String.valueOf(opt));
        assertNotNull(opt.get("cut"));
        Map<String, Object> st = (Map<String, Object>) meta.get("structure");
        assertEquals(false, st.get("exact"));
        assertNotNull(st.get("cut"));
        // the row, through JSON and back, keeps the interval: it holds the unbudgeted engine's
        // exact value for the same weights (independent: the engine without a budget, tested
        // against enumeration and OEIS A007764 in StructuralAnalysisTest)
        Map<String, Object> row = (Map<String, Object>) Json.parse(Json.write(SweepSize.row(meta, null)));
        assertEquals(false, row.get("exact"));
        double exact = StructuralAnalysis.run(s.scenario()).complexity();
        double lower = ((Number) row.get("complexity")).doubleValue();
        double upper = ((Number) row.get("complexityUpper")).doubleValue();
        assertTrue(lower <= exact * (1 + 1e-12) && exact <= upper * (1 + 1e-12), lower + " ≤ " + exact + " ≤ " + upper);
    }
}
