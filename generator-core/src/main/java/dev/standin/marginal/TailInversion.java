package dev.standin.marginal;

import java.util.function.DoubleUnaryOperator;
import org.apache.commons.math3.analysis.solvers.BrentSolver;

/**
 * Quantiles by root finding that stay accurate in both tails: below the median it solves F(x) = p,
 * above it S(x) = 1 − p with the survival function S computed directly (never as 1 − F, which
 * loses every digit near 1). Brent's method (commons-math3 {@link BrentSolver}) to a relative
 * accuracy of 1e-15 on a bracket found by doubling. Library quantiles that solve F(x) = p alone
 * return wild values above 1 − 1e-15 (seen: the gamma(6.25, 4.8) "quantile" of 1 − 1e-15 was 1.9e8).
 */
final class TailInversion {

    private TailInversion() {
    }

    /** The x with S(x) = q for an upper-tail probability q &lt; 0.5, S accurate in the upper tail. */
    static double upper(double q, DoubleUnaryOperator survival, double lower, double upper, double start) {
        return quantile(0.75, x -> 1 - survival.applyAsDouble(x), survival, lower, upper, start, q);
    }

    static double quantile(double p, DoubleUnaryOperator cdf, DoubleUnaryOperator survival, double lower, double upper,
                           double start) {
        return quantile(p, cdf, survival, lower, upper, start, 1 - p);
    }

    /**
     * @param cdf F
     * @param survival S = 1 − F, accurate in the upper tail
     * @param lower the support's lower end (finite)
     * @param upper the support's upper end (may be infinite)
     * @param start a point inside the support (e.g. the mean) for the bracket search
     * @param q the upper-tail probability, used when p &gt; 0.5 (given separately to keep its digits)
     */
    private static double quantile(double p, DoubleUnaryOperator cdf, DoubleUnaryOperator survival, double lower,
                                   double upper, double start, double q) {
        if (p <= 0) {
            return lower;
        }
        if (p >= 1) {
            return upper;
        }
        boolean upperTail = p > 0.5;
        if (upperTail && !(q > 0)) {
            return upper;
        }
        // (F − p)/(F + p) rather than F − p: the same sign and root, but O(1) near the root however
        // small p is, so Brent's sign test f(a)·f(b) < 0 cannot underflow to zero (it did for the
        // gamma's upper tail below 1e-300, throwing NoBracketingException)
        DoubleUnaryOperator f = upperTail ? x -> relative(q, survival.applyAsDouble(x))
                : x -> -relative(p, cdf.applyAsDouble(x));
        double hi = Math.min(Math.max(start, lower), upper);
        if (upper == Double.POSITIVE_INFINITY) {
            double step = Math.max(Math.abs(start), 1.0);
            while (f.applyAsDouble(hi) < 0) {
                hi += step;
                step *= 2;
                if (!Double.isFinite(hi)) {
                    return Double.MAX_VALUE;
                }
            }
        } else {
            hi = upper;
        }
        double lo = lower;
        if (f.applyAsDouble(lo) >= 0) {
            return lo;
        }
        if (f.applyAsDouble(hi) <= 0) {
            return hi;
        }
        // absolute accuracy MIN_VALUE, not MIN_NORMAL: quantiles near 1e-308 (gamma or beta with shape
        // below 1, far lower tail) must still come out increasing in p
        BrentSolver solver = new BrentSolver(1e-15, Double.MIN_VALUE, 0.0);
        return solver.solve(10_000, f::applyAsDouble, lo, hi);
    }

    /** (target − value)/(target + value): negative when value exceeds target, in [−1, 1]. */
    private static double relative(double target, double value) {
        return (target - value) / (target + value);
    }
}
