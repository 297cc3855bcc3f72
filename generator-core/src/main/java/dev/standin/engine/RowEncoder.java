package dev.standin.engine;

import dev.standin.marginal.Marginal;
import dev.standin.marginal.ValueKind;
import dev.standin.output.ByteText;
import dev.standin.output.CellKind;
import dev.standin.output.CsvRowWriter;
import dev.standin.output.Json;
import dev.standin.output.JsonRowWriter;
import dev.standin.output.NumberText;
import dev.standin.output.RowWriter;
import dev.standin.spec.ColumnSpec;
import dev.standin.spec.OutputSpec;
import dev.standin.spec.Spec;
import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;

/**
 * Encodes drawn rows straight to the output bytes of a spec's format, the same bytes the
 * {@link CsvRowWriter} and {@link JsonRowWriter} write for the cell texts of {@link DatasetWriter#text},
 * without a String per cell: fixed-decimal numbers go through {@link ByteText#appendFixed}, whole
 * numbers through {@link ByteText#appendLong}, labels and booleans are encoded once per level (by the
 * row writers themselves, so quoting, the formula guard and escaping stay theirs), and the rare other
 * texts (dates, timestamps, shortest-form numbers, numbers under an unusual CSV delimiter) are quoted
 * by a one-column row writer.
 *
 * <p>Each encoded value is also turned into the value the text reads back as, for the statistics:
 * {@code Double.parseDouble} of a fixed-decimal text, computed without parsing ({@link ByteText#appendFixed}).
 *
 * <p>The encoder is immutable; each thread uses its own {@link State}. Rows depend on nothing but their
 * index and values, so any row range encodes as in a whole run.
 */
final class RowEncoder {

    private enum Kind { FIXED, SHORTEST, INTEGER, BOOLEAN, LABEL, DATE, TIMESTAMP, SEQUENCE }

    private final OutputSpec output;
    private final List<String> names;
    private final CellKind[] cellKinds;
    private final Kind[] kinds;
    private final int[] decimals;
    /** Encoded cells of each level (labels) or of false/true (booleans); null otherwise. */
    private final byte[][][] levelBytes;
    private final byte[] nullBytes;
    private final byte[] delimiter;
    /** JSON: the encoded {@code "name":} of each column. */
    private final byte[][] keys;
    private final boolean csv;
    private final boolean jsonArray;
    /** CSV: number and boolean texts could need quoting under this delimiter, so quote them generically. */
    private final boolean genericNumbers;
    private final long rows;
    /** {@link #boundedCsvRow()}, computed once. */
    private final int csvRowBound;
    /** Sequence columns: start and step (the text is start + step·row, exact in 64 bits). */
    private final long[] start;
    private final long[] step;

    RowEncoder(Spec spec) {
        this.output = spec.output();
        List<ColumnSpec> columns = spec.columns();
        int k = columns.size();
        this.names = new ArrayList<>();
        this.cellKinds = new CellKind[k];
        this.kinds = new Kind[k];
        this.decimals = new int[k];
        this.levelBytes = new byte[k][][];
        this.keys = new byte[k][];
        this.start = new long[k];
        this.step = new long[k];
        this.rows = spec.rows();
        this.csv = output.format() == dev.standin.spec.OutputFormat.CSV;
        this.jsonArray = output.format() == dev.standin.spec.OutputFormat.JSON;
        this.delimiter = String.valueOf(output.delimiter()).getBytes(StandardCharsets.UTF_8);
        this.nullBytes = csv ? output.nullText().getBytes(StandardCharsets.UTF_8) : "null".getBytes(StandardCharsets.UTF_8);
        char d = output.delimiter();
        this.genericNumbers = csv && "0123456789.-+Eaeflrstu\"\r\n".indexOf(d) >= 0;
        for (int i = 0; i < k; i++) {
            ColumnSpec c = columns.get(i);
            names.add(c.name());
            StringBuilder sb = new StringBuilder();
            Json.string(sb, c.name());
            keys[i] = sb.append(':').toString().getBytes(StandardCharsets.UTF_8);
            if (!(c instanceof ColumnSpec.Random r)) {
                ColumnSpec.Sequence seq = (ColumnSpec.Sequence) c;
                start[i] = seq.start();
                step[i] = seq.step();
                kinds[i] = Kind.SEQUENCE;
                cellKinds[i] = CellKind.NUMBER;
                continue;
            }
            ValueKind vk = r.marginal().valueKind();
            cellKinds[i] = switch (vk) {
                case NUMBER, INTEGER -> CellKind.NUMBER;
                case BOOLEAN -> CellKind.BOOLEAN;
                case LABEL, DATE, TIMESTAMP -> CellKind.TEXT;
            };
            decimals[i] = r.decimals();
            kinds[i] = switch (vk) {
                case NUMBER -> r.decimals() >= 0 ? Kind.FIXED : Kind.SHORTEST;
                case INTEGER -> Kind.INTEGER;
                case BOOLEAN -> Kind.BOOLEAN;
                case LABEL -> Kind.LABEL;
                case DATE -> Kind.DATE;
                case TIMESTAMP -> Kind.TIMESTAMP;
            };
        }
        for (int i = 0; i < k; i++) {
            if (kinds[i] == Kind.BOOLEAN) {
                levelBytes[i] = new byte[][] {encodeCell(i, "false"), encodeCell(i, "true")};
            } else if (kinds[i] == Kind.LABEL) {
                Marginal m = ((ColumnSpec.Random) columns.get(i)).marginal();
                int levels = ((dev.standin.marginal.DiscreteTable) m).size();
                levelBytes[i] = new byte[levels][];
                for (int j = 0; j < levels; j++) {
                    levelBytes[i][j] = encodeCell(i, m.label(j));
                }
            }
        }
        this.csvRowBound = boundedCsvRow();
    }

    /** The bytes before the first row: the CSV header, or the JSON array's opening bracket. */
    byte[] prologue() {
        StringWriter sw = new StringWriter();
        try {
            RowWriter w = DatasetWriter.rowWriter(output, sw, names, cellKinds);
            w.begin();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return sw.toString().getBytes(StandardCharsets.UTF_8);
    }

    /** The bytes after the last row: the JSON array's closing bracket; nothing for CSV and JSON Lines. */
    byte[] epilogue() {
        if (!jsonArray) {
            return new byte[0];
        }
        return (rows == 0 ? "]\n" : "\n]\n").getBytes(StandardCharsets.UTF_8);
    }

    /** A cell's text as the format's row writer writes it alone in a row (without the row's end). */
    private byte[] encodeCell(int column, String text) {
        StringWriter sw = new StringWriter();
        try {
            RowWriter w = DatasetWriter.rowWriter(output, sw, List.of(names.get(column)),
                    new CellKind[] {cellKinds[column]});
            if (!csv) {
                // JSON: take the value out of {"name":value}
                StringBuilder sb = new StringBuilder();
                if (cellKinds[column] == CellKind.TEXT) {
                    Json.string(sb, text);
                } else {
                    sb.append(text);
                }
                return sb.toString().getBytes(StandardCharsets.UTF_8);
            }
            w.row(new String[] {text});
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        String s = sw.toString();
        return s.substring(0, s.length() - 1).getBytes(StandardCharsets.UTF_8);
    }

    /**
     * The most bytes one row can take when every cell's length is bounded (fixed decimals at most
     * {@value NumberText#MAX_FIXED_CHARS}, whole numbers 20, labels and booleans their longest
     * encoding) and the CSV delimiter is one byte; else −1, and rows take the general path.
     */
    private int boundedCsvRow() {
        if (!csv || genericNumbers || delimiter.length != 1) {
            return -1;
        }
        int total = 1;
        for (int i = 0; i < kinds.length; i++) {
            int cell = switch (kinds[i]) {
                case FIXED -> NumberText.MAX_FIXED_CHARS;
                case INTEGER, SEQUENCE -> 20;
                case BOOLEAN, LABEL -> {
                    int longest = 0;
                    for (byte[] level : levelBytes[i]) {
                        longest = Math.max(longest, level.length);
                    }
                    yield longest;
                }
                default -> -1;
            };
            if (cell < 0) {
                return -1;
            }
            total += Math.max(cell, nullBytes.length) + 1;
        }
        return total;
    }

    /** Per-thread working state. */
    final class State {
        private final StringWriter cellText = new StringWriter();
        private final RowWriter[] cellWriters = new RowWriter[kinds.length];
    }

    State state() {
        return new State();
    }

    /**
     * Encodes rows 0 .. n − 1 of a block starting at row {@code firstRow} and replaces each value by the
     * value its text reads back as (for the statistics).
     */
    void encode(long firstRow, int n, double[][] values, boolean[][] missing, ByteText out, State state) {
        if (csvRowBound > 0) {
            encodeBoundedCsv(firstRow, n, values, missing, out);
            return;
        }
        int k = kinds.length;
        for (int r = 0; r < n; r++) {
            long row = firstRow + r;
            if (jsonArray) {
                out.append((byte) (row == 0 ? '\n' : ','));
                if (row != 0) {
                    out.append((byte) '\n');
                }
            }
            if (!csv) {
                out.append((byte) '{');
            }
            for (int i = 0; i < k; i++) {
                if (i > 0) {
                    if (csv) {
                        out.append(delimiter);
                    } else {
                        out.append((byte) ',');
                    }
                }
                if (!csv) {
                    out.append(keys[i]);
                }
                if (missing[i][r]) {
                    out.append(nullBytes);
                    continue;
                }
                values[i][r] = cell(i, values[i][r], row, out, state);
            }
            if (!csv) {
                out.append((byte) '}');
                if (!jsonArray) {
                    out.append((byte) '\n');
                }
            } else {
                out.append((byte) '\n');
            }
        }
    }

    /**
     * CSV rows whose cells all have bounded lengths, written straight into the buffer's storage: the
     * same bytes as the general path (fixed decimals by {@link NumberText#writeScaled}, whole numbers as
     * {@link Long#toString(long)}, levels as encoded once), with room reserved once per row.
     */
    private void encodeBoundedCsv(long firstRow, int n, double[][] values, boolean[][] missing, ByteText out) {
        for (int r = 0; r < n; r++) {
            encodeBoundedCsvRow(firstRow + r, r, values, missing, out);
        }
    }

    /**
     * One row (a method of its own, called once per row, so the JIT compiles it whole after a few
     * thousand rows instead of compiling the block loop on stack replacement first).
     */
    private void encodeBoundedCsvRow(long row, int r, double[][] values, boolean[][] missing, ByteText out) {
        int k = kinds.length;
        byte delim = delimiter[0];
        byte[] b = out.reserve(csvRowBound);
        int p = out.length();
        for (int i = 0; i < k; i++) {
            if (i > 0) {
                b[p++] = delim;
            }
            if (missing[i][r]) {
                System.arraycopy(nullBytes, 0, b, p, nullBytes.length);
                p += nullBytes.length;
                continue;
            }
            double v = values[i][r];
            switch (kinds[i]) {
                case FIXED -> {
                    long q = NumberText.scaledHalfEven(v, decimals[i]);
                    if (q == NumberText.NO_FAST_PATH) {
                        // beyond 2^53 or 2^62 scaled: BigDecimal, through the checked buffer
                        out.setLength(p);
                        values[i][r] = out.appendFixed(v, decimals[i]);
                        b = out.reserve(csvRowBound);
                        p = out.length();
                    } else {
                        boolean negative = v < 0;
                        p = NumberText.writeScaled(q, negative, decimals[i], b, p);
                        values[i][r] = NumberText.scaledValue(q, negative, decimals[i]);
                    }
                }
                case INTEGER, SEQUENCE -> {
                    long whole = kinds[i] == Kind.SEQUENCE ? start[i] + step[i] * row : (long) v;
                    if (whole == Long.MIN_VALUE) {
                        out.setLength(p);
                        out.appendLong(whole);
                        b = out.reserve(csvRowBound);
                        p = out.length();
                    } else {
                        p = ByteText.writeLong(whole, b, p);
                    }
                }
                default -> {
                    byte[] level = levelBytes[i][kinds[i] == Kind.BOOLEAN ? (v == 1.0 ? 1 : 0) : (int) v];
                    System.arraycopy(level, 0, b, p, level.length);
                    p += level.length;
                }
            }
        }
        b[p++] = '\n';
        out.setLength(p);
    }

    private double cell(int i, double v, long row, ByteText out, State state) {
        switch (kinds[i]) {
            case FIXED:
                if (genericNumbers) {
                    String s = NumberText.fixed(v, decimals[i]);
                    generic(i, s, out, state);
                    return Double.parseDouble(s);
                }
                return out.appendFixed(v, decimals[i]);
            case INTEGER:
            case SEQUENCE: {
                long whole = kinds[i] == Kind.SEQUENCE ? start[i] + step[i] * row : (long) v;
                if (genericNumbers) {
                    generic(i, Long.toString(whole), out, state);
                } else {
                    out.appendLong(whole);
                }
                return v;
            }
            case BOOLEAN:
                out.append(levelBytes[i][v == 1.0 ? 1 : 0]);
                return v;
            case LABEL:
                out.append(levelBytes[i][(int) v]);
                return v;
            case SHORTEST: {
                String s = NumberText.shortest(v);
                if (genericNumbers) {
                    generic(i, s, out, state);
                } else {
                    out.append(s);
                }
                return v;
            }
            case DATE:
                generic(i, LocalDate.ofEpochDay((long) v).toString(), out, state);
                return v;
            default:
                generic(i, Instant.ofEpochSecond((long) v).toString(), out, state);
                return v;
        }
    }

    /** A cell quoted and escaped by the format's own row writer. */
    private void generic(int i, String text, ByteText out, State state) {
        if (!csv) {
            if (cellKinds[i] == CellKind.TEXT) {
                StringBuilder sb = new StringBuilder(text.length() + 2);
                Json.string(sb, text);
                out.append(sb.toString());
            } else {
                out.append(text);
            }
            return;
        }
        StringWriter sw = state.cellText;
        sw.getBuffer().setLength(0);
        try {
            RowWriter w = state.cellWriters[i];
            if (w == null) {
                w = DatasetWriter.rowWriter(output, sw, List.of(names.get(i)), new CellKind[] {cellKinds[i]});
                state.cellWriters[i] = w;
            }
            w.row(new String[] {text});
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        StringBuffer b = sw.getBuffer();
        out.append(b.substring(0, b.length() - 1));
    }
}
