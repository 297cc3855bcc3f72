package dev.standin.random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.distribution.ChiSquaredDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.util.FastMath;
import org.junit.jupiter.api.Test;

/**
 * Statistical checks of the uniforms of {@link RandomStreams}. Each check is deterministic (fixed
 * seed); its stated false-failure rate is the chance that it fails for a seed picked at random when
 * the generator is ideal, so a failure here is strong evidence of a defect, not bad luck.
 */
class RandomStreamsTest {

    private static final int N = 100_000;

    /** Two-sided normal critical value for a false-failure rate of 1e-6 per check: Φ^-1(1 − 5e-7) ≈ 4.8916. */
    private final double z = new NormalDistribution(0.0, 1.0).inverseCumulativeProbability(1 - 0.5e-6);

    @Test
    void criticalValueIsAsTabulated() {
        // Φ^-1(1 − 5e-7) = 4.891638 (from memory; standard normal tables of extreme quantiles)
        assertEquals(4.891638, z, 1e-6);
    }

    @Test
    void uniformsAreInTheOpenIntervalOnTheDocumentedGrid() {
        long stream = RandomStreams.streamId("wind_knots", RandomStreams.Purpose.VALUE);
        for (long row = 0; row < N; row++) {
            double u = RandomStreams.uniform(424242L, stream, row);
            assertTrue(u > 0.0 && u < 1.0, "u = " + u);
            // (k + 0.5)·2^-52 for an integer k in [0, 2^52): u·2^52 − 0.5 is a whole number
            double k = u * 0x1.0p52 - 0.5;
            assertEquals(Math.rint(k), k, 0.0);
        }
    }

    @Test
    void extremeBitsStayInsideTheOpenInterval() {
        // the largest 52-bit value gives (2^52 − 1 + 0.5)·2^-52 = 1 − 2^-53, the largest double below 1
        // (IEEE 754 binary64: the spacing just below 1 is 2^-53); the smallest gives 2^-53
        assertEquals(1.0 - 0x1.0p-53, ((0xFFFFFFFFFFFFFFFFL >>> 12) + 0.5) * 0x1.0p-52, 0.0);
        assertTrue(((0xFFFFFFFFFFFFFFFFL >>> 12) + 0.5) * 0x1.0p-52 < 1.0);
        assertEquals(0x1.0p-53, ((0L >>> 12) + 0.5) * 0x1.0p-52, 0.0);
    }

    @Test
    void chiSquaredOverOneHundredBins() {
        // Pearson's χ² goodness of fit: with 100 equiprobable bins and 10^5 draws (1000 expected a
        // bin, far above the usual ≥ 5 rule of common practice), X² is approximately χ²(99). The
        // critical value is the 1 − 1e-6 quantile of χ²(99) from commons-math3 (≈ 180), so each of the
        // three streams below fails by chance with probability 1e-6 (3e-6 for the test, union bound).
        double critical = new ChiSquaredDistribution(99).inverseCumulativeProbability(1 - 1e-6);
        assertTrue(critical > 170 && critical < 190, "critical " + critical);
        long[][] cases = {
            {424242L, RandomStreams.streamId("wind_knots", RandomStreams.Purpose.VALUE)},
            {0L, RandomStreams.streamId("a", RandomStreams.Purpose.VALUE)},
            {-1L, RandomStreams.streamId("wait_min", RandomStreams.Purpose.MISSING)},
        };
        for (long[] c : cases) {
            long[] counts = new long[100];
            for (long row = 0; row < N; row++) {
                counts[(int) (RandomStreams.uniform(c[0], c[1], row) * 100)]++;
            }
            double expected = N / 100.0;
            double x2 = 0;
            for (long count : counts) {
                x2 += (count - expected) * (count - expected) / expected;
            }
            double stat = x2;
            assertTrue(stat < critical, () -> "χ² = " + stat + " ≥ " + critical + " for seed " + c[0]);
        }
    }

    /** The Pearson correlation of two sequences of uniforms. */
    private static double correlation(double[] x, double[] y) {
        double mx = 0;
        double my = 0;
        for (int i = 0; i < x.length; i++) {
            mx += x[i];
            my += y[i];
        }
        mx /= x.length;
        my /= y.length;
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

    private static double[] draws(long seed, long stream, long firstRow) {
        double[] u = new double[N];
        for (int i = 0; i < N; i++) {
            u[i] = RandomStreams.uniform(seed, stream, firstRow + i);
        }
        return u;
    }

    private void assertUncorrelated(double[] x, double[] y, String what) {
        // Fisher's z: atanh(r) is approximately N(atanh ρ, 1/(n − 3)) (R. A. Fisher, "On the probable
        // error of a coefficient of correlation", Metron 1, 1921); under independence ρ = 0, and for
        // independent variables the large-sample variance of r is 1/n whatever the marginals. A bound
        // of z/√(n − 3) with z = 4.8916 fails by chance with probability 1e-6 per check.
        double r = correlation(x, y);
        double bound = z / Math.sqrt(N - 3.0);
        assertTrue(Math.abs(FastMath.atanh(r)) <= bound, () -> what + ": r = " + r + ", |atanh r| > " + bound);
    }

    @Test
    void streamsOfDifferentColumnsAreUncorrelated() {
        // 7 checks at 1e-6 each: the test fails by chance with probability ≤ 7e-6 (union bound)
        long seed = 424242L;
        String[][] pairs = {{"wind_knots", "wait_min"}, {"a", "b"}, {"x1", "x2"}, {"fare_eur", "fare_eu"},
            {"col_10", "col_01"}};
        for (String[] p : pairs) {
            assertNotEquals(RandomStreams.streamId(p[0], RandomStreams.Purpose.VALUE),
                    RandomStreams.streamId(p[1], RandomStreams.Purpose.VALUE));
            assertUncorrelated(draws(seed, RandomStreams.streamId(p[0], RandomStreams.Purpose.VALUE), 0),
                    draws(seed, RandomStreams.streamId(p[1], RandomStreams.Purpose.VALUE), 0), p[0] + " vs " + p[1]);
        }
        // the value and missing-value streams of one column
        assertUncorrelated(draws(seed, RandomStreams.streamId("fare_eur", RandomStreams.Purpose.VALUE), 0),
                draws(seed, RandomStreams.streamId("fare_eur", RandomStreams.Purpose.MISSING), 0), "value vs missing");
        // one stream under two neighbouring seeds
        long s = RandomStreams.streamId("fare_eur", RandomStreams.Purpose.VALUE);
        assertUncorrelated(draws(1L, s, 0), draws(2L, s, 0), "seed 1 vs seed 2");
    }

    @Test
    void successiveRowsOfOneStreamAreUncorrelated() {
        // lag-1 serial correlation of one stream (rows n and n + 1); same Fisher-z bound, 1e-6
        long s = RandomStreams.streamId("wind_knots", RandomStreams.Purpose.VALUE);
        assertUncorrelated(draws(7L, s, 0), draws(7L, s, 1), "lag 1");
    }
}
