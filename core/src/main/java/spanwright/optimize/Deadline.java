package spanwright.optimize;

import java.util.function.LongSupplier;

/**
 * The optimiser's time budget: a point in time on a clock (milliseconds), checked inside the
 * outer step, the line search and the surrogate's Newton iterations, so a budget is overrun by at
 * most one unit of work (one evaluation of the candidate inputs, or one Newton iteration) at any
 * graph size. The clock is injectable so tests count checks instead of timing.
 * <b>Mutable, single-threaded.</b>
 */
final class Deadline {
    private final LongSupplier clock;
    private final long end;
    private long reserve;
    private long checks;

    /** A deadline {@code millis} after now on {@code clock}. */
    Deadline(long millis, LongSupplier clock) {
        this.clock = clock;
        long now = clock.getAsLong();
        this.end = millis >= Long.MAX_VALUE - now ? Long.MAX_VALUE : now + millis;
    }

    /** A deadline {@code millis} from now on the system clock. */
    static Deadline after(long millis) {
        return new Deadline(millis, System::currentTimeMillis);
    }

    /** The clock's time now. */
    long now() {
        return clock.getAsLong();
    }

    /**
     * Keeps {@code millis} of the budget for the work after the search (the result's final
     * evaluation and analysis): {@link #passed} then answers true that much earlier.
     */
    void reserve(long millis) {
        reserve = Math.max(0, millis);
    }

    /** Whether the budget (less the reserve) is used up; each call reads the clock once. */
    boolean passed() {
        checks++;
        return clock.getAsLong() > end - Math.min(reserve, end);
    }

    /** How many times {@link #passed} was asked (for tests). */
    long checks() {
        return checks;
    }
}
