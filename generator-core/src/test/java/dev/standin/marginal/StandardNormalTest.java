package dev.standin.marginal;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.SplittableRandom;
import org.apache.commons.math3.special.Erf;
import org.junit.jupiter.api.Test;

class StandardNormalTest {

    private static final double SQRT_HALF = 0.70710678118654752440;

    /**
     * {@link StandardNormal#erfc} is commons-math3's {@link Erf#erfc(double)} bit for bit: 1,200,000
     * seeded arguments over the whole range it computes (|x| ≤ 40), near zero, and on both sides of
     * the switch from the series to the continued fraction (x² = 3/2).
     */
    @Test
    void erfcEqualsTheLibrarysBitForBit() {
        SplittableRandom random = new SplittableRandom(20261202L);
        for (int i = 0; i < 400_000; i++) {
            assertSameBits(random.nextDouble(-45, 45));
            assertSameBits(random.nextDouble(-3, 3));
            // log-uniform magnitudes from 1e-300 to 1e1, either sign
            double tiny = Math.pow(10, random.nextDouble(-300, 1));
            assertSameBits(random.nextBoolean() ? tiny : -tiny);
        }
    }

    @Test
    void erfcEqualsTheLibraryAtTheEdges() {
        double branch = Math.sqrt(1.5);
        double[] edges = {0.0, -0.0, Double.MIN_VALUE, -Double.MIN_VALUE, Double.MIN_NORMAL, 1e-300, 1e-8, 0.5, 1.0,
            branch, -branch, Math.nextUp(branch), Math.nextDown(branch), -Math.nextUp(branch), -Math.nextDown(branch),
            6.0, -6.0, 26.5, 27.3, 39.999999, 40.0, -40.0, Math.nextUp(40.0), -Math.nextUp(40.0), 1e3, -1e3,
            Double.MAX_VALUE, -Double.MAX_VALUE, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.NaN};
        for (double x : edges) {
            assertSameBits(x);
        }
        // every double within 64 ulps of the branch point, where x² crosses 3/2
        for (double x = branch, k = 0; k < 64; k++) {
            assertSameBits(x);
            assertSameBits(-x);
            x = Math.nextDown(x);
        }
        for (double x = branch, k = 0; k < 64; k++) {
            assertSameBits(x);
            x = Math.nextUp(x);
        }
    }

    /** Φ(x) is 0.5·erfc(−x/√2) of the library, bit for bit, including the infinite ends. */
    @Test
    void cdfIsHalfTheLibrarysErfc() {
        SplittableRandom random = new SplittableRandom(7L);
        for (int i = 0; i < 200_000; i++) {
            double x = random.nextDouble(-40, 40);
            assertEquals(Double.doubleToRawLongBits(0.5 * Erf.erfc(-x * SQRT_HALF)),
                    Double.doubleToRawLongBits(StandardNormal.cdf(x)), "Φ(" + x + ")");
        }
        assertEquals(0.0, StandardNormal.cdf(Double.NEGATIVE_INFINITY));
        assertEquals(1.0, StandardNormal.cdf(Double.POSITIVE_INFINITY));
    }

    /**
     * Known values: Φ(0) = 1/2 exactly; erfc(1) = 0.157299207050285 and erfc(2) = 0.004677734981047
     * (Abramowitz and Stegun, table 7.1, from memory, to 15 digits); Φ(1.959963984540054) = 0.975, the
     * usual two-sided 95 % point (from memory). The library is accurate to about 1e-15 relative.
     */
    @Test
    void agreesWithPublishedValues() {
        assertEquals(0.5, StandardNormal.cdf(0.0));
        assertEquals(0.157299207050285, StandardNormal.erfc(1.0), 1e-14);
        assertEquals(0.004677734981047, StandardNormal.erfc(2.0), 1e-15);
        assertEquals(0.975, StandardNormal.cdf(1.959963984540054), 1e-15);
        assertEquals(1.0 - 0.975, StandardNormal.cdf(-1.959963984540054), 1e-15);
    }

    private static void assertSameBits(double x) {
        assertEquals(Double.doubleToRawLongBits(Erf.erfc(x)), Double.doubleToRawLongBits(StandardNormal.erfc(x)),
                () -> "erfc(" + x + ") = " + Erf.erfc(x) + " in commons-math3, " + StandardNormal.erfc(x) + " here");
    }
}
