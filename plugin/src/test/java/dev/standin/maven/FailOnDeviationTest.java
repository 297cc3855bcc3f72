package dev.standin.maven;

import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import dev.standin.engine.GenerationResult;
import dev.standin.report.Check;
import java.util.List;
import org.apache.maven.plugin.MojoFailureException;
import org.apache.maven.plugin.logging.SystemStreamLog;
import org.junit.jupiter.api.Test;

class FailOnDeviationTest {

    private static GenerationResult result(Check... checks) {
        return new GenerationResult("bakery", 1000, 2,
                List.of(new GenerationResult.WrittenFile("bakery.csv", 10, "00")), null, List.of(checks));
    }

    private static final Check FAILED = new Check("mean of rye_kg", 12.0, 12.9, 0.3, false, null);
    private static final Check PASSED = new Check("sd of rye_kg", 2.0, 2.01, 0.1, true, null);
    private static final Check UNCHECKED = new Check("mean of tiny", 1.0, 5.0, Double.NaN, null, "20 values give no useful power");

    @Test
    void aFailedCheckFailsTheBuildNamingColumnAndNumbers() {
        PluginBridge bridge = PluginBridge.withLog(new SystemStreamLog());
        MojoFailureException e = assertThrows(MojoFailureException.class,
                () -> bridge.failOnDeviations(List.of(result(PASSED, FAILED))));
        assertEquals("1 fidelity check(s) failed (the files are written; set -Dstandin.failOnDeviation=false to keep the"
                + " build green):\nbakery: " + FAILED.describe(), e.getMessage());
        assertEquals("mean of rye_kg: FAILED — achieved 12.9, target 12, tolerance 0.3", FAILED.describe());
    }

    @Test
    void passedAndPowerlessChecksDoNotFail() {
        PluginBridge bridge = PluginBridge.withLog(new SystemStreamLog());
        assertDoesNotThrow(() -> bridge.failOnDeviations(List.of(result(PASSED, UNCHECKED))));
    }

    @Test
    void threadsOutsideTheRangeAreRefusedNamingTheProperty() {
        PluginBridge bridge = PluginBridge.withLog(new SystemStreamLog());
        MojoFailureException e = assertThrows(MojoFailureException.class, () -> bridge.withThreads(5000));
        assertEquals("standin.threads must be a whole number from 1 to 1024 (0 or unset: the processors available): 5000",
                e.getMessage());
        assertDoesNotThrow(() -> bridge.withThreads(2));
    }

    @Test
    void failOnDeviationFalseOnlyWarns() {
        PluginBridge bridge = PluginBridge.withLog(new SystemStreamLog()).configured(true, false);
        assertDoesNotThrow(() -> bridge.failOnDeviations(List.of(result(FAILED))));
    }
}
