package dev.standin.fit;

import dev.standin.marginal.DiscreteTable;
import dev.standin.marginal.Families;
import dev.standin.marginal.Marginal;
import dev.standin.marginal.NormalMarginal;
import java.util.ArrayList;
import java.util.List;
import java.util.function.DoubleUnaryOperator;
import org.apache.commons.math3.analysis.solvers.BrentSolver;
import org.apache.commons.math3.exception.MathIllegalStateException;
import org.apache.commons.math3.optim.InitialGuess;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.optim.PointValuePair;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.nonlinear.scalar.ObjectiveFunction;
import org.apache.commons.math3.optim.nonlinear.scalar.noderiv.NelderMeadSimplex;
import org.apache.commons.math3.optim.nonlinear.scalar.noderiv.SimplexOptimizer;
import org.apache.commons.math3.special.Beta;
import org.apache.commons.math3.special.Gamma;
import org.apache.commons.math3.stat.inference.KolmogorovSmirnovTest;
import org.apache.commons.math3.util.FastMath;

/**
 * Maximum-likelihood fits of the spec's numeric families to one column, each scored by AIC and by
 * the Kolmogorov-Smirnov distance.
 *
 * <p>Estimators (N. L. Johnson, S. Kotz and N. Balakrishnan, <i>Continuous Univariate
 * Distributions</i>, 2nd ed., Wiley 1994-95; <i>Univariate Discrete Distributions</i>, 3rd ed., 2005):
 * <ul>
 *   <li>normal: mean and the 1/n standard deviation; lognormal: the same of ln x;
 *   exponential: rate 1/mean; Poisson: the mean — all closed forms;</li>
 *   <li>gamma: shape k solves ln k − ψ(k) = ln x̄ − mean(ln x), scale x̄/k (Choi and Wette,
 *   Technometrics 11 (1969) 683-690), by Brent's method on a bracket from ½k ≤ 1/(ln k − ψ(k)) ≤ k;</li>
 *   <li>Weibull: shape k solves Σx<sup>k</sup>ln x / Σx<sup>k</sup> − 1/k − mean(ln x) = 0, scale
 *   (mean x<sup>k</sup>)<sup>1/k</sup> (Cohen, Technometrics 7 (1965) 579-588), by Brent's method;</li>
 *   <li>beta: the two-parameter likelihood maximised over (ln α, ln β) by Nelder-Mead from the
 *   method-of-moments start;</li>
 *   <li>negative binomial: size r solves Σψ(x<sub>i</sub> + r) − nψ(r) + n ln(r/(r + x̄)) = 0 and
 *   p = r/(r + x̄) (Anscombe, Biometrika 37 (1950) 358-382), by Brent's method; only for
 *   over-dispersed counts (s² &gt; x̄), where the root exists.</li>
 * </ul>
 *
 * <p>The likelihood compared by AIC is that of the values <i>as written</i>: a value v written with
 * resolution h (10<sup>−decimals</sup>, or 1 for whole numbers) has probability F(v + h/2) − F(v − h/2)
 * under a continuous family, which is what Standin writes when it rounds that family to the same
 * decimals, and P(v) under a count family. So continuous and count families compare on one scale,
 * and for fine resolutions the ranking equals the density-based one. Parameters are rounded to
 * {@value Numbers#PARAMETER_DIGITS} significant digits before scoring, so the scores are those of the
 * spec as written.
 *
 * <p>The KS distance D = sup|F<sub>n</sub> − G| is taken against G, the distribution of the rounded
 * values, at every jump of both. Its p-value uses Kolmogorov's distribution for n values (commons-math3
 * {@link KolmogorovSmirnovTest#cdf(double, int)}). With estimated parameters and with ties the test is
 * conservative: it rejects less often than its level (H. W. Lilliefors, JASA 62 (1967) 399-402), so a
 * rejection is strong evidence against the family.
 */
public final class FamilyFits {

    /** Binned probabilities below this are replaced by density × h, where the difference of two CDFs loses digits. */
    private static final double BINNED_FLOOR = 1e-6;

    private FamilyFits() {
    }

    /** The column's values grouped into distinct values with counts, and its moments. */
    static final class Sample {
        final double[] values;
        final long[] counts;
        final int n;
        final double mean;
        final double variance;
        final double min;
        final double max;

        Sample(double[] sorted) {
            List<Double> v = new ArrayList<>();
            List<Long> c = new ArrayList<>();
            for (double x : sorted) {
                if (!v.isEmpty() && v.get(v.size() - 1) == x) {
                    c.set(c.size() - 1, c.get(c.size() - 1) + 1);
                } else {
                    v.add(x);
                    c.add(1L);
                }
            }
            values = v.stream().mapToDouble(Double::doubleValue).toArray();
            counts = c.stream().mapToLong(Long::longValue).toArray();
            n = sorted.length;
            min = sorted[0];
            max = sorted[n - 1];
            double s = 0;
            for (int i = 0; i < values.length; i++) {
                s += counts[i] * values[i];
            }
            mean = s / n;
            double ss = 0;
            for (int i = 0; i < values.length; i++) {
                double d = values[i] - mean;
                ss += counts[i] * d * d;
            }
            variance = ss / n;
        }

        double sum(DoubleUnaryOperator f) {
            double s = 0;
            for (int i = 0; i < values.length; i++) {
                s += counts[i] * f.applyAsDouble(values[i]);
            }
            return s;
        }

        double mean(DoubleUnaryOperator f) {
            return sum(f) / n;
        }
    }

    /** A fitted family before scoring: its written parameters, distribution and log density (null for counts). */
    private record Fitted(String family, List<Candidate.Param> params, Marginal marginal, DoubleUnaryOperator logDensity) {
    }

    /**
     * Fits every family that suits the column and scores each.
     *
     * @param sorted the non-missing values, ascending (at least two distinct)
     * @param decimals the digits after the point the values are written with
     * @param wholeNumbers true for an integer column (count families are tried when all values are ≥ 0)
     * @return the candidates that could be fitted, in a fixed order (normal first)
     */
    public static List<Candidate> fit(double[] sorted, int decimals, boolean wholeNumbers) {
        Sample s = new Sample(sorted);
        double h = wholeNumbers ? 1.0 : Numbers.resolution(decimals);
        List<Fitted> fitted = new ArrayList<>();
        add(fitted, () -> normal(s));
        if (s.min > 0) {
            add(fitted, () -> lognormal(s));
            add(fitted, () -> gamma(s));
            add(fitted, () -> weibull(s));
            add(fitted, () -> exponential(s));
            if (s.max < 1) {
                add(fitted, () -> beta(s));
            }
        }
        if (wholeNumbers && s.min >= 0 && s.mean > 0) {
            add(fitted, () -> poisson(s));
            if (s.variance * s.n / (s.n - 1.0) > s.mean) {
                add(fitted, () -> negativeBinomial(s));
            }
        }
        KolmogorovSmirnovTest ks = new KolmogorovSmirnovTest();
        List<Candidate> out = new ArrayList<>();
        for (Fitted f : fitted) {
            double ll = logLikelihood(s, f, h);
            if (!Double.isFinite(ll)) {
                continue;
            }
            double d = ksDistance(s, f.marginal(), h);
            double p = 1.0 - ks.cdf(d, s.n);
            out.add(new Candidate(f.family(), f.params(), f.marginal(), f.params().size(), ll, d, Math.max(p, 0.0)));
        }
        return out;
    }

    private interface Attempt {
        Fitted get();
    }

    /** Adds a family's fit unless its estimator fails or its parameters are outside the family's range. */
    private static void add(List<Fitted> list, Attempt a) {
        try {
            Fitted f = a.get();
            if (f != null) {
                list.add(f);
            }
        } catch (IllegalArgumentException | MathIllegalStateException e) {
            // this family cannot describe the column (e.g. a table too wide to tabulate): leave it out
        }
    }

    private static double r(double x) {
        return Numbers.significant(x, Numbers.PARAMETER_DIGITS);
    }

    private static List<Candidate.Param> params(String k1, double v1, String k2, double v2) {
        return List.of(new Candidate.Param(k1, v1), new Candidate.Param(k2, v2));
    }

    private static final double LOG_SQRT_2PI = 0.91893853320467274178;

    static Fitted normal(Sample s) {
        double mu = r(s.mean);
        double sd = r(StrictMath.sqrt(s.variance));
        if (!(sd > 0)) {
            return null;
        }
        return new Fitted("normal", params("mean", mu, "sd", sd), NormalMarginal.of(mu, sd),
                x -> -LOG_SQRT_2PI - FastMath.log(sd) - (x - mu) * (x - mu) / (2 * sd * sd));
    }

    static Fitted lognormal(Sample s) {
        double ml = s.mean(FastMath::log);
        double vl = s.mean(x -> (FastMath.log(x) - ml) * (FastMath.log(x) - ml));
        double mu = r(ml);
        double sigma = r(StrictMath.sqrt(vl));
        if (!(sigma > 0)) {
            return null;
        }
        return new Fitted("lognormal", params("meanlog", mu, "sdlog", sigma), Families.lognormal(mu, sigma), x -> {
            double l = FastMath.log(x);
            return -LOG_SQRT_2PI - FastMath.log(sigma) - l - (l - mu) * (l - mu) / (2 * sigma * sigma);
        });
    }

    static Fitted exponential(Sample s) {
        double rate = r(1.0 / s.mean);
        return new Fitted("exponential", List.of(new Candidate.Param("rate", rate)), Families.exponential(rate),
                x -> FastMath.log(rate) - rate * x);
    }

    static Fitted gamma(Sample s) {
        double gap = FastMath.log(s.mean) - s.mean(FastMath::log);
        if (!(gap > 0)) {
            return null;
        }
        // 1/(2k) < ln k − ψ(k) < 1/k for k > 0, so the root lies in [1/(4 gap), 1/gap + 1]
        double k = new BrentSolver(1e-14, 1e-12).solve(500, x -> FastMath.log(x) - Gamma.digamma(x) - gap,
                1.0 / (4 * gap), 1.0 / gap + 1.0);
        double shape = r(k);
        double scale = r(s.mean / k);
        double lg = Gamma.logGamma(shape);
        return new Fitted("gamma", params("shape", shape, "scale", scale), Families.gamma(shape, scale),
                x -> (shape - 1) * FastMath.log(x) - x / scale - lg - shape * FastMath.log(scale));
    }

    static Fitted weibull(Sample s) {
        double lmax = FastMath.log(s.max);
        double meanLog = s.mean(FastMath::log);
        java.util.function.DoubleUnaryOperator g = k -> {
            double num = 0;
            double den = 0;
            for (int i = 0; i < s.values.length; i++) {
                double l = FastMath.log(s.values[i]);
                double w = s.counts[i] * FastMath.exp(k * (l - lmax));
                num += w * l;
                den += w;
            }
            return num / den - 1.0 / k - meanLog;
        };
        double lo = 1e-3;
        double hi = 1.0;
        while (g.applyAsDouble(hi) < 0 && hi < 1e4) {
            hi *= 2;
        }
        if (!(g.applyAsDouble(lo) < 0 && g.applyAsDouble(hi) > 0)) {
            return null;
        }
        double k = new BrentSolver(1e-14, 1e-12).solve(500, g::applyAsDouble, lo, hi);
        double m = s.mean(x -> FastMath.exp(k * (FastMath.log(x) - lmax)));
        double lambda = FastMath.exp(lmax + FastMath.log(m) / k);
        double shape = r(k);
        double scale = r(lambda);
        return new Fitted("weibull", params("shape", shape, "scale", scale), Families.weibull(shape, scale), x -> {
            double z = x / scale;
            return FastMath.log(shape / scale) + (shape - 1) * FastMath.log(z) - FastMath.pow(z, shape);
        });
    }

    static Fitted beta(Sample s) {
        double sl = s.mean(FastMath::log);
        double sl1 = s.mean(x -> FastMath.log1p(-x));
        double m = s.mean;
        double v = s.variance;
        double nu = m * (1 - m) / v - 1;
        double a0 = nu > 0 ? m * nu : 1;
        double b0 = nu > 0 ? (1 - m) * nu : 1;
        // minus the mean log-likelihood over (ln α, ln β)
        ObjectiveFunction f = new ObjectiveFunction(p -> {
            double a = FastMath.exp(p[0]);
            double b = FastMath.exp(p[1]);
            return -((a - 1) * sl + (b - 1) * sl1 - Beta.logBeta(a, b));
        });
        PointValuePair best = new SimplexOptimizer(1e-13, 1e-15).optimize(new MaxEval(10_000), f, GoalType.MINIMIZE,
                new InitialGuess(new double[] {FastMath.log(a0), FastMath.log(b0)}), new NelderMeadSimplex(2, 0.2));
        double alpha = r(FastMath.exp(best.getPoint()[0]));
        double beta = r(FastMath.exp(best.getPoint()[1]));
        double lb = Beta.logBeta(alpha, beta);
        return new Fitted("beta", params("alpha", alpha, "beta", beta), Families.beta(alpha, beta),
                x -> (alpha - 1) * FastMath.log(x) + (beta - 1) * FastMath.log1p(-x) - lb);
    }

    static Fitted poisson(Sample s) {
        double mean = r(s.mean);
        return new Fitted("poisson", List.of(new Candidate.Param("mean", mean)), Families.poisson(mean), null);
    }

    static Fitted negativeBinomial(Sample s) {
        double m = s.mean;
        java.util.function.DoubleUnaryOperator score = r -> {
            double t = 0;
            for (int i = 0; i < s.values.length; i++) {
                t += s.counts[i] * (Gamma.digamma(s.values[i] + r) - Gamma.digamma(r));
            }
            return t + s.n * FastMath.log(r / (r + m));
        };
        double sampleVar = s.variance * s.n / (s.n - 1.0);
        double r0 = m * m / (sampleVar - m);
        double lo = r0 / 1000;
        double hi = r0 * 1000;
        double flo = score.applyAsDouble(lo);
        double fhi = score.applyAsDouble(hi);
        if (!(flo * fhi < 0)) {
            return null;
        }
        double size = new BrentSolver(1e-14, 1e-12).solve(500, score::applyAsDouble, lo, hi);
        double rs = r(size);
        double p = r(rs / (rs + m));
        return new Fitted("negbinomial", params("size", rs, "p", p), Families.negativeBinomial(rs, p), null);
    }

    /** The log-likelihood of the values as written; −∞ when some value is impossible under the fit. */
    static double logLikelihood(Sample s, Fitted f, double h) {
        double ll = 0;
        Marginal m = f.marginal();
        for (int i = 0; i < s.values.length; i++) {
            double v = s.values[i];
            double term;
            if (f.logDensity() == null) {
                double p = ((DiscreteTable) m).probability((long) v);
                term = p > 0 ? FastMath.log(p) : Double.NEGATIVE_INFINITY;
            } else {
                double p = m.cdf(v + h / 2) - m.cdf(v - h / 2);
                term = p >= BINNED_FLOOR ? FastMath.log(p) : f.logDensity().applyAsDouble(v) + FastMath.log(h);
            }
            if (!(term > Double.NEGATIVE_INFINITY) || Double.isNaN(term)) {
                return Double.NEGATIVE_INFINITY;
            }
            ll += s.counts[i] * term;
        }
        return ll;
    }

    /**
     * The KS distance between the data's empirical CDF and G(x) = F(x + h/2), the CDF of the fitted
     * distribution rounded to resolution h, checked on both sides of every observed value (between
     * observed values both functions are constant or G only rises, so these are the extremes).
     */
    static double ksDistance(Sample s, Marginal m, double h) {
        double d = 0;
        long cum = 0;
        for (int i = 0; i < s.values.length; i++) {
            double below = (double) cum / s.n;
            cum += s.counts[i];
            double at = (double) cum / s.n;
            d = Math.max(d, Math.abs(below - m.cdf(s.values[i] - h / 2)));
            d = Math.max(d, Math.abs(at - m.cdf(s.values[i] + h / 2)));
        }
        return d;
    }

    /** The KS distance of an arbitrary distribution (such as a quantile table) to the column's values. */
    public static double ksDistance(double[] sorted, Marginal m, double h) {
        return ksDistance(new Sample(sorted), m, h);
    }

    /** The KS p-value for distance d with n values. */
    public static double ksPValue(double d, int n) {
        return Math.max(0.0, 1.0 - new KolmogorovSmirnovTest().cdf(d, n));
    }
}
