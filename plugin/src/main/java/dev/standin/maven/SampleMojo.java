package dev.standin.maven;

import java.io.File;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.Properties;
import org.apache.maven.execution.MavenSession;
import org.apache.maven.plugin.AbstractMojo;
import org.apache.maven.plugin.MojoExecutionException;
import org.apache.maven.plugin.MojoFailureException;
import org.apache.maven.plugins.annotations.Mojo;
import org.apache.maven.plugins.annotations.Parameter;

/**
 * Generates the named spec files without needing a project: handy to try a spec out. Each spec is
 * named in messages as given; its data file and report go straight into the output folder (by
 * default the folder Maven was started in). All specs are checked before anything is written. It
 * keeps no state: every spec named is generated each time. {@code -Dstandin.seed},
 * {@code -Dstandin.rows} and {@code -Dstandin.format} win over the same parameters in a pom.
 *
 * <p>Usage, in any folder:
 * <pre>
 * mvn dev.standin:standin-maven-plugin:0.1.0-SNAPSHOT:sample -Dstandin.spec=ferry-crossings.yaml
 * mvn dev.standin:standin-maven-plugin:0.1.0-SNAPSHOT:sample -Dstandin.spec=a.yaml,specs/b.yml \
 *     -Dstandin.outputDirectory=out -Dstandin.rows=20
 * </pre>
 * or bound in a pom:
 * <pre>
 * &lt;plugin&gt;
 *   &lt;groupId&gt;dev.standin&lt;/groupId&gt;
 *   &lt;artifactId&gt;standin-maven-plugin&lt;/artifactId&gt;
 *   &lt;version&gt;0.1.0-SNAPSHOT&lt;/version&gt;
 *   &lt;configuration&gt;
 *     &lt;spec&gt;docs/ferry-crossings.yaml&lt;/spec&gt;
 *     &lt;rows&gt;50&lt;/rows&gt;
 *   &lt;/configuration&gt;
 * &lt;/plugin&gt;
 * </pre>
 *
 * @since 0.1.0
 */
@Mojo(name = "sample", requiresProject = false, threadSafe = true)
public final class SampleMojo extends AbstractMojo {

    /**
     * The spec files to generate, comma-separated, relative to the folder Maven was started in (or
     * absolute). A value in the pom wins over {@code -Dstandin.spec}.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.spec")
    private String spec;

    /**
     * The folder the data files and reports are written to; by default the folder Maven was started
     * in. A value in the pom wins over {@code -Dstandin.outputDirectory}.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.outputDirectory")
    private File outputDirectory;

    /**
     * Replaces the {@code seed} of every spec: a 64-bit integer. {@code -Dstandin.seed} wins over a value in
     * the pom.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.seed")
    private String seed;

    /**
     * Replaces the {@code rows} of every spec: a whole number from 0 to 2^40. {@code -Dstandin.rows} wins over a value in
     * the pom.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.rows")
    private String rows;

    /**
     * Replaces the output format of every spec: {@code csv}, {@code json} or {@code jsonl}. {@code -Dstandin.format} wins over a value in
     * the pom.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.format")
    private String format;

    /**
     * Fails the build when a fidelity check of the written data fails; {@code false} only warns. The
     * files are written either way.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.failOnDeviation", defaultValue = "true")
    private boolean failOnDeviation;

    /**
     * Writes {@code <dataset>.report.html} beside each data file; the JSON report is always written.
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

    /** The build, for the {@code -D} user properties that win over the pom. */
    @Parameter(defaultValue = "${session}", readonly = true)
    private MavenSession session;

    /** The folder Maven was started in (the session's execution root). */
    @Parameter(defaultValue = "${session.executionRootDirectory}", readonly = true)
    private File startDirectory;

    @Override
    public void execute() throws MojoExecutionException, MojoFailureException {
        Path base = startDirectory != null ? startDirectory.toPath() : Paths.get(System.getProperty("user.dir"));
        Properties user = session == null ? null : session.getUserProperties();
        PluginBridge.withLog(getLog())
                .configured(CommandLine.flag(user, PluginBridge.REPORT_PROPERTY, report).on(),
                        CommandLine.flag(user, PluginBridge.FAIL_ON_DEVIATION_PROPERTY, failOnDeviation).on())
                .withThreads(CommandLine.threads(user, threads))
                .sampleGoal(spec, base.toAbsolutePath(),
                outputDirectory == null ? null : outputDirectory.toPath(),
                CommandLine.value(user, PluginBridge.SEED_PROPERTY, seed),
                CommandLine.value(user, PluginBridge.ROWS_PROPERTY, rows),
                CommandLine.value(user, PluginBridge.FORMAT_PROPERTY, format));
    }
}
