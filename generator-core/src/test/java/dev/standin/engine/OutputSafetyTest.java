package dev.standin.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.standin.output.DirectoryLock;
import dev.standin.output.OutputBusyException;
import dev.standin.output.PathEscapeException;
import dev.standin.spec.Overrides;
import dev.standin.spec.SpecException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Output paths that would escape the output folder or collide with the reports, checked before
 * anything is written, and the folder lock seen from inside one JVM.
 */
class OutputSafetyTest {

    private static final String SPEC = "dataset: tide-gauge\nrows: 20\nseed: 3\ncolumns:\n  level_cm: {dist: normal, mean: 300, sd: 40}\n";

    private static byte[] spec(String output) {
        return (SPEC + output).getBytes(StandardCharsets.UTF_8);
    }

    private static String compileProblem(String output, String subdir) {
        Engine engine = Engine.create(Overrides.none());
        return assertThrows(SpecException.class, () -> engine.compile("tide.yaml", spec(output), subdir)).getMessage();
    }

    @Test
    void anyReportNameIsReservedIgnoringCase() {
        String reserved = " would clash with the report files (tide-gauge.report.*, letter case ignored); choose another name";
        assertEquals("tide.yaml:7:9: output file tide-gauge.report.json" + reserved, compileProblem("output:\n  file: tide-gauge.report.json\n", ""));
        assertEquals("tide.yaml:7:9: output file tide-gauge.report.html" + reserved, compileProblem("output:\n  file: tide-gauge.report.html\n", ""));
        assertEquals("tide.yaml:7:9: output file Tide-Gauge.REPORT.csv" + reserved, compileProblem("output:\n  file: Tide-Gauge.REPORT.csv\n", ""));
        assertEquals("tide.yaml:7:9: output file tide-gauge.report.csv" + reserved,
                compileProblem("output:\n  file: sub/tide-gauge.report.csv\n", "coast"));
    }

    @Test
    void theOutputSubfolderMustStayInside() {
        String msg = "tide.yaml:1:1: output folder must be a relative path inside the output directory: ";
        for (String bad : new String[] {"..", "a/../..", "/abs", "C:/x", "a//b", "./a"}) {
            assertEquals(msg + bad, compileProblem("", bad));
        }
    }

    @Test
    void aLinkedFolderLeadingOutsideIsRefusedBeforeAnythingIsWritten(@TempDir Path dir) throws Exception {
        Path out = Files.createDirectories(dir.resolve("out"));
        Path elsewhere = Files.createDirectories(dir.resolve("elsewhere"));
        Files.createSymbolicLink(out.resolve("coast"), elsewhere);
        Engine engine = Engine.create(Overrides.none());
        CompiledSpec c = engine.compile("tide.yaml", spec("output:\n  file: coast/tide.csv\n"), "");
        PathEscapeException e = assertThrows(PathEscapeException.class, () -> engine.generate(c, out));
        assertEquals(out.resolve("coast") + ": leads to " + elsewhere.toRealPath() + ", outside the output directory "
                + out.toRealPath() + "; refusing to write through it", e.getMessage());
        assertEquals(List.of(), list(elsewhere));
        assertEquals(List.of("coast"), list(out), "nothing written, the lock file removed");

        // a session checks a whole batch before its first file
        CompiledSpec fine = engine.compile("fine.yaml", spec(""), "");
        try (OutputSession session = engine.openOutput(out, Duration.ofSeconds(1), null)) {
            assertThrows(PathEscapeException.class, () -> session.check(List.of(fine, c)));
        }
        assertEquals(List.of("coast"), list(out));

        // a link to a folder inside the output folder is fine, and so is a dangling one refused
        Path inside = Files.createDirectories(out.resolve("real-coast"));
        Files.delete(out.resolve("coast"));
        Files.createSymbolicLink(out.resolve("coast"), inside);
        engine.generate(c, out);
        assertTrue(Files.exists(inside.resolve("tide.csv")));
        Files.delete(out.resolve("coast"));
        Files.createSymbolicLink(out.resolve("coast"), dir.resolve("missing"));
        e = assertThrows(PathEscapeException.class, () -> engine.generate(c, out));
        assertEquals(out.resolve("coast") + ": is a symbolic link to a folder that does not exist; the output directory is "
                + out.toRealPath(), e.getMessage());
    }

    @Test
    void aLinkInTheFilesOwnPlaceIsReplacedNotFollowed(@TempDir Path dir) throws Exception {
        Path out = Files.createDirectories(dir.resolve("out"));
        Path victim = Files.writeString(dir.resolve("victim.txt"), "untouched");
        Files.createSymbolicLink(out.resolve("tide-gauge.csv"), victim);
        Engine engine = Engine.create(Overrides.none()).withoutHtmlReport();
        engine.generate(engine.compile("tide.yaml", spec(""), ""), out);
        assertEquals("untouched", Files.readString(victim));
        assertFalse(Files.isSymbolicLink(out.resolve("tide-gauge.csv")));
        assertTrue(Files.readString(out.resolve("tide-gauge.csv")).startsWith("level_cm\n"));
    }

    @Test
    void runsInOneJvmTakeTurnsAndGiveUpNamingTheLock(@TempDir Path dir) throws Exception {
        Path out = dir.resolve("out");
        Engine engine = Engine.create(Overrides.none()).withoutHtmlReport();
        List<String> notices = new ArrayList<>();
        try (OutputSession first = engine.openOutput(out, Duration.ofSeconds(1), null)) {
            assertTrue(Files.exists(out.resolve(DirectoryLock.FILE_NAME)));
            OutputBusyException busy = assertThrows(OutputBusyException.class,
                    () -> engine.openOutput(out, Duration.ofMillis(200), notices::add));
            assertEquals(out.resolve(DirectoryLock.FILE_NAME) + ": held by another Standin run; gave up after 200 ms", busy.getMessage());
            assertEquals(out.resolve(DirectoryLock.FILE_NAME).toString(), busy.getFile());
            // the same folder by another spelling is the same lock
            assertThrows(OutputBusyException.class, () -> engine.openOutput(dir.resolve("out/../out"), Duration.ZERO, null));
            first.generate(engine.compile("tide.yaml", spec(""), ""), null);
        }
        assertEquals(List.of("waiting for " + out.resolve(DirectoryLock.FILE_NAME) + " (held by another Standin run)"), notices);
        assertFalse(Files.exists(out.resolve(DirectoryLock.FILE_NAME)));
        // released: the next run gets it at once
        try (OutputSession again = engine.openOutput(out, Duration.ZERO, null)) {
            assertEquals(out, again.root());
        }
    }

    @Test
    void aLinkInTheLockFilesPlaceIsNotFollowed(@TempDir Path dir) throws Exception {
        Path out = Files.createDirectories(dir.resolve("out"));
        Path victim = Files.writeString(dir.resolve("victim.txt"), "untouched");
        Files.createSymbolicLink(out.resolve(DirectoryLock.FILE_NAME), victim);
        Engine engine = Engine.create(Overrides.none());
        java.io.IOException e = assertThrows(java.io.IOException.class, () -> engine.openOutput(out, Duration.ZERO, null));
        assertEquals(out.resolve(DirectoryLock.FILE_NAME) + ": is a symbolic link; the lock file must be a plain file (remove the link)",
                e.getMessage());
        assertEquals("untouched", Files.readString(victim));
    }

    private static List<String> list(Path dir) throws Exception {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }
}
