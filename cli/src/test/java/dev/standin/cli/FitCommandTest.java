package dev.standin.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code standin fit} and {@code standin disclosure} run in-process on Fisher's iris data (copied
 * from the Debian package python3-sklearn 1.2.1+dfsg-1; see
 * generator-core/src/test/resources/dev/standin/fit/iris.SOURCE.md) and on small invented tables.
 */
class FitCommandTest {

    static final Path IRIS = Path.of("../generator-core/src/test/resources/dev/standin/fit/iris.csv");

    @TempDir
    Path dir;

    private void copyIris() throws Exception {
        Files.copy(IRIS, dir.resolve("iris.csv"));
    }

    @Test
    void fitWritesASpecThatValidatesAndGeneratesAndPrintsTheCheckAndTheCaution() throws Exception {
        copyIris();
        CliRun run = CliRun.in(dir, "fit", "iris.csv", "--out", "specs/iris.yaml");

        assertEquals(0, run.exit(), run.err());
        assertTrue(run.out().startsWith("iris.csv: 150 rows × 5 columns → specs/iris.yaml (dataset iris, 150 rows, seed 1)\n"),
                run.out());
        assertTrue(run.out().contains("  species: categorical, 3 levels\n"), run.out());
        assertTrue(run.out().contains("Disclosure check: 150 synthetic rows against 150 real rows"), run.out());
        assertTrue(run.out().contains("reduce but do not remove the risk"), run.out());
        assertTrue(run.out().contains("This is not an anonymisation guarantee."), run.out());
        assertFalse(CliRun.looksLikeStackTrace(run.err()), run.err());
        assertTrue(Files.exists(dir.resolve("specs/iris.yaml")));
        assertEquals(List.of("iris.csv", "specs/iris.yaml"), CliRun.filesUnder(dir));

        CliRun validate = CliRun.in(dir, "validate", "specs/iris.yaml");
        assertEquals(0, validate.exit(), validate.err());
        assertEquals("specs/iris.yaml: ok\n", validate.out());
        CliRun generate = CliRun.in(dir, "generate", "specs/iris.yaml", "--out", "out", "--rows", "300");
        assertEquals(0, generate.exit(), generate.err());

        CliRun check = CliRun.in(dir, "disclosure", "iris.csv", "out/iris.csv", "--seed", "5");
        assertEquals(0, check.exit(), check.err());
        assertTrue(check.out().startsWith("Disclosure check: 300 synthetic rows against 150 real rows, on 5 columns"
                + " (4 numeric, 1 categorical or boolean).\n"), check.out());
        assertTrue(check.out().contains("split in half at random (seed 5)"), check.out());
    }

    @Test
    void optionsAreWrittenIntoTheSpec() throws Exception {
        copyIris();
        CliRun run = CliRun.in(dir, "fit", "iris.csv", "--out=f.yaml", "--dataset", "flowers", "--rows", "40", "--seed",
                "-9", "--min-category-count", "60", "--other-label", "any species");
        assertEquals(0, run.exit(), run.err());
        String spec = Files.readString(dir.resolve("f.yaml"), StandardCharsets.UTF_8);
        assertTrue(spec.contains("\ndataset: flowers\nrows: 40\nseed: -9\n"), spec);
        // K = 60 makes all three species (50 rows each) rare: one merged level
        assertTrue(spec.contains("      \"any species\": 1\n"), spec);
        assertTrue(run.err().contains("standin: note: iris.csv: column 'species': 3 levels seen fewer than 60 times merged"
                + " into 'any species' (150 rows)"), run.err());
        assertTrue(run.out().contains("Generated 40 rows from the spec for the check."), run.out());
    }

    @Test
    void identifiersAndFreeTextAreNotedOnStderr() throws Exception {
        StringBuilder sb = new StringBuilder("crossing_id,remark,deck\n");
        for (int i = 0; i < 60; i++) {
            sb.append(i + 1).append(',').append(i % 4 == 0 ? "calm" : "\"gusty, spray at " + i + "\"").append(',')
                    .append(i % 2 == 0 ? "upper" : "lower").append('\n');
        }
        Files.writeString(dir.resolve("ferry.csv"), sb.toString(), StandardCharsets.UTF_8);
        CliRun run = CliRun.in(dir, "fit", "ferry.csv", "--out", "ferry.yaml");
        assertEquals(0, run.exit(), run.err());
        assertTrue(run.err().contains("standin: note: ferry.csv: column 'crossing_id': every value is a distinct whole"
                + " number: looks like an identifier; written as a sequence 1, 2, 3, ... instead of its values\n"), run.err());
        assertTrue(run.err().contains("standin: note: ferry.csv: column 'remark': 45 of 60 values occur only once"), run.err());
        String spec = Files.readString(dir.resolve("ferry.yaml"), StandardCharsets.UTF_8);
        assertFalse(spec.contains("gusty"), spec);
    }

    @Test
    void aMalformedDataFileIsOneLineAtFileLineColumnAndWritesNothing() throws Exception {
        Files.writeString(dir.resolve("bad.csv"), "a,b\n1,2\n3,\"open\n", StandardCharsets.UTF_8);
        CliRun run = CliRun.in(dir, "fit", "bad.csv", "--out", "bad.yaml");
        assertEquals(2, run.exit());
        assertEquals(List.of("bad.csv:3:3: quoted field is not closed: a '\"' is missing before the end of the file"),
                run.errLines());
        assertEquals("", run.out());
        assertEquals(List.of("bad.csv"), CliRun.filesUnder(dir));

        CliRun missing = CliRun.in(dir, "fit", "none.csv", "--out", "x.yaml");
        assertEquals(2, missing.exit());
        assertEquals(List.of("none.csv:1:1: no such data file"), missing.errLines());
    }

    @Test
    void usageMistakesNameTheOption() throws Exception {
        copyIris();
        CliRun noOut = CliRun.in(dir, "fit", "iris.csv");
        assertEquals(2, noOut.exit());
        assertEquals("standin: --out is needed: the spec file to write, e.g. --out orders.yaml", noOut.errLines().get(0));
        assertEquals("Run 'standin fit --help' for usage.", noOut.errLines().get(1));

        CliRun k = CliRun.in(dir, "fit", "iris.csv", "--out", "a.yaml", "--min-category-count", "0");
        assertEquals(2, k.exit());
        assertEquals("standin: --min-category-count must be a whole number from 1 to 1000000: 0", k.errLines().get(0));

        CliRun name = CliRun.in(dir, "fit", "iris.csv", "--out", "a.yaml", "--dataset", "Iris!");
        assertEquals(2, name.exit());
        assertEquals("standin: --dataset must match [a-z0-9][a-z0-9_-]* (at most 128 characters): Iris!", name.errLines().get(0));

        StringBuilder mill = new StringBuilder("flour\n");
        for (int i = 0; i < 66; i++) {
            mill.append(i < 30 ? "rye" : i < 60 ? "spelt" : i < 63 ? "einkorn" : "emmer").append('\n');
        }
        Files.writeString(dir.resolve("mill.csv"), mill.toString(), StandardCharsets.UTF_8);
        // at K = 4 einkorn and emmer (3 rows each, 6 together) merge into the other label, which is also a kept level
        CliRun clash = CliRun.in(dir, "fit", "mill.csv", "--out", "a.yaml", "--min-category-count", "4", "--other-label", "rye");
        assertEquals(2, clash.exit(), clash.err());
        assertEquals("standin: --other-label must differ from the levels of column 'flour': rye", clash.errLines().get(0));
        Files.delete(dir.resolve("mill.csv"));

        CliRun same = CliRun.in(dir, "fit", "iris.csv", "--out", "iris.csv");
        assertEquals(2, same.exit());
        assertEquals("standin: --out must not be the data file: iris.csv", same.errLines().get(0));

        CliRun two = CliRun.in(dir, "disclosure", "iris.csv");
        assertEquals(2, two.exit());
        assertEquals("standin: disclosure needs two files, REAL.csv and SYNTHETIC.csv: iris.csv", two.errLines().get(0));
        assertEquals(List.of("iris.csv"), CliRun.filesUnder(dir));
    }

    @Test
    void helpListsTheNewCommands() {
        CliRun help = CliRun.in(dir, "--help");
        assertEquals(0, help.exit());
        for (String word : List.of("fit DATA.csv", "--out SPEC.yaml", "--min-category-count K", "--other-label TEXT",
                "disclosure REAL.csv SYNTHETIC.csv")) {
            assertTrue(help.out().contains(word), word + " missing from:\n" + help.out());
        }
    }
}
