package dev.standin.marginal;

import java.util.Arrays;

/**
 * A distribution on consecutive whole numbers lo, lo + 1, ..., held as a table of probabilities and
 * cumulative probabilities, sampled by inversion: the smallest k with F(k) ≥ p (binary search).
 * Truncation to [min, max] zeroes the rest and renormalises, so it is exact. Moments come from the
 * table. Probabilities beyond the table (tails below 1e-20 of the mode's) are treated as zero.
 */
public class DiscreteTable implements Marginal {

    /** The largest table accepted. */
    public static final int MAX_SIZE = 2_000_000;

    private final String family;
    private final long lo;
    private final double[] pmf;
    private final double[] cdf;
    private final double mean;
    private final double sd;

    protected DiscreteTable(String family, long lo, double[] weights) {
        this.family = family;
        this.lo = lo;
        double total = 0;
        for (double w : weights) {
            total += w;
        }
        if (!(total > 0)) {
            throw new IllegalArgumentException("min and max leave no probability to sample");
        }
        this.pmf = new double[weights.length];
        this.cdf = new double[weights.length];
        double c = 0;
        double m = 0;
        for (int i = 0; i < weights.length; i++) {
            pmf[i] = weights[i] / total;
            c += pmf[i];
            cdf[i] = c;
            m += pmf[i] * (lo + i);
        }
        cdf[cdf.length - 1] = 1.0;
        double v = 0;
        for (int i = 0; i < weights.length; i++) {
            double d = lo + i - m;
            v += pmf[i] * d * d;
        }
        this.mean = m;
        this.sd = StrictMath.sqrt(v);
    }

    /** The table truncated to [min, max] (either may be infinite). */
    public DiscreteTable truncated(double min, double max) {
        long a = Math.max(lo, (long) Math.ceil(Math.max(min, -9.0e18)));
        long b = Math.min(lo + pmf.length - 1, (long) Math.floor(Math.min(max, 9.0e18)));
        if (a > b) {
            throw new IllegalArgumentException("min and max leave no value to sample");
        }
        double[] w = Arrays.copyOfRange(pmf, (int) (a - lo), (int) (b - lo) + 1);
        return withTable(a, w);
    }

    /** A copy of this family with another table; subclasses keep their labels and kinds. */
    protected DiscreteTable withTable(long newLo, double[] weights) {
        return new DiscreteTable(family, newLo, weights);
    }

    /** Probabilities of lo .. hi computed by the family, trimmed where negligible. */
    static double[] trim(double[] w, long[] loOut) {
        double max = 0;
        for (double x : w) {
            max = Math.max(max, x);
        }
        int a = 0;
        int b = w.length - 1;
        while (a < b && w[a] < 1e-20 * max) {
            a++;
        }
        while (b > a && w[b] < 1e-20 * max) {
            b--;
        }
        loOut[0] += a;
        return Arrays.copyOfRange(w, a, b + 1);
    }

    @Override
    public String family() {
        return family;
    }

    public long lowest() {
        return lo;
    }

    public long highest() {
        return lo + pmf.length - 1;
    }

    /** P(X = k). */
    public double probability(long k) {
        return k < lo || k > highest() ? 0.0 : pmf[(int) (k - lo)];
    }

    @Override
    public double quantile(double p) {
        int i = Arrays.binarySearch(cdf, p);
        if (i < 0) {
            i = -i - 1;
        }
        return lo + Math.min(i, cdf.length - 1);
    }

    @Override
    public double cdf(double x) {
        if (x < lo) {
            return 0.0;
        }
        long k = (long) Math.floor(x);
        return k >= highest() ? 1.0 : cdf[(int) (k - lo)];
    }

    @Override
    public double grade(double x) {
        double f = cdf(x);
        long k = (long) Math.floor(x);
        return k == x ? f - 0.5 * probability(k) : f;
    }

    @Override
    public double mean() {
        return mean;
    }

    @Override
    public double sd() {
        return sd;
    }

    @Override
    public boolean isDiscrete() {
        return true;
    }

    @Override
    public ValueKind valueKind() {
        return ValueKind.INTEGER;
    }

    /** The number of values with positive probability in the table. */
    public int size() {
        return pmf.length;
    }
}
