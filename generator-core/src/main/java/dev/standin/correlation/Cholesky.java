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
            System.arraycopy(a[i], 0, l[i], 0, i + 1);
        }
        int failed = factorInPlace(l, 0.0);
        if (failed >= 0) {
            throw new NotPositiveDefiniteException(failed, l[failed][failed]);
        }
        return l;
    }

    /**
     * Overwrites the lower triangle of a with its factor L (row by row), reading only the lower
     * triangle; returns −1, or the row whose pivot was not above {@code minPivot} (its diagonal entry
     * then holds that pivot and the rest of a is undefined).
     */
    private static int factorInPlace(double[][] a, double minPivot) {
        int k = a.length;
        for (int i = 0; i < k; i++) {
            for (int j = 0; j <= i; j++) {
                double sum = a[i][j];
                for (int p = 0; p < j; p++) {
                    sum -= a[i][p] * a[j][p];
                }
                if (i == j) {
                    if (!(sum > minPivot)) {
                        a[i][i] = sum;
                        return i;
                    }
                    a[i][i] = StrictMath.sqrt(sum);
                } else {
                    a[i][j] = sum / a[j][j];
                }
            }
        }
        return -1;
    }

    /**
     * Solves a x = b in place for a symmetric positive definite a given by its lower triangle: a's
     * lower triangle is overwritten by the factor L (the same recurrence as {@link #factor}), then b by
     * x through L and L<sup>T</sup>. Returns false, leaving a and b undefined, when a pivot is not above
     * {@code minPivot} (0: not positive definite; larger: too ill-conditioned for the caller).
     */
    static boolean solveInPlace(double[][] a, double[] b, double minPivot) {
        if (factorInPlace(a, minPivot) >= 0) {
            return false;
        }
        solveWithFactor(a, b);
        return true;
    }

    /** b ← (L L<sup>T</sup>)<sup>-1</sup> b by forward then back substitution with the factor L (lower triangle of l). */
    static void solveWithFactor(double[][] l, double[] b) {
        int m = b.length;
        for (int p = 0; p < m; p++) {
            double s = b[p];
            for (int r = 0; r < p; r++) {
                s -= l[p][r] * b[r];
            }
            b[p] = s / l[p][p];
        }
        for (int p = m - 1; p >= 0; p--) {
            double s = b[p];
            for (int r = p + 1; r < m; r++) {
                s -= l[r][p] * b[r];
            }
            b[p] = s / l[p][p];
        }
    }
}
