package dev.standin.engine;

import dev.standin.output.OutputBusyException;
import dev.standin.spec.Overrides;
import dev.standin.spec.SpecException;
import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.Duration;

/**
 * Test helper run in a child JVM by {@link CrashSafetyTest} and {@link ConcurrentRunsTest}: one
 * Standin run into an output folder through the public engine API, printing what happens one line
 * at a time (flushed) so the parent can follow it.
 *
 * <p>Arguments: {@code MODE OUTPUT_DIR WAIT_MS ROWS SPEC...}, ROWS {@code -} for the specs' own.
 * MODE {@code generate} generates each spec and exits; {@code hold} generates them, prints
 * {@code holding}, and keeps the folder locked until a line arrives on standard input. Exit codes:
 * 0 done, 2 invalid spec, 3 busy (another run held the folder past WAIT_MS).
 */
public final class OutputChildMain {

    private OutputChildMain() {
    }

    public static void main(String[] args) throws Exception {
        String mode = args[0];
        Path out = Path.of(args[1]);
        Duration wait = Duration.ofMillis(Long.parseLong(args[2]));
        Long rows = args[3].equals("-") ? null : Long.parseLong(args[3]);
        Engine engine = Engine.create(new Overrides(null, rows, null)).withoutHtmlReport();
        try (OutputSession session = engine.openOutput(out, wait, line -> say("notice: " + line))) {
            say("locked");
            for (int i = 4; i < args.length; i++) {
                Path spec = Path.of(args[i]);
                GenerationResult r = session.generate(engine.compile(spec, spec.getFileName().toString(), ""), null);
                say("done: " + r.summary());
            }
            if (mode.equals("hold")) {
                say("holding");
                new BufferedReader(new InputStreamReader(System.in, StandardCharsets.UTF_8)).readLine();
            }
        } catch (OutputBusyException e) {
            say("busy: " + e.getMessage());
            System.exit(3);
        } catch (SpecException e) {
            say("spec: " + e.getMessage());
            System.exit(2);
        }
        say("released");
    }

    private static void say(String line) {
        System.out.println(line);
        System.out.flush();
    }
}
