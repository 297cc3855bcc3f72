package dev.standin.maven;

import dev.standin.engine.CompiledSpec;
import dev.standin.engine.Engine;
import dev.standin.engine.GenerationResult;
import dev.standin.engine.OutputSession;
import dev.standin.output.DirectoryLock;
import dev.standin.spec.Mark;
import dev.standin.spec.OutputFormat;
import dev.standin.spec.Overrides;
import dev.standin.spec.SpecException;
import dev.standin.spec.SpecParser;
import dev.standin.spec.SpecProblem;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.AccessDeniedException;
import java.nio.file.DirectoryStream;
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
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.TreeMap;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.apache.maven.model.Resource;
import org.apache.maven.plugin.MojoExecutionException;
import org.apache.maven.plugin.MojoFailureException;
import org.apache.maven.plugin.logging.Log;
import org.apache.maven.project.MavenProject;

/**
 * The one class through which the plugin's goals reach the core {@link Engine}: it turns goal
 * parameters into overrides and spec lists, compiles every spec before writing anything, keeps the
 * {@code generate} goal incremental through a {@link BuildState}, and maps the engine's outcomes
 * onto Maven's two failure kinds.
 *
 * <p>Maven's convention, as documented for {@code org.apache.maven.plugin.Mojo#execute()}: a
 * {@link MojoFailureException} is a problem in the user's input (an invalid spec, a bad property
 * value) and fails the build with a "BUILD FAILURE"; a {@link MojoExecutionException} is an
 * unexpected problem such as an I/O failure.
 *
 * <p>An instance holds only the goal's log; a new one (and a new {@link Engine}, hence a new YAML
 * parser) is made for every execution, so parallel builds ({@code mvn -T}) share nothing.
 */
public final class PluginBridge {

    /** The Maven property that overrides every spec's seed. */
    static final String SEED_PROPERTY = "standin.seed";
    /** The Maven property that overrides every spec's row count. */
    static final String ROWS_PROPERTY = "standin.rows";
    /** The Maven property that overrides every spec's output format. */
    static final String FORMAT_PROPERTY = "standin.format";
    /** The Maven property that skips the {@code generate} goal. */
    static final String SKIP_PROPERTY = "standin.skip";
    /** The Maven property that makes the {@code generate} goal regenerate every spec. */
    static final String FORCE_PROPERTY = "standin.force";
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

    /**
     * What the {@code generate} goal is asked to do, after the command-line rule has been applied.
     *
     * @param specDirectory the spec folder; a missing folder means there are no specs
     * @param outputDirectory the output root
     * @param seed the seed override as given, or null
     * @param rows the row-count override as given, or null
     * @param format the format override as given, or null
     * @param skipReason why the goal is skipped ("standin.skip is true ..."), or null to run
     * @param forceReason why every spec is regenerated, or null to skip up-to-date specs
     * @param stateFile where the incremental state is kept, or null for none (every spec generated)
     * @param code what identifies the generating code in the state (plugin version, fingerprint)
     */
    public record GenerateRequest(Path specDirectory, Path outputDirectory, String seed, String rows, String format,
                                  String skipReason, String forceReason, Path stateFile, Map<String, String> code) {

        public GenerateRequest {
            Objects.requireNonNull(specDirectory, "specDirectory");
            Objects.requireNonNull(outputDirectory, "outputDirectory");
            code = Map.copyOf(code);
        }

        /** Every spec of {@code specDirectory} into {@code outputDirectory}; no overrides, no state. */
        public static GenerateRequest of(Path specDirectory, Path outputDirectory) {
            return new GenerateRequest(specDirectory, outputDirectory, null, null, null, null, null, null, Map.of());
        }

        /** This request with the given overrides (each null for none). */
        public GenerateRequest overriding(String seed, String rows, String format) {
            return new GenerateRequest(specDirectory, outputDirectory, seed, rows, format, skipReason, forceReason,
                    stateFile, code);
        }

        /** This request skipped for the reason given (null: not skipped). */
        public GenerateRequest skipped(String reason) {
            return new GenerateRequest(specDirectory, outputDirectory, seed, rows, format, reason, forceReason,
                    stateFile, code);
        }

        /** This request regenerating every spec for the reason given (null: incremental). */
        public GenerateRequest forced(String reason) {
            return new GenerateRequest(specDirectory, outputDirectory, seed, rows, format, skipReason, reason,
                    stateFile, code);
        }

        /** This request kept incremental through {@code stateFile}, its outputs tagged with {@code code}. */
        public GenerateRequest withState(Path stateFile, Map<String, String> code) {
            return new GenerateRequest(specDirectory, outputDirectory, seed, rows, format, skipReason, forceReason,
                    stateFile, code);
        }
    }

    /** The property that keeps a build green when a fidelity check fails. */
    public static final String FAIL_ON_DEVIATION_PROPERTY = "standin.failOnDeviation";

    /** The property that switches the HTML report off. */
    public static final String REPORT_PROPERTY = "standin.report";

    private final Log log;
    private final boolean htmlReport;
    private final boolean failOnDeviation;
    private final int threads;

    private PluginBridge(Log log, boolean htmlReport, boolean failOnDeviation, int threads) {
        this.log = Objects.requireNonNull(log, "log");
        this.htmlReport = htmlReport;
        this.failOnDeviation = failOnDeviation;
        this.threads = threads;
    }

    /** A bridge that reports through the given goal log: HTML reports on, failing on deviations. */
    public static PluginBridge withLog(Log log) {
        return new PluginBridge(log, true, true, 0);
    }

    /** The property for the number of generating threads. */
    public static final String THREADS_PROPERTY = "standin.threads";

    /**
     * This bridge generating rows on the given number of threads (0: the processors available); the
     * files are the same for any number.
     *
     * @throws MojoFailureException for a number outside 0 .. 1024
     */
    public PluginBridge withThreads(int threads) throws MojoFailureException {
        if (threads < 0 || threads > 1024) {
            throw new MojoFailureException(THREADS_PROPERTY + " must be a whole number from 1 to 1024 (0 or unset: the"
                    + " processors available): " + threads);
        }
        return new PluginBridge(log, htmlReport, failOnDeviation, threads);
    }

    /**
     * This bridge writing {@code <dataset>.report.html} or not (each spec's {@code output.report}
     * must also be on), and failing the build when a fidelity check fails or only warning.
     */
    public PluginBridge configured(boolean htmlReport, boolean failOnDeviation) {
        return new PluginBridge(log, htmlReport, failOnDeviation, threads);
    }

    private Engine engine(Overrides overrides) {
        Engine engine = Engine.create(overrides).withThreads(threads);
        return htmlReport ? engine : engine.withoutHtmlReport();
    }

    /**
     * Fails the build, when {@code failOnDeviation} is on, if a fidelity check failed: one line per
     * failed check, naming the dataset, the column or pair, and the numbers.
     */
    void failOnDeviations(List<GenerationResult> results) throws MojoFailureException {
        List<String> lines = new ArrayList<>();
        for (GenerationResult r : results) {
            r.failedChecks().forEach(check -> lines.add(r.dataset() + ": " + check.describe()));
        }
        if (failOnDeviation && !lines.isEmpty()) {
            throw new MojoFailureException(lines.size() + " fidelity check(s) failed (the files are written; set -D"
                    + FAIL_ON_DEVIATION_PROPERTY + "=false to keep the build green):\n" + String.join("\n", lines));
        }
    }

    /**
     * The {@code generate} goal: every spec under the spec folder into the output folder, keeping
     * sub-folders, and the output folder added to the project's test resources.
     *
     * <p>Incremental when {@code request.stateFile()} is set: a spec whose bytes, configuration (the
     * overrides and {@code request.code()}) and every recorded output (present, same size and SHA-256)
     * are as the state records is up to date and neither compiled nor written. The outputs a spec no
     * longer writes (its spec removed or renamed, its file renamed, its format changed) are deleted when
     * they still hold what was written, and kept with a warning otherwise. The state is rewritten at
     * the end, also when a generation fails part-way, and only lists files that exist.
     *
     * @param request what to do
     * @param project the project whose test resources get the output folder, or null for none
     * @return what was generated, in spec order (empty when skipped or everything was up to date)
     */
    public List<GenerationResult> generateGoal(GenerateRequest request, MavenProject project)
            throws MojoFailureException, MojoExecutionException {
        if (request.skipReason() != null) {
            log.info("Skipping Standin generation because " + request.skipReason() + ".");
            return List.of();
        }
        Overrides overrides = overrides(request.seed(), request.rows(), request.format());
        Path specDirectory = request.specDirectory();
        Path out = request.outputDirectory().toAbsolutePath().normalize();
        List<SpecSource> specs;
        if (!Files.exists(specDirectory)) {
            log.info("No spec folder at " + specDirectory + "; nothing to generate.");
            specs = List.of();
        } else if (!Files.isDirectory(specDirectory)) {
            throw new MojoFailureException(SPEC_DIRECTORY_PROPERTY + " must be a folder: " + specDirectory);
        } else {
            specs = findSpecs(specDirectory);
            if (specs.isEmpty()) {
                log.info("No *.yaml or *.yml specs under " + specDirectory + "; nothing to generate.");
            }
        }
        BuildState previous = loadState(request.stateFile(), out);
        if (specs.isEmpty() && previous.specs().isEmpty()) {
            return List.of();
        }
        Map<String, String> configuration = configuration(request.code(), overrides);
        configuration.put("htmlReport", Boolean.toString(htmlReport));

        // 1. Decide what is up to date, and compile everything else before writing anything.
        record Pending(SpecSource source, CompiledSpec compiled) {
        }
        List<Pending> pending = new ArrayList<>();
        List<Claim> claims = new ArrayList<>();
        List<SpecProblem> problems = new ArrayList<>();
        Engine engine = null;
        int upToDate = 0;
        for (SpecSource source : specs) {
            String name = source.displayName();
            byte[] bytes = readSpec(source);
            BuildState.SpecState old = previous.specs().get(name);
            String why = request.forceReason() != null ? "forced"
                    : staleness(old, bytes == null ? null : Digests.sha256(bytes), configuration, out);
            if (why == null) {
                upToDate++;
                List<String> paths = old.files().stream().map(BuildState.FileState::path).collect(Collectors.toList());
                claims.add(new Claim(name, paths, paths.get(0), null));
                log.debug(name + ": up to date (" + String.join(", ", paths) + ")");
                continue;
            }
            log.debug(name + ": to generate (" + why + ")");
            if (engine == null) {
                engine = engine(overrides);
            }
            try {
                CompiledSpec compiled = bytes == null
                        ? engine.compile(source.file(), name, source.outputSubdir())
                        : engine.compile(name, bytes, source.outputSubdir());
                compiled.warnings().forEach(log::warn);
                pending.add(new Pending(source, compiled));
                claims.add(Claim.of(compiled));
            } catch (SpecException e) {
                problems.addAll(e.problems());
            } catch (IOException e) {
                throw new MojoExecutionException("cannot read the spec " + pathOf(e, source.file()) + ": " + reason(e), e);
            }
        }
        problems.addAll(clashes(claims));
        if (!problems.isEmpty()) {
            throw new MojoFailureException(problems.stream().map(SpecProblem::toString).collect(Collectors.joining("\n")));
        }
        if (upToDate > 0) {
            log.info(upToDate + " of " + specs.size() + (specs.size() == 1 ? " spec" : " specs") + " up to date, "
                    + pending.size() + " to generate (-D" + FORCE_PROPERTY + " regenerates all)");
        } else if (request.forceReason() != null && !specs.isEmpty()) {
            log.info("Regenerating every spec because " + request.forceReason() + ".");
        }

        // 2. Generate, keeping the state in step with the files on disk.
        Set<String> claimed = new HashSet<>();
        for (Claim c : claims) {
            c.paths().forEach(p -> claimed.add(p.toLowerCase(Locale.ROOT)));
        }
        Map<String, BuildState.SpecState> next = new TreeMap<>(previous.specs());
        List<GenerationResult> results = new ArrayList<>();
        boolean done = false;
        OutputSession session = null;
        try {
            // The output folder is locked only when something is written or deleted, so an up-to-date
            // build leaves it as it was.
            if (!pending.isEmpty() || hasStale(previous, claimed, out)) {
                session = open(engine == null ? engine(overrides) : engine, out);
                check(session, pending.stream().map(Pending::compiled).collect(Collectors.toList()));
            }
            for (Pending p : pending) {
                String name = p.source().displayName();
                GenerationResult result = generate(session, p.compiled());
                List<BuildState.FileState> files = written(p.compiled(), result, out);
                for (BuildState.FileState f : files) {
                    log.debug("  " + f.path() + ": " + f.bytes() + " bytes, SHA-256 " + f.sha256());
                }
                BuildState.SpecState before = next.put(name, new BuildState.SpecState(p.compiled().specSha256(),
                        configuration, files));
                if (before != null) {
                    removeStale(out, before.files(), claimed, "no longer written by " + name);
                }
                if (failOnDeviation && !result.failedChecks().isEmpty()) {
                    // not recorded as up to date: the next build regenerates it and fails the same way
                    next.put(name, new BuildState.SpecState("failed fidelity checks", configuration, files));
                }
                results.add(result);
            }
            // 3. Outputs of specs that are gone.
            Set<String> current = specs.stream().map(SpecSource::displayName).collect(Collectors.toSet());
            for (Iterator<Map.Entry<String, BuildState.SpecState>> it = next.entrySet().iterator(); it.hasNext(); ) {
                Map.Entry<String, BuildState.SpecState> e = it.next();
                if (!current.contains(e.getKey())) {
                    removeStale(out, e.getValue().files(), claimed, "its spec " + e.getKey() + " is gone");
                    it.remove();
                }
            }
            done = true;
        } finally {
            try {
                saveState(request.stateFile(), BuildState.of(out, next), done);
            } finally {
                close(session, out, done);
            }
        }
        if (project != null && !specs.isEmpty()) {
            addTestResourceRoot(project, out);
        }
        failOnDeviations(results);
        return List.copyOf(results);
    }

    /** The configuration a spec's outputs depend on besides its own bytes: the code and the overrides. */
    static Map<String, String> configuration(Map<String, String> code, Overrides overrides) {
        Map<String, String> c = new TreeMap<>(code);
        c.put("seed", overrides.seed() == null ? null : overrides.seed().toString());
        c.put("rows", overrides.rows() == null ? null : overrides.rows().toString());
        c.put("format", overrides.format() == null ? null : overrides.format().word());
        return c;
    }

    /**
     * Why a spec must be generated, or null when it is up to date: the state has it with the same
     * spec bytes and configuration, and each recorded file is there with its recorded size and SHA-256.
     */
    static String staleness(BuildState.SpecState old, String specSha256, Map<String, String> configuration, Path out) {
        if (old == null) {
            return "not generated before";
        }
        if (specSha256 == null || !old.specSha256().equals(specSha256)) {
            return "the spec changed";
        }
        if (!old.configuration().equals(configuration)) {
            Set<String> keys = new java.util.TreeSet<>(old.configuration().keySet());
            keys.addAll(configuration.keySet());
            keys.removeIf(k -> Objects.equals(old.configuration().get(k), configuration.get(k)));
            return "the configuration changed: " + String.join(", ", keys);
        }
        if (old.files().isEmpty()) {
            return "no outputs recorded";
        }
        for (BuildState.FileState f : old.files()) {
            Path p = inside(out, f.path());
            if (p == null || !Files.isRegularFile(p)) {
                return f.path() + " is missing";
            }
            try {
                if (Files.size(p) != f.bytes() || !Digests.sha256(p).equals(f.sha256())) {
                    return f.path() + " changed since it was written";
                }
            } catch (IOException e) {
                return f.path() + " cannot be read (" + reason(e) + ")";
            }
        }
        return null;
    }

    /** The spec's bytes, or null when it is too large to read (compiling it by path then says so). */
    private static byte[] readSpec(SpecSource source) throws MojoExecutionException {
        try {
            if (Files.size(source.file()) > SpecParser.MAX_SPEC_BYTES) {
                return null;
            }
            return Files.readAllBytes(source.file());
        } catch (NoSuchFileException e) {
            return null;
        } catch (IOException e) {
            throw new MojoExecutionException("cannot read the spec " + pathOf(e, source.file()) + ": " + reason(e), e);
        }
    }

    /** The relative path resolved under {@code root}, or null when it would leave it (a damaged state). */
    private static Path inside(Path root, String relative) {
        if (relative.isEmpty() || relative.startsWith("/") || relative.contains("\\")) {
            return null;
        }
        for (String part : relative.split("/", -1)) {
            if (part.isEmpty() || part.equals(".") || part.equals("..")) {
                return null;
            }
        }
        Path p = root.resolve(relative).normalize();
        return p.startsWith(root) && !p.equals(root) ? p : null;
    }

    /** The files a generation wrote: the spec's output files and any others the result names. */
    private static List<BuildState.FileState> written(CompiledSpec compiled, GenerationResult result, Path out)
            throws MojoExecutionException {
        Map<String, GenerationResult.WrittenFile> known = new HashMap<>();
        for (GenerationResult.WrittenFile f : result.files()) {
            known.put(f.path(), f);
        }
        Set<String> paths = new LinkedHashSet<>(compiled.outputFiles());
        known.keySet().stream().sorted().forEach(paths::add);
        List<BuildState.FileState> files = new ArrayList<>();
        for (String path : paths) {
            GenerationResult.WrittenFile w = known.get(path);
            if (w != null && w.sha256() != null) {
                files.add(new BuildState.FileState(path, w.bytes(), w.sha256()));
                continue;
            }
            Path p = out.resolve(path);
            if (!Files.isRegularFile(p)) {
                continue;
            }
            try {
                files.add(new BuildState.FileState(path, Files.size(p), Digests.sha256(p)));
            } catch (IOException e) {
                throw new MojoExecutionException("cannot read back " + p + ": " + reason(e), e);
            }
        }
        return List.copyOf(files);
    }

    /**
     * Deletes the files (relative to {@code out}) that no current spec claims (paths compared ignoring
     * letter case), when they still hold what was written, then any folder this leaves empty below
     * {@code out}. A file that changed since is kept, with a warning. One INFO line lists what went.
     */
    private void removeStale(Path out, List<BuildState.FileState> files, Set<String> claimed, String why)
            throws MojoExecutionException {
        List<String> deleted = new ArrayList<>();
        for (BuildState.FileState f : files) {
            if (claimed.contains(f.path().toLowerCase(Locale.ROOT))) {
                continue;
            }
            Path p = inside(out, f.path());
            if (p == null || !Files.isRegularFile(p)) {
                continue;
            }
            try {
                if (Files.size(p) != f.bytes() || !Digests.sha256(p).equals(f.sha256())) {
                    log.warn("Kept " + f.path() + " although " + why + ": it changed since Standin wrote it");
                    continue;
                }
                Files.delete(p);
                deleted.add(f.path());
                for (Path dir = p.getParent(); dir != null && !dir.equals(out) && dir.startsWith(out) && isEmptyFolder(dir);
                     dir = dir.getParent()) {
                    Files.delete(dir);
                }
            } catch (IOException e) {
                throw new MojoExecutionException("cannot delete " + pathOf(e, p) + ": " + reason(e), e);
            }
        }
        if (!deleted.isEmpty()) {
            log.info("Deleted " + String.join(", ", deleted) + " (" + why + ")");
        }
    }

    private static boolean isEmptyFolder(Path dir) throws IOException {
        if (!Files.isDirectory(dir)) {
            return false;
        }
        try (DirectoryStream<Path> entries = Files.newDirectoryStream(dir)) {
            return !entries.iterator().hasNext();
        }
    }

    private BuildState loadState(Path stateFile, Path out) {
        if (stateFile == null) {
            return BuildState.empty(out);
        }
        BuildState.Loaded loaded = BuildState.read(stateFile, out);
        if (loaded.problem() != null) {
            log.warn("Ignoring the incremental state: " + loaded.problem() + "; every spec is generated.");
        }
        return loaded.state();
    }

    /**
     * Writes the state. After a failure the state still goes out (it lists what is on disk now), and
     * a failure to write it then is logged rather than hiding the first failure.
     */
    private void saveState(Path stateFile, BuildState state, boolean succeeded) throws MojoExecutionException {
        if (stateFile == null) {
            return;
        }
        try {
            state.write(stateFile);
        } catch (IOException e) {
            if (succeeded) {
                throw new MojoExecutionException("cannot write the incremental state " + pathOf(e, stateFile) + ": "
                        + reason(e), e);
            }
            log.warn("Cannot write the incremental state " + pathOf(e, stateFile) + ": " + reason(e));
        }
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
     * only then generates each into {@code outputRoot}, logging one summary line per dataset. (The
     * {@code sample} goal; it keeps no state, so every spec is generated.)
     *
     * @throws MojoFailureException when any spec is invalid or two specs clash; its message is exactly
     *         the {@code FILE:LINE:COLUMN: message} lines, and nothing has been written
     * @throws MojoExecutionException when a spec cannot be read or an output cannot be written,
     *         naming the path
     */
    public List<GenerationResult> run(List<SpecSource> specs, Path outputRoot, Overrides overrides)
            throws MojoFailureException, MojoExecutionException {
        Engine engine = engine(overrides);
        List<CompiledSpec> compiled = new ArrayList<>();
        List<SpecProblem> problems = new ArrayList<>();
        for (SpecSource source : specs) {
            try {
                CompiledSpec c = engine.compile(source.file(), source.displayName(), source.outputSubdir());
                c.warnings().forEach(log::warn);
                compiled.add(c);
            } catch (SpecException e) {
                problems.addAll(e.problems());
            } catch (IOException e) {
                throw new MojoExecutionException("cannot read the spec " + pathOf(e, source.file()) + ": " + reason(e), e);
            }
        }
        problems.addAll(clashes(compiled.stream().map(Claim::of).collect(Collectors.toList())));
        if (!problems.isEmpty()) {
            throw new MojoFailureException(problems.stream().map(SpecProblem::toString).collect(Collectors.joining("\n")));
        }
        List<GenerationResult> results = new ArrayList<>();
        OutputSession session = open(engine, outputRoot);
        boolean done = false;
        try {
            check(session, compiled);
            for (CompiledSpec c : compiled) {
                GenerationResult result = generate(session, c);
                if (log.isDebugEnabled()) {
                    for (BuildState.FileState f : written(c, result, outputRoot)) {
                        log.debug("  " + f.path() + ": " + f.bytes() + " bytes, SHA-256 " + f.sha256());
                    }
                }
                results.add(result);
            }
            done = true;
        } finally {
            close(session, outputRoot, done);
        }
        failOnDeviations(results);
        return List.copyOf(results);
    }

    /**
     * Locks the output folder for this run through the engine (another Standin run into the same
     * folder is waited for, with one line saying so).
     */
    private OutputSession open(Engine engine, Path outputRoot) throws MojoExecutionException {
        try {
            return engine.openOutput(outputRoot, DirectoryLock.DEFAULT_WAIT, log::info);
        } catch (IOException e) {
            throw new MojoExecutionException("cannot write " + pathOf(e, outputRoot) + ": " + reason(e), e);
        }
    }

    /** Checks every spec's output paths before the first file is written. */
    private static void check(OutputSession session, List<CompiledSpec> compiled) throws MojoExecutionException {
        try {
            session.check(compiled);
        } catch (IOException e) {
            throw new MojoExecutionException("cannot write " + pathOf(e, session.root()) + ": " + reason(e), e);
        }
    }

    /** Releases the output folder; a failure to do so after another failure is only logged. */
    private void close(OutputSession session, Path outputRoot, boolean succeeded) throws MojoExecutionException {
        if (session == null) {
            return;
        }
        try {
            session.close();
        } catch (IOException e) {
            if (succeeded) {
                throw new MojoExecutionException("cannot release " + pathOf(e, outputRoot) + ": " + reason(e), e);
            }
            log.warn("Cannot release " + pathOf(e, outputRoot) + ": " + reason(e));
        }
    }

    /** True when a file of the previous state that no current spec claims is still there (it is to be deleted). */
    private static boolean hasStale(BuildState previous, Set<String> claimed, Path out) {
        for (BuildState.SpecState s : previous.specs().values()) {
            for (BuildState.FileState f : s.files()) {
                Path p = inside(out, f.path());
                if (!claimed.contains(f.path().toLowerCase(Locale.ROOT)) && p != null && Files.exists(p)) {
                    return true;
                }
            }
        }
        return false;
    }

    /**
     * Generates one compiled spec in the run's session, logging a progress line every
     * {@link ProgressLog#INTERVAL_NANOS} and then the summary line with the time taken.
     */
    private GenerationResult generate(OutputSession session, CompiledSpec c) throws MojoExecutionException {
        long start = System.nanoTime();
        GenerationResult result;
        try {
            result = session.generate(c, ProgressLog.of(c.spec().dataset(), c.spec().rows(), log::info, System::nanoTime));
        } catch (IOException e) {
            throw new MojoExecutionException("cannot write " + pathOf(e, session.root().resolve(c.dataFile())) + ": "
                    + reason(e), e);
        }
        log.info(summaryLine(result, System.nanoTime() - start));
        result.failedChecks().forEach(check -> log.warn(result.dataset() + ": " + check.describe()));
        return result;
    }

    /**
     * The summary with the time taken put right after the data file's size, before any notes, e.g.
     * {@code ferry-crossings: 5000 rows × 4 columns → ferry-crossings.csv (90803 bytes) in 0.4 s;
     * correlation repaired (max change 0.0312)}.
     */
    static String summaryLine(GenerationResult result, long nanos) {
        return summaryLine(result.summary(), nanos);
    }

    /** See {@link #summaryLine(GenerationResult, long)}: the time goes after the first " bytes)", else at the end. */
    static String summaryLine(String summary, long nanos) {
        String time = " in " + ProgressLog.seconds(nanos);
        int bytes = summary.indexOf(" bytes)");
        if (bytes < 0) {
            return summary + time;
        }
        int at = bytes + " bytes)".length();
        return summary.substring(0, at) + time + summary.substring(at);
    }

    /**
     * The files one spec claims: every path it writes, its data file, and where its output file is
     * written in the spec (null when not written there, or when the spec was not compiled).
     */
    record Claim(String spec, List<String> paths, String dataFile, Mark fileMark) {
        Claim {
            paths = List.copyOf(paths);
        }

        static Claim of(CompiledSpec c) {
            return new Claim(c.spec().file(), c.outputFiles(), c.dataFile(), c.spec().output().fileMark());
        }
    }

    /**
     * One problem for each spec that would write a file (data file, report or any other output) that
     * an earlier spec also writes, naming both specs and the shared paths. Paths are compared ignoring
     * letter case, since such paths are the same file on case-insensitive file systems.
     */
    static List<SpecProblem> clashes(List<Claim> specs) {
        record Owner(String spec, String path) {
        }
        Map<String, Owner> owners = new HashMap<>();
        List<SpecProblem> problems = new ArrayList<>();
        for (Claim c : specs) {
            Map<String, List<String>> shared = new LinkedHashMap<>();
            boolean dataClashes = false;
            for (String path : c.paths()) {
                Owner earlier = owners.putIfAbsent(path.toLowerCase(Locale.ROOT), new Owner(c.spec(), path));
                if (earlier != null) {
                    dataClashes |= path.equals(c.dataFile());
                    shared.computeIfAbsent(earlier.spec(), k -> new ArrayList<>()).add(earlier.path().equals(path) ? path
                            : path + " (as " + earlier.path() + " there; paths that differ only in letter case clash on"
                            + " some file systems)");
                }
            }
            Mark at = dataClashes && c.fileMark() != null ? c.fileMark() : Mark.startOf(c.spec());
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
