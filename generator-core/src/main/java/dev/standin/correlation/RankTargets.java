package dev.standin.correlation;

import dev.standin.marginal.Marginal;
import dev.standin.random.NormalQuantile;
import org.apache.commons.math3.analysis.solvers.BrentSolver;

/**
 * Latent normal correlations for rank-correlation targets under a Gaussian copula.
 *
 * <ul>
 *   <li>Spearman, continuous pair: r = 2 sin(πρ<sub>S</sub>/6), the inverse of ρ<sub>S</sub> = (6/π)
 *   arcsin(r/2) (K. Pearson, "On further methods of determining correlation", Drapers' Company
 *   Research Memoirs, Biometric Series IV, 1907). With a discrete column, ties break that relation:
 *   ρ<sub>S</sub> is the Pearson correlation of mid-distribution grades (Kruskal 1958), solved by
 *   {@link NortaPearson} on {@link GradeView}s.</li>
 *   <li>Kendall, continuous pair: r = sin(πτ/2), the inverse of τ = (2/π) arcsin r (W. Kruskal,
 *   "Ordinal measures of association", JASA 53 (1958) 814-861). With a discrete column the target is
 *   τ<sub>b</sub>, computed from the copula's joint probabilities on the grid of support points
 *   (continuous partners enter as {@value #BINS} equal-probability bins), and solved by Brent's method.</li>
 * </ul>
 */
public final class RankTargets {

    /** Equal-probability bins standing for a continuous column in a discrete Kendall pair. */
    static final int BINS = 400;

    /** The largest support used for a discrete Kendall computation (larger supports are binned). */
    static final int MAX_SUPPORT = 400;

    private final NortaPearson norta;
    private final BivariateNormal bvn = new BivariateNormal();

    public RankTargets(NortaPearson norta) {
        this.norta = norta;
    }

    public double spearmanLatent(Marginal a, Marginal b, double rho) throws NortaPearson.UnattainableException {
        if (!a.isDiscrete() && !b.isDiscrete()) {
            return 2 * StrictMath.sin(Math.PI * rho / 6);
        }
        return norta.latentFor(new GradeView(a), new GradeView(b), rho);
    }

    /** Spearman's ρ of the two marginals' values under latent correlation r. */
    public double spearman(Marginal a, Marginal b, double r) {
        if (!a.isDiscrete() && !b.isDiscrete()) {
            return 6 / Math.PI * StrictMath.asin(r / 2);
        }
        return norta.correlation(new GradeView(a), new GradeView(b), r);
    }

    public double kendallLatent(Marginal a, Marginal b, double tau) throws NortaPearson.UnattainableException {
        if (!a.isDiscrete() && !b.isDiscrete()) {
            return StrictMath.sin(Math.PI * tau / 2);
        }
        double[] ta = thresholds(a);
        double[] tb = thresholds(b);
        double low = tauB(ta, tb, -1.0);
        double high = tauB(ta, tb, 1.0);
        if (tau < low || tau > high) {
            throw new NortaPearson.UnattainableException(low, high);
        }
        if (tau == low) {
            return -1.0;
        }
        if (tau == high) {
            return 1.0;
        }
        try {
            return new BrentSolver(1e-12, 1e-12).solve(200, r -> tauB(ta, tb, r) - tau, -1.0, 1.0, 0.0);
        } catch (org.apache.commons.math3.exception.NoBracketingException
                 | org.apache.commons.math3.exception.TooManyEvaluationsException e) {
            throw new NortaPearson.UnattainableException(low, high);
        }
    }

    /** Kendall's τ (τ<sub>b</sub> with a discrete column) of the values under latent correlation r. */
    public double kendall(Marginal a, Marginal b, double r) {
        if (!a.isDiscrete() && !b.isDiscrete()) {
            return 2 / Math.PI * StrictMath.asin(r);
        }
        return tauB(thresholds(a), thresholds(b), r);
    }

    /**
     * Latent thresholds Φ<sup>-1</sup>(F(x<sub>i</sub>)) bounding each support point (or bin) of a
     * marginal: cell i is (t[i], t[i+1]], t[0] = −∞, t[last] = +∞.
     */
    private static double[] thresholds(Marginal m) {
        double[] cum;
        if (m.isDiscrete()) {
            java.util.List<Double> c = new java.util.ArrayList<>();
            double lo = m.quantile(1e-15);
            double hi = m.quantile(1 - 1e-15);
            if (hi - lo + 1 <= MAX_SUPPORT) {
                for (double x = lo; x < hi; x++) {
                    c.add(m.cdf(x));
                }
            } else {
                double previous = 0;
                for (int i = 1; i < MAX_SUPPORT; i++) {
                    double f = m.cdf(m.quantile((double) i / MAX_SUPPORT));
                    if (f > previous && f < 1) {
                        c.add(f);
                        previous = f;
                    }
                }
            }
            cum = c.stream().mapToDouble(Double::doubleValue).toArray();
        } else {
            cum = new double[BINS - 1];
            for (int i = 1; i < BINS; i++) {
                cum[i - 1] = (double) i / BINS;
            }
        }
        double[] t = new double[cum.length + 2];
        t[0] = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < cum.length; i++) {
            t[i + 1] = NormalQuantile.of(Math.min(Math.max(cum[i], 0), 1));
        }
        t[t.length - 1] = Double.POSITIVE_INFINITY;
        return t;
    }

    /**
     * τ<sub>b</sub> = (P<sub>c</sub> − P<sub>d</sub>)/√((1 − Σp<sub>i·</sub>²)(1 − Σp<sub>·j</sub>²)) for
     * the cell probabilities p<sub>ij</sub> = P(t<sub>i</sub> &lt; Z<sub>1</sub> ≤ t<sub>i+1</sub>, s<sub>j</sub>
     * &lt; Z<sub>2</sub> ≤ s<sub>j+1</sub>), with P<sub>c</sub> − P<sub>d</sub> = 2Σ p<sub>ij</sub>(C<sub>ij</sub> − D<sub>ij</sub>),
     * C<sub>ij</sub> the mass strictly below-left, D<sub>ij</sub> strictly below-right (A. Agresti,
     * <i>Analysis of Ordinal Categorical Data</i>, 2nd ed., Wiley 2010, section 7.1).
     */
    double tauB(double[] ta, double[] tb, double r) {
        int na = ta.length - 1;
        int nb = tb.length - 1;
        double[][] h = new double[na + 1][nb + 1];
        for (int i = 0; i <= na; i++) {
            for (int j = 0; j <= nb; j++) {
                h[i][j] = bvn.cdf(ta[i], tb[j], r);
            }
        }
        double[][] p = new double[na][nb];
        double[] pa = new double[na];
        double[] pb = new double[nb];
        for (int i = 0; i < na; i++) {
            for (int j = 0; j < nb; j++) {
                p[i][j] = Math.max(0, h[i + 1][j + 1] - h[i][j + 1] - h[i + 1][j] + h[i][j]);
                pa[i] += p[i][j];
                pb[j] += p[i][j];
            }
        }
        // below[i][j] = mass in cells (< i, < j); built by cumulative sums
        double[][] below = new double[na + 1][nb + 1];
        for (int i = 0; i < na; i++) {
            for (int j = 0; j < nb; j++) {
                below[i + 1][j + 1] = p[i][j] + below[i][j + 1] + below[i + 1][j] - below[i][j];
            }
        }
        double concordant = 0;
        double discordant = 0;
        for (int i = 0; i < na; i++) {
            for (int j = 0; j < nb; j++) {
                if (p[i][j] == 0) {
                    continue;
                }
                double lowerLeft = below[i][j];
                double lowerRight = below[i][na > 0 ? nb : 0] - below[i][j + 1];
                concordant += p[i][j] * lowerLeft;
                discordant += p[i][j] * lowerRight;
            }
        }
        double sa = 0;
        double sb = 0;
        for (double v : pa) {
            sa += v * v;
        }
        for (double v : pb) {
            sb += v * v;
        }
        double denominator = StrictMath.sqrt((1 - sa) * (1 - sb));
        return denominator == 0 ? 0 : 2 * (concordant - discordant) / denominator;
    }

}
