package spanwright.cli;

import java.io.PrintStream;

/**
 * Progress lines on stderr for runs that take a while ({@code analyze}, {@code optimize},
 * {@code bounds}, {@code build}, {@code simulate}): what is being done, done/total or the time so
 * far, and an estimate of the time left where one is known, e.g.
 * {@code spanwright: analyze: enumerating inputs: 412,000 of 1,048,576 (39%), 4 s so far, about 6 s left}.
 *
 * <p>Policy (docs/cli.md, "Progress"): nothing for a run shorter than {@link #DEFAULT_AFTER} s;
 * then one plain line (no carriage returns, so logs and terminals read alike; Java 17 cannot tell
 * whether stderr is a terminal) at most every {@link #DEFAULT_EVERY} s, less often as the run
 * grows (a tenth of the time so far, at most a line a minute). {@code --quiet} turns it off. The
 * system properties {@value #AFTER_PROPERTY} and {@value #EVERY_PROPERTY} (seconds) change the
 * two times; tests set both to 0 to see every update.
 *
 * <p>The work reports through {@link #phase}, {@link #count} and {@link #detail} from its own
 * thread; a daemon thread prints while the work is silent (a long solver call). Thread-safe;
 * {@link #close} stops the printing before the command writes its result.
 */
final class Progress implements AutoCloseable {
    static final String AFTER_PROPERTY = "spanwright.progress.after";
    static final String EVERY_PROPERTY = "spanwright.progress.every";
    static final double DEFAULT_AFTER = 2;
    static final double DEFAULT_EVERY = 5;
    private static final double LONGEST_GAP = 60;
    private static final long TICK_MILLIS = 250;

    private final String command;
    private final PrintStream err;
    private final boolean on;
    private final long afterNanos;
    private final long everyNanos;
    private final long started = System.nanoTime();
    private final Thread ticker;
    /** The stage in progress; null until the first {@link #phase} (nothing is printed before). */
    private String what;
    private long phaseStarted = started;
    private long done = -1;
    private long total = -1;
    private String detail;
    private long lastPrint;
    private boolean printed;
    private boolean closed;

    private Progress(String command, PrintStream err, boolean on) {
        this.command = command;
        this.err = err;
        this.on = on;
        this.afterNanos = nanos(AFTER_PROPERTY, DEFAULT_AFTER);
        this.everyNanos = nanos(EVERY_PROPERTY, DEFAULT_EVERY);
        if (on) {
            ticker = new Thread(this::tick, "spanwright-progress");
            ticker.setDaemon(true);
            ticker.start();
        } else {
            ticker = null;
        }
    }

    /** Progress for {@code command}; silent when {@code quiet}. */
    static Progress start(String command, PrintStream err, boolean quiet) {
        return new Progress(command, err, !quiet);
    }

    private static long nanos(String property, double fallback) {
        double s = fallback;
        String v = System.getProperty(property);
        if (v != null) {
            try {
                s = Double.parseDouble(v);
            } catch (NumberFormatException e) {
                s = fallback;
            }
        }
        return (long) (Math.max(0, s) * 1e9);
    }

    /** A new stage of the work (its counts start empty). */
    synchronized void phase(String what) {
        this.what = what;
        this.phaseStarted = System.nanoTime();
        this.done = -1;
        this.total = -1;
        this.detail = null;
        maybePrint(true);
    }

    /** Items done out of total in the current stage (total −1 when unknown). */
    synchronized void count(long done, long total) {
        this.done = done;
        this.total = total;
        maybePrint(false);
    }

    /** Free words about the current stage (e.g. "start 2 of 5, step 40"). */
    synchronized void detail(String text) {
        this.detail = text;
        maybePrint(false);
    }

    private void tick() {
        while (true) {
            synchronized (this) {
                if (closed) {
                    return;
                }
                maybePrint(false);
            }
            try {
                Thread.sleep(TICK_MILLIS);
            } catch (InterruptedException e) {
                return;
            }
        }
    }

    /** Prints a line when the run is old enough and the last line old enough (a new stage counts as news). */
    private void maybePrint(boolean newStage) {
        if (!on || closed || what == null) {
            return;
        }
        long now = System.nanoTime();
        long elapsed = now - started;
        if (elapsed < afterNanos) {
            return;
        }
        long gap = Math.max(everyNanos, Math.min((long) (LONGEST_GAP * 1e9), elapsed / 10));
        if (printed && now - lastPrint < gap && !(newStage && now - lastPrint >= everyNanos)) {
            return;
        }
        printed = true;
        lastPrint = now;
        err.println(line(now));
    }

    /** The progress line as it would be printed now. */
    synchronized String line(long now) {
        StringBuilder sb = new StringBuilder("spanwright: ").append(command).append(": ").append(what);
        if (total > 0 && done >= 0) {
            sb.append(": ").append(grouped(done)).append(" of ").append(grouped(total)).append(" (")
                    .append(100 * done / total).append("%)");
        } else if (done >= 0) {
            sb.append(": ").append(grouped(done)).append(" done");
        }
        if (detail != null) {
            sb.append(", ").append(detail);
        }
        sb.append(", ").append(seconds(now - started)).append(" so far");
        if (total > 0 && done > 0 && done < total) {
            double left = (now - phaseStarted) / (double) done * (total - done);
            sb.append(", about ").append(seconds((long) left)).append(" left");
        }
        return sb.toString();
    }

    private static String seconds(long nanos) {
        long s = Math.round(nanos / 1e9);
        return s < 120 ? s + " s" : (s / 60) + " min " + (s % 60) + " s";
    }

    /** 1048576 → "1,048,576". */
    static String grouped(long v) {
        String d = Long.toString(Math.abs(v));
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < d.length(); i++) {
            if (i > 0 && (d.length() - i) % 3 == 0) {
                sb.append(',');
            }
            sb.append(d.charAt(i));
        }
        return (v < 0 ? "-" : "") + sb;
    }

    @Override
    public void close() {
        synchronized (this) {
            closed = true;
        }
        if (ticker != null) {
            ticker.interrupt();
            try {
                ticker.join(1000);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }
    }
}
