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

    @Override
    public double quantile(double p) {
        double x = p < split ? a + StrictMath.sqrt(p * (b - a) * (c - a)) : b - StrictMath.sqrt((1 - p) * (b - a) * (b - c));
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
        return x <= c ? (x - a) * (x - a) / ((b - a) * (c - a)) : 1 - (b - x) * (b - x) / ((b - a) * (b - c));
    }

    @Override
    public double survival(double x) {
        if (x <= a) {
            return 1.0;
        }
        if (x >= b) {
            return 0.0;
        }
        return x <= c ? 1 - (x - a) * (x - a) / ((b - a) * (c - a)) : (b - x) * (b - x) / ((b - a) * (b - c));
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
