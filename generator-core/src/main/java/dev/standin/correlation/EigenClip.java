package dev.standin.correlation;

/**
 * Eigenvalue clipping: replace eigenvalues below a small positive floor by the floor, then rescale
 * to unit diagonal, X = D<sup>-1/2</sup> V max(Λ, δ) V<sup>T</sup> D<sup>-1/2</sup>. One
 * eigendecomposition, so fast, but cruder than {@link NearestCorrelation}: the result is a valid
 * correlation matrix, positive definite, generally not the nearest one (R. Rebonato and P. Jäckel,
 * "The most general methodology to create a valid correlation matrix for risk management and
 * option pricing purposes", Journal of Risk 2(2), 2000).
 */
public final class EigenClip {

    /** The eigenvalue floor δ. */
    public static final double FLOOR = 1e-8;

    private EigenClip() {
    }

    public static double[][] clip(double[][] a) {
        double[][] x = Matrices.eigenFloor(a, FLOOR);
        int n = x.length;
        double[] s = new double[n];
        for (int i = 0; i < n; i++) {
            s[i] = 1.0 / StrictMath.sqrt(x[i][i]);
        }
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                x[i][j] = i == j ? 1.0 : x[i][j] * s[i] * s[j];
            }
        }
        Matrices.symmetrize(x);
        return x;
    }
}
