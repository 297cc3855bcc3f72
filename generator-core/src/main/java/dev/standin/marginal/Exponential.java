package dev.standin.marginal;

/** The exponential distribution with rate λ: F<sup>-1</sup>(p) = −ln(1 − p)/λ, mean and sd 1/λ. */
final class Exponential implements Marginal {

    private final double rate;

    Exponential(double rate) {
        this.rate = rate;
    }

    @Override
    public String family() {
        return "exponential";
    }

    @Override
    public double quantile(double p) {
        return -StrictMath.log1p(-p) / rate;
    }

    @Override
    public double upperQuantile(double q) {
        return -StrictMath.log(q) / rate;
    }

    @Override
    public double cdf(double x) {
        return x <= 0 ? 0.0 : -StrictMath.expm1(-rate * x);
    }

    @Override
    public double survival(double x) {
        return x <= 0 ? 1.0 : StrictMath.exp(-rate * x);
    }

    @Override
    public double mean() {
        return 1 / rate;
    }

    @Override
    public double sd() {
        return 1 / rate;
    }
}
