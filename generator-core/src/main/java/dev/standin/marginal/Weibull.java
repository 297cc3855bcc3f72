package dev.standin.marginal;

import org.apache.commons.math3.special.Gamma;

/**
 * The Weibull distribution with shape k and scale λ: F(x) = 1 − exp(−(x/λ)<sup>k</sup>),
 * F<sup>-1</sup>(p) = λ(−ln(1 − p))<sup>1/k</sup>, mean λΓ(1 + 1/k), variance λ²(Γ(1 + 2/k) − Γ(1 + 1/k)²)
 * (Johnson, Kotz and Balakrishnan 1994, chapter 21).
 */
final class Weibull implements Marginal {

    private final double shape;
    private final double scale;

    Weibull(double shape, double scale) {
        this.shape = shape;
        this.scale = scale;
    }

    @Override
    public String family() {
        return "weibull";
    }

    @Override
    public double quantile(double p) {
        return scale * StrictMath.pow(-StrictMath.log1p(-p), 1 / shape);
    }

    @Override
    public double upperQuantile(double q) {
        return scale * StrictMath.pow(-StrictMath.log(q), 1 / shape);
    }

    @Override
    public double cdf(double x) {
        return x <= 0 ? 0.0 : -StrictMath.expm1(-StrictMath.pow(x / scale, shape));
    }

    @Override
    public double survival(double x) {
        return x <= 0 ? 1.0 : StrictMath.exp(-StrictMath.pow(x / scale, shape));
    }

    @Override
    public double mean() {
        return scale * StrictMath.exp(Gamma.logGamma(1 + 1 / shape));
    }

    @Override
    public double sd() {
        double g1 = StrictMath.exp(Gamma.logGamma(1 + 1 / shape));
        double g2 = StrictMath.exp(Gamma.logGamma(1 + 2 / shape));
        return scale * StrictMath.sqrt(Math.max(g2 - g1 * g1, 0));
    }
}
