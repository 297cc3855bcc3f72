package dev.standin.maven;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.standin.fit.FitJob;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.apache.maven.plugin.MojoFailureException;
import org.apache.maven.plugin.logging.SystemStreamLog;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The {@code fit} goal's bridge on Fisher's iris data (copied from the Debian package python3-sklearn
 * 1.2.1+dfsg-1; see generator-core/src/test/resources/dev/standin/fit/iris.SOURCE.md).
 */
class FitBridgeTest {

    static final Path IRIS = Path.of("../generator-core/src/test/resources/dev/standin/fit/iris.csv");

    /** A log that keeps what it is given. */
    static final class Lines extends SystemStreamLog {
        final List<String> info = new ArrayList<>();
        final List<String> warn = new ArrayList<>();

        @Override
        public void info(CharSequence content) {
            info.add(content.toString());
        }

        @Override
        public void warn(CharSequence content) {
            warn.add(content.toString());
        }
    }

    @TempDir
    Path dir;

    @Test
    void fitsWritesTheSpecAndLogsTheCheckAndTheCaution() throws Exception {
        Files.copy(IRIS, dir.resolve("iris.csv"));
        Lines log = new Lines();
        FitJob.Outcome o = FitBridge.withLog(log).fitGoal("iris.csv", "out/iris.yaml", dir, null, "500", "3", null, null);
        assertTrue(Files.exists(dir.resolve("out/iris.yaml")));
        String spec = Files.readString(dir.resolve("out/iris.yaml"), StandardCharsets.UTF_8);
        assertTrue(spec.contains("\nrows: 500\nseed: 3\n"), spec);
        assertEquals("iris.csv: 150 rows × 5 columns → out/iris.yaml (dataset iris, 500 rows, seed 3)", log.info.get(0));
        assertTrue(log.info.stream().anyMatch(l -> l.startsWith("Disclosure check: 500 synthetic rows against 150 real rows")),
                log.info.toString());
        assertTrue(log.warn.stream().anyMatch(l -> l.contains("This is not an anonymisation guarantee.")), log.warn.toString());
        assertEquals(500, o.sampleRows());
    }

    @Test
    void badPropertiesAndDataAreBuildFailuresNamingTheProperty() throws Exception {
        Files.copy(IRIS, dir.resolve("iris.csv"));
        FitBridge b = FitBridge.withLog(new Lines());
        assertEquals("standin.data must name the CSV file to fit (e.g. -Dstandin.data=orders.csv): not set",
                assertThrows(MojoFailureException.class, () -> b.fitGoal(null, "a.yaml", dir, null, null, null, null, null))
                        .getMessage());
        assertEquals("standin.spec must name the spec file to write (e.g. -Dstandin.spec=orders.yaml): not set",
                assertThrows(MojoFailureException.class, () -> b.fitGoal("iris.csv", null, dir, null, null, null, null, null))
                        .getMessage());
        assertEquals("standin.minCategoryCount must be a whole number from 1 to 1000000: 0",
                assertThrows(MojoFailureException.class, () -> b.fitGoal("iris.csv", "a.yaml", dir, null, null, null, "0", null))
                        .getMessage());
        assertEquals("standin.dataset must match [a-z0-9][a-z0-9_-]* (at most 128 characters): Iris",
                assertThrows(MojoFailureException.class, () -> b.fitGoal("iris.csv", "a.yaml", dir, "Iris", null, null, null, null))
                        .getMessage());
        assertEquals("standin.spec must not be the data file: iris.csv",
                assertThrows(MojoFailureException.class, () -> b.fitGoal("iris.csv", "iris.csv", dir, null, null, null, null, null))
                        .getMessage());
        Files.writeString(dir.resolve("bad.csv"), "a,b\n1\n", StandardCharsets.UTF_8);
        assertEquals("bad.csv:2:1: record has 1 field; the header has 2",
                assertThrows(MojoFailureException.class, () -> b.fitGoal("bad.csv", "a.yaml", dir, null, null, null, null, null))
                        .getMessage());
        assertFalse(Files.exists(dir.resolve("a.yaml")));
    }
}
