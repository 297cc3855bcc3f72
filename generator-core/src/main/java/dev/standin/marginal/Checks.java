package dev.standin.marginal;

/** Parameter checks with messages of the form "name must be ...: value". */
public final class Checks {

    private Checks() {
    }

    public static double finite(String name, double value) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException(name + " must be a finite number: " + value);
        }
        return value;
    }

    public static double positive(String name, double value) {
        finite(name, value);
        if (!(value > 0)) {
            throw new IllegalArgumentException(name + " must be > 0: " + text(value));
        }
        return value;
    }

    public static double probability(String name, double value) {
        finite(name, value);
        if (!(value >= 0 && value <= 1)) {
            throw new IllegalArgumentException(name + " must be in [0, 1]: " + text(value));
        }
        return value;
    }

    /** A finite value as the shortest decimal text (the same on every JDK), e.g. -3 rather than -3.0. */
    public static String text(double value) {
        return Double.isFinite(value) ? dev.standin.output.NumberText.shortest(value) : String.valueOf(value);
    }
}
