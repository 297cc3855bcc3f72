package dev.standin.marginal;

import dev.standin.random.NormalQuantile;
import java.util.Arrays;

/**
 * A fast form of a marginal's Gaussian-copula map z ↦ F<sup>-1</sup>(Φ(z)) ({@link Marginal#fromLatent})
 * and of its quantile function, for the row sampler's inner loop. Four forms:
 * <ul>
 *   <li>linear: μ + σz for an untruncated normal, the expression the sampler always used;</li>
 *   <li>exact: the marginal's own functions where they are already cheap (the piecewise-linear
 *   {@code quantiles} table, discrete families too wide to tabulate) or where no table could be made
 *   accurate;</li>
 *   <li>steps, for distributions on whole numbers: F<sup>-1</sup>(Φ(z)) is a step function of z, so the
 *   latent thresholds t<sub>i</sub> where it steps from value i to i + 1 are found once by bisection
 *   over the doubles with the exact map itself, and a value is then a binary search of z among them.
 *   Within 1e-12·max(1, |t|) of a threshold the exact map is evaluated (the computed Φ is not
 *   monotone at the ulp level), so the result equals the exact map's (checked by test on millions of
 *   latents and next to every threshold);</li>
 *   <li>Chebyshev, for the other continuous families: z in [−{@value #Z_MAX}, {@value #Z_MAX}] is cut
 *   into cells of width {@value #CELL}, and in each the exact map (or its logarithm, where the values
 *   span orders of magnitude) is interpolated at the {@value #NODES} Chebyshev points of the first kind
 *   and evaluated by Clenshaw's recurrence (J. C. Mason and D. C. Handscomb, <i>Chebyshev Polynomials</i>,
 *   Chapman &amp; Hall 2003, sections 6.3 and 2.4.1; each step one {@link Math#fma}, which is exactly
 *   rounded on every JVM). A cell is kept only when it matches the exact map
 *   to {@value #TOLERANCE} relative at {@value #CHECKS} points between the nodes; otherwise, and outside
 *   the range (|z| &gt; 8.5 has probability 2e-17), the exact map is used.</li>
 * </ul>
 * Building uses only the exact maps (commons-math3 pure Java and {@link StrictMath}) and plain
 * arithmetic, and evaluation is plain arithmetic and {@link Math#fma} (IEEE 754 fusedMultiplyAdd,
 * correctly rounded by specification), so values are bit-identical on every JVM.
 * Instances are immutable.
 */
public abstract class LatentQuantile {

    /** Half-width of the tabulated latent range. */
    static final double Z_MAX = 8.5;

    /** Width of a Chebyshev cell. */
    static final double CELL = 0.5;

    /** Interpolation nodes per cell (degree + 1). */
    static final int NODES = 16;

    /** Check points per cell. */
    static final int CHECKS = 4;

    /** Largest relative difference from the exact map accepted at a check point. */
    static final double TOLERANCE = 2e-14;

    /** Step functions with more values than this are left exact (bisection per step costs setup time). */
    static final int MAX_STEPS = 4096;

    private LatentQuantile() {
    }

    /** F<sup>-1</sup>(Φ(z)) for a latent z. */
    public abstract double fromLatent(double z);

    /** F<sup>-1</sup>(p) for p in (0, 1): the value of a column outside the correlation block. */
    public abstract double quantile(double p);

    /**
     * {@link #fromLatent} of {@code z[0 .. n − 1]} into {@code out}: the same values, with one call per
     * block so the loop is compiled for this form alone.
     */
    public void fromLatent(double[] z, double[] out, int n) {
        for (int r = 0; r < n; r++) {
            out[r] = fromLatent(z[r]);
        }
    }

    /** The fast form of a marginal's maps; see the class comment. */
    public static LatentQuantile of(Marginal m) {
        if (m.isLinearInLatent()) {
            return new Linear(m);
        }
        if (m instanceof DiscreteTable t) {
            return t.size() - 1 <= MAX_STEPS ? Steps.build(t) : new Exact(m);
        }
        if (m.isDiscrete() || m instanceof QuantileTable) {
            return new Exact(m);
        }
        return Chebyshev.build(m);
    }

    /** A short name of the form chosen, for benchmarks and tests: linear, exact, steps or chebyshev. */
    public abstract String form();

    /** μ + σz. */
    private static final class Linear extends LatentQuantile {
        private final Marginal m;
        private final double mean;
        private final double sd;

        Linear(Marginal m) {
            this.m = m;
            this.mean = m.mean();
            this.sd = m.sd();
        }

        @Override
        public double fromLatent(double z) {
            return mean + sd * z;
        }

        @Override
        public void fromLatent(double[] z, double[] out, int n) {
            for (int r = 0; r < n; r++) {
                out[r] = mean + sd * z[r];
            }
        }

        @Override
        public double quantile(double p) {
            return m.quantile(p);
        }

        @Override
        public String form() {
            return "linear";
        }
    }

    /** The marginal's own maps. */
    private static final class Exact extends LatentQuantile {
        private final Marginal m;

        Exact(Marginal m) {
            this.m = m;
        }

        @Override
        public double fromLatent(double z) {
            return m.fromLatent(z);
        }

        @Override
        public void fromLatent(double[] z, double[] out, int n) {
            for (int r = 0; r < n; r++) {
                out[r] = m.fromLatent(z[r]);
            }
        }

        @Override
        public double quantile(double p) {
            return m.quantile(p);
        }

        @Override
        public String form() {
            return "exact";
        }
    }

    /** A step function of z through its latent thresholds. */
    private static final class Steps extends LatentQuantile {
        /**
         * Half-width of the band around each threshold, relative to max(1, |t|), where the exact map is
         * evaluated: the computed Φ is good to a few ulps, so the exact map's steps can only wobble
         * within about 1e-16·max(1, |t|) of t, far inside the band.
         */
        static final double BAND = 1e-12;

        private final Marginal m;
        /** thresholds[i]: the largest z whose value is at most values[i]. */
        private final double[] thresholds;
        private final double[] bandLow;
        private final double[] bandHigh;
        private final double[] values;

        private Steps(Marginal m, double[] thresholds, double[] values) {
            this.m = m;
            this.thresholds = thresholds;
            this.values = values;
            this.bandLow = new double[thresholds.length];
            this.bandHigh = new double[thresholds.length];
            for (int i = 0; i < thresholds.length; i++) {
                double w = BAND * Math.max(1.0, Math.abs(thresholds[i]));
                bandLow[i] = thresholds[i] - w;
                bandHigh[i] = thresholds[i] + w;
            }
        }

        static LatentQuantile build(DiscreteTable t) {
            double zLo = -40.0;
            double zHi = 40.0;
            double first = t.fromLatent(zLo);
            double last = t.fromLatent(zHi);
            double[] th = new double[t.size()];
            double[] vals = new double[t.size() + 1];
            int n = 0;
            vals[0] = first;
            double from = zLo;
            double current = first;
            while (current < last && n < th.length) {
                // the largest z in [from, zHi) whose value is still `current`
                double z = lastWithValueAtMost(t, current, from, zHi);
                double next = t.fromLatent(Math.nextUp(z));
                if (!(next > current)) {
                    return new Exact(t);
                }
                th[n++] = z;
                vals[n] = next;
                current = next;
                from = Math.nextUp(z);
            }
            if (current != last) {
                return new Exact(t);
            }
            Steps steps = new Steps(t, Arrays.copyOf(th, n), Arrays.copyOf(vals, n + 1));
            // outside the bands the exact map must be flat: check it at each band's edges
            for (int i = 0; i < n; i++) {
                if (t.fromLatent(Math.nextDown(steps.bandLow[i])) != vals[i] || t.fromLatent(Math.nextUp(steps.bandHigh[i])) != vals[i + 1]) {
                    return new Exact(t);
                }
            }
            return steps;
        }

        /** Bisection over the ordered doubles in [lo, hi] for the last z with fromLatent(z) ≤ v. */
        private static double lastWithValueAtMost(Marginal m, double v, double lo, double hi) {
            // invariant: value(lo) ≤ v < value(hi)
            while (true) {
                double mid = midpoint(lo, hi);
                if (mid == lo || mid == hi) {
                    return lo;
                }
                if (m.fromLatent(mid) <= v) {
                    lo = mid;
                } else {
                    hi = mid;
                }
            }
        }

        /** A double between a and b (a &lt; b) halving their distance in ulps, so bisection ends in ~64 steps. */
        private static double midpoint(double a, double b) {
            long ka = ordered(a);
            long kb = ordered(b);
            long km = ka + ((kb - ka) >>> 1);
            return unordered(km);
        }

        private static long ordered(double x) {
            long bits = Double.doubleToRawLongBits(x + 0.0);
            return bits < 0 ? -(bits & Long.MAX_VALUE) : bits;
        }

        private static double unordered(long k) {
            return k < 0 ? Double.longBitsToDouble((-k) | Long.MIN_VALUE) : Double.longBitsToDouble(k);
        }

        @Override
        public double fromLatent(double z) {
            if (z != z) {
                return m.fromLatent(z);
            }
            // the number of thresholds below z: the index of the first threshold ≥ z
            int lo = 0;
            int hi = thresholds.length;
            while (lo < hi) {
                int mid = (lo + hi) >>> 1;
                if (thresholds[mid] < z) {
                    lo = mid + 1;
                } else {
                    hi = mid;
                }
            }
            if ((lo < thresholds.length && z >= bandLow[lo]) || (lo > 0 && z <= bandHigh[lo - 1])) {
                return m.fromLatent(z);
            }
            return values[lo];
        }

        @Override
        public void fromLatent(double[] z, double[] out, int n) {
            for (int r = 0; r < n; r++) {
                out[r] = fromLatent(z[r]);
            }
        }

        @Override
        public double quantile(double p) {
            return m.quantile(p);
        }

        @Override
        public String form() {
            return "steps";
        }
    }

    /** Piecewise Chebyshev interpolation of the map (or of a logarithm) on latent cells. */
    private static final class Chebyshev extends LatentQuantile {
        /** x itself. */
        private static final int IDENTITY = 0;
        /** log x, for values spanning orders of magnitude above 0. */
        private static final int LOG = 1;
        /** log(U − x), for values crowding the support's finite upper end U. */
        private static final int UPPER_LOG = 2;
        private static final int FALLBACK = 3;

        private final Marginal m;
        private final int[] mode;
        /** Coefficients, NODES per cell. */
        private final double[] coef;
        private final int cells;
        private final double upperEnd;

        private Chebyshev(Marginal m, int[] mode, double[] coef, double upperEnd) {
            this.m = m;
            this.mode = mode;
            this.coef = coef;
            this.cells = mode.length;
            this.upperEnd = upperEnd;
        }

        /**
         * The support's upper end where it is finite and values can crowd it (beta: 1), else NaN. The
         * accuracy asked of a table is then also relative to U − x, so 1 − x keeps its digits.
         */
        private static double upperEnd(Marginal m) {
            return m instanceof BetaMarginal ? 1.0 : Double.NaN;
        }

        static LatentQuantile build(Marginal m) {
            int cells = (int) StrictMath.round(2 * Z_MAX / CELL);
            double upper = upperEnd(m);
            int[] mode = new int[cells];
            double[] coef = new double[cells * NODES];
            double[] x = new double[NODES];
            double[] f = new double[NODES];
            double[] c = new double[NODES];
            double[] nodeCos = new double[NODES];
            double[][] cosTable = new double[NODES][NODES];
            for (int j = 0; j < NODES; j++) {
                nodeCos[j] = StrictMath.cos(StrictMath.PI * (j + 0.5) / NODES);
                for (int k = 0; k < NODES; k++) {
                    cosTable[k][j] = StrictMath.cos(StrictMath.PI * k * (j + 0.5) / NODES);
                }
            }
            double[] checkT = new double[CHECKS + 2];
            double[] checkX = new double[CHECKS + 2];
            int kept = 0;
            for (int cell = 0; cell < cells; cell++) {
                double a = -Z_MAX + cell * CELL;
                double mid = a + CELL / 2;
                boolean positive = true;
                boolean belowUpper = upper == upper;
                for (int j = 0; j < NODES; j++) {
                    x[j] = m.fromLatent(mid + CELL / 2 * nodeCos[j]);
                    positive &= x[j] > 0 && Double.isFinite(x[j]);
                    belowUpper &= upper - x[j] > 0;
                }
                for (int i = 0; i < checkT.length; i++) {
                    // points off the nodes, spread over the cell, and both ends, where the error peaks
                    double t = i < CHECKS ? -1.0 + (2.0 * i + 1.0) / CHECKS - 0.37 / CHECKS : (i == CHECKS ? -1.0 : 1.0);
                    checkT[i] = t;
                    checkX[i] = m.fromLatent(mid + CELL / 2 * t);
                }
                mode[cell] = FALLBACK;
                for (int form = IDENTITY; form <= UPPER_LOG; form++) {
                    if ((form == LOG && !positive) || (form == UPPER_LOG && !belowUpper)) {
                        continue;
                    }
                    for (int j = 0; j < NODES; j++) {
                        f[j] = form == LOG ? StrictMath.log(x[j]) : form == UPPER_LOG ? StrictMath.log(upper - x[j]) : x[j];
                    }
                    coefficients(f, cosTable, c);
                    if (accurate(c, form, upper, checkT, checkX)) {
                        mode[cell] = form;
                        System.arraycopy(c, 0, coef, cell * NODES, NODES);
                        kept++;
                        break;
                    }
                }
            }
            if (kept == 0) {
                return new Exact(m);
            }
            return new Chebyshev(m, mode, coef, upper);
        }

        /** c<sub>k</sub> = (2/n) Σ<sub>j</sub> f<sub>j</sub> T<sub>k</sub>(x<sub>j</sub>), c<sub>0</sub> halved (Mason and Handscomb eq. 6.27). */
        private static void coefficients(double[] f, double[][] cosTable, double[] c) {
            int n = f.length;
            for (int k = 0; k < n; k++) {
                double s = 0;
                for (int j = 0; j < n; j++) {
                    s += f[j] * cosTable[k][j];
                }
                c[k] = (k == 0 ? 1.0 : 2.0) * s / n;
            }
        }

        /**
         * Within {@link #TOLERANCE} of x, and with a finite upper end U within {@value #UPPER_TOLERANCE} of
         * U − x, at every check point.
         */
        private static boolean accurate(double[] c, int form, double upper, double[] checkT, double[] checkX) {
            for (int i = 0; i < checkT.length; i++) {
                double exact = checkX[i];
                double error = Math.abs(evaluate(c, 0, checkT[i], form, upper) - exact);
                if (!(error <= TOLERANCE * Math.abs(exact))) {
                    return false;
                }
                if (upper == upper && !(error <= UPPER_TOLERANCE * (upper - exact))) {
                    return false;
                }
            }
            return true;
        }

        /** Largest difference accepted relative to the distance from the support's upper end. */
        static final double UPPER_TOLERANCE = 1e-13;

        /** Clenshaw's recurrence for Σ c<sub>k</sub> T<sub>k</sub>(t), then back from the cell's form. */
        private static double evaluate(double[] c, int off, double t, int form, double upper) {
            double t2 = 2 * t;
            double b1 = 0;
            double b2 = 0;
            for (int k = NODES - 1; k >= 1; k--) {
                // one fused multiply-add per step: exact IEEE 754 fma, the same bits on every JVM
                double b0 = Math.fma(t2, b1, c[off + k] - b2);
                b2 = b1;
                b1 = b0;
            }
            double y = Math.fma(t, b1, c[off] - b2);
            if (form == IDENTITY) {
                return y;
            }
            return form == LOG ? StrictMath.exp(y) : upper - StrictMath.exp(y);
        }

        @Override
        public double fromLatent(double z) {
            double u = (z + Z_MAX) * (1.0 / CELL);
            if (!(u >= 0 && u < cells)) {
                return m.fromLatent(z);
            }
            int cell = (int) u;
            int form = mode[cell];
            if (form == FALLBACK) {
                return m.fromLatent(z);
            }
            double t = 2 * (u - cell) - 1;
            return evaluate(coef, cell * NODES, t, form, upperEnd);
        }

        @Override
        public void fromLatent(double[] z, double[] out, int n) {
            for (int r = 0; r < n; r++) {
                out[r] = fromLatent(z[r]);
            }
        }

        @Override
        public double quantile(double p) {
            return fromLatent(NormalQuantile.of(p));
        }

        @Override
        public String form() {
            return "chebyshev";
        }
    }
}
