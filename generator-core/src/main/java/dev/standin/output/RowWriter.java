package dev.standin.output;

import java.io.IOException;

/**
 * Writes rows of cell texts in one format. A cell is its text as formatted by the column, or null
 * for a missing value. Calls: {@link #begin()}, {@link #row(String[])} per row, {@link #end()}.
 */
public interface RowWriter {

    void begin() throws IOException;

    void row(String[] cells) throws IOException;

    void end() throws IOException;
}
