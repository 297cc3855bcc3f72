package dev.standin.cli;

import dev.standin.engine.CompiledSpec;
import dev.standin.engine.Engine;
import dev.standin.engine.GenerationResult;
import dev.standin.spec.OutputFormat;
import dev.standin.spec.Overrides;
import dev.standin.spec.SpecParser;
import java.io.IOException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.List;

/**
 * {@code standin generate SPEC... [--out DIR] [--seed N] [--rows N] [--format F]}: compiles every
 * spec first, and only when all are valid writes each one's data file and report directly into the
 * output directory, printing one summary line per dataset.
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
        return List.of(OUT, SEED, ROWS, FORMAT);
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
        List<String> specs = OptionValues.specs(NAME, args.operands());

        Engine engine = Engine.create(new Overrides(seed, rows, format));
        SpecBatch batch = SpecBatch.compile(engine, specs, console);
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
        for (CompiledSpec c : compiled) {
            GenerationResult result;
            try {
                result = engine.generate(c, outDir);
            } catch (IOException e) {
                console.err().println("standin: cannot write " + shown(outText, failedFile(c, e)) + ": "
                        + IoErrors.reason(e, console));
                return 1;
            }
            console.out().println(result.summary());
        }
        return 0;
    }

    /** The report when the failure names the report or its temporary file, else the data file. */
    private static String failedFile(CompiledSpec c, IOException e) {
        if (e instanceof FileSystemException fse && fse.getFile() != null) {
            Path failed = Path.of(fse.getFile()).getFileName();
            String report = c.reportFile().substring(c.reportFile().lastIndexOf('/') + 1);
            String name = failed == null ? "" : failed.toString();
            if (name.equals(report) || name.startsWith("." + report + ".")) {
                return c.reportFile();
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
