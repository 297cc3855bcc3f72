package dev.standin.maven;

import java.util.Properties;
import org.apache.maven.plugin.AbstractMojo;
import org.apache.maven.plugin.MojoFailureException;
import org.apache.maven.plugins.annotations.Parameter;

/**
 * The parameters the two generating goals ({@code generate} and {@code sample}) share: the
 * {@code seed}, {@code rows} and {@code format} overrides, {@code failOnDeviation}, {@code report}
 * and {@code threads}. For each of them a {@code -D} on the command line wins over the pom
 * ({@link CommandLine}). A goal keeps its own folders and the Maven objects it needs, and hands
 * everything to {@link PluginBridge}.
 */
abstract class AbstractDatasetMojo extends AbstractMojo {

    /**
     * Replaces the {@code seed} of every spec: a 64-bit integer. Unset keeps each spec's own seed.
     * {@code -Dstandin.seed} wins over a value in the pom.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.seed")
    private String seed;

    /**
     * Replaces the {@code rows} of every spec: a whole number from 0 to 2^40. Unset keeps each
     * spec's own row count. {@code -Dstandin.rows} wins over a value in the pom.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.rows")
    private String rows;

    /**
     * Replaces the output format of every spec: {@code csv}, {@code json} or {@code jsonl}. Unset
     * keeps each spec's own format. {@code -Dstandin.format} wins over a value in the pom.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.format")
    private String format;

    /**
     * Fails the build when a fidelity check of the written data fails (a column's mean, sd, missing
     * fraction or distribution, or a pair's correlation, outside its sampling-theory tolerance), naming
     * the dataset, the column or pair and the numbers; {@code false} only warns. The files are written
     * either way. {@code -Dstandin.failOnDeviation} wins over a value in the pom.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.failOnDeviation", defaultValue = "true")
    private boolean failOnDeviation;

    /**
     * Writes {@code <dataset>.report.html} beside each data file (a spec's {@code output.report: false}
     * also switches it off); the JSON report is always written. {@code -Dstandin.report} wins over a
     * value in the pom.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.report", defaultValue = "true")
    private boolean report;

    /**
     * Generates rows on this many threads (0, the default, uses the processors available). The files
     * are byte-identical for any number; lower it when a parallel build ({@code mvn -T}) already keeps
     * every core busy. {@code -Dstandin.threads} wins over a value in the pom.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.threads", defaultValue = "0")
    private int threads;

    /** The seed override: {@code -Dstandin.seed} when given, else the configured value (null: none). */
    final String seed(Properties user) {
        return CommandLine.value(user, PluginBridge.SEED_PROPERTY, seed);
    }

    /** The row-count override: {@code -Dstandin.rows} when given, else the configured value (null: none). */
    final String rows(Properties user) {
        return CommandLine.value(user, PluginBridge.ROWS_PROPERTY, rows);
    }

    /** The format override: {@code -Dstandin.format} when given, else the configured value (null: none). */
    final String format(Properties user) {
        return CommandLine.value(user, PluginBridge.FORMAT_PROPERTY, format);
    }

    /**
     * A bridge over this goal's log with {@code report}, {@code failOnDeviation} and {@code threads}
     * applied, each {@code -D} winning over the configured value.
     *
     * @param user Maven's user properties (the {@code -D}s), or null for none
     * @throws MojoFailureException naming the property when a {@code -D} value is not valid
     */
    final PluginBridge bridge(Properties user) throws MojoFailureException {
        return PluginBridge.withLog(getLog())
                .configured(CommandLine.flag(user, PluginBridge.REPORT_PROPERTY, report).on(),
                        CommandLine.flag(user, PluginBridge.FAIL_ON_DEVIATION_PROPERTY, failOnDeviation).on())
                .withThreads(CommandLine.threads(user, threads));
    }
}
