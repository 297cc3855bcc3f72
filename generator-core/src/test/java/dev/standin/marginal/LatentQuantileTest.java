package dev.standin.marginal;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.apache.commons.math3.distribution.BetaDistribution;
import org.apache.commons.math3.distribution.GammaDistribution;
import org.apache.commons.math3.special.Erf;
import org.junit.jupiter.api.Test;

/**
 * {@link LatentQuantile} against the exact maps it replaces in the sampler: the Chebyshev tables
 * agree with the exact F<sup>-1</sup>(Φ(z)) (Brent's method on commons-math3's regularised incomplete
 * gamma and beta functions) to 1e-12 relative across each family's parameter range, the step
 * functions of discrete families equal the exact map bit for bit, and, independently of Standin's own
 * inversion, commons-math3's {@link GammaDistribution} and {@link BetaDistribution} CDFs at the fast
 * quantile give back Φ(z) (commons-math3 {@link Erf}).
 */
class LatentQuantileTest {

    /** The brief's bound: fast and exact maps agree to this relative difference. */
    private static final double RELATIVE = 1e-12;

    private static List<Marginal> continuous() {
        List<Marginal> m = new ArrayList<>();
        for (double shape : new double[] {0.02, 0.1, 0.5, 1, 2, 7.5, 47.45679012345679, 300, 1e4}) {
            m.add(Families.gamma(shape, 3.0));
        }
        m.add(Families.gammaFromMoments(310, 45));
        double[] ab = {0.05, 0.3, 1, 2.5, 9, 50, 400};
        for (double a : ab) {
            for (double b : ab) {
                m.add(Families.beta(a, b));
            }
        }
        m.add(Families.betaFromMoments(0.62, 0.12));
        for (double shape : new double[] {0.2, 0.7, 1.8, 5, 20}) {
            m.add(Families.weibull(shape, 420));
        }
        m.add(Families.exponential(0.025));
        m.add(Families.triangular(0, 2, 10));
        m.add(Families.truncate(Families.gamma(2, 1), 1, 5));
        m.add(Families.truncate(Families.exponential(1), 50, Double.POSITIVE_INFINITY));
        return m;
    }

    /** Seeded latents: standard normal draws, a uniform sweep past the table's ends, and the cells' edges. */
    private static double[] latents(long seed, int n) {
        SplittableRandom rnd = new SplittableRandom(seed);
        double[] z = new double[n + 2 * 36 * 3];
        int i = 0;
        for (; i < n; i++) {
            z[i] = i % 2 == 0 ? rnd.nextGaussian() * 1.5 : rnd.nextDouble(-9.5, 9.5);
        }
        for (int c = 0; c <= 35 && i + 6 <= z.length; c++) {
            double edge = -LatentQuantile.Z_MAX + c * LatentQuantile.CELL;
            for (double e : new double[] {edge, -edge}) {
                z[i++] = e;
                z[i++] = Math.nextUp(e);
                z[i++] = Math.nextDown(e);
            }
        }
        return java.util.Arrays.copyOf(z, i);
    }

    private static double relative(double fast, double exact) {
        return fast == exact ? 0.0 : Math.abs(fast - exact) / Math.abs(exact);
    }

    @Test
    void chebyshevTablesAgreeWithTheExactMapsAcrossParameterRanges() {
        int tabulated = 0;
        for (Marginal m : continuous()) {
            LatentQuantile fast = LatentQuantile.of(m);
            if (fast.form().equals("chebyshev")) {
                tabulated++;
            }
            double worst = 0;
            double at = 0;
            for (double z : latents(m.hashCode() ^ 4242L, 2500)) {
                double r = relative(fast.fromLatent(z), m.fromLatent(z));
                if (!(r <= worst)) {
                    worst = r;
                    at = z;
                }
            }
            double w = worst;
            double a = at;
            assertTrue(w <= RELATIVE, () -> m.family() + " mean " + m.mean() + " sd " + m.sd() + ": relative difference "
                    + w + " at z = " + a);
            // and the quantile function of an uncorrelated column, through Φ⁻¹ first
            SplittableRandom rnd = new SplittableRandom(17);
            for (int i = 0; i < 500; i++) {
                double p = i % 10 == 0 ? Math.pow(10, -rnd.nextDouble(1, 15)) : rnd.nextDouble();
                for (double q : new double[] {p, 1 - p}) {
                    double r = relative(fast.quantile(q), m.quantile(q));
                    assertTrue(r <= RELATIVE, () -> m.family() + " quantile(" + q + "): relative difference " + r);
                }
            }
        }
        assertTrue(tabulated >= 60, "most continuous marginals get a table: " + tabulated);
    }

    @Test
    void commonsMathDistributionsGiveBackPhiAtTheFastQuantiles() {
        // F(x̂) = Φ(z) up to F's own slope times x̂'s error: 1e-12 relative in x (and in 1 − x for the
        // beta) moves the tail probability by x f(x)/min(F, 1 − F) · 1e-12, below 1e-10 relative for
        // |z| ≤ 5 with these shapes
        Object[][] cases = {
            {Families.gammaFromMoments(310, 45), new GammaDistribution(null, (310.0 / 45) * (310.0 / 45), 45.0 * 45 / 310)},
            {Families.gamma(0.5, 2), new GammaDistribution(null, 0.5, 2)},
            {Families.betaFromMoments(0.62, 0.12), null},
            {Families.beta(2.5, 9), new BetaDistribution(null, 2.5, 9)},
            // (not a U-shaped beta: its tails crowd 0 and 1 so closely that one ulp of x moves the tail
            // probability by 1e-9; LatentQuantile's own test above covers those against the exact map)
            {Families.beta(0.8, 3), new BetaDistribution(null, 0.8, 3)},
        };
        double common = 0.62 * 0.38 / (0.12 * 0.12) - 1;
        cases[2][1] = new BetaDistribution(null, 0.62 * common, 0.38 * common);
        SplittableRandom rnd = new SplittableRandom(1990);
        for (Object[] c : cases) {
            Marginal m = (Marginal) c[0];
            LatentQuantile fast = LatentQuantile.of(m);
            org.apache.commons.math3.distribution.RealDistribution d =
                    (org.apache.commons.math3.distribution.RealDistribution) c[1];
            for (int i = 0; i < 2000; i++) {
                double z = rnd.nextDouble(-5, 5);
                double expected = 0.5 * Erf.erfc(Math.abs(z) / Math.sqrt(2));
                double fastError = Math.abs(tail(d, fast.fromLatent(z), z) - expected) / expected;
                // the table inherits the exact map's own error, so it may be off by that much too
                double exactError = Math.abs(tail(d, m.fromLatent(z), z) - expected) / expected;
                assertTrue(fastError <= 1e-10 + 2 * exactError, m.family() + " at z = " + z + ": " + fastError
                        + " (exact map: " + exactError + ")");
            }
        }
    }

    /** The tail probability on z's side: F(x) below the median, 1 − F(x) above (commons-math3). */
    private static double tail(org.apache.commons.math3.distribution.RealDistribution d, double x, double z) {
        double f = d.cumulativeProbability(x);
        return z < 0 ? f : 1 - f;
    }

    @Test
    void stepFunctionsEqualTheExactMapBitForBit() {
        List<Marginal> discrete = List.of(Families.poisson(3.2), Families.poisson(250), Families.poisson(0.01),
                Families.binomial(20, 0.3), Families.negativeBinomialFromMoments(12, 5), Families.bernoulli(0.07),
                Families.categorical(new String[] {"upper", "lower", "cabin", "car"}, new double[] {4, 3, 2, 1})
        );
        SplittableRandom rnd = new SplittableRandom(2011);
        for (Marginal m : discrete) {
            LatentQuantile fast = LatentQuantile.of(m);
            assertEquals("steps", fast.form(), m.family());
            int n = m == discrete.get(0) ? 2_000_000 : 200_000;
            for (int i = 0; i < n; i++) {
                double z = i % 3 == 0 ? rnd.nextDouble(-9, 9) : rnd.nextGaussian();
                if (Double.doubleToRawLongBits(fast.fromLatent(z)) != Double.doubleToRawLongBits(m.fromLatent(z))) {
                    assertEquals(m.fromLatent(z), fast.fromLatent(z), m.family() + " at z = " + z);
                }
            }
            // at and next to every threshold: the exact map's own step points, found by scanning
            // Φ⁻¹(F(k)) (where the exact map steps, to within a few ulps)
            DiscreteTable t = (DiscreteTable) m;
            for (long k = t.lowest(); k < t.highest(); k++) {
                double c = t.cdf(k);
                if (!(c > 0 && c < 1)) {
                    continue;
                }
                double z0 = StandardNormal.quantile(c);
                double z = z0;
                for (int u = 0; u < 64; u++) {
                    z = Math.nextDown(z);
                }
                for (int u = 0; u < 128; u++, z = Math.nextUp(z)) {
                    assertEquals(m.fromLatent(z), fast.fromLatent(z), m.family() + " next to step " + k + ", z = " + z);
                }
            }
        }
    }

    @Test
    void cheapFamiliesStayExactOrLinear() {
        assertEquals("linear", LatentQuantile.of(NormalMarginal.of(12.5, 4)).form());
        // the lognormal is tabulated too (one exp per value is dearer than a table): within 1e-12
        for (Marginal ln : List.of(Families.lognormalFromMoments(48, 15), Families.lognormal(0, 2.5))) {
            LatentQuantile fast = LatentQuantile.of(ln);
            for (double z = -9; z <= 9; z += 0.001) {
                double zz = z;
                assertTrue(relative(fast.fromLatent(z), ln.fromLatent(z)) <= RELATIVE, () -> "lognormal at " + zz);
            }
        }
        NormalMarginal n = NormalMarginal.of(12.5, 4);
        for (double z = -9; z <= 9; z += 0.01) {
            assertEquals(n.mean() + n.sd() * z, LatentQuantile.of(n).fromLatent(z));
        }
    }
}
