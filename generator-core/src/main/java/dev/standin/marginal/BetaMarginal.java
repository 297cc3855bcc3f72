package dev.standin.marginal;

import org.apache.commons.math3.special.Beta;

/**
 * The beta distribution on [0, 1]: F(x) = I<sub>x</sub>(α, β), the regularised incomplete beta
 * function, and S(x) = I<sub>1−x</sub>(β, α) (commons-math3 {@link Beta}); quantiles by
 * {@link TailInversion}; mean α/(α + β), variance αβ/((α + β)²(α + β + 1)).
 *
 * <p>Above the median the quantile is 1 − y with y the lower-tail quantile of the mirrored Beta(β, α)
 * (1 − X ~ Beta(β, α)): solving for x itself near 1 stops within Brent's tolerance 2·1e-15·x, i.e.
 * some 18 ulps of 1, which for β &lt; 1 is far from the root (Beta(0.5, 0.5)'s upper 1e-12 quantile
 * came out as 1 − 3.6e-15, where S is 3.8e-8); y near 0 is resolved to its own relative precision.
 */
final class BetaMarginal implements Marginal {

    private final double alpha;
    private final double beta;

    BetaMarginal(double alpha, double beta) {
        this.alpha = alpha;
        this.beta = beta;
    }

    @Override
    public String family() {
        return "beta";
    }

    @Override
    public double quantile(double p) {
        if (p > 0.5) {
            return 1.0 - mirrored(1.0 - p);
        }
        return TailInversion.quantile(p, this::cdf, this::survival, 0.0, 1.0, mean());
    }

    @Override
    public double upperQuantile(double q) {
        return q >= 0.5 ? quantile(1 - q) : 1.0 - mirrored(q);
    }

    /** The q-quantile (q ≤ 0.5) of 1 − X ~ Beta(β, α): the y with I<sub>y</sub>(β, α) = q. */
    private double mirrored(double q) {
        return TailInversion.quantile(q, this::mirroredCdf, y -> cdf(1.0 - y), 0.0, 1.0, 1.0 - mean());
    }

    /** I<sub>y</sub>(β, α) = P(1 − X ≤ y), computed from y itself (not 1 − y) to keep its digits. */
    private double mirroredCdf(double y) {
        if (y <= 0) {
            return 0.0;
        }
        if (y >= 1) {
            return 1.0;
        }
        return Beta.regularizedBeta(y, beta, alpha, 1e-15, 100_000);
    }

    @Override
    public double cdf(double x) {
        if (x <= 0) {
            return 0.0;
        }
        if (x >= 1) {
            return 1.0;
        }
        return Beta.regularizedBeta(x, alpha, beta, 1e-15, 100_000);
    }

    @Override
    public double survival(double x) {
        if (x <= 0) {
            return 1.0;
        }
        if (x >= 1) {
            return 0.0;
        }
        return Beta.regularizedBeta(1 - x, beta, alpha, 1e-15, 100_000);
    }

    @Override
    public double mean() {
        return alpha / (alpha + beta);
    }

    @Override
    public double sd() {
        double s = alpha + beta;
        return StrictMath.sqrt(alpha * beta / (s * s * (s + 1)));
    }
}
