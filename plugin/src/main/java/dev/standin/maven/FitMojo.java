package dev.standin.maven;

import java.io.File;
import java.nio.file.Path;
import java.nio.file.Paths;
import org.apache.maven.plugin.AbstractMojo;
import org.apache.maven.plugin.MojoExecutionException;
import org.apache.maven.plugin.MojoFailureException;
import org.apache.maven.plugins.annotations.Mojo;
import org.apache.maven.plugins.annotations.Parameter;

/**
 * Fits a stand-in spec to a real CSV table, without needing a project: each column's type and
 * distribution (maximum likelihood, chosen by AIC, a coarse quantile table where the KS test rejects
 * every family), missing fractions and a Spearman correlation block. A sample generated from the spec
 * is checked for disclosure (copied rows, distance to closest record against a real holdout) before
 * the spec is written.
 *
 * <p>Privacy safeguards are always on: no raw rows or cells are copied, categories seen fewer than
 * {@code minCategoryCount} times are merged, identifiers and free text are not modelled, bounds come
 * from robust quantiles. They reduce but do not remove disclosure risk; this is not an anonymisation
 * guarantee, and personal data needs your privacy review under local rules.
 *
 * <pre>
 * mvn dev.standin:standin-maven-plugin:0.1.0-SNAPSHOT:fit -Dstandin.data=orders.csv -Dstandin.spec=orders.yaml
 * </pre>
 *
 * @since 0.1.0
 */
@Mojo(name = "fit", requiresProject = false, threadSafe = true)
public final class FitMojo extends AbstractMojo {

    /**
     * The CSV file to fit (RFC 4180, UTF-8, a header row), relative to the folder Maven was started in.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.data")
    private String data;

    /**
     * The spec file to write, relative to the folder Maven was started in.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.spec")
    private String spec;

    /**
     * The spec's dataset name; by default derived from the data file's name.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.dataset")
    private String dataset;

    /**
     * The spec's rows; by default the data's row count.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.rows")
    private String rows;

    /**
     * The spec's seed: a 64-bit integer; by default 1.
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.seed")
    private String seed;

    /**
     * Categories seen fewer than this many times are merged into one level (default 10).
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.minCategoryCount")
    private String minCategoryCount;

    /**
     * The label of the merged rare categories (default {@code other}).
     *
     * @since 0.1.0
     */
    @Parameter(property = "standin.otherLabel")
    private String otherLabel;

    /** The folder Maven was started in (the session's execution root). */
    @Parameter(defaultValue = "${session.executionRootDirectory}", readonly = true)
    private File startDirectory;

    @Override
    public void execute() throws MojoExecutionException, MojoFailureException {
        Path base = startDirectory != null ? startDirectory.toPath() : Paths.get(System.getProperty("user.dir"));
        FitBridge.withLog(getLog()).fitGoal(data, spec, base.toAbsolutePath(), dataset, rows, seed, minCategoryCount,
                otherLabel);
    }
}
