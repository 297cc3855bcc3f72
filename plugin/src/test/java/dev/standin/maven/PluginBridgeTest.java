package dev.standin.maven;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.standin.engine.Engine;
import dev.standin.engine.GenerationResult;
import dev.standin.spec.OutputFormat;
import dev.standin.spec.Overrides;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.apache.maven.model.Resource;
import org.apache.maven.plugin.MojoExecutionException;
import org.apache.maven.plugin.MojoFailureException;
import org.apache.maven.plugin.logging.SystemStreamLog;
import org.apache.maven.project.MavenProject;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The bridge between the goals and the engine: property parsing, spec discovery, the all-or-nothing
 * rule and output clashes. Expected values are worked out by hand from the rules stated in each
 * comment; none is read back from the code under test.
 */
class PluginBridgeTest {

    /** A minimal valid spec: 3 rows, one sequence column (spec format v1, generator-core's SpecParser). */
    private static String spec(String dataset, String extra) {
        return "dataset: " + dataset + "\n"
                + "rows: 3\n"
                + "seed: 11\n"
                + "columns:\n"
                + "  tray_no: {dist: sequence, start: 1, step: 1}\n"
                + extra;
    }

    /**
     * The files the core says a spec writes ({@code CompiledSpec.outputFiles()}), so these tests follow
     * the core's list of outputs (data file, JSON report and whatever else it adds) instead of copying it.
     */
    static List<String> outputsOf(String name, String yaml, String subdir, Overrides overrides) throws Exception {
        return Engine.create(overrides).compile(name, yaml.getBytes(StandardCharsets.UTF_8), subdir).outputFiles();
    }

    @SafeVarargs
    static List<String> sortedUnion(List<String>... lists) {
        return Stream.of(lists).flatMap(List::stream).sorted().distinct().collect(Collectors.toList());
    }

    private static void write(Path file, String text) throws IOException {
        Files.createDirectories(file.getParent());
        Files.write(file, text.getBytes(StandardCharsets.UTF_8));
    }

    private static List<String> filesUnder(Path root) throws IOException {
        if (!Files.exists(root)) {
            return List.of();
        }
        try (Stream<Path> walk = Files.walk(root)) {
            return walk.filter(Files::isRegularFile).map(p -> root.relativize(p).toString().replace('\\', '/'))
                    .sorted().collect(Collectors.toList());
        }
    }

    /** A log that keeps its info and error lines so tests can check what a user would read. */
    static final class RecordingLog extends SystemStreamLog {
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

    private static PluginBridge.GenerateRequest request(Path specs, Path out) {
        return PluginBridge.GenerateRequest.of(specs, out);
    }

    // --- overrides -------------------------------------------------------------------------------

    @Test
    void noOverridesGivesNone() throws Exception {
        assertSame(Overrides.none(), PluginBridge.overrides(null, null, null));
    }

    @Test
    void overridesAcceptTheWholeRangeOfEachProperty() throws Exception {
        // Long.MIN_VALUE and Long.MAX_VALUE are -2^63 and 2^63-1 (JLS 17 §4.2.1); 2^40 = 1099511627776
        // (closed form), the row limit stated in api.md.
        Overrides low = PluginBridge.overrides("-9223372036854775808", "0", "CSV");
        assertEquals(new Overrides(Long.MIN_VALUE, 0L, OutputFormat.CSV), low);
        Overrides high = PluginBridge.overrides(" 9223372036854775807 ", "1099511627776", "jsonl");
        assertEquals(new Overrides(Long.MAX_VALUE, 1L << 40, OutputFormat.JSONL), high);
        assertEquals(new Overrides(null, 7L, null), PluginBridge.overrides(null, "7", null));
    }

    @Test
    void badSeedNamesThePropertyAndTheRange() {
        // 2^63 = 9223372036854775808 is one past the largest long (JLS 17 §4.2.1).
        for (String bad : List.of("9223372036854775808", "12.5", "seven", "0x10", "+3")) {
            MojoFailureException e = assertThrows(MojoFailureException.class, () -> PluginBridge.overrides(bad, null, null));
            assertEquals("standin.seed must be a 64-bit integer (from -9223372036854775808 to 9223372036854775807): "
                    + bad, e.getMessage());
        }
    }

    @Test
    void badRowsNamesThePropertyAndTheRange() {
        // 2^40 + 1 = 1099511627777 is just past the limit (closed form).
        for (String bad : List.of("-1", "1099511627777", "7.0", "many")) {
            MojoFailureException e = assertThrows(MojoFailureException.class, () -> PluginBridge.overrides(null, bad, null));
            assertEquals("standin.rows must be a whole number from 0 to 2^40 (1099511627776): " + bad, e.getMessage());
        }
        MojoFailureException blank = assertThrows(MojoFailureException.class, () -> PluginBridge.overrides(null, " ", null));
        assertEquals("standin.rows must be a whole number from 0 to 2^40 (1099511627776): \" \"", blank.getMessage());
    }

    @Test
    void badFormatListsTheChoices() {
        MojoFailureException e = assertThrows(MojoFailureException.class, () -> PluginBridge.overrides(null, null, "xml"));
        assertEquals("standin.format must be one of csv, json, jsonl: xml", e.getMessage());
    }

    // --- discovery -------------------------------------------------------------------------------

    @Test
    void discoveryFindsYamlAndYmlAtAnyDepthSortedByPath(@TempDir Path dir) throws Exception {
        for (String name : List.of("zinnia.yaml", "beds/north/tomato.yml", "beds/basil.yaml", "beds/north/Pepper.YAML",
                "aster.yml", "notes.txt", "beds/readme.md", ".draft.yaml", "beds/.cache/old.yaml")) {
            write(dir.resolve(name), "dataset: x\n");
        }
        Files.createDirectories(dir.resolve("empty.yaml.d"));
        List<PluginBridge.SpecSource> found = PluginBridge.findSpecs(dir);
        // Expected by hand: Java String order compares UTF-16 code units, so 'B' (0x42) < 'a' (0x61) and
        // "beds/basil.yaml" < "beds/north/..." since 'b' < 'n' (Java SE 17 String.compareTo).
        List<String> names = found.stream().map(PluginBridge.SpecSource::displayName).collect(Collectors.toList());
        assertEquals(List.of("aster.yml", "beds/basil.yaml", "beds/north/Pepper.YAML", "beds/north/tomato.yml",
                "zinnia.yaml"), names);
        List<String> subdirs = found.stream().map(PluginBridge.SpecSource::outputSubdir).collect(Collectors.toList());
        assertEquals(List.of("", "beds", "beds/north", "beds/north", ""), subdirs);
        assertEquals(dir.resolve("beds/north/tomato.yml"), found.get(3).file());
    }

    @Test
    void givenSpecsKeepTheNamesAsTypedAndIgnoreBlankEntries(@TempDir Path dir) throws Exception {
        List<PluginBridge.SpecSource> given = PluginBridge.givenSpecs("depot/trams.yaml, ,buses.yml,depot/../depot/trams.yaml", dir);
        assertEquals(2, given.size());
        assertEquals("depot/trams.yaml", given.get(0).displayName());
        assertEquals(dir.resolve("depot/trams.yaml"), given.get(0).file());
        assertEquals("", given.get(0).outputSubdir());
        assertEquals("buses.yml", given.get(1).displayName());
        MojoFailureException e = assertThrows(MojoFailureException.class, () -> PluginBridge.givenSpecs(" , ", dir));
        assertEquals("standin.spec must name one or more spec files, comma-separated (e.g. -Dstandin.spec=ferry-crossings.yaml): \" , \"",
                e.getMessage());
    }

    // --- generation ------------------------------------------------------------------------------

    @Test
    void generatesEverySpecKeepingSubfoldersAndLogsOneSummaryEach(@TempDir Path dir) throws Exception {
        Path specs = dir.resolve("specs");
        write(specs.resolve("ovens.yaml"), spec("ovens", ""));
        write(specs.resolve("shops/north/loaves.yml"), spec("loaves", "output:\n  format: jsonl\n"));
        Path out = dir.resolve("out");
        RecordingLog log = new RecordingLog();
        MavenProject project = new MavenProject();
        List<GenerationResult> results = PluginBridge.withLog(log).generateGoal(request(specs, out), project);

        // Data file <dataset>.<format> and <dataset>.report.json beside it, under the spec's sub-folder (api.md).
        List<String> ovens = outputsOf("ovens.yaml", spec("ovens", ""), "", null);
        List<String> loaves = outputsOf("shops/north/loaves.yml", spec("loaves", "output:\n  format: jsonl\n"), "shops/north", null);
        assertEquals(List.of("ovens.csv", "ovens.report.json"), ovens.subList(0, 2));
        assertEquals(List.of("shops/north/loaves.jsonl", "shops/north/loaves.report.json"), loaves.subList(0, 2));
        assertEquals(sortedUnion(ovens, loaves), filesUnder(out));
        assertEquals(2, results.size());
        // One line per dataset: the summary, then the time taken (" in 0.0 s", one decimal).
        assertEquals(2, log.info.size(), log.info.toString());
        for (int i = 0; i < 2; i++) {
            assertTrue(log.info.get(i).matches(java.util.regex.Pattern.quote(results.get(i).summary()) + " in \\d+\\.\\d s"),
                    log.info.get(i));
        }
        assertTrue(log.info.get(0).startsWith("ovens: 3 rows × 1 columns → ovens.csv ("), log.info.get(0));
        // CSV with a header line (RFC 4180 §2.3) and 3 records, each ending in a line break: 4 lines.
        List<String> csv = Files.readAllLines(out.resolve("ovens.csv"), StandardCharsets.UTF_8);
        assertEquals(List.of("tray_no", "1", "2", "3"), csv);
        // JSON Lines: one object per line (jsonlines.org), 3 rows.
        assertEquals(3, Files.readAllLines(out.resolve("shops/north/loaves.jsonl"), StandardCharsets.UTF_8).size());

        List<Resource> resources = project.getTestResources();
        assertEquals(1, resources.size());
        assertEquals(out.toAbsolutePath().toString(), resources.get(0).getDirectory());
        // A second execution into the same folder does not add it twice.
        PluginBridge.withLog(log).generateGoal(request(specs, out), project);
        assertEquals(1, project.getTestResources().size());
    }

    @Test
    void overridesApplyToEverySpec(@TempDir Path dir) throws Exception {
        Path specs = dir.resolve("specs");
        write(specs.resolve("a.yaml"), spec("a", ""));
        write(specs.resolve("b.yaml"), spec("b", "output:\n  format: json\n"));
        Path out = dir.resolve("out");
        PluginBridge.withLog(new RecordingLog()).generateGoal(request(specs, out).overriding("5", "7", "jsonl"), null);
        Overrides jsonl = new Overrides(5L, 7L, OutputFormat.JSONL);
        List<String> a = outputsOf("a.yaml", spec("a", ""), "", jsonl);
        List<String> b = outputsOf("b.yaml", spec("b", "output:\n  format: json\n"), "", jsonl);
        assertEquals(List.of("a.jsonl", "b.jsonl"), List.of(a.get(0), b.get(0)));
        assertEquals(sortedUnion(a, b), filesUnder(out));
        assertEquals(7, Files.readAllLines(out.resolve("b.jsonl")).size());
    }

    @Test
    void specWarningsAreWarnLinesAndTheRepairNoteFollowsTheTime(@TempDir Path dir) throws Exception {
        Path specs = dir.resolve("specs");
        // a ~ b = b ~ c = 0.9 with a ~ c = 0.6 is not positive semidefinite: the determinant
        // 1 + 2(0.9)(0.9)(0.6) - 0.81 - 0.81 - 0.36 = -0.008 < 0 (closed form), so a small nearest
        // repair is made and warned about.
        write(specs.resolve("pumps/pressure.yaml"), "dataset: pressure\nrows: 5\nseed: 3\ncolumns:\n"
                + "  a: {dist: normal, mean: 0, sd: 1}\n  b: {dist: normal, mean: 0, sd: 1}\n  c: {dist: normal, mean: 0, sd: 1}\n"
                + "correlation:\n  pairs: {a ~ b: 0.9, b ~ c: 0.9, a ~ c: 0.6}\n  max-change: 0.05\n");
        RecordingLog log = new RecordingLog();
        PluginBridge.withLog(log).generateGoal(request(specs, dir.resolve("out")), null);
        assertEquals(1, log.warn.size(), log.warn.toString());
        // The pairs mapping starts on line 9, column 10 (counted by hand: "  pairs: " is 9 characters).
        assertTrue(log.warn.get(0).startsWith("pumps/pressure.yaml:9:10: warning: correlation matrix repaired"), log.warn.get(0));
        assertEquals(1, log.info.size(), log.info.toString());
        assertTrue(log.info.get(0).matches("pressure: 5 rows × 3 columns → pumps/pressure\\.csv \\(\\d+ bytes\\) in \\d+\\.\\d s;"
                + " correlation repaired \\(max change 0\\.\\d{4}\\).*"), log.info.get(0));
    }

    @Test
    void theTimeGoesRightAfterTheSizeOrAtTheEnd() {
        String summary = "ferry-crossings: 5000 rows × 4 columns → ferry-crossings.csv (90803 bytes)";
        assertEquals(summary + " in 0.4 s", PluginBridge.summaryLine(summary, 412_000_000L));
        String notes = "; correlation repaired (max change 0.0312); 1 fidelity check(s) FAILED";
        assertEquals(summary + " in 1.0 s" + notes, PluginBridge.summaryLine(summary + notes, 999_000_000L));
        assertEquals("no size here in 0.0 s", PluginBridge.summaryLine("no size here", 0L));
    }

    @Test
    void oneBadSpecFailsWithExactlyItsLinesAndWritesNothing(@TempDir Path dir) throws Exception {
        Path specs = dir.resolve("specs");
        write(specs.resolve("a-good.yaml"), spec("good", ""));
        // "  crust: {dist: normal, mean: 3, sd: -3}" — the value -3 starts at column 38 of line 6
        // (counted by hand: 2 spaces + "crust: {dist: normal, mean: 3, sd: " is 37 characters).
        write(specs.resolve("b/bad.yaml"), spec("bad", "  crust: {dist: normal, mean: 3, sd: -3}\n"));
        Path out = dir.resolve("out");
        MavenProject project = new MavenProject();
        MojoFailureException e = assertThrows(MojoFailureException.class,
                () -> PluginBridge.withLog(new RecordingLog()).generateGoal(request(specs, out), project));
        assertEquals("b/bad.yaml:6:38: normal: sd must be > 0: -3", e.getMessage());
        assertEquals(List.of(), filesUnder(out));
        assertTrue(project.getTestResources().isEmpty());
    }

    @Test
    void twoSpecsWritingTheSameFileFailNamingBoth(@TempDir Path dir) throws Exception {
        Path specs = dir.resolve("specs");
        write(specs.resolve("north.yaml"), spec("tram-shifts", ""));
        write(specs.resolve("south.yml"), spec("tram-shifts", ""));
        Path out = dir.resolve("out");
        MojoFailureException e = assertThrows(MojoFailureException.class,
                () -> PluginBridge.withLog(new RecordingLog()).generateGoal(request(specs, out), null));
        assertEquals("south.yml:1:1: " + String.join(" and ", outputsOf("south.yml", spec("tram-shifts", ""), "", null))
                + " would also be written by north.yaml;"
                + " give one of the specs another dataset name or output file", e.getMessage());
        assertEquals(List.of(), filesUnder(out));
    }

    @Test
    void aDataFileClashingWithAnotherSpecsReportIsCaught(@TempDir Path dir) throws Exception {
        Path specs = dir.resolve("specs");
        // Spec a names its data file after b's report (<dataset>.report.json, api.md).
        write(specs.resolve("a.yaml"), spec("ovens", "output:\n  file: loaves.report.json\n  format: json\n"));
        write(specs.resolve("b.yaml"), spec("loaves", ""));
        MojoFailureException e = assertThrows(MojoFailureException.class,
                () -> PluginBridge.withLog(new RecordingLog()).generateGoal(request(specs, dir.resolve("out")), null));
        assertEquals("b.yaml:1:1: loaves.report.json would also be written by a.yaml;"
                + " give one of the specs another dataset name or output file", e.getMessage());
        assertFalse(Files.exists(dir.resolve("out")));
    }

    @Test
    void outputPathsDifferingOnlyInCaseClash(@TempDir Path dir) throws Exception {
        Path specs = dir.resolve("specs");
        write(specs.resolve("a.yaml"), spec("ledger", "output:\n  file: Ledger.csv\n"));
        write(specs.resolve("b.yaml"), spec("other", "output:\n  file: ledger.CSV\n"));
        Path out = dir.resolve("out");
        MojoFailureException e = assertThrows(MojoFailureException.class,
                () -> PluginBridge.withLog(new RecordingLog()).generateGoal(request(specs, out), null));
        // The mark is that of b.yaml's output file value: line 7 ("  file: ledger.CSV"), column 9.
        assertEquals("b.yaml:7:9: ledger.CSV (as Ledger.csv there; paths that differ only in letter case clash on some"
                + " file systems) would also be written by a.yaml; give one of the specs another dataset name or output file",
                e.getMessage());
        assertFalse(Files.exists(out));
    }

    @Test
    void skipAndMissingFolderWriteNothingAndSayWhy(@TempDir Path dir) throws Exception {
        Path specs = dir.resolve("specs");
        write(specs.resolve("a.yaml"), spec("a", ""));
        Path out = dir.resolve("out");
        RecordingLog log = new RecordingLog();
        // Skipping wins over a bad override value (nothing is read when skipped).
        String why = "standin.skip is true (-Dstandin.skip on the command line)";
        assertEquals(List.of(), PluginBridge.withLog(log).generateGoal(request(specs, out).overriding(null, "lots", null)
                .skipped(why), null));
        assertEquals(List.of("Skipping Standin generation because " + why + "."), log.info);
        assertFalse(Files.exists(out));

        RecordingLog log2 = new RecordingLog();
        Path missing = dir.resolve("no-such-folder");
        assertEquals(List.of(), PluginBridge.withLog(log2).generateGoal(request(missing, out), null));
        assertEquals(List.of("No spec folder at " + missing + "; nothing to generate."), log2.info);
        assertFalse(Files.exists(out));
    }

    @Test
    void specDirectoryThatIsAFileIsAUserError(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("specs");
        write(file, "not a folder");
        MojoFailureException e = assertThrows(MojoFailureException.class,
                () -> PluginBridge.withLog(new RecordingLog()).generateGoal(request(file, dir.resolve("out")), null));
        assertEquals("standin.specDirectory must be a folder: " + file, e.getMessage());
    }

    @Test
    void sampleWritesIntoTheBaseFolderByDefaultAndReportsMissingFiles(@TempDir Path dir) throws Exception {
        write(dir.resolve("docs/ferry.yaml"), spec("ferry", ""));
        RecordingLog log = new RecordingLog();
        PluginBridge.withLog(log).sampleGoal("docs/ferry.yaml", dir, null, null, "2", null);
        assertEquals(List.of("tray_no", "1", "2"), Files.readAllLines(dir.resolve("ferry.csv")));
        assertTrue(Files.exists(dir.resolve("ferry.report.json")));
        assertEquals(1, log.info.size());

        MojoFailureException e = assertThrows(MojoFailureException.class,
                () -> PluginBridge.withLog(log).sampleGoal("docs/ferry.yaml,gone.yaml", dir, Path.of("out"), null, null, null));
        assertEquals("gone.yaml:1:1: no such spec file", e.getMessage());
        assertFalse(Files.exists(dir.resolve("out")));
    }

    @Test
    void anOutputFolderBlockedByAFileIsAnIoFailureNamingThePath(@TempDir Path dir) throws Exception {
        Path specs = dir.resolve("specs");
        write(specs.resolve("a.yaml"), spec("a", ""));
        Path out = dir.resolve("out");
        write(out, "a file where the output folder should be");
        MojoExecutionException e = assertThrows(MojoExecutionException.class,
                () -> PluginBridge.withLog(new RecordingLog()).generateGoal(request(specs, out), null));
        assertTrue(e.getMessage().startsWith("cannot write " + out), e.getMessage());
    }
}
