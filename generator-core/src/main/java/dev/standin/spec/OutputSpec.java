package dev.standin.spec;

/**
 * The {@code output:} block.
 *
 * @param file the output file name as written, or null for {@code <dataset>.<format>}
 * @param delimiter the CSV field separator
 * @param nullText the CSV text of a missing value
 * @param guardFormulas CSV only: prefix text cells that a spreadsheet would read as a formula with
 *     {@code '} ({@code guard-formulas}, default false)
 * @param htmlReport whether {@code <dataset>.report.html} is written ({@code report}, default true);
 *     the JSON report is always written
 */
public record OutputSpec(OutputFormat format, String file, Mark fileMark, boolean header, char delimiter,
                         String nullText, boolean guardFormulas, boolean htmlReport) {

    public static OutputSpec defaults() {
        return new OutputSpec(OutputFormat.CSV, null, null, true, ',', "", false, true);
    }
}
