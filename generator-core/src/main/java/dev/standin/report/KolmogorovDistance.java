package dev.standin.report;

import dev.standin.marginal.Marginal;
import java.util.Arrays;

/**
 * The Kolmogorov–Smirnov distance sup |F<sub>n</sub> − F| of a sample from the distribution of the
 * written value (A. N. Kolmogorov 1933; N. V. Smirnov 1948): at a distinct value v taken by the sample
 * at sorted positions i .. j, the terms |(j + 1)/n − F(v + h/2)| and |i/n − F(v − h/2)| for values
 * rounded to a step h (F(v) once when h = 0), and F(v) and F(v − 1) for a discrete marginal; the
 * distance is the largest term.
 *
 * <p>Evaluating F twice at every distinct value was most of a report's cost (commons-math3's
 * incomplete gamma and beta functions, 20,000 calls for a sample of 10,000). So the distinct values
 * are taken in runs of {@value #RUN}. F is evaluated first at each run's lowest and highest point,
 * fl and fu. F is non-decreasing and every point evaluated in a run lies between those two, so each of
 * the run's terms is at most max(c<sub>max</sub> − fl, fu − c<sub>min</sub>), where c<sub>min</sub> and
 * c<sub>max</sub> are the run's smallest and largest count fractions. A run is evaluated in full only
 * when that bound is not below the largest term found so far by more than {@value #MARGIN} (room for
 * rounding in F), taking the runs with the largest bounds first. A run that is skipped cannot hold a
 * term as large as the maximum, so the result is the very number the full evaluation gives (the
 * maximum of the same terms) for any F that is non-decreasing to within that margin.
 */
final class KolmogorovDistance {

    /** Distinct values per run. */
    static final int RUN = 8;

    /** Allowance for F's rounding: a run is skipped only when its bound is below the maximum by more. */
    static final double MARGIN = 1e-9;

    private KolmogorovDistance() {
    }

    static double of(Marginal m, double[] values, double h) {
        double[] x = values.clone();
        Arrays.sort(x);
        int n = x.length;
        // first[g]: the first sorted position of distinct value g; first[groups] = n
        int[] first = new int[n + 1];
        int groups = 0;
        for (int i = 0; i < n; i++) {
            if (i == 0 || x[i] != x[i - 1]) {
                first[groups++] = i;
            }
        }
        first[groups] = n;
        Terms t = new Terms(m, x, first, n, h);
        int runs = (groups + RUN - 1) / RUN;
        double[] bound = new double[runs];
        // F below the run's first value and up to its last, kept for the full evaluation
        double[] low = new double[runs];
        double[] high = new double[runs];
        double d = 0;
        for (int r = 0; r < runs; r++) {
            int g0 = r * RUN;
            int g1 = Math.min(groups, g0 + RUN) - 1;
            low[r] = t.lower(g0);
            high[r] = t.upper(g1);
            d = Math.max(d, Math.abs(t.below(g0) - low[r]));
            d = Math.max(d, Math.abs(t.upTo(g1) - high[r]));
            bound[r] = Math.max(t.upTo(g1) - low[r], high[r] - t.below(g0));
        }
        Integer[] order = new Integer[runs];
        for (int r = 0; r < runs; r++) {
            order[r] = r;
        }
        // largest bounds first (a NaN bound sorts first, so such a run is evaluated)
        Arrays.sort(order, (a, b) -> Double.compare(bound[b], bound[a]));
        for (int r : order) {
            if (bound[r] + MARGIN < d) {
                break;
            }
            int g0 = r * RUN;
            int g1 = Math.min(groups, g0 + RUN) - 1;
            for (int g = g0; g <= g1; g++) {
                // F once per point: the run's ends are known, and unrounded continuous values have one point
                double upper = g == g1 ? high[r] : t.upper(g);
                double lower = g == g0 ? low[r] : t.onePoint() ? upper : t.lower(g);
                d = Math.max(d, Math.abs(t.upTo(g) - upper));
                d = Math.max(d, Math.abs(t.below(g) - lower));
            }
        }
        return d;
    }

    /** The terms of distinct value g: count fractions and model probabilities below and up to it. */
    private record Terms(Marginal m, double[] x, int[] first, int n, double h) {

        /** i/n: the sample's fraction below value g. */
        double below(int g) {
            return (double) first[g] / n;
        }

        /** (j + 1)/n: the sample's fraction up to and including value g. */
        double upTo(int g) {
            return (double) first[g + 1] / n;
        }

        /** The model's probability up to value g. */
        double upper(int g) {
            double v = x[first[g]];
            return m.isDiscrete() ? m.cdf(v) : m.cdf(v + h / 2);
        }

        /** True when the probabilities below and up to a value are one evaluation (unrounded continuous values). */
        boolean onePoint() {
            return !m.isDiscrete() && !(h > 0);
        }

        /** The model's probability below value g. */
        double lower(int g) {
            double v = x[first[g]];
            if (m.isDiscrete()) {
                return m.cdf(v - 1);
            }
            return h > 0 ? m.cdf(v - h / 2) : m.cdf(v + h / 2);
        }
    }
}
