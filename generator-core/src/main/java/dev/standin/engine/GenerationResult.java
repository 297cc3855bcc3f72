package dev.standin.engine;

import java.util.List;

/** What one generation wrote; {@code note} is null or a short remark for the summary line. */
public record GenerationResult(String dataset, long rows, int columns, List<WrittenFile> files, String note) {

    /** One written file: its path relative to the output folder ('/'-separated), size and SHA-256. */
    public record WrittenFile(String path, long bytes, String sha256) {
    }

    /**
     * The one-line summary logged per dataset, e.g. {@code ferry-crossings: 5000 rows × 4 columns →
     * ferry-crossings.csv (90816 bytes)}, followed by the note (such as {@code correlation repaired
     * (max change 0.0312)}) when there is one.
     */
    public String summary() {
        WrittenFile data = files.get(0);
        return dataset + ": " + rows + " rows × " + columns + " columns → " + data.path() + " (" + data.bytes() + " bytes)"
                + (note == null ? "" : "; " + note);
    }
}
