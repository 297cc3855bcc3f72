package dev.standin.correlation;

/** Small dense symmetric-matrix helpers on {@code double[][]}; only {@link #copy} is public. */
public final class Matrices {

    private Matrices() {
    }

    /** A deep copy: a new array of rows, each row a clone of a's (rows may differ in length). */
    public static double[][] copy(double[][] a) {
        double[][] c = new double[a.length][];
        for (int i = 0; i < a.length; i++) {
            c[i] = a[i].clone();
        }
        return c;
    }

    /** The positions (i, j), i &gt; j, where mask is true, in row order: {rows, columns}. */
    static int[][] lowerPositions(boolean[][] mask) {
        int n = mask.length;
        int count = 0;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < i; j++) {
                if (mask[i][j]) {
                    count++;
                }
            }
        }
        int[] rows = new int[count];
        int[] cols = new int[count];
        int t = 0;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < i; j++) {
                if (mask[i][j]) {
                    rows[t] = i;
                    cols[t] = j;
                    t++;
                }
            }
        }
        return new int[][] {rows, cols};
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
     * computed from whichever side has fewer eigenvectors: A + Σ<sub>λ &lt; floor</sub> (floor − λ) v v<sup>T</sup>
     * when few eigenvalues are raised, else floor·I + Σ<sub>λ &gt; floor</sub> (λ − floor) v v<sup>T</sup>.
     * The result is exactly symmetric.
     */
    static double[][] eigenFloor(double[][] a, double floor) {
        int n = a.length;
        SymmetricEigen e = SymmetricEigen.of(a);
        int below = 0;
        while (below < n && e.values[below] < floor) {
            below++;
        }
        double[][] out = new double[n][n];
        int from;
        int to;
        if (below <= n - below) {
            for (int i = 0; i < n; i++) {
                System.arraycopy(a[i], 0, out[i], 0, i + 1);
            }
            from = 0;
            to = below;
        } else {
            for (int i = 0; i < n; i++) {
                out[i][i] = floor;
            }
            from = below;
            to = n;
        }
        int k = to - from;
        double[] weight = new double[k];
        double[][] vectors = new double[k][];
        for (int p = 0; p < k; p++) {
            weight[p] = Math.abs(floor - e.values[from + p]);
            vectors[p] = e.vectors[from + p];
        }
        // row by row, so that out[i] stays in cache while the k vectors stream past; rows 0 .. n/√2 and
        // the rest carry about equal halves of the triangle and may run side by side (disjoint rows)
        int[] cut = SymmetricEigen.splitsInTwo(n) ? new int[] {0, (int) (n / StrictMath.sqrt(2.0)), n} : new int[] {0, n};
        SymmetricEigen.inParts(cut.length - 1, part -> {
            for (int i = cut[part]; i < cut[part + 1]; i++) {
                double[] row = out[i];
                for (int p = 0; p < k; p++) {
                    double[] v = vectors[p];
                    SymmetricEigen.axpy(weight[p] * v[i], v, row, 0, i + 1);
                }
            }
        });
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < i; j++) {
                out[j][i] = out[i][j];
            }
        }
        return out;
    }

    /** The smallest eigenvalue ({@link SymmetricEigen}). */
    static double smallestEigenvalue(double[][] a) {
        return a.length == 0 ? Double.POSITIVE_INFINITY : SymmetricEigen.values(a)[0];
    }
}
