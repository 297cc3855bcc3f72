package dev.standin.correlation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.CholeskyDecomposition_F64;
import org.junit.jupiter.api.Test;

/**
 * {@link Cholesky} against EJML 0.43's Cholesky decomposition ({@code DecompositionFactory_DDRM.chol})
 * as an independent implementation. The lower-triangular factor with a positive diagonal is unique
 * (Golub and Van Loan, <i>Matrix Computations</i>, 4th ed., theorem 4.2.7), so both must agree up
 * to rounding.
 */
class CholeskyTest {

    /** A random SPD matrix B Bᵀ/k + 0.1 I with B standard normal (entries of order 1). */
    private static double[][] randomSpd(int k, SplittableRandom rnd) {
        double[][] b = new double[k][k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                b[i][j] = gaussian(rnd);
            }
        }
        double[][] a = new double[k][k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j <= i; j++) {
                double s = 0;
                for (int p = 0; p < k; p++) {
                    s += b[i][p] * b[j][p];
                }
                s /= k;
                if (i == j) {
                    s += 0.1;
                }
                a[i][j] = s;
                a[j][i] = s;
            }
        }
        return a;
    }

    /** Scales an SPD matrix to unit diagonal: a correlation matrix. */
    private static double[][] toCorrelation(double[][] a) {
        int k = a.length;
        double[][] c = new double[k][k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                c[i][j] = i == j ? 1.0 : a[i][j] / Math.sqrt(a[i][i] * a[j][j]);
            }
        }
        return c;
    }

    /** Box–Muller (G. E. P. Box and M. E. Muller, Ann. Math. Statist. 29, 1958). */
    private static double gaussian(SplittableRandom rnd) {
        double u = 1.0 - rnd.nextDouble();
        return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rnd.nextDouble());
    }

    private static double[][] ejmlFactor(double[][] a) {
        DMatrixRMaj m = new DMatrixRMaj(a);
        CholeskyDecomposition_F64<DMatrixRMaj> chol = DecompositionFactory_DDRM.chol(a.length, true);
        assertTrue(chol.decompose(m), "EJML rejects the matrix");
        DMatrixRMaj l = chol.getT(null);
        double[][] out = new double[a.length][a.length];
        for (int i = 0; i < a.length; i++) {
            for (int j = 0; j < a.length; j++) {
                out[i][j] = l.get(i, j);
            }
        }
        return out;
    }

    private static void assertFactorOf(double[][] a, double[][] l) {
        int k = a.length;
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                if (j > i) {
                    assertEquals(0.0, l[i][j], 0.0, "upper triangle must be zero");
                }
                double s = 0;
                for (int p = 0; p < k; p++) {
                    s += l[i][p] * l[j][p];
                }
                // L Lᵀ = A (definition of the factorisation), to 1e-12 for entries of order 1
                assertEquals(a[i][j], s, 1e-12 * Math.max(1.0, Math.abs(a[i][j])), "(L Lᵀ)[" + i + "][" + j + "]");
            }
            assertTrue(l[i][i] > 0, "positive diagonal");
        }
    }

    @Test
    void matchesEjmlOnRandomSpdMatrices() throws Exception {
        SplittableRandom rnd = new SplittableRandom(17L);
        for (int k = 2; k <= 50; k++) {
            for (int rep = 0; rep < 3; rep++) {
                double[][] a = randomSpd(k, rnd);
                if (rep == 1) {
                    a = toCorrelation(a);
                }
                double[][] ours = Cholesky.factor(a);
                double[][] theirs = ejmlFactor(a);
                for (int i = 0; i < k; i++) {
                    for (int j = 0; j < k; j++) {
                        assertEquals(theirs[i][j], ours[i][j], 1e-12 * Math.max(1.0, Math.abs(theirs[i][j])),
                                "k = " + k + ", L[" + i + "][" + j + "]");
                    }
                }
                assertFactorOf(a, ours);
            }
        }
    }

    @Test
    void twoByTwoClosedForm() throws Exception {
        // [[1, ρ], [ρ, 1]] = L Lᵀ with L = [[1, 0], [ρ, √(1 − ρ²)]] (the textbook bivariate construction)
        for (double rho : new double[] {-0.99, -0.5, 0.0, 0.3, 0.95}) {
            double[][] l = Cholesky.factor(new double[][] {{1, rho}, {rho, 1}});
            assertEquals(1.0, l[0][0], 0.0);
            assertEquals(0.0, l[0][1], 0.0);
            assertEquals(rho, l[1][0], 0.0);
            assertEquals(Math.sqrt(1 - rho * rho), l[1][1], 1e-16);
        }
    }

    @Test
    void inputIsNotModified() throws Exception {
        double[][] a = randomSpd(6, new SplittableRandom(3L));
        double[][] copy = new double[6][];
        for (int i = 0; i < 6; i++) {
            copy[i] = a[i].clone();
        }
        Cholesky.factor(a);
        for (int i = 0; i < 6; i++) {
            for (int j = 0; j < 6; j++) {
                assertEquals(copy[i][j], a[i][j], 0.0);
            }
        }
    }

    @Test
    void indefiniteMatrixThrows() {
        // [[1, .9, .9], [.9, 1, −.9], [.9, −.9, 1]] has eigenvalue 1 − 1.8 = −0.8 < 0 with eigenvector
        // (1, −1, −1)/√3 (closed form); the third pivot is 1 − .81 − ((−.9 − .81)/√.19)² = −15.2.
        double[][] a = {{1, 0.9, 0.9}, {0.9, 1, -0.9}, {0.9, -0.9, 1}};
        assertFalse(DecompositionFactory_DDRM.chol(3, true).decompose(new DMatrixRMaj(a)), "EJML agrees");
        Cholesky.NotPositiveDefiniteException e = assertThrows(Cholesky.NotPositiveDefiniteException.class,
                () -> Cholesky.factor(a));
        assertEquals(2, e.index());
        String prefix = "not positive definite: pivot 2 is ";
        assertTrue(e.getMessage().startsWith(prefix), e.getMessage());
        assertEquals(-15.2, Double.parseDouble(e.getMessage().substring(prefix.length())), 1e-12);
    }

    @Test
    void singularAndNonNumericMatricesThrow() {
        // [[1, 1], [1, 1]] is singular (rank 1): the second pivot is 1 − 1·1 = 0, not > 0
        Cholesky.NotPositiveDefiniteException singular = assertThrows(Cholesky.NotPositiveDefiniteException.class,
                () -> Cholesky.factor(new double[][] {{1, 1}, {1, 1}}));
        assertEquals(1, singular.index());
        // a negative first pivot
        assertEquals(0, assertThrows(Cholesky.NotPositiveDefiniteException.class,
                () -> Cholesky.factor(new double[][] {{-1, 0}, {0, 1}})).index());
        // NaN is not > 0
        assertEquals(0, assertThrows(Cholesky.NotPositiveDefiniteException.class,
                () -> Cholesky.factor(new double[][] {{Double.NaN, 0}, {0, 1}})).index());
        // a random SPD matrix with one correlation pushed past what the rest allows
        double[][] a = toCorrelation(randomSpd(8, new SplittableRandom(5L)));
        a[7][0] = a[0][7] = 0.999;
        a[7][1] = a[1][7] = -0.999;
        a[1][0] = a[0][1] = 0.999;
        double[][] bad = a;
        assertFalse(DecompositionFactory_DDRM.chol(8, true).decompose(new DMatrixRMaj(bad)), "EJML agrees");
        assertThrows(Cholesky.NotPositiveDefiniteException.class, () -> Cholesky.factor(bad));
    }
}
