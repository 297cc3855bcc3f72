package dev.standin.fit;

import dev.standin.engine.CompiledSpec;
import dev.standin.engine.Engine;
import dev.standin.output.AtomicFile;
import dev.standin.spec.Overrides;
import dev.standin.spec.SpecException;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.stream.Stream;

/**
 * The whole {@code fit} job shared by the command line and the Maven plugin: read the data, fit the
 * spec, check that it compiles, generate a sample from it in a temporary folder and run the
 * {@link DisclosureCheck} on that sample, and only then write the spec (atomically, so a failed run
 * leaves no file behind).
 */
public final class FitJob {

    /** The most rows generated for the disclosure check. */
    public static final long SAMPLE_ROWS = 5_000;

    /**
     * What the job did.
     *
     * @param fit the fitted spec
     * @param disclosure the check on the generated sample, or null when the spec has 0 rows
     * @param warnings the engine's warnings for the spec (each {@code FILE:LINE:COLUMN: warning: ...})
     * @param sampleRows how many rows were generated for the check
     */
    public record Outcome(FitResult fit, DisclosureCheck.Report disclosure, List<String> warnings, long sampleRows) {
    }

    private FitJob() {
    }

    /**
     * Runs the job.
     *
     * @param data the data file; {@code dataName} names it in messages
     * @param spec where to write the spec; {@code specName} names it in messages
     * @throws FitException for a problem in the data or the options
     * @throws IOException when a file cannot be read or written
     */
    public static Outcome run(Path data, String dataName, Path spec, String specName, FitOptions options)
            throws FitException, IOException {
        Path d = data.toAbsolutePath().normalize();
        Path s = spec.toAbsolutePath().normalize();
        if (d.equals(s) || (Files.exists(s) && Files.exists(d) && Files.isSameFile(d, s))) {
            throw FitException.option("out must not be the data file: " + specName);
        }
        if (Files.isDirectory(s)) {
            throw FitException.option("out must be a spec file, not a directory: " + specName);
        }
        CsvTable table = CsvReader.read(data, dataName);
        FitResult fit = Fitter.fit(table, options);
        byte[] bytes = fit.specText().getBytes(StandardCharsets.UTF_8);
        long sampleRows = Math.min(fit.rows(), SAMPLE_ROWS);
        CompiledSpec compiled;
        try {
            compiled = Engine.create(new Overrides(null, sampleRows, null)).withoutHtmlReport().compile(specName, bytes, "");
        } catch (SpecException e) {
            throw new IllegalStateException("the fitted spec does not compile (a bug in standin fit): " + e.getMessage(), e);
        }
        DisclosureCheck.Report report = null;
        if (sampleRows > 0) {
            Path dir = Files.createTempDirectory("standin-fit-");
            try {
                Engine.create(new Overrides(null, sampleRows, null)).withoutHtmlReport().generate(compiled, dir);
                CsvTable synthetic = CsvReader.read(dir.resolve(compiled.dataFile()), "generated sample");
                report = DisclosureCheck.compare(table, synthetic, fit.seed());
            } finally {
                deleteTree(dir);
            }
        }
        try (AtomicFile out = AtomicFile.create(s)) {
            Files.write(out.temp(), bytes);
            out.commit();
        }
        return new Outcome(fit, report, compiled.warnings(), sampleRows);
    }

    private static void deleteTree(Path dir) throws IOException {
        try (Stream<Path> walk = Files.walk(dir)) {
            for (Path p : (Iterable<Path>) walk.sorted(Comparator.reverseOrder())::iterator) {
                Files.deleteIfExists(p);
            }
        }
    }
}
