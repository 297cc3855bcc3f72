package dev.standin.sampling;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.standin.engine.CompiledSpec;
import dev.standin.engine.Engine;
import dev.standin.marginal.NormalMarginal;
import dev.standin.random.RandomStreams;
import dev.standin.spec.ColumnSpec;
import dev.standin.spec.Overrides;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.function.DoubleUnaryOperator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.util.FastMath;
import org.junit.jupiter.api.Test;

/**
 * Seeded 10^5-row draws against sampling theory, with every bound set so that a correct sampler
 * fails it by chance with probability about 1e-6 per check (for a seed picked at random; the seeds
 * here are fixed, so the tests are deterministic).
 *
 * <p>Choice of z: for a statistic that is approximately normal (central limit theorem at n = 10^5),
 * P(|T − E T| > z·SE) = 2(1 − Φ(z)) = 1e-6 gives z = Φ^-1(1 − 5e-7) ≈ 4.8916, computed below with
 * commons-math3. A test method with m checks then fails by chance with probability ≤ m·1e-6 (union
 * bound); the largest here has about 50 checks, so ≤ 5e-5.
 */
class SamplingTheoryTest {

    private static final int N = 100_000;

    private final double z = new NormalDistribution(0.0, 1.0).inverseCumulativeProbability(1 - 0.5e-6);

    /** Standard normal Φ and Φ^-1 from commons-math3, independent of the project's own. */
    private final NormalDistribution std = new NormalDistribution(0.0, 1.0);

    private static final String BAKERY = "dataset: bakery-orders\n"
            + "rows: " + N + "\n"
            + "seed: 20260101\n"
            + "columns:\n"
            + "  order_no: {dist: sequence, start: 1000}\n"
            + "  dough_kg: {dist: normal, mean: 50, sd: 8}\n"
            + "  oven_temp: {dist: normal, mean: 220, sd: 5}\n"
            + "  flour_price: {dist: uniform, min: 0.8, max: 1.6}\n"
            + "  wait_min: {dist: uniform, min: 0, max: 30, nulls: 0.3}\n"
            + "  tip_eur: {dist: normal, mean: 3, sd: 1.2, nulls: 0.02}\n"
            + "  crust_mm: {dist: normal, mean: 4, sd: 1.5, min: 2, max: 7}\n"
            + "  proof_min: {dist: normal, mean: 12.5, sd: 4, min: 0}\n"
            + "  glaze_g: {dist: normal, mean: 0, sd: 1, min: 2, max: 5}\n"
            + "  chill_c: {dist: normal, mean: 0, sd: 1, min: -6, max: -3}\n"
            + "correlation:\n"
            + "  pairs:\n"
            + "    dough_kg ~ oven_temp: 0.6\n"
            + "    tip_eur ~ dough_kg: -0.3\n"
            + "    flour_price ~ dough_kg: 0.5\n"
            + "    flour_price ~ wait_min: 0.3\n";

    /** The drawn bakery data: values[column][row], NaN where missing. */
    private static double[][] drawBakery(CompiledSpec compiled) {
        RowSampler sampler = new RowSampler(compiled.spec(), compiled.model());
        RowSampler.Scratch scratch = sampler.scratch();
        int k = sampler.columnCount();
        double[][] data = new double[k][N];
        double[] values = new double[k];
        boolean[] missing = new boolean[k];
        for (int row = 0; row < N; row++) {
            sampler.draw(row, values, missing, scratch);
            for (int c = 0; c < k; c++) {
                data[c][row] = missing[c] ? Double.NaN : values[c];
            }
        }
        return data;
    }

    private static double[] present(double[] x) {
        return Arrays.stream(x).filter(v -> !Double.isNaN(v)).toArray();
    }

    private static double mean(double[] x) {
        double s = 0;
        for (double v : x) {
            s += v;
        }
        return s / x.length;
    }

    /** Sample variance, divisor n − 1 (two-pass). */
    private static double variance(double[] x) {
        double m = mean(x);
        double s = 0;
        for (double v : x) {
            s += (v - m) * (v - m);
        }
        return s / (x.length - 1);
    }

    // ---- checks ------------------------------------------------------------------------------

    private void checkMean(double[] x, double mu, double sigma, String what) {
        // x̄ ~ N(μ, σ²/n) approximately (CLT): |x̄ − μ| ≤ z σ/√n
        double m = mean(x);
        double bound = z * sigma / Math.sqrt(x.length);
        assertTrue(Math.abs(m - mu) <= bound, () -> what + ": mean " + m + " vs " + mu + " ± " + bound);
    }

    /**
     * Sample sd against σ. Var(s²) = μ4/n − σ⁴(n − 3)/(n(n − 1)) for iid data (H. Cramér,
     * <i>Mathematical Methods of Statistics</i>, 1946, eq. 27.4.2; from memory), so by the delta method
     * SE(s) ≈ √Var(s²)/(2σ); for normal data μ4 = 3σ⁴ and SE(s) ≈ σ/√(2n).
     */
    private void checkSd(double[] x, double sigma, double mu4, String what) {
        int n = x.length;
        double s = Math.sqrt(variance(x));
        double varS2 = mu4 / n - Math.pow(sigma, 4) * (n - 3.0) / ((double) n * (n - 1.0));
        double bound = z * Math.sqrt(varS2) / (2 * sigma);
        assertTrue(Math.abs(s - sigma) <= bound, () -> what + ": sd " + s + " vs " + sigma + " ± " + bound);
    }

    /** Sample variance against σ², for the uniform: same Var(s²) formula, no delta method needed. */
    private void checkVariance(double[] x, double sigma2, double mu4, String what) {
        int n = x.length;
        double s2 = variance(x);
        double varS2 = mu4 / n - sigma2 * sigma2 * (n - 3.0) / ((double) n * (n - 1.0));
        double bound = z * Math.sqrt(varS2);
        assertTrue(Math.abs(s2 - sigma2) <= bound, () -> what + ": variance " + s2 + " vs " + sigma2 + " ± " + bound);
    }

    /**
     * Kolmogorov–Smirnov: √n·D_n is asymptotically Kolmogorov distributed, P(√n D_n > t) ≈
     * 2 Σ (−1)^(k−1) exp(−2k²t²) (A. N. Kolmogorov 1933; N. Smirnov 1948); the first term alone is
     * 1e-6 at t = √(ln(2e6)/2) ≈ 2.6934, so this bound fails by chance with probability ≈ 1e-6.
     */
    private static void checkKs(double[] x, DoubleUnaryOperator cdf, String what) {
        double[] s = x.clone();
        Arrays.sort(s);
        int n = s.length;
        double d = 0;
        for (int i = 0; i < n; i++) {
            double f = cdf.applyAsDouble(s[i]);
            d = Math.max(d, Math.max((i + 1.0) / n - f, f - (double) i / n));
        }
        double t = Math.sqrt(Math.log(2e6) / 2);
        double stat = Math.sqrt(n) * d;
        assertTrue(stat <= t, () -> what + ": √n·D = " + stat + " > " + t);
    }

    /** Pairs where both are present. */
    private static double[][] bothPresent(double[] x, double[] y) {
        int n = 0;
        for (int i = 0; i < x.length; i++) {
            if (!Double.isNaN(x[i]) && !Double.isNaN(y[i])) {
                n++;
            }
        }
        double[][] out = new double[2][n];
        int j = 0;
        for (int i = 0; i < x.length; i++) {
            if (!Double.isNaN(x[i]) && !Double.isNaN(y[i])) {
                out[0][j] = x[i];
                out[1][j] = y[i];
                j++;
            }
        }
        return out;
    }

    private static double pearson(double[] x, double[] y) {
        double mx = mean(x);
        double my = mean(y);
        double sxy = 0;
        double sxx = 0;
        double syy = 0;
        for (int i = 0; i < x.length; i++) {
            sxy += (x[i] - mx) * (y[i] - my);
            sxx += (x[i] - mx) * (x[i] - mx);
            syy += (y[i] - my) * (y[i] - my);
        }
        return sxy / Math.sqrt(sxx * syy);
    }

    /**
     * For bivariate normal data Fisher's z = atanh(r) is approximately N(atanh ρ, 1/(n − 3)) (R. A.
     * Fisher, Metron 1, 1921): |atanh r − atanh ρ| ≤ z/√(n − 3).
     */
    private void checkFisher(double[] x, double[] y, double rho, String what) {
        double r = pearson(x, y);
        double bound = z / Math.sqrt(x.length - 3.0);
        assertTrue(Math.abs(FastMath.atanh(r) - FastMath.atanh(rho)) <= bound,
                () -> what + ": r = " + r + " vs " + rho + " (Fisher z bound " + bound + ")");
    }

    /**
     * Pearson r of non-normal data: by the delta method Var(r) ≈ (1/n)[ρ²/4 (m40 + m04 + 2m22) −
     * ρ(m31 + m13) + m22] with m_ij the standardized mixed moments (M. G. Kendall and A. Stuart,
     * <i>The Advanced Theory of Statistics</i>, vol. 1, eq. 10.17, rearranged; from memory — it reduces
     * to (1 − ρ²)²/n for the bivariate normal, where m40 = 3, m22 = 1 + 2ρ², m31 = 3ρ). The moments
     * are estimated from the sample itself (consistent plug-in).
     */
    private void checkPearsonGeneral(double[] x, double[] y, double rho, String what) {
        int n = x.length;
        double mx = mean(x);
        double my = mean(y);
        double sx = Math.sqrt(variance(x));
        double sy = Math.sqrt(variance(y));
        double m40 = 0;
        double m04 = 0;
        double m22 = 0;
        double m31 = 0;
        double m13 = 0;
        for (int i = 0; i < n; i++) {
            double a = (x[i] - mx) / sx;
            double b = (y[i] - my) / sy;
            m40 += a * a * a * a;
            m04 += b * b * b * b;
            m22 += a * a * b * b;
            m31 += a * a * a * b;
            m13 += a * b * b * b;
        }
        m40 /= n;
        m04 /= n;
        m22 /= n;
        m31 /= n;
        m13 /= n;
        double var = (rho * rho / 4 * (m40 + m04 + 2 * m22) - rho * (m31 + m13) + m22) / n;
        double r = pearson(x, y);
        double bound = z * Math.sqrt(var);
        assertTrue(Math.abs(r - rho) <= bound, () -> what + ": r = " + r + " vs " + rho + " ± " + bound);
    }

    private void checkNulls(double[] x, double p, String what) {
        // the number missing is Binomial(n, p): |k − np| ≤ z √(np(1 − p)) (normal approximation, np ≥ 2000)
        long k = Arrays.stream(x).filter(Double::isNaN).count();
        double bound = z * Math.sqrt(N * p * (1 - p));
        assertTrue(Math.abs(k - N * p) <= bound, () -> what + ": " + k + " missing vs " + N * p + " ± " + bound);
    }

    // ---- the truncated normal by numerical integration ------------------------------------------

    /**
     * Mean, sd and central fourth moment of N(μ, σ²) truncated to [lower, upper], by Gauss–Legendre
     * quadrature (commons-math3 {@link GaussIntegratorFactory#legendre}, 32 points on each of 400
     * pieces) of the density itself, with no use of Φ: t = (x − μ)/σ, weight exp(−(t² − t0²)/2) with
     * t0 the point of the interval nearest 0 (the scale cancels and keeps far tails from underflow),
     * infinite bounds cut 40 sd beyond t0 (the weight there is below e^-800).
     */
    static double[] truncatedMomentsByIntegration(double mu, double sigma, double lower, double upper) {
        double a = (lower - mu) / sigma;
        double b = (upper - mu) / sigma;
        double t0 = a > 0 ? a : (b < 0 ? b : 0.0);
        double lo = Math.max(a, t0 - 40);
        double hi = Math.min(b, t0 + 40);
        double[] m = new double[5];
        int pieces = 400;
        double width = (hi - lo) / pieces;
        GaussIntegratorFactory factory = new GaussIntegratorFactory();
        for (int k = 0; k <= 4; k++) {
            int power = k;
            double sum = 0;
            for (int p = 0; p < pieces; p++) {
                double from = lo + p * width;
                double to = p == pieces - 1 ? hi : from + width;
                GaussIntegrator rule = factory.legendre(32, from, to);
                sum += rule.integrate(t -> Math.pow(t, power) * Math.exp(-(t * t - t0 * t0) / 2));
            }
            m[k] = sum;
        }
        double et = m[1] / m[0];
        double et2 = m[2] / m[0];
        double et3 = m[3] / m[0];
        double et4 = m[4] / m[0];
        double varT = et2 - et * et;
        double mu4T = et4 - 4 * et * et3 + 6 * et * et * et2 - 3 * Math.pow(et, 4);
        return new double[] {mu + sigma * et, sigma * Math.sqrt(varT), Math.pow(sigma, 4) * mu4T};
    }

    /** The truncated normal cdf from commons-math3's Φ, using the survival side for upper tails. */
    private DoubleUnaryOperator truncatedCdf(double mu, double sigma, double lower, double upper) {
        double a = (lower - mu) / sigma;
        double b = (upper - mu) / sigma;
        if (a > 0) {
            double sa = std.cumulativeProbability(-a);
            double sb = std.cumulativeProbability(-b);
            return x -> (sa - std.cumulativeProbability(-(x - mu) / sigma)) / (sa - sb);
        }
        double fa = std.cumulativeProbability(a);
        double fb = std.cumulativeProbability(b);
        return x -> (std.cumulativeProbability((x - mu) / sigma) - fa) / (fb - fa);
    }

    // ---- tests ---------------------------------------------------------------------------------

    @Test
    void criticalValue() {
        // Φ^-1(1 − 5e-7) = 4.891638 (from memory)
        assertEquals(4.891638, z, 1e-6);
    }

    @Test
    void bakeryColumnsFollowTheirMarginalsAndCorrelations() throws Exception {
        CompiledSpec compiled = Engine.create(Overrides.none()).compile("bakery.yaml",
                BAKERY.getBytes(StandardCharsets.UTF_8), "");
        double[][] d = drawBakery(compiled);
        // column indices in spec order
        int order = 0;
        int dough = 1;
        int oven = 2;
        int flour = 3;
        int wait = 4;
        int tip = 5;
        int crust = 6;
        int proof = 7;
        int glaze = 8;
        int chill = 9;

        for (int row = 0; row < N; row++) {
            assertEquals(1000.0 + row, d[order][row], 0.0);
        }

        // unbounded normals: mean, sd (μ4 = 3σ⁴), KS against commons-math3's normal cdf
        double[][] normals = {{dough, 50, 8}, {oven, 220, 5}, {tip, 3, 1.2}};
        for (double[] c : normals) {
            double[] x = present(d[(int) c[0]]);
            String what = "column " + (int) c[0];
            checkMean(x, c[1], c[2], what);
            checkSd(x, c[2], 3 * Math.pow(c[2], 4), what);
            NormalDistribution dist = new NormalDistribution(c[1], c[2]);
            checkKs(x, dist::cumulativeProbability, what);
        }

        // uniforms on [a, b]: mean (a + b)/2, variance (b − a)²/12, μ4 = (b − a)⁴/80 (closed forms of
        // the uniform distribution); every value inside [a, b]; KS against (x − a)/(b − a)
        double[][] uniforms = {{flour, 0.8, 1.6}, {wait, 0, 30}};
        for (double[] c : uniforms) {
            double[] x = present(d[(int) c[0]]);
            double w = c[2] - c[1];
            String what = "column " + (int) c[0];
            for (double v : x) {
                assertTrue(v >= c[1] && v <= c[2], what + ": " + v);
            }
            checkMean(x, (c[1] + c[2]) / 2, w / Math.sqrt(12), what);
            checkVariance(x, w * w / 12, Math.pow(w, 4) / 80, what);
            checkKs(x, v -> (v - c[1]) / w, what);
        }

        // nulls: Binomial counts; columns without nulls have none
        checkNulls(d[wait], 0.3, "wait_min");
        checkNulls(d[tip], 0.02, "tip_eur");
        for (int c : new int[] {order, dough, oven, flour, crust, proof, glaze, chill}) {
            for (double v : d[c]) {
                assertFalse(Double.isNaN(v), "column " + c + " has no nulls");
            }
        }

        // truncated normals: never outside [min, max]; mean and sd within sampling bounds of
        // NormalMarginal.mean()/sd(), with the fourth moment from numerical integration; KS
        double[][] truncated = {{crust, 4, 1.5, 2, 7}, {proof, 12.5, 4, 0, Double.POSITIVE_INFINITY},
            {glaze, 0, 1, 2, 5}, {chill, 0, 1, -6, -3}};
        for (double[] c : truncated) {
            double[] x = d[(int) c[0]];
            String name = compiled.spec().columns().get((int) c[0]).name();
            NormalMarginal m = (NormalMarginal) ((ColumnSpec.Random) compiled.spec().columns().get((int) c[0])).marginal();
            for (double v : x) {
                assertTrue(v >= c[3] && v <= c[4], name + " outside its bounds: " + v);
            }
            double[] ref = truncatedMomentsByIntegration(c[1], c[2], c[3], c[4]);
            checkMean(x, m.mean(), m.sd(), name);
            checkSd(x, m.sd(), ref[2], name);
            checkKs(x, truncatedCdf(c[1], c[2], c[3], c[4]), name);
        }

        // correlations. Normal ~ normal pairs are bivariate normal: Fisher z.
        double[][] p = bothPresent(d[dough], d[oven]);
        checkFisher(p[0], p[1], 0.6, "dough_kg ~ oven_temp");
        p = bothPresent(d[tip], d[dough]);
        checkFisher(p[0], p[1], -0.3, "tip_eur ~ dough_kg (over rows where both are present)");
        // a pair the spec does not give gets the maximum-determinant completion (LatentModel); the
        // given pairs among dough_kg, oven_temp, tip_eur form a path oven–dough–tip, and for such a
        // (chordal) pattern the max-det completion makes oven and tip conditionally independent given
        // dough (A. P. Dempster, Biometrics 28, 1972), so ρ(oven, tip) = 0.6 · (−0.3) = −0.18 (closed
        // form). Both are linear in their latents, so the values are bivariate normal: Fisher z.
        p = bothPresent(d[oven], d[tip]);
        checkFisher(p[0], p[1], 0.6 * -0.3, "oven_temp ~ tip_eur (not given: completed)");
        // uniform ~ normal and uniform ~ uniform: Pearson r of the values against the target with
        // the general large-sample variance of r
        p = bothPresent(d[flour], d[dough]);
        checkPearsonGeneral(p[0], p[1], 0.5, "flour_price ~ dough_kg");
        double[][] q = bothPresent(d[flour], d[wait]);
        checkPearsonGeneral(q[0], q[1], 0.3, "flour_price ~ wait_min");

        // ... and in latent space, where the pair is bivariate normal and the latent correlation has
        // a closed form: Corr(Z, Φ(Z)) = √(3/π) (Stein's lemma: Cov = E φ(Z) = 1/(2√π), Var Φ(Z) = 1/12),
        // so a uniform ~ normal target ρ needs latent ρ/√(3/π); for two uniforms Corr(Φ(X), Φ(Y)) =
        // (6/π) asin(r/2) (K. Pearson 1907; W. Kruskal, JASA 53, 1958), so latent 2 sin(πρ/6).
        double[] wFlour = new double[p[0].length];
        double[] zDough = new double[p[0].length];
        for (int i = 0; i < wFlour.length; i++) {
            wFlour[i] = std.inverseCumulativeProbability((p[0][i] - 0.8) / 0.8);
            zDough[i] = (p[1][i] - 50) / 8;
        }
        checkFisher(wFlour, zDough, 0.5 / Math.sqrt(3 / Math.PI), "latent flour_price ~ dough_kg");
        double[] w1 = new double[q[0].length];
        double[] w2 = new double[q[0].length];
        for (int i = 0; i < w1.length; i++) {
            w1[i] = std.inverseCumulativeProbability((q[0][i] - 0.8) / 0.8);
            w2[i] = std.inverseCumulativeProbability(q[1][i] / 30);
        }
        checkFisher(w1, w2, 2 * Math.sin(Math.PI * 0.3 / 6), "latent flour_price ~ wait_min");
    }

    @Test
    void truncatedNormalClosedFormMatchesNumericalIntegration() {
        // {mean, sd, lower, upper}: both-sided, one-sided, upper tail (the mirrored branch), lower
        // tail, narrow, far tails, a deep one-sided tail, and the half normal
        double inf = Double.POSITIVE_INFINITY;
        double[][] cases = {
            {4, 1.5, 2, 7}, {12.5, 4, 0, inf}, {0, 1, 2, 5}, {0, 1, -6, -3}, {5, 2, 4, 4.01},
            {0, 1, 8, 9}, {0, 1, -9, -8}, {0, 1, -inf, -30}, {0, 1, 30, inf}, {10, 3, -inf, 10},
            {10, 3, 10, inf}, {-100, 0.01, -100.5, -99.9}, {0, 1, -0.5, 0.5},
        };
        for (double[] c : cases) {
            NormalMarginal m = NormalMarginal.truncated(c[0], c[1], c[2], c[3]);
            double[] ref = truncatedMomentsByIntegration(c[0], c[1], c[2], c[3]);
            String what = Arrays.toString(c);
            // The closed form (Johnson, Kotz and Balakrishnan 1994, §10.1) computes the variance as
            // σ²[1 + (αφ(α) − βφ(β))/Z − ((φ(α) − φ(β))/Z)²], a difference of terms of size up to
            // max(1, α², β²) for a result of size v = Var((X − μ)/σ), with Z = Φ(β) − Φ(α) itself a
            // difference. Its relative error is therefore about ε·max(1, α², β²)/v with ε the error of
            // Φ (observed ε ≈ 1e-13: sd off by 4e-8 relative for [4, 4.01] with σ = 2, 2e-8 for
            // (−∞, −30]); the tolerance is ten times that model, and 1e-13 at least.
            double alpha = (c[2] - c[0]) / c[1];
            double beta = (c[3] - c[0]) / c[1];
            double terms = 1.0;
            for (double t : new double[] {alpha, beta}) {
                if (Double.isFinite(t)) {
                    terms = Math.max(terms, t * t);
                }
            }
            double v = ref[1] * ref[1] / (c[1] * c[1]);
            double tol = Math.max(1e-13, 1e-12 * terms / v);
            assertEquals(ref[0], m.mean(), 1e-12 * Math.max(1, Math.abs(ref[0])) + tol * ref[1], "mean " + what);
            assertEquals(ref[1], m.sd(), tol * ref[1], "sd " + what);
        }
        // half normal closed form: mean μ − σ√(2/π), sd σ√(1 − 2/π) (Johnson, Kotz and Balakrishnan 1994)
        NormalMarginal half = NormalMarginal.truncated(10, 3, Double.NEGATIVE_INFINITY, 10);
        assertEquals(10 - 3 * Math.sqrt(2 / Math.PI), half.mean(), 1e-13);
        assertEquals(3 * Math.sqrt(1 - 2 / Math.PI), half.sd(), 1e-13);
        // untruncated: the parameters themselves
        NormalMarginal plain = NormalMarginal.of(7, 2);
        assertEquals(7.0, plain.mean(), 0.0);
        assertEquals(2.0, plain.sd(), 0.0);
    }

    @Test
    void truncatedNormalSamplesStayInsideAndMatchTheirMoments() {
        // inversion sampling of NormalMarginal.quantile on the project's uniforms, including far tails
        double inf = Double.POSITIVE_INFINITY;
        double[][] cases = {{0, 1, 8, 9}, {0, 1, -9, -8}, {0, 1, -inf, -30}, {5, 2, 4, 4.01}, {-100, 0.01, -100.5, -99.9}};
        long stream = RandomStreams.streamId("probe", RandomStreams.Purpose.VALUE);
        for (double[] c : cases) {
            NormalMarginal m = NormalMarginal.truncated(c[0], c[1], c[2], c[3]);
            double[] ref = truncatedMomentsByIntegration(c[0], c[1], c[2], c[3]);
            double[] x = new double[N];
            for (int i = 0; i < N; i++) {
                x[i] = m.quantile(RandomStreams.uniform(5L, stream, i));
                assertTrue(x[i] >= c[2] && x[i] <= c[3], Arrays.toString(c) + ": " + x[i]);
            }
            String what = Arrays.toString(c);
            checkMean(x, m.mean(), m.sd(), what);
            checkSd(x, m.sd(), ref[2], what);
            checkKs(x, truncatedCdf(c[0], c[1], c[2], c[3]), what);
        }
    }
}
