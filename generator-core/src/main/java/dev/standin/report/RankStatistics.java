package dev.standin.report;

import dev.standin.spec.CorrelationSpec;
import java.util.List;
import java.util.Arrays;
import org.apache.commons.math3.stat.correlation.KendallsCorrelation;
import org.apache.commons.math3.stat.correlation.PearsonsCorrelation;

/**
 * Rank correlations of sampled rows, pairwise complete: Spearman's ρ with average ranks for ties
 * and Kendall's τ<sub>b</sub> by Knight's O(n log n) algorithm (W. R. Knight, "A computer method
 * for calculating Kendall's tau with ungrouped data", JASA 61 (1966) 436-439), both from
 * commons-math3. Spearman's ρ is commons-math3's own definition (its {@code SpearmansCorrelation}:
 * the Pearson correlation, by {@link PearsonsCorrelation}, of the average ranks), with the ranks found
 * by a primitive sort instead of commons-math3's {@code NaturalRanking} of boxed pairs: average ranks
 * are whole or half numbers, exact in binary, so the result is the same bits at a fraction of the cost.
 */
public final class RankStatistics {

    private RankStatistics() {
    }

    /** The measure's correlation of columns a and b over rows where both are present, or NaN. */
    public static double correlation(CorrelationSpec.Measure measure, List<double[]> rows, int a, int b) {
        if (measure != CorrelationSpec.Measure.KENDALL && rows instanceof RowSample.Rows sample && rows.size() >= 3) {
            // both columns complete: the pairwise-complete rows are all rows, ranked once per column
            double[] ra = sample.completeRanks(a);
            double[] rb = ra == null ? null : sample.completeRanks(b);
            if (rb != null) {
                double v = new PearsonsCorrelation().correlation(ra, rb);
                return Double.isFinite(v) ? v : Double.NaN;
            }
        }
        RowSample.Pair p = RowSample.pairwiseComplete(rows, a, b);
        if (p.x().length < 3) {
            return Double.NaN;
        }
        double v = measure == CorrelationSpec.Measure.KENDALL
                ? new KendallsCorrelation().correlation(p.x(), p.y())
                : new PearsonsCorrelation().correlation(averageRanks(p.x()), averageRanks(p.y()));
        return Double.isFinite(v) ? v : Double.NaN;
    }

    /**
     * Ranks 1..n of the values, ties given the mean of the ranks they span, values ordered as
     * {@link Double#compare} orders them (as commons-math3's NaturalRanking with TiesStrategy.AVERAGE
     * does): each value becomes a long key in that order (IEEE 754 bits with the magnitude bits of
     * negative values flipped), the keys are sorted, each run of equal keys gets its average rank, and
     * each value looks up the run of its key.
     */
    static double[] averageRanks(double[] x) {
        int n = x.length;
        long[] keys = new long[n];
        for (int i = 0; i < n; i++) {
            keys[i] = key(x[i]);
        }
        long[] sorted = keys.clone();
        Arrays.sort(sorted);
        // average rank of the run each sorted position belongs to: positions lo..hi → (lo + hi + 2) / 2
        double[] runRank = new double[n];
        for (int lo = 0; lo < n; ) {
            int hi = lo;
            while (hi + 1 < n && sorted[hi + 1] == sorted[lo]) {
                hi++;
            }
            double r = (lo + hi + 2) / 2.0;
            for (int j = lo; j <= hi; j++) {
                runRank[j] = r;
            }
            lo = hi + 1;
        }
        double[] ranks = new double[n];
        for (int i = 0; i < n; i++) {
            ranks[i] = runRank[Arrays.binarySearch(sorted, keys[i])];
        }
        return ranks;
    }

    /** A long whose signed order is Double.compare's order of finite doubles and infinities (−0.0 before 0.0). */
    private static long key(double v) {
        long bits = Double.doubleToRawLongBits(v);
        return bits ^ ((bits >> 63) & Long.MAX_VALUE);
    }
}
