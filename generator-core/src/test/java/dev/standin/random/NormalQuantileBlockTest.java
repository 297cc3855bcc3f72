package dev.standin.random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/** The block form of AS 241 gives the same bits as the one-value form, tails and edges included. */
class NormalQuantileBlockTest {

    @Test
    void blockEqualsOneAtATime() {
        SplittableRandom rnd = new SplittableRandom(241);
        int n = 100_000;
        double[] p = new double[n];
        for (int i = 0; i < n; i++) {
            p[i] = switch (i % 4) {
                case 0 -> rnd.nextDouble();
                case 1 -> Math.pow(10, -rnd.nextDouble(0, 300));
                case 2 -> 1 - Math.pow(10, -rnd.nextDouble(0, 16));
                default -> 0.5 + (rnd.nextDouble() - 0.5) * 0.851;
            };
        }
        double[] edges = {0.0, 1.0, 0.075, 0.925, Math.nextUp(0.075), Math.nextDown(0.925), 0.5, Double.MIN_VALUE,
            Math.nextDown(1.0), 0x1.0p-54, 1 - 0x1.0p-53};
        System.arraycopy(edges, 0, p, 0, edges.length);
        double[] out = new double[n];
        NormalQuantile.of(p, out, n);
        for (int i = 0; i < n; i++) {
            assertEquals(Double.doubleToRawLongBits(NormalQuantile.of(p[i])), Double.doubleToRawLongBits(out[i]), "p = " + p[i]);
        }
        double[] bad = {0.3, Double.NaN};
        assertThrows(IllegalArgumentException.class, () -> NormalQuantile.of(bad, new double[2], 2));
        double[] above = {1.5};
        assertThrows(IllegalArgumentException.class, () -> NormalQuantile.of(above, new double[1], 1));
    }
}
