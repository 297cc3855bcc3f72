package dev.standin.maven;

import java.io.File;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.Properties;
import org.apache.maven.execution.MavenSession;
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
public final class SampleMojo extends AbstractDatasetMojo {

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
        bridge(user).sampleGoal(spec, base.toAbsolutePath(), outputDirectory == null ? null : outputDirectory.toPath(),
                seed(user), rows(user), format(user));
    }
}
