package dev.standin.correlation;

/**
 * The Cholesky factorisation A = L L<sup>T</sup> of a symmetric positive definite matrix, by the
 * Cholesky–Banachiewicz (row by row) recurrence: G. H. Golub and C. F. Van Loan, <i>Matrix
 * Computations</i>, 4th ed. (2013), algorithm 4.2.1. Plain arithmetic and {@link StrictMath#sqrt}
 * in a fixed order, so the factor is bit-identical on every JVM.
 */
public final class Cholesky {

    private Cholesky() {
    }

    /** Thrown when a pivot is not positive: the matrix is not (numerically) positive definite. */
    public static final class NotPositiveDefiniteException extends Exception {
        private static final long serialVersionUID = 1L;
        private final int index;

        NotPositiveDefiniteException(int index, double pivot) {
            super("not positive definite: pivot " + index + " is " + pivot, null, false, false);
            this.index = index;
        }

        /** The 0-based row at which the factorisation broke down. */
        public int index() {
            return index;
        }
    }

    /**
     * The lower-triangular factor L, as a full k × k array with zeros above the diagonal.
     *
     * @throws NotPositiveDefiniteException when a pivot is ≤ 0 or not a number
     */
    public static double[][] factor(double[][] a) throws NotPositiveDefiniteException {
        int k = a.length;
        double[][] l = new double[k][k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j <= i; j++) {
                double sum = a[i][j];
                for (int p = 0; p < j; p++) {
                    sum -= l[i][p] * l[j][p];
                }
                if (i == j) {
                    if (!(sum > 0)) {
                        throw new NotPositiveDefiniteException(i, sum);
                    }
                    l[i][i] = StrictMath.sqrt(sum);
                } else {
                    l[i][j] = sum / l[j][j];
                }
            }
        }
        return l;
    }

    /**
     * Solves a x = b in place for a symmetric positive definite a given by its lower triangle: a's
     * lower triangle is overwritten by the factor L (the same recurrence as {@link #factor}), then b by
     * x through L and L<sup>T</sup>. Returns false, leaving a and b undefined, when a pivot is not above
     * {@code minPivot} (0: not positive definite; larger: too ill-conditioned for the caller).
     */
    static boolean solveInPlace(double[][] a, double[] b, double minPivot) {
        int m = b.length;
        for (int p = 0; p < m; p++) {
            for (int q = 0; q <= p; q++) {
                double s = a[p][q];
                for (int r = 0; r < q; r++) {
                    s -= a[p][r] * a[q][r];
                }
                if (p == q) {
                    if (!(s > minPivot)) {
                        return false;
                    }
                    a[p][p] = StrictMath.sqrt(s);
                } else {
                    a[p][q] = s / a[q][q];
                }
            }
        }
        for (int p = 0; p < m; p++) {
            double s = b[p];
            for (int r = 0; r < p; r++) {
                s -= a[p][r] * b[r];
            }
            b[p] = s / a[p][p];
        }
        for (int p = m - 1; p >= 0; p--) {
            double s = b[p];
            for (int r = p + 1; r < m; r++) {
                s -= a[r][p] * b[r];
            }
            b[p] = s / a[p][p];
        }
        return true;
    }
}
