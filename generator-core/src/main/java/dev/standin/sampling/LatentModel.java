package dev.standin.sampling;

import dev.standin.correlation.Cholesky;
import dev.standin.correlation.CorrelationRepair;
import dev.standin.correlation.Definiteness;
import dev.standin.correlation.Matrices;
import dev.standin.correlation.NortaPearson;
import dev.standin.correlation.PivotedCholesky;
import dev.standin.correlation.RankTargets;
import dev.standin.marginal.Marginal;
import dev.standin.marginal.ValueKind;
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
 * The Gaussian copula of a spec: which columns share correlated standard normal latents, the target
 * actually used (after completing unspecified pairs and any repair), the latent correlation matrix
 * that makes those targets hold on the written values, and its factor.
 *
 * <p>The factor is taken in a canonical order, the correlated columns sorted by name, so that
 * reordering columns in the spec leaves every value unchanged. It is the Cholesky factor when the
 * latent matrix is positive definite and a rank-revealing pivoted Cholesky factor when it is only
 * semidefinite (e.g. a correlation of ±1), so such targets are sampled exactly. A column outside the
 * correlation block keeps its own latent.
 */
public final class LatentModel {

    /** How many changed pairs a message or warning lists. */
    static final int LISTED = 10;

    private final List<String> order;
    private final double[][] used;
    private final double[][] latent;
    private final List<String> canonical;
    private final double[][] factor;
    private final int[] latentSource;
    private final CorrelationRepair.Outcome targetRepair;
    private final CorrelationRepair.Outcome latentRepair;
    private final List<String> warnings;

    private LatentModel(List<String> order, double[][] used, double[][] latent, List<String> canonical,
                        double[][] factor, int[] latentSource, CorrelationRepair.Outcome targetRepair,
                        CorrelationRepair.Outcome latentRepair, List<String> warnings) {
        this.order = order;
        this.used = used;
        this.latent = latent;
        this.canonical = canonical;
        this.factor = factor;
        this.latentSource = latentSource;
        this.targetRepair = targetRepair;
        this.latentRepair = latentRepair;
        this.warnings = warnings;
    }

    /** A model with no correlated columns. */
    public static LatentModel independent() {
        return new LatentModel(List.of(), new double[0][0], new double[0][0], List.of(), new double[0][0], new int[0],
                null, null, List.of());
    }

    /**
     * Builds the latent model of a spec.
     *
     * @throws SpecException when the target is not positive semidefinite under {@code repair: fail},
     *     a repair exceeds {@code max-change}, or a target is unattainable for its marginals
     */
    public static LatentModel of(Spec spec, NortaPearson norta) throws SpecException {
        return of(spec, norta, new RankTargets(norta));
    }

    /** As {@link #of(Spec, NortaPearson)} with a shared rank-target solver. */
    public static LatentModel of(Spec spec, NortaPearson norta, RankTargets ranks) throws SpecException {
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
        boolean covariance = c.measure() == CorrelationSpec.Measure.COVARIANCE;
        double[][] target = new double[k][k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                double v = c.requested()[i][j];
                target[i][j] = i == j ? 1.0 : covariance ? v / (marginals[i].sd() * marginals[j].sd()) : v;
            }
        }
        List<String> warnings = new ArrayList<>();
        String what = covariance ? "covariance" : "correlation";
        CorrelationRepair.Outcome targetRepair = repair(target, c, order, what, c.mark(), warnings, spec.file(), true);
        double[][] usedCorrelation = targetRepair.matrix();

        double[][] latent = new double[k][k];
        List<SpecProblem> problems = new ArrayList<>();
        for (int i = 0; i < k; i++) {
            latent[i][i] = 1.0;
            for (int j = 0; j < i; j++) {
                double r;
                try {
                    r = latentFor(c.measure(), marginals[i], marginals[j], usedCorrelation[i][j], norta, ranks);
                } catch (NortaPearson.UnattainableException e) {
                    if (Double.isNaN(c.requested()[i][j])) {
                        // a completed (free) pair: take the nearest attainable latent
                        r = usedCorrelation[i][j] < e.low() ? -1.0 : 1.0;
                    } else {
                        Mark at = c.entryMarks()[i][j] != null ? c.entryMarks()[i][j] : c.mark();
                        problems.add(SpecProblem.at(at, c.measure().word() + " " + NumberText.shortest(usedCorrelation[i][j])
                                + " is unattainable for " + order.get(j) + " ~ " + order.get(i)
                                + " with these marginals: attainable [" + NumberText.fixed(e.low(), 3) + ", "
                                + NumberText.fixed(e.high(), 3) + "]" + (c.measure() == CorrelationSpec.Measure.PEARSON
                                ? "; consider measure: spearman" : "")));
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
        CorrelationRepair.Outcome latentRepair = null;
        if (!CorrelationRepair.isPsd(latent)) {
            latentRepair = repair(latent, c, order, "latent correlation", c.mark(), warnings, spec.file(), false);
            latent = latentRepair.matrix();
        }

        double[][] used = new double[k][k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                used[i][j] = covariance ? usedCorrelation[i][j] * marginals[i].sd() * marginals[j].sd() : usedCorrelation[i][j];
            }
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
        int[] source;
        try {
            factor = trimmed(Cholesky.factor(permuted));
            source = new int[k];
            for (int i = 0; i < k; i++) {
                source[i] = i;
            }
        } catch (Cholesky.NotPositiveDefiniteException e) {
            try {
                PivotedCholesky.Result p = PivotedCholesky.factor(permuted, 1e-10);
                factor = p.factor();
                source = p.pivots();
            } catch (Cholesky.NotPositiveDefiniteException e2) {
                throw new SpecException(SpecProblem.at(c.mark(), "latent correlation matrix could not be factored:"
                        + " it is not positive semidefinite after repair"));
            }
        }
        return new LatentModel(List.copyOf(order), used, latent, List.copyOf(canonical), factor, source,
                targetRepair, latentRepair, List.copyOf(warnings));
    }

    /**
     * The latent correlation for one pair's target in the spec's measure. Pairs with a categorical
     * column are defined on the latent scale under every measure (levels have no order of their own
     * beyond the order written, so a value correlation would depend on that arbitrary order).
     */
    static double latentFor(CorrelationSpec.Measure measure, Marginal a, Marginal b, double target, NortaPearson norta,
                            RankTargets ranks) throws NortaPearson.UnattainableException {
        if (a.valueKind() == ValueKind.LABEL || b.valueKind() == ValueKind.LABEL) {
            return target;
        }
        return switch (measure) {
            case LATENT -> target;
            case COVARIANCE, PEARSON -> norta.latentFor(a, b, target);
            case SPEARMAN -> ranks.spearmanLatent(a, b, target);
            case KENDALL -> ranks.kendallLatent(a, b, target);
        };
    }

    private static CorrelationRepair.Outcome repair(double[][] target, CorrelationSpec c, List<String> order, String what,
                                                    Mark mark, List<String> warnings, String file, boolean enforceMaxChange)
            throws SpecException {
        CorrelationRepair.Outcome outcome;
        try {
            outcome = CorrelationRepair.repair(target, c.repair());
        } catch (CorrelationRepair.NotPositiveSemidefiniteException e) {
            throw new SpecException(SpecProblem.at(mark, notPositiveSemidefinite(e.diagnosis(), target, order, what)));
        }
        if (!outcome.repaired()) {
            return outcome;
        }
        String list = changes(outcome, order);
        String max = NumberText.fixed(outcome.maxChange(), 4);
        if (enforceMaxChange && outcome.maxChange() > c.maxChange()) {
            throw new SpecException(SpecProblem.at(mark, what + " matrix is not positive semidefinite and repair: "
                    + c.repair().word() + " would change a specified pair by " + max + ", more than max-change "
                    + NumberText.shortest(c.maxChange()) + ": " + list
                    + "; revise these pairs, raise max-change, or set repair: fail to see the diagnosis"));
        }
        warnings.add(SpecProblem.at(mark, "warning: " + what + " matrix repaired by " + c.repair().word()
                + " (max change " + max + "): " + list).toString());
        return outcome;
    }

    private static String changes(CorrelationRepair.Outcome outcome, List<String> order) {
        StringBuilder sb = new StringBuilder();
        int n = 0;
        for (CorrelationRepair.Change ch : outcome.changed()) {
            if (n == LISTED) {
                sb.append(", ... (").append(outcome.changed().size() - LISTED).append(" more)");
                break;
            }
            if (n++ > 0) {
                sb.append(", ");
            }
            sb.append(order.get(ch.j())).append(" ~ ").append(order.get(ch.i())).append(' ')
                    .append(NumberText.shortest(ch.from())).append(" → ").append(NumberText.fixed(ch.to(), 4));
        }
        return sb.toString();
    }

    private static String notPositiveSemidefinite(Definiteness d, double[][] target, List<String> order, String what) {
        StringBuilder sb = new StringBuilder();
        sb.append(what).append(" matrix is not positive semidefinite (smallest eigenvalue ")
                .append(String.format(Locale.ROOT, "%.4g", d.smallestEigenvalue())).append(")");
        if (!d.worst().isEmpty()) {
            sb.append("; pairs pulling it down most: ");
            for (int n = 0; n < d.worst().size(); n++) {
                Definiteness.Contribution w = d.worst().get(n);
                if (n > 0) {
                    sb.append(", ");
                }
                sb.append(order.get(w.j())).append(" ~ ").append(order.get(w.i())).append(" (")
                        .append(NumberText.shortest(target[w.i()][w.j()])).append(")");
            }
        }
        return sb.append("; use repair: nearest or clip to repair it").toString();
    }

    /** Drops the zeros above the diagonal of a lower-triangular factor: row p keeps p + 1 entries. */
    private static double[][] trimmed(double[][] l) {
        double[][] t = new double[l.length][];
        for (int p = 0; p < l.length; p++) {
            t[p] = java.util.Arrays.copyOf(l[p], p + 1);
        }
        return t;
    }

    /** The correlated columns in the spec's order (the report's matrix order). */
    public List<String> order() {
        return order;
    }

    /** The target actually used, in {@link #order()}: completed and repaired, in the spec's measure. */
    public double[][] used() {
        return Matrices.copy(used);
    }

    /** The latent normal correlation matrix given to the factorisation, in {@link #order()}. */
    public double[][] latent() {
        return Matrices.copy(latent);
    }

    /** The correlated columns in factorisation order (sorted by name). */
    public List<String> canonicalOrder() {
        return canonical;
    }

    /**
     * The factor L in {@link #canonicalOrder()}: row p gives the weights of latent dimensions 0..,
     * with L L<sup>T</sup> the permuted latent matrix. Rows may be shorter than the column count.
     */
    public double[][] factor() {
        return Matrices.copy(factor);
    }

    /**
     * For each latent dimension q, the canonical position of the column whose value stream drives
     * it: the identity for a Cholesky factor, the pivot order for a pivoted one.
     */
    public int[] latentSource() {
        return latentSource.clone();
    }

    /** What completion or repair did to the spec's target (null when there is no correlation). */
    public CorrelationRepair.Outcome targetRepair() {
        return targetRepair;
    }

    /** The repair of the latent matrix when NORTA's latent was not positive semidefinite, else null. */
    public CorrelationRepair.Outcome latentRepair() {
        return latentRepair;
    }

    /** Warnings to show the user (each {@code FILE:LINE:COLUMN: warning: ...}). */
    public List<String> warnings() {
        return warnings;
    }
}
