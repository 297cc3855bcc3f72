package dev.standin.marginal;

import org.apache.commons.math3.special.Gamma;

/**
 * The gamma distribution with shape k and scale θ: F(x) = P(k, x/θ), the regularised lower
 * incomplete gamma function, and S(x) = Q(k, x/θ) (commons-math3 {@link Gamma}); quantiles by
 * {@link TailInversion}; mean kθ, variance kθ².
 */
final class GammaMarginal implements Marginal {

    private final double shape;
    private final double scale;

    GammaMarginal(double shape, double scale) {
        this.shape = shape;
        this.scale = scale;
    }

    @Override
    public String family() {
        return "gamma";
    }

    @Override
    public double quantile(double p) {
        return TailInversion.quantile(p, this::cdf, this::survival, 0.0, Double.POSITIVE_INFINITY, mean());
    }

    @Override
    public double upperQuantile(double q) {
        return q >= 0.5 ? quantile(1 - q) : TailInversion.upper(q, this::survival, 0.0, Double.POSITIVE_INFINITY, mean());
    }

    @Override
    public double cdf(double x) {
        return x <= 0 ? 0.0 : Gamma.regularizedGammaP(shape, x / scale, 1e-15, 100_000);
    }

    @Override
    public double survival(double x) {
        return x <= 0 ? 1.0 : Gamma.regularizedGammaQ(shape, x / scale, 1e-15, 100_000);
    }

    @Override
    public double mean() {
        return shape * scale;
    }

    @Override
    public double sd() {
        return StrictMath.sqrt(shape) * scale;
    }
}
