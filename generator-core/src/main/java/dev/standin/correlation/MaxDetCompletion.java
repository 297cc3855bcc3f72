package dev.standin.correlation;

/**
 * The maximum-determinant positive definite completion of a partially specified correlation matrix:
 * among all positive definite matrices with the given entries, the one with the largest
 * determinant, characterised by zeros of its inverse at the unspecified positions. For Gaussian
 * latents this is the completion that adds no dependence beyond what was specified (the
 * maximum-entropy, conditional-independence choice). A. P. Dempster, "Covariance selection",
 * Biometrics 28 (1972) 157-175; R. Grone, C. R. Johnson, E. M. Sá and H. Wolkowicz, "Positive
 * definite completions of partial Hermitian matrices", Linear Algebra Appl. 58 (1984) 109-124.
 * Example: a ~ b = 0.9 and b ~ c = 0.9 give a ~ c = 0.81.
 *
 * <p>Method: cyclic coordinate ascent on log det from a positive definite start. Along one free
 * pair (i, j), det(X + t(e<sub>i</sub>e<sub>j</sub><sup>T</sup> + e<sub>j</sub>e<sub>i</sub><sup>T</sup>))
 * = det X · ((1 + t s<sub>ij</sub>)² − t² s<sub>ii</sub>s<sub>jj</sub>) with S = X<sup>-1</sup>, maximised at
 * t = s<sub>ij</sub>/(s<sub>ii</sub>s<sub>jj</sub> − s<sub>ij</sub>²), which makes the new s<sub>ij</sub> zero;
 * S is updated by the Sherman–Morrison–Woodbury formula and recomputed every sweep. The
 * determinant never decreases, so the iterate stays positive definite.
 */
public final class MaxDetCompletion {

    /** The outcome. */
    public record Result(double[][] matrix, int sweeps, boolean converged) {
    }

    private MaxDetCompletion() {
    }

    /**
     * @param start a positive definite matrix holding the specified entries
     * @param free which off-diagonal entries may change (symmetric)
     * @param tolerance stop when every free |s<sub>ij</sub>|/√(s<sub>ii</sub>s<sub>jj</sub>) is at most this
     */
    public static Result complete(double[][] start, boolean[][] free, double tolerance, int maxSweeps) {
        int n = start.length;
        double[][] x = Matrices.copy(start);
        for (int sweep = 1; sweep <= maxSweeps; sweep++) {
            double[][] s = inverse(x);
            if (s == null) {
                return new Result(x, sweep, false);
            }
            double worst = 0;
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < i; j++) {
                    if (!free[i][j]) {
                        continue;
                    }
                    double sij = s[i][j];
                    double scale = StrictMath.sqrt(s[i][i] * s[j][j]);
                    worst = Math.max(worst, Math.abs(sij) / scale);
                    double denominator = s[i][i] * s[j][j] - sij * sij;
                    if (sij == 0.0 || !(denominator > 0)) {
                        continue;
                    }
                    double t = sij / denominator;
                    x[i][j] += t;
                    x[j][i] = x[i][j];
                    update(s, i, j, t);
                }
            }
            if (worst <= tolerance) {
                return new Result(x, sweep, true);
            }
        }
        return new Result(x, maxSweeps, false);
    }

    /** S ← (X + tE)<sup>-1</sup> for E = e<sub>i</sub>e<sub>j</sub><sup>T</sup> + e<sub>j</sub>e<sub>i</sub><sup>T</sup>, by Woodbury. */
    private static void update(double[][] s, int i, int j, double t) {
        int n = s.length;
        // (X + U C V^T)^-1 = S − S U (C^-1 + V^T S U)^-1 V^T S with U = [e_i e_j], V = [e_j e_i], C = t I
        double m00 = 1.0 / t + s[j][i];
        double m01 = s[j][j];
        double m10 = s[i][i];
        double m11 = 1.0 / t + s[i][j];
        double det = m00 * m11 - m01 * m10;
        double i00 = m11 / det;
        double i01 = -m01 / det;
        double i10 = -m10 / det;
        double i11 = m00 / det;
        double[] si = new double[n];
        double[] sj = new double[n];
        for (int r = 0; r < n; r++) {
            si[r] = s[r][i];
            sj[r] = s[r][j];
        }
        for (int r = 0; r < n; r++) {
            double a = si[r] * i00 + sj[r] * i10;
            double b = si[r] * i01 + sj[r] * i11;
            for (int c = 0; c < n; c++) {
                // V^T S rows: row 0 is S[j][:], row 1 is S[i][:]
                s[r][c] -= a * sj[c] + b * si[c];
            }
        }
    }

    /** The inverse of a symmetric positive definite matrix through its Cholesky factor, or null. */
    static double[][] inverse(double[][] x) {
        double[][] l;
        try {
            l = Cholesky.factor(x);
        } catch (Cholesky.NotPositiveDefiniteException e) {
            return null;
        }
        int n = x.length;
        double[][] inv = new double[n][n];
        double[] col = new double[n];
        for (int c = 0; c < n; c++) {
            for (int r = 0; r < n; r++) {
                double sum = r == c ? 1.0 : 0.0;
                for (int p = 0; p < r; p++) {
                    sum -= l[r][p] * col[p];
                }
                col[r] = sum / l[r][r];
            }
            for (int r = n - 1; r >= 0; r--) {
                double sum = col[r];
                for (int p = r + 1; p < n; p++) {
                    sum -= l[p][r] * inv[p][c];
                }
                inv[r][c] = sum / l[r][r];
            }
        }
        Matrices.symmetrize(inv);
        return inv;
    }
}
