package dev.standin.report;

import dev.standin.spec.CorrelationSpec;
import java.util.List;
import org.apache.commons.math3.stat.correlation.KendallsCorrelation;
import org.apache.commons.math3.stat.correlation.SpearmansCorrelation;

/**
 * Rank correlations of sampled rows, pairwise complete: Spearman's ρ with average ranks for ties
 * and Kendall's τ<sub>b</sub> by Knight's O(n log n) algorithm (W. R. Knight, "A computer method
 * for calculating Kendall's tau with ungrouped data", JASA 61 (1966) 436-439), both from
 * commons-math3.
 */
public final class RankStatistics {

    private RankStatistics() {
    }

    /** The measure's correlation of columns a and b over rows where both are present, or NaN. */
    public static double correlation(CorrelationSpec.Measure measure, List<double[]> rows, int a, int b) {
        int n = 0;
        for (double[] r : rows) {
            if (!Double.isNaN(r[a]) && !Double.isNaN(r[b])) {
                n++;
            }
        }
        if (n < 3) {
            return Double.NaN;
        }
        double[] x = new double[n];
        double[] y = new double[n];
        int i = 0;
        for (double[] r : rows) {
            if (!Double.isNaN(r[a]) && !Double.isNaN(r[b])) {
                x[i] = r[a];
                y[i] = r[b];
                i++;
            }
        }
        double v = measure == CorrelationSpec.Measure.KENDALL
                ? new KendallsCorrelation().correlation(x, y)
                : new SpearmansCorrelation().correlation(x, y);
        return Double.isFinite(v) ? v : Double.NaN;
    }
}
