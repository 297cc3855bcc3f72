package dev.standin.marginal;

/**
 * The discrete uniform distribution on the whole numbers from .. to: F<sup>-1</sup>(p) = from +
 * ⌊pN⌋ with N = to − from + 1; mean (from + to)/2, variance (N² − 1)/12. Used for dates (days) and
 * timestamps (seconds).
 */
final class DiscreteUniform implements Marginal {

    private final String family;
    private final long from;
    private final long to;
    private final double count;
    private final ValueKind kind;

    DiscreteUniform(String family, long from, long to, ValueKind kind) {
        this.family = family;
        this.from = from;
        this.to = to;
        this.count = (double) (to - from) + 1.0;
        this.kind = kind;
    }

    @Override
    public String family() {
        return family;
    }

    @Override
    public double quantile(double p) {
        long k = (long) Math.floor(p * count);
        return from + Math.min(k, to - from);
    }

    @Override
    public double cdf(double x) {
        if (x < from) {
            return 0.0;
        }
        if (x >= to) {
            return 1.0;
        }
        return (Math.floor(x) - from + 1) / count;
    }

    @Override
    public double grade(double x) {
        double f = cdf(x);
        return Math.floor(x) == x && x >= from && x <= to ? f - 0.5 / count : f;
    }

    @Override
    public double mean() {
        return from + (to - from) / 2.0;
    }

    @Override
    public double sd() {
        return StrictMath.sqrt((count * count - 1) / 12);
    }

    @Override
    public boolean isDiscrete() {
        return true;
    }

    @Override
    public ValueKind valueKind() {
        return kind;
    }
}
