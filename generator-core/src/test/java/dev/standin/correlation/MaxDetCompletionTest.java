package dev.standin.correlation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.CholeskyDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.junit.jupiter.api.Test;

class MaxDetCompletionTest {

    /**
     * The maximum-determinant completion is the positive definite completion whose inverse is zero at
     * every unspecified position (Dempster 1972, Biometrics 28; Grone, Johnson, Sá and Wolkowicz 1984,
     * Linear Algebra Appl. 58, theorem 2). Random sparse patterns of specified pairs, taken from a
     * random positive definite matrix so that a completion exists; the inverse comes from
     * commons-math3's Cholesky decomposition, an independent library.
     */
    @Test
    void inverseVanishesAtTheFreePairsAndSpecifiedPairsStay() throws Exception {
        SplittableRandom random = new SplittableRandom(17);
        for (int trial = 0; trial < 12; trial++) {
            int n = 6 + random.nextInt(55);
            double[][] full = randomCorrelation(n, random);
            double[][] requested = new double[n][n];
            double density = 0.05 + 0.3 * random.nextDouble();
            for (int i = 0; i < n; i++) {
                requested[i][i] = 1;
                for (int j = 0; j < i; j++) {
                    double v = random.nextDouble() < density ? full[i][j] : Double.NaN;
                    requested[i][j] = v;
                    requested[j][i] = v;
                }
            }
            CorrelationRepair.Outcome o = CorrelationRepair.repair(requested, RepairPolicy.FAIL);
            assertEquals("completion", o.method());
            double[][] x = o.matrix();
            RealMatrix inverse = new CholeskyDecomposition(new Array2DRowRealMatrix(x)).getSolver().getInverse();
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < i; j++) {
                    if (Double.isNaN(requested[i][j])) {
                        double scaled = inverse.getEntry(i, j) / Math.sqrt(inverse.getEntry(i, i) * inverse.getEntry(j, j));
                        // the iteration accepts at 1e-13; another library's inverse adds rounding of order n·1e-16·cond
                        assertTrue(Math.abs(scaled) < 1e-9, "n=" + n + " free (" + i + "," + j + "): " + scaled);
                    } else {
                        assertEquals(requested[i][j], x[i][j], 0.0);
                    }
                }
            }
        }
    }

    /** C = B B^T rescaled to unit diagonal, B with n/2 + 1 random normal columns: positive definite. */
    private static double[][] randomCorrelation(int n, SplittableRandom random) {
        int k = n / 2 + 1;
        double[][] b = new double[n][k];
        for (double[] row : b) {
            for (int c = 0; c < k; c++) {
                row[c] = random.nextGaussian();
            }
        }
        double[][] c = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j <= i; j++) {
                double s = 0;
                for (int t = 0; t < k; t++) {
                    s += b[i][t] * b[j][t];
                }
                c[i][j] = s;
                c[j][i] = s;
            }
        }
        double[][] r = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                r[i][j] = c[i][j] / Math.sqrt(c[i][i] * c[j][j]);
            }
        }
        return r;
    }
}
