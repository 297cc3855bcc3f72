package dev.standin.fit;

import java.util.List;

/**
 * A fitted spec and how it was made.
 *
 * @param specText the spec, UTF-8 YAML with its header comment
 * @param sourceRows how many records the data file has
 * @param columns every data column, in the file's order
 * @param dependence the correlation block's estimate, or null when fewer than two columns are correlated
 * @param notes remarks for the user, each {@code column 'x': ...} (also comments in the spec)
 */
public record FitResult(String specText, String dataset, long rows, long seed, int sourceRows, List<ColumnFit> columns,
                        Dependence.Result dependence, List<String> notes) {

    public FitResult {
        columns = List.copyOf(columns);
        notes = List.copyOf(notes);
    }

    /** The column with this name, or null. */
    public ColumnFit column(String name) {
        for (ColumnFit c : columns) {
            if (c.name().equals(name)) {
                return c;
            }
        }
        return null;
    }

    /**
     * The caution carried by every fitted spec, by the command line and by the plugin. Reason: the
     * safeguards lower the chance that a spec or its data reveal something about real people or
     * records, but no such tool can promise that, and whether data may be shared is a legal question
     * for the data's owner.
     */
    public static final List<String> CAUTION = List.of(
            "CAUTION: this spec was fitted to real data. Its safeguards (no raw rows or cells; rare categories",
            "merged; identifiers and free text not modelled; bounds from robust quantiles, rounded outward;",
            "coarse quantile tables) reduce but do not remove the risk of disclosing facts about that data.",
            "This is not an anonymisation guarantee. If the data are personal data, have this spec and anything",
            "generated from it reviewed under your local privacy rules before sharing them.");
}
