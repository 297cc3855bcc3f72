package dev.standin.cli;

import java.io.BufferedOutputStream;
import java.io.FileDescriptor;
import java.io.FileOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;

/**
 * The {@code standin} command: {@code java -jar standin.jar COMMAND [OPTION]... SPEC...}.
 *
 * <p>Exit codes: 0 success; 2 an invalid spec or a command-line mistake (each problem one line on
 * stderr, never a stack trace); 1 an I/O or internal failure (one line on stderr).
 */
public final class Main {

    private static final List<String> HELP_WORDS = List.of("help", "--help", "-h");
    private static final String VERSION = "--version";

    private Main() {
    }

    /** Runs the command line and exits with its code. Output is UTF-8, as are spec files. */
    public static void main(String[] args) {
        PrintStream out = new PrintStream(new BufferedOutputStream(new FileOutputStream(FileDescriptor.out)), false,
                StandardCharsets.UTF_8);
        PrintStream err = new PrintStream(new FileOutputStream(FileDescriptor.err), true, StandardCharsets.UTF_8);
        int code = run(args, out, err, Path.of("").toAbsolutePath());
        out.flush();
        err.flush();
        System.exit(code);
    }

    /**
     * Runs one command line in-process.
     *
     * @param args the arguments, as {@code main} receives them
     * @param out where results and help go
     * @param err where problems go, one a line
     * @param workingDir the directory relative paths are resolved against
     * @return the exit code
     */
    public static int run(String[] args, PrintStream out, PrintStream err, Path workingDir) {
        Console console = new Console(out, err, workingDir.toAbsolutePath());
        try {
            return dispatch(Arrays.asList(args), console);
        } catch (UsageException e) {
            err.println("standin: " + e.getMessage());
            err.println(e.hint());
            return 2;
        } catch (RuntimeException e) {
            err.println("standin: internal error: " + e);
            return 1;
        } finally {
            out.flush();
            err.flush();
        }
    }

    /** The commands, in help order. A new command is added here. */
    static List<Command> commands() {
        return List.of(new GenerateCommand(), new ValidateCommand(), new FitCommand(), new DisclosureCommand());
    }

    private static int dispatch(List<String> args, Console console) throws UsageException {
        List<Command> commands = commands();
        if (args.isEmpty()) {
            throw UsageException.of(null, "a command is needed: " + names(commands));
        }
        String first = args.get(0);
        List<String> rest = args.subList(1, args.size());
        if (HELP_WORDS.contains(first)) {
            return help(rest, commands, console);
        }
        if (first.equals(VERSION)) {
            if (!rest.isEmpty()) {
                throw UsageException.of(null, VERSION + " takes no arguments: " + String.join(" ", rest));
            }
            console.out().println(Help.version());
            return 0;
        }
        if (first.startsWith("-")) {
            List<String> globals = List.of("--help", VERSION);
            String detail = Suggestions.closest(first, globals).map(s -> "did you mean " + s + "?")
                    .orElse("give a command first: " + names(commands));
            throw UsageException.of(null, "unknown option: " + first + " (" + detail + ")");
        }
        Command command = find(first, commands).orElseThrow(() -> unknownCommand(first, commands));
        if (asksForHelp(rest)) {
            console.out().print(Help.of(command));
            return 0;
        }
        List<Option> options = new ArrayList<>(command.options());
        options.add(Option.HELP);
        return command.run(Arguments.parse(command.name(), rest, options), console);
    }

    private static int help(List<String> rest, List<Command> commands, Console console) throws UsageException {
        if (rest.isEmpty()) {
            console.out().print(Help.general(commands));
            return 0;
        }
        if (rest.size() > 1) {
            throw UsageException.of(null, "help takes at most one COMMAND: " + String.join(" ", rest));
        }
        Command command = find(rest.get(0), commands).orElseThrow(() -> unknownCommand(rest.get(0), commands));
        console.out().print(Help.of(command));
        return 0;
    }

    /** {@code --help} or {@code -h} anywhere before {@code --} wins over every other argument. */
    private static boolean asksForHelp(List<String> args) {
        for (String a : args) {
            if (a.equals("--")) {
                return false;
            }
            if (a.equals("--help") || a.equals("-h")) {
                return true;
            }
        }
        return false;
    }

    private static Optional<Command> find(String name, List<Command> commands) {
        return commands.stream().filter(c -> c.name().equals(name)).findFirst();
    }

    private static UsageException unknownCommand(String word, List<Command> commands) {
        List<String> names = commands.stream().map(Command::name).toList();
        String detail = Suggestions.closest(word, names).map(s -> "did you mean " + s + "?")
                .orElse("commands: " + names(commands));
        return UsageException.of(null, "unknown command: " + word + " (" + detail + ")");
    }

    private static String names(List<Command> commands) {
        List<String> names = new ArrayList<>(commands.stream().map(Command::name).toList());
        names.add("help");
        return String.join(", ", names);
    }
}
