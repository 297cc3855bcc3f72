package dev.standin.engine;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.standin.output.DirectoryLock;
import dev.standin.spec.Overrides;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.security.MessageDigest;
import java.time.Instant;
import java.util.HexFormat;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A run killed with SIGKILL in the middle of writing a large data file must leave the previous
 * complete files untouched (same bytes) and nothing partial under a final name; the temporary it
 * leaves behind is removed by the next run that writes the same file. The kill is real: a child JVM
 * ({@link OutputChildMain}) and {@link Process#destroyForcibly()}, which is SIGKILL on POSIX
 * (documented in {@link java.lang.Process}).
 */
class CrashSafetyTest {

    /** An invented tram depot's sensor log, wide enough that the data file grows quickly. */
    static final String SPEC = """
            dataset: depot-sensors
            rows: 1000
            seed: 8080
            columns:
              reading_id: {dist: sequence}
              rail_temp_c: {dist: normal, mean: 21, sd: 6}
              current_a: {dist: gamma, shape: 3, scale: 40}
              door_cycles: {dist: poisson, mean: 12}
              line: {dist: categorical, levels: [north, south, ring]}
            """;

    @Test
    void aKilledRunLeavesThePreviousFilesIntactAndTheNextRunRemovesItsTemporary(@TempDir Path dir) throws Exception {
        Path spec = dir.resolve("depot-sensors.yaml");
        Files.writeString(spec, SPEC, StandardCharsets.UTF_8);
        Path out = dir.resolve("out");
        Engine engine = Engine.create(Overrides.none()).withoutHtmlReport();
        CompiledSpec compiled = engine.compile(spec, "depot-sensors.yaml", "");
        engine.generate(compiled, out);
        Path data = out.resolve("depot-sensors.csv");
        Path report = out.resolve("depot-sensors.report.json");
        byte[] dataBefore = Files.readAllBytes(data);
        byte[] reportBefore = Files.readAllBytes(report);

        // 10^9 rows would take hours: the child is certainly still writing when it is killed
        try (ChildJvm child = ChildJvm.start("generate", out, 60_000, "1000000000", spec)) {
            child.await("locked", 120);
            Path temp = awaitGrowingTemporary(out, "depot-sensors.csv", 1L << 20);
            child.kill();
            assertTrue(Files.exists(temp), "the killed run cannot remove its temporary: " + temp);
        }
        assertArrayEquals(dataBefore, Files.readAllBytes(data), "the previous data file must be intact");
        assertArrayEquals(reportBefore, Files.readAllBytes(report), "the previous report must be intact");
        assertEquals(1, temporaries(out, "depot-sensors.csv").size());

        // a temporary written after the next run starts is not stale (here: dated an hour ahead)
        Path fresh = out.resolve(".depot-sensors.csv.123.partial");
        Files.writeString(fresh, "not stale");
        Files.setLastModifiedTime(fresh, FileTime.from(Instant.now().plusSeconds(3600)));
        // names that only look similar are never touched
        Path other = Files.writeString(out.resolve(".depot-sensors.csv.12a.partial"), "keep");
        Path notes = Files.writeString(out.resolve("notes.partial"), "keep");

        Engine other7 = Engine.create(new Overrides(7L, 500L, null)).withoutHtmlReport();
        GenerationResult result = other7.generate(other7.compile(spec, "depot-sensors.yaml", ""), out);
        assertEquals(List.of(fresh), temporaries(out, "depot-sensors.csv"), "the killed run's temporary is removed");
        assertTrue(Files.exists(other) && Files.exists(notes));
        assertFalse(Files.exists(out.resolve(DirectoryLock.FILE_NAME)), "the lock file is removed at the end of a run");
        // the new pair is complete and consistent: the report's SHA-256 is the data file's
        JsonNode json = new ObjectMapper().readTree(Files.readAllBytes(report));
        assertEquals(500, json.get("rows").asLong());
        assertEquals(sha256(Files.readAllBytes(data)), json.get("files").get(0).get("sha256").asText());
        assertEquals(result.files().get(0).sha256(), sha256(Files.readAllBytes(data)));
    }

    /** Waits (hang guard, not a speed check) until a temporary of {@code name} exists and holds at least {@code bytes}. */
    static Path awaitGrowingTemporary(Path dir, String name, long bytes) throws IOException, InterruptedException {
        long end = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
        while (System.nanoTime() < end) {
            for (Path p : temporaries(dir, name)) {
                try {
                    if (Files.size(p) >= bytes) {
                        return p;
                    }
                } catch (java.nio.file.NoSuchFileException e) {
                    // gone between listing and size
                }
            }
            Thread.sleep(20);
        }
        throw new AssertionError("no temporary of " + name + " reached " + bytes + " bytes in " + dir);
    }

    static List<Path> temporaries(Path dir, String name) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.filter(p -> p.getFileName().toString().matches("\\." + java.util.regex.Pattern.quote(name) + "\\.[0-9]+\\.partial"))
                    .sorted().toList();
        }
    }

    static String sha256(byte[] bytes) throws Exception {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
    }
}
