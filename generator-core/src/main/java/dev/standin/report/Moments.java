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

    /**
     * Adds a group of values summarised by its count, mean, sum of squared deviations from that mean,
     * minimum and maximum, plus a number of missing values: the pairwise update of T. F. Chan, G. H.
     * Golub and R. J. LeVeque, "Updating formulae and a pairwise algorithm for computing sample
     * variances", COMPSTAT 1982 (also The American Statistician 37(3), 1983, eq. 2.1). Merging the same
     * groups in the same order gives the same bits, whatever thread summarised each group.
     */
    public void merge(long count, double groupMean, double groupM2, double groupMin, double groupMax, long groupMissing) {
        missing += groupMissing;
        if (count == 0) {
            return;
        }
        if (n == 0) {
            n = count;
            mean = groupMean;
            m2 = groupM2;
        } else {
            long total = n + count;
            double d = groupMean - mean;
            mean += d * ((double) count / total);
            m2 += groupM2 + d * d * ((double) n * count / total);
            n = total;
        }
        if (groupMin < min) {
            min = groupMin;
        }
        if (groupMax > max) {
            max = groupMax;
        }
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
