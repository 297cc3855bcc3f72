package dev.standin.correlation;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.junit.jupiter.api.Test;

class SymmetricEigenTest {

    @Test
    void agreesWithCommonsMathAndEjml() {
        SplittableRandom random = new SplittableRandom(99);
        for (int n : new int[] {1, 2, 3, 7, 30, 120, 201}) {
            double[][] a = TestMatrices.randomSymmetric(n, random);
            SymmetricEigen ours = SymmetricEigen.of(a);
            // commons-math3 EigenDecomposition: eigenvalues (sorted here)
            double[] cm = new EigenDecomposition(new Array2DRowRealMatrix(a)).getRealEigenvalues();
            Arrays.sort(cm);
            // EJML symmetric decomposition: eigenvalues (sorted here)
            EigenDecomposition_F64<DMatrixRMaj> ejml = DecompositionFactory_DDRM.eig(n, false, true);
            assertTrue(ejml.decompose(new DMatrixRMaj(a)));
            double[] ej = new double[n];
            for (int p = 0; p < n; p++) {
                ej[p] = ejml.getEigenvalue(p).getReal();
            }
            Arrays.sort(ej);
            for (int p = 0; p < n; p++) {
                assertEquals(cm[p], ours.values[p], 1e-11 * n, "n=" + n + " p=" + p);
                assertEquals(ej[p], ours.values[p], 1e-11 * n, "n=" + n + " p=" + p);
            }
            // A v = λ v and orthonormal vectors (definition)
            for (int p = 0; p < n; p++) {
                double[] v = ours.vectors[p];
                for (int i = 0; i < n; i++) {
                    double s = 0;
                    for (int j = 0; j < n; j++) {
                        s += a[i][j] * v[j];
                    }
                    assertEquals(ours.values[p] * v[i], s, 1e-12 * n);
                }
                for (int q = 0; q <= p; q++) {
                    double dot = 0;
                    for (int i = 0; i < n; i++) {
                        dot += v[i] * ours.vectors[q][i];
                    }
                    assertEquals(p == q ? 1.0 : 0.0, dot, 1e-12 * n);
                }
            }
        }
    }

    @Test
    void handlesDiagonalAndRepeatedEigenvalues() {
        SymmetricEigen e = SymmetricEigen.of(new double[][] {{2, 0, 0}, {0, -1, 0}, {0, 0, 2}});
        assertEquals(-1, e.values[0], 0);
        assertEquals(2, e.values[1], 0);
        assertEquals(2, e.values[2], 0);
        // the all-ones 4 × 4 matrix has eigenvalues 0, 0, 0, 4 (closed form: rank one, trace 4)
        double[][] ones = new double[4][4];
        for (double[] row : ones) {
            Arrays.fill(row, 1.0);
        }
        SymmetricEigen o = SymmetricEigen.of(ones);
        assertEquals(0, o.values[0], 1e-14);
        assertEquals(4, o.values[3], 1e-14);
    }

    @Test
    void halvesSideBySideGiveTheSameBitsAsOneThread() {
        // the parallel path (n >= PARALLEL_MIN) must not change a single bit, nor may the values-only path
        SplittableRandom random = new SplittableRandom(7);
        for (int n : new int[] {SymmetricEigen.PARALLEL_MIN, 257}) {
            double[][] a = TestMatrices.randomSymmetric(n, random);
            SymmetricEigen split = SymmetricEigen.of(a, true);
            SymmetricEigen single = SymmetricEigen.of(a, false);
            assertArrayEquals(single.values, split.values, 0.0);
            assertArrayEquals(single.values, SymmetricEigen.values(a), 0.0);
            for (int p = 0; p < n; p++) {
                assertArrayEquals(single.vectors[p], split.vectors[p], 0.0, "n=" + n + " vector " + p);
            }
        }
    }
}
