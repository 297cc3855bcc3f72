package dev.standin.marginal;

import dev.standin.random.NormalQuantile;

/**
 * The lognormal distribution X = exp(μ + σZ): F<sup>-1</sup>(p) = exp(μ + σΦ<sup>-1</sup>(p)); mean
 * exp(μ + σ²/2), variance (exp(σ²) − 1) exp(2μ + σ²) (Johnson, Kotz and Balakrishnan, <i>Continuous
 * Univariate Distributions</i> vol. 1, 2nd ed. 1994, chapter 14).
 */
final class Lognormal implements Marginal {

    private final double mu;
    private final double sigma;

    Lognormal(double mu, double sigma) {
        this.mu = mu;
        this.sigma = sigma;
    }

    @Override
    public String family() {
        return "lognormal";
    }

    @Override
    public double quantile(double p) {
        return StrictMath.exp(mu + sigma * NormalQuantile.of(p));
    }

    @Override
    public double upperQuantile(double q) {
        return StrictMath.exp(mu - sigma * NormalQuantile.of(q));
    }

    @Override
    public double fromLatent(double z) {
        return StrictMath.exp(mu + sigma * z);
    }

    @Override
    public double cdf(double x) {
        return x <= 0 ? 0.0 : StandardNormal.cdf((StrictMath.log(x) - mu) / sigma);
    }

    @Override
    public double survival(double x) {
        return x <= 0 ? 1.0 : StandardNormal.cdf(-(StrictMath.log(x) - mu) / sigma);
    }

    @Override
    public double mean() {
        return StrictMath.exp(mu + sigma * sigma / 2);
    }

    @Override
    public double sd() {
        double s2 = sigma * sigma;
        return StrictMath.sqrt(StrictMath.expm1(s2) * StrictMath.exp(2 * mu + s2));
    }

    double meanlog() {
        return mu;
    }

    double sdlog() {
        return sigma;
    }
}
