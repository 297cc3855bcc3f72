package dev.standin.fit;

import java.util.List;

/**
 * A mistake in the data file or in a fitting option: one or more one-line messages, each
 * {@code FILE:LINE:COLUMN: message} for the data file or {@code --option must be ...: value} for an
 * option. Shown to the user as it is; it never needs a stack trace.
 */
public final class FitException extends Exception {

    private static final long serialVersionUID = 1L;

    private final List<String> lines;
    private final boolean option;

    private FitException(List<String> lines, boolean option) {
        super(String.join("\n", lines), null, false, false);
        this.lines = List.copyOf(lines);
        this.option = option;
    }

    /** A problem at a place in a data file (line and column 1-based). */
    public static FitException at(String file, int line, int column, String message) {
        return new FitException(List.of(file + ":" + line + ":" + column + ": " + message), false);
    }

    /**
     * A problem with an option or setting; the message starts with the setting's key (e.g.
     * {@code other-label must differ ...}) so a front end can put its own option name there.
     */
    public static FitException option(String message) {
        return new FitException(List.of(message), true);
    }

    /** True for a problem with a setting (see {@link #option}), false for one in a data file. */
    public boolean isOption() {
        return option;
    }

    /** The message lines. */
    public List<String> lines() {
        return lines;
    }
}
