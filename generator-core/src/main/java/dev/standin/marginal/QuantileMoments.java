package dev.standin.marginal;

import java.util.function.DoubleUnaryOperator;

/**
 * Mean and sd of a distribution from its quantile function, E[X<sup>k</sup>] = ∫<sub>0</sub><sup>1</sup>
 * Q(u)<sup>k</sup> du, by composite Gauss–Legendre quadrature (commons-math3's nodes, held in {@link GaussLegendre}) on
 * intervals graded geometrically towards both ends, [10<sup>-j-1</sup>, 10<sup>-j</sup>] down to
 * 10<sup>-16</sup>, which copes with the logarithmic growth of Q in unbounded tails. A fixed rule, so
 * the result is the same on every run and JVM.
 */
public final class QuantileMoments {

    private static final int POINTS = 32;
    private static final int DECADES = 16;

    /** The rule's nodes and weights on [0, 1] (immutable, shared). */
    private static final double[] X = GaussLegendre.points(POINTS);
    private static final double[] W = GaussLegendre.weights(POINTS);

    private QuantileMoments() {
    }

    /** ∫<sub>0</sub><sup>1</sup> h(u) du by the same graded rule. */
    public static double integral(DoubleUnaryOperator h) {
        double[] m = moments(h, 0.0);
        return m[0];
    }

    /** {mean, sd}. */
    public static double[] of(DoubleUnaryOperator q) {
        double centre = q.applyAsDouble(0.5);
        double[] m = moments(q, centre);
        double mean = centre + m[0];
        double var = Math.max(m[1] - m[0] * m[0], 0);
        return new double[] {mean, StrictMath.sqrt(var)};
    }

    /** {∫(q − c), ∫(q − c)²}. */
    private static double[] moments(DoubleUnaryOperator q, double first) {
        double s1 = 0;
        double s2 = 0;
        // center: [0.1, 0.9]; then [10^-(j+1), 10^-j] and its mirror for j = 1..DECADES
        double[][] pieces = new double[2 * DECADES + 1][];
        pieces[0] = new double[] {0.1, 0.9};
        for (int j = 1; j <= DECADES; j++) {
            double hi = StrictMath.pow(10, -j);
            double lo = StrictMath.pow(10, -j - 1);
            pieces[2 * j - 1] = new double[] {lo, hi};
            // the upper side stops at 1 − 1e-16, the last double below 1 that 1 − 10^-j still resolves
            pieces[2 * j] = j < DECADES ? new double[] {1 - hi, 1 - lo} : new double[] {1 - hi, 1 - hi};
        }
        for (double[] piece : pieces) {
            double a = piece[0];
            double b = piece[1];
            for (int i = 0; i < X.length; i++) {
                double u = a + (b - a) * X[i];
                double w = (b - a) * W[i];
                double x = q.applyAsDouble(u) - first;
                s1 += w * x;
                s2 += w * x * x;
            }
        }
        return new double[] {s1, s2};
    }
}
