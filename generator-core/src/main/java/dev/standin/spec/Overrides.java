package dev.standin.spec;

/**
 * Values given on the command line or as Maven properties that replace the spec's own.
 * Each field is {@code null} when not overridden.
 */
public record Overrides(Long seed, Long rows, OutputFormat format) {

    private static final Overrides NONE = new Overrides(null, null, null);

    public static Overrides none() {
        return NONE;
    }

    public boolean isEmpty() {
        return seed == null && rows == null && format == null;
    }
}
