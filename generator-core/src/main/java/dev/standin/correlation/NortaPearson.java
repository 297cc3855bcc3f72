package dev.standin.correlation;

import dev.standin.marginal.GaussLegendre;
import dev.standin.marginal.Marginal;
import dev.standin.marginal.StandardNormal;
import dev.standin.random.NormalQuantile;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.analysis.solvers.BrentSolver;
import org.apache.commons.math3.exception.NoBracketingException;
import org.apache.commons.math3.exception.TooManyEvaluationsException;

/**
 * NORTA ("normal to anything") for Pearson targets: the latent normal correlation r whose image
 * c(r) = Corr(F<sub>1</sub><sup>-1</sup>(Φ(Z<sub>1</sub>)), F<sub>2</sub><sup>-1</sup>(Φ(Z<sub>2</sub>)))
 * equals the requested product-moment correlation. M. C. Cario and B. L. Nelson, "Modeling and
 * generating random vectors with arbitrary marginal distributions and correlation matrix",
 * Technical report, Northwestern University (1997).
 *
 * <p>How c(r) is evaluated depends on the two sides, each either linear (an unbounded normal: its
 * value is μ + σz), smooth, or a step function of its latent (a discrete marginal with at most
 * {@value #MAX_STEPS} support points):
 * <ul>
 *   <li>linear–linear: c(r) = r; linear–other: c(r) = r E[Z g(Z)]/sd(g(Z)) (Stein's lemma);</li>
 *   <li>smooth–smooth: Gauss–Hermite quadrature over the bivariate normal (commons-math3's nodes, held in {@link HermiteRule64}),
 *   Z<sub>2</sub> = rZ<sub>1</sub> + √(1 − r²)Z<sub>3</sub>;</li>
 *   <li>smooth–step: E[f(Z<sub>1</sub>)g(Z<sub>2</sub>)] = Σ<sub>j</sub> y<sub>j</sub> E[f(Z<sub>1</sub>)
 *   (Φ((s<sub>j+1</sub> − rZ<sub>1</sub>)/√(1 − r²)) − Φ((s<sub>j</sub> − rZ<sub>1</sub>)/√(1 − r²)))] with the
 *   step's thresholds s<sub>j</sub> = Φ<sup>-1</sup>(F(x<sub>j−1</sub>)), a smooth integrand for Gauss–Hermite;
 *   at r = ±1, Σ y<sub>j</sub> ∫ over the step's cell of F<sub>1</sub><sup>-1</sup>(u) du by Gauss–Legendre;</li>
 *   <li>step–step: Σ x<sub>i</sub>y<sub>j</sub>p<sub>ij</sub> with cell probabilities from {@link BivariateNormal}.</li>
 * </ul>
 * Moments of step sides are exact sums over the support. The ends c(±1) of two smooth sides are
 * one-dimensional integrals, taken by composite Gauss–Legendre. c is increasing in r (Cario and Nelson
 * 1997, theorem 1), so the root is bracketed by [−1, 1] and found by Brent's method when the target
 * lies in the attainable range [c(−1), c(1)].
 */
public final class NortaPearson {

    /** Gauss–Hermite points per dimension. */
    static final int POINTS = HermiteRule64.POINTS;

    /** Gauss–Legendre panels on [−16, 16] for the one-dimensional integrals at r = ±1. */
    static final int PANELS = 64;

    /** Discrete marginals with more support points than this are integrated as smooth functions. */
    static final int MAX_STEPS = 400;

    // quadrature rules, computed once: immutable after class initialisation, shared by every thread
    private static final double[] Z;
    private static final double[] W;
    private static final double[] LEGENDRE_X;
    private static final double[] LEGENDRE_W;

    static {
        double[] points = HermiteRule64.points();
        double[] weights = HermiteRule64.weights();
        int n = points.length;
        Z = new double[n];
        W = new double[n];
        double sqrt2 = StrictMath.sqrt(2.0);
        double sqrtPi = StrictMath.sqrt(Math.PI);
        for (int i = 0; i < n; i++) {
            Z[i] = sqrt2 * points[i];
            W[i] = weights[i] / sqrtPi;
        }
        LEGENDRE_X = GaussLegendre.points(16);
        LEGENDRE_W = GaussLegendre.weights(16);
    }

    private final double[] z = Z;
    private final double[] w = W;
    private final double[] legendreX = LEGENDRE_X;
    private final double[] legendreW = LEGENDRE_W;
    private final BivariateNormal bvn = new BivariateNormal();

    public NortaPearson() {
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

    /** One side of a pair: linear, smooth (values at the Hermite nodes) or a step function. */
    private final class Side {
        final Marginal m;
        final boolean linear;
        final double[] atNodes;
        /** Step values y<sub>j</sub> and thresholds s<sub>0</sub> = −∞ &lt; ... &lt; s<sub>J</sub> = +∞, or null. */
        final double[] steps;
        final double[] thresholds;
        final double mean;
        final double sd;

        /** True when the values are constant to rounding error, so no correlation is defined. */
        boolean constant() {
            return !linear && !(sd > 1e-12 * Math.max(1.0, Math.abs(mean)));
        }

        Side(Marginal m) {
            this.m = m;
            this.linear = m.isLinearInLatent();
            double[][] st = steps(m);
            this.steps = st == null ? null : st[0];
            this.thresholds = st == null ? null : st[1];
            if (steps != null) {
                this.atNodes = null;
                double mu = 0;
                double second = 0;
                for (int j = 0; j < steps.length; j++) {
                    double p = StandardNormal.cdf(thresholds[j + 1]) - StandardNormal.cdf(thresholds[j]);
                    mu += p * steps[j];
                }
                for (int j = 0; j < steps.length; j++) {
                    double p = StandardNormal.cdf(thresholds[j + 1]) - StandardNormal.cdf(thresholds[j]);
                    second += p * (steps[j] - mu) * (steps[j] - mu);
                }
                this.mean = mu;
                this.sd = StrictMath.sqrt(second);
            } else {
                this.atNodes = new double[z.length];
                double mu = 0;
                for (int i = 0; i < z.length; i++) {
                    atNodes[i] = value(m, z[i]);
                    mu += w[i] * atNodes[i];
                }
                double var = 0;
                for (int i = 0; i < z.length; i++) {
                    double d = atNodes[i] - mu;
                    var += w[i] * d * d;
                }
                this.mean = mu;
                this.sd = StrictMath.sqrt(var);
            }
        }
    }

    /** Support values (for a grade view: their grades) and latent thresholds of a small discrete marginal, or null. */
    private static double[][] steps(Marginal m) {
        Marginal base = m instanceof GradeView g ? g.base() : m;
        if (!base.isDiscrete()) {
            return null;
        }
        double lo = base.quantile(1e-15);
        double hi = base.quantile(1 - 1e-15);
        if (!(hi - lo + 1 <= MAX_STEPS)) {
            return null;
        }
        List<Double> values = new ArrayList<>();
        List<Double> cuts = new ArrayList<>();
        cuts.add(Double.NEGATIVE_INFINITY);
        for (double x = lo; x <= hi; x++) {
            double f = x == hi ? 1.0 : base.cdf(x);
            double previous = base.cdf(x - 1);
            if (!(f > previous) && x != hi) {
                continue;
            }
            values.add(m instanceof GradeView ? base.grade(x) : x);
            cuts.add(x == hi ? Double.POSITIVE_INFINITY : NormalQuantile.of(Math.min(f, 1.0)));
        }
        double[] y = values.stream().mapToDouble(Double::doubleValue).toArray();
        double[] s = cuts.stream().mapToDouble(Double::doubleValue).toArray();
        return new double[][] {y, s};
    }

    /** The Pearson correlation of the two marginals' values under latent correlation r. */
    public double correlation(Marginal a, Marginal b, double r) {
        if (a.isLinearInLatent() && b.isLinearInLatent()) {
            return r;
        }
        Side sa = new Side(a);
        Side sb = new Side(b);
        if (Math.abs(r) == 1.0 && !sa.linear && !sb.linear) {
            return endpoint(sa, sb, r > 0);
        }
        return correlation(sa, sb, r);
    }

    private double correlation(Side a, Side b, double r) {
        if (a.linear && b.linear) {
            return r;
        }
        if (a.linear) {
            return r * steinSlope(b);
        }
        if (b.linear) {
            return r * steinSlope(a);
        }
        return (crossMoment(a, b, r) - a.mean * b.mean) / (a.sd * b.sd);
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
        Side sa = new Side(a);
        Side sb = new Side(b);
        if (sa.constant() || sb.constant()) {
            // a column that is constant to rounding error carries no correlation: only 0 is attainable
            if (target != 0.0) {
                throw new UnattainableException(0.0, 0.0);
            }
            return 0.0;
        }
        if (sa.linear || sb.linear) {
            double slope = steinSlope(sa.linear ? sb : sa);
            if (Math.abs(target) > Math.abs(slope)) {
                throw new UnattainableException(-Math.abs(slope), Math.abs(slope));
            }
            return Math.max(-1.0, Math.min(1.0, target / slope));
        }
        double low = endpoint(sa, sb, false);
        double high = endpoint(sa, sb, true);
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
            return solver.solve(200, r -> correlation(sa, sb, r) - target, -1.0, 1.0, 0.0);
        } catch (TooManyEvaluationsException | NoBracketingException e) {
            // quadrature noise at the ends of a degenerate pair: no latent in (−1, 1) reaches the target
            throw new UnattainableException(low, high);
        }
    }

    /**
     * c(±1) for two non-linear sides. For two smooth sides, E[f(Z)g(±Z)] and the moments are
     * one-dimensional integrals against φ, taken by composite Gauss–Legendre on z ∈ [−16, 16]
     * ({@value #PANELS} panels), which stays accurate for heavy tails (a lognormal with σ = 2) where
     * a fixed Gauss–Hermite rule does not.
     */
    private double endpoint(Side a, Side b, boolean same) {
        if (a.steps != null || b.steps != null) {
            return correlation(a, b, same ? 1.0 : -1.0);
        }
        int n = PANELS * legendreX.length;
        double[] zz = new double[n];
        double[] ww = new double[n];
        double width = 32.0 / PANELS;
        for (int p = 0; p < PANELS; p++) {
            for (int i = 0; i < legendreX.length; i++) {
                double x = -16.0 + width * (p + legendreX[i]);
                zz[p * legendreX.length + i] = x;
                ww[p * legendreX.length + i] = width * legendreW[i] * StandardNormal.density(x);
            }
        }
        double[] fa = new double[n];
        double[] fb = new double[n];
        double ma = 0;
        double mb = 0;
        for (int i = 0; i < n; i++) {
            fa[i] = value(a.m, zz[i]);
            fb[i] = value(b.m, same ? zz[i] : -zz[i]);
            ma += ww[i] * fa[i];
            mb += ww[i] * fb[i];
        }
        double va = 0;
        double vb = 0;
        double cab = 0;
        for (int i = 0; i < n; i++) {
            double da = fa[i] - ma;
            double db = fb[i] - mb;
            va += ww[i] * da * da;
            vb += ww[i] * db * db;
            cab += ww[i] * da * db;
        }
        return cab / StrictMath.sqrt(va * vb);
    }

    private static double clamp(double u) {
        return Math.min(Math.max(u, Double.MIN_NORMAL), 1.0 - 0x1.0p-53);
    }

    /** E[Z g(Z)] / sd(g(Z)): the Pearson correlation of Z and g(Z). */
    private double steinSlope(Side s) {
        double ezg = 0;
        if (s.steps != null) {
            // E[Z 1{s_j < Z ≤ s_j+1}] = φ(s_j) − φ(s_j+1)
            for (int j = 0; j < s.steps.length; j++) {
                ezg += s.steps[j] * (StandardNormal.density(s.thresholds[j]) - StandardNormal.density(s.thresholds[j + 1]));
            }
        } else {
            for (int i = 0; i < z.length; i++) {
                ezg += w[i] * z[i] * s.atNodes[i];
            }
        }
        return ezg / s.sd;
    }

    private static double value(Marginal m, double latent) {
        return m.fromLatent(latent);
    }

    private double crossMoment(Side a, Side b, double r) {
        if (a.steps != null && b.steps != null) {
            double sum = 0;
            double[] ta = a.thresholds;
            double[] tb = b.thresholds;
            double[][] h = new double[ta.length][tb.length];
            for (int i = 0; i < ta.length; i++) {
                for (int j = 0; j < tb.length; j++) {
                    h[i][j] = bvn.cdf(ta[i], tb[j], r);
                }
            }
            for (int i = 0; i < a.steps.length; i++) {
                for (int j = 0; j < b.steps.length; j++) {
                    double p = h[i + 1][j + 1] - h[i][j + 1] - h[i + 1][j] + h[i][j];
                    sum += a.steps[i] * b.steps[j] * p;
                }
            }
            return sum;
        }
        if (a.steps != null) {
            return crossMoment(b, a, r);
        }
        double s = StrictMath.sqrt(Math.max(0.0, 1.0 - r * r));
        if (b.steps != null) {
            if (s == 0.0) {
                return cellIntegral(a.m, b, r > 0);
            }
            double sum = 0;
            for (int i = 0; i < z.length; i++) {
                double inner = 0;
                double previous = 0;
                for (int j = 0; j < b.steps.length; j++) {
                    double upper = b.thresholds[j + 1] == Double.POSITIVE_INFINITY ? 1.0
                            : StandardNormal.cdf((b.thresholds[j + 1] - r * z[i]) / s);
                    inner += b.steps[j] * (upper - previous);
                    previous = upper;
                }
                sum += w[i] * a.atNodes[i] * inner;
            }
            return sum;
        }
        double sum = 0;
        if (s == 0.0) {
            for (int i = 0; i < z.length; i++) {
                sum += w[i] * a.atNodes[i] * value(b.m, r * z[i]);
            }
            return sum;
        }
        for (int i = 0; i < z.length; i++) {
            double inner = 0;
            for (int j = 0; j < z.length; j++) {
                inner += w[j] * value(b.m, r * z[i] + s * z[j]);
            }
            sum += w[i] * a.atNodes[i] * inner;
        }
        return sum;
    }

    /**
     * E[f(Z) g(±Z)] for a smooth f = F<sup>-1</sup>∘Φ and a step g: Σ<sub>j</sub> y<sub>j</sub>
     * ∫<sub>cell j</sub> F<sup>-1</sup>(u) du, each cell by Gauss–Legendre in u.
     */
    private double cellIntegral(Marginal smooth, Side step, boolean same) {
        double sum = 0;
        for (int j = 0; j < step.steps.length; j++) {
            double u0 = StandardNormal.cdf(step.thresholds[j]);
            double u1 = StandardNormal.cdf(step.thresholds[j + 1]);
            double a = same ? u0 : 1 - u1;
            double b = same ? u1 : 1 - u0;
            double integral = 0;
            for (int i = 0; i < legendreX.length; i++) {
                double u = a + (b - a) * legendreX[i];
                u = Math.min(Math.max(u, Double.MIN_NORMAL), 1.0 - 0x1.0p-53);
                integral += (b - a) * legendreW[i] * smooth.quantile(u);
            }
            sum += step.steps[j] * integral;
        }
        return sum;
    }
}
