package dev.standin.report;

/**
 * Counts of values in equal-width bins over [low, high], plus the counts below and above. Fixed
 * memory; bins are chosen before the data are seen (from the target's quantiles), so the counts
 * can be merged across row ranges.
 */
public final class Histogram {

    private final double low;
    private final double high;
    private final long[] counts;
    private long below;
    private long above;

    public Histogram(double low, double high, int bins) {
        if (!(high > low)) {
            high = low + 1;
        }
        this.low = low;
        this.high = high;
        this.counts = new long[bins];
    }

    public void add(double x) {
        int i = bin(x);
        if (i < 0) {
            below++;
        } else if (i >= counts.length) {
            above++;
        } else {
            counts[i]++;
        }
    }

    /** The bin of a value: −1 below the range, {@link #bins()} above it (NaN falls in bin 0, as it always did). */
    public int bin(double x) {
        if (x < low) {
            return -1;
        }
        if (x > high) {
            return counts.length;
        }
        int i = (int) ((x - low) / (high - low) * counts.length);
        return Math.min(i, counts.length - 1);
    }

    /**
     * Adds counts gathered elsewhere with {@link #bin}: {@code binCounts[0]} below, {@code binCounts[1 +
     * i]} in bin i, {@code binCounts[bins + 1]} above. Counts add exactly, in any order.
     */
    public void addCounts(long[] binCounts) {
        below += binCounts[0];
        for (int i = 0; i < counts.length; i++) {
            counts[i] += binCounts[1 + i];
        }
        above += binCounts[counts.length + 1];
    }

    public double low() {
        return low;
    }

    public double high() {
        return high;
    }

    public int bins() {
        return counts.length;
    }

    public long count(int bin) {
        return counts[bin];
    }

    public long below() {
        return below;
    }

    public long above() {
        return above;
    }

    public double edge(int i) {
        return low + (high - low) * i / counts.length;
    }
}
