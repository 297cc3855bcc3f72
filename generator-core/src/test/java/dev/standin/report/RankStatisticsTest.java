package dev.standin.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.standin.spec.CorrelationSpec;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.apache.commons.math3.stat.correlation.SpearmansCorrelation;
import org.apache.commons.math3.stat.ranking.NaNStrategy;
import org.apache.commons.math3.stat.ranking.NaturalRanking;
import org.apache.commons.math3.stat.ranking.TiesStrategy;
import org.junit.jupiter.api.Test;

/** The primitive-sort ranks and Spearman's ρ against commons-math3's own, bit for bit. */
class RankStatisticsTest {

    @Test
    void ranksAndSpearmanEqualCommonsMath() {
        SplittableRandom rnd = new SplittableRandom(1958);
        NaturalRanking natural = new NaturalRanking(NaNStrategy.FAILED, TiesStrategy.AVERAGE);
        for (int trial = 0; trial < 200; trial++) {
            int n = 3 + rnd.nextInt(3000);
            int levels = trial % 3 == 0 ? 1 + rnd.nextInt(6) : 0;
            double[] x = new double[n];
            double[] y = new double[n];
            List<double[]> rows = new ArrayList<>();
            for (int i = 0; i < n; i++) {
                // ties (few levels, rounded values) and both zeros, which Double.compare tells apart
                x[i] = levels > 0 ? rnd.nextInt(levels) - 1 : Math.rint(rnd.nextGaussian() * 50) / 10;
                if (x[i] == 0 && rnd.nextBoolean()) {
                    x[i] = -0.0;
                }
                y[i] = 0.3 * x[i] + rnd.nextGaussian();
                rows.add(new double[] {x[i], Double.NaN, y[i]});
            }
            assertArrayEquals(natural.rank(x), RankStatistics.averageRanks(x), "ranks, trial " + trial);
            double expected = new SpearmansCorrelation().correlation(x, y);
            double actual = RankStatistics.correlation(CorrelationSpec.Measure.SPEARMAN, rows, 0, 2);
            if (Double.isFinite(expected)) {
                assertEquals(Double.doubleToRawLongBits(expected), Double.doubleToRawLongBits(actual), "rho, trial " + trial);
            }
        }
    }

    @Test
    void theSampleRanksEachColumnOnceWithTheSameResult() {
        // the sample's rank memo against the per-pair path on a plain list of the same rows
        SplittableRandom rnd = new SplittableRandom(7);
        RowSample sample = new RowSample(99, 2000);
        for (long row = 0; row < 20_000; row++) {
            double a = rnd.nextGaussian();
            double[] v = {a, Math.rint(a + rnd.nextGaussian()), rnd.nextInt(4), row % 17 == 0 ? Double.NaN : a * a};
            sample.offer(row, v);
        }
        List<double[]> memo = sample.rows();
        List<double[]> plain = new ArrayList<>(memo);
        for (int a = 0; a < 4; a++) {
            for (int b = 0; b < 4; b++) {
                double expected = RankStatistics.correlation(CorrelationSpec.Measure.SPEARMAN, plain, a, b);
                double actual = RankStatistics.correlation(CorrelationSpec.Measure.SPEARMAN, memo, a, b);
                assertEquals(Double.doubleToRawLongBits(expected), Double.doubleToRawLongBits(actual), a + " ~ " + b);
            }
        }
    }
}
