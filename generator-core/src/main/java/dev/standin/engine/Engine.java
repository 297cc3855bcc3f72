package dev.standin.engine;

import dev.standin.correlation.NortaPearson;
import dev.standin.sampling.LatentModel;
import dev.standin.spec.Overrides;
import dev.standin.spec.Spec;
import dev.standin.spec.SpecException;
import dev.standin.spec.SpecParser;
import dev.standin.spec.SpecProblem;
import dev.standin.spec.Mark;
import dev.standin.output.DirectoryLock;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;

/**
 * The one entry point the command line and the Maven plugin call: compile specs (parse and check
 * everything, writing nothing), then generate each compiled spec into an output folder.
 *
 * <p>An engine holds no mutable state; it may be shared, but the plugin and the command line create
 * one per run. Compile every spec first and generate only when all compiled, so an invalid spec
 * leaves nothing behind.
 */
public final class Engine {

    private final SpecParser parser;
    private final NortaPearson norta;
    private final boolean formatOverridden;
    private final Overrides overrides;
    private final boolean htmlReport;
    private final int threads;

    private Engine(Overrides overrides, boolean htmlReport, int threads) {
        this.overrides = overrides;
        this.htmlReport = htmlReport;
        this.threads = threads;
        this.formatOverridden = overrides != null && overrides.format() != null;
        this.parser = SpecParser.withOverrides(overrides);
        this.norta = new NortaPearson();
    }

    /** An engine that applies the given overrides (seed, rows, format) to every spec. */
    public static Engine create(Overrides overrides) {
        return new Engine(overrides, true, 0);
    }

    /** The same engine without the HTML report ({@code <dataset>.report.html}); the JSON report is always written. */
    public Engine withoutHtmlReport() {
        return new Engine(overrides, false, threads);
    }

    /**
     * The same engine generating rows on {@code threads} threads (0, the default: the processors
     * available). The bytes written are the same for any count.
     */
    public Engine withThreads(int threads) {
        if (threads < 0) {
            throw new IllegalArgumentException("threads must be >= 0 (0: the processors available): " + threads);
        }
        return new Engine(overrides, htmlReport, threads);
    }

    /**
     * Reads and checks one spec file.
     *
     * @param file the spec file
     * @param displayName the name used in messages and the report, e.g. its path relative to the spec folder
     * @param outputSubdir the folder under the output folder for its files ('/'-separated, "" for none)
     * @throws SpecException for any problem in the spec, each located at FILE:LINE:COLUMN
     * @throws IOException when the file cannot be read
     */
    public CompiledSpec compile(Path file, String displayName, String outputSubdir) throws SpecException, IOException {
        byte[] bytes;
        try {
            if (Files.isDirectory(file)) {
                throw new SpecException(SpecProblem.at(Mark.startOf(displayName), "is a directory, not a spec file"));
            }
            if (Files.size(file) > SpecParser.MAX_SPEC_BYTES) {
                throw new SpecException(SpecProblem.at(Mark.startOf(displayName), "spec is " + Files.size(file)
                        + " bytes; the limit is " + SpecParser.MAX_SPEC_SIZE));
            }
            bytes = Files.readAllBytes(file);
        } catch (NoSuchFileException e) {
            throw new SpecException(SpecProblem.at(Mark.startOf(displayName), "no such spec file"));
        }
        return compile(displayName, bytes, outputSubdir);
    }

    /** Checks a spec given as bytes; see {@link #compile(Path, String, String)}. */
    public CompiledSpec compile(String displayName, byte[] bytes, String outputSubdir) throws SpecException {
        Spec spec = parser.parse(displayName, bytes);
        LatentModel model = LatentModel.of(spec, norta);
        String subfolder = OutputPaths.subfolder(displayName, outputSubdir);
        String prefix = subfolder.isEmpty() ? "" : subfolder + "/";
        String dataFile = spec.output().file() != null ? (formatOverridden ? withFormat(spec) : spec.output().file()) : spec.dataset() + "." + spec.output().format().word();
        String dataPath = prefix + dataFile;
        int slash = dataPath.lastIndexOf('/');
        String reportPath = (slash < 0 ? "" : dataPath.substring(0, slash + 1)) + spec.dataset() + ".report.json";
        OutputPaths.checkNotReport(spec, displayName, dataPath);
        return new CompiledSpec(spec, model, Hashes.sha256(bytes), dataPath, reportPath,
                htmlReport && spec.output().htmlReport(), threads);
    }

    /** The spec's file name with its extension replaced by the overriding format's. */
    private static String withFormat(Spec spec) {
        String f = spec.output().file();
        String ext = "." + spec.output().format().word();
        if (f.endsWith(ext)) {
            return f;
        }
        for (String other : new String[] {".csv", ".jsonl", ".json"}) {
            if (f.endsWith(other)) {
                return f.substring(0, f.length() - other.length()) + ext;
            }
        }
        return f;
    }

    /**
     * Generates a compiled spec into the output folder: the data file and its reports, each written
     * to a temporary file and moved into place when complete. The folder is locked for the call (see
     * {@link #openOutput}), waiting up to {@link DirectoryLock#DEFAULT_WAIT} for another run, silently;
     * a run of several specs should rather open one {@link OutputSession} and generate each in it.
     *
     * @throws dev.standin.output.OutputBusyException when another run holds the folder too long
     * @throws dev.standin.output.PathEscapeException when a folder on the way is a link leading outside
     */
    public GenerationResult generate(CompiledSpec compiled, Path outputRoot) throws IOException {
        return generate(compiled, outputRoot, null);
    }

    /**
     * As {@link #generate(CompiledSpec, Path)}, calling {@code rowsWritten} with the number of rows
     * written so far every {@value DatasetWriter#PROGRESS_EVERY} rows, on the generating thread, so a
     * caller can show progress of a long generation. The callback must be quick and must not throw.
     */
    public GenerationResult generate(CompiledSpec compiled, Path outputRoot, java.util.function.LongConsumer rowsWritten)
            throws IOException {
        try (OutputSession session = openOutput(outputRoot, DirectoryLock.DEFAULT_WAIT, null)) {
            return session.generate(compiled, rowsWritten);
        }
    }

    /**
     * Locks an output folder for one run (creating it if needed): concurrent runs into the same folder
     * take turns, each waiting at most {@code wait}; see {@link DirectoryLock} for why a lock rather
     * than per-file atomicity alone.
     *
     * @param waiting told once when another run holds the folder ("waiting for DIR/.standin.lock (held
     *     by another Standin run)"), or null
     * @throws dev.standin.output.OutputBusyException when another run still holds it after {@code wait}
     */
    public OutputSession openOutput(Path outputRoot, java.time.Duration wait, java.util.function.Consumer<String> waiting)
            throws IOException {
        return OutputSession.open(outputRoot, wait, waiting);
    }
}
