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
        if (x < low) {
            below++;
        } else if (x > high) {
            above++;
        } else {
            int i = (int) ((x - low) / (high - low) * counts.length);
            counts[Math.min(i, counts.length - 1)]++;
        }
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
