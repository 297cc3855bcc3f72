package dev.standin.marginal;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.function.DoubleUnaryOperator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;
import org.apache.commons.math3.analysis.solvers.BrentSolver;
import org.apache.commons.math3.distribution.BetaDistribution;
import org.apache.commons.math3.distribution.BinomialDistribution;
import org.apache.commons.math3.distribution.ExponentialDistribution;
import org.apache.commons.math3.distribution.GammaDistribution;
import org.apache.commons.math3.distribution.IntegerDistribution;
import org.apache.commons.math3.distribution.LogNormalDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.distribution.PascalDistribution;
import org.apache.commons.math3.distribution.PoissonDistribution;
import org.apache.commons.math3.distribution.RealDistribution;
import org.apache.commons.math3.distribution.TriangularDistribution;
import org.apache.commons.math3.distribution.UniformIntegerDistribution;
import org.apache.commons.math3.distribution.UniformRealDistribution;
import org.apache.commons.math3.distribution.WeibullDistribution;
import org.apache.commons.math3.special.Beta;
import org.apache.commons.math3.special.Gamma;
import org.junit.jupiter.api.Test;

/**
 * Every family's CDF, quantile, tails and moments against commons-math3's distributions (an
 * independent implementation in test scope), closed forms and a few published table values.
 */
class FamiliesReferenceTest {

    /**
     * A continuous family and its commons-math3 counterpart, with F and S = 1 − F computed accurately in
     * both tails: commons-math3's lognormal, exponential and Weibull CDFs are 0.5 + 0.5 erf(·) or
     * 1 − exp(·) and lose every digit below ~1e-12, so those families get F from commons-math3's normal
     * CDF (erfc) or −expm1 (closed forms of their CDFs).
     */
    private record Continuous(String name, Marginal m, RealDistribution ref, DoubleUnaryOperator lower,
                              DoubleUnaryOperator survival) {
        Continuous(String name, Marginal m, RealDistribution ref, DoubleUnaryOperator survival) {
            this(name, m, ref, ref::cumulativeProbability, survival);
        }
    }

    private static List<Continuous> continuous() {
        List<Continuous> c = new ArrayList<>();
        NormalDistribution std = new NormalDistribution(0, 1);
        c.add(new Continuous("normal(3, 2)", NormalMarginal.of(3, 2), new NormalDistribution(3, 2),
                x -> std.cumulativeProbability(-(x - 3) / 2)));
        c.add(new Continuous("lognormal(1, 0.8)", Families.lognormal(1, 0.8), new LogNormalDistribution(1, 0.8),
                x -> std.cumulativeProbability((Math.log(x) - 1) / 0.8), x -> std.cumulativeProbability(-(Math.log(x) - 1) / 0.8)));
        c.add(new Continuous("lognormal(-2, 2)", Families.lognormal(-2, 2), new LogNormalDistribution(-2, 2),
                x -> std.cumulativeProbability((Math.log(x) + 2) / 2), x -> std.cumulativeProbability(-(Math.log(x) + 2) / 2)));
        c.add(new Continuous("exponential(0.25)", Families.exponential(0.25), new ExponentialDistribution(4),
                x -> -Math.expm1(-x / 4), x -> Math.exp(-x / 4)));
        for (double[] g : new double[][] {{0.3, 2}, {1, 1}, {2.5, 0.4}, {6.25, 4.8}, {150, 0.01}}) {
            c.add(new Continuous("gamma(" + g[0] + ", " + g[1] + ")", Families.gamma(g[0], g[1]),
                    new GammaDistribution(g[0], g[1]), x -> Gamma.regularizedGammaQ(g[0], x / g[1])));
        }
        for (double[] b : new double[][] {{0.5, 0.5}, {2, 5}, {1, 3.5}, {3, 1}, {40, 7}}) {
            c.add(new Continuous("beta(" + b[0] + ", " + b[1] + ")", Families.beta(b[0], b[1]),
                    new BetaDistribution(b[0], b[1]), x -> x >= 1 ? 0.0 : x <= 0 ? 1.0 : Beta.regularizedBeta(1 - x, b[1], b[0])));
        }
        for (double[] w : new double[][] {{0.5, 3}, {1.5, 3}, {4, 0.2}}) {
            c.add(new Continuous("weibull(" + w[0] + ", " + w[1] + ")", Families.weibull(w[0], w[1]),
                    new WeibullDistribution(w[0], w[1]), x -> -Math.expm1(-Math.pow(x / w[1], w[0])),
                    x -> Math.exp(-Math.pow(x / w[1], w[0]))));
        }
        for (double[] t : new double[][] {{1, 2, 5}, {0, 0, 1}, {-3, 4, 4}}) {
            TriangularDistribution ref = new TriangularDistribution(t[0], t[1], t[2]);
            c.add(new Continuous("triangular" + java.util.Arrays.toString(t), Families.triangular(t[0], t[1], t[2]), ref,
                    x -> triangularCdf(t, x, false), x -> triangularCdf(t, x, true)));
        }
        UniformRealDistribution u = new UniformRealDistribution(-2, 7);
        c.add(new Continuous("uniform(-2, 7)", UniformMarginal.of(-2, 7), u, x -> x >= 7 ? 0.0 : x <= -2 ? 1.0 : (7 - x) / 9));
        return c;
    }

    /**
     * The triangular CDF (x − a)²/((b − a)(c − a)) below the mode and 1 − (b − x)²/((b − a)(b − c))
     * above it (closed form), or its complement, in exact decimal arithmetic (BigDecimal, 34 digits),
     * since in doubles 1 − (·) loses the digits of a small tail.
     */
    private static double triangularCdf(double[] t, double x, boolean upper) {
        if (x <= t[0]) {
            return upper ? 1.0 : 0.0;
        }
        if (x >= t[2]) {
            return upper ? 0.0 : 1.0;
        }
        java.math.MathContext mc = java.math.MathContext.DECIMAL128;
        java.math.BigDecimal a = new java.math.BigDecimal(t[0]);
        java.math.BigDecimal c = new java.math.BigDecimal(t[1]);
        java.math.BigDecimal b = new java.math.BigDecimal(t[2]);
        java.math.BigDecimal v = new java.math.BigDecimal(x);
        java.math.BigDecimal f;
        if (x <= t[1]) {
            f = v.subtract(a).pow(2).divide(b.subtract(a).multiply(c.subtract(a)), mc);
        } else {
            f = java.math.BigDecimal.ONE.subtract(b.subtract(v).pow(2).divide(b.subtract(a).multiply(b.subtract(c)), mc));
        }
        return (upper ? java.math.BigDecimal.ONE.subtract(f) : f).doubleValue();
    }

    private static final double[] P = {1e-12, 1e-8, 1e-5, 1e-3, 0.01, 0.05, 0.1, 0.25, 0.5, 0.75, 0.9, 0.95, 0.99, 0.999};

    @Test
    void cdfMatchesCommonsMath() {
        for (Continuous c : continuous()) {
            for (double p : P) {
                double x = c.ref.inverseCumulativeProbability(p);
                // absolute agreement of F; commons-math3's continued fractions are good to about 1e-14
                assertEquals(c.ref.cumulativeProbability(x), c.m.cdf(x), 1e-13, c.name + " F at " + x);
                double f = c.lower.applyAsDouble(x);
                assertEquals(f, c.m.cdf(x), 1e-12 * f, c.name + " F at " + x + ", lower tail");
                double s = c.survival.applyAsDouble(x);
                assertEquals(s, c.m.survival(x), 1e-12 * s + 1e-300, c.name + " S at " + x);
            }
        }
    }

    @Test
    void quantileInvertsCommonsMathsCdf() {
        // The root of F_ref(x) = p must lie within Brent's stopping tolerance δ = 2·(2·1e-15|x|) of Q(p)
        // (commons-math3 BrentSolver at the relative accuracy TailInversion sets; closed-form quantiles
        // are better than that): F_ref(x − δ) ≤ p ≤ F_ref(x + δ), each side with 1e-12 relative slack for
        // the reference's own rounding; in the upper half the same with the accurate survival function
        // S_ref. This does not rely on commons-math3's own inverse (its generic solver stops at 1e-9
        // absolute), and it holds where the true quantile is not a double (Beta(0.5, 0.5)'s upper 1e-12
        // quantile is 1 − 2.5e-24, which rounds to 1).
        for (Continuous c : continuous()) {
            for (double p : P) {
                double x = c.m.quantile(p);
                double d = 4e-15 * Math.abs(x) + Double.MIN_VALUE;
                String what = c.name + " Q(" + p + ") = " + x;
                assertTrue(c.lower.applyAsDouble(x - d) <= p * (1 + 1e-12), what + ": F(x − δ) > p");
                assertTrue(c.lower.applyAsDouble(x + d) >= p * (1 - 1e-12), what + ": F(x + δ) < p");
                double y = c.m.upperQuantile(p);
                double e = 4e-15 * Math.abs(y) + Double.MIN_VALUE;
                what = c.name + " upperQuantile(" + p + ") = " + y;
                assertTrue(c.survival.applyAsDouble(y - e) >= p * (1 - 1e-12), what + ": S(x − δ) < q");
                assertTrue(c.survival.applyAsDouble(y + e) <= p * (1 + 1e-12), what + ": S(x + δ) > q");
            }
        }
    }

    @Test
    void quantileAndCdfRoundTrip() {
        for (Continuous c : continuous()) {
            for (double p = 0.001; p < 1; p += 0.001) {
                double x = c.m.quantile(p);
                // |Q(F(x)) − x| from F's last-bit error ε ≈ 1e-15 relative: dx = εF/f
                double tol = 1e-13 * Math.max(1, Math.abs(x)) + 1e-14 * p / c.ref.density(x);
                assertEquals(x, c.m.quantile(c.m.cdf(x)), tol, c.name + " Q(F(" + x + "))");
                assertEquals(p, c.m.cdf(x), 1e-13, c.name + " F(Q(" + p + "))");
            }
        }
    }

    @Test
    void quantilesIncreaseAndLatentMapIsMonotoneAndFinite() {
        // Brent's method stops within 2·1e-15·|x| of the root (commons-math3 BrentSolver, relative
        // accuracy 1e-15 as TailInversion sets it), so two inverted quantiles can come out of order by
        // up to 4e-15|x|: the slack below. Anything larger, or a non-finite value, fails.
        for (Continuous c : continuous()) {
            double previous = Double.NEGATIVE_INFINITY;
            for (double z = -38; z <= 38; z += 0.05) {
                double x = c.m.fromLatent(z);
                assertTrue(Double.isFinite(x), c.name + " fromLatent(" + z + ") = " + x);
                assertTrue(x >= previous - 4e-15 * Math.abs(x), c.name + " fromLatent decreases at z = " + z + ": " + previous + " > " + x);
                previous = Math.max(previous, x);
            }
            previous = Double.NEGATIVE_INFINITY;
            for (int i = 1; i < 2_000; i++) {
                double x = c.m.quantile(i / 2_000.0);
                assertTrue(x >= previous - 4e-15 * Math.abs(x), c.name + " quantile decreases at " + i);
                previous = Math.max(previous, x);
            }
        }
    }

    @Test
    void upperQuantileAgreesWithQuantileWhereBothAreAccurate() {
        // 1 − q is within 1.1e-16 of the true complement, which moves x by ~1e-16/f(x); for q ≥ 1e-6
        // the two must agree to 1e-8 relative (f(x)·x ≥ ~q for these families)
        for (Continuous c : continuous()) {
            for (double q : new double[] {1e-6, 1e-4, 0.01, 0.1, 0.3, 0.5}) {
                double a = c.m.upperQuantile(q);
                double b = c.m.quantile(1 - q);
                assertEquals(b, a, 1e-8 * Math.max(1, Math.abs(b)), c.name + " at q = " + q);
            }
        }
    }

    @Test
    void momentsMatchCommonsMath() {
        for (Continuous c : continuous()) {
            double sd = Math.sqrt(c.ref.getNumericalVariance());
            assertEquals(c.ref.getNumericalMean(), c.m.mean(), 1e-12 * Math.max(1, Math.abs(c.ref.getNumericalMean())), c.name + " mean");
            assertEquals(sd, c.m.sd(), 1e-11 * sd, c.name + " sd");
        }
    }

    @Test
    void upperTailsMatchDirectInversionAndPublishedValues() {
        // the gamma's and beta's upper tails down to 1 − 1e-15, against Brent's method run here on
        // commons-math3's regularizedGammaQ / regularizedBeta (a direct inversion of S at 1e-15 relative)
        // (function-value accuracy 0: the default 1e-15 would accept any x where S is below 2e-15)
        BrentSolver brent = new BrentSolver(1e-15, 1e-300, 0.0);
        for (double[] g : new double[][] {{0.3, 2}, {2.5, 0.4}, {6.25, 4.8}, {150, 0.01}}) {
            Marginal m = Families.gamma(g[0], g[1]);
            for (double q : new double[] {1e-15, 1e-12, 1e-9, 1e-5}) {
                double x = brent.solve(10_000, t -> Gamma.regularizedGammaQ(g[0], t / g[1]) - q, 0, g[1] * (3 * g[0] + 100));
                assertEquals(x, m.upperQuantile(q), 1e-12 * x, "gamma " + g[0] + " upper " + q);
            }
            // fromLatent(z) is the upper quantile of Φ(−z) (commons-math3's Φ, erfc-based)
            for (double z : new double[] {3, 7.9, 20, 37}) {
                double q = new NormalDistribution().cumulativeProbability(-z);
                double x = brent.solve(10_000, t -> Gamma.regularizedGammaQ(g[0], t / g[1]) / q - 1, 0, g[1] * (3 * g[0] + 800));
                assertEquals(x, m.fromLatent(z), 1e-12 * x, "gamma " + g[0] + " fromLatent(" + z + ")");
            }
        }
        for (double[] b : new double[][] {{0.5, 0.5}, {2, 5}, {40, 7}}) {
            Marginal m = Families.beta(b[0], b[1]);
            for (double q : new double[] {1e-15, 1e-12, 1e-9, 1e-5}) {
                // solve for y = 1 − x, where the beta's upper tail is I_y(β, α), to keep y's digits
                double y = brent.solve(10_000, t -> Beta.regularizedBeta(t, b[1], b[0]) - q, 0, 1);
                assertEquals(1 - y, m.upperQuantile(q), 1e-12 * y + 2.3e-16, "beta " + b[0] + ", " + b[1] + " upper " + q);
            }
        }
        // closed forms: Beta(1, b) has S(x) = (1 − x)^b, so its upper q-quantile is 1 − q^(1/b);
        // Beta(a, 1) has F(x) = x^a, lower p-quantile p^(1/a); Gamma(1, θ) is exponential: −θ ln q
        Marginal b13 = Families.beta(1, 3.5);
        Marginal b31 = Families.beta(3, 1);
        Marginal g1 = Families.gamma(1, 2.5);
        for (double q : new double[] {1e-15, 1e-10, 1e-3, 0.2}) {
            assertEquals(1 - Math.pow(q, 1 / 3.5), b13.upperQuantile(q), 1e-15);
            // (pow with the inexact exponent 1/3 is itself good to about |ln q|·1e-16 relative)
            assertEquals(Math.pow(q, 1 / 3.0), b31.quantile(q), 1e-14 * Math.pow(q, 1 / 3.0));
            assertEquals(-2.5 * Math.log(q), g1.upperQuantile(q), 1e-13 * -2.5 * Math.log(q));
        }
        // χ²_ν = Gamma(ν/2, 2): upper percentage points from Abramowitz and Stegun, Handbook of
        // Mathematical Functions (1964), Table 26.8 (values from memory); ν = 2 is the closed form −2 ln q
        double[][] chi2 = {{1, 0.05, 3.841459}, {1, 0.01, 6.634897}, {5, 0.05, 11.070498}, {10, 0.05, 18.307038},
            {10, 0.01, 23.209251}, {2, 0.001, -2 * Math.log(0.001)}};
        for (double[] row : chi2) {
            assertEquals(row[2], Families.gamma(row[0] / 2, 2).upperQuantile(row[1]), 5e-6, "χ² ν " + row[0] + " Q " + row[1]);
        }
        // Φ^-1(0.975) = 1.959963985 (A&S Table 26.1; from memory)
        assertEquals(1.959963985, NormalMarginal.of(0, 1).quantile(0.975), 1e-9);
    }

    // ---- truncated families: moments by integrating the density ----------------------------

    /** ∫_a^b h by 20-point Gauss–Legendre (commons-math3 nodes) on equal panels. */
    private static double integrate(DoubleUnaryOperator h, double a, double b, int panels) {
        GaussIntegratorFactory factory = new GaussIntegratorFactory();
        double width = (b - a) / panels;
        double sum = 0;
        for (int p = 0; p < panels; p++) {
            GaussIntegrator rule = factory.legendre(20, a + p * width, p == panels - 1 ? b : a + (p + 1) * width);
            sum += rule.integrate(h::applyAsDouble);
        }
        return sum;
    }

    /**
     * {mean, sd} of the density f on [a, b] (renormalised), by {@link #integrate} after the substitution
     * x = a + t², which turns a density singular like (x − a)^(α−1) at a (a beta or gamma with shape ½)
     * into a smooth integrand 2t·f(a + t²).
     */
    private static double[] truncatedMoments(DoubleUnaryOperator f, double a, double b, double kink) {
        double[] m = new double[3];
        for (int k = 0; k < 3; k++) {
            int power = k;
            double shift = k == 2 ? m[1] / m[0] : 0.0;
            DoubleUnaryOperator h = x -> Math.pow(x - shift, power) * f.applyAsDouble(x);
            m[k] = kink > a && kink < b ? substituted(h, a, kink) + substituted(h, kink, b) : substituted(h, a, b);
        }
        return new double[] {m[1] / m[0], Math.sqrt(m[2] / m[0])};
    }

    /** ∫_a^b h(x) dx as ∫_0^√(b−a) 2t·h(a + t²) dt, 4000 panels. */
    private static double substituted(DoubleUnaryOperator h, double a, double b) {
        return integrate(t -> 2 * t * h.applyAsDouble(a + t * t), 0, Math.sqrt(b - a), 4000);
    }

    @Test
    void truncatedMomentsMatchNumericalIntegrationOfTheDensity() {
        double inf = Double.POSITIVE_INFINITY;
        // {family, min, max, the integration's upper end for max = ∞ (where the neglected tail is below 1e-20)}
        Object[][] cases = {
            {"gamma(2, 3) on [1, 20]", Families.gamma(2, 3), new GammaDistribution(2, 3), 1.0, 20.0, 20.0},
            {"gamma(0.5, 2) on [0.01, ∞)", Families.gamma(0.5, 2), new GammaDistribution(0.5, 2), 0.01, inf, 120.0},
            {"exponential(1) on [5, ∞)", Families.exponential(1), new ExponentialDistribution(1), 5.0, inf, 60.0},
            {"exponential(1) on [40, ∞)", Families.exponential(1), new ExponentialDistribution(1), 40.0, inf, 95.0},
            {"lognormal(0, 1) on [1, ∞)", Families.lognormal(0, 1), new LogNormalDistribution(0, 1), 1.0, inf, Math.exp(10)},
            {"lognormal(0, 1) on (0, 5]", Families.lognormal(0, 1), new LogNormalDistribution(0, 1), 0.0, 5.0, 5.0},
            {"weibull(1.5, 3) on [2, ∞)", Families.weibull(1.5, 3), new WeibullDistribution(1.5, 3), 2.0, inf, 60.0},
            {"beta(2, 5) on [0.3, 0.9]", Families.beta(2, 5), new BetaDistribution(2, 5), 0.3, 0.9, 0.9},
            {"beta(0.5, 3) on [0, 0.2]", Families.beta(0.5, 3), new BetaDistribution(0.5, 3), 0.0, 0.2, 0.2},
            {"triangular(1, 2, 5) on [1.5, 4]", Families.triangular(1, 2, 5), new TriangularDistribution(1, 2, 5), 1.5, 4.0, 4.0},
        };
        for (Object[] c : cases) {
            String name = (String) c[0];
            RealDistribution ref = (RealDistribution) c[2];
            double min = (double) c[3];
            double max = (double) c[4];
            Marginal t = Families.truncate((Marginal) c[1], min, max);
            // the triangular density has a kink at its mode: integrate up to it and from it
            double kink = ref instanceof TriangularDistribution tri ? tri.getMode() : Double.NaN;
            double[] ref2 = truncatedMoments(ref::density, min, (double) c[5], kink);
            // TruncatedContinuous takes its moments by QuantileMoments, a fixed graded Gauss–Legendre rule
            // on the quantile function; where that function's second derivative jumps (the triangular
            // mode) the rule is good to ~1e-7 only (observed 3.5e-8 relative; the exact mean here is
            // 320/123 = 2.6016260163), elsewhere to 1e-9
            double tol = ref instanceof TriangularDistribution ? 1e-7 : 1e-9;
            assertEquals(ref2[0], t.mean(), tol * Math.max(1, Math.abs(ref2[0])), name + " mean");
            assertEquals(ref2[1], t.sd(), 10 * tol * ref2[1], name + " sd");
            // samples stay inside: the quantile at the extreme uniforms and latents
            for (double p : new double[] {Double.MIN_VALUE, 1e-300, 1e-16, 0.5, 1 - 1e-16, 1 - 0x1.0p-53}) {
                double x = t.quantile(p);
                assertTrue(x >= min && x <= max && Double.isFinite(x), name + " quantile(" + p + ") = " + x);
            }
            for (double z = -38; z <= 38; z += 0.25) {
                double x = t.fromLatent(z);
                assertTrue(x >= min && x <= max && Double.isFinite(x), name + " fromLatent(" + z + ") = " + x);
            }
        }
        // the memoryless exponential: on [m, ∞) it is m + Exp(rate) (closed form), even where F(m)
        // rounds to 1 (m = 50: 1 − F = 2e-22)
        Marginal far = Families.truncate(Families.exponential(2), 50, inf);
        assertEquals(50.5, far.mean(), 1e-12);
        assertEquals(0.5, far.sd(), 1e-12);
        assertEquals(50 - Math.log(0.3) / 2, far.upperQuantile(0.3), 1e-12);
        assertEquals(50 - Math.log1p(-0.3) / 2, far.quantile(0.3), 1e-12);
    }

    @Test
    void quantilesFamilyIsPiecewiseLinear() {
        // points {0: 1, 0.5: 4, 0.9: 10, 1: 50}: uniform on each piece with density Δp/Δv; mean and sd by
        // integrating x·f(x) on each piece (commons-math3 Gauss–Legendre), quantile by linear interpolation
        double[] p = {0, 0.5, 0.9, 1};
        double[] v = {1, 4, 10, 50};
        Marginal m = Families.quantiles(p, v);
        double mean = 0;
        double second = 0;
        for (int i = 0; i + 1 < p.length; i++) {
            double f = (p[i + 1] - p[i]) / (v[i + 1] - v[i]);
            mean += integrate(x -> x * f, v[i], v[i + 1], 1);
            second += integrate(x -> x * x * f, v[i], v[i + 1], 1);
        }
        assertEquals(mean, m.mean(), 1e-12);
        assertEquals(Math.sqrt(second - mean * mean), m.sd(), 1e-12);
        assertEquals(2.5, m.quantile(0.25), 1e-15);
        assertEquals(7.0, m.quantile(0.7), 1e-14);
        assertEquals(30.0, m.quantile(0.95), 1e-13);
        assertEquals(0.7, m.cdf(7.0), 1e-15);
        Marginal t = Families.truncate(m, 2, 30);
        // truncated to [2, 30]: F(2) = 1/6, F(30) = 0.95; the moments by the same piecewise integral
        double lo = 1.0 / 6;
        double mass = 0.95 - lo;
        double tm = (integrate(x -> x * 0.5 / 3, 2, 4, 1) + integrate(x -> x * 0.4 / 6, 4, 10, 1) + integrate(x -> x * 0.1 / 40, 10, 30, 1)) / mass;
        double t2 = (integrate(x -> x * x * 0.5 / 3, 2, 4, 1) + integrate(x -> x * x * 0.4 / 6, 4, 10, 1) + integrate(x -> x * x * 0.1 / 40, 10, 30, 1)) / mass;
        assertEquals(tm, t.mean(), 1e-12 * tm);
        assertEquals(Math.sqrt(t2 - tm * tm), t.sd(), 1e-12 * Math.sqrt(t2 - tm * tm));
        assertEquals(2.0, t.quantile(0), 0.0);
        assertEquals(4.0, t.quantile((0.5 - lo) / mass), 1e-13);
        assertEquals(30.0, t.quantile(1 - 0x1.0p-53), 1e-12);
    }

    // ---- discrete families -------------------------------------------------------------------

    private record Discrete(String name, DiscreteTable m, IntegerDistribution ref) {
    }

    private static List<Discrete> discrete() {
        List<Discrete> d = new ArrayList<>();
        for (double mean : new double[] {0.05, 3.5, 40, 2500}) {
            d.add(new Discrete("poisson(" + mean + ")", Families.poisson(mean), new PoissonDistribution(null, mean, 1e-15, 10_000_000)));
        }
        d.add(new Discrete("binomial(20, 0.3)", Families.binomial(20, 0.3), new BinomialDistribution(20, 0.3)));
        d.add(new Discrete("binomial(1000, 0.002)", Families.binomial(1000, 0.002), new BinomialDistribution(1000, 0.002)));
        d.add(new Discrete("binomial(7, 0.9)", Families.binomial(7, 0.9), new BinomialDistribution(7, 0.9)));
        d.add(new Discrete("negbinomial(3, 0.4)", Families.negativeBinomial(3, 0.4), new PascalDistribution(3, 0.4)));
        d.add(new Discrete("negbinomial(1, 0.05)", Families.negativeBinomial(1, 0.05), new PascalDistribution(1, 0.05)));
        d.add(new Discrete("bernoulli(0.2)", Families.bernoulli(0.2), new BinomialDistribution(1, 0.2)));
        return d;
    }

    @Test
    void discretePmfCdfQuantileAndMomentsMatchCommonsMath() {
        for (Discrete c : discrete()) {
            DiscreteTable m = c.m;
            for (long k = m.lowest(); k <= m.highest(); k++) {
                double p = c.ref.probability((int) k);
                // tables are renormalised after dropping tails below 1e-20 of the mode; each probability
                // is exp of a sum of terms as large as k·ln λ ≈ 2e4 (Poisson 2500), each good to ~1e-16
                // relative, so 1e-11 relative
                assertEquals(p, m.probability(k), 1e-11 * p + 1e-300, c.name + " P(" + k + ")");
                double f = c.ref.cumulativeProbability((int) k);
                // F sums the table: up to ~2500 terms each good to 1e-11 relative
                assertEquals(f, m.cdf(k), 1e-11, c.name + " F(" + k + ")");
                assertEquals(f - p / 2, m.grade(k), 1e-11, c.name + " grade(" + k + ")");
            }
            // quantile: the smallest k with F(k) ≥ p, at p between the jumps (commons-math3 searches exactly)
            for (double p = 0.0005; p < 1; p += 0.001) {
                assertEquals(c.ref.inverseCumulativeProbability(p), m.quantile(p), 0.0, c.name + " Q(" + p + ")");
            }
            double sd = Math.sqrt(c.ref.getNumericalVariance());
            assertEquals(c.ref.getNumericalMean(), m.mean(), 1e-11 * Math.max(1, c.ref.getNumericalMean()), c.name + " mean");
            assertEquals(sd, m.sd(), 1e-10 * sd, c.name + " sd");
        }
        // negative binomial from its moments: p = mean/sd², size = mean²/(sd² − mean); mean 4, sd 3 gives
        // p = 4/9, size = 16/5 (closed form); Pascal needs a whole size, so compare to the pmf formula
        DiscreteTable nb = Families.negativeBinomialFromMoments(4, 3);
        assertEquals(4.0, nb.mean(), 1e-12);
        assertEquals(3.0, nb.sd(), 1e-12);
        double size = 3.2;
        double p = 4.0 / 9;
        for (int k = 0; k < 30; k++) {
            double pk = Math.exp(Gamma.logGamma(k + size) - Gamma.logGamma(size) - Gamma.logGamma(k + 1.0)
                    + size * Math.log(p) + k * Math.log1p(-p));
            assertEquals(pk, nb.probability(k), 1e-13 * pk);
        }
    }

    @Test
    void truncatedDiscreteIsTheConditionalDistribution() {
        PoissonDistribution ref = new PoissonDistribution(null, 3.5, 1e-15, 10_000_000);
        DiscreteTable t = Families.poisson(3.5).truncated(2, 9);
        double mass = ref.cumulativeProbability(9) - ref.cumulativeProbability(1);
        double mean = 0;
        for (int k = 2; k <= 9; k++) {
            assertEquals(ref.probability(k) / mass, t.probability(k), 1e-13, "P(" + k + ")");
            mean += k * ref.probability(k) / mass;
        }
        double var = 0;
        for (int k = 2; k <= 9; k++) {
            var += (k - mean) * (k - mean) * ref.probability(k) / mass;
        }
        assertEquals(mean, t.mean(), 1e-12);
        assertEquals(Math.sqrt(var), t.sd(), 1e-12);
        assertEquals(2, t.lowest());
        assertEquals(9, t.highest());
        assertEquals(0.0, t.probability(1), 0.0);
        assertEquals(2.0, t.quantile(1e-300), 0.0);
        assertEquals(9.0, t.quantile(1 - 0x1.0p-53), 0.0);
        assertThrows(IllegalArgumentException.class, () -> Families.poisson(3.5).truncated(2.2, 2.8));
    }

    @Test
    void categoricalAndCalendarFamilies() {
        Marginal cat = Families.categorical(new String[] {"rye", "spelt", "oat"}, new double[] {1, 2, 5});
        double[] expected = {1 / 8.0, 2 / 8.0, 5 / 8.0};
        double c = 0;
        for (int k = 0; k < 3; k++) {
            c += expected[k];
            assertEquals(c, cat.cdf(k), 1e-15);
        }
        assertEquals("spelt", cat.label(1));
        assertEquals(0.0, cat.quantile(0.1), 0.0);
        assertEquals(1.0, cat.quantile(0.2), 0.0);
        assertEquals(2.0, cat.quantile(0.9), 0.0);
        assertEquals("true", Families.bernoulli(0.5).label(1));
        // date and timestamp: uniform over whole days / seconds, against commons-math3's discrete uniform
        long from = java.time.LocalDate.parse("2026-03-01").toEpochDay();
        long to = java.time.LocalDate.parse("2026-11-30").toEpochDay();
        Marginal dates = Families.dates(from, to);
        UniformIntegerDistribution ref = new UniformIntegerDistribution((int) from, (int) to);
        assertEquals(ref.getNumericalMean(), dates.mean(), 1e-9);
        assertEquals(Math.sqrt(ref.getNumericalVariance()), dates.sd(), 1e-9);
        for (double p = 0.0005; p < 1; p += 0.001) {
            assertEquals(ref.inverseCumulativeProbability(p), dates.quantile(p), 0.0, "date Q(" + p + ")");
        }
        for (long d = from; d <= to; d += 7) {
            assertEquals(ref.cumulativeProbability((int) d), dates.cdf(d), 1e-15);
        }
        Marginal seconds = Families.timestamps(0, 86_399);
        assertEquals(0.0, seconds.quantile(1e-300), 0.0);
        assertEquals(86_399.0, seconds.quantile(1 - 0x1.0p-53), 0.0);
        assertEquals(86_399 / 2.0, seconds.mean(), 1e-9);
        // (N² − 1)/12 with N = 86400 (discrete uniform variance; closed form)
        assertEquals(Math.sqrt((86_400.0 * 86_400.0 - 1) / 12), seconds.sd(), 1e-9);
    }
}
