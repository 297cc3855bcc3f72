package dev.standin.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import dev.standin.engine.Engine;
import dev.standin.engine.OutputSession;
import dev.standin.spec.Overrides;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code standin generate} when the output cannot or must not be written: a parent that is a regular
 * file, a folder the operating system refuses, a linked folder leading outside, another run holding
 * the directory, and report names taken by another spec. Each is one line on stderr naming the path
 * and exit 1 (I/O) or 2 (spec), with nothing written.
 */
class OutputSafetyCliTest {

    @TempDir
    Path dir;

    @Test
    void aParentThatIsARegularFileIsAnIoFailureNamingIt() throws Exception {
        // root ignores file permissions, so an unwritable place is made from a regular file in the way
        CliRun.spec(dir, "greenhouse.yaml", CliRun.greenhouse("greenhouse-readings"));
        Files.writeString(dir.resolve("blocker"), "a file\n");

        CliRun run = CliRun.in(dir, "generate", "greenhouse.yaml", "--out", "blocker/sub");

        assertEquals(1, run.exit());
        assertEquals(List.of("standin: cannot write blocker/sub/greenhouse-readings.csv: blocker/sub: Not a directory"),
                run.errLines());
        assertEquals("a file\n", Files.readString(dir.resolve("blocker")));
    }

    @Test
    void aFolderTheSystemRefusesIsAnIoFailureNamingIt() throws Exception {
        // an injected failing directory: Linux's /proc accepts no new entries, even from root
        assumeTrue(Files.isDirectory(Path.of("/proc/self")), "needs Linux /proc");
        CliRun.spec(dir, "greenhouse.yaml", CliRun.greenhouse("greenhouse-readings"));

        CliRun run = CliRun.in(dir, "generate", "greenhouse.yaml", "--out", "/proc/standin-out");

        assertEquals(1, run.exit());
        assertEquals(1, run.errLines().size(), run.err());
        String line = run.errLines().get(0);
        assertEquals(true, line.startsWith("standin: cannot write /proc/standin-out/greenhouse-readings.csv: /proc/standin-out: "), line);
        assertFalse(CliRun.looksLikeStackTrace(run.err()), run.err());
    }

    @Test
    void aLinkedFolderLeadingOutsideIsRefusedBeforeTheFirstFile() throws Exception {
        CliRun.spec(dir, "first.yaml", CliRun.greenhouse("first-house"));
        CliRun.spec(dir, "second.yaml", CliRun.greenhouse("second-house").replace("  format: csv\n",
                "  format: csv\n  file: linked/second.csv\n"));
        Path out = Files.createDirectories(dir.resolve("out"));
        Path outside = Files.createDirectories(dir.resolve("outside"));
        Files.createSymbolicLink(out.resolve("linked"), outside);

        CliRun run = CliRun.in(dir, "generate", "first.yaml", "second.yaml", "--out", "out");

        assertEquals(1, run.exit());
        assertEquals(List.of("standin: cannot write into out: out/linked: leads to " + outside.toRealPath()
                + ", outside the output directory " + out.toRealPath() + "; refusing to write through it"), run.errLines());
        assertEquals(List.of(), CliRun.filesUnder(outside));
        assertEquals(List.of(), CliRun.filesUnder(out), "not even the first spec's files");
    }

    @Test
    void anotherRunHoldingTheDirectoryMakesItBusyAfterTheWait() throws Exception {
        CliRun.spec(dir, "greenhouse.yaml", CliRun.greenhouse("greenhouse-readings"));
        Engine engine = Engine.create(Overrides.none());
        try (OutputSession other = engine.openOutput(dir.resolve("out"), Duration.ZERO, null)) {
            CliRun run = CliRun.in(dir, "generate", "greenhouse.yaml", "--out", "out", "--wait", "0");
            assertEquals(1, run.exit());
            assertEquals(List.of("standin: waiting for out/.standin.lock (held by another Standin run)",
                    "standin: output directory out is busy: out/.standin.lock is held by another Standin run; gave up after 0 s"),
                    run.errLines());
        }
        assertEquals(List.of(), CliRun.filesUnder(dir.resolve("out")));
        CliRun run = CliRun.in(dir, "generate", "greenhouse.yaml", "--out", "out", "--wait", "0");
        assertEquals(0, run.exit(), run.err());
        assertEquals(List.of("greenhouse-readings.csv", "greenhouse-readings.report.html", "greenhouse-readings.report.json"),
                CliRun.filesUnder(dir.resolve("out")), "no lock file left behind");
    }

    @Test
    void waitMustBeWholeSeconds() throws Exception {
        CliRun.spec(dir, "greenhouse.yaml", CliRun.greenhouse("greenhouse-readings"));
        CliRun run = CliRun.in(dir, "generate", "greenhouse.yaml", "--wait", "1.5");
        assertEquals(2, run.exit());
        assertEquals("standin: --wait must be a whole number of seconds from 0 to 86400: 1.5", run.errLines().get(0));
        run = CliRun.in(dir, "generate", "greenhouse.yaml", "--wait", "86401");
        assertEquals("standin: --wait must be a whole number of seconds from 0 to 86400: 86401", run.errLines().get(0));
    }

    @Test
    void aDataFileTakingAnotherSpecsReportNameIsASpecProblem() throws Exception {
        CliRun.spec(dir, "a.yaml", CliRun.greenhouse("house"));
        String b = CliRun.greenhouse("shed").replace("  format: csv\n", "  format: csv\n  file: House.Report.csv\n");
        CliRun.spec(dir, "b.yaml", b);

        CliRun run = CliRun.in(dir, "generate", "a.yaml", "b.yaml", "--out", "out");

        assertEquals(2, run.exit());
        assertEquals(List.of("b.yaml:14:9: output file House.Report.csv takes a name of the report files house.report.* of a.yaml"
                + " (letter case ignored); give one of the two specs another dataset name or output file"), run.errLines());
        // and the other way round: the later spec's reports would take the earlier one's data file name
        run = CliRun.in(dir, "generate", "b.yaml", "a.yaml", "--out", "out");
        assertEquals(List.of("a.yaml:1:1: the report files house.report.* would take the name of House.Report.csv, the output file"
                + " of b.yaml (letter case ignored); give one of the two specs another dataset name or output file"), run.errLines());
        assertFalse(Files.exists(dir.resolve("out")));
    }
}
