package dev.standin.fit;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Reads comma-separated values as defined by RFC 4180 (Y. Shafranovich, "Common Format and MIME Type
 * for Comma-Separated Values (CSV) Files", October 2005), written by hand so that every problem names
 * FILE:LINE:COLUMN.
 *
 * <ul>
 *   <li>The first record is the header: one non-empty, distinct name per column.</li>
 *   <li>Fields are separated by {@code ,}; records end with CRLF, LF or a lone CR (RFC 4180 asks for
 *   CRLF; the other two are what most tools write); the last record may end without one.</li>
 *   <li>A field starting with {@code "} is quoted: it may hold commas, line breaks and doubled quotes
 *   {@code ""} (one quote), and after its closing quote only {@code ,} or the end of the record may
 *   follow. A {@code "} inside an unquoted field is kept as a character, as Apache Commons CSV does
 *   (RFC 4180 §2.5 forbids it, but spreadsheets write {@code 5" pipe} unquoted).</li>
 *   <li>Every record must have as many fields as the header. A completely empty line is skipped when
 *   the header has more than one column (it cannot be a record), and is one empty field otherwise.</li>
 *   <li>Text is UTF-8 (RFC 4180's MIME type allows a charset parameter; UTF-8 is the only one read);
 *   a leading byte-order mark is skipped. Invalid UTF-8 is an error at its line.</li>
 * </ul>
 *
 * The whole file is read into memory; files over {@link #MAX_BYTES} are refused.
 */
public final class CsvReader {

    /** The largest data file read: 1 GiB. */
    public static final long MAX_BYTES = 1L << 30;

    /** The most columns a data file may have (the spec format's own limit). */
    public static final int MAX_COLUMNS = 10_000;

    private CsvReader() {
    }

    /**
     * Reads a data file.
     *
     * @param displayName the name used in messages
     * @throws FitException for a malformed file, at FILE:LINE:COLUMN
     * @throws IOException when the file cannot be read
     */
    public static CsvTable read(Path file, String displayName) throws FitException, IOException {
        if (Files.isDirectory(file)) {
            throw FitException.at(displayName, 1, 1, "is a directory, not a data file");
        }
        byte[] bytes;
        try {
            if (Files.size(file) > MAX_BYTES) {
                throw FitException.at(displayName, 1, 1, "data file is " + Files.size(file) + " bytes; the limit is "
                        + MAX_BYTES + " bytes (1 GiB)");
            }
            bytes = Files.readAllBytes(file);
        } catch (NoSuchFileException e) {
            throw FitException.at(displayName, 1, 1, "no such data file");
        }
        return parse(displayName, decode(displayName, bytes));
    }

    /** Decodes UTF-8 strictly; invalid bytes are an error at their line and column. */
    static String decode(String displayName, byte[] bytes) throws FitException {
        CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                .onUnmappableCharacter(CodingErrorAction.REPORT);
        ByteBuffer in = ByteBuffer.wrap(bytes);
        CharBuffer out = CharBuffer.allocate((int) Math.min(Integer.MAX_VALUE - 16L, bytes.length + 1L));
        CoderResult r = decoder.decode(in, out, true);
        if (r.isError()) {
            int bad = in.position();
            int line = 1;
            int lineStart = 0;
            for (int i = 0; i < bad; i++) {
                if (bytes[i] == '\n' || (bytes[i] == '\r' && (i + 1 >= bytes.length || bytes[i + 1] != '\n'))) {
                    line++;
                    lineStart = i + 1;
                }
            }
            int column = new String(bytes, lineStart, bad - lineStart, StandardCharsets.UTF_8).length() + 1;
            throw FitException.at(displayName, line, column, "data file is not valid UTF-8 text (byte " + (bad + 1) + ")");
        }
        decoder.flush(out);
        out.flip();
        return out.toString();
    }

    /**
     * Parses CSV text.
     *
     * @throws FitException for a malformed file, at FILE:LINE:COLUMN
     */
    public static CsvTable parse(String displayName, String text) throws FitException {
        return new Parser(displayName, text).table();
    }

    /** The parser's state: a position in the text and the physical line and column there. */
    private static final class Parser {
        private final String file;
        private final String text;
        private int pos;
        private int line = 1;
        private int lineStart;

        Parser(String file, String text) {
            this.file = file;
            this.text = text;
            this.pos = !text.isEmpty() && text.charAt(0) == '\uFEFF' ? 1 : 0;
            this.lineStart = pos;
        }

        private int column() {
            return pos - lineStart + 1;
        }

        CsvTable table() throws FitException {
            if (pos >= text.length()) {
                throw FitException.at(file, 1, 1, "data file is empty; it needs a header row naming the columns");
            }
            List<Integer> headerColumns = new ArrayList<>();
            int headerLine = line;
            List<String> header = record(headerColumns);
            if (header.size() > MAX_COLUMNS) {
                throw FitException.at(file, headerLine, 1, "header names " + header.size() + " columns; the limit is " + MAX_COLUMNS);
            }
            Map<String, Integer> seen = new HashMap<>();
            for (int i = 0; i < header.size(); i++) {
                String name = header.get(i);
                int col = headerColumns.get(i);
                if (name.isEmpty()) {
                    throw FitException.at(file, headerLine, col, "column " + (i + 1) + " has no name; every header field must name its column");
                }
                Integer earlier = seen.putIfAbsent(name, i);
                if (earlier != null) {
                    throw FitException.at(file, headerLine, col, "column name '" + name + "' is given twice (columns "
                            + (earlier + 1) + " and " + (i + 1) + "); column names must be distinct");
                }
            }
            List<String[]> rows = new ArrayList<>();
            List<Integer> lines = new ArrayList<>();
            while (pos < text.length()) {
                int startLine = line;
                if (header.size() > 1 && atBlankLine()) {
                    endOfRecord();
                    continue;
                }
                List<String> fields = record(null);
                if (fields.size() != header.size()) {
                    throw FitException.at(file, startLine, 1, "record has " + fields.size() + " field"
                            + (fields.size() == 1 ? "" : "s") + "; the header has " + header.size());
                }
                rows.add(fields.toArray(new String[0]));
                lines.add(startLine);
            }
            int[] l = new int[lines.size()];
            for (int i = 0; i < l.length; i++) {
                l[i] = lines.get(i);
            }
            int[] hc = new int[headerColumns.size()];
            for (int i = 0; i < hc.length; i++) {
                hc[i] = headerColumns.get(i);
            }
            return new CsvTable(file, header, hc, rows, l);
        }

        private boolean atBlankLine() {
            char c = text.charAt(pos);
            return c == '\n' || c == '\r';
        }

        /** Reads one record and the line break after it (if any). */
        private List<String> record(List<Integer> columns) throws FitException {
            List<String> fields = new ArrayList<>();
            while (true) {
                if (columns != null) {
                    columns.add(column());
                }
                fields.add(pos < text.length() && text.charAt(pos) == '"' ? quoted() : unquoted());
                if (pos >= text.length()) {
                    return fields;
                }
                char c = text.charAt(pos);
                if (c == ',') {
                    pos++;
                    continue;
                }
                endOfRecord();
                return fields;
            }
        }

        private String unquoted() {
            int start = pos;
            while (pos < text.length()) {
                char c = text.charAt(pos);
                if (c == ',' || c == '\n' || c == '\r') {
                    break;
                }
                pos++;
            }
            return text.substring(start, pos);
        }

        private String quoted() throws FitException {
            int openLine = line;
            int openColumn = column();
            pos++;
            StringBuilder sb = new StringBuilder();
            while (true) {
                if (pos >= text.length()) {
                    throw FitException.at(file, openLine, openColumn, "quoted field is not closed: a '\"' is missing before the end of the file");
                }
                char c = text.charAt(pos);
                if (c == '"') {
                    if (pos + 1 < text.length() && text.charAt(pos + 1) == '"') {
                        sb.append('"');
                        pos += 2;
                        continue;
                    }
                    pos++;
                    break;
                }
                sb.append(c);
                pos++;
                if (c == '\n' || (c == '\r' && (pos >= text.length() || text.charAt(pos) != '\n'))) {
                    line++;
                    lineStart = pos;
                }
            }
            if (pos < text.length()) {
                char c = text.charAt(pos);
                if (c != ',' && c != '\n' && c != '\r') {
                    throw FitException.at(file, line, column(), "a quoted field must end at its closing '\"'; found '"
                            + printable(c) + "' after it (write \"\" for a quote inside the field)");
                }
            }
            return sb.toString();
        }

        private void endOfRecord() {
            char c = text.charAt(pos);
            pos++;
            if (c == '\r' && pos < text.length() && text.charAt(pos) == '\n') {
                pos++;
            }
            line++;
            lineStart = pos;
        }

        private static String printable(char c) {
            return Character.isISOControl(c) ? String.format(java.util.Locale.ROOT, "\\u%04x", (int) c) : String.valueOf(c);
        }
    }
}
