package dev.standin.spec;

import java.util.Objects;

/**
 * One user mistake in a spec, located at a file, line and column (both 1-based).
 *
 * <p>{@link #toString()} gives the one-line form {@code FILE:LINE:COLUMN: message} that the command
 * line prints on stderr and the Maven plugin puts into its failure message.
 */
public record SpecProblem(String file, int line, int column, String message) {

    public SpecProblem {
        Objects.requireNonNull(file, "file");
        Objects.requireNonNull(message, "message");
    }

    /** A problem at the given mark of the given file. */
    public static SpecProblem at(Mark mark, String message) {
        return new SpecProblem(mark.file(), mark.line(), mark.column(), message);
    }

    @Override
    public String toString() {
        return file + ":" + line + ":" + column + ": " + message;
    }
}
