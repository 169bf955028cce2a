package spanwright.model;

import java.util.function.LongSupplier;

/**
 * The time budget of one call, handed to every long-running pass it makes (candidate listing,
 * evaluations, the structural engine's frontier search, subset dynamic programming, branch and
 * bound and decision diagrams, the final check), each of which asks {@link #passed} once per step:
 * one input evaluated, one frontier level (or a block of its states), one branch-and-bound node, a
 * block of decision-diagram nodes, one optimiser iteration. So a call overruns its budget by at most
 * one step plus the time to assemble its answer, at any graph size; a pass that stops early says so
 * in its result.
 *
 * <p>The clock is injectable (milliseconds), so tests script time instead of measuring it, and
 * {@link #afterChecks} expires after a number of checks with no clock at all. A reserve
 * ({@link #reserve}) makes {@link #passed} answer true that much earlier, for a caller that keeps
 * time for a last pass and then releases it. Common practice, no source.
 *
 * <p><b>Mutable, single-threaded</b>: one per call, never shared between threads.
 */
public final class Deadline {
    /** A budget ran out inside a pass that cannot stop with a partial answer of its own; its caller turns this into one. */
    public static final class Expired extends RuntimeException {
        private static final long serialVersionUID = 1L;

        public Expired(String where) {
            super(where, null, false, false);
        }
    }

    private final LongSupplier clock;
    private final long end;
    private final long checkLimit;
    /** The budget this one is a share of (asked first), or null. */
    private final Deadline parent;
    private long reserve;
    private long checks;

    private Deadline(LongSupplier clock, long end, long checkLimit) {
        this(clock, end, checkLimit, null);
    }

    private Deadline(LongSupplier clock, long end, long checkLimit, Deadline parent) {
        this.clock = clock;
        this.end = end;
        this.checkLimit = checkLimit;
        this.parent = parent;
    }

    /** A deadline {@code millis} after now on {@code clock} (milliseconds). */
    public Deadline(long millis, LongSupplier clock) {
        this.clock = clock;
        long now = clock.getAsLong();
        this.end = millis >= Long.MAX_VALUE - Math.max(0, now) ? Long.MAX_VALUE : now + Math.max(0, millis);
        this.checkLimit = Long.MAX_VALUE;
        this.parent = null;
    }

    /** No budget: {@link #passed} is always false and reads no clock. */
    public static Deadline none() {
        return new Deadline(null, Long.MAX_VALUE, Long.MAX_VALUE);
    }

    /** A deadline {@code millis} from now on the system's monotonic clock. */
    public static Deadline after(long millis) {
        return new Deadline(millis, Deadline::systemMillis);
    }

    /** A deadline {@code seconds} from now (infinite or NaN: none). */
    public static Deadline afterSeconds(double seconds) {
        if (!(seconds < 9e15)) {
            return none();
        }
        return after((long) Math.ceil(Math.max(0, seconds) * 1000));
    }

    /**
     * For tests: a deadline with no clock that has passed from the check after the first
     * {@code checks} on ({@code afterChecks(0)}: already expired).
     */
    public static Deadline afterChecks(long checks) {
        return new Deadline(null, Long.MAX_VALUE, Math.max(0, checks));
    }

    private static long systemMillis() {
        return System.nanoTime() / 1_000_000L;
    }

    /** Is there a budget at all? */
    public boolean limited() {
        return clock != null || checkLimit != Long.MAX_VALUE || parent != null && parent.limited();
    }

    /** The clock's time now (0 without a clock). */
    public long now() {
        return clock == null ? 0 : clock.getAsLong();
    }

    /**
     * Keeps {@code millis} of the budget for a later pass: {@link #passed} then answers true that
     * much earlier; {@code reserve(0)} releases it. Ignored by {@link #afterChecks} deadlines.
     */
    public void reserve(long millis) {
        reserve = Math.max(0, millis);
    }

    /** The reserve in force. */
    public long reserved() {
        return reserve;
    }

    /**
     * A share of what is left now, for one of several passes in a row: it has passed when this
     * budget has, or once {@code fraction} of the time left now (less the reserve) is used; time a
     * pass leaves unused stays with this budget for the next. Its checks count here too.
     */
    public Deadline share(double fraction) {
        long left = remainingMillis();
        if (clock == null || left == Long.MAX_VALUE) {
            return new Deadline(null, Long.MAX_VALUE, Long.MAX_VALUE, this);
        }
        long now = clock.getAsLong();
        return new Deadline(clock, now + (long) Math.floor(Math.max(0, Math.min(1, fraction)) * left), Long.MAX_VALUE,
                this);
    }

    /** Whether the budget (less the reserve) is used up; one check, at most one clock reading (two for a share). */
    public boolean passed() {
        checks++;
        if (checks > checkLimit || parent != null && parent.passed()) {
            return true;
        }
        if (clock == null || end == Long.MAX_VALUE) {
            return false;
        }
        return clock.getAsLong() > end - Math.min(reserve, end);
    }

    /**
     * {@link #passed}, as an exception for passes deep in a search.
     *
     * @throws Expired naming {@code where} when the budget is used up
     */
    public void check(String where) {
        if (passed()) {
            throw new Expired(where);
        }
    }

    /** Milliseconds left before the budget less the reserve is used up (≥ 0; Long.MAX_VALUE without a clock). */
    public long remainingMillis() {
        if (checkLimit != Long.MAX_VALUE && checks >= checkLimit) {
            return 0;
        }
        if (parent != null && parent.remainingMillis() == 0) {
            return 0;
        }
        if (clock == null || end == Long.MAX_VALUE) {
            return Long.MAX_VALUE;
        }
        return Math.max(0, end - Math.min(reserve, end) - clock.getAsLong());
    }

    /** How many times {@link #passed} was asked (for tests and reports). */
    public long checks() {
        return checks;
    }
}
