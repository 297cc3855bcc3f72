package dev.standin.fit;

import dev.standin.marginal.Marginal;
import java.util.List;

/**
 * What the fit made of one data column.
 *
 * @param role whether it is modelled, written as a sequence or left out
 * @param family the spec's family word, or null when dropped
 * @param yaml the column's lines in the spec (its name first), without the indentation of {@code columns:}
 * @param comments comment lines written above it (without {@code #})
 * @param note a remark for the user (also a comment in the spec), or null
 * @param marginal the distribution written (null for sequences and dropped columns)
 * @param nulls the fraction of missing values written
 * @param candidates the families tried, for numeric columns
 * @param chosen the family chosen, or null (quantile fallback, or not numeric)
 * @param ksDistance the KS distance of the written distribution to the data (numbers only, else NaN)
 * @param mean the data's mean (numbers only, else NaN)
 * @param sd the data's standard deviation with divisor n − 1 (numbers only, else NaN)
 * @param levels the categorical levels written, in order (else empty)
 * @param codes per row, the value the dependence is measured on (level index for categories; NaN missing)
 */
public record ColumnFit(String name, ColumnKind kind, Role role, String family, List<String> yaml, List<String> comments,
                        String note, Marginal marginal, double nulls, List<Candidate> candidates, Candidate chosen,
                        double ksDistance, double mean, double sd, List<String> levels, double[] codes) {

    /** What became of a column. */
    public enum Role {
        /** Fitted and written with a distribution. */
        MODELLED,
        /** Written as {@code sequence} (an identifier). */
        SEQUENCE,
        /** Left out of the spec. */
        DROPPED
    }

    public ColumnFit {
        yaml = List.copyOf(yaml);
        comments = List.copyOf(comments);
        candidates = List.copyOf(candidates);
        levels = List.copyOf(levels);
    }

    /** True when it takes part in the correlation block. */
    boolean correlated() {
        return role == Role.MODELLED && codes != null;
    }
}
