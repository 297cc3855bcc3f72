package dev.standin.spec;

import java.util.List;

/**
 * A parsed and checked spec: what to generate, independent of where it is written.
 *
 * @param file the spec's display name (as used in messages and the report)
 * @param correlation the correlation block, or null for independent columns
 */
public record Spec(String file, String dataset, long rows, long seed, List<ColumnSpec> columns,
                   CorrelationSpec correlation, OutputSpec output) {

    public Spec {
        columns = List.copyOf(columns);
    }

    /** The column with this name, or null. */
    public ColumnSpec column(String name) {
        for (ColumnSpec c : columns) {
            if (c.name().equals(name)) {
                return c;
            }
        }
        return null;
    }
}
