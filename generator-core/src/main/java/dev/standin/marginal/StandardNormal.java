package dev.standin.marginal;

import dev.standin.random.NormalQuantile;
import org.apache.commons.math3.special.Erf;
import org.apache.commons.math3.special.Gamma;
import org.apache.commons.math3.util.FastMath;

/**
 * Φ, φ and Φ<sup>-1</sup> of the standard normal. Φ is commons-math3's {@link Erf#erfc(double)}
 * (the regularized incomplete gamma function Q(1/2, x²): a power series below x² = 3/2, Lentz's
 * continued fraction above it, in pure Java, so bit-identical on every JVM), computed by
 * {@link #erfc(double)}; Φ<sup>-1</sup> is {@link NormalQuantile} (Wichura's AS 241).
 */
public final class StandardNormal {

    private static final double SQRT_HALF = 0.70710678118654752440;
    private static final double INV_SQRT_2PI = 0.39894228040143267794;
    /** ln Γ(1/2) as commons-math3 computes it, so {@link #erfc} multiplies by the same double. */
    private static final double LOG_GAMMA_HALF = Gamma.logGamma(0.5);
    /** The series' and the continued fraction's tolerance in {@link Erf#erfc(double)}. */
    private static final double EPSILON = 1.0e-15;
    /** The iteration limit in {@link Erf#erfc(double)}. */
    private static final int MAX_ITERATIONS = 10000;
    /** The continued fraction's substitute for a zero denominator ({@code ContinuedFraction}'s). */
    private static final double SMALL = 1e-50;

    private StandardNormal() {
    }

    public static double cdf(double x) {
        if (x == Double.NEGATIVE_INFINITY) {
            return 0.0;
        }
        if (x == Double.POSITIVE_INFINITY) {
            return 1.0;
        }
        return 0.5 * erfc(-x * SQRT_HALF);
    }

    /**
     * {@link Erf#erfc(double)} of commons-math3 3.6.1, the same floating-point operations in the same
     * order, specialised to the one shape parameter it uses: erfc(x) = Q(1/2, x²) for x ≥ 0 and
     * 2 − Q(1/2, x²) below, where Q(a, t) is {@code Gamma.regularizedGammaQ(a, t, 1e-15, 10000)}: for
     * t &lt; a + 1, 1 − P(a, t) by P's power series (Abramowitz and Stegun 6.5.29, from memory);
     * otherwise the continued fraction of Q (A&amp;S 6.5.31, from memory) by the modified Lentz
     * method ({@code ContinuedFraction}, Lentz 1976). The specialisation drops the argument checks, the continued fraction's object and
     * virtual calls, and ln Γ(1/2) per call ({@link #LOG_GAMMA_HALF}); its zero tests
     * {@code Precision.equals(v, 0.0, 1e-50)} are |v| ≤ 10<sup>−50</sup>, the same set of doubles.
     * Every result is the library's bits ({@code StandardNormalTest} compares millions), which keeps
     * NORTA's latent correlations, the quantile tables and so every output byte as they were.
     * NORTA's smooth-by-step cross moments call it tens of thousands of times in a cold JVM (the
     * README's Performance section has the measured effect). A case the library would reject (no
     * convergence) goes to the library.
     */
    static double erfc(double x) {
        if (FastMath.abs(x) > 40) {
            return x > 0 ? 0 : 2;
        }
        double t = x * x;
        double q;
        if (t == 0.0) {
            q = 1.0;
        } else if (t < 1.5) {
            q = 1.0 - seriesP(t);
        } else {
            double h = continuedFraction(t);
            if (Double.isNaN(h)) {
                return Erf.erfc(x);
            }
            q = 1.0 / h;
            q = FastMath.exp(-t + (0.5 * FastMath.log(t)) - LOG_GAMMA_HALF) * q;
        }
        return x < 0 ? 2 - q : q;
    }

    /** P(1/2, t) for 0 &lt; t &lt; 3/2 by its power series, as {@code Gamma.regularizedGammaP}. */
    private static double seriesP(double t) {
        double n = 0.0;
        double an = 1.0 / 0.5;
        double sum = an;
        while (FastMath.abs(an / sum) > EPSILON && n < MAX_ITERATIONS && sum < Double.POSITIVE_INFINITY) {
            n += 1.0;
            an *= t / (0.5 + n);
            sum += an;
        }
        // for t < 3/2 the terms fall geometrically: the limit and an infinite sum are out of reach
        return FastMath.exp(-t + (0.5 * FastMath.log(t)) - LOG_GAMMA_HALF) * sum;
    }

    /**
     * The continued fraction of Q(1/2, t) for t ≥ 3/2 by {@code ContinuedFraction.evaluate}'s modified
     * Lentz steps, with a<sub>n</sub> = 2n + 1 − 1/2 + t and b<sub>n</sub> = n(1/2 − n); NaN where that
     * method would throw (divergence or no convergence in 10,000 terms).
     */
    private static double continuedFraction(double t) {
        double hPrev = ((2.0 * 0) + 1.0) - 0.5 + t;
        if (FastMath.abs(hPrev) <= SMALL) {
            hPrev = SMALL;
        }
        int n = 1;
        double dPrev = 0.0;
        double cPrev = hPrev;
        double hN = hPrev;
        while (n < MAX_ITERATIONS) {
            double a = ((2.0 * n) + 1.0) - 0.5 + t;
            double b = n * (0.5 - n);
            double dN = a + b * dPrev;
            if (FastMath.abs(dN) <= SMALL) {
                dN = SMALL;
            }
            double cN = a + b / cPrev;
            if (FastMath.abs(cN) <= SMALL) {
                cN = SMALL;
            }
            dN = 1 / dN;
            double deltaN = cN * dN;
            hN = hPrev * deltaN;
            if (Double.isInfinite(hN) || Double.isNaN(hN)) {
                return Double.NaN;
            }
            if (FastMath.abs(deltaN - 1.0) < EPSILON) {
                break;
            }
            dPrev = dN;
            cPrev = cN;
            hPrev = hN;
            n++;
        }
        return n >= MAX_ITERATIONS ? Double.NaN : hN;
    }

    /** 1 - Φ(x), accurate in the upper tail. */
    public static double survival(double x) {
        return cdf(-x);
    }

    public static double density(double x) {
        if (Double.isInfinite(x)) {
            return 0.0;
        }
        return INV_SQRT_2PI * FastMath.exp(-0.5 * x * x);
    }

    public static double quantile(double p) {
        return NormalQuantile.of(p);
    }
}
