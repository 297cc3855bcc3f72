package dev.standin.correlation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import dev.standin.marginal.Families;
import dev.standin.marginal.Marginal;
import dev.standin.marginal.NormalMarginal;
import dev.standin.marginal.UniformMarginal;
import org.junit.jupiter.api.Test;

/** NORTA and the rank-correlation maps against closed forms under the Gaussian copula. */
class NortaClosedFormTest {

    private final NortaPearson norta = new NortaPearson();
    private final RankTargets ranks = new RankTargets(norta);

    /**
     * Pearson correlation of two lognormals exp(σ1 Z1), exp(σ2 Z2) with Corr(Z1, Z2) = r:
     * (e<sup>rσ1σ2</sup> − 1)/√((e<sup>σ1²</sup> − 1)(e<sup>σ2²</sup> − 1)) (N. L. Johnson and S. Kotz,
     * <i>Distributions in Statistics: Continuous Multivariate Distributions</i>, Wiley 1972; from memory).
     */
    private static double lognormalPearson(double s1, double s2, double r) {
        return Math.expm1(r * s1 * s2) / Math.sqrt(Math.expm1(s1 * s1) * Math.expm1(s2 * s2));
    }

    @Test
    void lognormalLatentMatchesTheClosedForm() throws Exception {
        Marginal a = Families.lognormal(0, 1);
        Marginal b = Families.lognormal(0, 1);
        // the closed form at r = 0.5, σ1 = σ2 = 1: (e^0.5 − 1)/(e − 1) = 0.3775406688 (to 10 digits)
        assertEquals(0.3775406688, lognormalPearson(1, 1, 0.5), 1e-10);
        assertEquals(0.5, norta.latentFor(a, b, 0.3775406688), 1e-6);
        // and c(r) along the whole range, with other location parameters (Pearson ignores scale)
        Marginal c = Families.lognormal(2.5, 1);
        Marginal d = Families.lognormal(-1, 2);
        for (double r = -0.95; r <= 0.951; r += 0.05) {
            assertEquals(lognormalPearson(1, 1, r), norta.correlation(a, c, r), 1e-9, "σ 1, 1, r " + r);
            assertEquals(lognormalPearson(1, 2, r), norta.correlation(a, d, r), 1e-9, "σ 1, 2, r " + r);
        }
    }

    @Test
    void lognormalAttainableRangeIsEmbrechtsMcNeilStraumanns() {
        // σ1 = 1, σ2 = 2: attainable Pearson correlations [−0.0901, 0.6657] (P. Embrechts, A. McNeil and
        // D. Straumann, "Correlation and dependence in risk management: properties and pitfalls", 2002,
        // example 5; the ends are the closed form above at r = ∓1: (e^−2 − 1)/√((e − 1)(e^4 − 1)) =
        // −0.0901002, (e^2 − 1)/√((e − 1)(e^4 − 1)) = 0.6657553)
        Marginal a = Families.lognormal(0, 1);
        Marginal b = Families.lognormal(0, 2);
        assertEquals(-0.0901002, lognormalPearson(1, 2, -1), 1e-7);
        assertEquals(0.6657553, lognormalPearson(1, 2, 1), 1e-7);
        NortaPearson.UnattainableException e = assertThrows(NortaPearson.UnattainableException.class,
                () -> norta.latentFor(a, b, 0.9));
        assertEquals(-0.0901002, e.low(), 1e-6);
        assertEquals(0.6657553, e.high(), 1e-6);
        NortaPearson.UnattainableException below = assertThrows(NortaPearson.UnattainableException.class,
                () -> norta.latentFor(a, b, -0.1));
        assertEquals(-0.0901002, below.low(), 1e-6);
        assertEquals(-0.0901002, norta.correlation(a, b, -1), 1e-6);
        assertEquals(0.6657553, norta.correlation(a, b, 1), 1e-6);
    }

    @Test
    void exponentialPairsReachOneButNotMinusOne() throws Exception {
        // Corr(X, Y) of two Exp(1) at the countermonotone end r = −1 is 1 − π²/6 = −0.6449341 (classic
        // result: E[ln U ln(1 − U)] = 2 − π²/6; from memory); comonotone equal marginals reach 1
        Marginal a = Families.exponential(1);
        Marginal b = Families.exponential(3); // a rate is a scale: the correlation does not change
        assertEquals(1 - Math.PI * Math.PI / 6, norta.correlation(a, b, -1), 1e-9);
        assertEquals(1.0, norta.correlation(a, b, 1), 1e-9);
        NortaPearson.UnattainableException e = assertThrows(NortaPearson.UnattainableException.class,
                () -> norta.latentFor(a, b, -0.7));
        assertEquals(1 - Math.PI * Math.PI / 6, e.low(), 1e-6);
        assertEquals(-1.0, norta.latentFor(a, b, norta.correlation(a, b, -1)), 1e-9);
    }

    @Test
    void uniformMarginsFollowPearsons1907Relation() throws Exception {
        // for U_i = Φ(Z_i), Corr(U1, U2) = (6/π) arcsin(r/2) (K. Pearson 1907), so a Pearson target of
        // 0.5 needs latent 2 sin(π/12) = 0.5176381 (closed form)
        Marginal u = UniformMarginal.of(0, 1);
        Marginal v = UniformMarginal.of(-4, 10);
        assertEquals(0.5176381, 2 * Math.sin(Math.PI / 12), 1e-7);
        assertEquals(2 * Math.sin(Math.PI / 12), norta.latentFor(u, v, 0.5), 1e-9);
        for (double r = -1; r <= 1.0001; r += 0.125) {
            double rr = Math.max(-1, Math.min(1, r));
            assertEquals(6 / Math.PI * Math.asin(rr / 2), norta.correlation(u, v, rr), 1e-9, "r " + rr);
        }
    }

    @Test
    void normalPartnersFollowSteinsLemma() throws Exception {
        // Corr(Z, g(Z)) = E[g'(Z)]/sd g(Z) (Stein's lemma): for g = Φ it is √(3/π) (E φ(Z) = 1/(2√π),
        // Var Φ(Z) = 1/12); for g(z) = e^{σz}, σ/√(e^{σ²} − 1) (closed forms); a normal partner scales by r
        Marginal n = NormalMarginal.of(5, 3);
        Marginal u = UniformMarginal.of(0, 1);
        Marginal ln = Families.lognormal(0, 0.8);
        double su = Math.sqrt(3 / Math.PI);
        double sl = 0.8 / Math.sqrt(Math.expm1(0.64));
        assertEquals(0.4 * su, norta.correlation(n, u, 0.4), 1e-12);
        assertEquals(-0.7 * sl, norta.correlation(ln, n, -0.7), 1e-12);
        assertEquals(0.6 / su, norta.latentFor(u, n, 0.6), 1e-12);
        NortaPearson.UnattainableException e = assertThrows(NortaPearson.UnattainableException.class,
                () -> norta.latentFor(n, ln, 0.99));
        assertEquals(-sl, e.low(), 1e-12);
        assertEquals(sl, e.high(), 1e-12);
        assertEquals(0.3, norta.latentFor(n, NormalMarginal.of(-1, 0.2), 0.3), 0.0);
    }

    @Test
    void rankCorrelationsOfContinuousPairsAreKruskals() throws Exception {
        // Gaussian copula, continuous margins: Spearman ρs = (6/π) arcsin(r/2), Kendall τ = (2/π) arcsin r
        // (W. Kruskal, JASA 53, 1958); at r = 0.5: ρs = 0.4825837, τ = 1/3
        Marginal a = Families.gamma(2, 3);
        Marginal b = Families.weibull(1.5, 2);
        assertEquals(0.4825837, ranks.spearman(a, b, 0.5), 1e-7);
        assertEquals(1.0 / 3, ranks.kendall(a, b, 0.5), 1e-12);
        assertEquals(0.5, ranks.spearmanLatent(a, b, 6 / Math.PI * Math.asin(0.25)), 1e-12);
        assertEquals(0.5, ranks.kendallLatent(a, b, 1.0 / 3), 1e-12);
        // Spearman's ρ is the Pearson correlation of the grades F(X), F(Y), uniforms under the copula:
        // NORTA on two uniforms is an independent route to the same number
        assertEquals(norta.correlation(UniformMarginal.of(0, 1), UniformMarginal.of(0, 1), 0.5),
                ranks.spearman(a, b, 0.5), 1e-9);
        for (double r = -0.9; r <= 0.91; r += 0.3) {
            assertEquals(6 / Math.PI * Math.asin(r / 2), ranks.spearman(a, b, r), 1e-12);
            assertEquals(2 / Math.PI * Math.asin(r), ranks.kendall(a, b, r), 1e-12);
        }
    }
}
