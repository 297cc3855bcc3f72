package dev.standin.fit;

import java.util.List;

/**
 * A CSV file read into memory: its header names, its records (each exactly as wide as the header)
 * and, for each record, the physical line it starts on (for messages).
 *
 * @param file the name used in messages
 * @param headerColumns the column (1-based character position on line 1) where each header name starts
 */
public record CsvTable(String file, List<String> header, int[] headerColumns, List<String[]> rows, int[] lines) {

    public CsvTable {
        header = List.copyOf(header);
        headerColumns = headerColumns.clone();
        rows = List.copyOf(rows);
        lines = lines.clone();
    }

    /** A table without positions (e.g. built in memory): every header name at column 1. */
    public static CsvTable of(String file, List<String> header, List<String[]> rows) {
        int[] lines = new int[rows.size()];
        for (int i = 0; i < lines.length; i++) {
            lines[i] = i + 2;
        }
        int[] columns = new int[header.size()];
        java.util.Arrays.fill(columns, 1);
        return new CsvTable(file, header, columns, rows, lines);
    }

    /** The number of records below the header. */
    public int size() {
        return rows.size();
    }

    /** The position of a header name, or -1. */
    public int column(String name) {
        return header.indexOf(name);
    }
}
