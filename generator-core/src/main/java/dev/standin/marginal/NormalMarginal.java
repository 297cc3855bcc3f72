package dev.standin.marginal;

import dev.standin.random.NormalQuantile;

/**
 * The normal distribution N(μ, σ²), optionally truncated to [lower, upper].
 *
 * <p>Truncation is by inversion on [Φ(α), Φ(β)] with α = (lower − μ)/σ and β = (upper − μ)/σ, so no
 * value is ever clipped to a bound. When both bounds lie above the mean the upper tail is inverted
 * by symmetry to keep precision. Moments of the truncated normal: Johnson, Kotz and Balakrishnan,
 * <i>Continuous Univariate Distributions</i>, vol. 1, 2nd ed. (1994), section 10.1, eq. (13.134)ff:
 * mean = μ + σ(φ(α) − φ(β))/Z, var = σ²[1 + (αφ(α) − βφ(β))/Z − ((φ(α) − φ(β))/Z)²],
 * Z = Φ(β) − Φ(α).
 */
public final class NormalMarginal implements Marginal {

    private final double mu;
    private final double sigma;
    private final double lower;
    private final double upper;
    private final boolean truncated;
    private final boolean upperTail;
    private final double pLo;
    private final double pHi;
    private final double mean;
    private final double sd;

    private NormalMarginal(double mu, double sigma, double lower, double upper) {
        this.mu = mu;
        this.sigma = sigma;
        this.lower = lower;
        this.upper = upper;
        this.truncated = lower != Double.NEGATIVE_INFINITY || upper != Double.POSITIVE_INFINITY;
        double alpha = (lower - mu) / sigma;
        double beta = (upper - mu) / sigma;
        this.upperTail = alpha > 0;
        if (upperTail) {
            // work with the mirrored variable −X, whose bounds −β < −α lie below its mean
            this.pLo = StandardNormal.cdf(-beta);
            this.pHi = StandardNormal.cdf(-alpha);
        } else {
            this.pLo = StandardNormal.cdf(alpha);
            this.pHi = StandardNormal.cdf(beta);
        }
        if (truncated) {
            double z = pHi - pLo;
            double da = StandardNormal.density(alpha);
            double db = StandardNormal.density(beta);
            double ada = Double.isInfinite(alpha) ? 0.0 : alpha * da;
            double bdb = Double.isInfinite(beta) ? 0.0 : beta * db;
            double shift = (da - db) / z;
            this.mean = mu + sigma * shift;
            double variance = sigma * sigma * (1.0 + (ada - bdb) / z - shift * shift);
            this.sd = StrictMath.sqrt(Math.max(variance, 0.0));
        } else {
            this.mean = mu;
            this.sd = sigma;
        }
    }

    /** N(mean, sd²) on the whole line. */
    public static NormalMarginal of(double mean, double sd) {
        return truncated(mean, sd, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);
    }

    /**
     * N(mean, sd²) truncated to [lower, upper] (either may be infinite).
     *
     * @throws IllegalArgumentException when the bounds leave no probability mass to sample
     */
    public static NormalMarginal truncated(double mean, double sd, double lower, double upper) {
        Checks.finite("mean", mean);
        Checks.positive("sd", sd);
        if (!(lower < upper)) {
            throw new IllegalArgumentException("min must be < max: " + Checks.text(lower) + " >= " + Checks.text(upper));
        }
        NormalMarginal m = new NormalMarginal(mean, sd, lower, upper);
        if (!(m.pHi - m.pLo > 1e-300)) {
            throw new IllegalArgumentException("min and max leave no probability to sample: the normal mass in ["
                    + Checks.text(lower) + ", " + Checks.text(upper) + "] is below 1e-300");
        }
        return m;
    }

    @Override
    public String family() {
        return "normal";
    }

    public double mu() {
        return mu;
    }

    public double sigma() {
        return sigma;
    }

    public double lower() {
        return lower;
    }

    public double upper() {
        return upper;
    }

    @Override
    public double quantile(double p) {
        if (!truncated) {
            return mu + sigma * NormalQuantile.of(p);
        }
        // in the upper tail, −X has bounds −upper < −lower below its mean: X's p-quantile is −(−X)'s (1 − p)-quantile
        double x = upperTail ? mu - sigma * NormalQuantile.of(pHi - p * (pHi - pLo))
                : mu + sigma * NormalQuantile.of(pLo + p * (pHi - pLo));
        // rounding in the last bit can step over a bound; the bounds are part of the support
        return Math.min(Math.max(x, lower), upper);
    }

    @Override
    public double upperQuantile(double q) {
        if (!truncated) {
            return mu - sigma * NormalQuantile.of(q);
        }
        double x;
        if (upperTail) {
            x = mu - sigma * NormalQuantile.of(pLo + q * (pHi - pLo));
        } else {
            x = mu - sigma * NormalQuantile.of((1.0 - pHi) + q * (pHi - pLo));
        }
        return Math.min(Math.max(x, lower), upper);
    }

    @Override
    public double fromLatent(double z) {
        return truncated ? Marginal.super.fromLatent(z) : mu + sigma * z;
    }

    @Override
    public double cdf(double x) {
        if (x <= lower) {
            return 0.0;
        }
        if (x >= upper) {
            return 1.0;
        }
        double w = (x - mu) / sigma;
        if (!truncated) {
            return StandardNormal.cdf(w);
        }
        if (upperTail) {
            return (pHi - StandardNormal.cdf(-w)) / (pHi - pLo);
        }
        return (StandardNormal.cdf(w) - pLo) / (pHi - pLo);
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
    public boolean isLinearInLatent() {
        return !truncated;
    }
}
