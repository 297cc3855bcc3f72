package dev.standin.report;

/**
 * Streaming covariance and Pearson correlation of a pair over rows where both are present, by the
 * bivariate form of Welford's update (Welford 1962; see also T. F. Chan, G. H. Golub and R. J.
 * LeVeque, "Algorithms for computing the sample variance", The American Statistician 37(3), 1983).
 */
public final class PairMoments {

    private long n;
    private double meanX;
    private double meanY;
    private double m2x;
    private double m2y;
    private double cxy;

    public void add(double x, double y) {
        n++;
        double dx = x - meanX;
        meanX += dx / n;
        double dy = y - meanY;
        meanY += dy / n;
        m2x += dx * (x - meanX);
        m2y += dy * (y - meanY);
        cxy += dx * (y - meanY);
    }

    /**
     * Adds a group of pairs summarised by its count, means, sums of squared deviations and sum of
     * cross products of deviations (Chan, Golub and LeVeque's pairwise update, as in
     * {@link Moments#merge}; the co-moment term is their eq. 2.1 with the product of the two mean shifts).
     */
    public void merge(long count, double groupMeanX, double groupMeanY, double groupM2x, double groupM2y, double groupCxy) {
        if (count == 0) {
            return;
        }
        if (n == 0) {
            n = count;
            meanX = groupMeanX;
            meanY = groupMeanY;
            m2x = groupM2x;
            m2y = groupM2y;
            cxy = groupCxy;
            return;
        }
        long total = n + count;
        double dx = groupMeanX - meanX;
        double dy = groupMeanY - meanY;
        double share = (double) count / total;
        double weight = (double) n * count / total;
        meanX += dx * share;
        meanY += dy * share;
        m2x += groupM2x + dx * dx * weight;
        m2y += groupM2y + dy * dy * weight;
        cxy += groupCxy + dx * dy * weight;
        n = total;
    }

    public long count() {
        return n;
    }

    /** The sample covariance (divisor n − 1), or NaN with fewer than two pairs. */
    public double covariance() {
        return n < 2 ? Double.NaN : cxy / (n - 1);
    }

    /** The sample Pearson correlation, or NaN when undefined. */
    public double correlation() {
        if (n < 2 || m2x <= 0 || m2y <= 0) {
            return Double.NaN;
        }
        return cxy / StrictMath.sqrt(m2x * m2y);
    }
}
