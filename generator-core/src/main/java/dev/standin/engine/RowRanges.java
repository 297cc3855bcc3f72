package dev.standin.engine;

import java.io.IOException;
import java.io.OutputStream;

/**
 * The data file of a compiled spec in independent pieces, the basis for generating one dataset on
 * several machines: the file is exactly {@link #prologue} + {@link #rows}(0, a) + {@code rows}(a, b) +
 * ... + {@code rows}(z, rows) + {@link #epilogue}, for any cut points. Each row's bytes depend only
 * on (seed, spec, row index) — see the random contract in {@code RandomStreams} — so a range can be
 * made anywhere, in any order, and concatenated. Reports are not produced here: they need every row.
 */
public final class RowRanges {

    private RowRanges() {
    }

    /** The bytes before the first row: the CSV header (if any) or the JSON array's opening bracket. */
    public static byte[] prologue(CompiledSpec compiled) {
        return DatasetWriter.prologue(compiled);
    }

    /**
     * Writes the bytes of rows {@code from} (inclusive) to {@code to} (exclusive) on the calling thread.
     *
     * @throws IllegalArgumentException unless 0 ≤ from ≤ to ≤ the spec's rows
     */
    public static void rows(CompiledSpec compiled, long from, long to, OutputStream out) throws IOException {
        check(compiled, from, to);
        DatasetWriter.writeRows(compiled, from, to, out);
    }

    /**
     * A writer of row ranges of one compiled spec that builds the sampler's tables and its buffers once,
     * for writing many ranges; {@link #rows} builds them on every call. Not for concurrent use: give
     * each thread its own.
     */
    public static Writer writer(CompiledSpec compiled) {
        return new Writer(compiled);
    }

    /** See {@link #writer(CompiledSpec)}. */
    public static final class Writer {
        private final CompiledSpec compiled;
        private final DatasetWriter.RangeWriter ranges;

        private Writer(CompiledSpec compiled) {
            this.compiled = compiled;
            this.ranges = new DatasetWriter.RangeWriter(compiled);
        }

        /** As {@link RowRanges#rows}, with this writer's tables and buffers. */
        public void rows(long from, long to, OutputStream out) throws IOException {
            check(compiled, from, to);
            ranges.write(from, to, out);
        }
    }

    private static void check(CompiledSpec compiled, long from, long to) {
        long rows = compiled.spec().rows();
        if (from < 0 || from > to || to > rows) {
            throw new IllegalArgumentException("row range must satisfy 0 <= from <= to <= " + rows + ": [" + from + ", "
                    + to + ")");
        }
    }

    /** The bytes after the last row: the JSON array's closing bracket; empty for CSV and JSON Lines. */
    public static byte[] epilogue(CompiledSpec compiled) {
        return DatasetWriter.epilogue(compiled);
    }
}
