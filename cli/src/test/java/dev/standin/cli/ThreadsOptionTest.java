package dev.standin.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code standin generate --threads N}: the same files for any N, and a one-line error for a bad N. */
class ThreadsOptionTest {

    @TempDir
    Path dir;

    @Test
    void theFilesAreTheSameForAnyThreadCount() throws Exception {
        CliRun.spec(dir, "greenhouse.yaml", CliRun.greenhouse("greenhouse-readings"));
        byte[][] first = null;
        for (String n : new String[] {"1", "2", "3", "7"}) {
            CliRun run = CliRun.in(dir, "generate", "greenhouse.yaml", "--out", "out" + n, "--rows", "30000", "--threads", n);
            assertEquals(0, run.exit(), run.err());
            byte[][] files = {
                Files.readAllBytes(dir.resolve("out" + n + "/greenhouse-readings.csv")),
                Files.readAllBytes(dir.resolve("out" + n + "/greenhouse-readings.report.json")),
                Files.readAllBytes(dir.resolve("out" + n + "/greenhouse-readings.report.html")),
            };
            if (first == null) {
                first = files;
            } else {
                for (int f = 0; f < files.length; f++) {
                    assertArrayEquals(first[f], files[f], "file " + f + " with --threads " + n);
                }
            }
        }
    }

    @Test
    void aBadThreadCountIsAUsageError() throws Exception {
        CliRun.spec(dir, "greenhouse.yaml", CliRun.greenhouse("greenhouse-readings"));
        for (String bad : new String[] {"0", "-1", "two", "1025", "1.5"}) {
            CliRun run = CliRun.in(dir, "generate", "greenhouse.yaml", "--threads", bad);
            assertEquals(2, run.exit(), bad);
            assertEquals("standin: --threads must be a whole number from 1 to 1024: " + bad, run.errLines().get(0));
            assertFalse(Files.exists(dir.resolve("greenhouse-readings.csv")), "nothing written");
        }
    }
}
