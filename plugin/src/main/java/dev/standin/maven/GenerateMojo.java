package dev.standin.maven;

import java.io.File;
import org.apache.maven.plugin.AbstractMojo;
import org.apache.maven.plugin.MojoExecutionException;
import org.apache.maven.plugin.MojoFailureException;
import org.apache.maven.plugins.annotations.LifecyclePhase;
import org.apache.maven.plugins.annotations.Mojo;
import org.apache.maven.plugins.annotations.Parameter;
import org.apache.maven.project.MavenProject;

/**
 * Generates every spec ({@code *.yaml}, {@code *.yml}) under the spec folder into the output folder,
 * keeping sub-folders, and adds the output folder to the project's test resources so tests read the
 * fixtures from the classpath. All specs are checked before anything is written: one invalid spec
 * fails the build with its {@code FILE:LINE:COLUMN: message} lines and leaves no file behind. One
 * summary line is logged per dataset.
 *
 * <p>Usage in a pom:
 * <pre>
 * &lt;plugin&gt;
 *   &lt;groupId&gt;dev.standin&lt;/groupId&gt;
 *   &lt;artifactId&gt;standin-maven-plugin&lt;/artifactId&gt;
 *   &lt;version&gt;0.1.0-SNAPSHOT&lt;/version&gt;
 *   &lt;executions&gt;
 *     &lt;execution&gt;
 *       &lt;goals&gt;&lt;goal&gt;generate&lt;/goal&gt;&lt;/goals&gt;
 *       &lt;!-- optional; these are the defaults --&gt;
 *       &lt;configuration&gt;
 *         &lt;specDirectory&gt;${project.basedir}/src/test/standin&lt;/specDirectory&gt;
 *         &lt;outputDirectory&gt;${project.build.directory}/generated-test-resources/standin&lt;/outputDirectory&gt;
 *       &lt;/configuration&gt;
 *     &lt;/execution&gt;
 *   &lt;/executions&gt;
 * &lt;/plugin&gt;
 * </pre>
 * A spec at {@code src/test/standin/depot/trams.yaml} writing {@code trams.csv} is then on the test
 * classpath as {@code /depot/trams.csv}. From the command line:
 * {@code mvn generate-test-resources -Dstandin.rows=100 -Dstandin.format=jsonl}.
 *
 * @since 0.1.0
 */
@Mojo(name = "generate", defaultPhase = LifecyclePhase.GENERATE_TEST_RESOURCES, threadSafe = true)
public final class GenerateMojo extends AbstractMojo {

    /**
     * The folder searched, at any depth, for spec files ending in {@code .yaml} or {@code .yml}
     * (names starting with '.' are ignored). A spec's path relative to this folder is its name in
     * messages and reports, and its sub-folder is kept under the output folder. A missing folder
     * means there is nothing to generate.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.specDirectory", defaultValue = "${project.basedir}/src/test/standin", required = true)
    private File specDirectory;

    /**
     * The folder the data files and their {@code <dataset>.report.json} reports are written to. It is
     * added to the project's test resources.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.outputDirectory",
            defaultValue = "${project.build.directory}/generated-test-resources/standin", required = true)
    private File outputDirectory;

    /**
     * Replaces the {@code seed} of every spec: a 64-bit integer. Unset keeps each spec's own seed.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.seed")
    private String seed;

    /**
     * Replaces the {@code rows} of every spec: a whole number from 0 to 2^40. Unset keeps each
     * spec's own row count.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.rows")
    private String rows;

    /**
     * Replaces the output format of every spec: {@code csv}, {@code json} or {@code jsonl}. Unset
     * keeps each spec's own format.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.format")
    private String format;

    /**
     * Skips generation (a log line says so); nothing is written and no test resource is added.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.skip", defaultValue = "false")
    private boolean skip;

    /** The project whose test resources receive the output folder. */
    @Parameter(defaultValue = "${project}", readonly = true, required = true)
    private MavenProject project;

    @Override
    public void execute() throws MojoExecutionException, MojoFailureException {
        PluginBridge.withLog(getLog()).generateGoal(skip, specDirectory.toPath(), outputDirectory.toPath(), seed, rows,
                format, project);
    }
}
