package dev.standin.correlation;

import dev.standin.marginal.Marginal;
import dev.standin.marginal.StandardNormal;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;
import org.apache.commons.math3.analysis.solvers.BrentSolver;
import org.apache.commons.math3.exception.TooManyEvaluationsException;

/**
 * NORTA ("normal to anything") for Pearson targets: the latent normal correlation r whose image
 * c(r) = Corr(F<sub>1</sub><sup>-1</sup>(Φ(Z<sub>1</sub>)), F<sub>2</sub><sup>-1</sup>(Φ(Z<sub>2</sub>)))
 * equals the requested product-moment correlation. M. C. Cario and B. L. Nelson, "Modeling and
 * generating random vectors with arbitrary marginal distributions and correlation matrix",
 * Technical report, Northwestern University (1997).
 *
 * <p>c(r) is evaluated by Gauss–Hermite quadrature over the bivariate normal (nodes and weights
 * from commons-math3's {@link GaussIntegratorFactory#hermite(int)}), writing Z<sub>2</sub> = r
 * Z<sub>1</sub> + √(1 − r²) Z<sub>3</sub>; means and variances use the same rule so that c(0) = 0.
 * When one column is exactly linear in its latent (an unbounded normal), Corr(Z<sub>1</sub>,
 * g(Z<sub>2</sub>)) = r E[Z g(Z)] / sd(g(Z)) (Stein's lemma), a one-dimensional integral; two such
 * columns need no integral at all. c is increasing in r (Cario and Nelson 1997, theorem 1), so the
 * root is bracketed by [−1, 1] and found by Brent's method when the target is attainable, i.e.
 * within [c(−1), c(1)].
 */
public final class NortaPearson {

    /** Gauss–Hermite points per dimension. */
    static final int POINTS = 48;

    private final double[] z;
    private final double[] w;

    public NortaPearson() {
        GaussIntegrator rule = new GaussIntegratorFactory().hermite(POINTS);
        int n = rule.getNumberOfPoints();
        z = new double[n];
        w = new double[n];
        double sqrt2 = StrictMath.sqrt(2.0);
        double sqrtPi = StrictMath.sqrt(Math.PI);
        for (int i = 0; i < n; i++) {
            z[i] = sqrt2 * rule.getPoint(i);
            w[i] = rule.getWeight(i) / sqrtPi;
        }
    }

    /** The target is outside what these two marginals can reach under a Gaussian copula. */
    public static final class UnattainableException extends Exception {
        private static final long serialVersionUID = 1L;
        private final double low;
        private final double high;

        UnattainableException(double low, double high) {
            super("attainable range [" + low + ", " + high + "]", null, false, false);
            this.low = low;
            this.high = high;
        }

        public double low() {
            return low;
        }

        public double high() {
            return high;
        }
    }

    /** The Pearson correlation of the two marginals' values under latent correlation r. */
    public double correlation(Marginal a, Marginal b, double r) {
        if (a.isLinearInLatent() && b.isLinearInLatent()) {
            return r;
        }
        if (a.isLinearInLatent()) {
            return r * steinSlope(b);
        }
        if (b.isLinearInLatent()) {
            return r * steinSlope(a);
        }
        double[] fa = values(a);
        double[] ma = moments(fa);
        double[] mb = moments(values(b));
        return (crossMoment(fa, b, r) - ma[0] * mb[0]) / (ma[1] * mb[1]);
    }

    /**
     * The latent correlation for a Pearson target.
     *
     * @throws UnattainableException when target is outside [c(−1), c(1)]
     */
    public double latentFor(Marginal a, Marginal b, double target) throws UnattainableException {
        if (a.isLinearInLatent() && b.isLinearInLatent()) {
            return target;
        }
        if (a.isLinearInLatent() || b.isLinearInLatent()) {
            double slope = steinSlope(a.isLinearInLatent() ? b : a);
            if (Math.abs(target) > slope) {
                throw new UnattainableException(-slope, slope);
            }
            return Math.max(-1.0, Math.min(1.0, target / slope));
        }
        double[] fa = values(a);
        double[] ma = moments(fa);
        double[] mb = moments(values(b));
        double low = (crossMoment(fa, b, -1.0) - ma[0] * mb[0]) / (ma[1] * mb[1]);
        double high = (crossMoment(fa, b, 1.0) - ma[0] * mb[0]) / (ma[1] * mb[1]);
        if (target < low || target > high) {
            throw new UnattainableException(low, high);
        }
        if (target == low) {
            return -1.0;
        }
        if (target == high) {
            return 1.0;
        }
        BrentSolver solver = new BrentSolver(1e-13, 1e-13);
        try {
            return solver.solve(200, r -> (crossMoment(fa, b, r) - ma[0] * mb[0]) / (ma[1] * mb[1]) - target,
                    -1.0, 1.0, 0.0);
        } catch (TooManyEvaluationsException e) {
            throw new IllegalStateException("NORTA root finding did not converge", e);
        }
    }

    /** E[Z g(Z)] / sd(g(Z)) for g = F<sup>-1</sup>∘Φ: the Pearson correlation of Z and g(Z). */
    private double steinSlope(Marginal m) {
        double[] f = values(m);
        double[] mom = moments(f);
        double ezg = 0;
        for (int i = 0; i < z.length; i++) {
            ezg += w[i] * z[i] * f[i];
        }
        return ezg / mom[1];
    }

    private double[] values(Marginal m) {
        double[] f = new double[z.length];
        for (int i = 0; i < z.length; i++) {
            f[i] = value(m, z[i]);
        }
        return f;
    }

    private static double value(Marginal m, double latent) {
        double p = StandardNormal.cdf(latent);
        p = Math.min(Math.max(p, Double.MIN_NORMAL), 1.0 - 0x1.0p-53);
        return m.quantile(p);
    }

    /** {mean, sd} of values at the nodes. */
    private double[] moments(double[] f) {
        double mean = 0;
        for (int i = 0; i < f.length; i++) {
            mean += w[i] * f[i];
        }
        double var = 0;
        for (int i = 0; i < f.length; i++) {
            double d = f[i] - mean;
            var += w[i] * d * d;
        }
        return new double[] {mean, StrictMath.sqrt(var)};
    }

    private double crossMoment(double[] fa, Marginal b, double r) {
        double s = StrictMath.sqrt(Math.max(0.0, 1.0 - r * r));
        double sum = 0;
        if (s == 0.0) {
            for (int i = 0; i < z.length; i++) {
                sum += w[i] * fa[i] * value(b, r * z[i]);
            }
            return sum;
        }
        for (int i = 0; i < z.length; i++) {
            double inner = 0;
            for (int j = 0; j < z.length; j++) {
                inner += w[j] * value(b, r * z[i] + s * z[j]);
            }
            sum += w[i] * fa[i] * inner;
        }
        return sum;
    }
}
