package dev.standin.correlation;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.junit.jupiter.api.Test;

class CorrelationRepairTest {

    private static final double NA = Double.NaN;

    @Test
    void highamExampleMatchesThePublishedNearestMatrix() throws Exception {
        // Higham 2002, IMA J. Numer. Anal. 22:329-343, section 3: the nearest correlation matrix to
        // [[1,1,0],[1,1,1],[0,1,1]] has off-diagonals 0.7607 and 0.1573 (paper, 4 digits); a reference
        // run of the same algorithm gave 0.7606898 and 0.1572981.
        CorrelationRepair.Outcome o = CorrelationRepair.repair(new double[][] {{1, 1, 0}, {1, 1, 1}, {0, 1, 1}},
                RepairPolicy.NEAREST);
        double[][] x = o.matrix();
        assertEquals("nearest", o.method());
        assertEquals(0.7606898, x[0][1], 1e-6);
        assertEquals(0.7606898, x[1][2], 1e-6);
        assertEquals(0.1572981, x[0][2], 1e-6);
        assertTrue(TestMatrices.minEigenvalue(x) > -1e-10);
    }

    @Test
    void completionKeepsSpecifiedPairsAndPicksTheMaximumDeterminantValue() throws Exception {
        // a~b = b~c = 0.9 with a~c free: the feasible interval for a~c is [0.9·0.9 − 0.19, 1] =
        // [0.62, 1] (det ≥ 0 of the 3×3, closed form); the maximum-determinant completion is the
        // conditional-independence value 0.9·0.9 = 0.81 (Dempster 1972; Grone et al. 1984).
        CorrelationRepair.Outcome o = CorrelationRepair.repair(new double[][] {{1, 0.9, NA}, {0.9, 1, 0.9}, {NA, 0.9, 1}},
                RepairPolicy.NEAREST);
        assertEquals("completion", o.method());
        assertEquals(0.9, o.matrix()[0][1], 0.0);
        assertEquals(0.9, o.matrix()[1][2], 0.0);
        assertEquals(0.81, o.matrix()[0][2], 1e-10);
        assertEquals(0.0, o.maxChange(), 0.0);
        assertTrue(o.changed().isEmpty());
        assertEquals(1, o.completed().size());
    }

    @Test
    void chainCompletionHasZerosInTheInverse() throws Exception {
        // Max-determinant completions are characterised by (X^-1)_ij = 0 at the free positions
        // (Grone, Johnson, Sá and Wolkowicz 1984, theorem 2); for an AR(1)-like chain this gives
        // 0.9^|i-j| (closed form).
        double[][] a = {{1, 0.9, NA, NA}, {0.9, 1, 0.9, NA}, {NA, 0.9, 1, 0.9}, {NA, NA, 0.9, 1}};
        CorrelationRepair.Outcome o = CorrelationRepair.repair(a, RepairPolicy.FAIL);
        for (int i = 0; i < 4; i++) {
            for (int j = 0; j < 4; j++) {
                assertEquals(Math.pow(0.9, Math.abs(i - j)), o.matrix()[i][j], 1e-9, i + "," + j);
            }
        }
        double[][] inv = MaxDetCompletion.inverse(o.matrix());
        assertEquals(0.0, inv[0][2], 1e-8);
        assertEquals(0.0, inv[0][3], 1e-8);
        assertEquals(0.0, inv[1][3], 1e-8);
    }

    @Test
    void inconsistentPairsMoveAsLittleAsNeeded() throws Exception {
        // a~b = 0.9, b~c = 0.9, a~c = -0.9 admit no valid matrix (det < 0; closed form: det = 1 − 3(0.81) − 2(0.729) < 0).
        // By symmetry of the problem the nearest correlation matrix moves all three by the same amount
        // to ±0.5, where the matrix [[1,.5,-.5],[.5,1,.5],[-.5,.5,1]] is singular (det = 0, closed form).
        double[][] a = {{1, 0.9, -0.9}, {0.9, 1, 0.9}, {-0.9, 0.9, 1}};
        CorrelationRepair.Outcome o = CorrelationRepair.repair(a, RepairPolicy.NEAREST);
        assertEquals(0.5, o.matrix()[0][1], 1e-9);
        assertEquals(0.5, o.matrix()[1][2], 1e-9);
        assertEquals(-0.5, o.matrix()[0][2], 1e-9);
        assertEquals(0.4, o.maxChange(), 1e-9);
        assertEquals(3, o.changed().size());
        assertThrows(CorrelationRepair.NotPositiveSemidefiniteException.class, () -> CorrelationRepair.repair(a, RepairPolicy.FAIL));
    }

    @Test
    void inconsistentPairsAmongFreePairsMoveOnlyWhereTheyMust() throws Exception {
        // the triangle above inside five columns: a, b, c as before, c ~ d = 0.2, d ~ e = 0.3, the other
        // pairs free. Any valid matrix has a valid a, b, c block, so the triangle must move at least to its
        // own nearest matrix (±0.5 above, unique); that block extends with c ~ d and d ~ e kept (a chain
        // hanging off c), so the closest choice moves the triangle to ±0.5 and nothing else (argument, not a table).
        double n = Double.NaN;
        double[][] a = {
            {1, 0.9, -0.9, n, n},
            {0.9, 1, 0.9, n, n},
            {-0.9, 0.9, 1, 0.2, n},
            {n, n, 0.2, 1, 0.3},
            {n, n, n, 0.3, 1}};
        CorrelationRepair.Outcome o = CorrelationRepair.repair(a, RepairPolicy.NEAREST);
        assertEquals("nearest", o.method());
        double[][] x = o.matrix();
        assertEquals(0.5, x[0][1], 1e-6);
        assertEquals(0.5, x[1][2], 1e-6);
        assertEquals(-0.5, x[0][2], 1e-6);
        assertEquals(0.2, x[2][3], 1e-6);
        assertEquals(0.3, x[3][4], 1e-6);
        assertEquals(0.4, o.maxChange(), 1e-6);
        // eigenvalues by commons-math3, an independent library: the result is a valid correlation matrix
        double[] ev = new org.apache.commons.math3.linear.EigenDecomposition(
                new org.apache.commons.math3.linear.Array2DRowRealMatrix(x)).getRealEigenvalues();
        for (double v : ev) {
            assertTrue(v > -1e-9, "eigenvalue " + v);
        }
    }

    @Test
    void pairsOfPlusOrMinusOneAmongFreePairsAreKeptExactly() throws Exception {
        // a ~ b = 1 makes b = a, c ~ d = −1 makes d = −c; with b ~ c = 0.5 every other pair follows
        // by substitution: a ~ c = 0.5, a ~ d = b ~ d = −0.5 (closed form, no choice left)
        double n = Double.NaN;
        double[][] a = {{1, 1, n, n}, {1, 1, 0.5, n}, {n, 0.5, 1, -1}, {n, n, -1, 1}};
        CorrelationRepair.Outcome o = CorrelationRepair.repair(a, RepairPolicy.FAIL);
        assertEquals("completion", o.method());
        double[][] expected = {{1, 1, 0.5, -0.5}, {1, 1, 0.5, -0.5}, {0.5, 0.5, 1, -1}, {-0.5, -0.5, -1, 1}};
        for (int i = 0; i < 4; i++) {
            assertArrayEquals(expected[i], o.matrix()[i], 1e-15, "row " + i);
        }
        assertTrue(CorrelationRepair.isPsd(o.matrix()));
        // contradicting ties (a ~ b = 1, b ~ c = 1, a ~ c = −1) are not tied away but repaired like any target
        double[][] bad = {{1, 1, -1, n}, {1, 1, 1, n}, {-1, 1, 1, 0.2}, {n, n, 0.2, 1}};
        assertThrows(CorrelationRepair.NotPositiveSemidefiniteException.class, () -> CorrelationRepair.repair(bad, RepairPolicy.FAIL));
        assertEquals("nearest", CorrelationRepair.repair(bad, RepairPolicy.NEAREST).method());
    }

    @Test
    void failPolicyExplainsWithTheSmallestEigenvalue() {
        double[][] a = {{1, 1, 0}, {1, 1, 1}, {0, 1, 1}};
        CorrelationRepair.NotPositiveSemidefiniteException e = assertThrows(
                CorrelationRepair.NotPositiveSemidefiniteException.class, () -> CorrelationRepair.repair(a, RepairPolicy.FAIL));
        // eigenvalues of this matrix are 1 − √2, 1, 1 + √2 (closed form: tridiagonal Toeplitz with 0 corner)
        assertEquals(1 - Math.sqrt(2), e.diagnosis().smallestEigenvalue(), 1e-12);
        assertTrue(!e.diagnosis().worst().isEmpty());
    }

    @Test
    void propertiesOnRandomSymmetricUnitDiagonalMatrices() throws Exception {
        SplittableRandom random = new SplittableRandom(20261201L);
        for (int trial = 0; trial < 24; trial++) {
            int n = 3 + random.nextInt(58);
            double[][] a = TestMatrices.randomUnitDiagonal(n, random);
            CorrelationRepair.Outcome nearest = CorrelationRepair.repair(a, RepairPolicy.NEAREST);
            double[][] x = nearest.matrix();
            for (int i = 0; i < n; i++) {
                assertEquals(1.0, x[i][i], 0.0);
                for (int j = 0; j < n; j++) {
                    assertEquals(x[i][j], x[j][i], 0.0);
                }
            }
            // eigenvalues by EJML, an independent library
            assertTrue(TestMatrices.minEigenvalue(x) > -1e-9, "PSD for n=" + n);
            // idempotent: repairing a valid matrix changes nothing
            CorrelationRepair.Outcome again = CorrelationRepair.repair(x, RepairPolicy.NEAREST);
            assertEquals("none", again.method());
            for (int i = 0; i < n; i++) {
                assertArrayEquals(x[i], again.matrix()[i], 0.0);
            }
            // nearest is never farther than clipping (Higham 2002: the nearest point minimises the Frobenius distance)
            double[][] clipped = CorrelationRepair.repair(a, RepairPolicy.CLIP).matrix();
            assertTrue(Matrices.distance(x, a) <= Matrices.distance(clipped, a) + 1e-9, "nearest ≤ clip for n=" + n);
            assertTrue(TestMatrices.minEigenvalue(clipped) > 0, "clip gives a positive definite matrix");
        }
    }

    @Test
    void eigenProjectionAgreesWithEjml() {
        SplittableRandom random = new SplittableRandom(7);
        for (int n : new int[] {3, 10, 40}) {
            double[][] a = TestMatrices.randomSymmetric(n, random);
            double[][] ours = Matrices.eigenFloor(a, 0.0);
            // EJML symmetric eigendecomposition, then V max(Λ, 0) V^T
            EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(n, true, true);
            assertTrue(eig.decompose(new DMatrixRMaj(a)));
            double[][] ref = new double[n][n];
            for (int p = 0; p < n; p++) {
                double lambda = Math.max(eig.getEigenvalue(p).getReal(), 0);
                DMatrixRMaj v = eig.getEigenVector(p);
                for (int i = 0; i < n; i++) {
                    for (int j = 0; j < n; j++) {
                        ref[i][j] += lambda * v.get(i) * v.get(j);
                    }
                }
            }
            for (int i = 0; i < n; i++) {
                assertArrayEquals(ref[i], ours[i], 1e-10);
            }
        }
    }

    @Test
    void pivotedCholeskyFactorsSemidefiniteMatricesExactly() throws Exception {
        // |ρ| = 1: rank one; the two rows of the factor are equal (ρ = 1) or opposite (ρ = −1).
        PivotedCholesky.Result plus = PivotedCholesky.factor(new double[][] {{1, 1}, {1, 1}}, 1e-10);
        assertEquals(1, plus.rank());
        assertArrayEquals(plus.factor()[0], plus.factor()[1], 0.0);
        PivotedCholesky.Result minus = PivotedCholesky.factor(new double[][] {{1, -1}, {-1, 1}}, 1e-10);
        assertEquals(1, minus.rank());
        assertEquals(-minus.factor()[0][0], minus.factor()[1][0], 0.0);
        // an indefinite matrix is refused
        assertThrows(Cholesky.NotPositiveDefiniteException.class,
                () -> PivotedCholesky.factor(new double[][] {{1, 1, 0}, {1, 1, 1}, {0, 1, 1}}, 1e-10));
    }
}
