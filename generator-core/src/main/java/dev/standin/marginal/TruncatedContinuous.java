package dev.standin.marginal;

/**
 * A continuous marginal truncated to [min, max] by inversion on [F(min), F(max)]: values are drawn
 * from the conditional distribution, never clipped. Its mean and sd are computed numerically from
 * the quantile function ({@link QuantileMoments}).
 */
final class TruncatedContinuous implements Marginal {

    private final Marginal base;
    private final double min;
    private final double max;
    private final double pLo;
    private final double pHi;
    private final double mean;
    private final double sd;

    TruncatedContinuous(Marginal base, double min, double max) {
        if (!(min < max)) {
            throw new IllegalArgumentException("min must be < max: " + Checks.text(min) + " >= " + Checks.text(max));
        }
        this.base = base;
        this.min = min;
        this.max = max;
        this.pLo = min == Double.NEGATIVE_INFINITY ? 0.0 : base.cdf(min);
        this.pHi = max == Double.POSITIVE_INFINITY ? 1.0 : base.cdf(max);
        if (!(pHi - pLo > 1e-12)) {
            throw new IllegalArgumentException("min and max leave (almost) no probability to sample: "
                    + Checks.text(pHi - pLo) + " of the " + base.family() + " mass lies in [" + Checks.text(min) + ", "
                    + Checks.text(max) + "]");
        }
        double[] moments = QuantileMoments.of(this::quantile);
        this.mean = moments[0];
        this.sd = moments[1];
    }

    @Override
    public String family() {
        return base.family();
    }

    @Override
    public double quantile(double p) {
        double x = base.quantile(pLo + p * (pHi - pLo));
        return Math.min(Math.max(x, min), max);
    }

    @Override
    public double upperQuantile(double q) {
        // 1 − (pLo + p(pHi − pLo)) for p = 1 − q, through the base's upper tail when it is untouched
        if (pHi == 1.0) {
            double x = base.upperQuantile(q * (1.0 - pLo));
            return Math.min(Math.max(x, min), max);
        }
        return quantile(1.0 - q);
    }

    @Override
    public double cdf(double x) {
        if (x <= min) {
            return 0.0;
        }
        if (x >= max) {
            return 1.0;
        }
        return (base.cdf(x) - pLo) / (pHi - pLo);
    }

    @Override
    public double mean() {
        return mean;
    }

    @Override
    public double sd() {
        return sd;
    }
}
