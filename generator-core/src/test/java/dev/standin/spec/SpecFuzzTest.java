package dev.standin.spec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import dev.standin.engine.CompiledSpec;
import dev.standin.engine.Engine;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.SplittableRandom;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Seeded mutation fuzzing of the spec reader and the engine over every example spec in
 * {@code example-specs/specs/} (whatever is there when the test runs): lines deleted, duplicated
 * and swapped, values replaced by other types and by extreme or non-finite numbers, random bytes
 * (including invalid UTF-8), deep nesting, truncation and YAML punctuation. Every case must end
 * either in success (compile, then generate with rows overridden to 200) or in a clean
 * {@link SpecException} whose every problem carries a file, a line and column of at least 1 and a
 * message. Any other exception, a hang (the per-case preemptive timeout is a hang guard, not a
 * speed check), or a file written outside the output folder fails the test.
 *
 * <p>The mutations are the usual ones of grammar-unaware fuzzers (common practice); the seed is
 * fixed, so a failure is reproduced by its case number.
 */
class SpecFuzzTest {

    private static final Path SPECS = Path.of("../example-specs/specs");
    private static final int TOTAL_CASES = 2000;
    private static final long SEED = 0x5EED_F022L;
    private static final Duration HANG_GUARD = Duration.ofSeconds(20);

    private static final String[] VALUES = {
        "~", "\"\"", "''", "[]", "{}", "abc", "-1", "0", "1", "-0", "0.5", "1e308", "-1e308", "1.8e308", "4.9e-324",
        "1e-400", ".inf", "-.inf", ".nan", ".NaN", "9223372036854775807", "9223372036854775808",
        "-9223372036854775809", "1099511627776", "1099511627777", "0x1F", "0o17", "1_000", "2026-13-45",
        "2026-01-01", "2026-02-30", "-999999999-01-01", "2026-05-17T08:30:00Z", "true", "false", "yes", "\"12\"",
        "!!binary ZmVycnk=", "!x y", "!!java.lang.Object x", "&a x", "*a", "*nowhere", "<<", "? x", "|", ">",
        "@x", "`x`", "%TAG", "-", "- a", "[1, 2]", "{a: 1}", "[[1, 0.5], [0.5, 1]]", "{0: 1, 1: 2}",
        "{0: 5, 0.5: 1, 1: 2}", "[a, a]", "{a: 0, b: -1}", "normal", "sequence", "categorical", "quantiles",
        "spearman", "covariance", "fail", "clip", "json", "jsonl", "csv", "\"\\t\"", "\"\\0\"", "CON.csv",
        "../x.csv", "/tmp/x.csv", "C:x.csv", "a\\\\b.csv", "x.report.html", "=cmd",
        "1" + "0".repeat(150), "0." + "0".repeat(120) + "1",
    };

    private static final Pattern KEY_VALUE = Pattern.compile("([A-Za-z_][A-Za-z0-9_ ~-]*):\\s*([^,{}\\[\\]\\n]*)");
    private static final Pattern NUMBER = Pattern.compile("-?[0-9][0-9.eE+-]*");

    @Test
    void mutatedExampleSpecsFailCleanlyOrGenerate(@TempDir Path root) throws IOException {
        List<Path> specs;
        try (Stream<Path> s = Files.list(SPECS)) {
            specs = s.filter(p -> p.getFileName().toString().matches(".*\\.ya?ml")).sorted().toList();
        }
        assertFalse(specs.isEmpty(), "no example specs under " + SPECS.toAbsolutePath());
        Path out = root.resolve("out");
        Files.createDirectories(out);
        // the HTML report is left out to keep the run short; the JSON report and the data file are written
        Engine engine = Engine.create(new Overrides(null, 200L, null)).withoutHtmlReport();
        SplittableRandom random = new SplittableRandom(SEED);
        int perSpec = (TOTAL_CASES + specs.size() - 1) / specs.size();
        List<String> failures = new ArrayList<>();
        int cases = 0;
        int generated = 0;
        for (Path spec : specs) {
            String original = Files.readString(spec, StandardCharsets.UTF_8);
            // the unchanged spec must generate
            assertTrue(runCase(engine, spec.getFileName() + "#original", original.getBytes(StandardCharsets.UTF_8), out,
                    failures), "the unchanged example " + spec + " must generate: " + failures);
            for (int i = 0; i < perSpec; i++) {
                byte[] mutated = mutate(original, random);
                String name = spec.getFileName() + "#" + i;
                if (runCase(engine, name, mutated, out, failures)) {
                    generated++;
                }
                cases++;
                if (failures.size() >= 5) {
                    break;
                }
            }
        }
        try (Stream<Path> s = Files.list(root)) {
            assertEquals(List.of(out), s.toList(), "nothing may be written beside the output folder");
        }
        if (!failures.isEmpty()) {
            fail(failures.size() + " of " + cases + " cases failed:\n" + String.join("\n\n", failures));
        }
        assertTrue(cases >= 2000, "cases run: " + cases);
        // the mutations are meant to break specs, but some must survive (or the fuzzer tests nothing downstream)
        assertTrue(generated > 0, "no mutated spec generated");
    }

    /** Runs one case; true when it generated, false when it failed cleanly; a failure is added to the list. */
    private static boolean runCase(Engine engine, String name, byte[] bytes, Path out, List<String> failures) {
        String display = "fuzz/" + name + ".yaml";
        try {
            return assertTimeoutPreemptively(HANG_GUARD, () -> {
                CompiledSpec compiled;
                try {
                    compiled = engine.compile(display, bytes, "");
                } catch (SpecException e) {
                    assertClean(display, e);
                    return false;
                }
                engine.generate(compiled, out);
                Path real = out.toRealPath();
                try (Stream<Path> s = Files.walk(out)) {
                    for (Path p : s.toList()) {
                        assertTrue(p.toRealPath().startsWith(real), "written outside the output folder: " + p);
                    }
                }
                clear(out);
                return true;
            }, () -> display + " did not finish");
        } catch (Throwable t) {
            failures.add(display + ": " + t + "\n--- input ---\n" + shorten(new String(bytes, StandardCharsets.UTF_8)));
            return false;
        }
    }

    private static void assertClean(String display, SpecException e) {
        assertFalse(e.problems().isEmpty(), "no problems");
        for (SpecProblem p : e.problems()) {
            assertEquals(display, p.file(), p.toString());
            assertTrue(p.line() >= 1 && p.column() >= 1, p.toString());
            assertFalse(p.message().isBlank(), p.toString());
            assertFalse(p.message().contains("\n"), "one line: " + p);
        }
    }

    private static void clear(Path out) throws IOException {
        try (Stream<Path> s = Files.walk(out)) {
            for (Path p : s.sorted(Comparator.reverseOrder()).toList()) {
                if (!p.equals(out)) {
                    Files.delete(p);
                }
            }
        }
    }

    private static String shorten(String s) {
        return s.length() <= 2000 ? s : s.substring(0, 2000) + "... (" + s.length() + " characters)";
    }

    // ---- the mutator ---------------------------------------------------------------------------

    static byte[] mutate(String original, SplittableRandom r) {
        List<String> lines = new ArrayList<>(List.of(original.split("\n", -1)));
        int steps = 1 + r.nextInt(3);
        byte[] raw = null;
        for (int s = 0; s < steps; s++) {
            int n = lines.size();
            int at = r.nextInt(n);
            switch (r.nextInt(12)) {
                case 0 -> lines.remove(at);
                case 1 -> lines.add(at, lines.get(at));
                case 2 -> {
                    int other = r.nextInt(n);
                    String t = lines.get(at);
                    lines.set(at, lines.get(other));
                    lines.set(other, t);
                }
                case 3, 4 -> lines.set(at, replaceValue(lines.get(at), VALUES[r.nextInt(VALUES.length)], r));
                case 5 -> lines.set(at, replaceNumber(lines.get(at), r));
                case 6 -> {
                    int depth = 1 + r.nextInt(r.nextBoolean() ? 10 : 200);
                    String deep = r.nextBoolean() ? "[".repeat(depth) + "1" + "]".repeat(depth)
                            : "{a: ".repeat(depth) + "1" + "}".repeat(depth);
                    lines.set(at, replaceValue(lines.get(at), deep, r));
                }
                case 7 -> {
                    String line = lines.get(at);
                    int indent = r.nextInt(5);
                    lines.set(at, r.nextBoolean() ? " ".repeat(indent) + line : line.strip());
                }
                case 8 -> lines.add(at, " ".repeat(2 * r.nextInt(3)) + randomKey(r) + ": " + VALUES[r.nextInt(VALUES.length)]);
                case 9 -> {
                    String line = lines.get(at);
                    if (!line.isEmpty()) {
                        int c = r.nextInt(line.length());
                        String punct = ":-#&*!|>'\"%@`,[]{}?\t\\";
                        lines.set(at, line.substring(0, c) + punct.charAt(r.nextInt(punct.length())) + line.substring(c + 1));
                    }
                }
                case 10 -> raw = randomBytes(String.join("\n", lines).getBytes(StandardCharsets.UTF_8), r);
                default -> {
                    String all = String.join("\n", lines);
                    int cut = r.nextInt(all.length() + 1);
                    lines = new ArrayList<>(List.of(all.substring(0, cut).split("\n", -1)));
                }
            }
            if (lines.isEmpty()) {
                lines.add("");
            }
        }
        return raw != null ? raw : String.join("\n", lines).getBytes(StandardCharsets.UTF_8);
    }

    private static String replaceValue(String line, String value, SplittableRandom r) {
        List<int[]> spans = new ArrayList<>();
        Matcher m = KEY_VALUE.matcher(line);
        while (m.find()) {
            spans.add(new int[] {m.start(2), m.end(2)});
        }
        if (spans.isEmpty()) {
            return line + value;
        }
        int[] span = spans.get(r.nextInt(spans.size()));
        return line.substring(0, span[0]) + value + line.substring(span[1]);
    }

    private static String replaceNumber(String line, SplittableRandom r) {
        List<int[]> spans = new ArrayList<>();
        Matcher m = NUMBER.matcher(line);
        while (m.find()) {
            spans.add(new int[] {m.start(), m.end()});
        }
        String[] extreme = {"1e308", "-1e308", "1e309", "4.9e-324", "2.2250738585072014e-308", "9007199254740993",
            "9223372036854775807", "-9223372036854775808", "1e-15", "0", "-0.0", ".inf", ".nan", "1e18", "0.9999999999999999",
            "1.0000000000000002", "-1.0000000000000002", "1e-300", "123456789012345678901234567890"};
        String value = extreme[r.nextInt(extreme.length)];
        if (spans.isEmpty()) {
            return line;
        }
        int[] span = spans.get(r.nextInt(spans.size()));
        return line.substring(0, span[0]) + value + line.substring(span[1]);
    }

    private static String randomKey(SplittableRandom r) {
        String[] keys = {"rows", "seed", "dataset", "columns", "correlation", "output", "file", "format", "dist",
            "mean", "sd", "min", "max", "decimals", "nulls", "levels", "points", "pairs", "order", "matrix", "repair",
            "max-change", "guard-formulas", "header", "delimiter", "null", "x ~ y", "<<", "zzz"};
        return keys[r.nextInt(keys.length)];
    }

    private static byte[] randomBytes(byte[] in, SplittableRandom r) {
        byte[] out = in.clone();
        int flips = 1 + r.nextInt(8);
        for (int i = 0; i < flips && out.length > 0; i++) {
            out[r.nextInt(out.length)] = (byte) r.nextInt(256);
        }
        return out;
    }
}
