package dev.standin.correlation;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.standin.marginal.Families;
import dev.standin.marginal.Marginal;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;
import org.apache.commons.math3.distribution.BinomialDistribution;
import org.apache.commons.math3.distribution.IntegerDistribution;
import org.apache.commons.math3.distribution.PoissonDistribution;
import org.junit.jupiter.api.Test;

/**
 * Pearson, Spearman and Kendall correlations of pairs with a discrete column under the Gaussian
 * copula, against exact values the test computes itself: the joint distribution comes from the
 * latent thresholds Φ<sup>-1</sup>(F(x)) of commons-math3's discrete distributions and bivariate normal
 * probabilities from {@link IndependentNormal2} (Owen's T and a conditional integral, not the
 * project's {@link BivariateNormal}); Kendall's τ<sub>b</sub> by brute-force enumeration of all pairs of
 * cells rather than the project's cumulative sums.
 */
class DiscreteTargetsExactTest {

    private final NortaPearson norta = new NortaPearson();
    private final RankTargets ranks = new RankTargets(norta);

    /** A discrete marginal's support (values with probability above 1e-18) and probabilities. */
    private record Pmf(double[] x, double[] p) {
        static Pmf of(IntegerDistribution d) {
            int lo = d.getSupportLowerBound();
            int hi = lo;
            while (hi < d.getSupportUpperBound() && (d.cumulativeProbability(hi) < 0.5 || d.probability(hi + 1) > 1e-18)) {
                hi++;
            }
            double[] x = new double[hi - lo + 1];
            double[] p = new double[x.length];
            double total = 0;
            for (int k = lo; k <= hi; k++) {
                x[k - lo] = k;
                p[k - lo] = d.probability(k);
                total += p[k - lo];
            }
            for (int i = 0; i < p.length; i++) {
                p[i] /= total;
            }
            return new Pmf(x, p);
        }

        /** Latent thresholds: cell i is (t[i], t[i+1]], t[i+1] = Φ^-1(F(x_i)). */
        double[] thresholds() {
            double[] t = new double[p.length + 1];
            t[0] = Double.NEGATIVE_INFINITY;
            double c = 0;
            for (int i = 0; i < p.length - 1; i++) {
                c += p[i];
                t[i + 1] = IndependentNormal2.inverse(c);
            }
            t[p.length] = Double.POSITIVE_INFINITY;
            return t;
        }

        /** Mid-distribution grades G(x_i) = F(x_{i−1}) + p_i/2 (Kruskal 1958). */
        double[] grades() {
            double[] g = new double[p.length];
            double c = 0;
            for (int i = 0; i < p.length; i++) {
                g[i] = c + p[i] / 2;
                c += p[i];
            }
            return g;
        }

        double sumSquares() {
            double s = 0;
            for (double v : p) {
                s += v * v;
            }
            return s;
        }
    }

    /** Cell probabilities P(X = x_i, Y = y_j) under latent r, by inclusion–exclusion on Φ2. */
    private static double[][] joint(Pmf a, Pmf b, double r) {
        double[] ta = a.thresholds();
        double[] tb = b.thresholds();
        double[][] h = new double[ta.length][tb.length];
        for (int i = 0; i < ta.length; i++) {
            for (int j = 0; j < tb.length; j++) {
                h[i][j] = IndependentNormal2.cdf(ta[i], tb[j], r);
            }
        }
        double[][] p = new double[a.p.length][b.p.length];
        for (int i = 0; i < a.p.length; i++) {
            for (int j = 0; j < b.p.length; j++) {
                p[i][j] = h[i + 1][j + 1] - h[i][j + 1] - h[i + 1][j] + h[i][j];
            }
        }
        return p;
    }

    private static double correlation(double[][] p, double[] x, double[] y) {
        double mx = 0;
        double my = 0;
        for (int i = 0; i < x.length; i++) {
            for (int j = 0; j < y.length; j++) {
                mx += p[i][j] * x[i];
                my += p[i][j] * y[j];
            }
        }
        double sxy = 0;
        double sxx = 0;
        double syy = 0;
        for (int i = 0; i < x.length; i++) {
            for (int j = 0; j < y.length; j++) {
                sxy += p[i][j] * (x[i] - mx) * (y[j] - my);
                sxx += p[i][j] * (x[i] - mx) * (x[i] - mx);
                syy += p[i][j] * (y[j] - my) * (y[j] - my);
            }
        }
        return sxy / Math.sqrt(sxx * syy);
    }

    /** τ_b = (Pc − Pd)/√((1 − Σp_i·²)(1 − Σp_·j²)), Pc and Pd summed over every ordered pair of cells. */
    private static double kendall(double[][] p, Pmf a, Pmf b) {
        double pc = 0;
        double pd = 0;
        int n = a.p.length;
        int m = b.p.length;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < m; j++) {
                for (int k = 0; k < n; k++) {
                    for (int l = 0; l < m; l++) {
                        int s = Integer.signum(i - k) * Integer.signum(j - l);
                        if (s > 0) {
                            pc += p[i][j] * p[k][l];
                        } else if (s < 0) {
                            pd += p[i][j] * p[k][l];
                        }
                    }
                }
            }
        }
        return (pc - pd) / Math.sqrt((1 - a.sumSquares()) * (1 - b.sumSquares()));
    }

    @Test
    void twoBernoullisHaveTheTetrachoricClosedForm() throws Exception {
        // X = 1{Z1 > Φ^-1(1 − p)}, Y = 1{Z2 > Φ^-1(1 − q)}: P(X = 1, Y = 1) = P(Z1 > −a, Z2 > −b) =
        // Φ2(a, b; r) with a = Φ^-1(p), b = Φ^-1(q) (by the symmetry (Z1, Z2) → (−Z1, −Z2)), so
        // Corr(X, Y) = (Φ2(a, b; r) − pq)/√(p(1 − p)q(1 − q)) (derived here; K. Pearson's tetrachoric
        // correlation, 1900). For a 2×2 table τ_b = (p11 p00 − p10 p01)/√(p(1 − p)q(1 − q)) = the same φ
        // coefficient (Agresti 2010, §7.1, with 1 − Σp² = 2p(1 − p)), and mid-ranks of a binary column are
        // affine in it, so Spearman's ρ is the same number too.
        double p = 0.3;
        double q = 0.6;
        Marginal x = Families.bernoulli(p);
        Marginal y = Families.bernoulli(q);
        double a = IndependentNormal2.inverse(p);
        double b = IndependentNormal2.inverse(q);
        for (double r : new double[] {-0.9, -0.5, 0.2, 0.6, 0.95}) {
            double phi = (IndependentNormal2.owen(a, b, r) - p * q) / Math.sqrt(p * (1 - p) * q * (1 - q));
            assertEquals(phi, norta.correlation(x, y, r), 1e-10, "pearson r " + r);
            assertEquals(phi, ranks.spearman(x, y, r), 1e-10, "spearman r " + r);
            assertEquals(phi, ranks.kendall(x, y, r), 1e-10, "kendall r " + r);
        }
        // the ends: r = ±1 give the Fréchet bounds of the 2×2 table, P(1, 1) = min(p, q) and
        // max(0, p + q − 1) (closed form)
        double sd = Math.sqrt(p * (1 - p) * q * (1 - q));
        assertEquals((Math.min(p, q) - p * q) / sd, norta.correlation(x, y, 1), 1e-12);
        assertEquals((Math.max(0, p + q - 1) - p * q) / sd, norta.correlation(x, y, -1), 1e-12);
        // and back: the latent for the φ of r = 0.45 is 0.45
        double target = (IndependentNormal2.owen(a, b, 0.45) - p * q) / sd;
        assertEquals(0.45, norta.latentFor(x, y, target), 1e-8);
        assertEquals(0.45, ranks.spearmanLatent(x, y, target), 1e-8);
        assertEquals(0.45, ranks.kendallLatent(x, y, target), 1e-8);
    }

    @Test
    void countPairMatchesTheExactJointTable() throws Exception {
        Pmf pa = Pmf.of(new PoissonDistribution(null, 2.2, 1e-15, 10_000_000));
        Pmf pb = Pmf.of(new BinomialDistribution(null, 6, 0.35));
        Marginal a = Families.poisson(2.2);
        Marginal b = Families.binomial(6, 0.35);
        for (double r : new double[] {-0.6, 0.3, 0.8, 1.0}) {
            double[][] p = r == 1.0 ? comonotone(pa, pb) : joint(pa, pb, r);
            double pearson = correlation(p, pa.x, pb.x);
            double spearman = correlation(p, pa.grades(), pb.grades());
            double kendall = kendall(p, pa, pb);
            assertEquals(pearson, norta.correlation(a, b, r), 1e-9, "pearson r " + r);
            assertEquals(spearman, ranks.spearman(a, b, r), 1e-9, "spearman r " + r);
            assertEquals(kendall, ranks.kendall(a, b, r), 1e-9, "kendall r " + r);
        }
        double[][] p = joint(pa, pb, 0.45);
        assertEquals(0.45, norta.latentFor(a, b, correlation(p, pa.x, pb.x)), 1e-7);
        assertEquals(0.45, ranks.spearmanLatent(a, b, correlation(p, pa.grades(), pb.grades())), 1e-7);
        assertEquals(0.45, ranks.kendallLatent(a, b, kendall(p, pa, pb)), 1e-7);
    }

    /** r = 1: both columns are functions of one uniform; P(x_i, y_j) is the overlap of their F-intervals. */
    private static double[][] comonotone(Pmf a, Pmf b) {
        double[][] p = new double[a.p.length][b.p.length];
        double ca = 0;
        for (int i = 0; i < a.p.length; i++) {
            double cb = 0;
            for (int j = 0; j < b.p.length; j++) {
                p[i][j] = Math.max(0, Math.min(ca + a.p[i], cb + b.p[j]) - Math.max(ca, cb));
                cb += b.p[j];
            }
            ca += a.p[i];
        }
        return p;
    }

    @Test
    void continuousDiscretePairMatchesOneDimensionalIntegrals() throws Exception {
        // X = Exp(1) = −ln Φ(−Z1) (its quantile at Φ(Z1)), Y discrete with cells (t_j, t_j+1], and
        // P(Y = y_j | Z1 = z) = Φ((t_j+1 − rz)/s) − Φ((t_j − rz)/s), s = √(1 − r²):
        // E[XY] = Σ_j y_j E[X P(Y = y_j | Z1)], Spearman's ρ = Corr(Φ(Z1), G(Y)) with G the mid-grades,
        // and Kendall's τ_b = E[sign(X − X')sign(Y − Y')]/√(1 − Σq_j²) (X has no ties), where, given
        // Z1 = x and Y = y_j, E[sign(x − Z1')sign(y_j − Y')] = 2B(x, t_j) + 2B(x, t_j+1) + 1 − 2Φ(x) − Φ(t_j)
        // − Φ(t_j+1) with B(x, t) = Φ2(x, t; r) by Owen's T (derived here from the four quadrant
        // probabilities). Each expectation over Z1 is a 1-D integral, 20-point Gauss–Legendre on 90 panels
        // of [−9, 9] (φ is below 1e-17 beyond).
        //
        // The project takes Kendall's τ_b for such pairs with the continuous column in B = 400 equal-
        // probability bins (RankTargets javadoc). Binning ties the pairs that share a bin (probability
        // 1/B), each contributing at most 1 to |E sign·sign|, and changes the denominator by the factor
        // √(1 − 1/B): |τ_binned − τ| ≤ 1/B + |τ|/(2B) + O(B^-2) ≤ 1.5/B (derived here). That is the
        // tolerance for Kendall (observed: 6e-4 at r = −0.7 with the Poisson partner).
        Marginal x = Families.exponential(1);
        Object[][] partners = {
            {Families.poisson(1.5), Pmf.of(new PoissonDistribution(null, 1.5, 1e-15, 10_000_000))},
            {Families.bernoulli(0.25), Pmf.of(new BinomialDistribution(null, 1, 0.25))},
        };
        GaussIntegrator rule = new GaussIntegratorFactory().legendre(20, 0.0, 1.0);
        int panels = 90;
        double width = 18.0 / panels;
        for (Object[] partner : partners) {
            Marginal y = (Marginal) partner[0];
            Pmf py = (Pmf) partner[1];
            double[] t = py.thresholds();
            double[] gy = py.grades();
            double my = 0;
            double vy = 0;
            double mg = 0;
            double vg = 0;
            for (int j = 0; j < py.p.length; j++) {
                my += py.p[j] * py.x[j];
                mg += py.p[j] * gy[j];
            }
            for (int j = 0; j < py.p.length; j++) {
                vy += py.p[j] * (py.x[j] - my) * (py.x[j] - my);
                vg += py.p[j] * (gy[j] - mg) * (gy[j] - mg);
            }
            for (double r : new double[] {-0.7, 0.35, 0.9}) {
                double s = Math.sqrt(1 - r * r);
                double exy = 0;
                double eug = 0;
                double tau = 0;
                for (int k = 0; k < panels; k++) {
                    for (int n = 0; n < rule.getNumberOfPoints(); n++) {
                        double z = -9 + width * (k + rule.getPoint(n));
                        double w = width * rule.getWeight(n) * IndependentNormal2.density(z);
                        double gz = -Math.log(IndependentNormal2.phi(-z));
                        double uz = IndependentNormal2.phi(z);
                        double[] bz = new double[t.length];
                        double[] cond = new double[t.length];
                        for (int j = 0; j < t.length; j++) {
                            bz[j] = b(z, t[j], r);
                            cond[j] = IndependentNormal2.phi((t[j] - r * z) / s);
                        }
                        for (int j = 0; j < py.p.length; j++) {
                            double c = cond[j + 1] - cond[j];
                            exy += w * gz * py.x[j] * c;
                            eug += w * uz * gy[j] * c;
                            tau += w * c * (2 * bz[j] + 2 * bz[j + 1] + 1 - 2 * uz - IndependentNormal2.phi(t[j])
                                    - IndependentNormal2.phi(t[j + 1]));
                        }
                    }
                }
                double pearson = (exy - 1.0 * my) / (1.0 * Math.sqrt(vy)); // Exp(1): mean 1, sd 1
                double spearman = (eug - 0.5 * mg) / Math.sqrt(vg / 12);
                double kendall = tau / Math.sqrt(1 - py.sumSquares());
                String what = y.family() + " r " + r;
                assertEquals(pearson, norta.correlation(x, y, r), 1e-8, "pearson " + what);
                assertEquals(pearson, norta.correlation(y, x, r), 1e-8, "pearson, sides swapped, " + what);
                assertEquals(spearman, ranks.spearman(x, y, r), 1e-8, "spearman " + what);
                assertEquals(kendall, ranks.kendall(x, y, r), 1.5 / 400, "kendall " + what);
            }
        }
    }

    @Test
    void spearmanWithABalancedFlagHasAClosedFormThatNoContinuousMarginalChanges() throws Exception {
        // The mid-grade of a continuous X is F(X) = Φ(Z1), uniform whatever F is, so a Spearman target
        // between a continuous and a discrete column fixes the same latent r for every continuous
        // marginal. With Y = 1{Z2 > 0} (Bernoulli 1/2, mid-grades affine in Y): Cov(U, Y) =
        // P(W < Z1, Z2 > 0) − 1/4 for W ~ N(0, 1) independent, and ((Z1 − W)/√2, Z2) is standard
        // bivariate normal with correlation r/√2, so by Sheppard's orthant formula Cov = arcsin(r/√2)/(2π)
        // and ρ_S = Cov/(sd U · sd Y) = (2√3/π) arcsin(r/√2); at r = 1 that is √3/2, Corr(U, 1{U > 1/2})
        // (derived here).
        Marginal flag = Families.bernoulli(0.5);
        Marginal[] continuous = {
            dev.standin.marginal.NormalMarginal.of(3, 2),
            Families.gamma(0.5, 4),
            Families.beta(0.3, 2),
            Families.lognormal(0, 2),
            Families.weibull(0.6, 1),
        };
        for (double r : new double[] {-1.0, -0.6, 0.25, 0.8, 1.0}) {
            double closed = 2 * Math.sqrt(3) / Math.PI * Math.asin(r / Math.sqrt(2));
            double first = ranks.spearman(continuous[0], flag, r);
            assertEquals(closed, first, 1e-12, "spearman at r " + r);
            for (Marginal x : continuous) {
                // exactly the same number: nothing of F enters
                assertEquals(first, ranks.spearman(x, flag, r), 0.0, x.family() + " at r " + r);
                assertEquals(first, ranks.spearman(flag, x, r), 0.0, x.family() + ", sides swapped, at r " + r);
            }
        }
        double latent = ranks.spearmanLatent(continuous[0], flag, 0.5);
        assertEquals(Math.sqrt(2) * Math.sin(Math.PI * 0.5 / (2 * Math.sqrt(3))), latent, 1e-10,
                "the inverse of the closed form at ρ_S = 0.5");
        for (Marginal x : continuous) {
            assertEquals(latent, ranks.spearmanLatent(x, flag, 0.5), 0.0, x.family());
        }
    }

    /** Φ2(x, t; r) with the infinite thresholds of the outer cells. */
    private static double b(double x, double t, double r) {
        return IndependentNormal2.cdf(x, t, r);
    }
}
