package dev.standin.maven;

import dev.standin.fit.ColumnFit;
import dev.standin.fit.FitException;
import dev.standin.fit.FitJob;
import dev.standin.fit.FitOptions;
import dev.standin.fit.FitResult;
import dev.standin.output.NumberText;
import dev.standin.spec.SpecParser;
import java.io.IOException;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.Map;
import java.util.Objects;
import org.apache.maven.plugin.MojoExecutionException;
import org.apache.maven.plugin.MojoFailureException;
import org.apache.maven.plugin.logging.Log;

/**
 * The {@code fit} goal's way to the core {@link FitJob}: it reads the goal's properties, runs the job
 * and logs the summary, the disclosure check and the caution. A bad property value or a malformed
 * data file is a {@link MojoFailureException} (the user's input, as {@code Mojo#execute()} documents);
 * an I/O failure a {@link MojoExecutionException}.
 *
 * <p>Kept apart from {@link PluginBridge} so the generating goals and the fitting goal do not share
 * code paths. An instance holds only the goal's log.
 */
public final class FitBridge {

    static final String DATA_PROPERTY = "standin.data";
    static final String SPEC_PROPERTY = "standin.spec";

    /** The core's setting keys (see {@link FitOptions}) as the goal's properties. */
    private static final Map<String, String> PROPERTIES = Map.of(
            "dataset", "standin.dataset",
            "rows", "standin.rows",
            "seed", "standin.seed",
            "min-category-count", "standin.minCategoryCount",
            "other-label", "standin.otherLabel",
            "out", SPEC_PROPERTY);

    private final Log log;

    private FitBridge(Log log) {
        this.log = Objects.requireNonNull(log, "log");
    }

    /** A bridge that reports through the given goal log. */
    public static FitBridge withLog(Log log) {
        return new FitBridge(log);
    }

    /**
     * The {@code fit} goal.
     *
     * @param data the {@code standin.data} value: the CSV file to fit, relative to {@code base}
     * @param spec the {@code standin.spec} value: the spec file to write, relative to {@code base}
     * @param base the folder Maven was started in
     * @return what the job did
     */
    public FitJob.Outcome fitGoal(String data, String spec, Path base, String dataset, String rows, String seed,
                                  String minCategoryCount, String otherLabel)
            throws MojoFailureException, MojoExecutionException {
        if (data == null || data.isBlank()) {
            throw new MojoFailureException(DATA_PROPERTY + " must name the CSV file to fit (e.g. -D" + DATA_PROPERTY
                    + "=orders.csv): " + (data == null ? "not set" : "\"" + data + "\""));
        }
        if (spec == null || spec.isBlank()) {
            throw new MojoFailureException(SPEC_PROPERTY + " must name the spec file to write (e.g. -D" + SPEC_PROPERTY
                    + "=orders.yaml): " + (spec == null ? "not set" : "\"" + spec + "\""));
        }
        Long r = whole("standin.rows", rows, 0, SpecParser.MAX_ROWS);
        Long s = null;
        if (seed != null) {
            try {
                s = Long.parseLong(seed.strip());
            } catch (NumberFormatException e) {
                throw new MojoFailureException("standin.seed must be a 64-bit integer (from " + Long.MIN_VALUE + " to "
                        + Long.MAX_VALUE + "): " + seed);
            }
        }
        Long k = whole("standin.minCategoryCount", minCategoryCount, 1, FitOptions.MAX_MIN_CATEGORY_COUNT);
        FitOptions options;
        try {
            options = new FitOptions(blankToNull(dataset), r, s, k == null ? FitOptions.DEFAULT_MIN_CATEGORY_COUNT : k.intValue(),
                    otherLabel == null ? FitOptions.DEFAULT_OTHER_LABEL : otherLabel);
        } catch (IllegalArgumentException e) {
            throw new MojoFailureException(property(e.getMessage()));
        }
        Path dataPath;
        Path specPath;
        try {
            dataPath = base.resolve(Paths.get(data.strip()));
            specPath = base.resolve(Paths.get(spec.strip()));
        } catch (InvalidPathException e) {
            throw new MojoFailureException(DATA_PROPERTY + " and " + SPEC_PROPERTY + " must be valid file paths: " + e.getInput());
        }
        FitJob.Outcome outcome;
        try {
            outcome = FitJob.run(dataPath, data.strip(), specPath, spec.strip(), options);
        } catch (FitException e) {
            throw new MojoFailureException(e.isOption() ? property(e.getMessage()) : e.getMessage());
        } catch (IOException e) {
            throw new MojoExecutionException("cannot fit " + dataPath + " into " + specPath + ": " + PluginBridge.reason(e), e);
        }
        report(outcome, data.strip(), spec.strip());
        return outcome;
    }

    private void report(FitJob.Outcome o, String data, String spec) {
        FitResult fit = o.fit();
        for (String note : fit.notes()) {
            log.warn(data + ": " + note);
        }
        o.warnings().forEach(log::warn);
        log.info(data + ": " + fit.sourceRows() + " rows × " + fit.columns().size() + " columns → " + spec + " (dataset "
                + fit.dataset() + ", " + fit.rows() + " rows, seed " + fit.seed() + ")");
        for (ColumnFit c : fit.columns()) {
            String what = switch (c.role()) {
                case DROPPED -> "left out";
                case SEQUENCE -> "sequence";
                default -> c.family() + (Double.isNaN(c.ksDistance()) ? "" : " (KS D " + NumberText.fixed(c.ksDistance(), 4) + ")");
            };
            log.info("  " + c.name() + ": " + what);
        }
        if (o.disclosure() != null) {
            o.disclosure().lines().forEach(log::info);
            if (o.disclosure().flagged()) {
                log.warn("the disclosure check flagged the generated sample of " + spec + "; review it before sharing");
            }
        }
        FitResult.CAUTION.forEach(log::warn);
    }

    /** A core message "key must ..." with the key replaced by the goal's property. */
    static String property(String message) {
        for (Map.Entry<String, String> e : PROPERTIES.entrySet()) {
            if (message.startsWith(e.getKey() + " ")) {
                return e.getValue() + message.substring(e.getKey().length());
            }
        }
        return message;
    }

    private static Long whole(String property, String text, long min, long max) throws MojoFailureException {
        if (text == null) {
            return null;
        }
        try {
            long v = Long.parseLong(text.strip());
            if (v >= min && v <= max) {
                return v;
            }
        } catch (NumberFormatException e) {
            // the message below
        }
        throw new MojoFailureException(property + " must be a whole number from " + min + " to " + max + ": " + text);
    }

    private static String blankToNull(String s) {
        return s == null || s.isBlank() ? null : s.strip();
    }
}
