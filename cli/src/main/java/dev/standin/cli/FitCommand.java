package dev.standin.cli;

import dev.standin.fit.ColumnFit;
import dev.standin.fit.FitException;
import dev.standin.fit.FitJob;
import dev.standin.fit.FitOptions;
import dev.standin.fit.FitResult;
import dev.standin.output.NumberText;
import java.io.IOException;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.List;
import java.util.regex.Pattern;

/**
 * {@code standin fit DATA.csv --out SPEC.yaml [--dataset NAME] [--rows N] [--seed N]
 * [--min-category-count K] [--other-label TEXT]}: fits a spec to a real CSV table (see
 * {@link dev.standin.fit.Fitter} for what is fitted and the privacy safeguards), checks a generated
 * sample of it with the disclosure check, writes the spec and prints a summary.
 */
final class FitCommand implements Command {

    static final String NAME = "fit";

    private static final Option OUT = Option.valued("--out", "SPEC.yaml", "the spec file to write (required)");
    private static final Option DATASET = Option.valued("--dataset", "NAME",
            "the spec's dataset name (default: from the data file's name)");
    private static final Option ROWS = Option.valued("--rows", "N", "the spec's rows (default: the data's row count)");
    private static final Option SEED = Option.valued("--seed", "N", "the spec's seed (default: " + FitOptions.DEFAULT_SEED + ")");
    private static final Option MIN_COUNT = Option.valued("--min-category-count", "K",
            "merge categories seen fewer than K times (default: " + FitOptions.DEFAULT_MIN_CATEGORY_COUNT + ")");
    private static final Option OTHER = Option.valued("--other-label", "TEXT",
            "the label of merged rare categories (default: " + FitOptions.DEFAULT_OTHER_LABEL + ")");

    private static final Pattern WHOLE = Pattern.compile("[0-9]{1,9}");

    @Override
    public String name() {
        return NAME;
    }

    @Override
    public String operands() {
        return "DATA.csv";
    }

    @Override
    public String summary() {
        return "fit a spec to a real CSV table, check a sample of it for disclosure and write the spec";
    }

    @Override
    public List<Option> options() {
        return List.of(OUT, DATASET, ROWS, SEED, MIN_COUNT, OTHER);
    }

    @Override
    public int run(Arguments args, Console console) throws UsageException {
        if (args.operands().size() != 1 || args.operands().get(0).isEmpty()) {
            throw UsageException.of(NAME, "fit needs exactly one DATA.csv file: "
                    + (args.operands().isEmpty() ? "none given" : String.join(" ", args.operands())));
        }
        String out = args.value(OUT.name()).orElseThrow(() -> UsageException.of(NAME,
                "--out is needed: the spec file to write, e.g. --out orders.yaml"));
        OptionValues.path(NAME, OUT.name(), out);
        Long rows = args.value(ROWS.name()).isPresent() ? OptionValues.rows(NAME, args.value(ROWS.name()).get()) : null;
        Long seed = args.value(SEED.name()).isPresent() ? OptionValues.seed(NAME, args.value(SEED.name()).get()) : null;
        int k = FitOptions.DEFAULT_MIN_CATEGORY_COUNT;
        if (args.value(MIN_COUNT.name()).isPresent()) {
            String text = args.value(MIN_COUNT.name()).get();
            if (!WHOLE.matcher(text).matches() || Integer.parseInt(text) < 1 || Integer.parseInt(text) > FitOptions.MAX_MIN_CATEGORY_COUNT) {
                throw UsageException.of(NAME, "--min-category-count must be a whole number from 1 to "
                        + FitOptions.MAX_MIN_CATEGORY_COUNT + ": " + text);
            }
            k = Integer.parseInt(text);
        }
        FitOptions options;
        try {
            options = new FitOptions(args.value(DATASET.name()).orElse(null), rows, seed, k,
                    args.value(OTHER.name()).orElse(FitOptions.DEFAULT_OTHER_LABEL));
        } catch (IllegalArgumentException e) {
            throw UsageException.of(NAME, "--" + e.getMessage());
        }
        String dataName = args.operands().get(0);
        Path data;
        Path spec;
        try {
            data = console.workingDir().resolve(dataName);
            spec = console.workingDir().resolve(out);
        } catch (InvalidPathException e) {
            throw UsageException.of(NAME, "DATA.csv and --out must be valid file paths: " + e.getInput());
        }
        FitJob.Outcome outcome;
        try {
            outcome = FitJob.run(data, dataName, spec, out, options);
        } catch (FitException e) {
            if (e.isOption()) {
                throw UsageException.of(NAME, "--" + e.getMessage());
            }
            e.lines().forEach(console.err()::println);
            return 2;
        } catch (IOException e) {
            console.err().println("standin: cannot fit " + dataName + " into " + out + ": " + IoErrors.reason(e, console));
            return 1;
        }
        print(outcome, dataName, out, console);
        return 0;
    }

    static void print(FitJob.Outcome o, String dataName, String out, Console console) {
        FitResult fit = o.fit();
        for (String note : fit.notes()) {
            console.err().println("standin: note: " + dataName + ": " + note);
        }
        for (String w : o.warnings()) {
            console.err().println(w);
        }
        console.out().println(dataName + ": " + fit.sourceRows() + " rows × " + fit.columns().size() + " columns → " + out
                + " (dataset " + fit.dataset() + ", " + fit.rows() + " rows, seed " + fit.seed() + ")");
        for (ColumnFit c : fit.columns()) {
            console.out().println("  " + describe(c));
        }
        if (fit.dependence() != null) {
            console.out().println("  correlation: spearman over " + fit.dependence().order().size() + " columns"
                    + (fit.dependence().repairChange() > 0.00005 ? " (made valid: a latent pair changed by at most "
                    + NumberText.fixed(fit.dependence().repairChange(), 4) + ")" : ""));
        }
        if (o.disclosure() != null) {
            console.out().println("Generated " + o.sampleRows() + " rows from the spec for the check.");
            o.disclosure().lines().forEach(console.out()::println);
            if (o.disclosure().flagged()) {
                console.err().println("standin: warning: the disclosure check flagged the generated sample of " + out
                        + "; review it before sharing");
            }
        } else {
            console.out().println("The spec has 0 rows: no sample to check for disclosure.");
        }
        FitResult.CAUTION.forEach(console.out()::println);
    }

    private static String describe(ColumnFit c) {
        return switch (c.role()) {
            case DROPPED -> c.name() + ": left out (" + c.note() + ")";
            case SEQUENCE -> c.name() + ": sequence (" + c.note() + ")";
            default -> {
                String s = c.name() + ": " + c.family();
                if (c.family().equals("categorical")) {
                    s += ", " + c.levels().size() + " level" + (c.levels().size() == 1 ? "" : "s");
                } else if (c.chosen() != null || c.family().equals("quantiles")) {
                    s += " (KS D " + NumberText.fixed(c.ksDistance(), 4) + (c.chosen() == null
                            ? "; every family rejected by the KS test" : "") + ")";
                }
                if (c.nulls() > 0) {
                    s += ", nulls " + NumberText.shortest(c.nulls());
                }
                yield s;
            }
        };
    }
}
