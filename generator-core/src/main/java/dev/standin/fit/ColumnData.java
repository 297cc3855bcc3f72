package dev.standin.fit;

/**
 * One data column read with its inferred type: numeric kinds as numbers (dates as days since
 * 1970-01-01, timestamps as seconds, booleans as 0/1), text as stripped strings; missing cells are
 * NaN and null.
 *
 * @param values one number per row (NaN where missing or for text)
 * @param texts one stripped string per row for {@link ColumnKind#TEXT} (null where missing), else null
 * @param missing how many cells are missing
 * @param decimals the most digits after the decimal point written in the column (numbers only, else 0)
 */
public record ColumnData(String name, ColumnKind kind, double[] values, String[] texts, int missing, int decimals) {

    /** How many cells hold a value. */
    public int present() {
        return values.length - missing;
    }

    /** Infers the type of column {@code j} of the table and reads its cells. */
    public static ColumnData of(CsvTable table, int j) {
        int n = table.size();
        boolean integer = true;
        boolean decimal = true;
        boolean bool = true;
        boolean date = true;
        boolean timestamp = true;
        int missing = 0;
        for (String[] row : table.rows()) {
            String cell = row[j];
            if (Cells.missing(cell)) {
                missing++;
                continue;
            }
            if (integer && Cells.integer(cell) == null) {
                integer = false;
            }
            if (decimal && Cells.decimal(cell) == null) {
                decimal = false;
            }
            if (bool && Cells.bool(cell) == null) {
                bool = false;
            }
            if (date && Cells.date(cell) == null) {
                date = false;
            }
            if (timestamp && Cells.timestamp(cell) == null) {
                timestamp = false;
            }
        }
        ColumnKind kind;
        if (missing == n) {
            kind = ColumnKind.EMPTY;
        } else if (integer) {
            kind = ColumnKind.INTEGER;
        } else if (decimal) {
            kind = ColumnKind.DECIMAL;
        } else if (bool) {
            kind = ColumnKind.BOOLEAN;
        } else if (date) {
            kind = ColumnKind.DATE;
        } else if (timestamp) {
            kind = ColumnKind.TIMESTAMP;
        } else {
            kind = ColumnKind.TEXT;
        }
        double[] values = new double[n];
        String[] texts = kind == ColumnKind.TEXT ? new String[n] : null;
        int decimals = 0;
        for (int i = 0; i < n; i++) {
            String cell = table.rows().get(i)[j];
            if (Cells.missing(cell)) {
                values[i] = Double.NaN;
                continue;
            }
            switch (kind) {
                case INTEGER -> values[i] = Cells.integer(cell);
                case DECIMAL -> {
                    values[i] = Cells.decimal(cell);
                    decimals = Math.max(decimals, Cells.decimals(cell));
                }
                case BOOLEAN -> values[i] = Cells.bool(cell) ? 1.0 : 0.0;
                case DATE -> values[i] = Cells.date(cell);
                case TIMESTAMP -> values[i] = Cells.timestamp(cell);
                default -> {
                    values[i] = Double.NaN;
                    texts[i] = cell.strip();
                }
            }
        }
        return new ColumnData(table.header().get(j), kind, values, texts, missing, Math.min(decimals, 15));
    }

    /** The non-missing numbers, sorted ascending. */
    public double[] sortedPresent() {
        double[] v = new double[present()];
        int k = 0;
        for (double x : values) {
            if (!Double.isNaN(x)) {
                v[k++] = x;
            }
        }
        java.util.Arrays.sort(v);
        return v;
    }
}
