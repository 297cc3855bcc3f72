package dev.standin.spec;

import java.util.ArrayList;
import java.util.List;

/** Collects the problems of one spec so that a user sees all of them at once. */
final class Problems {

    private final List<SpecProblem> list = new ArrayList<>();

    void add(Mark mark, String message) {
        list.add(SpecProblem.at(mark, message));
    }

    boolean isEmpty() {
        return list.isEmpty();
    }

    int size() {
        return list.size();
    }

    void throwIfAny() throws SpecException {
        if (!list.isEmpty()) {
            throw new SpecException(list);
        }
    }
}
