package dev.standin.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.standin.marginal.Families;
import dev.standin.marginal.Marginal;
import dev.standin.marginal.NormalMarginal;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.Arrays;
import java.util.SplittableRandom;
import org.apache.commons.math3.distribution.GammaDistribution;
import org.apache.commons.math3.stat.inference.KolmogorovSmirnovTest;
import org.junit.jupiter.api.Test;

/**
 * {@link KolmogorovDistance} skips runs of values that cannot hold the maximum; these tests compare it
 * with evaluating every term (written out below, as FidelityChecks did before) for exact equality, and
 * with commons-math3's KS statistic where that applies (unrounded continuous values).
 */
class KolmogorovDistanceTest {

    /** Every term evaluated: the definition in KolmogorovDistance's javadoc, one distinct value at a time. */
    private static double everyTerm(Marginal m, double[] values, double h) {
        double[] x = values.clone();
        Arrays.sort(x);
        int n = x.length;
        double d = 0;
        boolean discrete = m.isDiscrete();
        int i = 0;
        while (i < n) {
            int j = i;
            while (j + 1 < n && x[j + 1] == x[i]) {
                j++;
            }
            double v = x[i];
            double upper = discrete ? m.cdf(v) : m.cdf(v + h / 2);
            double lower = discrete ? m.cdf(v - 1) : (h > 0 ? m.cdf(v - h / 2) : upper);
            d = Math.max(d, Math.abs((double) (j + 1) / n - upper));
            d = Math.max(d, Math.abs((double) i / n - lower));
            i = j + 1;
        }
        return d;
    }

    /** A marginal that counts its CDF calls. */
    private static final class Counting implements Marginal {
        final Marginal m;
        long calls;

        Counting(Marginal m) {
            this.m = m;
        }

        @Override
        public String family() {
            return m.family();
        }

        @Override
        public double quantile(double p) {
            return m.quantile(p);
        }

        @Override
        public double cdf(double x) {
            calls++;
            return m.cdf(x);
        }

        @Override
        public double mean() {
            return m.mean();
        }

        @Override
        public double sd() {
            return m.sd();
        }

        @Override
        public boolean isDiscrete() {
            return m.isDiscrete();
        }
    }

    /** n values of m (by inversion of seeded uniforms), rounded half-even to the given decimals (or not, for −1). */
    private static double[] sample(Marginal m, int n, long seed, int decimals, double shift) {
        SplittableRandom random = new SplittableRandom(seed);
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            double v = m.quantile(random.nextDouble(1e-12, 1 - 1e-12)) + shift;
            x[i] = decimals < 0 ? v : new BigDecimal(v).setScale(decimals, RoundingMode.HALF_EVEN).doubleValue();
        }
        return x;
    }

    @Test
    void equalsTheFullEvaluationExactly() {
        Object[][] cases = {
            // marginal, n, decimals, shift (a shift moves the maximum to one place)
            {Families.gamma(9, 2), 10_000, 3, 0.0},
            {Families.gamma(9, 2), 10_000, 1, 0.0},
            {Families.gamma(0.3, 1), 10_000, 4, 0.0},
            {Families.beta(2, 5), 10_000, 3, 0.0},
            {Families.beta(2, 5), 10_000, 2, 0.004},
            {Families.weibull(1.5, 3), 7_777, 3, -0.05},
            {Families.lognormal(0, 1.2), 10_000, -1, 0.0},
            {NormalMarginal.of(10, 2), 10_000, 0, 0.0},
            {NormalMarginal.of(10, 2), 3_000, -1, 0.3},
            {Families.poisson(3.5), 10_000, 0, 0.0},
            {Families.poisson(40), 10_000, 0, 1.0},
            {Families.gamma(9, 2), 17, 3, 0.0},
            {Families.gamma(9, 2), 1, 3, 0.0},
        };
        long seed = 1;
        for (Object[] c : cases) {
            Marginal m = (Marginal) c[0];
            int decimals = (int) c[2];
            double h = m.isDiscrete() || decimals < 0 ? 0.0 : Math.pow(10, -decimals);
            double[] x = sample(m, (int) c[1], seed++, decimals, (double) c[3]);
            double expected = everyTerm(m, x, h);
            double actual = KolmogorovDistance.of(m, x, h);
            assertEquals(Double.doubleToRawLongBits(expected), Double.doubleToRawLongBits(actual),
                    m.family() + " n " + x.length + " decimals " + decimals + ": " + expected + " vs " + actual);
        }
    }

    @Test
    void agreesWithCommonsMathOnUnroundedValues() {
        // commons-math3's KolmogorovSmirnovTest statistic, an independent implementation (no rounding step)
        Marginal m = Families.gamma(4, 1.5);
        double[] x = sample(m, 5000, 11, -1, 0.0);
        double theirs = new KolmogorovSmirnovTest().kolmogorovSmirnovStatistic(new GammaDistribution(null, 4, 1.5), x);
        assertEquals(theirs, KolmogorovDistance.of(m, x, 0.0), 1e-12);
    }

    @Test
    void evaluatesFarFewerThanEveryTerm() {
        // the point of the runs: on a typical rounded sample of 10,000 the full evaluation makes two
        // calls per distinct value; the bounded one a small fraction of that (the ends of each run, and
        // the few runs near the maximum)
        Counting full = new Counting(Families.gamma(9, 2));
        Counting bounded = new Counting(Families.gamma(9, 2));
        double[] x = sample(full.m, 10_000, 5, 3, 0.0);
        double expected = everyTerm(full, x, 0.001);
        assertEquals(expected, KolmogorovDistance.of(bounded, x, 0.001), 0.0);
        assertTrue(bounded.calls * 4 < full.calls, bounded.calls + " calls against " + full.calls);
    }
}
