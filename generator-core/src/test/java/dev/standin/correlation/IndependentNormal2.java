package dev.standin.correlation;

import java.util.function.DoubleUnaryOperator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;
import org.apache.commons.math3.distribution.NormalDistribution;

/**
 * Test-side bivariate standard normal probabilities computed independently of {@link BivariateNormal}
 * (which integrates Sheppard's formula over the angle with a fixed Gauss–Legendre rule), by two other
 * routes, each by composite 20-point Gauss–Legendre quadrature (nodes from commons-math3's
 * {@link GaussIntegratorFactory}) on many more, and differently placed, panels than the project's:
 * <ul>
 *   <li>Owen's formula Φ<sub>2</sub>(h, k; ρ) = ½Φ(h) + ½Φ(k) − T(h, a<sub>h</sub>) − T(k, a<sub>k</sub>) − β,
 *   a<sub>h</sub> = (k − ρh)/(h√(1 − ρ²)), a<sub>k</sub> = (h − ρk)/(k√(1 − ρ²)), β = ½ when hk &lt; 0 (or hk = 0
 *   and h + k &lt; 0), else 0, with Owen's T function T(h, a) = (1/2π)∫<sub>0</sub><sup>a</sup> e<sup>−h²(1+x²)/2</sup>/(1 + x²) dx
 *   (D. B. Owen, "Tables for computing bivariate normal probabilities", Ann. Math. Statist. 27 (1956)
 *   1075-1090; formulas from memory), taken as (1/2π)∫<sub>0</sub><sup>arctan a</sup> exp(−(h²/2)sec²θ) dθ;</li>
 *   <li>the conditional integral Φ<sub>2</sub>(h, k; ρ) = ∫<sub>−∞</sub><sup>h</sup> φ(x) Φ((k − ρx)/√(1 − ρ²)) dx
 *   (Z<sub>2</sub> | Z<sub>1</sub> = x is N(ρx, 1 − ρ²)), split at x = k/ρ where the integrand turns.</li>
 * </ul>
 * Φ and φ are commons-math3's {@link NormalDistribution}.
 */
final class IndependentNormal2 {

    private static final NormalDistribution STD = new NormalDistribution(0.0, 1.0);

    private IndependentNormal2() {
    }

    private static final GaussIntegrator RULE = new GaussIntegratorFactory().legendre(20, 0.0, 1.0);

    /** ∫<sub>a</sub><sup>b</sup> f by composite 20-point Gauss–Legendre on equal panels. */
    static double integrate(DoubleUnaryOperator f, double a, double b, int panels) {
        double width = (b - a) / panels;
        double sum = 0;
        for (int p = 0; p < panels; p++) {
            double from = a + p * width;
            for (int i = 0; i < RULE.getNumberOfPoints(); i++) {
                sum += width * RULE.getWeight(i) * f.applyAsDouble(from + width * RULE.getPoint(i));
            }
        }
        return sum;
    }

    static double phi(double x) {
        return Double.isInfinite(x) ? (x > 0 ? 1.0 : 0.0) : STD.cumulativeProbability(x);
    }

    static double density(double x) {
        return Double.isInfinite(x) ? 0.0 : STD.density(x);
    }

    static double inverse(double p) {
        return STD.inverseCumulativeProbability(p);
    }

    /** Owen's T(h, a). */
    static double owenT(double h, double a) {
        if (a == 0.0) {
            return 0.0;
        }
        if (a < 0) {
            return -owenT(h, -a); // T is odd in a
        }
        double end = Math.atan(a);
        double hh = h * h / 2;
        double value = integrate(t -> {
            double c = Math.cos(t);
            return Math.exp(-hh / (c * c));
        }, 0.0, end, 24);
        return value / (2 * Math.PI);
    }

    /** Φ<sub>2</sub> by Owen's formula; h and k must be finite and non-zero, |ρ| &lt; 1. */
    static double owen(double h, double k, double rho) {
        if (h == 0.0 || k == 0.0 || Double.isInfinite(h) || Double.isInfinite(k) || !(Math.abs(rho) < 1)) {
            throw new IllegalArgumentException("owen: h, k finite and non-zero, |rho| < 1");
        }
        double s = Math.sqrt(1 - rho * rho);
        double ah = (k - rho * h) / (h * s);
        double ak = (h - rho * k) / (k * s);
        double beta = h * k < 0 ? 0.5 : 0.0;
        return 0.5 * phi(h) + 0.5 * phi(k) - owenT(h, ah) - owenT(k, ak) - beta;
    }

    /** Φ<sub>2</sub> by Owen's formula, infinite limits giving the margins (h, k non-zero). */
    static double cdf(double h, double k, double rho) {
        if (h == Double.NEGATIVE_INFINITY || k == Double.NEGATIVE_INFINITY) {
            return 0.0;
        }
        if (h == Double.POSITIVE_INFINITY) {
            return phi(k);
        }
        if (k == Double.POSITIVE_INFINITY) {
            return phi(h);
        }
        return owen(h, k, rho);
    }

    /** Φ<sub>2</sub> by the conditional integral; any h, k (infinite allowed), |ρ| &lt; 1. */
    static double conditional(double h, double k, double rho) {
        if (h == Double.NEGATIVE_INFINITY || k == Double.NEGATIVE_INFINITY) {
            return 0.0;
        }
        if (h == Double.POSITIVE_INFINITY) {
            return phi(k);
        }
        if (k == Double.POSITIVE_INFINITY) {
            return phi(h);
        }
        double s = Math.sqrt(1 - rho * rho);
        // φ is below 1e-31 beyond 12; panels of 0.05, and of 0.002 within 0.2 of the turn k/ρ, where
        // Φ((k − ρx)/s) changes over a width s/|ρ|
        double lo = Math.min(h - 30, -12.0);
        double from = Math.max(lo, -40.0);
        double sum = 0;
        double turn = rho == 0.0 ? Double.NaN : k / rho;
        double[] cuts = {from, turn - 0.2, turn + 0.2, h};
        java.util.Arrays.sort(cuts);
        for (int i = 0; i + 1 < cuts.length; i++) {
            double a = Math.max(cuts[i], from);
            double b = Math.min(cuts[i + 1], h);
            if (!(b > a)) {
                continue;
            }
            boolean near = Math.abs((a + b) / 2 - turn) < 0.2;
            int panels = (int) Math.ceil((b - a) / (near ? 0.002 : 0.05));
            sum += integrate(x -> density(x) * phi((k - rho * x) / s), a, b, Math.max(panels, 1));
        }
        return sum;
    }

}
