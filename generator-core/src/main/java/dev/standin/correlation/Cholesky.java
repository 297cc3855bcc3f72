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
}
