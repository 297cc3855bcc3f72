package dev.standin.correlation;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;
import org.junit.jupiter.api.Test;

class HermiteRule64Test {

    /** Every node and weight is the one commons-math3 computes, bit for bit. */
    @Test
    void equalsTheLibrarysRuleBitForBit() {
        GaussIntegrator rule = new GaussIntegratorFactory().hermite(64);
        double[] x = HermiteRule64.points();
        double[] w = HermiteRule64.weights();
        assertEquals(rule.getNumberOfPoints(), x.length);
        for (int i = 0; i < x.length; i++) {
            assertEquals(Double.doubleToRawLongBits(rule.getPoint(i)), Double.doubleToRawLongBits(x[i]), "node " + i);
            assertEquals(Double.doubleToRawLongBits(rule.getWeight(i)), Double.doubleToRawLongBits(w[i]), "weight " + i);
        }
    }

    /**
     * The rule's moments: Σ w x^(2m) = Γ(m + 1/2) = (2m − 1)!! √π / 2^m, exact for 2m ≤ 127
     * (a 64-point Gauss rule integrates polynomials of degree ≤ 127 exactly; Abramowitz and Stegun
     * 25.4.46), here m = 0 .. 4 to 1e-13 relative.
     */
    @Test
    void integratesEvenMomentsOfTheGaussianWeight() {
        double[] x = HermiteRule64.points();
        double[] w = HermiteRule64.weights();
        double expected = Math.sqrt(Math.PI);
        for (int m = 0; m <= 4; m++) {
            double sum = 0;
            for (int i = 0; i < x.length; i++) {
                sum += w[i] * Math.pow(x[i], 2 * m);
            }
            assertEquals(expected, sum, 1e-13 * expected, "moment " + 2 * m);
            expected *= (2 * m + 1) / 2.0;
        }
    }
}
