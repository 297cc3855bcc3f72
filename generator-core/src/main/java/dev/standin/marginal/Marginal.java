package dev.standin.marginal;

/**
 * A column's marginal distribution, sampled by its quantile function (inversion), so one uniform
 * gives one value and a Gaussian copula can feed it Φ(latent).
 *
 * <p>Implementations are immutable and must be bit-reproducible across JVMs: no
 * {@code java.lang.Math} transcendental functions (use {@link StrictMath} or commons-math3's
 * {@code FastMath}).
 */
public interface Marginal {

    /** The spec's family word, e.g. {@code normal}. */
    String family();

    /** The quantile function F<sup>-1</sup>(p) for p in (0, 1). */
    double quantile(double p);

    /** The distribution function F(x). */
    double cdf(double x);

    /** The mean of the distribution as sampled (after any truncation). */
    double mean();

    /** The standard deviation of the distribution as sampled (after any truncation). */
    double sd();

    /**
     * True when the value is exactly {@code mean() + sd() * z} of a standard normal latent z, so the
     * sampler can skip Φ and F<sup>-1</sup> and a Pearson target equals the latent correlation.
     */
    default boolean isLinearInLatent() {
        return false;
    }
}
