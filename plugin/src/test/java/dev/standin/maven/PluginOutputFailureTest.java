package dev.standin.maven;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.standin.engine.Engine;
import dev.standin.engine.OutputSession;
import dev.standin.spec.Overrides;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import org.apache.maven.plugin.MojoExecutionException;
import org.apache.maven.plugin.logging.SystemStreamLog;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Output folders the plugin cannot write are a {@link MojoExecutionException} (Maven's kind for
 * unexpected failures, per {@code Mojo#execute()}) whose message names the path, never a spec
 * error or a stack trace; and nothing is left behind.
 */
class PluginOutputFailureTest {

    private static final String SPEC = "dataset: quay-cranes\nrows: 30\nseed: 5\ncolumns:\n"
            + "  lift_t: {dist: normal, mean: 22, sd: 4}\n";

    @Test
    void aParentThatIsARegularFileNamesThePath(@TempDir Path dir) throws Exception {
        Path spec = Files.writeString(dir.resolve("quay.yaml"), SPEC, StandardCharsets.UTF_8);
        Path blocker = Files.writeString(dir.resolve("blocker"), "a file\n");
        PluginBridge bridge = PluginBridge.withLog(new SystemStreamLog());
        MojoExecutionException e = assertThrows(MojoExecutionException.class, () -> bridge.run(
                List.of(new PluginBridge.SpecSource(spec, "quay.yaml", "")), blocker.resolve("out"), Overrides.none()));
        assertTrue(e.getMessage().startsWith("cannot write "), e.getMessage());
        assertTrue(e.getMessage().contains(blocker.toString()), e.getMessage());
        assertEquals("a file\n", Files.readString(blocker));
    }

    @Test
    void aBusyOutputFolderIsWaitedFor(@TempDir Path dir) throws Exception {
        // another run holds the folder; the plugin waits (DirectoryLock.DEFAULT_WAIT) unless the run
        // ends first: here the holder is released from another thread after a short while
        Path spec = Files.writeString(dir.resolve("quay.yaml"), SPEC, StandardCharsets.UTF_8);
        Path out = dir.resolve("out");
        PluginBridge bridge = PluginBridge.withLog(new SystemStreamLog());
        OutputSession holder = Engine.create(Overrides.none()).openOutput(out, Duration.ZERO, null);
        Thread release = new Thread(() -> {
            try {
                Thread.sleep(500);
                holder.close();
            } catch (Exception ignored) {
                // the test fails below if the folder stays locked
            }
        });
        release.start();
        bridge.run(List.of(new PluginBridge.SpecSource(spec, "quay.yaml", "")), out, Overrides.none());
        release.join();
        assertTrue(Files.exists(out.resolve("quay-cranes.csv")));
    }
}
