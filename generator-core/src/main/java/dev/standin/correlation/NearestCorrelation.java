package dev.standin.correlation;

/**
 * The nearest correlation matrix in the Frobenius norm by Higham's alternating projections with
 * Dykstra's correction: N. J. Higham, "Computing the nearest correlation matrix — a problem from
 * finance", IMA Journal of Numerical Analysis 22 (2002) 329-343, algorithm 3.3 (with W = I).
 *
 * <p>The iteration alternates the projection onto the positive semidefinite cone S (eigenvalues
 * clipped at a floor, Dykstra-corrected) with the projection onto the affine set U of symmetric
 * matrices with unit diagonal and, optionally, some off-diagonal entries held at given values (the
 * "fixed entries" variant of the same method, Higham 2002 section 4). Dykstra's correction makes
 * the limit the nearest point of S ∩ U to the start, not merely some point of it (Boyle and Dykstra
 * 1986). The iteration stops when the relative changes of both iterates and their relative distance
 * all fall below the tolerance.
 */
public final class NearestCorrelation {

    /** The default stopping tolerance on relative changes. */
    public static final double DEFAULT_TOLERANCE = 1e-12;

    /** The default iteration limit. */
    public static final int DEFAULT_MAX_ITERATIONS = 100_000;

    /** The outcome: the matrix (from U, so exactly unit diagonal), iterations and whether it converged. */
    public record Result(double[][] matrix, int iterations, boolean converged) {
    }

    private NearestCorrelation() {
    }

    /** Higham's nearest correlation matrix to a symmetric matrix a. */
    public static Result nearest(double[][] a) {
        return project(a, null, 0.0, DEFAULT_TOLERANCE, DEFAULT_MAX_ITERATIONS);
    }

    /**
     * The nearest matrix to a in S<sub>floor</sub> ∩ U<sub>fixed</sub>.
     *
     * @param a a symmetric matrix; entries of a where fixed[i][j] is true are held at their value
     * @param fixed which off-diagonal entries stay as in a (null for none)
     * @param floor the smallest eigenvalue allowed in the positive semidefinite projection (0 for Higham's method)
     * @param tolerance stop when relative changes are at most this
     * @param maxIterations stop after this many iterations (then {@code converged} is false)
     */
    public static Result project(double[][] a, boolean[][] fixed, double floor, double tolerance, int maxIterations) {
        int n = a.length;
        double[][] y = Matrices.copy(a);
        projectU(y, a, fixed);
        double[][] correction = new double[n][n];
        double[][] x = null;
        for (int k = 1; k <= maxIterations; k++) {
            double[][] r = new double[n][n];
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    r[i][j] = y[i][j] - correction[i][j];
                }
            }
            double[][] xNew = Matrices.eigenFloor(r, floor);
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    correction[i][j] = xNew[i][j] - r[i][j];
                }
            }
            double[][] yNew = Matrices.copy(xNew);
            projectU(yNew, a, fixed);
            double normY = Math.max(Matrices.norm(yNew), Double.MIN_NORMAL);
            double dx = x == null ? Double.POSITIVE_INFINITY : Matrices.distance(xNew, x) / Math.max(Matrices.norm(xNew), Double.MIN_NORMAL);
            double dy = Matrices.distance(yNew, y) / normY;
            double dxy = Matrices.distance(yNew, xNew) / normY;
            x = xNew;
            y = yNew;
            if (Math.max(Math.max(dx, dy), dxy) <= tolerance) {
                return new Result(y, k, true);
            }
        }
        return new Result(y, maxIterations, false);
    }

    /** Projection onto U: unit diagonal, fixed entries as in a. */
    private static void projectU(double[][] y, double[][] a, boolean[][] fixed) {
        int n = y.length;
        for (int i = 0; i < n; i++) {
            y[i][i] = 1.0;
            if (fixed != null) {
                for (int j = 0; j < n; j++) {
                    if (i != j && fixed[i][j]) {
                        y[i][j] = a[i][j];
                    }
                }
            }
        }
        Matrices.symmetrize(y);
    }
}
