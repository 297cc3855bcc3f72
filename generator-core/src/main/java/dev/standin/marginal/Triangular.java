package dev.standin.marginal;

/**
 * The triangular distribution on [a, b] with mode c: F<sup>-1</sup>(p) = a + √(p(b − a)(c − a)) for
 * p &lt; (c − a)/(b − a), else b − √((1 − p)(b − a)(b − c)); mean (a + b + c)/3, variance
 * (a² + b² + c² − ab − ac − bc)/18 (Johnson, Kotz and Balakrishnan, <i>Continuous Univariate
 * Distributions</i> vol. 2, 2nd ed. 1995, chapter 26).
 */
final class Triangular implements Marginal {

    private final double a;
    private final double c;
    private final double b;
    private final double split;

    Triangular(double a, double c, double b) {
        this.a = a;
        this.c = c;
        this.b = b;
        this.split = (c - a) / (b - a);
    }

    @Override
    public String family() {
        return "triangular";
    }

    /**
     * In the upper piece below the median (a mode near min) b − √((1 − p)DE), D = b − a, E = b − c,
     * cancels; there it is taken as a + D(c − a + pE)/(D + √((1 − p)DE)), the same number rearranged
     * (multiply by the conjugate), which keeps the digits of a small p.
     */
    @Override
    public double quantile(double p) {
        double d = b - a;
        double x;
        if (p < split) {
            x = a + StrictMath.sqrt(p * d * (c - a));
        } else if (p < 0.5) {
            double e = b - c;
            x = a + d * ((c - a) + p * e) / (d + StrictMath.sqrt((1 - p) * d * e));
        } else {
            x = b - StrictMath.sqrt((1 - p) * d * (b - c));
        }
        return Math.min(Math.max(x, a), b);
    }

    /**
     * The quantile for an upper-tail probability q, from q itself (1 − q loses q's digits below 1e-16):
     * b − √(qDE) in the upper piece, and b − D(b − c + qF)/(D + √((1 − q)DF)), F = c − a, in the lower
     * piece (the conjugate form of a + √((1 − q)DF), for a mode near max).
     */
    @Override
    public double upperQuantile(double q) {
        double d = b - a;
        double x;
        if (q < 1 - split) {
            x = b - StrictMath.sqrt(q * d * (b - c));
        } else if (q < 0.5) {
            double f = c - a;
            x = b - d * ((b - c) + q * f) / (d + StrictMath.sqrt((1 - q) * d * f));
        } else {
            return quantile(1 - q);
        }
        return Math.min(Math.max(x, a), b);
    }

    @Override
    public double cdf(double x) {
        if (x <= a) {
            return 0.0;
        }
        if (x >= b) {
            return 1.0;
        }
        // above the mode 1 − (b − x)²/(DE) = ((x − a)E + (b − x)(x − c))/(DE): two non-negative terms,
        // no cancellation when the mode is near min and F is small
        return x <= c ? (x - a) * (x - a) / ((b - a) * (c - a))
                : ((x - a) * (b - c) + (b - x) * (x - c)) / ((b - a) * (b - c));
    }

    @Override
    public double survival(double x) {
        if (x <= a) {
            return 1.0;
        }
        if (x >= b) {
            return 0.0;
        }
        // below the mode 1 − (x − a)²/(DF) = ((b − x)F + (x − a)(c − x))/(DF), F = c − a (as in cdf)
        return x <= c ? ((b - x) * (c - a) + (x - a) * (c - x)) / ((b - a) * (c - a))
                : (b - x) * (b - x) / ((b - a) * (b - c));
    }

    @Override
    public double mean() {
        return (a + b + c) / 3;
    }

    @Override
    public double sd() {
        return StrictMath.sqrt((a * a + b * b + c * c - a * b - a * c - b * c) / 18);
    }
}
