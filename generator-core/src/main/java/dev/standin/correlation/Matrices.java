package dev.standin.correlation;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.apache.commons.math3.linear.RealMatrix;

/** Small dense symmetric-matrix helpers on {@code double[][]}. */
final class Matrices {

    private Matrices() {
    }

    static double[][] copy(double[][] a) {
        double[][] c = new double[a.length][];
        for (int i = 0; i < a.length; i++) {
            c[i] = a[i].clone();
        }
        return c;
    }

    /** Frobenius norm of a − b. */
    static double distance(double[][] a, double[][] b) {
        double s = 0;
        for (int i = 0; i < a.length; i++) {
            for (int j = 0; j < a.length; j++) {
                double d = a[i][j] - b[i][j];
                s += d * d;
            }
        }
        return StrictMath.sqrt(s);
    }

    static double norm(double[][] a) {
        double s = 0;
        for (double[] row : a) {
            for (double v : row) {
                s += v * v;
            }
        }
        return StrictMath.sqrt(s);
    }

    /** Averages a with its transpose, removing rounding asymmetry. */
    static void symmetrize(double[][] a) {
        for (int i = 0; i < a.length; i++) {
            for (int j = 0; j < i; j++) {
                double m = 0.5 * (a[i][j] + a[j][i]);
                a[i][j] = m;
                a[j][i] = m;
            }
        }
    }

    /**
     * The projection onto {X : X symmetric, λ<sub>min</sub>(X) ≥ floor} in the Frobenius norm: V
     * max(Λ, floor) V<sup>T</sup> from the eigendecomposition (Higham 2002, theorem 3.2 for floor 0).
     */
    static double[][] eigenFloor(double[][] a, double floor) {
        int n = a.length;
        EigenDecomposition e = new EigenDecomposition(new Array2DRowRealMatrix(a, false));
        double[] values = e.getRealEigenvalues();
        RealMatrix v = e.getV();
        double[][] vd = v.getData();
        double[][] out = new double[n][n];
        double[] lambda = new double[n];
        for (int p = 0; p < n; p++) {
            lambda[p] = Math.max(values[p], floor);
        }
        for (int i = 0; i < n; i++) {
            for (int j = 0; j <= i; j++) {
                double s = 0;
                for (int p = 0; p < n; p++) {
                    s += vd[i][p] * lambda[p] * vd[j][p];
                }
                out[i][j] = s;
                out[j][i] = s;
            }
        }
        return out;
    }

    /** The smallest eigenvalue (commons-math3 {@link EigenDecomposition}). */
    static double smallestEigenvalue(double[][] a) {
        double[] values = new EigenDecomposition(new Array2DRowRealMatrix(a, false)).getRealEigenvalues();
        double min = Double.POSITIVE_INFINITY;
        for (double v : values) {
            min = Math.min(min, v);
        }
        return min;
    }
}
