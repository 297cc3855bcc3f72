package dev.standin.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class HelpTest {

    @TempDir
    Path dir;

    @Test
    void helpListsEveryCommandAndOptionInAllThreeSpellings() throws Exception {
        CliRun help = CliRun.in(dir, "--help");

        assertEquals(0, help.exit());
        assertEquals("", help.err());
        for (String word : List.of("generate", "validate", "help", "--out DIR", "--seed N", "--rows N",
                "--format csv|json|jsonl", "--version", "-h, --help", "FILE:LINE:COLUMN")) {
            assertTrue(help.out().contains(word), word + " missing from:\n" + help.out());
        }
        assertEquals(help, CliRun.in(dir, "help"));
        assertEquals(help, CliRun.in(dir, "-h"));
        assertEquals(List.of(), CliRun.filesUnder(dir));
    }

    @Test
    void commandHelpShowsItsOptionsAndWinsOverOtherArguments() throws Exception {
        CliRun help = CliRun.in(dir, "generate", "--help");

        assertEquals(0, help.exit());
        assertTrue(help.out().startsWith("Usage: standin generate SPEC... [--out DIR] [--seed N] [--rows N]"
                + " [--format csv|json|jsonl] [--wait SECONDS] [--threads N] [--no-report] [--allow-deviation]\n"), help.out());
        assertEquals(help, CliRun.in(dir, "help", "generate"));
        assertEquals(help, CliRun.in(dir, "generate", "x.yaml", "--rows", "abc", "-h"));
        assertEquals(List.of(), CliRun.filesUnder(dir));
    }

    @Test
    void versionIsTheBuildsVersion() {
        String expected = System.getProperty("standin.test.version");
        assumeTrue(expected != null, "run by Maven, which passes the project version");

        CliRun run = CliRun.in(dir, "--version");

        assertEquals(0, run.exit());
        assertEquals("standin " + expected + "\n", run.out());
        assertEquals("", run.err());
    }
}
