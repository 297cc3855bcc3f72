package dev.standin.random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.analysis.solvers.BrentSolver;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.special.Erf;
import org.apache.commons.math3.util.FastMath;
import org.junit.jupiter.api.Test;

/**
 * Φ<sup>-1</sup> (Wichura's AS 241) against published values and against commons-math3 3.6.1 as an
 * independent library.
 */
class NormalQuantileTest {

    /** commons-math3's standard normal; its cdf is 0.5·erfc(−x/√2) with a continued-fraction erfc. */
    private final NormalDistribution std = new NormalDistribution(0.0, 1.0);

    private static void assertRelative(double expected, double actual, double tolerance, String what) {
        double scale = Math.max(Math.abs(expected), Double.MIN_NORMAL);
        assertTrue(Math.abs(actual - expected) <= tolerance * scale,
                () -> what + ": expected " + expected + " but was " + actual + " (relative error "
                        + Math.abs(actual - expected) / scale + ")");
    }

    @Test
    void publishedValues() {
        // Φ^-1(0.975) = 1.959963984540054: Abramowitz and Stegun (1964) §26.2 (the normal
        // distribution) tabulate 1.959964; the 16-digit value is scipy.special.ndtri(0.975) (from
        // memory). AS 241 claims about 1e-16 relative, so 2 ulps are allowed.
        assertRelative(1.959963984540054, NormalQuantile.of(0.975), 4e-16, "p = 0.975");
        // Φ^-1(0.5) = 0 exactly (symmetry of the normal density).
        assertEquals(0.0, NormalQuantile.of(0.5));
        // Φ^-1(1e-10) = -6.361340902404056: scipy.special.ndtri(1e-10) (from memory).
        assertRelative(-6.361340902404056, NormalQuantile.of(1e-10), 4e-16, "p = 1e-10");
        // Φ^-1(0.995) = 2.5758293035489 (A&S §26.2 tabulate 2.575829; 14 digits from memory, scipy ndtri).
        assertRelative(2.5758293035489, NormalQuantile.of(0.995), 1e-13, "p = 0.995");
        // Φ^-1(0.841344746068543) = 1 within 1e-12: Φ(1) = 0.841344746068543 (A&S §26.2 table of Φ;
        // 15 digits from memory).
        assertRelative(1.0, NormalQuantile.of(0.841344746068543), 1e-12, "p = Φ(1)");
    }

    @Test
    void endpointsAndInvalidInput() {
        // the quantile function's limits at 0 and 1 (definition)
        assertEquals(Double.NEGATIVE_INFINITY, NormalQuantile.of(0.0));
        assertEquals(Double.POSITIVE_INFINITY, NormalQuantile.of(1.0));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> NormalQuantile.of(1.5));
        assertEquals("p must be in [0, 1]: 1.5", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> NormalQuantile.of(-0.1));
        assertThrows(IllegalArgumentException.class, () -> NormalQuantile.of(Double.NaN));
    }

    @Test
    void symmetry() {
        // Φ^-1(1 − p) = −Φ^-1(p) (the normal density is even). For dyadic p = k/2^20 both p and 1 − p
        // are exact, and AS 241 evaluates both sides through the same arithmetic, so equality is exact.
        for (int k = 1; k < (1 << 20); k += 37) {
            double p = k / (double) (1 << 20);
            assertEquals(-NormalQuantile.of(p), NormalQuantile.of(1.0 - p), 0.0, "p = " + p);
        }
    }

    @Test
    void monotone() {
        // a quantile function is non-decreasing
        double prev = Double.NEGATIVE_INFINITY;
        for (int k = 1; k < 200_000; k++) {
            double x = NormalQuantile.of(k / 200_000.0);
            assertTrue(x >= prev, "not monotone at " + k);
            prev = x;
        }
    }

    /** The grid: 10^-300 .. 1e-3 log-spaced, (1e-3, 1 − 1e-3) linear, and 1 − 10^-3 .. 1 − 2^-53. */
    private static List<Double> grid() {
        List<Double> ps = new ArrayList<>();
        for (int k = 30; k <= 3000; k++) {
            ps.add(FastMath.pow(10.0, -k / 10.0));
        }
        for (int k = 1; k < 1000; k++) {
            ps.add(k / 1000.0);
        }
        for (int k = 30; k <= 160; k++) {
            ps.add(1.0 - FastMath.pow(10.0, -k / 10.0));
        }
        ps.add(1.0 - 0x1.0p-53);
        ps.add(Double.MIN_NORMAL);
        return ps;
    }

    @Test
    void agreesWithCommonsMathInverseAwayFromTheLowerTail() {
        // commons-math3 NormalDistribution.inverseCumulativeProbability = √2·erfInv(2p − 1) (Giles'
        // erfinv). 2p − 1 is exact only for p ≥ 0.25 and cancels badly as p → 0 (observed: relative
        // error 2e-9 at p = 1e-10, −∞ below 1e-16), so it is a reference only for p ≥ 1e-3.
        for (double p : grid()) {
            if (p < 1e-3 || p == 0.5) {
                continue;
            }
            assertRelative(std.inverseCumulativeProbability(p), NormalQuantile.of(p), 1e-9, "p = " + p);
            // Erf.erfcInv(2p) gives the same reference by the identity Φ^-1(p) = −√2·erfc^-1(2p)
            assertRelative(-FastMath.sqrt(2.0) * Erf.erfcInv(2 * p), NormalQuantile.of(p), 1e-9, "erfcInv, p = " + p);
        }
    }

    @Test
    void agreesWithTheRootOfCommonsMathCdfInTheLowerTail() {
        // For p < 0.5 the reference is the root of log Φ(x) = log p with Φ(x) = 0.5·erfc(−x/√2) from
        // commons-math3 (Erf.erfc is a regularized incomplete gamma Q(1/2, x²/2), accurate relative to
        // its value deep in the tail), solved by commons-math3's BrentSolver on [−40, 0].
        BrentSolver solver = new BrentSolver(1e-15, 1e-15);
        for (double p : grid()) {
            if (p >= 0.5) {
                continue;
            }
            double logP = FastMath.log(p);
            double root = solver.solve(1000, x -> FastMath.log(0.5 * Erf.erfc(-x / FastMath.sqrt(2.0))) - logP, -40.0, 0.0);
            assertRelative(root, NormalQuantile.of(p), 1e-9, "p = " + p);
        }
    }

    @Test
    void roundTripThroughCommonsMathCdf() {
        // Φ(Φ^-1(p)) = p with commons-math3's Φ. The relative error of the round trip is about
        // |x|·|δx| + (error of erfc); observed ≤ 3e-13 down to p = 1e-300, asserted to 1e-11.
        for (double p : grid()) {
            double x = NormalQuantile.of(p);
            if (p <= 0.5) {
                assertRelative(p, std.cumulativeProbability(x), 1e-11, "p = " + p);
            } else {
                // upper half: compare the survival 1 − p (exact for p ≥ 0.5, Sterbenz) with Φ(−x)
                assertRelative(1.0 - p, std.cumulativeProbability(-x), 1e-11, "p = " + p);
            }
        }
    }
}
