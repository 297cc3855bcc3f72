package dev.standin.marginal;

import org.apache.commons.math3.special.Beta;

/**
 * The beta distribution on [0, 1]: F(x) = I<sub>x</sub>(α, β), the regularised incomplete beta
 * function, and S(x) = I<sub>1−x</sub>(β, α) (commons-math3 {@link Beta}); quantiles by
 * {@link TailInversion}; mean α/(α + β), variance αβ/((α + β)²(α + β + 1)).
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
        return TailInversion.quantile(p, this::cdf, this::survival, 0.0, 1.0, mean());
    }

    @Override
    public double upperQuantile(double q) {
        return q >= 0.5 ? quantile(1 - q) : TailInversion.upper(q, this::survival, 0.0, 1.0, mean());
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
