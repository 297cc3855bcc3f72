package dev.standin.correlation;

/**
 * A rank-revealing factor of a positive semidefinite matrix by Cholesky factorisation with complete
 * (diagonal) pivoting: P A P<sup>T</sup> = R R<sup>T</sup>, stopping when the largest remaining
 * diagonal falls to the tolerance. N. J. Higham, "Analysis of the Cholesky decomposition of a
 * semi-definite matrix", in <i>Reliable Numerical Computation</i>, Oxford University Press (1990),
 * 161-185; Golub and Van Loan, <i>Matrix Computations</i>, 4th ed., algorithm 4.2.4 (outer product
 * form with pivoting).
 *
 * <p>The factor is returned unpermuted, as L = P<sup>T</sup>R (k × rank) with A = L L<sup>T</sup>,
 * so a column with correlation ±1 to another gets the same (or mirrored) row of L.
 */
public final class PivotedCholesky {

    /** The outcome: L (k rows, {@code rank} columns) and the pivot order of the latent dimensions. */
    public record Result(double[][] factor, int rank, int[] pivots) {
    }

    private PivotedCholesky() {
    }

    /**
     * @param tolerance remaining diagonals at or below this are treated as zero
     * @throws Cholesky.NotPositiveDefiniteException when A is not positive semidefinite (a reconstructed
     *     entry differs from A by more than 1e-8)
     */
    public static Result factor(double[][] a, double tolerance) throws Cholesky.NotPositiveDefiniteException {
        int n = a.length;
        double[][] s = Matrices.copy(a);
        int[] perm = new int[n];
        for (int i = 0; i < n; i++) {
            perm[i] = i;
        }
        double[][] r = new double[n][n];
        int rank = 0;
        for (int k = 0; k < n; k++) {
            int best = k;
            for (int i = k + 1; i < n; i++) {
                if (s[perm[i]][perm[i]] > s[perm[best]][perm[best]]) {
                    best = i;
                }
            }
            int t = perm[k];
            perm[k] = perm[best];
            perm[best] = t;
            int p = perm[k];
            double d = s[p][p];
            if (!(d > tolerance)) {
                break;
            }
            double root = StrictMath.sqrt(d);
            for (int i = k; i < n; i++) {
                r[perm[i]][k] = s[perm[i]][p] / root;
            }
            for (int i = k + 1; i < n; i++) {
                int pi = perm[i];
                for (int j = k + 1; j < n; j++) {
                    int pj = perm[j];
                    s[pi][pj] -= r[pi][k] * r[pj][k];
                }
            }
            rank++;
        }
        double[][] l = new double[n][rank];
        for (int i = 0; i < n; i++) {
            System.arraycopy(r[i], 0, l[i], 0, rank);
        }
        for (int i = 0; i < n; i++) {
            for (int j = 0; j <= i; j++) {
                double sum = 0;
                for (int q = 0; q < rank; q++) {
                    sum += l[i][q] * l[j][q];
                }
                if (Math.abs(sum - a[i][j]) > 1e-8) {
                    throw new Cholesky.NotPositiveDefiniteException(i, sum - a[i][j]);
                }
            }
        }
        int[] pivots = new int[rank];
        System.arraycopy(perm, 0, pivots, 0, rank);
        return new Result(l, rank, pivots);
    }
}
