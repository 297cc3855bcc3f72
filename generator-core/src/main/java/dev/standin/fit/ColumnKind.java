package dev.standin.fit;

/** The type inferred for a data column from its non-missing values. */
public enum ColumnKind {
    /** Whole numbers (no leading zeros, magnitude at most 2<sup>53</sup>). */
    INTEGER("integer"),
    /** Decimal numbers, with or without an exponent. */
    DECIMAL("decimal"),
    /** {@code true}/{@code false} in any letter case. */
    BOOLEAN("boolean"),
    /** ISO-8601 dates such as {@code 2026-05-17}. */
    DATE("date"),
    /** ISO-8601 instants such as {@code 2026-05-17T08:30:00Z} (or with an offset). */
    TIMESTAMP("timestamp"),
    /** Anything else: text, modelled as categories when not an identifier or free text. */
    TEXT("text"),
    /** No value present at all. */
    EMPTY("empty");

    private final String word;

    ColumnKind(String word) {
        this.word = word;
    }

    public String word() {
        return word;
    }

    /** True for the kinds measured on a number line (numbers, dates, timestamps). */
    public boolean numeric() {
        return this == INTEGER || this == DECIMAL || this == DATE || this == TIMESTAMP;
    }
}
