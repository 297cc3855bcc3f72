package dev.standin.maven;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class BuildStateTest {

    private static BuildState sample(Path out) {
        Map<String, String> configuration = new LinkedHashMap<>();
        configuration.put("plugin", "dev.standin:standin-maven-plugin:0.1.0");
        configuration.put("rows", "7");
        configuration.put("seed", null);
        // Names that need JSON escapes (RFC 8259 §7): quote, backslash, a control character, non-ASCII.
        return BuildState.of(out, Map.of("dépôt/\"odd\" name\\x\u0001.yaml", new BuildState.SpecState("ab".repeat(32),
                configuration, List.of(new BuildState.FileState("dépôt/odd.csv", 1L << 40, "cd".repeat(32))))));
    }

    @Test
    void writesJsonThatJacksonReadsAndReadsItBack(@TempDir Path dir) throws Exception {
        Path out = dir.resolve("out");
        Path file = dir.resolve("state/state.json");
        BuildState state = sample(out);
        state.write(file);
        String text = Files.readString(file, StandardCharsets.UTF_8);
        assertTrue(text.endsWith("}\n"));
        // Jackson, an independent JSON parser, reads the same values.
        var root = new ObjectMapper().readTree(text);
        var spec = root.get("specs").get("dépôt/\"odd\" name\\x\u0001.yaml");
        assertEquals(1L << 40, spec.get("files").get(0).get("bytes").asLong());
        assertTrue(spec.get("configuration").get("seed").isNull());

        BuildState.Loaded back = BuildState.read(file, out);
        assertNull(back.problem());
        assertEquals(state.specs(), back.state().specs());
        assertEquals(text, back.state().toJson());
    }

    @Test
    void aStateForAnotherFolderIsEmptyAndAMissingFileIsNoProblem(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("state.json");
        sample(dir.resolve("out")).write(file);
        BuildState.Loaded other = BuildState.read(file, dir.resolve("elsewhere"));
        assertNull(other.problem());
        assertTrue(other.state().specs().isEmpty());
        BuildState.Loaded missing = BuildState.read(dir.resolve("none.json"), dir.resolve("out"));
        assertNull(missing.problem());
        assertTrue(missing.state().specs().isEmpty());
    }

    @Test
    void damagedStatesAreReportedNotTrusted(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("state.json");
        for (String bad : List.of("", "[1, 2]", "{\"format\": \"" + BuildState.FORMAT + "\"}",
                "{\"format\": \"" + BuildState.FORMAT + "\", \"outputDirectory\": \"/x\", \"specs\": {\"a\": {\"specSha256\": \"0\","
                        + " \"configuration\": {}, \"files\": [{\"path\": \"a.csv\", \"bytes\": \"many\", \"sha256\": \"0\"}]}}}",
                "{\"format\": \"" + BuildState.FORMAT + "\", \"outputDirectory\": \"/x\", \"specs\": {\"a\": {\"specSha256\": \"0\"")) {
            Files.writeString(file, bad);
            BuildState.Loaded loaded = BuildState.read(file, Path.of("/x"));
            assertTrue(loaded.problem() != null && loaded.problem().startsWith(file + " is not a state file this plugin wrote ("),
                    bad + " -> " + loaded.problem());
            assertTrue(loaded.state().specs().isEmpty());
        }
    }
}
