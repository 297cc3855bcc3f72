package dev.standin.correlation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class NearestCorrelationTest {

    /**
     * X is the nearest correlation matrix to A exactly when X − A = Diag(θ) + S with S positive
     * semidefinite and S X = 0 (the optimality conditions of the convex problem min ‖X − A‖ over
     * {X ⪰ 0, diag X = 1}; Higham 2002, IMA J. Numer. Anal. 22, theorem 2.4, from memory). With
     * diag X = 1, S X = 0 gives θ<sub>i</sub> = ((X − A) X)<sub>ii</sub>; the check then needs S ⪰ 0 (eigenvalues
     * by EJML, an independent library) and S X ≈ 0. The 200 × 200 case runs the two-thread eigensolver.
     */
    @Test
    void resultsSatisfyTheOptimalityConditions() {
        SplittableRandom random = new SplittableRandom(20261202L);
        for (int trial = 0; trial < 10; trial++) {
            int n = trial < 9 ? 4 + random.nextInt(77) : 200;
            double[][] a = trial < 9 ? TestMatrices.randomUnitDiagonal(n, random) : perturbedFactorModel(n, random);
            NearestCorrelation.Result r = NearestCorrelation.nearest(a);
            assertTrue(r.converged());
            double[][] x = r.matrix();
            double[][] xa = new double[n][n];
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    xa[i][j] = x[i][j] - a[i][j];
                }
            }
            double[][] s = new double[n][n];
            for (int i = 0; i < n; i++) {
                double theta = 0;
                for (int k = 0; k < n; k++) {
                    theta += xa[i][k] * x[k][i];
                }
                for (int j = 0; j < n; j++) {
                    s[i][j] = xa[i][j] - (i == j ? theta : 0.0);
                }
            }
            double worst = 0;
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    double sx = 0;
                    for (int k = 0; k < n; k++) {
                        sx += s[i][k] * x[k][j];
                    }
                    worst = Math.max(worst, Math.abs(sx));
                }
            }
            // the iteration stops at relative changes of 1e-12; products of O(1) entries summed over n terms
            assertTrue(worst < 1e-8, "S X = 0 for n=" + n + ": " + worst);
            assertTrue(TestMatrices.minEigenvalue(s) > -1e-8, "S positive semidefinite for n=" + n + ": " + TestMatrices.minEigenvalue(s));
            assertTrue(TestMatrices.minEigenvalue(x) > -1e-9, "X positive semidefinite for n=" + n);
        }
    }

    /** Anderson acceleration changes the path, not the limit: plain Dykstra (memory 0) reaches the same matrix. */
    @Test
    void accelerationKeepsTheLimitWithAndWithoutFixedEntries() {
        SplittableRandom random = new SplittableRandom(99);
        for (int trial = 0; trial < 8; trial++) {
            int n = 5 + random.nextInt(40);
            double[][] a = TestMatrices.randomUnitDiagonal(n, random);
            boolean[][] fixed = null;
            if (trial % 2 == 1) {
                // hold a few pairs at a small value, a feasible set (the identity-like pairs keep it non-empty)
                fixed = new boolean[n][n];
                for (int t = 0; t < n / 3; t++) {
                    int i = 1 + random.nextInt(n - 1);
                    int j = random.nextInt(i);
                    fixed[i][j] = true;
                    fixed[j][i] = true;
                    a[i][j] = 0.1;
                    a[j][i] = 0.1;
                }
            }
            double floor = trial % 4 == 3 ? 1e-6 : 0.0;
            NearestCorrelation.Result accelerated = NearestCorrelation.project(a, fixed, floor, 1e-13, 100_000, NearestCorrelation.MEMORY, null, false);
            NearestCorrelation.Result plain = NearestCorrelation.project(a, fixed, floor, 1e-13, 100_000, 0, null, false);
            assertTrue(accelerated.converged() && plain.converged());
            assertTrue(accelerated.iterations() <= plain.iterations(), accelerated.iterations() + " vs " + plain.iterations());
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    assertEquals(plain.matrix()[i][j], accelerated.matrix()[i][j], 1e-9, "n=" + n + " (" + i + "," + j + ")");
                    if (fixed != null && fixed[i][j]) {
                        assertEquals(0.1, accelerated.matrix()[i][j], 0.0);
                    }
                }
                assertEquals(1.0, accelerated.matrix()[i][i], 0.0);
            }
        }
    }

    /** A 5-factor correlation matrix with uniform ±0.1 noise on the pairs, rounded to 2 decimals (how people write them). */
    static double[][] perturbedFactorModel(int n, SplittableRandom random) {
        double[][] loadings = new double[n][5];
        for (int i = 0; i < n; i++) {
            double norm = 0;
            for (int k = 0; k < 5; k++) {
                loadings[i][k] = random.nextDouble(-1, 1);
                norm += loadings[i][k] * loadings[i][k];
            }
            double scale = StrictMath.sqrt(0.8 / norm);
            for (int k = 0; k < 5; k++) {
                loadings[i][k] *= scale;
            }
        }
        double[][] a = new double[n][n];
        for (int i = 0; i < n; i++) {
            a[i][i] = 1;
            for (int j = 0; j < i; j++) {
                double v = 0;
                for (int k = 0; k < 5; k++) {
                    v += loadings[i][k] * loadings[j][k];
                }
                v = Math.max(-1, Math.min(1, Math.round((v + random.nextDouble(-0.1, 0.1)) * 100) / 100.0));
                a[i][j] = v;
                a[j][i] = v;
            }
        }
        return a;
    }
}
