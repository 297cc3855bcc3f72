package dev.standin.correlation;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/**
 * Turns a requested correlation target into a valid one (symmetric, unit diagonal, positive
 * semidefinite) and says exactly what it changed.
 *
 * <ol>
 *   <li>Unspecified pairs (NaN) are free. If some valid matrix keeps every specified pair, the free
 *   pairs are chosen by the maximum-determinant rule ({@link MaxDetCompletion}), starting from a
 *   positive definite point found by alternating projections with the specified pairs held fixed
 *   ({@link NearestCorrelation#project}). When the specified pairs only admit singular completions,
 *   the projection's semidefinite limit is used. Columns tied by pairs of exactly ±1 are completed as
 *   one column ({@link TiedColumns}), so the result keeps those pairs exactly. When the pairs admit no
 *   valid matrix, the projection's distance between the two sets levels off and the run stops there.</li>
 *   <li>A matrix that is still not positive semidefinite (a full matrix, or specified pairs that are
 *   inconsistent) is repaired by the policy: {@code nearest} — Higham's nearest correlation matrix;
 *   with free pairs, the alternation of Higham's projection with resetting the specified pairs,
 *   which converges to the valid matrix whose specified pairs are nearest the request (W. Cheney and
 *   A. A. Goldstein, "Proximity maps for convex sets", Proc. AMS 10 (1959) 448-450), run as a
 *   fixed-point iteration on the free pairs with {@link AndersonMixing} and each projection started
 *   from the previous one's diagonal correction; {@code clip} — {@link EigenClip}; {@code fail} — an
 *   error with the {@link Definiteness} diagnostic.</li>
 * </ol>
 */
public final class CorrelationRepair {

    /** Smallest eigenvalue still accepted as positive semidefinite (rounding). */
    public static final double PSD_TOLERANCE = 1e-10;

    private static final double COMPLETION_FLOOR = 1e-6;
    private static final int PROJECTION_LIMIT = 20_000;
    private static final int OUTER_LIMIT = 500;
    /** Below this relative gap a failed positive definite completion is retried with singular ones allowed. */
    private static final double SINGULAR_GAP = 1e-6;

    /** One specified pair's change. */
    public record Change(int i, int j, double from, double to) {
        public double size() {
            return Math.abs(to - from);
        }
    }

    /**
     * The outcome.
     *
     * @param method {@code none}, {@code completion}, {@code nearest} or {@code clip}
     * @param changed specified pairs that moved, largest change first
     * @param completed the free pairs and the values chosen for them
     */
    public record Outcome(double[][] matrix, String method, int iterations, double maxChange, double frobenius,
                          List<Change> changed, List<Change> completed) {
        public boolean repaired() {
            return method.equals("nearest") || method.equals("clip");
        }
    }

    /** The target is not positive semidefinite and the policy is {@code fail}. */
    public static final class NotPositiveSemidefiniteException extends Exception {
        private static final long serialVersionUID = 1L;
        private final transient Definiteness diagnosis;

        NotPositiveSemidefiniteException(Definiteness diagnosis) {
            super("not positive semidefinite", null, false, false);
            this.diagnosis = diagnosis;
        }

        public Definiteness diagnosis() {
            return diagnosis;
        }
    }

    private CorrelationRepair() {
    }

    /**
     * @param requested symmetric, unit diagonal, entries in [−1, 1] or NaN for unspecified pairs
     */
    public static Outcome repair(double[][] requested, RepairPolicy policy) throws NotPositiveSemidefiniteException {
        int n = requested.length;
        boolean[][] free = new boolean[n][n];
        boolean anyFree = false;
        double[][] start = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                free[i][j] = i != j && Double.isNaN(requested[i][j]);
                anyFree |= free[i][j];
                start[i][j] = free[i][j] ? 0.0 : requested[i][j];
            }
        }
        int iterations = 0;
        if (anyFree) {
            // columns tied by ±1 pairs: complete one representative per tie and expand, exactly
            TiedColumns tied = TiedColumns.of(requested);
            double[][] reduced = tied == null ? null : tied.reduce(requested);
            if (reduced != null) {
                try {
                    Outcome inner = repair(reduced, RepairPolicy.FAIL);
                    return outcome(requested, tied.expand(inner.matrix()), "completion", inner.iterations(), free);
                } catch (NotPositiveSemidefiniteException e) {
                    // the pairs between ties are inconsistent: repaired below like any other target
                }
            }
            double[][] pd = start;
            if (MaxDetCompletion.inverse(start) == null) {
                // a positive definite completion, if there is one; the run stops early when the pairs given admit none
                NearestCorrelation.Result r = NearestCorrelation.project(start, not(free), COMPLETION_FLOOR,
                        NearestCorrelation.DEFAULT_TOLERANCE, PROJECTION_LIMIT, NearestCorrelation.MEMORY, null, true);
                iterations += r.iterations();
                pd = r.converged() && MaxDetCompletion.inverse(r.matrix()) != null ? r.matrix() : null;
                if (pd == null && r.gap() < SINGULAR_GAP) {
                    // so close that only singular completions may exist (|ρ| = 1 among the pairs given); the
                    // distance to such a set shrinks slowly, so this run is not cut short when it levels off
                    NearestCorrelation.Result r0 = NearestCorrelation.project(start, not(free), 0.0,
                            NearestCorrelation.DEFAULT_TOLERANCE, PROJECTION_LIMIT, NearestCorrelation.MEMORY, null, false);
                    iterations += r0.iterations();
                    if (r0.converged() && isPsd(r0.matrix())) {
                        return outcome(requested, r0.matrix(), "completion", iterations, free);
                    }
                }
                if (pd == null) {
                    start = r.matrix();
                }
            }
            if (pd != null) {
                MaxDetCompletion.Result c = MaxDetCompletion.complete(pd, free, 1e-13, 10_000);
                iterations += c.sweeps();
                return outcome(requested, c.matrix(), "completion", iterations, free);
            }
        } else if (isPsd(start)) {
            return outcome(requested, start, "none", 0, free);
        }
        if (policy == RepairPolicy.FAIL) {
            throw new NotPositiveSemidefiniteException(Definiteness.of(start, 3));
        }
        double[][] result;
        String method = policy.word();
        if (policy == RepairPolicy.CLIP) {
            result = EigenClip.clip(start);
            iterations += 1;
        } else if (!anyFree) {
            NearestCorrelation.Result r = NearestCorrelation.nearest(start);
            iterations += r.iterations();
            result = r.matrix();
        } else {
            int[][] positions = Matrices.lowerPositions(free);
            int[] row = positions[0];
            int[] col = positions[1];
            int count = row.length;
            double[] weight = new double[count];
            java.util.Arrays.fill(weight, 2.0);
            double[] yFree = new double[count];
            for (int t = 0; t < count; t++) {
                yFree[t] = start[row[t]][col[t]];
            }
            // Cheney-Goldstein: X = nearest(Y), Y = X with the pairs given reset, as a fixed-point
            // iteration on the free pairs with Anderson mixing; each nearest() starts from the last one's
            // diagonal correction (the same limit, a few eigendecompositions instead of a full run)
            AndersonMixing mixing = new AndersonMixing(NearestCorrelation.MEMORY, weight);
            double[] warm = new double[n];
            double[][] x = null;
            for (int outer = 0; outer < OUTER_LIMIT; outer++) {
                double[][] y = Matrices.copy(requested);
                for (int i = 0; i < n; i++) {
                    y[i][i] = 1.0;
                }
                for (int t = 0; t < count; t++) {
                    y[row[t]][col[t]] = yFree[t];
                    y[col[t]][row[t]] = yFree[t];
                }
                NearestCorrelation.Result r = NearestCorrelation.project(y, null, 0.0, NearestCorrelation.DEFAULT_TOLERANCE,
                        NearestCorrelation.DEFAULT_MAX_ITERATIONS, NearestCorrelation.MEMORY, warm, false);
                iterations += r.iterations();
                double norm = Matrices.norm(r.matrix());
                double change = x == null ? Double.POSITIVE_INFINITY : Matrices.distance(r.matrix(), x) / norm;
                x = r.matrix();
                double[] next = new double[count];
                double[] residual = new double[count];
                double residual2 = 0;
                for (int t = 0; t < count; t++) {
                    next[t] = x[row[t]][col[t]];
                    residual[t] = next[t] - yFree[t];
                    residual2 += 2 * residual[t] * residual[t];
                }
                if (Math.max(change, StrictMath.sqrt(residual2) / norm) <= 1e-10) {
                    break;
                }
                yFree = mixing.next(next, residual);
            }
            result = x;
        }
        return outcome(requested, result, method, iterations, free);
    }

    /** True when the smallest eigenvalue is at least −{@link #PSD_TOLERANCE}. */
    public static boolean isPsd(double[][] a) {
        return Matrices.smallestEigenvalue(a) >= -PSD_TOLERANCE;
    }

    private static boolean[][] not(boolean[][] m) {
        boolean[][] r = new boolean[m.length][m.length];
        for (int i = 0; i < m.length; i++) {
            for (int j = 0; j < m.length; j++) {
                r[i][j] = !m[i][j];
            }
        }
        return r;
    }

    private static Outcome outcome(double[][] requested, double[][] result, String method, int iterations, boolean[][] free) {
        int n = requested.length;
        Matrices.symmetrize(result);
        for (int i = 0; i < n; i++) {
            result[i][i] = 1.0;
        }
        List<Change> changed = new ArrayList<>();
        List<Change> completed = new ArrayList<>();
        double max = 0;
        double sumSq = 0;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < i; j++) {
                if (free[i][j]) {
                    completed.add(new Change(i, j, Double.NaN, result[i][j]));
                    continue;
                }
                double d = result[i][j] - requested[i][j];
                if (method.equals("none") || method.equals("completion")) {
                    result[i][j] = requested[i][j];
                    result[j][i] = requested[i][j];
                    continue;
                }
                sumSq += 2 * d * d;
                max = Math.max(max, Math.abs(d));
                if (d != 0) {
                    changed.add(new Change(i, j, requested[i][j], result[i][j]));
                }
            }
        }
        // largest first; sizes equal to 1e-12 count as ties (rounding must not reorder the list), then spec order
        changed.sort(Comparator.comparingLong((Change c) -> -Math.round(c.size() * 1e12)).thenComparingInt(Change::j)
                .thenComparingInt(Change::i));
        return new Outcome(result, method, iterations, max, StrictMath.sqrt(sumSq), List.copyOf(changed), List.copyOf(completed));
    }
}
