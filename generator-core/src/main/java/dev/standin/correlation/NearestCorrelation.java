package dev.standin.correlation;

/**
 * The nearest correlation matrix in the Frobenius norm by Higham's alternating projections with
 * Dykstra's correction: N. J. Higham, "Computing the nearest correlation matrix — a problem from
 * finance", IMA Journal of Numerical Analysis 22 (2002) 329-343, algorithm 3.3 (with W = I),
 * accelerated by Anderson mixing as proposed by N. J. Higham and N. Strabić, "Anderson acceleration
 * of the alternating projections method for computing the nearest correlation matrix", Numerical
 * Algorithms 72 (2016) 1021-1042.
 *
 * <p>The iteration alternates the projection onto the positive semidefinite cone S (eigenvalues
 * clipped at a floor, Dykstra-corrected) with the projection onto the affine set U of symmetric
 * matrices with unit diagonal and, optionally, some off-diagonal entries held at given values (the
 * "fixed entries" variant of the same method, Higham 2002 section 4). Dykstra's correction makes
 * the limit the nearest point of S ∩ U to the start, not merely some point of it (Boyle and Dykstra
 * 1986).
 *
 * <p>Written in the Dykstra variable Z = Y − ΔS the method is the fixed-point iteration
 * Z ← g(Z) = Z + P<sub>U</sub>(P<sub>S</sub>(Z)) − P<sub>S</sub>(Z). Since P<sub>U</sub> changes only the diagonal and
 * the fixed entries, the residual f = P<sub>U</sub>(X) − X lives on those positions and Z differs from
 * P<sub>U</sub>(A) only there: the iteration is carried on that short vector (n numbers plus one per
 * fixed pair) and Z rebuilt from it. Anderson acceleration with a memory of {@link #MEMORY} replaces
 * g(Z<sub>k</sub>) by the combination of the last few g values whose residuals combine to the smallest
 * Frobenius norm (H. F. Walker and P. Ni, "Anderson acceleration for fixed-point iterations", SIAM J.
 * Numer. Anal. 49 (2011) 1715-1735). The limit is the same; the number of eigendecompositions falls
 * several-fold (91 to 20 on a perturbed 500 × 500 factor-model matrix). The iteration stops when the
 * relative changes of X and Y and their relative distance all fall below the tolerance.
 */
public final class NearestCorrelation {

    /** The default stopping tolerance on relative changes. */
    public static final double DEFAULT_TOLERANCE = 1e-12;

    /** The default iteration limit. */
    public static final int DEFAULT_MAX_ITERATIONS = 100_000;

    /**
     * Anderson memory: how many earlier steps enter each combination (Higham and Strabić used 2 to
     * 5; 8 took the fewest steps on our 100 × 100 to 500 × 500 tests, and larger gained nothing).
     */
    static final int MEMORY = 8;

    /**
     * The outcome: the matrix (from U, so exactly unit diagonal), iterations, whether it converged,
     * and the last relative distance ‖Y − X‖/‖Y‖ between the two sets' iterates (near 0 when S ∩ U is
     * not empty; it levels off at the sets' gap when it is, as when fixed entries admit no valid matrix).
     */
    public record Result(double[][] matrix, int iterations, boolean converged, double gap) {
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
     * @param fixed which off-diagonal entries stay as in a (symmetric; null for none)
     * @param floor the smallest eigenvalue allowed in the positive semidefinite projection (0 for Higham's method)
     * @param tolerance stop when relative changes are at most this
     * @param maxIterations stop after this many iterations (then {@code converged} is false)
     */
    public static Result project(double[][] a, boolean[][] fixed, double floor, double tolerance, int maxIterations) {
        return project(a, fixed, floor, tolerance, maxIterations, MEMORY, null, false);
    }

    /** Iterations before {@code stopWhenStalled} may end a run, and the window it compares. */
    private static final int STALL_AFTER = 50;
    private static final int STALL_WINDOW = 25;

    /**
     * As {@link #project(double[][], boolean[][], double, double, int)}, with the given Anderson memory
     * (0: plain Dykstra), optionally warm-started and stopping early when the sets do not meet.
     *
     * @param warm null, or the correction on the support (the n diagonal entries, then the fixed pairs
     *        in row order) to start from, overwritten with the final one. Any start gives the same
     *        limit: a fixed point Z = P<sub>U</sub>(A) + D with P<sub>S</sub>(Z) ∈ U satisfies the optimality
     *        conditions A − X ∈ N<sub>S</sub>(X) + N<sub>U</sub>(X) (D lies in U's normal space), so the
     *        previous solve's correction speeds up a sequence of nearby problems.
     * @param stopWhenStalled stop (not converged) once the smallest ‖Y − X‖/‖Y‖ of the last
     *        {@value #STALL_WINDOW} iterations is no better than 0.99 times the smallest before them, after
     *        {@value #STALL_AFTER} iterations: the sign that S ∩ U is empty (the distance levels off at the gap)
     */
    static Result project(double[][] a, boolean[][] fixed, double floor, double tolerance, int maxIterations, int memory,
                          double[] warm, boolean stopWhenStalled) {
        int n = a.length;
        Support u = Support.of(a, fixed);
        // Z = P_U(A) + (the correction dz on the support)
        double[][] base = Matrices.copy(a);
        Matrices.symmetrize(base);
        u.set(base, u.target);
        double[] dz = warm != null && warm.length == u.size() ? warm.clone() : new double[u.size()];
        double[] gaps = new double[Math.max(1, Math.min(maxIterations, 1024))];
        AndersonMixing anderson = new AndersonMixing(memory, u.weight);
        double[][] x = null;
        for (int k = 1; k <= maxIterations; k++) {
            double[][] z = Matrices.copy(base);
            u.add(z, dz);
            double[][] xNew = Matrices.eigenFloor(z, floor);
            // the residual f = Y − X on the support; elsewhere Y = X
            double[] f = new double[u.size()];
            double fNorm2 = 0;
            double onSupportX2 = 0;
            double onSupportDx2 = 0;
            for (int t = 0; t < f.length; t++) {
                double xv = xNew[u.row[t]][u.col[t]];
                f[t] = u.target[t] - xv;
                fNorm2 += u.weight[t] * f[t] * f[t];
                onSupportX2 += u.weight[t] * xv * xv;
                if (x != null) {
                    double d = xv - x[u.row[t]][u.col[t]];
                    onSupportDx2 += u.weight[t] * d * d;
                }
            }
            double xx = 0;
            double dxx = 0;
            for (int i = 0; i < n; i++) {
                double[] xi = xNew[i];
                double[] pi = x == null ? xi : x[i];
                for (int j = 0; j < n; j++) {
                    double d = xi[j] - pi[j];
                    xx += xi[j] * xi[j];
                    dxx += d * d;
                }
            }
            // Y = X off the support and the targets on it, which do not change from step to step
            double normX = Math.max(StrictMath.sqrt(xx), Double.MIN_NORMAL);
            double normY = Math.max(StrictMath.sqrt(Math.max(0.0, xx - onSupportX2 + u.targetNorm2)), Double.MIN_NORMAL);
            double dx = x == null ? Double.POSITIVE_INFINITY : StrictMath.sqrt(dxx) / normX;
            double dy = x == null ? Double.POSITIVE_INFINITY : StrictMath.sqrt(Math.max(0.0, dxx - onSupportDx2)) / normY;
            double dxy = StrictMath.sqrt(fNorm2) / normY;
            x = xNew;
            if (k > gaps.length) {
                gaps = java.util.Arrays.copyOf(gaps, 2 * gaps.length);
            }
            gaps[k - 1] = dxy;
            boolean converged = Math.max(Math.max(dx, dy), dxy) <= tolerance;
            if (converged || k == maxIterations || stopWhenStalled && stalled(gaps, k)) {
                double[][] y = Matrices.copy(xNew);
                u.set(y, u.target);
                if (warm != null && warm.length == dz.length) {
                    System.arraycopy(dz, 0, warm, 0, dz.length);
                }
                return new Result(y, k, converged, dxy);
            }
            double[] g = new double[dz.length];
            for (int t = 0; t < g.length; t++) {
                g[t] = dz[t] + f[t];
            }
            dz = anderson.next(g, f);
        }
        throw new IllegalArgumentException("maxIterations must be at least 1: " + maxIterations);
    }

    /** True when the last STALL_WINDOW gaps did not get below 0.99 times the best gap before them. */
    private static boolean stalled(double[] gaps, int k) {
        if (k < STALL_AFTER) {
            return false;
        }
        double before = Double.POSITIVE_INFINITY;
        for (int i = 0; i < k - STALL_WINDOW; i++) {
            before = Math.min(before, gaps[i]);
        }
        double recent = Double.POSITIVE_INFINITY;
        for (int i = k - STALL_WINDOW; i < k; i++) {
            recent = Math.min(recent, gaps[i]);
        }
        return recent >= 0.99 * before;
    }

    /** The positions P_U sets: the diagonal and the fixed pairs (i > j), each with its value and Frobenius weight. */
    private static final class Support {
        final int[] row;
        final int[] col;
        final double[] target;
        /** 1 for a diagonal entry, 2 for a pair (it appears twice in the matrix). */
        final double[] weight;
        /** The squared Frobenius norm of the targets on the support (Y there, at every step). */
        final double targetNorm2;

        private Support(int[] row, int[] col, double[] target, double[] weight) {
            this.row = row;
            this.col = col;
            this.target = target;
            this.weight = weight;
            double s = 0;
            for (int t = 0; t < target.length; t++) {
                s += weight[t] * target[t] * target[t];
            }
            this.targetNorm2 = s;
        }

        static Support of(double[][] a, boolean[][] fixed) {
            int n = a.length;
            int[][] pairs = fixed == null ? new int[][] {new int[0], new int[0]} : Matrices.lowerPositions(fixed);
            int size = n + pairs[0].length;
            int[] row = new int[size];
            int[] col = new int[size];
            double[] target = new double[size];
            double[] weight = new double[size];
            for (int i = 0; i < n; i++) {
                row[i] = i;
                col[i] = i;
                target[i] = 1.0;
                weight[i] = 1.0;
            }
            for (int t = 0; t < pairs[0].length; t++) {
                int i = pairs[0][t];
                int j = pairs[1][t];
                row[n + t] = i;
                col[n + t] = j;
                target[n + t] = 0.5 * (a[i][j] + a[j][i]);
                weight[n + t] = 2.0;
            }
            return new Support(row, col, target, weight);
        }

        int size() {
            return row.length;
        }

        /** m ← v on the support (both triangles). */
        void set(double[][] m, double[] v) {
            for (int t = 0; t < v.length; t++) {
                m[row[t]][col[t]] = v[t];
                m[col[t]][row[t]] = v[t];
            }
        }

        /** m ← m + v on the support (both triangles). */
        void add(double[][] m, double[] v) {
            for (int t = 0; t < v.length; t++) {
                double s = m[row[t]][col[t]] + v[t];
                m[row[t]][col[t]] = s;
                m[col[t]][row[t]] = s;
            }
        }
    }
}
