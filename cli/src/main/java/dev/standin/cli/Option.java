package dev.standin.cli;

/**
 * One command-line option.
 *
 * @param name the long form, e.g. {@code --rows}
 * @param shortName a one-letter form such as {@code -h}, or {@code null}
 * @param valueName the placeholder for its value in help text, e.g. {@code N}; {@code null} for a flag
 * @param description one line of help
 */
record Option(String name, String shortName, String valueName, String description) {

    /** The option every command understands. */
    static final Option HELP = flag("--help", "-h", "show this help and exit");

    /** An option that takes a value, as {@code --name VALUE} or {@code --name=VALUE}. */
    static Option valued(String name, String valueName, String description) {
        return new Option(name, null, valueName, description);
    }

    /** An option without a value. */
    static Option flag(String name, String shortName, String description) {
        return new Option(name, shortName, null, description);
    }

    boolean takesValue() {
        return valueName != null;
    }

    /** How help shows it: {@code -h, --help} or {@code --rows N}. */
    String label() {
        String lead = shortName == null ? name : shortName + ", " + name;
        return takesValue() ? lead + " " + valueName : lead;
    }
}
