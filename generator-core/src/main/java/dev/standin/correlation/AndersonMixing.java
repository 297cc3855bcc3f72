package dev.standin.correlation;

import java.util.ArrayList;
import java.util.List;

/**
 * Anderson mixing (type II) for a fixed-point iteration z ← g(z) with residual f = g(z) − z, in a
 * weighted inner product (for vectors of matrix entries, weight 2 on an off-diagonal pair makes it
 * the Frobenius one): D. G. Anderson, "Iterative procedures for nonlinear integral equations",
 * J. ACM 12 (1965) 547-560, in the form of H. F. Walker and P. Ni, "Anderson acceleration for
 * fixed-point iterations", SIAM J. Numer. Anal. 49 (2011) 1715-1735. It keeps the last {@code memory} differences ΔF, ΔG
 * of f and g (oldest first), solves min ‖f − ΔF γ‖ by the normal equations (dropping the oldest
 * difference while they are ill-conditioned) and returns g − ΔG γ.
 */
final class AndersonMixing {
    private final int memory;
    private final double[] weight;
    private final List<double[]> df = new ArrayList<>();
    private final List<double[]> dg = new ArrayList<>();
    private double[] fPrev;
    private double[] gPrev;

    AndersonMixing(int memory, double[] weight) {
        this.memory = memory;
        this.weight = weight;
    }

    double[] next(double[] g, double[] f) {
        if (memory == 0) {
            return g;
        }
        if (fPrev != null) {
            double[] dfk = new double[f.length];
            double[] dgk = new double[g.length];
            for (int t = 0; t < f.length; t++) {
                dfk[t] = f[t] - fPrev[t];
                dgk[t] = g[t] - gPrev[t];
            }
            if (df.size() == memory) {
                df.remove(0);
                dg.remove(0);
            }
            df.add(dfk);
            dg.add(dgk);
        }
        fPrev = f;
        gPrev = g;
        while (!df.isEmpty()) {
            double[] gamma = leastSquares(f);
            if (gamma != null) {
                double[] out = g.clone();
                for (int p = 0; p < gamma.length; p++) {
                    double[] d = dg.get(p);
                    for (int t = 0; t < out.length; t++) {
                        out[t] -= gamma[p] * d[t];
                    }
                }
                return out;
            }
            df.remove(0);
            dg.remove(0);
        }
        return g;
    }

    /** γ minimising ‖f − ΔF γ‖ by Cholesky on ΔF<sup>T</sup>ΔF, or null when that is ill-conditioned. */
    private double[] leastSquares(double[] f) {
        int m = df.size();
        double[][] l = new double[m][m];
        double[] rhs = new double[m];
        double largest = 0;
        for (int p = 0; p < m; p++) {
            rhs[p] = dot(df.get(p), f);
            for (int q = 0; q <= p; q++) {
                l[p][q] = dot(df.get(p), df.get(q));
            }
            largest = Math.max(largest, l[p][p]);
        }
        // a pivot below 1e-14 of the largest diagonal entry: condition number beyond ~1e14
        return Cholesky.solveInPlace(l, rhs, 1e-14 * largest) ? rhs : null;
    }

    private double dot(double[] a, double[] b) {
        double s = 0;
        for (int t = 0; t < a.length; t++) {
            s += weight[t] * a[t] * b[t];
        }
        return s;
    }
}
