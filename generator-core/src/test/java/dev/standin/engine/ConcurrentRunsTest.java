package dev.standin.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.standin.output.DirectoryLock;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Two processes generating into the same folder take turns through the folder's
 * {@link DirectoryLock}: the second waits (and says so) while the first holds it, gives up with a
 * "busy" error naming the lock file after its wait, and neither can leave one run's data file beside
 * the other run's report. Every run is a real child JVM ({@link OutputChildMain}); the order of
 * events is forced by the children's printed lines and standard input, not by sleeping.
 */
class ConcurrentRunsTest {

    private static Path spec(Path dir, String file, String dataset, long seed, long rows) throws Exception {
        Path p = dir.resolve(file);
        Files.writeString(p, CrashSafetyTest.SPEC.replace("depot-sensors", dataset).replace("seed: 8080", "seed: " + seed)
                .replace("rows: 1000", "rows: " + rows), StandardCharsets.UTF_8);
        return p;
    }

    @Test
    void aSecondRunWaitsForTheFirstAndThenWritesAConsistentPair(@TempDir Path dir) throws Exception {
        Path out = dir.resolve("out");
        Path first = spec(dir, "a.yaml", "depot", 1, 2000);
        Path second = spec(dir, "b.yaml", "depot", 2, 3000);
        try (ChildJvm a = ChildJvm.start("hold", out, 60_000, "-", first)) {
            a.await("holding", 120);
            assertPair(out, "depot", 1, 2000);
            try (ChildJvm b = ChildJvm.start("generate", out, 120_000, "-", second)) {
                assertEquals("notice: waiting for " + out.resolve(DirectoryLock.FILE_NAME) + " (held by another Standin run)",
                        b.await("notice:", 120));
                // while b waits, the folder still holds a's complete pair
                assertPair(out, "depot", 1, 2000);
                a.tell("release");
                a.await("released", 60);
                assertEquals(0, a.exit(60), a.output());
                b.await("done: depot: 3000 rows", 120);
                assertEquals(0, b.exit(60), b.output());
            }
        }
        assertPair(out, "depot", 2, 3000);
        assertFalse(Files.exists(out.resolve(DirectoryLock.FILE_NAME)));
    }

    @Test
    void aRunThatWaitsTooLongGivesUpNamingTheLockFile(@TempDir Path dir) throws Exception {
        Path out = dir.resolve("out");
        Path first = spec(dir, "a.yaml", "depot", 1, 100);
        try (ChildJvm a = ChildJvm.start("hold", out, 60_000, "-", first)) {
            a.await("holding", 120);
            try (ChildJvm b = ChildJvm.start("generate", out, 500, "-", spec(dir, "b.yaml", "depot", 2, 100))) {
                assertEquals(3, b.exit(120), b.output());
                assertEquals(List.of(
                        "notice: waiting for " + out.resolve(DirectoryLock.FILE_NAME) + " (held by another Standin run)",
                        "busy: " + out.resolve(DirectoryLock.FILE_NAME) + ": held by another Standin run; gave up after 500 ms"),
                        b.output().lines().toList());
            }
            assertPair(out, "depot", 1, 100);
            a.tell("release");
            assertEquals(0, a.exit(60), a.output());
        }
    }

    @Test
    void twoFreeRunningProcessesNeverMixTheirFiles(@TempDir Path dir) throws Exception {
        Path out = dir.resolve("out");
        String[] datasets = {"north-depot", "south-depot", "ring-depot"};
        List<Path> specsA = new ArrayList<>();
        List<Path> specsB = new ArrayList<>();
        for (String d : datasets) {
            specsA.add(spec(dir, d + "-a.yaml", d, 11, 5_000));
            specsB.add(spec(dir, d + "-b.yaml", d, 22, 5_000));
        }
        try (ChildJvm a = ChildJvm.start("generate", out, 120_000, "-", specsA.toArray(Path[]::new));
             ChildJvm b = ChildJvm.start("generate", out, 120_000, "-", specsB.toArray(Path[]::new))) {
            assertEquals(0, a.exit(300), a.output());
            assertEquals(0, b.exit(300), b.output());
        }
        // whichever ran last, each pair is one run's: its report describes its own data file
        long seed = -1;
        for (String d : datasets) {
            long s = reportSeed(out, d);
            assertTrue(s == 11 || s == 22, "seed " + s);
            if (seed == -1) {
                seed = s;
            }
            // the runs took turns for the whole batch, so all three pairs come from the same run
            assertEquals(seed, s, "pairs from different runs: " + d);
            assertPair(out, d, s, 5_000);
        }
        try (var s = Files.list(out)) {
            assertEquals(6, s.count(), "three data files and three reports, no temporaries, no lock file");
        }
    }

    private static long reportSeed(Path out, String dataset) throws Exception {
        return new ObjectMapper().readTree(Files.readAllBytes(out.resolve(dataset + ".report.json"))).get("seed").asLong();
    }

    /** The report names the seed and rows and the SHA-256 of the data file beside it. */
    private static void assertPair(Path out, String dataset, long seed, long rows) throws Exception {
        JsonNode report = new ObjectMapper().readTree(Files.readAllBytes(out.resolve(dataset + ".report.json")));
        assertEquals(seed, report.get("seed").asLong());
        assertEquals(rows, report.get("rows").asLong());
        byte[] data = Files.readAllBytes(out.resolve(dataset + ".csv"));
        assertEquals(CrashSafetyTest.sha256(data), report.get("files").get(0).get("sha256").asText());
        assertEquals(rows + 1, new String(data, StandardCharsets.UTF_8).lines().count(), "header and rows");
    }
}
