package dev.standin.fit;

import java.util.regex.Pattern;

/**
 * The settings of one fit. Each bad value is an {@link IllegalArgumentException} whose message starts
 * with the setting's key ({@code dataset}, {@code rows}, {@code seed}, {@code min-category-count},
 * {@code other-label}), so a front end can name its own option instead.
 *
 * @param dataset the spec's dataset name, or null to derive it from the data file's name
 * @param rows the spec's row count, or null for the data's own row count
 * @param seed the spec's seed, or null for {@value #DEFAULT_SEED}
 * @param minCategoryCount K: a category seen fewer than K times is merged into {@code otherLabel}
 * @param otherLabel the label of the merged rare categories
 */
public record FitOptions(String dataset, Long rows, Long seed, int minCategoryCount, String otherLabel) {

    /**
     * The default K. Reason (privacy): a label carried by only a handful of rows can single those rows
     * out (a rare job title, a small village); ten is a common minimum cell size for published
     * frequency tables (common practice in statistical disclosure control).
     */
    public static final int DEFAULT_MIN_CATEGORY_COUNT = 10;

    /** The default label of merged rare categories. */
    public static final String DEFAULT_OTHER_LABEL = "other";

    /** The seed written when none is given. */
    public static final long DEFAULT_SEED = 1;

    /** The largest K accepted. */
    public static final int MAX_MIN_CATEGORY_COUNT = 1_000_000;

    private static final Pattern DATASET = Pattern.compile("[a-z0-9][a-z0-9_-]*");

    public FitOptions {
        if (dataset != null && (!DATASET.matcher(dataset).matches() || dataset.length() > 128)) {
            throw new IllegalArgumentException("dataset must match [a-z0-9][a-z0-9_-]* (at most 128 characters): " + dataset);
        }
        if (rows != null && (rows < 0 || rows > dev.standin.spec.SpecParser.MAX_ROWS)) {
            throw new IllegalArgumentException("rows must be a whole number from 0 to " + dev.standin.spec.SpecParser.MAX_ROWS + ": " + rows);
        }
        if (minCategoryCount < 1 || minCategoryCount > MAX_MIN_CATEGORY_COUNT) {
            throw new IllegalArgumentException("min-category-count must be a whole number from 1 to " + MAX_MIN_CATEGORY_COUNT
                    + ": " + minCategoryCount);
        }
        if (otherLabel == null || otherLabel.isBlank() || !otherLabel.strip().equals(otherLabel) || otherLabel.length() > 128
                || otherLabel.chars().anyMatch(Character::isISOControl)) {
            throw new IllegalArgumentException("other-label must be 1 to 128 characters without control characters or"
                    + " surrounding spaces: \"" + otherLabel + "\"");
        }
    }

    /** Every setting at its default. */
    public static FitOptions defaults() {
        return new FitOptions(null, null, null, DEFAULT_MIN_CATEGORY_COUNT, DEFAULT_OTHER_LABEL);
    }

    /** The seed written into the spec. */
    public long seedOrDefault() {
        return seed == null ? DEFAULT_SEED : seed;
    }
}
