package dev.standin.output;

/** How a column's text is written: numbers and booleans bare in JSON, text quoted. */
public enum CellKind {
    NUMBER,
    BOOLEAN,
    TEXT
}
