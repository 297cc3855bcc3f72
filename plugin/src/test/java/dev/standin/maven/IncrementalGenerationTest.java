package dev.standin.maven;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.standin.engine.GenerationResult;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.apache.maven.plugin.MojoFailureException;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The incremental rule of the {@code generate} goal, driven through {@link PluginBridge} with a real
 * state file. Expected outcomes follow from the rule as documented on
 * {@link PluginBridge#generateGoal}; file contents are checked with the JDK's own SHA-256 and
 * Jackson (independent of the plugin's code), timestamps through {@link Files#getLastModifiedTime}.
 */
class IncrementalGenerationTest {

    /** A time no build of this test writes at: 2001-01-01T00:00:00Z. */
    private static final FileTime LONG_AGO = FileTime.fromMillis(978_307_200_000L);

    @TempDir
    Path dir;
    private Path specs;
    private Path out;
    private Path state;

    @BeforeEach
    void layOut() throws IOException {
        specs = dir.resolve("specs");
        out = dir.resolve("out");
        state = dir.resolve("target/maven-status/standin-maven-plugin/generate/default/state.json");
        write(specs.resolve("ovens.yaml"), spec("ovens", 3, ""));
        write(specs.resolve("shops/north/loaves.yml"), spec("loaves", 4, ""));
    }

    private static String spec(String dataset, int rows, String extra) {
        return "dataset: " + dataset + "\nrows: " + rows + "\nseed: 11\ncolumns:\n"
                + "  tray_no: {dist: sequence, start: 1, step: 1}\n" + extra;
    }

    private static void write(Path file, String text) throws IOException {
        Files.createDirectories(file.getParent());
        Files.write(file, text.getBytes(StandardCharsets.UTF_8));
    }

    /** What the core says the two specs write (see {@link PluginBridgeTest#outputsOf}), for the given format. */
    private List<String> outputs(String format) throws Exception {
        dev.standin.spec.Overrides o = format == null ? null
                : new dev.standin.spec.Overrides(null, null, dev.standin.spec.OutputFormat.parse(format).orElseThrow());
        return PluginBridgeTest.sortedUnion(PluginBridgeTest.outputsOf("ovens.yaml", spec("ovens", 3, ""), "", o),
                PluginBridgeTest.outputsOf("shops/north/loaves.yml", spec("loaves", 4, ""), "shops/north", o));
    }

    private List<String> loavesOutputs() throws Exception {
        return PluginBridgeTest.outputsOf("shops/north/loaves.yml", spec("loaves", 4, ""), "shops/north", null);
    }

    private List<String> ovensOutputs() throws Exception {
        return PluginBridgeTest.outputsOf("ovens.yaml", spec("ovens", 3, ""), "", null);
    }

    private PluginBridge.GenerateRequest request() {
        return PluginBridge.GenerateRequest.of(specs, out).withState(state, Map.of("plugin", "p:1", "code", "c1"));
    }

    private List<GenerationResult> run(PluginBridge.GenerateRequest request, PluginBridgeTest.RecordingLog log)
            throws Exception {
        return PluginBridge.withLog(log).generateGoal(request, null);
    }

    private List<String> files() throws IOException {
        if (!Files.exists(out)) {
            return List.of();
        }
        try (Stream<Path> walk = Files.walk(out)) {
            return walk.filter(Files::isRegularFile).map(p -> out.relativize(p).toString().replace('\\', '/')).sorted()
                    .collect(Collectors.toList());
        }
    }

    /** Sets every output's time to {@link #LONG_AGO}, so a rewrite would show. */
    private void backdate() throws IOException {
        for (String f : files()) {
            Files.setLastModifiedTime(out.resolve(f), LONG_AGO);
        }
    }

    private Map<String, FileTime> times() throws IOException {
        Map<String, FileTime> t = new TreeMap<>();
        for (String f : files()) {
            t.put(f, Files.getLastModifiedTime(out.resolve(f)));
        }
        return t;
    }

    private static String sha256(Path file) throws Exception {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(file)));
    }

    @Test
    void anUnchangedBuildIsUpToDateAndTouchesNothing() throws Exception {
        PluginBridgeTest.RecordingLog first = new PluginBridgeTest.RecordingLog();
        assertEquals(2, run(request(), first).size());
        List<String> expected = outputs(null);
        assertTrue(expected.containsAll(List.of("ovens.csv", "ovens.report.json", "shops/north/loaves.csv",
                "shops/north/loaves.report.json")), expected.toString());
        assertEquals(expected, files());
        backdate();
        // The folder's own time changes when an entry is created or removed in it (POSIX rename/unlink
        // update the directory's mtime), so the second build must not even take the folder's lock file.
        Files.setLastModifiedTime(out, LONG_AGO);
        byte[] stateBefore = Files.readAllBytes(state);

        PluginBridgeTest.RecordingLog second = new PluginBridgeTest.RecordingLog();
        assertEquals(List.of(), run(request(), second));
        assertEquals(List.of("2 of 2 specs up to date, 0 to generate (-Dstandin.force regenerates all)"), second.info);
        assertEquals(expected, files());
        for (FileTime t : times().values()) {
            assertEquals(LONG_AGO, t);
        }
        assertEquals(LONG_AGO, Files.getLastModifiedTime(out));
        assertEquals(new String(stateBefore, StandardCharsets.UTF_8), Files.readString(state));
    }

    @Test
    void theStateRecordsEverySpecAndFileWithItsHash() throws Exception {
        run(request().overriding(null, "2", null), new PluginBridgeTest.RecordingLog());
        // Read with Jackson (an independent JSON parser, RFC 8259), hashes with the JDK's SHA-256.
        String text = Files.readString(state, StandardCharsets.UTF_8);
        assertFalse(text.contains("\r"));
        JsonNode root = new ObjectMapper().readTree(text);
        assertEquals(BuildState.FORMAT, root.get("format").asText());
        assertEquals(out.toAbsolutePath().normalize().toString(), root.get("outputDirectory").asText());
        JsonNode loaves = root.get("specs").get("shops/north/loaves.yml");
        assertEquals(sha256(specs.resolve("shops/north/loaves.yml")), loaves.get("specSha256").asText());
        assertEquals("2", loaves.get("configuration").get("rows").asText());
        assertTrue(loaves.get("configuration").get("seed").isNull());
        assertEquals("c1", loaves.get("configuration").get("code").asText());
        JsonNode files = loaves.get("files");
        List<String> paths = new java.util.ArrayList<>();
        files.forEach(f -> paths.add(f.get("path").asText()));
        assertEquals(loavesOutputs(), paths);
        for (JsonNode f : files) {
            Path p = out.resolve(f.get("path").asText());
            assertEquals(Files.size(p), f.get("bytes").asLong());
            assertEquals(sha256(p), f.get("sha256").asText());
        }
        // The state is written atomically: no temporary file is left beside it.
        try (Stream<Path> beside = Files.list(state.getParent())) {
            assertEquals(List.of("state.json"), beside.map(p -> p.getFileName().toString()).collect(Collectors.toList()));
        }
    }

    @Test
    void aChangedSpecAloneIsRegenerated() throws Exception {
        run(request(), new PluginBridgeTest.RecordingLog());
        backdate();
        write(specs.resolve("ovens.yaml"), spec("ovens", 5, ""));
        PluginBridgeTest.RecordingLog log = new PluginBridgeTest.RecordingLog();
        List<GenerationResult> results = run(request(), log);
        assertEquals(List.of("ovens"), results.stream().map(GenerationResult::dataset).collect(Collectors.toList()));
        assertEquals("1 of 2 specs up to date, 1 to generate (-Dstandin.force regenerates all)", log.info.get(0));
        assertTrue(log.info.get(1).startsWith("ovens: 5 rows × 1 columns → ovens.csv ("), log.info.get(1));
        // CSV header plus 5 records (RFC 4180 §2.3).
        assertEquals(6, Files.readAllLines(out.resolve("ovens.csv")).size());
        Map<String, FileTime> t = times();
        assertEquals(LONG_AGO, t.get("shops/north/loaves.csv"));
        assertEquals(LONG_AGO, t.get("shops/north/loaves.report.json"));
        assertTrue(t.get("ovens.csv").compareTo(LONG_AGO) > 0);
    }

    @Test
    void aMissingOrEditedOutputIsRegenerated() throws Exception {
        run(request(), new PluginBridgeTest.RecordingLog());
        byte[] original = Files.readAllBytes(out.resolve("ovens.csv"));
        Files.delete(out.resolve("shops/north/loaves.report.json"));
        // Same size, other bytes: only the hash can tell.
        byte[] edited = original.clone();
        edited[edited.length - 2] = (byte) (edited[edited.length - 2] == '9' ? '8' : '9');
        Files.write(out.resolve("ovens.csv"), edited);
        List<GenerationResult> results = run(request(), new PluginBridgeTest.RecordingLog());
        assertEquals(2, results.size());
        assertTrue(Files.exists(out.resolve("shops/north/loaves.report.json")));
        assertEquals(HexFormat.of().formatHex(original), HexFormat.of().formatHex(Files.readAllBytes(out.resolve("ovens.csv"))));
    }

    @Test
    void aConfigurationOrCodeChangeRegeneratesAndDropsFilesNoLongerWritten() throws Exception {
        run(request(), new PluginBridgeTest.RecordingLog());
        PluginBridgeTest.RecordingLog log = new PluginBridgeTest.RecordingLog();
        assertEquals(2, run(request().overriding(null, null, "jsonl"), log).size());
        assertEquals(outputs("jsonl"), files());
        assertTrue(log.info.contains("Deleted ovens.csv (no longer written by ovens.yaml)"), log.info.toString());

        PluginBridge.GenerateRequest newCode = PluginBridge.GenerateRequest.of(specs, out).overriding(null, null, "jsonl")
                .withState(state, Map.of("plugin", "p:1", "code", "c2"));
        assertEquals(2, run(newCode, new PluginBridgeTest.RecordingLog()).size());
        assertEquals(List.of(), run(newCode, new PluginBridgeTest.RecordingLog()));
    }

    @Test
    void aRemovedSpecsOutputsAndEmptiedFoldersAreDeleted() throws Exception {
        run(request(), new PluginBridgeTest.RecordingLog());
        Files.delete(specs.resolve("shops/north/loaves.yml"));
        PluginBridgeTest.RecordingLog log = new PluginBridgeTest.RecordingLog();
        assertEquals(List.of(), run(request(), log));
        assertEquals(PluginBridgeTest.sortedUnion(ovensOutputs()), files());
        assertFalse(Files.exists(out.resolve("shops")));
        assertEquals(List.of("1 of 1 spec up to date, 0 to generate (-Dstandin.force regenerates all)",
                "Deleted " + String.join(", ", loavesOutputs()) + " (its spec shops/north/loaves.yml is gone)"), log.info);
        JsonNode root = new ObjectMapper().readTree(state.toFile());
        assertEquals(List.of("ovens.yaml"), iterate(root.get("specs").fieldNames()));
    }

    @Test
    void aRenamedSpecKeepsItsFilesWhenTheyAreStillWritten() throws Exception {
        run(request(), new PluginBridgeTest.RecordingLog());
        Files.move(specs.resolve("ovens.yaml"), specs.resolve("ovens-renamed.yaml"));
        PluginBridgeTest.RecordingLog log = new PluginBridgeTest.RecordingLog();
        assertEquals(1, run(request(), log).size());
        // Same dataset, same folder: the new spec writes the same two files, which must survive.
        assertEquals(outputs(null), files());
        assertFalse(log.info.stream().anyMatch(l -> l.startsWith("Deleted")), log.info.toString());
    }

    @Test
    void aStaleFileThatWasEditedIsKeptWithAWarning() throws Exception {
        run(request(), new PluginBridgeTest.RecordingLog());
        write(out.resolve("shops/north/loaves.csv"), "hand-edited\n");
        Files.delete(specs.resolve("shops/north/loaves.yml"));
        PluginBridgeTest.RecordingLog log = new PluginBridgeTest.RecordingLog();
        run(request(), log);
        assertEquals(List.of("Kept shops/north/loaves.csv although its spec shops/north/loaves.yml is gone: it changed"
                + " since Standin wrote it"), log.warn);
        assertEquals("hand-edited\n", Files.readString(out.resolve("shops/north/loaves.csv")));
        assertFalse(Files.exists(out.resolve("shops/north/loaves.report.json")));
    }

    @Test
    void forceRegeneratesEverything() throws Exception {
        run(request(), new PluginBridgeTest.RecordingLog());
        PluginBridgeTest.RecordingLog log = new PluginBridgeTest.RecordingLog();
        String why = "standin.force is true (-Dstandin.force on the command line)";
        assertEquals(2, run(request().forced(why), log).size());
        assertEquals("Regenerating every spec because " + why + ".", log.info.get(0));
    }

    @Test
    void aDamagedStateIsIgnoredWithAWarning() throws Exception {
        run(request(), new PluginBridgeTest.RecordingLog());
        write(state, "{\"format\": \"something else\"}\n");
        PluginBridgeTest.RecordingLog log = new PluginBridgeTest.RecordingLog();
        assertEquals(2, run(request(), log).size());
        assertEquals(1, log.warn.size(), log.warn.toString());
        assertTrue(log.warn.get(0).startsWith("Ignoring the incremental state: " + state + " is not a state file this"
                + " plugin wrote (format must be"), log.warn.get(0));
        // and it is replaced by a good one
        assertEquals(List.of(), run(request(), new PluginBridgeTest.RecordingLog()));
    }

    @Test
    void anotherOutputFolderStartsAfreshAndLeavesTheOldOneAlone() throws Exception {
        run(request(), new PluginBridgeTest.RecordingLog());
        List<String> before = files();
        Path other = dir.resolve("other");
        PluginBridge.GenerateRequest moved = PluginBridge.GenerateRequest.of(specs, other)
                .withState(state, Map.of("plugin", "p:1", "code", "c1"));
        assertEquals(2, run(moved, new PluginBridgeTest.RecordingLog()).size());
        assertEquals(before, files());
        assertTrue(Files.exists(other.resolve("shops/north/loaves.csv")));
    }

    @Test
    void aNewSpecClashingWithAnUpToDateOneFailsNamingBothAndWritesNothing() throws Exception {
        run(request(), new PluginBridgeTest.RecordingLog());
        backdate();
        write(specs.resolve("shops/north/rolls.yaml"), spec("loaves", 9, ""));
        MojoFailureException e = assertThrows(MojoFailureException.class,
                () -> run(request(), new PluginBridgeTest.RecordingLog()));
        // "shops/north/loaves.yml" < "shops/north/rolls.yaml" ('l' < 'r'), so the new spec is the later claimant.
        assertEquals("shops/north/rolls.yaml:1:1: " + String.join(" and ", loavesOutputs()) + " would also be"
                + " written by shops/north/loaves.yml; give one of the specs another dataset name or output file",
                e.getMessage());
        for (FileTime t : times().values()) {
            assertEquals(LONG_AGO, t);
        }
    }

    @Test
    void removingEverySpecDeletesEveryOutput() throws Exception {
        run(request(), new PluginBridgeTest.RecordingLog());
        Files.delete(specs.resolve("ovens.yaml"));
        Files.delete(specs.resolve("shops/north/loaves.yml"));
        PluginBridgeTest.RecordingLog log = new PluginBridgeTest.RecordingLog();
        run(request(), log);
        assertEquals(List.of(), files());
        assertEquals("No *.yaml or *.yml specs under " + specs + "; nothing to generate.", log.info.get(0));
    }

    private static List<String> iterate(java.util.Iterator<String> it) {
        List<String> l = new java.util.ArrayList<>();
        it.forEachRemaining(l::add);
        return l;
    }
}
