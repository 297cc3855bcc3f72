package dev.standin.spec;

import java.util.List;
import java.util.stream.Collectors;

/**
 * An invalid spec: one or more {@link SpecProblem}s. Its message is the problems, one a line, so it
 * can be shown to a user as it is; it never needs a stack trace.
 */
public final class SpecException extends Exception {

    private static final long serialVersionUID = 1L;

    private final List<SpecProblem> problems;

    public SpecException(List<SpecProblem> problems) {
        super(problems.stream().map(SpecProblem::toString).collect(Collectors.joining("\n")), null, false, false);
        if (problems.isEmpty()) {
            throw new IllegalArgumentException("problems must not be empty");
        }
        this.problems = List.copyOf(problems);
    }

    public SpecException(SpecProblem problem) {
        this(List.of(problem));
    }

    public List<SpecProblem> problems() {
        return problems;
    }
}
