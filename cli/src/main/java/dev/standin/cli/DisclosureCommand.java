package dev.standin.cli;

import dev.standin.fit.CsvReader;
import dev.standin.fit.CsvTable;
import dev.standin.fit.DisclosureCheck;
import dev.standin.fit.FitException;
import java.io.IOException;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.List;

/**
 * {@code standin disclosure REAL.csv SYNTHETIC.csv [--seed N]}: the {@link DisclosureCheck} of a
 * synthetic table against the real one: exact copies and distances to the closest real record,
 * against a real-vs-real holdout baseline. Prints the report; exit 0 whether or not it flags.
 */
final class DisclosureCommand implements Command {

    static final String NAME = "disclosure";

    private static final Option SEED = Option.valued("--seed", "N", "seed of the holdout split and samples (default: 1)");

    @Override
    public String name() {
        return NAME;
    }

    @Override
    public String operands() {
        return "REAL.csv SYNTHETIC.csv";
    }

    @Override
    public String summary() {
        return "compare a synthetic CSV table with the real one: copied rows and distance to closest record";
    }

    @Override
    public List<Option> options() {
        return List.of(SEED);
    }

    @Override
    public int run(Arguments args, Console console) throws UsageException {
        if (args.operands().size() != 2 || args.operands().contains("")) {
            throw UsageException.of(NAME, "disclosure needs two files, REAL.csv and SYNTHETIC.csv: "
                    + (args.operands().isEmpty() ? "none given" : String.join(" ", args.operands())));
        }
        long seed = args.value(SEED.name()).isPresent() ? OptionValues.seed(NAME, args.value(SEED.name()).get()) : 1L;
        String realName = args.operands().get(0);
        String synName = args.operands().get(1);
        Path real;
        Path syn;
        try {
            real = console.workingDir().resolve(realName);
            syn = console.workingDir().resolve(synName);
        } catch (InvalidPathException e) {
            throw UsageException.of(NAME, "REAL.csv and SYNTHETIC.csv must be valid file paths: " + e.getInput());
        }
        DisclosureCheck.Report report;
        String reading = realName;
        try {
            CsvTable r = CsvReader.read(real, realName);
            reading = synName;
            CsvTable s = CsvReader.read(syn, synName);
            report = DisclosureCheck.compare(r, s, seed);
        } catch (FitException e) {
            e.lines().forEach(console.err()::println);
            return 2;
        } catch (IOException e) {
            console.err().println("standin: cannot read " + reading + ": " + IoErrors.reason(e, console));
            return 1;
        }
        report.lines().forEach(console.out()::println);
        return 0;
    }
}
