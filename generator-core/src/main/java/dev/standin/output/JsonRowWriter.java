package dev.standin.output;

import java.io.IOException;
import java.io.Writer;
import java.util.List;

/**
 * JSON (RFC 8259) rows: either one array of objects ({@link #array}) or JSON Lines, one object a
 * line ({@link #lines}). Numbers and booleans are bare, text is quoted, a missing value is null.
 */
public final class JsonRowWriter implements RowWriter {

    private final Writer out;
    private final String[] keys;
    private final CellKind[] kinds;
    private final boolean array;
    private long count;

    private JsonRowWriter(Writer out, List<String> names, CellKind[] kinds, boolean array) {
        this.out = out;
        this.keys = new String[names.size()];
        for (int i = 0; i < keys.length; i++) {
            StringBuilder sb = new StringBuilder();
            Json.string(sb, names.get(i));
            keys[i] = sb.append(':').toString();
        }
        this.kinds = kinds.clone();
        this.array = array;
    }

    public static JsonRowWriter array(Writer out, List<String> names, CellKind[] kinds) {
        return new JsonRowWriter(out, names, kinds, true);
    }

    public static JsonRowWriter lines(Writer out, List<String> names, CellKind[] kinds) {
        return new JsonRowWriter(out, names, kinds, false);
    }

    @Override
    public void begin() throws IOException {
        if (array) {
            out.write('[');
        }
    }

    @Override
    public void row(String[] cells) throws IOException {
        StringBuilder sb = new StringBuilder(16 * cells.length);
        if (array) {
            sb.append(count == 0 ? "\n" : ",\n");
        }
        sb.append('{');
        for (int i = 0; i < cells.length; i++) {
            if (i > 0) {
                sb.append(',');
            }
            sb.append(keys[i]);
            String c = cells[i];
            if (c == null) {
                sb.append("null");
            } else if (kinds[i] == CellKind.TEXT) {
                Json.string(sb, c);
            } else {
                sb.append(c);
            }
        }
        sb.append('}');
        if (!array) {
            sb.append('\n');
        }
        out.write(sb.toString());
        count++;
    }

    @Override
    public void end() throws IOException {
        if (array) {
            out.write(count == 0 ? "]\n" : "\n]\n");
        }
    }
}
