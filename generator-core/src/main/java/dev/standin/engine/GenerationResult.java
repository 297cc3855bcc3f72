package dev.standin.engine;

import dev.standin.report.Check;
import java.util.List;

/**
 * What one generation wrote: the files (data first, then the reports), a note for the summary line
 * (or null), and the fidelity checks of the written data.
 */
public record GenerationResult(String dataset, long rows, int columns, List<WrittenFile> files, String note,
                               List<Check> checks) {

    /** The checks that were made and failed. */
    public List<Check> failedChecks() {
        return checks.stream().filter(c -> !c.ok()).toList();
    }

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
                + (note == null ? "" : "; " + note)
                + (failedChecks().isEmpty() ? "" : "; " + failedChecks().size() + " fidelity check(s) FAILED");
    }
}
