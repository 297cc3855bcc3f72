package dev.standin.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/** Command-line mistakes: exit 2, one line naming the option and what is valid, then the help hint. */
class UsageErrorTest {

    @TempDir
    Path dir;

    static Stream<Arguments> mistakes() {
        String gen = "Run 'standin generate --help' for usage.";
        String top = "Run 'standin --help' for usage.";
        return Stream.of(
                Arguments.of(List.of("generate", "g.yaml", "--rwos", "3"),
                        "standin: unknown option: --rwos (did you mean --rows?)", gen),
                Arguments.of(List.of("generate", "g.yaml", "--quiet"),
                        "standin: unknown option: --quiet (generate takes --out, --seed, --rows, --format, --wait, --threads, --no-report, --allow-deviation, --help)", gen),
                Arguments.of(List.of("generate", "g.yaml", "--rows", "abc"),
                        "standin: --rows must be a whole number from 0 to 1099511627776: abc", gen),
                // 2^40 + 1, one past the largest row count
                Arguments.of(List.of("generate", "g.yaml", "--rows=1099511627777"),
                        "standin: --rows must be a whole number from 0 to 1099511627776: 1099511627777", gen),
                Arguments.of(List.of("generate", "g.yaml", "--rows", "-1"),
                        "standin: --rows must be a whole number from 0 to 1099511627776: -1", gen),
                // 2^63, one past Long.MAX_VALUE (Java Language Specification 4.2.1)
                Arguments.of(List.of("generate", "g.yaml", "--seed", "9223372036854775808"),
                        "standin: --seed must be a whole number from -9223372036854775808 to 9223372036854775807:"
                                + " 9223372036854775808", gen),
                Arguments.of(List.of("generate", "g.yaml", "--format", "xml"),
                        "standin: --format must be one of csv, json, jsonl: xml", gen),
                Arguments.of(List.of("generate", "g.yaml", "--out"),
                        "standin: --out needs a value: --out DIR or --out=DIR", gen),
                Arguments.of(List.of("generate", "g.yaml", "--out="),
                        "standin: --out must be a directory path, not empty: \"\"", gen),
                Arguments.of(List.of("generate", "g.yaml", "--rows", "1", "--rows", "2"),
                        "standin: --rows may be given only once: 1 and 2", gen),
                Arguments.of(List.of("generate"),
                        "standin: generate needs at least one SPEC file", gen),
                Arguments.of(List.of("generate", "--rows", "5"),
                        "standin: generate needs at least one SPEC file", gen),
                Arguments.of(List.of("generate", "g.yaml", ""),
                        "standin: SPEC must be a file path, not empty: \"\"", gen),
                Arguments.of(List.of("validate"),
                        "standin: validate needs at least one SPEC file", "Run 'standin validate --help' for usage."),
                Arguments.of(List.of("validate", "g.yaml", "--rows", "5"),
                        "standin: unknown option: --rows (validate takes --help)", "Run 'standin validate --help' for usage."),
                Arguments.of(List.of("genrate", "g.yaml"),
                        "standin: unknown command: genrate (did you mean generate?)", top),
                Arguments.of(List.of("shuffle"),
                        "standin: unknown command: shuffle (commands: generate, validate, fit, disclosure, help)", top),
                Arguments.of(List.of(),
                        "standin: a command is needed: generate, validate, fit, disclosure, help", top),
                Arguments.of(List.of("--verison"),
                        "standin: unknown option: --verison (did you mean --version?)", top),
                Arguments.of(List.of("help", "shuffle"),
                        "standin: unknown command: shuffle (commands: generate, validate, fit, disclosure, help)", top));
    }

    @ParameterizedTest
    @MethodSource("mistakes")
    void isExitTwoWithOneLineAndAHint(List<String> args, String message, String hint) throws Exception {
        CliRun.spec(dir, "g.yaml", CliRun.greenhouse("greenhouse-readings"));

        CliRun run = CliRun.in(dir, args.toArray(String[]::new));

        assertEquals(2, run.exit());
        assertEquals(List.of(message, hint), run.errLines());
        assertEquals("", run.out());
        assertFalse(CliRun.looksLikeStackTrace(run.err()), run.err());
        assertEquals(List.of("g.yaml"), CliRun.filesUnder(dir), "nothing is written");
    }
}
