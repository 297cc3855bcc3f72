package dev.standin.cli;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.stream.Collectors;

/**
 * A command's parsed arguments: its operands (e.g. SPEC files) in order and the options given.
 *
 * <p>The syntax follows the GNU long-option conventions (GNU C Library manual, "Program Argument
 * Syntax Conventions"): {@code --name VALUE} or {@code --name=VALUE}; options and operands may be
 * mixed; {@code --} ends the options, so every later argument is an operand even if it starts with
 * {@code -}. A lone {@code -} is an operand. A value that itself starts with {@code --} must use the
 * {@code =} form. Unlike GNU, long options may not be abbreviated; a near miss is a usage error that
 * suggests the intended option.
 */
final class Arguments {

    private final List<String> operands;
    private final Map<String, String> values;

    private Arguments(List<String> operands, Map<String, String> values) {
        this.operands = Collections.unmodifiableList(operands);
        this.values = Collections.unmodifiableMap(values);
    }

    /**
     * Parses the arguments that follow the command word.
     *
     * @param command the command name, for messages
     * @param args the arguments after it
     * @param options the options the command understands
     * @throws UsageException for an unknown option, a missing or unexpected value, or a repeated option
     */
    static Arguments parse(String command, List<String> args, List<Option> options) throws UsageException {
        List<String> operands = new ArrayList<>();
        Map<String, String> values = new LinkedHashMap<>();
        boolean optionsEnded = false;
        for (int i = 0; i < args.size(); i++) {
            String arg = args.get(i);
            if (optionsEnded || arg.equals("-") || !arg.startsWith("-")) {
                operands.add(arg);
                continue;
            }
            if (arg.equals("--")) {
                optionsEnded = true;
                continue;
            }
            int eq = arg.startsWith("--") ? arg.indexOf('=') : -1;
            String name = eq < 0 ? arg : arg.substring(0, eq);
            Option option = find(name, options);
            if (option == null) {
                throw unknown(command, name, options);
            }
            String value;
            if (!option.takesValue()) {
                if (eq >= 0) {
                    throw UsageException.of(command, option.name() + " takes no value: " + arg.substring(eq + 1));
                }
                value = "";
            } else if (eq >= 0) {
                value = arg.substring(eq + 1);
            } else if (i + 1 < args.size() && !args.get(i + 1).startsWith("--")) {
                value = args.get(++i);
            } else {
                throw UsageException.of(command, option.name() + " needs a value: " + option.label() + " or "
                        + option.name() + "=" + option.valueName());
            }
            if (option.takesValue() && values.containsKey(option.name())) {
                throw UsageException.of(command, option.name() + " may be given only once: "
                        + values.get(option.name()) + " and " + value);
            }
            values.put(option.name(), value);
        }
        return new Arguments(operands, values);
    }

    private static Option find(String name, List<Option> options) {
        for (Option o : options) {
            if (o.name().equals(name) || name.equals(o.shortName())) {
                return o;
            }
        }
        return null;
    }

    private static UsageException unknown(String command, String name, List<Option> options) {
        List<String> names = options.stream().map(Option::name).collect(Collectors.toList());
        Optional<String> near = Suggestions.closest(name, names);
        String detail = near.map(s -> "did you mean " + s + "?")
                .orElse(command + " takes " + String.join(", ", names));
        return UsageException.of(command, "unknown option: " + name + " (" + detail + ")");
    }

    /** The operands, in the order given. */
    List<String> operands() {
        return operands;
    }

    /** The value of an option that takes one, if it was given. */
    Optional<String> value(String name) {
        return Optional.ofNullable(values.get(name));
    }

    /** Whether an option (flag or valued) was given. */
    boolean has(String name) {
        return values.containsKey(name);
    }
}
