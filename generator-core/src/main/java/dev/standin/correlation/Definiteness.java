package dev.standin.correlation;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.apache.commons.math3.linear.RealVector;

/**
 * Explains why a symmetric matrix is not positive definite: its smallest eigenvalue λ and the pairs
 * that contribute most to it. With v the unit eigenvector of λ, λ = Σ<sub>ij</sub> v<sub>i</sub>
 * a<sub>ij</sub> v<sub>j</sub>, so the pair (i, j) contributes 2 v<sub>i</sub> a<sub>ij</sub>
 * v<sub>j</sub>; the most negative contributions are the pairs to look at. Eigenvalues by
 * commons-math3's {@link EigenDecomposition}.
 */
public final class Definiteness {

    /** One pair's share of the smallest eigenvalue. */
    public record Contribution(int i, int j, double value) {
    }

    private final double smallestEigenvalue;
    private final List<Contribution> worst;

    private Definiteness(double smallestEigenvalue, List<Contribution> worst) {
        this.smallestEigenvalue = smallestEigenvalue;
        this.worst = worst;
    }

    public static Definiteness of(double[][] a, int top) {
        EigenDecomposition eigen = new EigenDecomposition(new Array2DRowRealMatrix(a, true));
        double[] values = eigen.getRealEigenvalues();
        int min = 0;
        for (int i = 1; i < values.length; i++) {
            if (values[i] < values[min]) {
                min = i;
            }
        }
        RealVector v = eigen.getEigenvector(min);
        List<Contribution> all = new ArrayList<>();
        for (int i = 0; i < a.length; i++) {
            for (int j = 0; j < i; j++) {
                all.add(new Contribution(i, j, 2 * v.getEntry(i) * a[i][j] * v.getEntry(j)));
            }
        }
        all.sort((x, y) -> Double.compare(x.value(), y.value()));
        List<Contribution> worst = new ArrayList<>();
        for (Contribution c : all) {
            if (worst.size() == top || c.value() >= 0) {
                break;
            }
            worst.add(c);
        }
        return new Definiteness(values[min], List.copyOf(worst));
    }

    public double smallestEigenvalue() {
        return smallestEigenvalue;
    }

    /** The pairs pulling the smallest eigenvalue down most, worst first. */
    public List<Contribution> worst() {
        return worst;
    }
}
