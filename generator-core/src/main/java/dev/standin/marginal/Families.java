package dev.standin.marginal;

import org.apache.commons.math3.special.Gamma;
import org.apache.commons.math3.util.FastMath;

/**
 * Static factories for every marginal family, in the parameterisations a spec offers. Each factory
 * checks its parameters ("name must be ...: value") and throws {@link IllegalArgumentException}.
 */
public final class Families {

    private Families() {
    }

    // ---- discrete ---------------------------------------------------------------------------

    /** Poisson(mean): P(k) = e<sup>−λ</sup>λ<sup>k</sup>/k!. */
    public static DiscreteTable poisson(double mean) {
        Checks.positive("mean", mean);
        if (mean > 1e9) {
            throw new IllegalArgumentException("mean must be at most 1e9: " + Checks.text(mean));
        }
        double sd = StrictMath.sqrt(mean);
        long lo = (long) Math.max(0, Math.floor(mean - 40 * sd - 40));
        long hi = (long) Math.ceil(mean + 40 * sd + 40);
        double logMean = FastMath.log(mean);
        double[] w = table(lo, hi, k -> FastMath.exp(k * logMean - mean - Gamma.logGamma(k + 1.0)));
        long[] start = {lo};
        w = DiscreteTable.trim(w, start);
        return new DiscreteTable("poisson", start[0], w);
    }

    /** Binomial(trials, p). */
    public static DiscreteTable binomial(long trials, double p) {
        if (trials < 1 || trials > 1_000_000_000L) {
            throw new IllegalArgumentException("trials must be a whole number from 1 to 1e9: " + trials);
        }
        Checks.probability("p", p);
        double mean = trials * p;
        double sd = StrictMath.sqrt(trials * p * (1 - p));
        long lo = (long) Math.max(0, Math.floor(mean - 40 * sd - 40));
        long hi = (long) Math.min(trials, Math.ceil(mean + 40 * sd + 40));
        double[] w;
        if (p == 0.0 || p == 1.0) {
            lo = p == 0.0 ? 0 : trials;
            w = new double[] {1.0};
        } else {
            double lp = FastMath.log(p);
            double lq = FastMath.log1p(-p);
            double lgN = Gamma.logGamma(trials + 1.0);
            w = table(lo, hi, k -> FastMath.exp(lgN - Gamma.logGamma(k + 1.0) - Gamma.logGamma(trials - k + 1.0)
                    + k * lp + (trials - k) * lq));
        }
        long[] start = {lo};
        w = DiscreteTable.trim(w, start);
        return new DiscreteTable("binomial", start[0], w);
    }

    /**
     * Negative binomial with size r &gt; 0 (real) and success probability p: P(k) = Γ(k + r)/(Γ(r) k!)
     * p<sup>r</sup>(1 − p)<sup>k</sup>, mean r(1 − p)/p, variance r(1 − p)/p².
     */
    public static DiscreteTable negativeBinomial(double size, double p) {
        Checks.positive("size", size);
        Checks.finite("p", p);
        if (!(p > 0 && p < 1)) {
            throw new IllegalArgumentException("p must be in (0, 1): " + Checks.text(p));
        }
        double mean = size * (1 - p) / p;
        double sd = StrictMath.sqrt(size * (1 - p)) / p;
        long hi = (long) Math.ceil(mean + 80 * sd + 80);
        if (hi > DiscreteTable.MAX_SIZE * 4L) {
            throw new IllegalArgumentException("the distribution is too wide to tabulate (mean " + Checks.text(mean) + ", sd " + Checks.text(sd) + ")");
        }
        double lp = FastMath.log(p);
        double lq = FastMath.log1p(-p);
        double lgR = Gamma.logGamma(size);
        double[] w = table(0, hi, k -> FastMath.exp(Gamma.logGamma(k + size) - lgR - Gamma.logGamma(k + 1.0)
                + size * lp + k * lq));
        long[] start = {0};
        w = DiscreteTable.trim(w, start);
        return new DiscreteTable("negbinomial", start[0], w);
    }

    /** Negative binomial from its mean and sd (sd² &gt; mean): p = mean/sd², size = mean²/(sd² − mean). */
    public static DiscreteTable negativeBinomialFromMoments(double mean, double sd) {
        Checks.positive("mean", mean);
        Checks.positive("sd", sd);
        double var = sd * sd;
        if (!(var > mean)) {
            throw new IllegalArgumentException("sd² must be > mean for a negative binomial (else use poisson): sd² = "
                    + Checks.text(var) + ", mean = " + Checks.text(mean));
        }
        return negativeBinomial(mean * mean / (var - mean), mean / var);
    }

    /** Bernoulli(p), written as true/false. */
    public static DiscreteTable bernoulli(double p) {
        Checks.probability("p", p);
        return new Labelled("bernoulli", 0, new double[] {1 - p, p}, null, ValueKind.BOOLEAN);
    }

    /** Categorical over the labels with the given (positive) weights, levels in the order given. */
    public static DiscreteTable categorical(String[] labels, double[] weights) {
        if (labels.length == 0 || labels.length != weights.length) {
            throw new IllegalArgumentException("levels must name at least one label");
        }
        for (double w : weights) {
            Checks.finite("weight", w);
            if (!(w > 0)) {
                throw new IllegalArgumentException("weight must be > 0: " + Checks.text(w));
            }
        }
        return new Labelled("categorical", 0, weights.clone(), labels.clone(), ValueKind.LABEL);
    }

    private static double[] table(long lo, long hi, java.util.function.LongToDoubleFunction f) {
        long n = hi - lo + 1;
        if (n > DiscreteTable.MAX_SIZE) {
            throw new IllegalArgumentException("the distribution is too wide to tabulate: " + n + " values (limit "
                    + DiscreteTable.MAX_SIZE + ")");
        }
        double[] w = new double[(int) n];
        for (int i = 0; i < n; i++) {
            w[i] = f.applyAsDouble(lo + i);
        }
        return w;
    }

    /** A table whose values are written as labels or booleans. */
    static final class Labelled extends DiscreteTable {
        private final String[] labels;
        private final ValueKind kind;

        Labelled(String family, long lo, double[] weights, String[] labels, ValueKind kind) {
            super(family, lo, weights);
            this.labels = labels;
            this.kind = kind;
        }

        @Override
        protected DiscreteTable withTable(long newLo, double[] weights) {
            throw new IllegalArgumentException(family() + " columns take no min or max");
        }

        @Override
        public ValueKind valueKind() {
            return kind;
        }

        @Override
        public String label(int level) {
            if (labels == null) {
                return level == 1 ? "true" : "false";
            }
            return labels[level];
        }

        /** The number of levels. */
        public int levels() {
            return labels == null ? 2 : labels.length;
        }
    }

    // ---- continuous -------------------------------------------------------------------------

    /** Lognormal with log-scale parameters: X = exp(μ + σZ). */
    public static Marginal lognormal(double meanlog, double sdlog) {
        return new Lognormal(Checks.finite("meanlog", meanlog), Checks.positive("sdlog", sdlog));
    }

    /** Lognormal with the mean and sd of the variable: σ² = ln(1 + sd²/mean²), μ = ln(mean) − σ²/2. */
    public static Marginal lognormalFromMoments(double mean, double sd) {
        Checks.positive("mean", mean);
        Checks.positive("sd", sd);
        double s2 = FastMath.log1p((sd / mean) * (sd / mean));
        return new Lognormal(FastMath.log(mean) - s2 / 2, StrictMath.sqrt(s2));
    }

    /** Exponential with the given rate λ (mean 1/λ). */
    public static Marginal exponential(double rate) {
        return new Exponential(Checks.positive("rate", rate));
    }

    /** Weibull with shape k and scale λ: F(x) = 1 − exp(−(x/λ)<sup>k</sup>). */
    public static Marginal weibull(double shape, double scale) {
        return new Weibull(Checks.positive("shape", shape), Checks.positive("scale", scale));
    }

    /** Triangular on [min, max] with the given mode. */
    public static Marginal triangular(double min, double mode, double max) {
        Checks.finite("min", min);
        Checks.finite("mode", mode);
        Checks.finite("max", max);
        if (!(min < max) || mode < min || mode > max) {
            throw new IllegalArgumentException("triangular needs min <= mode <= max and min < max: " + Checks.text(min) + ", " + Checks.text(mode) + ", " + Checks.text(max));
        }
        return new Triangular(min, mode, max);
    }

    /** Gamma with shape and scale. */
    public static Marginal gamma(double shape, double scale) {
        return new GammaMarginal(Checks.positive("shape", shape), Checks.positive("scale", scale));
    }

    /** Gamma from its mean and sd: shape = mean²/sd², scale = sd²/mean. */
    public static Marginal gammaFromMoments(double mean, double sd) {
        Checks.positive("mean", mean);
        Checks.positive("sd", sd);
        return gamma(mean * mean / (sd * sd), sd * sd / mean);
    }

    /** Beta(α, β) on [0, 1]. */
    public static Marginal beta(double alpha, double beta) {
        return new BetaMarginal(Checks.positive("alpha", alpha), Checks.positive("beta", beta));
    }

    /** Beta from its mean in (0, 1) and sd: ν = mean(1 − mean)/sd² − 1 must be &gt; 0, α = mean·ν, β = (1 − mean)ν. */
    public static Marginal betaFromMoments(double mean, double sd) {
        Checks.finite("mean", mean);
        if (!(mean > 0 && mean < 1)) {
            throw new IllegalArgumentException("mean must be in (0, 1): " + Checks.text(mean));
        }
        Checks.positive("sd", sd);
        double nu = mean * (1 - mean) / (sd * sd) - 1;
        if (!(nu > 0)) {
            throw new IllegalArgumentException("sd must be < √(mean(1 − mean)) = " + Checks.text(StrictMath.sqrt(mean * (1 - mean))) + ": " + Checks.text(sd));
        }
        return beta(mean * nu, (1 - mean) * nu);
    }

    /** A piecewise-linear quantile function through (probability, value) points, 0 and 1 included. */
    public static Marginal quantiles(double[] probabilities, double[] values) {
        return new QuantileTable(probabilities, values);
    }

    /** Uniform over the days from .. to (inclusive), as day counts from 1970-01-01. */
    public static Marginal dates(long fromDay, long toDay) {
        if (toDay < fromDay) {
            throw new IllegalArgumentException("to must not be before from");
        }
        return new DiscreteUniform("date", fromDay, toDay, ValueKind.DATE);
    }

    /** Uniform over the seconds from .. to (inclusive), as second counts from 1970-01-01T00:00:00Z. */
    public static Marginal timestamps(long fromSecond, long toSecond) {
        if (toSecond < fromSecond) {
            throw new IllegalArgumentException("to must not be before from");
        }
        return new DiscreteUniform("timestamp", fromSecond, toSecond, ValueKind.TIMESTAMP);
    }

    /** A continuous marginal truncated to [min, max] by inversion on [F(min), F(max)]. */
    public static Marginal truncate(Marginal base, double min, double max) {
        if (min == Double.NEGATIVE_INFINITY && max == Double.POSITIVE_INFINITY) {
            return base;
        }
        if (base instanceof DiscreteTable t) {
            return t.truncated(min, max);
        }
        if (base instanceof NormalMarginal n) {
            return NormalMarginal.truncated(n.mu(), n.sigma(), min, max);
        }
        if (base instanceof QuantileTable q) {
            return q.truncated(min, max);
        }
        if (base instanceof DiscreteUniform) {
            throw new IllegalArgumentException(base.family() + " columns take from and to, not min and max");
        }
        return new TruncatedContinuous(base, min, max);
    }
}
