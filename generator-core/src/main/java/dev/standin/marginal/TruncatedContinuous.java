package dev.standin.marginal;

/**
 * A continuous marginal truncated to [min, max] by inversion on [F(min), F(max)]: values are drawn
 * from the conditional distribution, never clipped. Its mean and sd are computed numerically from
 * the quantile function ({@link QuantileMoments}).
 *
 * <p>Probabilities above the base's median are carried as upper-tail probabilities S = 1 − F from
 * the base's {@link Marginal#survival(double)}, and quantiles there are taken through
 * {@link Marginal#upperQuantile(double)}. Working with F alone, pLo + p(pHi − pLo) rounds to 1 for p
 * near 1 when only min is given (F<sup>-1</sup>(1) = ∞: infinite values, NaN mean and sd for, e.g., a
 * lognormal with min above its median), and a min far in the upper tail (an exponential with min: 50)
 * leaves F(min) = 1 and no mass at all.
 */
final class TruncatedContinuous implements Marginal {

    private final Marginal base;
    private final double min;
    private final double max;
    /** True when min lies above the base's median: every probability is then kept as S. */
    private final boolean upperSide;
    /** F(min) and F(max) (used when !upperSide). */
    private final double pLo;
    private final double pHi;
    /** S(min) and S(max). */
    private final double qLo;
    private final double qHi;
    /** The base's probability of [min, max]. */
    private final double mass;
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
        this.qLo = min == Double.NEGATIVE_INFINITY ? 1.0 : base.survival(min);
        this.qHi = max == Double.POSITIVE_INFINITY ? 0.0 : base.survival(max);
        this.upperSide = pLo > 0.5;
        this.mass = upperSide ? qLo - qHi : pHi - pLo;
        // the mass is a difference of two probabilities, each good to about 1e-16 of its own size
        double scale = upperSide ? qLo : pHi;
        if (!(mass > 1e-12 * scale && mass > 1e-300)) {
            throw new IllegalArgumentException("min and max leave (almost) no probability to sample: "
                    + Checks.text(Math.max(mass, 0.0)) + " of the " + base.family() + " mass lies in [" + Checks.text(min)
                    + ", " + Checks.text(max) + "]");
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
        double x;
        if (upperSide) {
            // S(x) = S(min) − p·mass = S(max) + (1 − p)·mass; the second keeps its digits for p near 1
            x = base.upperQuantile(tail(p <= 0.5 ? qLo - p * mass : qHi + (1.0 - p) * mass));
        } else {
            double t = pLo + p * mass;
            x = t <= 0.5 ? base.quantile(t) : base.upperQuantile(qHi + (1.0 - p) * mass);
        }
        return clamp(x);
    }

    @Override
    public double upperQuantile(double q) {
        // the truncated upper tail q is the base's upper tail S(max) + q·mass
        double s = qHi + q * mass;
        double x = s < 0.5 || upperSide ? base.upperQuantile(tail(s)) : base.quantile(pHi - q * mass);
        return clamp(x);
    }

    /**
     * An upper-tail probability kept above zero: q·mass underflows for a tiny mass (an exponential
     * on [40, ∞) has mass 4e-18, and fromLatent passes q down to 2e-308), and S<sup>-1</sup>(0) = ∞.
     */
    private static double tail(double s) {
        return Math.max(s, Double.MIN_VALUE);
    }

    private double clamp(double x) {
        return Math.min(Math.max(x, min), max);
    }

    @Override
    public double cdf(double x) {
        if (x <= min) {
            return 0.0;
        }
        if (x >= max) {
            return 1.0;
        }
        double c = upperSide ? (qLo - base.survival(x)) / mass : (base.cdf(x) - pLo) / mass;
        return Math.min(Math.max(c, 0.0), 1.0);
    }

    @Override
    public double survival(double x) {
        if (x <= min) {
            return 1.0;
        }
        if (x >= max) {
            return 0.0;
        }
        return Math.min(Math.max((base.survival(x) - qHi) / mass, 0.0), 1.0);
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
