package spanwright.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The shared time budget on a scripted clock (no wall time). Common practice, no source: a
 * deadline passes when the clock is past its end less the reserve, a share ends no later than its
 * budget, and time a share leaves unused stays with the budget.
 */
class DeadlineTest {
    @Test
    void passesAfterItsEndLessTheReserve() {
        long[] now = {100};
        Deadline d = new Deadline(50, () -> now[0]); // ends at 150
        assertFalse(d.passed());
        now[0] = 150;
        assertFalse(d.passed(), "at the end itself the budget is not yet exceeded");
        d.reserve(20);
        assertTrue(d.passed(), "150 > 150 - 20");
        assertEquals(0, d.remainingMillis());
        d.reserve(0);
        assertFalse(d.passed(), "the reserve released");
        assertEquals(0, d.remainingMillis());
        now[0] = 151;
        assertTrue(d.passed());
        assertEquals(5, d.checks());
    }

    @Test
    void noneNeverPassesAndAfterChecksCountsChecks() {
        Deadline none = Deadline.none();
        for (int i = 0; i < 1000; i++) {
            assertFalse(none.passed());
        }
        assertFalse(none.limited());
        assertEquals(Long.MAX_VALUE, none.remainingMillis());
        Deadline two = Deadline.afterChecks(2);
        assertTrue(two.limited());
        assertFalse(two.passed());
        assertFalse(two.passed());
        assertTrue(two.passed());
        assertTrue(two.passed(), "stays passed");
        assertTrue(Deadline.afterChecks(0).passed());
        Deadline.Expired e = assertThrows(Deadline.Expired.class, () -> Deadline.afterChecks(0).check("step 1"));
        assertEquals("step 1", e.getMessage());
    }

    @Test
    void aShareEndsEarlierAndLeavesTheRestToTheBudget() {
        long[] now = {0};
        Deadline d = new Deadline(90, () -> now[0]);
        Deadline third = d.share(1.0 / 3); // ends at 30
        now[0] = 30;
        assertFalse(third.passed());
        now[0] = 31;
        assertTrue(third.passed());
        assertFalse(d.passed(), "the budget itself goes on");
        Deadline rest = d.share(1.0); // 59 left: ends at 90
        now[0] = 90;
        assertFalse(rest.passed());
        now[0] = 91;
        assertTrue(rest.passed());
        assertEquals(5, d.checks(), "a share's checks count in its budget (2 + 1 + 2)");
        // a share of a budget that expires by checks passes when its budget does
        Deadline counted = Deadline.afterChecks(1);
        Deadline part = counted.share(0.5);
        assertFalse(part.passed());
        assertTrue(part.passed());
    }

    @Test
    void secondsConvertAndInfinityMeansNoBudget() {
        assertFalse(Deadline.afterSeconds(Double.POSITIVE_INFINITY).limited());
        assertFalse(Deadline.afterSeconds(Double.NaN).limited());
        Deadline d = Deadline.afterSeconds(3600);
        assertTrue(d.limited());
        assertFalse(d.passed());
        assertTrue(d.remainingMillis() > 3_500_000 && d.remainingMillis() <= 3_600_000, "" + d.remainingMillis());
    }
}
