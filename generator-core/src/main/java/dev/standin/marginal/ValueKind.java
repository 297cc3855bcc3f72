package dev.standin.marginal;

/** How a marginal's values are written. */
public enum ValueKind {
    /** A decimal number, rounded to the column's decimals. */
    NUMBER,
    /** A whole number. */
    INTEGER,
    /** true or false (the value is 1 or 0). */
    BOOLEAN,
    /** A category label (the value is the level index). */
    LABEL,
    /** An ISO-8601 date (the value is the day count from 1970-01-01). */
    DATE,
    /** An ISO-8601 UTC instant (the value is the second count from 1970-01-01T00:00:00Z). */
    TIMESTAMP
}
