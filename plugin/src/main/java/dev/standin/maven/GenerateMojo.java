package dev.standin.maven;

import java.io.File;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Properties;
import org.apache.maven.artifact.Artifact;
import org.apache.maven.execution.MavenSession;
import org.apache.maven.plugin.MojoExecution;
import org.apache.maven.plugin.MojoExecutionException;
import org.apache.maven.plugin.MojoFailureException;
import org.apache.maven.plugin.descriptor.PluginDescriptor;
import org.apache.maven.plugins.annotations.LifecyclePhase;
import org.apache.maven.plugins.annotations.Mojo;
import org.apache.maven.plugins.annotations.Parameter;
import org.apache.maven.project.MavenProject;

/**
 * Generates every spec ({@code *.yaml}, {@code *.yml}) under the spec folder into the output folder,
 * keeping sub-folders, and adds the output folder to the project's test resources so tests read the
 * fixtures from the classpath. All specs to generate are checked before anything is written: one
 * invalid spec fails the build with its {@code FILE:LINE:COLUMN: message} lines and leaves no file
 * behind. One summary line is logged per dataset, with its size and time; spec warnings are logged
 * as warnings.
 *
 * <p>The goal is incremental: a spec whose bytes, overrides ({@code seed}, {@code rows},
 * {@code format}), output folder and plugin are unchanged, and whose files are all there with the
 * SHA-256 they were written with, is not generated again and its files are not touched; one line
 * says how many specs were up to date. The outputs of a removed or renamed spec are deleted. The
 * state is kept in
 * {@code target/maven-status/standin-maven-plugin/generate/<execution id>/state.json};
 * {@code -Dstandin.force} regenerates everything.
 *
 * <p>{@code -Dstandin.seed}, {@code -Dstandin.rows}, {@code -Dstandin.format}, {@code -Dstandin.skip}
 * and {@code -Dstandin.force} on the command line win over the same parameters in the pom; the two
 * folders follow Maven's usual rule (a value in the pom wins over {@code -D}).
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
public final class GenerateMojo extends AbstractDatasetMojo {

    /**
     * The folder searched, at any depth, for spec files ending in {@code .yaml} or {@code .yml}
     * (names starting with '.' are ignored). A spec's path relative to this folder is its name in
     * messages and reports, and its sub-folder is kept under the output folder. A missing folder
     * means there is nothing to generate (and the outputs of earlier builds are deleted). A value in
     * the pom wins over {@code -Dstandin.specDirectory}.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.specDirectory", defaultValue = "${project.basedir}/src/test/standin", required = true)
    private File specDirectory;

    /**
     * The folder the data files and their {@code <dataset>.report.json} reports are written to. It is
     * added to the project's test resources. A value in the pom wins over
     * {@code -Dstandin.outputDirectory}; changing it regenerates every spec into the new folder and
     * leaves the old one as it is.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.outputDirectory",
            defaultValue = "${project.build.directory}/generated-test-resources/standin", required = true)
    private File outputDirectory;

    /**
     * Skips generation (a log line says why); nothing is written or deleted and no test resource is
     * added. {@code -Dstandin.skip} (or {@code -Dstandin.skip=false}) wins over a value in the pom.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.skip", defaultValue = "false")
    private boolean skip;

    /**
     * Regenerates every spec even when it is up to date. {@code -Dstandin.force} wins over a value in
     * the pom.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.force", defaultValue = "false")
    private boolean force;

    /** The project whose test resources receive the output folder. */
    @Parameter(defaultValue = "${project}", readonly = true, required = true)
    private MavenProject project;

    /** The build, for the {@code -D} user properties that win over the pom. */
    @Parameter(defaultValue = "${session}", readonly = true, required = true)
    private MavenSession session;

    /** This execution, whose id names its state file. */
    @Parameter(defaultValue = "${mojoExecution}", readonly = true, required = true)
    private MojoExecution mojoExecution;

    /** This plugin, whose version and jars tag the state. */
    @Parameter(defaultValue = "${plugin}", readonly = true, required = true)
    private PluginDescriptor plugin;

    @Override
    public void execute() throws MojoExecutionException, MojoFailureException {
        Properties user = session == null ? null : session.getUserProperties();
        CommandLine.Flag skipFlag = CommandLine.flag(user, PluginBridge.SKIP_PROPERTY, skip);
        CommandLine.Flag forceFlag = CommandLine.flag(user, PluginBridge.FORCE_PROPERTY, force);
        PluginBridge.GenerateRequest request = PluginBridge.GenerateRequest
                .of(specDirectory.toPath(), outputDirectory.toPath())
                .overriding(seed(user), rows(user), format(user))
                .skipped(skipFlag.on() ? CommandLine.reason(PluginBridge.SKIP_PROPERTY, skipFlag) : null)
                .forced(forceFlag.on() ? CommandLine.reason(PluginBridge.FORCE_PROPERTY, forceFlag) : null)
                .withState(stateFile(), code());
        bridge(user).generateGoal(request, project);
    }

    /** {@code target/maven-status/standin-maven-plugin/generate/<execution id>/state.json}. */
    private Path stateFile() {
        String id = mojoExecution == null || mojoExecution.getExecutionId() == null ? "default"
                : mojoExecution.getExecutionId().replaceAll("[^A-Za-z0-9._-]", "_");
        return Path.of(project.getBuild().getDirectory(), "maven-status", "standin-maven-plugin", "generate", id,
                "state.json");
    }

    /** The plugin's coordinates and the fingerprint of its class path (SNAPSHOT jars by content). */
    private Map<String, String> code() {
        Map<String, String> code = new LinkedHashMap<>();
        if (plugin == null) {
            code.put("plugin", "unknown");
            return code;
        }
        code.put("plugin", plugin.getId());
        List<Digests.CodePart> parts = new ArrayList<>();
        List<Artifact> artifacts = new ArrayList<>();
        if (plugin.getPluginArtifact() != null) {
            artifacts.add(plugin.getPluginArtifact());
        }
        if (plugin.getArtifacts() != null) {
            artifacts.addAll(plugin.getArtifacts());
        }
        java.util.Set<String> seen = new java.util.HashSet<>();
        for (Artifact a : artifacts) {
            if (seen.add(a.getId())) {
                parts.add(new Digests.CodePart(a.getId(), a.getFile() == null ? null : a.getFile().toPath(), a.isSnapshot()));
            }
        }
        code.put("code", Digests.codeFingerprint(parts));
        return code;
    }
}
