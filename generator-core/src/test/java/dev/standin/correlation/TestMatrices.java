package dev.standin.correlation;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;

/** Seeded test matrices and an independent eigenvalue check (EJML), shared by the correlation tests. */
final class TestMatrices {

    private TestMatrices() {
    }

    /** A symmetric matrix with entries uniform on (−1, 1), the diagonal included. */
    static double[][] randomSymmetric(int n, SplittableRandom random) {
        double[][] a = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j <= i; j++) {
                double v = random.nextDouble(-1, 1);
                a[i][j] = v;
                a[j][i] = v;
            }
        }
        return a;
    }

    /** A symmetric matrix with unit diagonal and off-diagonal entries uniform on (−1, 1): rarely a valid correlation matrix. */
    static double[][] randomUnitDiagonal(int n, SplittableRandom random) {
        double[][] a = new double[n][n];
        for (int i = 0; i < n; i++) {
            a[i][i] = 1;
            for (int j = 0; j < i; j++) {
                double v = random.nextDouble(-1, 1);
                a[i][j] = v;
                a[j][i] = v;
            }
        }
        return a;
    }

    /** The smallest eigenvalue by EJML's symmetric decomposition, a library independent of ours. */
    static double minEigenvalue(double[][] m) {
        EigenDecomposition_F64<DMatrixRMaj> e = DecompositionFactory_DDRM.eig(m.length, false, true);
        assertTrue(e.decompose(new DMatrixRMaj(m)));
        double min = Double.POSITIVE_INFINITY;
        for (int p = 0; p < m.length; p++) {
            min = Math.min(min, e.getEigenvalue(p).getReal());
        }
        return min;
    }
}
