package dev.standin.fit;

import dev.standin.correlation.CorrelationRepair;
import dev.standin.correlation.NortaPearson;
import dev.standin.correlation.RankTargets;
import dev.standin.correlation.RepairPolicy;
import dev.standin.marginal.Marginal;
import dev.standin.marginal.StandardNormal;
import dev.standin.random.NormalQuantile;
import java.util.Arrays;
import java.util.List;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;

/**
 * The dependence between the modelled columns, estimated on the real rows and turned into a
 * {@code measure: spearman} block that the spec's Gaussian copula can reproduce.
 *
 * <ol>
 *   <li>Each pair uses the rows where both values are present (pairwise deletion).</li>
 *   <li>A pair of ordered columns (numbers, booleans, dates, timestamps): Spearman's ρ of mid-ranks
 *   (C. Spearman, Am. J. Psychol. 15 (1904) 72-101; ties by mid-ranks as in Kendall, <i>Rank
 *   Correlation Methods</i>, 1948), turned into the copula's latent correlation with
 *   {@link RankTargets#spearmanLatent} for the fitted marginals (the inverse of what the engine does).
 *   A ρ outside what the marginals can attain is clamped to the nearest attainable end.</li>
 *   <li>A pair with a categorical column is defined on the latent scale (as the engine reads it): each
 *   column's value v is replaced by its normal score g(v) = E[Z | Φ⁻¹(F(v⁻)) &lt; Z ≤ Φ⁻¹(F(v))], the
 *   mean of a standard normal over v's slice of the empirical distribution (levels in the spec's
 *   order, ties together), and the latent correlation is estimated as cov(g₁, g₂)/(var g₁ · var g₂).
 *   That is the first Hermite term of the bivariate normal, so it is exact when the partner is
 *   continuous — the "ad hoc" polyserial estimator of U. Olsson, F. Drasgow and N. J. Dorans,
 *   "The polyserial correlation coefficient", Psychometrika 47 (1982) 337-347 — and a close
 *   approximation for two categorical columns.</li>
 *   <li>The latent matrix is repaired to the nearest correlation matrix when it is not positive
 *   semidefinite ({@link CorrelationRepair#repair} with {@link RepairPolicy#NEAREST}; Higham 2002),
 *   and turned back into Spearman's ρ for the spec with {@link RankTargets#spearman} (latent values for
 *   pairs with a categorical column). The engine checks both the written matrix and the latent one it
 *   implies, so the latent matrix is blended with the identity, (1 − w)R + wI with the smallest w
 *   found by bisection, until both have a smallest eigenvalue of at least max({@value #MIN_EIGENVALUE},
 *   10⁻⁴k): headroom for rounding the pairs to 4 decimals.</li>
 * </ol>
 */
public final class Dependence {

    /** The smallest eigenvalue of the latent matrix written (headroom for rounding the pairs to 4 decimals). */
    static final double MIN_EIGENVALUE = 1e-3;

    /**
     * The outcome.
     *
     * @param order the columns, in spec order
     * @param estimated the pairs as estimated (Spearman's ρ, or latent for categorical pairs), before repair
     * @param written the pairs written into the spec (same scales), rounded to 4 decimals
     * @param latent the latent matrix those pairs stand for
     * @param repairChange the largest change the repair and eigenvalue lift made to a latent pair (0 when none)
     */
    public record Result(List<String> order, double[][] estimated, double[][] written, double[][] latent,
                         double repairChange) {
    }

    /** One column's input: its values per row (NaN missing; categorical as level index) and marginal. */
    record Input(String name, double[] values, Marginal marginal, boolean categorical) {
    }

    private Dependence() {
    }

    static Result estimate(List<Input> columns) {
        int k = columns.size();
        RankTargets ranks = new RankTargets(new NortaPearson());
        double[][] estimated = new double[k][k];
        double[][] latent = new double[k][k];
        for (int i = 0; i < k; i++) {
            estimated[i][i] = 1;
            latent[i][i] = 1;
            for (int j = 0; j < i; j++) {
                Input a = columns.get(i);
                Input b = columns.get(j);
                double[][] pair = complete(a.values(), b.values());
                double e;
                double r;
                if (pair[0].length < 3) {
                    e = 0;
                    r = 0;
                } else if (a.categorical() || b.categorical()) {
                    e = latentByScores(pair[0], pair[1]);
                    r = e;
                } else {
                    e = spearman(pair[0], pair[1]);
                    try {
                        r = ranks.spearmanLatent(a.marginal(), b.marginal(), e);
                    } catch (NortaPearson.UnattainableException x) {
                        r = e < x.low() ? -1.0 : 1.0;
                    }
                }
                estimated[i][j] = estimated[j][i] = e;
                latent[i][j] = latent[j][i] = Math.max(-1, Math.min(1, r));
            }
        }
        double[][] nearest = latent;
        if (!CorrelationRepair.isPsd(latent)) {
            try {
                nearest = CorrelationRepair.repair(latent, RepairPolicy.NEAREST).matrix();
            } catch (CorrelationRepair.NotPositiveSemidefiniteException e) {
                throw new IllegalStateException("nearest repair does not fail", e);
            }
        }
        // the engine checks the written matrix (Spearman's rho, latent for categorical pairs) and the
        // latent one it implies; blend with the identity just enough that both keep the headroom
        double margin = Math.max(MIN_EIGENVALUE, 1e-4 * k);
        double[][] repaired = blend(nearest, 0);
        double[][] written = written(columns, ranks, repaired);
        if (!(lowest(repaired) >= margin && lowest(written) >= margin)) {
            double lo = 0;
            double hi = 1;
            for (int it = 0; it < 40; it++) {
                double w = (lo + hi) / 2;
                double[][] l = blend(nearest, w);
                if (lowest(l) >= margin && lowest(written(columns, ranks, l)) >= margin) {
                    hi = w;
                } else {
                    lo = w;
                }
            }
            repaired = blend(nearest, hi);
            written = written(columns, ranks, repaired);
        }
        double change = 0;
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < i; j++) {
                change = Math.max(change, Math.abs(repaired[i][j] - latent[i][j]));
            }
        }
        return new Result(columns.stream().map(Input::name).toList(), estimated, written, repaired, change);
    }

    /** (1 − w)·m + w·I. */
    private static double[][] blend(double[][] m, double w) {
        int k = m.length;
        double[][] b = new double[k][k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                b[i][j] = i == j ? 1.0 : (1 - w) * m[i][j];
            }
        }
        return b;
    }

    private static double lowest(double[][] m) {
        double low = Double.POSITIVE_INFINITY;
        for (double ev : new EigenDecomposition(new Array2DRowRealMatrix(m)).getRealEigenvalues()) {
            low = Math.min(low, ev);
        }
        return low;
    }

    /** The pairs as written for a latent matrix: Spearman's rho (latent for categorical pairs), 4 decimals. */
    private static double[][] written(List<Input> columns, RankTargets ranks, double[][] latent) {
        int k = columns.size();
        double[][] written = new double[k][k];
        for (int i = 0; i < k; i++) {
            written[i][i] = 1;
            for (int j = 0; j < i; j++) {
                Input a = columns.get(i);
                Input b = columns.get(j);
                double w = a.categorical() || b.categorical() ? latent[i][j]
                        : ranks.spearman(a.marginal(), b.marginal(), latent[i][j]);
                written[i][j] = written[j][i] = Numbers.fixed(Math.max(-1, Math.min(1, w)), 4);
            }
        }
        return written;
    }

    /** The rows where both are present: {a values, b values}. */
    static double[][] complete(double[] a, double[] b) {
        int n = 0;
        for (int i = 0; i < a.length; i++) {
            if (!Double.isNaN(a[i]) && !Double.isNaN(b[i])) {
                n++;
            }
        }
        double[] x = new double[n];
        double[] y = new double[n];
        int t = 0;
        for (int i = 0; i < a.length; i++) {
            if (!Double.isNaN(a[i]) && !Double.isNaN(b[i])) {
                x[t] = a[i];
                y[t] = b[i];
                t++;
            }
        }
        return new double[][] {x, y};
    }

    /** Mid-ranks (1-based; tied values share the mean of their ranks). */
    static double[] midRanks(double[] v) {
        int n = v.length;
        Integer[] idx = new Integer[n];
        for (int i = 0; i < n; i++) {
            idx[i] = i;
        }
        Arrays.sort(idx, (p, q) -> Double.compare(v[p], v[q]));
        double[] r = new double[n];
        int i = 0;
        while (i < n) {
            int j = i;
            while (j + 1 < n && v[idx[j + 1]] == v[idx[i]]) {
                j++;
            }
            double mid = (i + j) / 2.0 + 1;
            for (int t = i; t <= j; t++) {
                r[idx[t]] = mid;
            }
            i = j + 1;
        }
        return r;
    }

    /** Spearman's ρ: the Pearson correlation of mid-ranks; 0 when a side is constant. */
    static double spearman(double[] x, double[] y) {
        return pearson(midRanks(x), midRanks(y));
    }

    static double pearson(double[] x, double[] y) {
        int n = x.length;
        double mx = 0;
        double my = 0;
        for (int i = 0; i < n; i++) {
            mx += x[i];
            my += y[i];
        }
        mx /= n;
        my /= n;
        double sxy = 0;
        double sxx = 0;
        double syy = 0;
        for (int i = 0; i < n; i++) {
            sxy += (x[i] - mx) * (y[i] - my);
            sxx += (x[i] - mx) * (x[i] - mx);
            syy += (y[i] - my) * (y[i] - my);
        }
        return sxx > 0 && syy > 0 ? sxy / StrictMath.sqrt(sxx * syy) : 0.0;
    }

    /**
     * Normal scores with ties: for the slice (F(v⁻), F(v)] of the empirical distribution that value v
     * occupies, the mean of a standard normal over (Φ⁻¹(F(v⁻)), Φ⁻¹(F(v))]:
     * (φ(a) − φ(b))/(Φ(b) − Φ(a)) (the truncated-normal mean; Johnson, Kotz and Balakrishnan 1994, §10.1).
     */
    static double[] normalScores(double[] v) {
        int n = v.length;
        Integer[] idx = new Integer[n];
        for (int i = 0; i < n; i++) {
            idx[i] = i;
        }
        Arrays.sort(idx, (p, q) -> Double.compare(v[p], v[q]));
        double[] g = new double[n];
        int i = 0;
        while (i < n) {
            int j = i;
            while (j + 1 < n && v[idx[j + 1]] == v[idx[i]]) {
                j++;
            }
            double pa = (double) i / n;
            double pb = (double) (j + 1) / n;
            double a = pa <= 0 ? Double.NEGATIVE_INFINITY : NormalQuantile.of(pa);
            double b = pb >= 1 ? Double.POSITIVE_INFINITY : NormalQuantile.of(pb);
            double da = Double.isInfinite(a) ? 0 : StandardNormal.density(a);
            double db = Double.isInfinite(b) ? 0 : StandardNormal.density(b);
            double score = (da - db) / (pb - pa);
            for (int t = i; t <= j; t++) {
                g[idx[t]] = score;
            }
            i = j + 1;
        }
        return g;
    }

    /** The latent correlation from normal scores: cov(g₁, g₂)/(var g₁ · var g₂), clamped to [−1, 1]. */
    static double latentByScores(double[] x, double[] y) {
        double[] gx = normalScores(x);
        double[] gy = normalScores(y);
        int n = x.length;
        double c = 0;
        double vx = 0;
        double vy = 0;
        for (int i = 0; i < n; i++) {
            c += gx[i] * gy[i];
            vx += gx[i] * gx[i];
            vy += gy[i] * gy[i];
        }
        c /= n;
        vx /= n;
        vy /= n;
        if (!(vx > 0 && vy > 0)) {
            return 0.0;
        }
        return Math.max(-1.0, Math.min(1.0, c / (vx * vy)));
    }
}
