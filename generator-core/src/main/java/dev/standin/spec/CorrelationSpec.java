package dev.standin.spec;

import dev.standin.correlation.RepairPolicy;
import java.util.List;

/**
 * The {@code correlation:} block as written: the measure, the columns it covers (in {@link #order()}),
 * and the requested matrix in that order, with {@code NaN} for pairs the spec does not give.
 *
 * @param fromPairs true when written as {@code pairs:}, false for {@code order:} + {@code matrix:}
 * @param entryMarks where each off-diagonal entry was written (null where not written)
 * @param repair what to do when the target is not positive semidefinite
 * @param maxChange the largest change a repair may make to any specified entry before it is an error
 */
public record CorrelationSpec(Measure measure, Mark mark, List<String> order, double[][] requested,
                              boolean fromPairs, Mark[][] entryMarks, RepairPolicy repair, double maxChange) {

    /** The default {@code max-change}. */
    public static final double DEFAULT_MAX_CHANGE = 0.05;

    /** The correlation measures a spec may target. */
    public enum Measure {
        /** Product-moment correlation of the written values, matched by NORTA. */
        PEARSON("pearson"),
        /** Spearman's rank correlation of the written values (mid-ranks for ties). */
        SPEARMAN("spearman"),
        /** Kendall's τ<sub>b</sub> of the written values. */
        KENDALL("kendall"),
        /** The correlation of the normal latents themselves (the Gaussian copula's parameter). */
        LATENT("latent"),
        /** Covariance of the written values (normal columns only). */
        COVARIANCE("covariance");

        private final String word;

        Measure(String word) {
            this.word = word;
        }

        public String word() {
            return word;
        }

        public static String choices() {
            return "pearson, spearman, kendall, latent, covariance";
        }
    }

    public int size() {
        return order.size();
    }
}
