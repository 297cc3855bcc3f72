package dev.standin.sampling;

import dev.standin.correlation.Cholesky;
import dev.standin.correlation.Definiteness;
import dev.standin.correlation.NortaPearson;
import dev.standin.marginal.Marginal;
import dev.standin.output.NumberText;
import dev.standin.spec.ColumnSpec;
import dev.standin.spec.CorrelationSpec;
import dev.standin.spec.Mark;
import dev.standin.spec.Spec;
import dev.standin.spec.SpecException;
import dev.standin.spec.SpecProblem;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Locale;

/**
 * The Gaussian copula of a spec: which columns share correlated standard normal latents, the
 * latent correlation matrix that makes the requested correlations hold on the written values, and
 * its Cholesky factor.
 *
 * <p>The factor is taken in a canonical order, the correlated columns sorted by name, so that
 * reordering columns in the spec leaves every value unchanged. A column outside the correlation
 * block keeps its own latent.
 */
public final class LatentModel {

    private final List<String> order;
    private final double[][] used;
    private final double[][] latent;
    private final List<String> canonical;
    private final double[][] factor;

    private LatentModel(List<String> order, double[][] used, double[][] latent, List<String> canonical, double[][] factor) {
        this.order = order;
        this.used = used;
        this.latent = latent;
        this.canonical = canonical;
        this.factor = factor;
    }

    /** A model with no correlated columns. */
    public static LatentModel independent() {
        return new LatentModel(List.of(), new double[0][0], new double[0][0], List.of(), new double[0][0]);
    }

    /**
     * Builds the latent model of a spec.
     *
     * @throws SpecException when a target is unattainable for its marginals or the latent matrix is
     *     not positive definite (located at the correlation block)
     */
    public static LatentModel of(Spec spec, NortaPearson norta) throws SpecException {
        CorrelationSpec c = spec.correlation();
        if (c == null) {
            return independent();
        }
        int k = c.size();
        List<String> order = c.order();
        Marginal[] marginals = new Marginal[k];
        for (int i = 0; i < k; i++) {
            marginals[i] = ((ColumnSpec.Random) spec.column(order.get(i))).marginal();
        }
        double[][] used = new double[k][k];
        double[][] latent = new double[k][k];
        List<SpecProblem> problems = new ArrayList<>();
        for (int i = 0; i < k; i++) {
            used[i][i] = c.requested()[i][i];
            latent[i][i] = 1.0;
            for (int j = 0; j < i; j++) {
                double target = c.requested()[i][j];
                // issue-2 rule: a pair the spec does not give is uncorrelated
                if (Double.isNaN(target)) {
                    target = 0.0;
                }
                used[i][j] = target;
                used[j][i] = target;
                double r;
                if (c.measure() == CorrelationSpec.Measure.COVARIANCE) {
                    r = target / (marginals[i].sd() * marginals[j].sd());
                } else {
                    try {
                        r = norta.latentFor(marginals[i], marginals[j], target);
                    } catch (NortaPearson.UnattainableException e) {
                        Mark at = c.entryMarks()[i][j] != null ? c.entryMarks()[i][j] : c.mark();
                        problems.add(SpecProblem.at(at, "pearson " + NumberText.shortest(target) + " is unattainable for "
                                + order.get(i) + " ~ " + order.get(j) + " with these marginals: attainable ["
                                + fixed3(e.low()) + ", " + fixed3(e.high()) + "]"));
                        continue;
                    }
                }
                latent[i][j] = r;
                latent[j][i] = r;
            }
        }
        if (!problems.isEmpty()) {
            throw new SpecException(problems);
        }
        List<String> canonical = new ArrayList<>(order);
        Collections.sort(canonical);
        int[] perm = new int[k];
        for (int i = 0; i < k; i++) {
            perm[i] = order.indexOf(canonical.get(i));
        }
        double[][] permuted = new double[k][k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                permuted[i][j] = latent[perm[i]][perm[j]];
            }
        }
        double[][] factor;
        try {
            factor = Cholesky.factor(permuted);
        } catch (Cholesky.NotPositiveDefiniteException e) {
            throw new SpecException(SpecProblem.at(c.mark(), notPositiveDefinite(latent, order, c)));
        }
        return new LatentModel(List.copyOf(order), used, latent, List.copyOf(canonical), factor);
    }

    private static String notPositiveDefinite(double[][] latent, List<String> order, CorrelationSpec c) {
        Definiteness d = Definiteness.of(latent, 3);
        StringBuilder sb = new StringBuilder();
        sb.append(c.measure() == CorrelationSpec.Measure.COVARIANCE ? "covariance" : "correlation")
                .append(" matrix is not positive definite (smallest eigenvalue of the latent correlation ")
                .append(String.format(Locale.ROOT, "%.4g", d.smallestEigenvalue())).append(")");
        if (!d.worst().isEmpty()) {
            sb.append("; pairs pulling it down most: ");
            for (int n = 0; n < d.worst().size(); n++) {
                Definiteness.Contribution w = d.worst().get(n);
                if (n > 0) {
                    sb.append(", ");
                }
                sb.append(order.get(w.i())).append(" ~ ").append(order.get(w.j())).append(" (")
                        .append(NumberText.shortest(c.requested()[w.i()][w.j()])).append(")");
            }
        }
        return sb.toString();
    }

    private static String fixed3(double v) {
        return NumberText.fixed(v, 3);
    }

    /** The correlated columns in the spec's order (the report's matrix order). */
    public List<String> order() {
        return order;
    }

    /** The target matrix actually used, in {@link #order()}: requested with unspecified pairs filled. */
    public double[][] used() {
        return copy(used);
    }

    /** The latent normal correlation matrix given to the factorisation, in {@link #order()}. */
    public double[][] latent() {
        return copy(latent);
    }

    /** The correlated columns in factorisation order (sorted by name). */
    public List<String> canonicalOrder() {
        return canonical;
    }

    /** The lower-triangular Cholesky factor in {@link #canonicalOrder()}. */
    public double[][] factor() {
        return copy(factor);
    }

    private static double[][] copy(double[][] m) {
        double[][] c = new double[m.length][];
        for (int i = 0; i < m.length; i++) {
            c[i] = m[i].clone();
        }
        return c;
    }
}
