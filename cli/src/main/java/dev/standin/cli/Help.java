package dev.standin.cli;

import dev.standin.engine.ToolInfo;
import java.util.ArrayList;
import java.util.List;

/** The help texts, built from the commands' own descriptions so they cannot drift apart. */
final class Help {

    private static final int LABEL_WIDTH = 24;

    private Help() {
    }

    /** {@code standin --help}: every command with its options. */
    static String general(List<Command> commands) {
        StringBuilder sb = new StringBuilder();
        sb.append("Usage: standin COMMAND [OPTION]... SPEC...\n");
        sb.append("       standin --version\n\n");
        sb.append("Seeded, statistically faithful synthetic test data from YAML specs.\n\n");
        sb.append("Commands:\n");
        for (Command c : commands) {
            row(sb, c.name(), c.summary());
        }
        row(sb, "help [COMMAND]", "show this help, or one command's");
        for (Command c : commands) {
            sb.append('\n');
            commandBody(sb, c);
        }
        sb.append('\n');
        sb.append("Options for every command:\n");
        row(sb, Option.HELP.label(), Option.HELP.description());
        row(sb, "--version", "print the name and version and exit");
        sb.append('\n');
        footer(sb);
        return sb.toString();
    }

    /** {@code standin COMMAND --help}. */
    static String of(Command c) {
        StringBuilder sb = new StringBuilder();
        sb.append("Usage: ");
        commandBody(sb, c);
        row(sb, Option.HELP.label(), Option.HELP.description());
        sb.append('\n');
        footer(sb);
        return sb.toString();
    }

    /** {@code standin --version}. */
    static String version() {
        return ToolInfo.name() + " " + ToolInfo.version();
    }

    private static void commandBody(StringBuilder sb, Command c) {
        sb.append(synopsis(c)).append('\n');
        sb.append("  ").append(capitalise(c.summary())).append(".\n");
        for (Option o : c.options()) {
            row(sb, o.label(), o.description());
        }
    }

    private static String synopsis(Command c) {
        List<String> parts = new ArrayList<>();
        parts.add("standin " + c.name() + " " + c.operands());
        for (Option o : c.options()) {
            parts.add("[" + o.label() + "]");
        }
        return String.join(" ", parts);
    }

    private static void footer(StringBuilder sb) {
        sb.append("Problems in a spec are printed as FILE:LINE:COLUMN: message.\n");
        sb.append("Exit status: 0 success; 2 invalid spec or usage error; 1 I/O or internal failure;\n"
                + "3 generate wrote every file but a fidelity check of the data failed.\n");
    }

    private static void row(StringBuilder sb, String label, String text) {
        sb.append("  ").append(label);
        int pad = LABEL_WIDTH - label.length();
        if (pad < 2) {
            sb.append('\n').append(" ".repeat(LABEL_WIDTH + 2));
        } else {
            sb.append(" ".repeat(pad));
        }
        sb.append(text).append('\n');
    }

    private static String capitalise(String s) {
        return s.isEmpty() ? s : Character.toUpperCase(s.charAt(0)) + s.substring(1);
    }
}
