package dev.standin.cli;

import java.util.List;

/**
 * One {@code standin} command. A command is stateless: {@link Main} creates the commands per run,
 * parses the arguments against {@link #options()} and calls {@link #run}. To add a command, implement
 * this and list it in {@link Main#commands()}; help text is built from these methods.
 */
interface Command {

    /** The word that selects it, e.g. {@code generate}. */
    String name();

    /** What its operands are in help text, e.g. {@code SPEC...}. */
    String operands();

    /** One line for the command list in help. */
    String summary();

    /** The options it understands besides {@code --help}, in help order. */
    List<Option> options();

    /**
     * Runs the command.
     *
     * @return the exit code: 0 success, 2 invalid input, 1 I/O or internal failure
     * @throws UsageException for a command-line mistake, before anything is done
     */
    int run(Arguments args, Console console) throws UsageException;
}
