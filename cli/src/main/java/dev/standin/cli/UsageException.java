package dev.standin.cli;

/**
 * A mistake on the command line (unknown option, bad value, missing SPEC). Its message is one line
 * naming the option and what would be valid; it is printed after {@code standin: }, followed by a
 * hint to run {@code --help}, and the exit code is 2. It never needs a stack trace.
 */
final class UsageException extends Exception {

    private static final long serialVersionUID = 1L;

    private final String command;

    private UsageException(String message, String command) {
        super(message, null, false, false);
        this.command = command;
    }

    /** A usage mistake in the given command ({@code null} for the command word itself). */
    static UsageException of(String command, String message) {
        return new UsageException(message, command);
    }

    /** The command whose help the hint points to, or {@code null} for the general help. */
    String command() {
        return command;
    }

    /** The line printed after the message. */
    String hint() {
        return command == null ? "Run 'standin --help' for usage." : "Run 'standin " + command + " --help' for usage.";
    }
}
