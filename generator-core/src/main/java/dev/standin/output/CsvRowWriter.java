package dev.standin.output;

import java.io.IOException;
import java.io.Writer;
import java.util.List;

/**
 * CSV per RFC 4180: a field is quoted when it contains the delimiter, a double quote, CR or LF (or
 * is text equal to the missing-value text, or has leading or trailing spaces), with quotes doubled
 * inside. Records end with {@code \n} (not RFC 4180's CRLF) so files are identical on every OS.
 *
 * <p>With the formula guard on, a text field (a header name or a text cell: categorical labels,
 * dates, timestamps) that starts with {@code =}, {@code +}, {@code -}, {@code @}, a tab or a CR gets a
 * leading {@code '}, so a spreadsheet shows it as text instead of evaluating it. That is common
 * practice against "CSV injection" (the character list and the quote prefix are OWASP's "CSV
 * Injection" page's). Number and boolean cells are never changed, so {@code -3.5} stays a number.
 * The guard changes the data (a reader of the CSV sees the {@code '}), which is why it is off unless
 * asked for.
 */
public final class CsvRowWriter implements RowWriter {

    private final Writer out;
    private final List<String> names;
    private final CellKind[] kinds;
    private final boolean header;
    private final char delimiter;
    private final String nullText;
    private final boolean guardFormulas;

    /** A writer without the formula guard. */
    public CsvRowWriter(Writer out, List<String> names, CellKind[] kinds, boolean header, char delimiter, String nullText) {
        this(out, names, kinds, header, delimiter, nullText, false);
    }

    /**
     * A writer.
     *
     * @param guardFormulas prefix formula-like text fields with {@code '} (see the class comment)
     */
    public CsvRowWriter(Writer out, List<String> names, CellKind[] kinds, boolean header, char delimiter, String nullText,
                        boolean guardFormulas) {
        this.guardFormulas = guardFormulas;
        this.out = out;
        this.names = List.copyOf(names);
        this.kinds = kinds.clone();
        this.header = header;
        this.delimiter = delimiter;
        this.nullText = nullText;
    }

    @Override
    public void begin() throws IOException {
        if (!header) {
            return;
        }
        for (int i = 0; i < names.size(); i++) {
            if (i > 0) {
                out.write(delimiter);
            }
            field(names.get(i), true);
        }
        out.write('\n');
    }

    @Override
    public void row(String[] cells) throws IOException {
        for (int i = 0; i < cells.length; i++) {
            if (i > 0) {
                out.write(delimiter);
            }
            String c = cells[i];
            if (c == null) {
                out.write(nullText);
            } else {
                field(c, kinds[i] == CellKind.TEXT);
            }
        }
        out.write('\n');
    }

    /** True when a spreadsheet would read text starting this way as a formula (OWASP's list). */
    static boolean formulaLike(String s) {
        if (s.isEmpty()) {
            return false;
        }
        char c = s.charAt(0);
        return c == '=' || c == '+' || c == '-' || c == '@' || c == '\t' || c == '\r';
    }

    private void field(String value, boolean text) throws IOException {
        String s = text && guardFormulas && formulaLike(value) ? "'" + value : value;
        if (needsQuotes(s, text)) {
            out.write('"');
            out.write(s.replace("\"", "\"\""));
            out.write('"');
        } else {
            out.write(s);
        }
    }

    private boolean needsQuotes(String s, boolean text) {
        if (text && (s.equals(nullText) || (!s.isEmpty() && (s.charAt(0) == ' ' || s.charAt(s.length() - 1) == ' ')))) {
            return true;
        }
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (c == delimiter || c == '"' || c == '\n' || c == '\r') {
                return true;
            }
        }
        return false;
    }

    @Override
    public void end() {
        // nothing follows the last record
    }
}
