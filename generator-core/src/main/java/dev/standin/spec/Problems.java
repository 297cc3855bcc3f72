package dev.standin.spec;

import java.util.ArrayList;
import java.util.List;

/**
 * Collects the problems of one spec so that a user sees all of them at once, up to
 * {@link #LISTED}: a hostile or badly broken spec can hold tens of thousands of mistakes, and past
 * the first hundred one line says how many more there are (at the place of the first one left out).
 */
final class Problems {

    /** The most problems listed one by one. */
    static final int LISTED = 100;

    private final List<SpecProblem> list = new ArrayList<>();
    private int count;
    private Mark firstUnlisted;

    void add(Mark mark, String message) {
        count++;
        if (list.size() < LISTED) {
            list.add(SpecProblem.at(mark, message));
        } else if (firstUnlisted == null) {
            firstUnlisted = mark;
        }
    }

    boolean isEmpty() {
        return count == 0;
    }

    /** Every problem recorded, listed or not. */
    int size() {
        return count;
    }

    /** True once further problems would not be listed, so costly details (suggestions) can be skipped. */
    boolean full() {
        return list.size() >= LISTED;
    }

    void throwIfAny() throws SpecException {
        if (count == 0) {
            return;
        }
        List<SpecProblem> all = new ArrayList<>(list);
        if (firstUnlisted != null) {
            all.add(SpecProblem.at(firstUnlisted, (count - list.size()) + " more problems not listed (the first "
                    + LISTED + " are above)"));
        }
        throw new SpecException(all);
    }
}
