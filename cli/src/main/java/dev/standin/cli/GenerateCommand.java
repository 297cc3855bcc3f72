package dev.standin.cli;

import dev.standin.engine.CompiledSpec;
import dev.standin.engine.Engine;
import dev.standin.engine.GenerationResult;
import dev.standin.engine.OutputSession;
import dev.standin.output.DirectoryLock;
import dev.standin.output.OutputBusyException;
import dev.standin.spec.OutputFormat;
import dev.standin.spec.Overrides;
import dev.standin.spec.SpecParser;
import java.io.IOException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;

/**
 * {@code standin generate SPEC... [--out DIR] [--seed N] [--rows N] [--format F] [--threads N]}: compiles every
 * spec first, and only when all are valid writes each one's data file and report directly into the
 * output directory, printing one summary line per dataset.
 *
 * <p>The whole run holds the output directory's lock ({@link DirectoryLock}), so two runs into one
 * directory take turns: the second says {@code standin: waiting for DIR/.standin.lock (held by
 * another Standin run)} and fails with exit 1 ("busy") after {@code --wait} seconds. Every spec's
 * paths are checked against the directory before the first file is written. When a fidelity check
 * of the written data fails, each failed check is printed on stderr and the exit code is
 * {@value #DEVIATION} (the files are complete and kept), unless {@code --allow-deviation}.
 */
final class GenerateCommand implements Command {

    static final String NAME = "generate";

    private static final Option OUT = Option.valued("--out", "DIR",
            "directory for every spec's data and report files (default: the current directory)");
    private static final Option SEED = Option.valued("--seed", "N",
            "use seed N (a 64-bit whole number) instead of each spec's seed");
    private static final Option ROWS = Option.valued("--rows", "N",
            "write N rows (0 to " + SpecParser.MAX_ROWS + ") instead of each spec's rows");
    private static final Option FORMAT = Option.valued("--format", "csv|json|jsonl",
            "write this format instead of each spec's output format");
    private static final Option WAIT = Option.valued("--wait", "SECONDS",
            "wait at most SECONDS (0 to 86400) for another Standin run writing to the same directory (default: "
                    + DirectoryLock.DEFAULT_WAIT.toSeconds() + ")");

    /** The most --threads. */
    static final int MAX_THREADS = 1024;

    private static final Option THREADS = Option.valued("--threads", "N",
            "generate rows on N threads (1 to " + MAX_THREADS + "; default: the processors available); the files are the same for any N");

    private static final Option NO_REPORT = Option.flag("--no-report", null,
            "do not write <dataset>.report.html (the JSON report is always written)");
    private static final Option ALLOW_DEVIATION = Option.flag("--allow-deviation", null,
            "exit 0 even when a fidelity check fails (failed checks are still printed)");

    /** The exit code when the files were written but a fidelity check failed. */
    static final int DEVIATION = 3;

    /** The longest --wait: one day. */
    static final long MAX_WAIT_SECONDS = 86_400;

    @Override
    public String name() {
        return NAME;
    }

    @Override
    public String operands() {
        return "SPEC...";
    }

    @Override
    public String summary() {
        return "write each spec's data file and report into one directory";
    }

    @Override
    public List<Option> options() {
        return List.of(OUT, SEED, ROWS, FORMAT, WAIT, THREADS, NO_REPORT, ALLOW_DEVIATION);
    }

    @Override
    public int run(Arguments args, Console console) throws UsageException {
        Long seed = args.value(SEED.name()).isPresent() ? OptionValues.seed(NAME, args.value(SEED.name()).get()) : null;
        Long rows = args.value(ROWS.name()).isPresent() ? OptionValues.rows(NAME, args.value(ROWS.name()).get()) : null;
        OutputFormat format = args.value(FORMAT.name()).isPresent()
                ? OptionValues.format(NAME, args.value(FORMAT.name()).get()) : null;
        String outText = args.value(OUT.name()).isPresent() ? OptionValues.path(NAME, OUT.name(), args.value(OUT.name()).get()) : null;
        Path outDir;
        try {
            outDir = outText == null ? console.workingDir() : console.workingDir().resolve(outText);
        } catch (InvalidPathException e) {
            throw UsageException.of(NAME, OUT.name() + " must be a valid directory path: " + outText);
        }
        Duration wait = args.value(WAIT.name()).isPresent() ? waitOption(args.value(WAIT.name()).get()) : DirectoryLock.DEFAULT_WAIT;
        int threads = args.value(THREADS.name()).isPresent() ? threadsOption(args.value(THREADS.name()).get()) : 0;
        List<String> specs = OptionValues.specs(NAME, args.operands());

        Engine engine = Engine.create(new Overrides(seed, rows, format)).withThreads(threads);
        if (args.has(NO_REPORT.name())) {
            engine = engine.withoutHtmlReport();
        }
        List<GenerationResult> results = new java.util.ArrayList<>();
        SpecBatch batch = SpecBatch.compile(engine, specs, console);
        batch.printWarnings(console);
        if (batch.exitCode() != 0) {
            batch.printFailures(console);
            return batch.exitCode();
        }

        List<CompiledSpec> compiled = batch.compiled();
        if (Files.exists(outDir) && !Files.isDirectory(outDir)) {
            console.err().println("standin: cannot write " + shown(outText, compiled.get(0).dataFile()) + ": "
                    + outText + " is not a directory");
            return 1;
        }
        String shownOut = outText == null ? "." : outText;
        OutputSession session;
        try {
            session = engine.openOutput(outDir, wait, line -> console.err().println("standin: waiting for "
                    + console.show(outDir.resolve(DirectoryLock.FILE_NAME)) + " (held by another Standin run)"));
        } catch (OutputBusyException e) {
            console.err().println("standin: output directory " + shownOut + " is busy: " + console.show(Path.of(e.getFile()))
                    + " is " + e.getReason());
            return 1;
        } catch (IOException e) {
            console.err().println("standin: cannot write " + shown(outText, compiled.get(0).dataFile()) + ": "
                    + IoErrors.reason(e, console));
            return 1;
        }
        try (session) {
            try {
                session.check(compiled);
            } catch (IOException e) {
                console.err().println("standin: cannot write into " + shownOut + ": " + IoErrors.reason(e, console));
                return 1;
            }
            for (CompiledSpec c : compiled) {
                GenerationResult result;
                try {
                    result = session.generate(c, null);
                } catch (IOException e) {
                    console.err().println("standin: cannot write " + shown(outText, failedFile(c, e)) + ": "
                            + IoErrors.reason(e, console));
                    return 1;
                }
                console.out().println(result.summary());
                results.add(result);
            }
        } catch (IOException e) {
            console.err().println("standin: cannot release " + console.show(outDir.resolve(DirectoryLock.FILE_NAME)) + ": "
                    + IoErrors.reason(e, console));
            return 1;
        }
        return deviations(results, args.has(ALLOW_DEVIATION.name()), console.err());
    }

    /**
     * Prints each failed fidelity check on {@code err} and returns {@value #DEVIATION} when one failed
     * (0 with {@code allow}, or when none failed).
     */
    static int deviations(List<GenerationResult> results, boolean allow, java.io.PrintStream err) {
        int failed = 0;
        for (GenerationResult result : results) {
            for (var check : result.failedChecks()) {
                err.println("standin: " + result.dataset() + ": " + check.describe());
                failed++;
            }
        }
        if (failed > 0 && !allow) {
            err.println("standin: " + failed + " fidelity check(s) failed; the files are written"
                    + " (--allow-deviation exits 0 all the same)");
            return DEVIATION;
        }
        return 0;
    }

    private static Duration waitOption(String text) throws UsageException {
        if (!text.matches("[0-9]{1,6}") || Long.parseLong(text) > MAX_WAIT_SECONDS) {
            throw UsageException.of(NAME, WAIT.name() + " must be a whole number of seconds from 0 to " + MAX_WAIT_SECONDS + ": " + text);
        }
        return Duration.ofSeconds(Long.parseLong(text));
    }

    private static int threadsOption(String text) throws UsageException {
        if (!text.matches("[0-9]{1,4}") || Integer.parseInt(text) < 1 || Integer.parseInt(text) > MAX_THREADS) {
            throw UsageException.of(NAME, THREADS.name() + " must be a whole number from 1 to " + MAX_THREADS + ": " + text);
        }
        return Integer.parseInt(text);
    }

    /** The output file (data file or a report) the failure names, itself or by its temporary file; else the data file. */
    private static String failedFile(CompiledSpec c, IOException e) {
        if (e instanceof FileSystemException fse && fse.getFile() != null) {
            Path failed = Path.of(fse.getFile()).getFileName();
            String name = failed == null ? "" : failed.toString();
            for (String file : c.outputFiles()) {
                String own = file.substring(file.lastIndexOf('/') + 1);
                if (name.equals(own) || name.startsWith("." + own + ".")) {
                    return file;
                }
            }
        }
        return c.dataFile();
    }

    /** An output path as the user would write it: under --out as given, or relative to the current directory. */
    private static String shown(String outText, String relative) {
        if (outText == null) {
            return relative;
        }
        return outText.endsWith("/") ? outText + relative : outText + "/" + relative;
    }
}
