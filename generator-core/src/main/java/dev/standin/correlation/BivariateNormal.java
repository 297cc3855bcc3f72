package dev.standin.correlation;

import dev.standin.marginal.GaussLegendre;
import dev.standin.marginal.StandardNormal;
import org.apache.commons.math3.util.FastMath;

/**
 * The bivariate standard normal distribution function Φ<sub>2</sub>(h, k; r) = P(Z<sub>1</sub> ≤ h,
 * Z<sub>2</sub> ≤ k) by Sheppard's formula Φ<sub>2</sub> = Φ(h)Φ(k) + (1/2π) ∫<sub>0</sub><sup>arcsin r</sup>
 * exp(−(h² + k² − 2hk sin θ)/(2cos² θ)) dθ (W. F. Sheppard 1900; see Z. Drezner and G. O.
 * Wesolowsky, "On the computation of the bivariate normal integral", J. Statist. Comput. Simul. 35
 * (1990) 101-107), with composite Gauss–Legendre quadrature (commons-math3's nodes, held in {@link GaussLegendre}). Accurate to
 * about 1e-12 for |r| ≤ 0.99 and 1e-9 beyond; |r| = 1 is exact.
 */
public final class BivariateNormal {

    private static final int PIECES = 8;
    // the rule is computed once: immutable after class initialisation, shared by every thread
    private static final double[] X = GaussLegendre.points(20);
    private static final double[] W = GaussLegendre.weights(20);

    private final double[] x = X;
    private final double[] w = W;

    public BivariateNormal() {
    }

    public double cdf(double h, double k, double r) {
        if (h == Double.NEGATIVE_INFINITY || k == Double.NEGATIVE_INFINITY) {
            return 0.0;
        }
        if (h == Double.POSITIVE_INFINITY) {
            return StandardNormal.cdf(k);
        }
        if (k == Double.POSITIVE_INFINITY) {
            return StandardNormal.cdf(h);
        }
        if (r >= 1.0) {
            return StandardNormal.cdf(Math.min(h, k));
        }
        if (r <= -1.0) {
            return Math.max(0.0, StandardNormal.cdf(h) - StandardNormal.cdf(-k));
        }
        double end = StrictMath.asin(r);
        double sum = 0;
        double piece = end / PIECES;
        double hk = h * k;
        double hh = (h * h + k * k) / 2;
        for (int p = 0; p < PIECES; p++) {
            double a = p * piece;
            for (int i = 0; i < x.length; i++) {
                double theta = a + piece * x[i];
                double sin = StrictMath.sin(theta);
                double cos2 = 1 - sin * sin;
                sum += piece * w[i] * FastMath.exp((hk * sin - hh) / cos2);
            }
        }
        double value = StandardNormal.cdf(h) * StandardNormal.cdf(k) + sum / (2 * Math.PI);
        return Math.min(Math.max(value, 0.0), Math.min(StandardNormal.cdf(h), StandardNormal.cdf(k)));
    }
}
