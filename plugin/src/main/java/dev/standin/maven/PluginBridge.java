package dev.standin.maven;

import dev.standin.engine.CompiledSpec;
import dev.standin.engine.Engine;
import dev.standin.engine.GenerationResult;
import dev.standin.spec.Mark;
import dev.standin.spec.OutputFormat;
import dev.standin.spec.Overrides;
import dev.standin.spec.SpecException;
import dev.standin.spec.SpecParser;
import dev.standin.spec.SpecProblem;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.NotDirectoryException;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.apache.maven.model.Resource;
import org.apache.maven.plugin.MojoExecutionException;
import org.apache.maven.plugin.MojoFailureException;
import org.apache.maven.plugin.logging.Log;
import org.apache.maven.project.MavenProject;

/**
 * The one class through which the plugin's goals reach the core {@link Engine}: it turns goal
 * parameters into overrides and spec lists, compiles every spec before writing anything, and maps
 * the engine's outcomes onto Maven's two failure kinds.
 *
 * <p>Maven's convention, as documented for {@code org.apache.maven.plugin.Mojo#execute()}: a
 * {@link MojoFailureException} is a problem in the user's input (an invalid spec, a bad property
 * value) and fails the build with a "BUILD FAILURE"; a {@link MojoExecutionException} is an
 * unexpected problem such as an I/O failure.
 *
 * <p>An instance holds only the goal's log; a new one (and a new {@link Engine}) is made for every
 * execution, so parallel builds ({@code mvn -T}) share nothing.
 */
public final class PluginBridge {

    /** The Maven property that overrides every spec's seed. */
    static final String SEED_PROPERTY = "standin.seed";
    /** The Maven property that overrides every spec's row count. */
    static final String ROWS_PROPERTY = "standin.rows";
    /** The Maven property that overrides every spec's output format. */
    static final String FORMAT_PROPERTY = "standin.format";
    /** The Maven property naming the spec files of the {@code sample} goal. */
    static final String SPEC_PROPERTY = "standin.spec";
    /** The Maven property naming the spec folder of the {@code generate} goal. */
    static final String SPEC_DIRECTORY_PROPERTY = "standin.specDirectory";

    /**
     * One spec to compile.
     *
     * @param file where to read it
     * @param displayName the name that messages and the report show
     * @param outputSubdir the folder under the output root for its files ('/'-separated, "" for none)
     */
    public record SpecSource(Path file, String displayName, String outputSubdir) {

        public SpecSource {
            Objects.requireNonNull(file, "file");
            Objects.requireNonNull(displayName, "displayName");
            Objects.requireNonNull(outputSubdir, "outputSubdir");
        }
    }

    private final Log log;

    private PluginBridge(Log log) {
        this.log = Objects.requireNonNull(log, "log");
    }

    /** A bridge that reports through the given goal log. */
    public static PluginBridge withLog(Log log) {
        return new PluginBridge(log);
    }

    /**
     * The {@code generate} goal: every spec under {@code specDirectory} into {@code outputDirectory},
     * keeping sub-folders, and the output folder added to the project's test resources.
     *
     * @param skip true to do nothing (logged)
     * @param specDirectory the spec folder; a missing folder means there is nothing to do
     * @param outputDirectory the output root
     * @param seed the {@code standin.seed} value or null
     * @param rows the {@code standin.rows} value or null
     * @param format the {@code standin.format} value or null
     * @param project the project whose test resources get the output folder, or null for none
     * @return what was written, in spec order (empty when skipped or there was nothing to do)
     */
    public List<GenerationResult> generateGoal(boolean skip, Path specDirectory, Path outputDirectory, String seed,
                                               String rows, String format, MavenProject project)
            throws MojoFailureException, MojoExecutionException {
        if (skip) {
            log.info("Skipping Standin generation because standin.skip is true.");
            return List.of();
        }
        Overrides overrides = overrides(seed, rows, format);
        if (!Files.exists(specDirectory)) {
            log.info("No spec folder at " + specDirectory + "; nothing to generate.");
            return List.of();
        }
        if (!Files.isDirectory(specDirectory)) {
            throw new MojoFailureException(SPEC_DIRECTORY_PROPERTY + " must be a folder: " + specDirectory);
        }
        List<SpecSource> specs = findSpecs(specDirectory);
        if (specs.isEmpty()) {
            log.info("No *.yaml or *.yml specs under " + specDirectory + "; nothing to generate.");
            return List.of();
        }
        List<GenerationResult> results = run(specs, outputDirectory, overrides);
        if (project != null) {
            addTestResourceRoot(project, outputDirectory);
        }
        return results;
    }

    /**
     * The {@code sample} goal: the comma-separated spec files, each named in messages as given and
     * resolved against {@code baseDirectory}, into {@code outputDirectory} (the base folder when null).
     *
     * @param specList the {@code standin.spec} value
     * @param baseDirectory the folder Maven was started in
     * @param outputDirectory the output root, or null for {@code baseDirectory}
     * @return what was written, in the order given
     */
    public List<GenerationResult> sampleGoal(String specList, Path baseDirectory, Path outputDirectory, String seed,
                                             String rows, String format)
            throws MojoFailureException, MojoExecutionException {
        Overrides overrides = overrides(seed, rows, format);
        List<SpecSource> specs = givenSpecs(specList, baseDirectory);
        Path out = outputDirectory == null ? baseDirectory : baseDirectory.resolve(outputDirectory);
        return run(specs, out, overrides);
    }

    /**
     * Parses the three override properties; null means "not overridden". Each bad value fails with a
     * one-line message naming the property and what is valid.
     */
    public static Overrides overrides(String seed, String rows, String format) throws MojoFailureException {
        Long s = null;
        if (seed != null) {
            s = parseLong(seed);
            if (s == null) {
                throw new MojoFailureException(SEED_PROPERTY + " must be a 64-bit integer (from " + Long.MIN_VALUE
                        + " to " + Long.MAX_VALUE + "): " + shown(seed));
            }
        }
        Long r = null;
        if (rows != null) {
            r = parseLong(rows);
            if (r == null || r < 0 || r > SpecParser.MAX_ROWS) {
                throw new MojoFailureException(ROWS_PROPERTY + " must be a whole number from 0 to 2^40 ("
                        + SpecParser.MAX_ROWS + "): " + shown(rows));
            }
        }
        OutputFormat f = null;
        if (format != null) {
            f = OutputFormat.parse(format.trim()).orElseThrow(() -> new MojoFailureException(
                    FORMAT_PROPERTY + " must be one of " + OutputFormat.choices() + ": " + shown(format)));
        }
        return s == null && r == null && f == null ? Overrides.none() : new Overrides(s, r, f);
    }

    private static Long parseLong(String text) {
        String t = text.trim();
        if (t.isEmpty() || t.startsWith("+")) {
            return null;
        }
        try {
            return Long.parseLong(t);
        } catch (NumberFormatException e) {
            return null;
        }
    }

    /** The value as the user gave it, quoted when blank or padded so the spaces can be seen. */
    private static String shown(String value) {
        return value.isEmpty() || !value.strip().equals(value) ? "\"" + value + "\"" : value;
    }

    /**
     * Every {@code *.yaml} and {@code *.yml} file under {@code specDirectory} (any depth; the
     * extension in any letter case), skipping names that start with '.', as sources whose display
     * name is the '/'-separated path relative to the folder and whose output sub-folder is that
     * path's parent. Sorted by display name (String order, the same on every platform).
     */
    public static List<SpecSource> findSpecs(Path specDirectory) throws MojoExecutionException {
        List<SpecSource> specs = new ArrayList<>();
        try (Stream<Path> walk = Files.walk(specDirectory)) {
            for (Path p : (Iterable<Path>) walk::iterator) {
                String relative = relative(specDirectory, p);
                if (!relative.isEmpty() && isSpec(p, relative)) {
                    specs.add(new SpecSource(p, relative, parentOf(relative)));
                }
            }
        } catch (IOException e) {
            throw new MojoExecutionException("cannot list the spec folder " + pathOf(e, specDirectory) + ": " + reason(e), e);
        } catch (UncheckedIOException e) {
            throw new MojoExecutionException("cannot list the spec folder " + pathOf(e.getCause(), specDirectory) + ": "
                    + reason(e.getCause()), e.getCause());
        }
        specs.sort(Comparator.comparing(SpecSource::displayName));
        return List.copyOf(specs);
    }

    private static String relative(Path root, Path p) {
        List<String> parts = new ArrayList<>();
        for (Path part : root.relativize(p)) {
            parts.add(part.toString());
        }
        return String.join("/", parts);
    }

    private static boolean isSpec(Path file, String relative) {
        for (String part : relative.split("/")) {
            if (part.startsWith(".")) {
                return false;
            }
        }
        String name = relative.substring(relative.lastIndexOf('/') + 1).toLowerCase(Locale.ROOT);
        return (name.endsWith(".yaml") || name.endsWith(".yml")) && Files.isRegularFile(file);
    }

    private static String parentOf(String relative) {
        int slash = relative.lastIndexOf('/');
        return slash < 0 ? "" : relative.substring(0, slash);
    }

    /**
     * The spec files of a comma-separated list, blank and repeated entries ignored, each resolved against
     * {@code baseDirectory} and named as given; their files go straight into the output root.
     */
    public static List<SpecSource> givenSpecs(String specList, Path baseDirectory) throws MojoFailureException {
        List<SpecSource> specs = new ArrayList<>();
        Set<Path> seen = new HashSet<>();
        if (specList != null) {
            for (String entry : specList.split(",")) {
                String name = entry.trim();
                if (!name.isEmpty()) {
                    Path file;
                    try {
                        file = baseDirectory.resolve(Paths.get(name));
                    } catch (java.nio.file.InvalidPathException e) {
                        throw new MojoFailureException(SPEC_PROPERTY + " must name spec files that are valid paths: " + name);
                    }
                    if (seen.add(file.toAbsolutePath().normalize())) {
                        specs.add(new SpecSource(file, name, ""));
                    }
                }
            }
        }
        if (specs.isEmpty()) {
            throw new MojoFailureException(SPEC_PROPERTY + " must name one or more spec files, comma-separated"
                    + " (e.g. -D" + SPEC_PROPERTY + "=ferry-crossings.yaml): "
                    + (specList == null ? "not set" : shown(specList)));
        }
        return List.copyOf(specs);
    }

    /**
     * Compiles every spec with one new engine, checks that no two of them write the same file, and
     * only then generates each into {@code outputRoot}, logging one summary line per dataset.
     *
     * @throws MojoFailureException when any spec is invalid or two specs clash; its message is exactly
     *         the {@code FILE:LINE:COLUMN: message} lines, and nothing has been written
     * @throws MojoExecutionException when a spec cannot be read or an output cannot be written,
     *         naming the path
     */
    public List<GenerationResult> run(List<SpecSource> specs, Path outputRoot, Overrides overrides)
            throws MojoFailureException, MojoExecutionException {
        Engine engine = Engine.create(overrides);
        List<CompiledSpec> compiled = new ArrayList<>();
        List<SpecProblem> problems = new ArrayList<>();
        for (SpecSource source : specs) {
            try {
                compiled.add(engine.compile(source.file(), source.displayName(), source.outputSubdir()));
            } catch (SpecException e) {
                problems.addAll(e.problems());
            } catch (IOException e) {
                throw new MojoExecutionException("cannot read the spec " + pathOf(e, source.file()) + ": " + reason(e), e);
            }
        }
        problems.addAll(clashes(compiled));
        if (!problems.isEmpty()) {
            throw new MojoFailureException(problems.stream().map(SpecProblem::toString).collect(Collectors.joining("\n")));
        }
        List<GenerationResult> results = new ArrayList<>();
        for (CompiledSpec c : compiled) {
            GenerationResult result;
            try {
                result = engine.generate(c, outputRoot);
            } catch (IOException e) {
                throw new MojoExecutionException("cannot write " + pathOf(e, outputRoot.resolve(c.dataFile())) + ": "
                        + reason(e), e);
            }
            log.info(result.summary());
            results.add(result);
        }
        return List.copyOf(results);
    }

    /**
     * One problem for each spec that would write a file (data file or report) that an earlier spec
     * also writes, naming both specs and the shared paths. Paths are compared ignoring letter case,
     * since such paths are the same file on case-insensitive file systems.
     */
    static List<SpecProblem> clashes(List<CompiledSpec> compiled) {
        record Claim(String spec, String path) {
        }
        Map<String, Claim> claims = new HashMap<>();
        List<SpecProblem> problems = new ArrayList<>();
        for (CompiledSpec c : compiled) {
            String spec = c.spec().file();
            Map<String, List<String>> shared = new LinkedHashMap<>();
            boolean dataClashes = false;
            for (String path : List.of(c.dataFile(), c.reportFile())) {
                Claim earlier = claims.putIfAbsent(path.toLowerCase(Locale.ROOT), new Claim(spec, path));
                if (earlier != null) {
                    dataClashes |= path.equals(c.dataFile());
                    shared.computeIfAbsent(earlier.spec(), k -> new ArrayList<>()).add(earlier.path().equals(path) ? path
                            : path + " (as " + earlier.path() + " there; paths that differ only in letter case clash on"
                            + " some file systems)");
                }
            }
            Mark fileMark = c.spec().output().fileMark();
            Mark at = dataClashes && fileMark != null ? fileMark : Mark.startOf(spec);
            for (Map.Entry<String, List<String>> e : shared.entrySet()) {
                problems.add(SpecProblem.at(at, String.join(" and ", e.getValue()) + " would also be written by "
                        + e.getKey() + "; give one of the specs another dataset name or output file"));
            }
        }
        return List.copyOf(problems);
    }

    /** Adds {@code directory} to the project's test resources unless it is already one. */
    static void addTestResourceRoot(MavenProject project, Path directory) {
        Path wanted = directory.toAbsolutePath().normalize();
        for (Resource r : project.getTestResources()) {
            if (r.getDirectory() != null && Paths.get(r.getDirectory()).toAbsolutePath().normalize().equals(wanted)) {
                return;
            }
        }
        Resource resource = new Resource();
        resource.setDirectory(wanted.toString());
        project.addTestResource(resource);
    }

    private static Path pathOf(IOException e, Path fallback) {
        if (e instanceof FileSystemException fse && fse.getFile() != null) {
            return Paths.get(fse.getFile());
        }
        return fallback;
    }

    /** A short human reason for an I/O failure, without the path (which the caller names). */
    static String reason(IOException e) {
        if (e instanceof FileSystemException fse && fse.getReason() != null) {
            return fse.getReason();
        }
        if (e instanceof AccessDeniedException) {
            return "permission denied";
        }
        if (e instanceof NoSuchFileException) {
            return "no such file or folder";
        }
        if (e instanceof NotDirectoryException) {
            return "not a folder";
        }
        if (e instanceof FileAlreadyExistsException) {
            return "a file is in the way";
        }
        if (e instanceof FileSystemException) {
            return e.getClass().getSimpleName();
        }
        return e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
    }
}
