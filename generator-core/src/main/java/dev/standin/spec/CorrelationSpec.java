package dev.standin.spec;

import java.util.List;

/**
 * The {@code correlation:} block as written: the measure, the columns it covers (in {@link #order()}),
 * and the requested matrix in that order, with {@code NaN} for pairs the spec does not give.
 *
 * @param fromPairs true when written as {@code pairs:}, false for {@code order:} + {@code matrix:}
 * @param entryMarks where each off-diagonal entry was written (null where not written)
 */
public record CorrelationSpec(Measure measure, Mark mark, List<String> order, double[][] requested,
                              boolean fromPairs, Mark[][] entryMarks) {

    /** The correlation measures a spec may target. */
    public enum Measure {
        /** Product-moment correlation of the written values. */
        PEARSON("pearson"),
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
            return "pearson, covariance";
        }
    }

    public int size() {
        return order.size();
    }
}
