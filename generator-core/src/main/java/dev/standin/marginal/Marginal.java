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

    /**
     * The survival function S(x) = 1 − F(x). Families whose upper tail can be computed directly (not
     * as 1 − F, which loses every digit once F is within 1e-16 of 1) override it.
     */
    default double survival(double x) {
        return 1.0 - cdf(x);
    }

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

    /**
     * The quantile for an upper-tail probability q = 1 − p, for q in (0, 1): families that can do
     * better than {@code quantile(1 − q)} (which loses every digit of q below 1e-16) override it.
     */
    default double upperQuantile(double q) {
        return quantile(Math.min(1.0 - q, 1.0 - 0x1.0p-53));
    }

    /**
     * The value for a standard normal latent z: F<sup>-1</sup>(Φ(z)), computed through the upper
     * tail for z &gt; 0 so that large latents keep their precision. This is the Gaussian copula's map.
     */
    default double fromLatent(double z) {
        if (z <= 0) {
            return quantile(Math.max(StandardNormal.cdf(z), Double.MIN_NORMAL));
        }
        return upperQuantile(Math.max(StandardNormal.cdf(-z), Double.MIN_NORMAL));
    }

    /** How values are written; decimal numbers unless the family says otherwise. */
    default ValueKind valueKind() {
        return ValueKind.NUMBER;
    }

    /** True for distributions on whole numbers (counts, flags, levels, days, seconds). */
    default boolean isDiscrete() {
        return false;
    }

    /**
     * The mid-distribution function G(x) = (F(x) + F(x⁻))/2, the population counterpart of mid-ranks:
     * Spearman's ρ of two variables is the Pearson correlation of their G-values (W. Kruskal,
     * "Ordinal measures of association", JASA 53 (1958) 814-861). Equals F for continuous marginals.
     */
    default double grade(double x) {
        return cdf(x);
    }

    /** The label of a level, for {@link ValueKind#LABEL} marginals. */
    default String label(int level) {
        throw new UnsupportedOperationException(family() + " has no labels");
    }
}
