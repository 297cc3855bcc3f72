package dev.standin.correlation;

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
     * max(Λ, floor) V<sup>T</sup> from the eigendecomposition (Higham 2002, theorem 3.2 for floor 0),
     * computed as A + Σ<sub>λ &lt; floor</sub> (floor − λ) v v<sup>T</sup> so that only the eigenvalues
     * being raised cost a rank-one update.
     */
    static double[][] eigenFloor(double[][] a, double floor) {
        int n = a.length;
        SymmetricEigen e = SymmetricEigen.of(a);
        double[][] out = new double[n][];
        for (int i = 0; i < n; i++) {
            out[i] = a[i].clone();
        }
        for (int p = 0; p < n && e.values[p] < floor; p++) {
            double raise = floor - e.values[p];
            double[] v = e.vectors[p];
            for (int i = 0; i < n; i++) {
                double vi = raise * v[i];
                double[] row = out[i];
                for (int j = 0; j <= i; j++) {
                    row[j] += vi * v[j];
                }
            }
        }
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < i; j++) {
                out[j][i] = out[i][j];
            }
        }
        return out;
    }

    /** The smallest eigenvalue ({@link SymmetricEigen}). */
    static double smallestEigenvalue(double[][] a) {
        return a.length == 0 ? Double.POSITIVE_INFINITY : SymmetricEigen.of(a).values[0];
    }
}
