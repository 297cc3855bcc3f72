package dev.standin.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class GenerateCommandTest {

    @TempDir
    Path dir;

    @Test
    void writesDataAndReportAndPrintsOneSummaryLine() throws Exception {
        CliRun.spec(dir, "specs/greenhouse.yaml", CliRun.greenhouse("greenhouse-readings"));

        CliRun run = CliRun.in(dir, "generate", "specs/greenhouse.yaml", "--out", "out");

        assertEquals(0, run.exit(), run.err());
        assertEquals("", run.err());
        Path out = dir.resolve("out");
        assertEquals(List.of("greenhouse-readings.csv", "greenhouse-readings.report.html", "greenhouse-readings.report.json"),
                CliRun.filesUnder(out));
        Path csv = out.resolve("greenhouse-readings.csv");
        List<String> lines = Files.readAllLines(csv, StandardCharsets.UTF_8);
        assertEquals(51, lines.size(), "header + rows: 50");
        assertEquals("reading_id,air_temp_c,humidity_pct", lines.get(0));
        for (int i = 1; i < lines.size(); i++) {
            String[] cells = lines.get(i).split(",", -1);
            assertEquals(3, cells.length, lines.get(i));
            // sequence start 100, step 5: the i-th value is 100 + 5 (i - 1), by the spec's definition
            assertEquals(100 + 5L * (i - 1), Long.parseLong(cells[0]));
            long humidity = Long.parseLong(cells[2]);
            assertTrue(humidity >= 40 && humidity <= 90, "uniform 40..90 with 0 decimals: " + humidity);
        }
        // the summary names the file and its size as the file system reports it
        assertEquals("greenhouse-readings: 50 rows × 3 columns → greenhouse-readings.csv (" + Files.size(csv) + " bytes)\n",
                run.out());

        String report = Files.readString(out.resolve("greenhouse-readings.report.json"), StandardCharsets.UTF_8);
        assertEquals("specs/greenhouse.yaml", jsonString(report, "file"), "display name is the path as given");
        assertEquals(Files.size(csv), jsonLong(report, "bytes"));
        // SHA-256 per FIPS 180-4, computed here by the JDK's own MessageDigest
        assertEquals(sha256(Files.readAllBytes(csv)), jsonString(report, "sha256", 1));
        assertEquals(sha256(Files.readAllBytes(dir.resolve("specs/greenhouse.yaml"))), jsonString(report, "sha256", 0));
    }

    @Test
    void guardFormulasPrefixesFormulaLikeHeaderAndLabelsInTheDataFile() throws Exception {
        // OWASP's CSV Injection page: cells starting with = + - @ are prefixed with ' (common practice)
        String spec = "dataset: bakery-tills\nrows: 40\nseed: 3\ncolumns:\n"
                + "  \"=till\": {dist: categorical, levels: [\"=SUM(A1)\", \"+rye\", \"@loaf\", plain]}\n"
                + "output:\n  guard-formulas: GUARD\n  report: false\n";
        CliRun.spec(dir, "on.yaml", spec.replace("GUARD", "true"));
        CliRun.spec(dir, "off.yaml", spec.replace("GUARD", "false").replace("bakery-tills", "bakery-raw"));

        assertEquals(0, CliRun.in(dir, "generate", "on.yaml", "off.yaml").exit());

        List<String> on = Files.readAllLines(dir.resolve("bakery-tills.csv"), StandardCharsets.UTF_8);
        List<String> off = Files.readAllLines(dir.resolve("bakery-raw.csv"), StandardCharsets.UTF_8);
        assertEquals("'=till", on.get(0));
        assertEquals("=till", off.get(0));
        assertEquals(off.size(), on.size());
        for (int r = 1; r < on.size(); r++) {
            String raw = off.get(r);
            assertEquals(raw.equals("plain") ? raw : "'" + raw, on.get(r), "row " + r);
        }
        assertTrue(off.contains("=SUM(A1)") && off.contains("+rye") && off.contains("@loaf"), off.toString());
    }

    @Test
    void writesIntoTheWorkingDirectoryByDefaultAndAcceptsOutEqualsForm() throws Exception {
        CliRun.spec(dir, "greenhouse.yaml", CliRun.greenhouse("greenhouse-readings"));

        CliRun here = CliRun.in(dir, "generate", "greenhouse.yaml");
        CliRun equalsForm = CliRun.in(dir, "generate", "--out=elsewhere/deeper", "greenhouse.yaml");

        assertEquals(0, here.exit(), here.err());
        assertEquals(0, equalsForm.exit(), equalsForm.err());
        assertTrue(Files.isRegularFile(dir.resolve("greenhouse-readings.csv")));
        assertEquals(List.of("greenhouse-readings.csv", "greenhouse-readings.report.html", "greenhouse-readings.report.json"),
                CliRun.filesUnder(dir.resolve("elsewhere/deeper")));
    }

    @Test
    void rowsAndFormatOverridesTakeEffect() throws Exception {
        CliRun.spec(dir, "greenhouse.yaml", CliRun.greenhouse("greenhouse-readings"));

        CliRun run = CliRun.in(dir, "generate", "greenhouse.yaml", "--rows", "7", "--format", "jsonl", "--out", "out");

        assertEquals(0, run.exit(), run.err());
        Path out = dir.resolve("out");
        assertEquals(List.of("greenhouse-readings.jsonl", "greenhouse-readings.report.html", "greenhouse-readings.report.json"),
                CliRun.filesUnder(out));
        List<String> lines = Files.readAllLines(out.resolve("greenhouse-readings.jsonl"), StandardCharsets.UTF_8);
        assertEquals(7, lines.size());
        for (String line : lines) {
            // JSON Lines (jsonlines.org): one JSON object per line
            assertTrue(line.startsWith("{\"reading_id\":") && line.endsWith("}"), line);
        }
        assertTrue(run.out().startsWith("greenhouse-readings: 7 rows × 3 columns → greenhouse-readings.jsonl ("), run.out());
    }

    @Test
    void seedOverrideChangesTheDataAndIsRecorded() throws Exception {
        CliRun.spec(dir, "greenhouse.yaml", CliRun.greenhouse("greenhouse-readings"));

        assertEquals(0, CliRun.in(dir, "generate", "greenhouse.yaml", "--out", "own").exit());
        assertEquals(0, CliRun.in(dir, "generate", "greenhouse.yaml", "--out", "seeded", "--seed", "-77").exit());

        byte[] own = Files.readAllBytes(dir.resolve("own/greenhouse-readings.csv"));
        byte[] seeded = Files.readAllBytes(dir.resolve("seeded/greenhouse-readings.csv"));
        assertFalse(java.util.Arrays.equals(own, seeded), "another seed must give other values");
        String report = Files.readString(dir.resolve("seeded/greenhouse-readings.report.json"));
        assertEquals(-77, jsonLong(report, "seed"));
        assertEquals(20261201, jsonLong(Files.readString(dir.resolve("own/greenhouse-readings.report.json")), "seed"));
    }

    @Test
    void sameSpecAndSeedGiveIdenticalBytes() throws Exception {
        CliRun.spec(dir, "greenhouse.yaml", CliRun.greenhouse("greenhouse-readings"));

        CliRun first = CliRun.in(dir, "generate", "greenhouse.yaml", "--seed", "31337", "--out", "a");
        CliRun second = CliRun.in(dir, "generate", "greenhouse.yaml", "--seed", "31337", "--out", "b");

        assertEquals(0, first.exit());
        assertEquals(0, second.exit());
        assertEquals(first.out(), second.out());
        for (String f : List.of("greenhouse-readings.csv", "greenhouse-readings.report.json")) {
            assertArrayEquals(Files.readAllBytes(dir.resolve("a").resolve(f)), Files.readAllBytes(dir.resolve("b").resolve(f)), f);
        }
    }

    @Test
    void invalidSpecWritesNothingAndNamesFileLineColumn() throws Exception {
        String bad = CliRun.greenhouse("bad-greenhouse").replace("sd: 2.5", "sd: -3");
        CliRun.spec(dir, "good.yaml", CliRun.greenhouse("greenhouse-readings"));
        CliRun.spec(dir, "bad.yaml", bad);
        Files.createDirectories(dir.resolve("out"));

        CliRun run = CliRun.in(dir, "generate", "good.yaml", "bad.yaml", "--out", "out");

        assertEquals(2, run.exit());
        assertEquals("", run.out());
        // line and column (1-based) of the value -3, counted here in the text written above
        int at = bad.indexOf("-3");
        int line = (int) bad.substring(0, at).chars().filter(c -> c == '\n').count() + 1;
        int column = at - bad.lastIndexOf('\n', at - 1);
        assertEquals("bad.yaml:" + line + ":" + column + ": normal: sd must be > 0: -3\n", run.err());
        assertEquals(List.of(), CliRun.filesUnder(dir.resolve("out")), "the valid spec must not be written either");
    }

    @Test
    void missingSpecFileIsASpecProblem() throws Exception {
        CliRun run = CliRun.in(dir, "generate", "nowhere/none.yaml", "--out", "out");

        assertEquals(2, run.exit());
        assertEquals("nowhere/none.yaml:1:1: no such spec file\n", run.err());
        assertFalse(Files.exists(dir.resolve("out")));
    }

    @Test
    void twoSpecsWritingTheSameFilesAreAnErrorNamingBoth() throws Exception {
        CliRun.spec(dir, "north/house.yaml", CliRun.greenhouse("greenhouse-readings"));
        CliRun.spec(dir, "south/house.yaml", CliRun.greenhouse("greenhouse-readings"));

        CliRun run = CliRun.in(dir, "generate", "north/house.yaml", "south/house.yaml", "--out", "out");

        assertEquals(2, run.exit());
        assertEquals(List.of("south/house.yaml:1:1: output files greenhouse-readings.csv, greenhouse-readings.report.json and greenhouse-readings.report.html"
                + " are also written by north/house.yaml; give one of the two specs another dataset name or output file"),
                run.errLines());
        assertFalse(Files.exists(dir.resolve("out")));
    }

    @Test
    void sameOutputFileUnderAnotherDatasetPointsAtItsFileKey() throws Exception {
        CliRun.spec(dir, "a.yaml", CliRun.greenhouse("house-a"));
        String b = CliRun.greenhouse("house-b").replace("  format: csv\n", "  format: csv\n  file: house-a.csv\n");
        CliRun.spec(dir, "b.yaml", b);

        CliRun run = CliRun.in(dir, "generate", "a.yaml", "b.yaml", "--out", "out");

        assertEquals(2, run.exit());
        int at = b.indexOf("house-a.csv");
        int line = (int) b.substring(0, at).chars().filter(c -> c == '\n').count() + 1;
        int column = at - b.lastIndexOf('\n', at - 1);
        assertEquals(List.of("b.yaml:" + line + ":" + column + ": output file house-a.csv is also written by a.yaml;"
                + " give one of the two specs another dataset name or output file"), run.errLines());
        assertFalse(Files.exists(dir.resolve("out")));
    }

    @Test
    void outPointingAtARegularFileIsAnIoFailure() throws Exception {
        CliRun.spec(dir, "greenhouse.yaml", CliRun.greenhouse("greenhouse-readings"));
        Files.writeString(dir.resolve("blocker"), "not a directory\n");

        CliRun run = CliRun.in(dir, "generate", "greenhouse.yaml", "--out", "blocker");

        assertEquals(1, run.exit());
        assertEquals("", run.out());
        assertEquals(List.of("standin: cannot write blocker/greenhouse-readings.csv: blocker is not a directory"), run.errLines());
        assertEquals("not a directory\n", Files.readString(dir.resolve("blocker")));
    }

    @Test
    void outputSubdirectoryBlockedByAFileIsAnIoFailure() throws Exception {
        String spec = CliRun.greenhouse("greenhouse-readings").replace("  format: csv\n", "  format: csv\n  file: sub/readings.csv\n");
        CliRun.spec(dir, "greenhouse.yaml", spec);
        Files.createDirectories(dir.resolve("out"));
        Files.writeString(dir.resolve("out/sub"), "in the way\n");

        CliRun run = CliRun.in(dir, "generate", "greenhouse.yaml", "--out", "out");

        assertEquals(1, run.exit());
        List<String> err = run.errLines();
        assertEquals(1, err.size(), run.err());
        assertTrue(err.get(0).startsWith("standin: cannot write out/sub/readings.csv: "), err.get(0));
        assertFalse(CliRun.looksLikeStackTrace(run.err()), run.err());
        assertEquals(List.of("sub"), CliRun.filesUnder(dir.resolve("out")));
    }

    private static String sha256(byte[] bytes) throws NoSuchAlgorithmException {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
    }

    private static String jsonString(String json, String key) {
        return jsonString(json, key, 0);
    }

    /** The n-th (0-based) string value of {@code "key": "..."} in the report's text. */
    private static String jsonString(String json, String key, int n) {
        Matcher m = Pattern.compile("\"" + Pattern.quote(key) + "\": \"([^\"]*)\"").matcher(json);
        for (int i = 0; i <= n; i++) {
            assertTrue(m.find(), "no " + key + " #" + i + " in " + json);
        }
        return m.group(1);
    }

    private static long jsonLong(String json, String key) {
        Matcher m = Pattern.compile("\"" + Pattern.quote(key) + "\": (-?[0-9]+)").matcher(json);
        assertTrue(m.find(), "no " + key + " in " + json);
        return Long.parseLong(m.group(1));
    }
}
