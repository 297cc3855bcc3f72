package dev.standin.marginal;

import dev.standin.random.NormalQuantile;
import org.apache.commons.math3.special.Erf;
import org.apache.commons.math3.util.FastMath;

/**
 * Φ, φ and Φ<sup>-1</sup> of the standard normal. Φ uses commons-math3's {@link Erf#erfc(double)}
 * (a continued fraction for the incomplete gamma function in pure Java, so bit-identical on every
 * JVM); Φ<sup>-1</sup> is {@link NormalQuantile} (Wichura's AS 241).
 */
public final class StandardNormal {

    private static final double SQRT_HALF = 0.70710678118654752440;
    private static final double INV_SQRT_2PI = 0.39894228040143267794;

    private StandardNormal() {
    }

    public static double cdf(double x) {
        if (x == Double.NEGATIVE_INFINITY) {
            return 0.0;
        }
        if (x == Double.POSITIVE_INFINITY) {
            return 1.0;
        }
        return 0.5 * Erf.erfc(-x * SQRT_HALF);
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
