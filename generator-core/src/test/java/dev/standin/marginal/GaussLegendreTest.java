package dev.standin.marginal;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;
import org.junit.jupiter.api.Test;

class GaussLegendreTest {

    private static final int[] ORDERS = {16, 20, 32};

    /** Every node and weight is the one commons-math3 computes for [0, 1], bit for bit. */
    @Test
    void equalsTheLibrarysRulesBitForBit() {
        for (int n : ORDERS) {
            GaussIntegrator rule = new GaussIntegratorFactory().legendre(n, 0, 1);
            double[] x = GaussLegendre.points(n);
            double[] w = GaussLegendre.weights(n);
            assertEquals(rule.getNumberOfPoints(), x.length);
            assertEquals(n, w.length);
            for (int i = 0; i < n; i++) {
                assertEquals(Double.doubleToRawLongBits(rule.getPoint(i)), Double.doubleToRawLongBits(x[i]), n + " node " + i);
                assertEquals(Double.doubleToRawLongBits(rule.getWeight(i)), Double.doubleToRawLongBits(w[i]), n + " weight " + i);
            }
        }
    }

    /**
     * An n-point Gauss–Legendre rule integrates polynomials of degree ≤ 2n − 1 exactly (Abramowitz and
     * Stegun 25.4.29): on [0, 1], Σ w x^k = 1/(k + 1), here for k = 0 .. 2n − 1 to 1e-14.
     */
    @Test
    void integratesPolynomialsUpToDegreeTwoNMinusOne() {
        for (int n : ORDERS) {
            double[] x = GaussLegendre.points(n);
            double[] w = GaussLegendre.weights(n);
            for (int k = 0; k <= 2 * n - 1; k++) {
                double sum = 0;
                for (int i = 0; i < n; i++) {
                    sum += w[i] * Math.pow(x[i], k);
                }
                assertEquals(1.0 / (k + 1), sum, 1e-14, n + " points, degree " + k);
            }
        }
    }

    @Test
    void otherOrdersAreRefused() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> GaussLegendre.points(17));
        assertEquals("n must be 16, 20 or 32: 17", e.getMessage());
    }
}
