package dev.standin.engine;

import java.util.List;

/** What one generation wrote. */
public record GenerationResult(String dataset, long rows, int columns, List<WrittenFile> files) {

    /** One written file: its path relative to the output folder ('/'-separated), size and SHA-256. */
    public record WrittenFile(String path, long bytes, String sha256) {
    }

    /** The one-line summary logged per dataset, e.g. {@code ferry-crossings: 5000 rows × 4 columns → ferry-crossings.csv (210394 bytes)}. */
    public String summary() {
        WrittenFile data = files.get(0);
        return dataset + ": " + rows + " rows × " + columns + " columns → " + data.path() + " (" + data.bytes() + " bytes)";
    }
}
