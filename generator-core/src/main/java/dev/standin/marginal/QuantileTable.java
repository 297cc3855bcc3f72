package dev.standin.marginal;

/**
 * A distribution given by a piecewise-linear quantile function through points (p<sub>i</sub>,
 * v<sub>i</sub>) with p<sub>0</sub> = 0 and p<sub>n</sub> = 1, strictly increasing in both: the density
 * is constant between consecutive values. Mean Σ Δp (v<sub>i</sub> + v<sub>i+1</sub>)/2 and second
 * moment Σ Δp (v<sub>i</sub>² + v<sub>i</sub>v<sub>i+1</sub> + v<sub>i+1</sub>²)/3 (uniform on each piece).
 */
final class QuantileTable implements Marginal {

    private final double[] p;
    private final double[] v;
    private final double mean;
    private final double sd;

    QuantileTable(double[] probabilities, double[] values) {
        if (probabilities.length < 2 || probabilities.length != values.length) {
            throw new IllegalArgumentException("points must give at least two probabilities with values");
        }
        if (probabilities[0] != 0.0 || probabilities[probabilities.length - 1] != 1.0) {
            throw new IllegalArgumentException("points must include probabilities 0 and 1");
        }
        for (int i = 0; i < values.length; i++) {
            Checks.finite("value", values[i]);
            if (i > 0 && !(probabilities[i] > probabilities[i - 1])) {
                throw new IllegalArgumentException("point probabilities must be strictly increasing: " + probabilities[i]);
            }
            if (i > 0 && !(values[i] > values[i - 1])) {
                throw new IllegalArgumentException("point values must be strictly increasing: " + values[i]);
            }
        }
        this.p = probabilities.clone();
        this.v = values.clone();
        double m = 0;
        double m2 = 0;
        for (int i = 0; i + 1 < p.length; i++) {
            double dp = p[i + 1] - p[i];
            m += dp * (v[i] + v[i + 1]) / 2;
            m2 += dp * (v[i] * v[i] + v[i] * v[i + 1] + v[i + 1] * v[i + 1]) / 3;
        }
        this.mean = m;
        this.sd = StrictMath.sqrt(Math.max(m2 - m * m, 0));
    }

    /**
     * The table truncated to [min, max]: again piecewise linear, through (0, max(min, v<sub>0</sub>)), the
     * points strictly inside, and (1, min(max, v<sub>n</sub>)), with probabilities rescaled to
     * (p − F(min))/(F(max) − F(min)); so its moments stay exact (integrating the quantile function
     * numerically across its kinks was only good to about 1e-4).
     */
    Marginal truncated(double min, double max) {
        if (!(min < max)) {
            throw new IllegalArgumentException("min must be < max: " + Checks.text(min) + " >= " + Checks.text(max));
        }
        double lo = Math.max(min, v[0]);
        double hi = Math.min(max, v[v.length - 1]);
        double fLo = cdf(lo);
        double fHi = cdf(hi);
        if (!(hi > lo) || !(fHi - fLo > 1e-12)) {
            throw new IllegalArgumentException("min and max leave (almost) no probability to sample: [" + Checks.text(min)
                    + ", " + Checks.text(max) + "] holds " + Checks.text(Math.max(fHi - fLo, 0.0)) + " of the quantiles mass");
        }
        java.util.List<double[]> points = new java.util.ArrayList<>();
        points.add(new double[] {0.0, lo});
        for (int i = 0; i < p.length; i++) {
            if (v[i] > lo && v[i] < hi) {
                double t = (p[i] - fLo) / (fHi - fLo);
                if (t > points.get(points.size() - 1)[0] && t < 1.0) {
                    points.add(new double[] {t, v[i]});
                }
            }
        }
        points.add(new double[] {1.0, hi});
        double[] np = new double[points.size()];
        double[] nv = new double[points.size()];
        for (int i = 0; i < np.length; i++) {
            np[i] = points.get(i)[0];
            nv[i] = points.get(i)[1];
        }
        return new QuantileTable(np, nv);
    }

    @Override
    public String family() {
        return "quantiles";
    }

    @Override
    public double quantile(double q) {
        int i = java.util.Arrays.binarySearch(p, q);
        if (i >= 0) {
            return v[i];
        }
        int hi = -i - 1;
        int lo = hi - 1;
        double t = (q - p[lo]) / (p[hi] - p[lo]);
        return Math.min(v[lo] + t * (v[hi] - v[lo]), v[hi]);
    }

    @Override
    public double cdf(double x) {
        if (x <= v[0]) {
            return 0.0;
        }
        if (x >= v[v.length - 1]) {
            return 1.0;
        }
        int i = java.util.Arrays.binarySearch(v, x);
        if (i >= 0) {
            return p[i];
        }
        int hi = -i - 1;
        int lo = hi - 1;
        return p[lo] + (x - v[lo]) / (v[hi] - v[lo]) * (p[hi] - p[lo]);
    }

    @Override
    public double mean() {
        return mean;
    }

    @Override
    public double sd() {
        return sd;
    }
}
