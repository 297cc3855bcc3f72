package dev.standin.report;

/**
 * Streaming mean, variance, minimum and maximum by Welford's update (B. P. Welford, "Note on a method
 * for calculating corrected sums of squares and products", Technometrics 4(3), 1962, 419-420), plus a
 * count of missing values. Memory does not grow with the number of values.
 */
public final class Moments {

    private long n;
    private long missing;
    private double mean;
    private double m2;
    private double min = Double.POSITIVE_INFINITY;
    private double max = Double.NEGATIVE_INFINITY;

    public void add(double x) {
        n++;
        double d = x - mean;
        mean += d / n;
        m2 += d * (x - mean);
        if (x < min) {
            min = x;
        }
        if (x > max) {
            max = x;
        }
    }

    public void addMissing() {
        missing++;
    }

    public long count() {
        return n;
    }

    public long missing() {
        return missing;
    }

    /** The mean, or NaN with no values. */
    public double mean() {
        return n == 0 ? Double.NaN : mean;
    }

    /** The sample standard deviation (divisor n − 1), or NaN with fewer than two values. */
    public double sd() {
        return n < 2 ? Double.NaN : StrictMath.sqrt(m2 / (n - 1));
    }

    public double min() {
        return n == 0 ? Double.NaN : min;
    }

    public double max() {
        return n == 0 ? Double.NaN : max;
    }
}
