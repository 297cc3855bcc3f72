package dev.standin.engine;

import dev.standin.sampling.LatentModel;
import dev.standin.spec.Spec;

/**
 * A spec that passed every check and is ready to generate: the parsed spec, its latent model, the
 * spec file's SHA-256, where its files go relative to the output folder ('/'-separated), and whether
 * the HTML report is written.
 */
public record CompiledSpec(Spec spec, LatentModel model, String specSha256, String dataFile, String reportFile,
                           boolean htmlReport) {

    /** The HTML report's path relative to the output folder: {@code <dataset>.report.html} beside the JSON report. */
    public String htmlReportFile() {
        return reportFile.substring(0, reportFile.length() - ".json".length()) + ".html";
    }

    /** Warnings to show the user before generating, each {@code FILE:LINE:COLUMN: warning: ...}. */
    public java.util.List<String> warnings() {
        return model.warnings();
    }

    /**
     * Every file this spec writes, relative to the output folder ('/'-separated), the data file first:
     * what a build tool needs to track, clean up or check for clashes. Keep in step with what
     * {@link Engine#generate} writes.
     */
    public java.util.List<String> outputFiles() {
        return htmlReport ? java.util.List.of(dataFile, reportFile, htmlReportFile()) : java.util.List.of(dataFile, reportFile);
    }
}
