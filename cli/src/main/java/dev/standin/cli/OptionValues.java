package dev.standin.cli;

import dev.standin.spec.OutputFormat;
import dev.standin.spec.SpecParser;
import java.util.List;
import java.util.regex.Pattern;

/**
 * Reads the typed values of options shared by commands that generate data, with messages of the form
 * {@code --name must be ...: value}. The ranges are the spec format's own (see {@link SpecParser}).
 */
final class OptionValues {

    private static final Pattern INTEGER = Pattern.compile("[+-]?[0-9]{1,19}");

    private OptionValues() {
    }

    /** A row count from 0 to {@link SpecParser#MAX_ROWS} (2<sup>40</sup>). */
    static long rows(String command, String text) throws UsageException {
        Long v = integer(text);
        if (v == null || v < 0 || v > SpecParser.MAX_ROWS) {
            throw UsageException.of(command, "--rows must be a whole number from 0 to " + SpecParser.MAX_ROWS + ": " + text);
        }
        return v;
    }

    /** A seed: any 64-bit two's-complement integer, as in the spec's {@code seed}. */
    static long seed(String command, String text) throws UsageException {
        Long v = integer(text);
        if (v == null) {
            throw UsageException.of(command, "--seed must be a whole number from " + Long.MIN_VALUE + " to "
                    + Long.MAX_VALUE + ": " + text);
        }
        return v;
    }

    /** One of {@link OutputFormat#choices()}. */
    static OutputFormat format(String command, String text) throws UsageException {
        return OutputFormat.parse(text).orElseThrow(() ->
                UsageException.of(command, "--format must be one of " + OutputFormat.choices() + ": " + text));
    }

    /** A non-empty path. */
    static String path(String command, String option, String text) throws UsageException {
        if (text.isEmpty()) {
            throw UsageException.of(command, option + " must be a directory path, not empty: \"\"");
        }
        return text;
    }

    /** The SPEC operands: at least one, none empty. */
    static List<String> specs(String command, List<String> operands) throws UsageException {
        if (operands.isEmpty()) {
            throw UsageException.of(command, command + " needs at least one SPEC file");
        }
        if (operands.contains("")) {
            throw UsageException.of(command, "SPEC must be a file path, not empty: \"\"");
        }
        return operands;
    }

    private static Long integer(String text) {
        if (!INTEGER.matcher(text).matches()) {
            return null;
        }
        try {
            return Long.parseLong(text);
        } catch (NumberFormatException e) {
            return null;
        }
    }
}
