package dev.standin.correlation;

/**
 * Eigenvalues and eigenvectors of a real symmetric matrix: Householder reduction to tridiagonal
 * form, A = Q T Q<sup>T</sup>, followed by the implicit QL algorithm on T with the rotations
 * accumulated into Q. The reduction and the forming of Q follow LAPACK's DSYTD2 (lower) and DORG2L
 * (E. Anderson et al., <i>LAPACK Users' Guide</i>, 3rd ed., SIAM 1999; G. H. Golub and C. F. Van
 * Loan, <i>Matrix Computations</i>, 4th ed., 2013, algorithm 8.3.1 and section 5.1.6); the QL step is
 * EISPACK's TQL2 (B. T. Smith et al., <i>Matrix Eigensystem Routines — EISPACK Guide</i>, Springer
 * LNCS 6, 1976, from the Algol procedure of Bowdler, Martin, Reinsch and Wilkinson in J. H.
 * Wilkinson and C. Reinsch, <i>Handbook for Automatic Computation, vol. II</i>, 1971, II/3).
 *
 * <p>Written on plain row-major arrays because the nearest-correlation iteration needs one
 * decomposition per step and commons-math3's general-purpose version is several times slower on
 * large matrices. Every inner loop runs along a row (the matrix is kept in full symmetric storage,
 * so a column is a row), which the JIT vectorises; the reduction is an ordered sequence of plain
 * operations and {@link StrictMath#sqrt}, so results are identical on every JVM. Tested against
 * commons-math3 and EJML.
 */
final class SymmetricEigen {

    /** Eigenvalues in ascending order. */
    final double[] values;
    /** Eigenvectors as rows: vectors[p] is the unit eigenvector of values[p]. */
    final double[][] vectors;

    private SymmetricEigen(double[] values, double[][] vectors) {
        this.values = values;
        this.vectors = vectors;
    }

    /** Decomposes the symmetric matrix a (only its lower triangle is read); a is not modified. */
    static SymmetricEigen of(double[][] a) {
        return of(a, true);
    }

    /**
     * As {@link #of(double[][])}; when {@code parallel} and the matrix has at least {@link #PARALLEL_MIN}
     * rows, forming Q and accumulating the QL rotations run as two halves of the columns of Q<sup>T</sup>
     * side by side, the second on the common fork-join pool (each half repeats the cheap scalar QL
     * recurrence, so the two share nothing but read-only input). Every entry sees the same operations
     * in the same order either way, so the result is the same to the last bit.
     */
    static SymmetricEigen of(double[][] a, boolean parallel) {
        int n = a.length;
        double[] d = new double[n];
        double[] e = new double[n];
        if (n == 0) {
            return new SymmetricEigen(d, new double[0][]);
        }
        double[][] work = symmetricCopy(a);
        double[] tau = new double[n];
        tridiagonalize(work, d, e, tau);
        int[] cut = parallel && splitsInTwo(n) ? new int[] {0, n / 2, n} : new int[] {0, n};
        int parts = cut.length - 1;
        // Q in column blocks; then W = Q^T in column blocks (rows k of Q), on which QL rotates pairs of rows
        double[][][] q = new double[parts][][];
        inParts(parts, p -> q[p] = formQ(work, tau, cut[p], cut[p + 1]));
        double[][] dPart = new double[parts][];
        double[][] ePart = new double[parts][];
        for (int p = 0; p < parts; p++) {
            dPart[p] = d.clone();
            ePart[p] = e.clone();
        }
        double[][][] w = new double[parts][][];
        inParts(parts, p -> {
            int from = cut[p];
            int width = cut[p + 1] - from;
            double[][] block = new double[n][width];
            for (int k = 0; k < width; k++) {
                for (int b = 0; b < parts; b++) {
                    double[] qk = q[b][from + k];
                    for (int j = 0; j < qk.length; j++) {
                        block[cut[b] + j][k] = qk[j];
                    }
                }
            }
            ql(block, dPart[p], ePart[p]);
            w[p] = block;
        });
        if (parts == 1) {
            return new SymmetricEigen(dPart[0], w[0]);
        }
        double[][] vectors = new double[n][n];
        for (int r = 0; r < n; r++) {
            for (int p = 0; p < parts; p++) {
                System.arraycopy(w[p][r], 0, vectors[r], cut[p], cut[p + 1] - cut[p]);
            }
        }
        return new SymmetricEigen(dPart[0], vectors);
    }

    /** Matrices with at least this many rows are decomposed in two halves side by side. */
    static final int PARALLEL_MIN = 160;

    /** Whether work on an n × n matrix is split in two halves side by side (large enough, and a second processor). */
    static boolean splitsInTwo(int n) {
        return n >= PARALLEL_MIN && Runtime.getRuntime().availableProcessors() > 1;
    }

    /** Runs part 0 .. parts−1 (at most 2), the second on the common fork-join pool; the caller runs it when the pool is busy. */
    static void inParts(int parts, java.util.function.IntConsumer part) {
        if (parts == 1) {
            part.accept(0);
            return;
        }
        java.util.concurrent.ForkJoinTask<?> second = java.util.concurrent.ForkJoinTask.adapt(() -> part.accept(1)).fork();
        part.accept(0);
        second.join();
    }

    /** The eigenvalues of the symmetric matrix a in ascending order, without the vectors. */
    static double[] values(double[][] a) {
        int n = a.length;
        double[] d = new double[n];
        double[] e = new double[n];
        if (n == 0) {
            return d;
        }
        tridiagonalize(symmetricCopy(a), d, e, new double[n]);
        ql(null, d, e);
        return d;
    }

    /** The full symmetric matrix from the lower triangle of a. */
    private static double[][] symmetricCopy(double[][] a) {
        int n = a.length;
        double[][] w = new double[n][n];
        for (int i = 0; i < n; i++) {
            System.arraycopy(a[i], 0, w[i], 0, i + 1);
            for (int j = 0; j < i; j++) {
                w[j][i] = a[i][j];
            }
        }
        return w;
    }

    /**
     * DSYTD2, lower: for i = 0 .. n−3 a reflector H<sub>i</sub> = I − τ<sub>i</sub> u u<sup>T</sup> (u<sub>i+1</sub> = 1)
     * zeroes column i below the subdiagonal, and the trailing block is updated as A ← A − u w<sup>T</sup> − w u<sup>T</sup>
     * with p = τ A u, w = p − (τ/2)(p<sup>T</sup>u) u. On return d and e hold the diagonal and the
     * subdiagonal (e[i] couples i and i+1; e[n−1] = 0), row i of a holds u<sub>i+2..n−1</sub> in
     * columns i+2..n−1, and tau the τ<sub>i</sub>.
     */
    private static void tridiagonalize(double[][] a, double[] d, double[] e, double[] tau) {
        int n = d.length;
        double[] p = new double[n];
        double[] u = new double[n];
        for (int i = 0; i < n - 2; i++) {
            double[] ai = a[i];
            int s = i + 1;
            double alpha = ai[s];
            double xnorm2 = 0.0;
            for (int c = s + 1; c < n; c++) {
                xnorm2 += ai[c] * ai[c];
            }
            d[i] = ai[i];
            if (xnorm2 == 0.0) {
                tau[i] = 0.0;
                e[i] = alpha;
                continue;
            }
            double beta = StrictMath.sqrt(alpha * alpha + xnorm2);
            if (alpha > 0) {
                beta = -beta;
            }
            double t = (beta - alpha) / beta;
            double scale = 1.0 / (alpha - beta);
            tau[i] = t;
            e[i] = beta;
            u[s] = 1.0;
            for (int c = s + 1; c < n; c++) {
                u[c] = ai[c] * scale;
                ai[c] = u[c];
            }
            // p = τ A u over the trailing block (rows s..n−1), row by row
            java.util.Arrays.fill(p, s, n, 0.0);
            for (int r = s; r < n; r++) {
                axpy(t * u[r], a[r], p, s, n);
            }
            double pu = 0.0;
            for (int c = s; c < n; c++) {
                pu += p[c] * u[c];
            }
            double k = 0.5 * t * pu;
            for (int c = s; c < n; c++) {
                p[c] -= k * u[c];
            }
            for (int r = s; r < n; r++) {
                rankTwo(a[r], u[r], p, p[r], u, s, n);
            }
        }
        if (n >= 2) {
            d[n - 2] = a[n - 2][n - 2];
            e[n - 2] = a[n - 1][n - 2];
        }
        d[n - 1] = a[n - 1][n - 1];
        e[n - 1] = 0.0;
    }

    /**
     * DORG2L-style backward accumulation Q = H<sub>0</sub> H<sub>1</sub> ⋯ H<sub>n−3</sub>, columns [from, to) only
     * (returned as an n × (to − from) block): applying H<sub>i</sub> from the left to the product of the
     * later reflectors only touches rows and columns i+1..n−1, and each column is independent of the others.
     */
    private static double[][] formQ(double[][] a, double[] tau, int from, int to) {
        int n = a.length;
        int width = to - from;
        double[][] q = new double[n][width];
        for (int i = from; i < to; i++) {
            q[i][i - from] = 1.0;
        }
        double[] w = new double[width];
        for (int i = n - 3; i >= 0; i--) {
            double t = tau[i];
            int s = i + 1;
            int c0 = Math.max(s, from) - from;
            if (t == 0.0 || c0 >= width) {
                continue;
            }
            double[] ai = a[i];
            // w = u^T Q over rows s..n−1 (u_s = 1), then Q ← Q − τ u w^T
            System.arraycopy(q[s], c0, w, c0, width - c0);
            for (int r = s + 1; r < n; r++) {
                axpy(ai[r], q[r], w, c0, width);
            }
            for (int r = s; r < n; r++) {
                axpy(-(r == s ? t : t * ai[r]), w, q[r], c0, width);
            }
        }
        return q;
    }

    /** TQL2: implicit QL iterations on the tridiagonal, accumulating into the rows of w (unless null); sorts ascending. */
    private static void ql(double[][] w, double[] d, double[] e) {
        int n = d.length;
        double f = 0.0;
        double tst1 = 0.0;
        double eps = 0x1.0p-52;
        for (int l = 0; l < n; l++) {
            tst1 = Math.max(tst1, Math.abs(d[l]) + Math.abs(e[l]));
            int m = l;
            while (m < n) {
                if (Math.abs(e[m]) <= eps * tst1) {
                    break;
                }
                m++;
            }
            if (m > l) {
                int iterations = 0;
                do {
                    if (++iterations > 60) {
                        throw new ArithmeticException("eigenvalue iteration did not converge");
                    }
                    double g = d[l];
                    double p = (d[l + 1] - g) / (2.0 * e[l]);
                    double r = hypot(p, 1.0);
                    if (p < 0) {
                        r = -r;
                    }
                    d[l] = e[l] / (p + r);
                    d[l + 1] = e[l] * (p + r);
                    double dl1 = d[l + 1];
                    double h = g - d[l];
                    for (int i = l + 2; i < n; i++) {
                        d[i] -= h;
                    }
                    f += h;
                    p = d[m];
                    double c = 1.0;
                    double c2 = c;
                    double c3 = c;
                    double el1 = e[l + 1];
                    double s = 0.0;
                    double s2 = 0.0;
                    for (int i = m - 1; i >= l; i--) {
                        c3 = c2;
                        c2 = c;
                        s2 = s;
                        g = c * e[i];
                        h = c * p;
                        r = hypot(p, e[i]);
                        e[i + 1] = s * r;
                        s = e[i] / r;
                        c = p / r;
                        p = c * d[i] - s * g;
                        d[i + 1] = h + s * (c * g + s * d[i]);
                        if (w != null) {
                            double[] wi = w[i];
                            double[] wi1 = w[i + 1];
                            rotate(wi, wi1, c, s, wi.length);
                        }
                    }
                    p = -s * s2 * c3 * el1 * e[l] / dl1;
                    e[l] = s * p;
                    d[l] = c * p;
                } while (Math.abs(e[l]) > eps * tst1);
            }
            d[l] += f;
            e[l] = 0.0;
        }
        for (int i = 0; i < n - 1; i++) {
            int k = i;
            double p = d[i];
            for (int j = i + 1; j < n; j++) {
                if (d[j] < p) {
                    k = j;
                    p = d[j];
                }
            }
            if (k != i) {
                d[k] = d[i];
                d[i] = p;
                if (w != null) {
                    double[] t = w[i];
                    w[i] = w[k];
                    w[k] = t;
                }
            }
        }
    }

    /**
     * (wi, wi1) ← (c·wi − s·wi1, s·wi + c·wi1). A method of its own, with the rows checked distinct
     * and wi stored first: in that form HotSpot 17's C2 vectorises the loop (measured about 2.5 times
     * faster than the same arithmetic written otherwise).
     */
    private static void rotate(double[] wi, double[] wi1, double c, double s, int n) {
        if (wi == wi1) {
            throw new IllegalArgumentException("a rotation needs two rows");
        }
        for (int k = 0; k < n; k++) {
            double lower = wi[k];
            double upper = wi1[k];
            wi[k] = c * lower - s * upper;
            wi1[k] = s * lower + c * upper;
        }
    }

    /*
     * The inner loops are small methods of their own: called hundreds of thousands of times per
     * decomposition, they are compiled (and vectorised) by the JIT within the first decomposition,
     * where loops inside one long method would wait for on-stack replacement.
     */

    /** y ← y + a·x on [from, to). */
    static void axpy(double a, double[] x, double[] y, int from, int to) {
        for (int c = from; c < to; c++) {
            y[c] += a * x[c];
        }
    }

    /** row ← row − (ur·p + pr·u) on [from, to): one row of the symmetric rank-two update. */
    private static void rankTwo(double[] row, double ur, double[] p, double pr, double[] u, int from, int to) {
        for (int c = from; c < to; c++) {
            row[c] -= ur * p[c] + pr * u[c];
        }
    }

    /** √(a² + b²); the direct formula is exact enough here and far faster than {@link StrictMath#hypot}. */
    private static double hypot(double a, double b) {
        double r = StrictMath.sqrt(a * a + b * b);
        return Double.isInfinite(r) || r == 0.0 && (a != 0.0 || b != 0.0) ? StrictMath.hypot(a, b) : r;
    }
}
