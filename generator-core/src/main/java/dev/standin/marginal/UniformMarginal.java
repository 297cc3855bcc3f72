package dev.standin.marginal;

/** The continuous uniform distribution on [min, max]: F<sup>-1</sup>(p) = min + (max − min)p. */
public final class UniformMarginal implements Marginal {

    private static final double SQRT_12 = 3.46410161513775458705;

    private final double min;
    private final double max;

    private UniformMarginal(double min, double max) {
        this.min = min;
        this.max = max;
    }

    public static UniformMarginal of(double min, double max) {
        Checks.finite("min", min);
        Checks.finite("max", max);
        if (!(min < max)) {
            throw new IllegalArgumentException("min must be < max: " + Checks.text(min) + " >= " + Checks.text(max));
        }
        if (!Double.isFinite(max - min)) {
            throw new IllegalArgumentException("max - min must be finite: " + Checks.text(max) + " - " + Checks.text(min));
        }
        return new UniformMarginal(min, max);
    }

    @Override
    public String family() {
        return "uniform";
    }

    @Override
    public double quantile(double p) {
        return Math.min(min + (max - min) * p, max);
    }

    @Override
    public double upperQuantile(double q) {
        return Math.max(max - (max - min) * q, min);
    }

    @Override
    public double survival(double x) {
        if (x <= min) {
            return 1.0;
        }
        if (x >= max) {
            return 0.0;
        }
        return (max - x) / (max - min);
    }

    @Override
    public double cdf(double x) {
        if (x <= min) {
            return 0.0;
        }
        if (x >= max) {
            return 1.0;
        }
        return (x - min) / (max - min);
    }

    @Override
    public double mean() {
        return min + 0.5 * (max - min);
    }

    @Override
    public double sd() {
        return (max - min) / SQRT_12;
    }
}
