package dev.standin.report;

import dev.standin.correlation.NortaPearson;
import dev.standin.correlation.RankTargets;
import dev.standin.marginal.DiscreteTable;
import dev.standin.marginal.Marginal;
import dev.standin.marginal.QuantileMoments;
import dev.standin.marginal.ValueKind;
import dev.standin.sampling.LatentModel;
import dev.standin.spec.ColumnSpec;
import dev.standin.spec.CorrelationSpec;
import dev.standin.spec.Spec;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.concurrent.ForkJoinTask;
import org.apache.commons.math3.distribution.ChiSquaredDistribution;

/**
 * Checks a written dataset against its spec, each with a tolerance from sampling theory chosen so
 * that a correct generator fails a given check with probability below 10<sup>-6</sup>.
 *
 * <p>The false-failure rate: two-sided normal checks use z = 4.8916, since P(|Z| &gt; 4.8916) =
 * 1.0e-6 (Φ<sup>-1</sup>(1 − 5e-7) = 4.89164, AS 241); KS uses the asymptotic Kolmogorov critical
 * value √(−ln(α/2)/2)/√n = 2.6934/√n for α = 1e-6 (Smirnov 1948; conservative for rounded and
 * discrete data); χ² uses its 1 − 1e-6 quantile (commons-math3). A dataset with 20 checks thus
 * fails falsely with probability below 2e-5.
 *
 * <ul>
 *   <li>mean: SE σ/√n (central limit theorem), plus half the rounding step h = 10<sup>-decimals</sup>;</li>
 *   <li>sd: SE of s by the delta method, Var(s²) = (μ<sub>4</sub> − σ⁴(n − 3)/(n − 1))/n and SE(s) =
 *   √Var(s²)/(2σ), with the target's fourth central moment μ<sub>4</sub>, against √(σ² + h²/12) (Sheppard's
 *   correction for rounding), plus h/2;</li>
 *   <li>missing values: binomial SE √(p(1 − p)/N);</li>
 *   <li>goodness of fit: KS on the seeded row sample for continuous columns (against the distribution
 *   of the rounded value, P(round(X) ≤ v) = F(v + h/2)), and χ² over all rows for discrete and
 *   categorical columns, adjacent cells pooled until each expects at least 5 (common practice);</li>
 *   <li>correlations: Pearson against the asymptotic variance of r for non-normal data, n Var(r) =
 *   ρ²(μ<sub>40</sub> + μ<sub>04</sub> + 2μ<sub>22</sub>)/4 − ρ(μ<sub>31</sub> + μ<sub>13</sub>) + μ<sub>22</sub> in
 *   standardised moments (A. Stuart and J. K. Ord, <i>Kendall's Advanced Theory of Statistics</i> vol. 1,
 *   6th ed. 1994, example 10.6), the moments estimated on the row sample and the SE inflated by 25% for
 *   that estimate's own noise; Spearman and Kendall on Fisher's z scale with SE √(1.06/(n − 3)) and
 *   √(0.437/(n − 4)) (E. C. Fieller, H. O. Hartley and E. S. Pearson, Biometrika 44 (1957) 470-481);
 *   covariance with SE √((σ<sub>x</sub>²σ<sub>y</sub>² + σ<sub>xy</sub>²)/(n − 1)) (normal theory);
 *   a {@code latent} target through the Spearman ρ it implies. Pairs with a categorical column are
 *   defined on the latent scale and not measured.</li>
 * </ul>
 * Checks with fewer than {@value #MIN_N} observations have no useful power and say so instead of passing.
 */
public final class FidelityChecks {

    /** z for a two-sided false-failure rate of 1e-6 per check. */
    public static final double Z = 4.8916;

    /** The KS constant √(−ln(α/2)/2) for α = 1e-6. */
    public static final double KS_CONSTANT = 2.6934;

    /** The false-failure rate per check. */
    public static final double ALPHA = 1e-6;

    /** Fewest observations for a check to be made. */
    public static final int MIN_N = 50;

    private FidelityChecks() {
    }

    public static List<Check> of(Spec spec, LatentModel model, DatasetStats stats) {
        return of(spec, model, stats, false);
    }

    /**
     * The checks of a generated dataset: each column's, then each correlated pair's. With
     * {@code parallel}, the column checks (a Kolmogorov–Smirnov distance is a few thousand CDF
     * evaluations) run as tasks of the common fork-join pool while the calling thread makes the pair
     * checks; the list is the same either way.
     */
    public static List<Check> of(Spec spec, LatentModel model, DatasetStats stats, boolean parallel) {
        List<ColumnSpec> columns = spec.columns();
        List<double[]> sample = stats.sample().rows();
        List<ForkJoinTask<List<Check>>> perColumn = new ArrayList<>();
        for (int i = 0; i < columns.size(); i++) {
            if (columns.get(i) instanceof ColumnSpec.Random r) {
                int column = i;
                Callable<List<Check>> task = () -> {
                    List<Check> out = new ArrayList<>();
                    columnChecks(out, r, column, stats, sample, spec.rows());
                    return out;
                };
                ForkJoinTask<List<Check>> t = ForkJoinTask.adapt(task);
                perColumn.add(parallel ? t.fork() : t);
            }
        }
        List<Check> pairs = new ArrayList<>();
        if (spec.correlation() != null) {
            // the sample's rank memo is used by this thread only
            pairChecks(pairs, spec, model, stats, sample);
        }
        List<Check> checks = new ArrayList<>();
        for (ForkJoinTask<List<Check>> t : perColumn) {
            checks.addAll(parallel ? t.join() : t.invoke());
        }
        checks.addAll(pairs);
        return checks;
    }

    private static Check tooFew(String name, double target, double achieved, long n) {
        return new Check(name, target, achieved, Double.NaN, null, n + " values give no useful power; not checked");
    }

    private static void columnChecks(List<Check> checks, ColumnSpec.Random c, int i, DatasetStats stats,
                                     List<double[]> sample, long rows) {
        Marginal m = c.marginal();
        Moments mo = stats.moments(i);
        long n = mo.count();
        String name = c.name();
        double h = m.valueKind() == ValueKind.NUMBER && c.decimals() >= 0 ? StrictMath.pow(10, -c.decimals()) : 0.0;
        // missing values
        long total = n + mo.missing();
        double p = c.nulls();
        double nullFraction = total == 0 ? Double.NaN : (double) mo.missing() / total;
        if (total < MIN_N) {
            checks.add(tooFew("nulls of " + name, p, nullFraction, total));
        } else if (p == 0) {
            checks.add(new Check("nulls of " + name, 0, nullFraction, 0, mo.missing() == 0, null));
        } else {
            double tol = Z * StrictMath.sqrt(p * (1 - p) / total) + 1.0 / total;
            checks.add(new Check("nulls of " + name, p, nullFraction, tol, Math.abs(nullFraction - p) <= tol, null));
        }
        if (m.valueKind() == ValueKind.LABEL) {
            chiSquare(checks, name, (DiscreteTable) m, stats.counts(i), stats.countOffset(i), n);
            return;
        }
        double mu = m.mean();
        double sigma = m.sd();
        if (n < MIN_N) {
            checks.add(tooFew("mean of " + name, mu, mo.mean(), n));
            checks.add(tooFew("sd of " + name, sigma, mo.sd(), n));
        } else {
            double tolMean = Z * sigma / StrictMath.sqrt(n) + h / 2;
            checks.add(new Check("mean of " + name, mu, mo.mean(), tolMean, Math.abs(mo.mean() - mu) <= tolMean, null));
            double mu4 = fourthCentralMoment(m);
            double varS2 = Math.max(mu4 - sigma * sigma * sigma * sigma * (n - 3.0) / (n - 1.0), 0) / n;
            double tolSd = Z * StrictMath.sqrt(varS2) / (2 * sigma) + h / 2;
            double expected = StrictMath.sqrt(sigma * sigma + h * h / 12);
            checks.add(new Check("sd of " + name, sigma, mo.sd(), tolSd, Math.abs(mo.sd() - expected) <= tolSd,
                    h > 0 ? "target with Sheppard's rounding correction: " + dev.standin.output.NumberText.shortest(expected) : null));
        }
        if (stats.counts(i) != null && m instanceof DiscreteTable t) {
            chiSquare(checks, name, t, stats.counts(i), stats.countOffset(i), n);
        } else {
            ks(checks, name, m, column(sample, i), h);
        }
    }

    private static double fourthCentralMoment(Marginal m) {
        double mu = m.mean();
        if (m instanceof DiscreteTable t) {
            double s = 0;
            for (long k = t.lowest(); k <= t.highest(); k++) {
                double d = k - mu;
                s += t.probability(k) * d * d * d * d;
            }
            return s;
        }
        return QuantileMoments.integral(u -> {
            double d = m.quantile(Math.min(Math.max(u, Double.MIN_NORMAL), 1 - 0x1.0p-53)) - mu;
            return d * d * d * d;
        });
    }

    private static double[] column(List<double[]> sample, int i) {
        return RowSample.pairwiseComplete(sample, i, i).x();
    }

    /** KS distance of the sample from the distribution of the rounded (or discrete) value ({@link KolmogorovDistance}). */
    static double ksDistance(Marginal m, double[] values, double h) {
        return KolmogorovDistance.of(m, values, h);
    }

    private static void ks(List<Check> checks, String name, Marginal m, double[] values, double h) {
        int n = values.length;
        if (n < MIN_N) {
            checks.add(tooFew("ks of " + name, 0, Double.NaN, n));
            return;
        }
        double d = ksDistance(m, values, h);
        double critical = KS_CONSTANT / StrictMath.sqrt(n);
        checks.add(new Check("ks of " + name, 0, d, critical, d <= critical, "Kolmogorov–Smirnov distance on a seeded sample of " + n));
    }

    private static void chiSquare(List<Check> checks, String name, DiscreteTable t, long[] counts, long offset, long n) {
        if (counts == null || n < MIN_N) {
            checks.add(tooFew("chi-square of " + name, Double.NaN, Double.NaN, n));
            return;
        }
        List<double[]> cells = new ArrayList<>();
        double expected = 0;
        double observed = 0;
        for (int j = 0; j < counts.length; j++) {
            expected += n * t.probability(offset + j);
            observed += counts[j];
            if (expected >= 5) {
                cells.add(new double[] {observed, expected});
                expected = 0;
                observed = 0;
            }
        }
        if (expected > 0 || observed > 0) {
            if (cells.isEmpty()) {
                cells.add(new double[] {observed, expected});
            } else {
                double[] last = cells.get(cells.size() - 1);
                last[0] += observed;
                last[1] += expected;
            }
        }
        if (cells.size() < 2) {
            checks.add(new Check("chi-square of " + name, 0, 0, 0, null, "a single cell after pooling; not checked"));
            return;
        }
        double chi2 = 0;
        for (double[] cell : cells) {
            double d = cell[0] - cell[1];
            chi2 += d * d / cell[1];
        }
        int df = cells.size() - 1;
        double critical = new ChiSquaredDistribution(null, df).inverseCumulativeProbability(1 - ALPHA);
        checks.add(new Check("chi-square of " + name, df, chi2, critical, chi2 <= critical,
                df + " degrees of freedom after pooling cells expecting fewer than 5"));
    }

    private static void pairChecks(List<Check> checks, Spec spec, LatentModel model, DatasetStats stats, List<double[]> sample) {
        CorrelationSpec cs = spec.correlation();
        List<String> order = model.order();
        double[][] used = model.used();
        double[][] latent = model.latent();
        NortaPearson norta = new NortaPearson();
        RankTargets ranks = new RankTargets(norta);
        for (int a = 0; a < order.size(); a++) {
            for (int b = 0; b < a; b++) {
                int ca = stats.pairColumn(a);
                int cb = stats.pairColumn(b);
                Marginal ma = ((ColumnSpec.Random) spec.columns().get(ca)).marginal();
                Marginal mb = ((ColumnSpec.Random) spec.columns().get(cb)).marginal();
                String name = cs.measure().word() + " of " + order.get(b) + " ~ " + order.get(a);
                if (ma.valueKind() == ValueKind.LABEL || mb.valueKind() == ValueKind.LABEL) {
                    checks.add(new Check(name, used[a][b], Double.NaN, Double.NaN, null,
                            "a categorical pair is defined on the latent scale; not measured"));
                    continue;
                }
                switch (cs.measure()) {
                    case PEARSON -> pearson(checks, name, used[a][b], stats.pair(a, b), sample, ca, cb);
                    case COVARIANCE -> covariance(checks, name, used[a][b], stats.pair(a, b), ma.sd(), mb.sd());
                    case SPEARMAN -> rank(checks, name, used[a][b], sample, ca, cb, CorrelationSpec.Measure.SPEARMAN);
                    case KENDALL -> rank(checks, name, used[a][b], sample, ca, cb, CorrelationSpec.Measure.KENDALL);
                    case LATENT -> rank(checks, "spearman implied by " + name, ranks.spearman(mb, ma, latent[a][b]),
                            sample, ca, cb, CorrelationSpec.Measure.SPEARMAN);
                }
            }
        }
    }

    private static void pearson(List<Check> checks, String name, double target, PairMoments pm, List<double[]> sample,
                                int ca, int cb) {
        long n = pm.count();
        double r = pm.correlation();
        if (n < MIN_N || !Double.isFinite(r)) {
            checks.add(tooFew(name, target, r, n));
            return;
        }
        double nVar = pearsonAsymptoticVariance(sample, ca, cb, target);
        double tol = Z * 1.25 * StrictMath.sqrt(nVar / n);
        checks.add(new Check(name, target, r, tol, Math.abs(r - target) <= tol,
                "delta-method SE from the sample's standardised fourth moments"));
    }

    /** n·Var(r) from standardised sample moments (Stuart and Ord 1994, example 10.6). */
    static double pearsonAsymptoticVariance(List<double[]> sample, int ca, int cb, double rho) {
        RowSample.Pair p = RowSample.pairwiseComplete(sample, ca, cb);
        double[] x = p.x();
        double[] y = p.y();
        int n = x.length;
        if (n < 3) {
            return (1 - rho * rho) * (1 - rho * rho);
        }
        standardise(x, n);
        standardise(y, n);
        double m40 = 0;
        double m04 = 0;
        double m22 = 0;
        double m31 = 0;
        double m13 = 0;
        for (int i = 0; i < n; i++) {
            double x2 = x[i] * x[i];
            double y2 = y[i] * y[i];
            m40 += x2 * x2;
            m04 += y2 * y2;
            m22 += x2 * y2;
            m31 += x2 * x[i] * y[i];
            m13 += y2 * x[i] * y[i];
        }
        m40 /= n;
        m04 /= n;
        m22 /= n;
        m31 /= n;
        m13 /= n;
        double v = rho * rho / 4 * (m40 + m04 + 2 * m22) - rho * (m31 + m13) + m22;
        return Math.max(v, (1 - rho * rho) * (1 - rho * rho) / 4);
    }

    private static void standardise(double[] v, int n) {
        double mean = 0;
        for (int i = 0; i < n; i++) {
            mean += v[i];
        }
        mean /= n;
        double ss = 0;
        for (int i = 0; i < n; i++) {
            ss += (v[i] - mean) * (v[i] - mean);
        }
        double sd = StrictMath.sqrt(ss / n);
        for (int i = 0; i < n; i++) {
            v[i] = sd > 0 ? (v[i] - mean) / sd : 0;
        }
    }

    private static void covariance(List<Check> checks, String name, double target, PairMoments pm, double sx, double sy) {
        long n = pm.count();
        double c = pm.covariance();
        if (n < MIN_N) {
            checks.add(tooFew(name, target, c, n));
            return;
        }
        double tol = Z * StrictMath.sqrt((sx * sx * sy * sy + target * target) / (n - 1));
        checks.add(new Check(name, target, c, tol, Math.abs(c - target) <= tol, "normal-theory SE"));
    }

    private static void rank(List<Check> checks, String name, double target, List<double[]> sample, int ca, int cb,
                             CorrelationSpec.Measure measure) {
        int n = 0;
        for (double[] row : sample) {
            if (!Double.isNaN(row[ca]) && !Double.isNaN(row[cb])) {
                n++;
            }
        }
        List<double[]> rows = sample;
        double achieved = RankStatistics.correlation(measure, rows, ca, cb);
        if (n < MIN_N || !Double.isFinite(achieved)) {
            checks.add(tooFew(name, target, achieved, n));
            return;
        }
        double se = measure == CorrelationSpec.Measure.KENDALL ? StrictMath.sqrt(0.437 / (n - 4)) : StrictMath.sqrt(1.06 / (n - 3));
        double zt = atanh(Math.max(-0.999999, Math.min(0.999999, target)));
        // a target of exactly ±1 (tied columns) is reached exactly: the interval then ends at ±1 itself
        double lo = target <= -1 ? -1.0 : StrictMath.tanh(zt - Z * se);
        double hi = target >= 1 ? 1.0 : StrictMath.tanh(zt + Z * se);
        double tol = Math.max(hi - target, target - lo);
        boolean pass = achieved >= lo && achieved <= hi;
        checks.add(new Check(name, target, achieved, tol, pass, "Fisher-z interval on a seeded sample of " + n));
    }

    private static double atanh(double r) {
        return 0.5 * StrictMath.log((1 + r) / (1 - r));
    }
}
