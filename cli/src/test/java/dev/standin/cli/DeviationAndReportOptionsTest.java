package dev.standin.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.standin.engine.GenerationResult;
import dev.standin.report.Check;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class DeviationAndReportOptionsTest {

    @TempDir
    Path dir;

    // A correct generator passes its checks (their false-failure rate is 1e-6 each), so a failing
    // check is made here by hand, as a deliberately wrong result would report it.
    private static final Check FAILED = new Check("mean of weight", 0.5, 0.61, 0.02, false, null);

    private static GenerationResult result(Check... checks) {
        return new GenerationResult("scales", 2000, 1, List.of(new GenerationResult.WrittenFile("scales.csv", 9, "00")),
                null, List.of(checks));
    }

    @Test
    void aFailedCheckExitsWithThreeNamingTheCheck() {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        PrintStream err = new PrintStream(bytes, true, StandardCharsets.UTF_8);
        assertEquals(GenerateCommand.DEVIATION, GenerateCommand.deviations(List.of(result(FAILED)), false, err));
        assertEquals("standin: scales: mean of weight: FAILED — achieved 0.61, target 0.5, tolerance 0.02\n"
                + "standin: 1 fidelity check(s) failed; the files are written (--allow-deviation exits 0 all the same)\n",
                bytes.toString(StandardCharsets.UTF_8));
    }

    @Test
    void allowDeviationExitsZeroButStillPrintsTheCheck() {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        PrintStream err = new PrintStream(bytes, true, StandardCharsets.UTF_8);
        assertEquals(0, GenerateCommand.deviations(List.of(result(FAILED)), true, err));
        assertEquals("standin: scales: mean of weight: FAILED — achieved 0.61, target 0.5, tolerance 0.02\n",
                bytes.toString(StandardCharsets.UTF_8));
    }

    @Test
    void aCorrectRunExitsZero() throws Exception {
        CliRun.spec(dir, "greenhouse.yaml", CliRun.greenhouse("greenhouse-readings"));
        CliRun run = CliRun.in(dir, "generate", "greenhouse.yaml", "--out", "out");
        assertEquals(0, run.exit(), run.err());
        assertEquals("", run.err());
    }

    @Test
    void noReportLeavesOutTheHtmlReportOnly() throws Exception {
        CliRun.spec(dir, "greenhouse.yaml", CliRun.greenhouse("greenhouse-readings"));
        CliRun run = CliRun.in(dir, "generate", "greenhouse.yaml", "--out", "out", "--no-report");
        assertEquals(0, run.exit(), run.err());
        assertEquals(List.of("greenhouse-readings.csv", "greenhouse-readings.report.json"), CliRun.filesUnder(dir.resolve("out")));
        assertTrue(Files.exists(dir.resolve("out/greenhouse-readings.report.json")));
    }
}
