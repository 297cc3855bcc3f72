package dev.standin.correlation;

/**
 * Eigenvalues and eigenvectors of a real symmetric matrix by Householder reduction to tridiagonal
 * form followed by the implicit QL algorithm: the EISPACK routines TRED2 and TQL2 (B. T. Smith et
 * al., <i>Matrix Eigensystem Routines — EISPACK Guide</i>, Springer LNCS 6, 1976), derived from the
 * Algol procedures of Bowdler, Martin, Reinsch and Wilkinson in J. H. Wilkinson and C. Reinsch,
 * <i>Handbook for Automatic Computation, vol. II: Linear Algebra</i>, Springer (1971), II/2 and II/3.
 *
 * <p>Written on plain row-major arrays because the nearest-correlation iteration needs one
 * decomposition per step and commons-math3's general-purpose version is several times slower on
 * large matrices; tested against commons-math3 and EJML. Plain arithmetic, {@link StrictMath#sqrt}
 * only, so results are identical on every JVM.
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
        int n = a.length;
        double[][] v = new double[n][];
        for (int i = 0; i < n; i++) {
            v[i] = a[i].clone();
        }
        double[] d = new double[n];
        double[] e = new double[n];
        if (n == 0) {
            return new SymmetricEigen(d, v);
        }
        tridiagonalize(v, d, e);
        // QL works on the transpose so that each rotation touches two contiguous rows
        double[][] w = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                w[j][i] = v[i][j];
            }
        }
        ql(w, d, e);
        return new SymmetricEigen(d, w);
    }

    /** TRED2: Householder reduction; on return v holds the orthogonal transformation, d and e the tridiagonal. */
    private static void tridiagonalize(double[][] v, double[] d, double[] e) {
        int n = d.length;
        for (int j = 0; j < n; j++) {
            d[j] = v[n - 1][j];
        }
        for (int i = n - 1; i > 0; i--) {
            double scale = 0.0;
            double h = 0.0;
            for (int k = 0; k < i; k++) {
                scale += Math.abs(d[k]);
            }
            if (scale == 0.0) {
                e[i] = d[i - 1];
                for (int j = 0; j < i; j++) {
                    d[j] = v[i - 1][j];
                    v[i][j] = 0.0;
                    v[j][i] = 0.0;
                }
            } else {
                for (int k = 0; k < i; k++) {
                    d[k] /= scale;
                    h += d[k] * d[k];
                }
                double f = d[i - 1];
                double g = StrictMath.sqrt(h);
                if (f > 0) {
                    g = -g;
                }
                e[i] = scale * g;
                h -= f * g;
                d[i - 1] = f - g;
                for (int j = 0; j < i; j++) {
                    e[j] = 0.0;
                }
                for (int j = 0; j < i; j++) {
                    f = d[j];
                    v[j][i] = f;
                    double[] vj = v[j];
                    g = e[j] + vj[j] * f;
                    for (int k = j + 1; k <= i - 1; k++) {
                        double[] vk = v[k];
                        g += vk[j] * d[k];
                        e[k] += vk[j] * f;
                    }
                    e[j] = g;
                }
                f = 0.0;
                for (int j = 0; j < i; j++) {
                    e[j] /= h;
                    f += e[j] * d[j];
                }
                double hh = f / (h + h);
                for (int j = 0; j < i; j++) {
                    e[j] -= hh * d[j];
                }
                for (int j = 0; j < i; j++) {
                    f = d[j];
                    g = e[j];
                    for (int k = j; k <= i - 1; k++) {
                        v[k][j] -= (f * e[k] + g * d[k]);
                    }
                    d[j] = v[i - 1][j];
                    v[i][j] = 0.0;
                }
            }
            d[i] = h;
        }
        // accumulate the transformations
        for (int i = 0; i < n - 1; i++) {
            v[n - 1][i] = v[i][i];
            v[i][i] = 1.0;
            double h = d[i + 1];
            if (h != 0.0) {
                for (int k = 0; k <= i; k++) {
                    d[k] = v[k][i + 1] / h;
                }
                for (int j = 0; j <= i; j++) {
                    double g = 0.0;
                    for (int k = 0; k <= i; k++) {
                        g += v[k][i + 1] * v[k][j];
                    }
                    for (int k = 0; k <= i; k++) {
                        v[k][j] -= g * d[k];
                    }
                }
            }
            for (int k = 0; k <= i; k++) {
                v[k][i + 1] = 0.0;
            }
        }
        for (int j = 0; j < n; j++) {
            d[j] = v[n - 1][j];
            v[n - 1][j] = 0.0;
        }
        v[n - 1][n - 1] = 1.0;
        e[0] = 0.0;
    }

    /** TQL2: implicit QL iterations on the tridiagonal, accumulating into the rows of w; sorts ascending. */
    private static void ql(double[][] w, double[] d, double[] e) {
        int n = d.length;
        for (int i = 1; i < n; i++) {
            e[i - 1] = e[i];
        }
        e[n - 1] = 0.0;
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
                        double[] wi = w[i];
                        double[] wi1 = w[i + 1];
                        for (int k = 0; k < n; k++) {
                            h = wi1[k];
                            wi1[k] = s * wi[k] + c * h;
                            wi[k] = c * wi[k] - s * h;
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
                double[] t = w[i];
                w[i] = w[k];
                w[k] = t;
            }
        }
    }

    /** √(a² + b²); the direct formula is exact enough here and far faster than {@link StrictMath#hypot}. */
    private static double hypot(double a, double b) {
        double r = StrictMath.sqrt(a * a + b * b);
        return Double.isInfinite(r) || r == 0.0 && (a != 0.0 || b != 0.0) ? StrictMath.hypot(a, b) : r;
    }
}
