package dev.standin.spec;

import java.util.Locale;
import java.util.Optional;

/** The file formats Standin writes. */
public enum OutputFormat {
    /** Comma-separated values per RFC 4180. */
    CSV("csv"),
    /** One JSON array of objects (RFC 8259). */
    JSON("json"),
    /** JSON Lines: one JSON object a line. */
    JSONL("jsonl");

    private final String word;

    OutputFormat(String word) {
        this.word = word;
    }

    /** The spec and command-line spelling, which is also the default file extension. */
    public String word() {
        return word;
    }

    public static Optional<OutputFormat> parse(String text) {
        String t = text.toLowerCase(Locale.ROOT);
        for (OutputFormat f : values()) {
            if (f.word.equals(t)) {
                return Optional.of(f);
            }
        }
        return Optional.empty();
    }

    /** The valid spellings, for error messages: {@code csv, json, jsonl}. */
    public static String choices() {
        return "csv, json, jsonl";
    }
}
