package dev.standin.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ValidateCommandTest {

    @TempDir
    Path dir;

    @Test
    void printsOkPerSpecAndWritesNothing() throws Exception {
        CliRun.spec(dir, "specs/north.yaml", CliRun.greenhouse("north-house"));
        CliRun.spec(dir, "specs/south.yaml", CliRun.greenhouse("south-house"));
        List<String> before = CliRun.filesUnder(dir);

        CliRun run = CliRun.in(dir, "validate", "specs/north.yaml", "specs/south.yaml");

        assertEquals(0, run.exit(), run.err());
        assertEquals("specs/north.yaml: ok\nspecs/south.yaml: ok\n", run.out());
        assertEquals("", run.err());
        assertEquals(before, CliRun.filesUnder(dir));
    }

    @Test
    void warnsOnStderrWhenARepairStaysWithinMaxChange() throws Exception {
        // a ~ b = b ~ c = 0.6 with a ~ c = -0.6 is not positive semidefinite (det = 1 - 3·0.36 - 2·0.216 < 0)
        CliRun.spec(dir, "vents.yaml", "dataset: vents\nrows: 10\nseed: 1\ncolumns:\n"
                + "  a: {dist: normal, mean: 0, sd: 1}\n  b: {dist: normal, mean: 0, sd: 1}\n  c: {dist: normal, mean: 0, sd: 1}\n"
                + "correlation:\n  measure: latent\n  max-change: 0.2\n  pairs: {a ~ b: 0.6, b ~ c: 0.6, a ~ c: -0.6}\n");

        CliRun run = CliRun.in(dir, "validate", "vents.yaml");

        assertEquals(0, run.exit(), run.err());
        assertEquals("vents.yaml: ok\n", run.out());
        List<String> err = run.errLines();
        assertEquals(1, err.size(), run.err());
        // the place is the pairs mapping (line 11, column 10); the repaired values come from the core (its own tests check them)
        assertEquals("vents.yaml:11:10: warning: correlation matrix repaired by nearest (max change 0.1000): a ~ b 0.6 → 0.5000,"
                + " a ~ c -0.6 → -0.5000, b ~ c 0.6 → 0.5000", err.get(0));
    }

    @Test
    void reportsEachInvalidSpecAndStillConfirmsTheValidOnes() throws Exception {
        String bad = CliRun.greenhouse("bad-house").replace("max: 90", "max: 30");
        CliRun.spec(dir, "good.yaml", CliRun.greenhouse("good-house"));
        CliRun.spec(dir, "bad.yaml", bad);
        List<String> before = CliRun.filesUnder(dir);

        CliRun run = CliRun.in(dir, "validate", "bad.yaml", "good.yaml");

        assertEquals(2, run.exit());
        assertEquals("good.yaml: ok\n", run.out());
        List<String> err = run.errLines();
        assertEquals(1, err.size(), run.err());
        // uniform min 40 > max 30 must be refused; the exact wording belongs to the core, the place to us
        assertEquals(true, err.get(0).matches("bad\\.yaml:\\d+:\\d+: .*"), err.get(0));
        assertFalse(CliRun.looksLikeStackTrace(run.err()), run.err());
        assertEquals(before, CliRun.filesUnder(dir));
    }

    @Test
    void findsOutputClashesBetweenSpecs() throws Exception {
        CliRun.spec(dir, "a.yaml", CliRun.greenhouse("same-house"));
        CliRun.spec(dir, "b.yaml", CliRun.greenhouse("same-house"));

        CliRun run = CliRun.in(dir, "validate", "a.yaml", "b.yaml");

        assertEquals(2, run.exit());
        assertEquals("a.yaml: ok\n", run.out());
        assertEquals(List.of("b.yaml:1:1: output files same-house.csv, same-house.report.json and same-house.report.html are also written by a.yaml;"
                + " give one of the two specs another dataset name or output file"), run.errLines());
    }
}
