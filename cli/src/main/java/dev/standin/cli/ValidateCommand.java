package dev.standin.cli;

import dev.standin.engine.Engine;
import dev.standin.spec.Overrides;
import java.util.List;

/** {@code standin validate SPEC...}: compiles every spec, including the checks between specs, and writes nothing. */
final class ValidateCommand implements Command {

    static final String NAME = "validate";

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
        return "check specs and print 'SPEC: ok' for each valid one; writes nothing";
    }

    @Override
    public List<Option> options() {
        return List.of();
    }

    @Override
    public int run(Arguments args, Console console) throws UsageException {
        List<String> specs = OptionValues.specs(NAME, args.operands());
        SpecBatch batch = SpecBatch.compile(Engine.create(Overrides.none()), specs, console);
        batch.printWarnings(console);
        for (SpecBatch.Entry e : batch.entries()) {
            if (e.ok()) {
                console.out().println(e.name() + ": ok");
            }
        }
        batch.printFailures(console);
        return batch.exitCode();
    }
}
