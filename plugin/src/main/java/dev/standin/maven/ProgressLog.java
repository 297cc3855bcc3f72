package dev.standin.maven;

import java.util.Locale;
import java.util.Objects;
import java.util.function.Consumer;
import java.util.function.LongConsumer;
import java.util.function.LongSupplier;

/**
 * The progress callback given to {@code Engine.generate}: it is told the rows written so far and
 * logs a line such as {@code ferry-crossings: 1310720 of 5000000 rows (26%) after 5.0 s} at most once
 * per interval, so short generations log nothing and long ones show they are alive. One instance per
 * generation, used on the generating thread only.
 */
final class ProgressLog implements LongConsumer {

    /** Nanoseconds between two progress lines: 5 s. */
    static final long INTERVAL_NANOS = 5_000_000_000L;

    private final String dataset;
    private final long rows;
    private final Consumer<String> sink;
    private final LongSupplier clock;
    private final long start;
    private long next;

    private ProgressLog(String dataset, long rows, Consumer<String> sink, LongSupplier clock) {
        this.dataset = Objects.requireNonNull(dataset, "dataset");
        this.rows = rows;
        this.sink = Objects.requireNonNull(sink, "sink");
        this.clock = Objects.requireNonNull(clock, "clock");
        this.start = clock.getAsLong();
        this.next = start + INTERVAL_NANOS;
    }

    /** Progress of {@code rows} rows of {@code dataset}, reported to {@code sink}, timed by {@code clock} (ns). */
    static ProgressLog of(String dataset, long rows, Consumer<String> sink, LongSupplier clock) {
        return new ProgressLog(dataset, rows, sink, clock);
    }

    @Override
    public void accept(long written) {
        long now = clock.getAsLong();
        if (now - next < 0) {
            return;
        }
        next = now + INTERVAL_NANOS;
        long percent = rows <= 0 ? 100 : (long) Math.floor(100.0 * written / rows);
        sink.accept(dataset + ": " + written + " of " + rows + " rows (" + percent + "%) after " + seconds(now - start));
    }

    /** Elapsed nanoseconds as seconds with one decimal, e.g. {@code 0.4 s}. */
    static String seconds(long nanos) {
        return String.format(Locale.ROOT, "%.1f s", nanos / 1e9);
    }
}
