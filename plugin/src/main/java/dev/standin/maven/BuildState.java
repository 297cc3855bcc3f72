package dev.standin.maven;

import dev.standin.output.AtomicFile;
import dev.standin.output.Json;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.constructor.SafeConstructor;
import org.yaml.snakeyaml.error.YAMLException;

/**
 * What one execution of the {@code generate} goal wrote, kept between builds so that an unchanged
 * spec is not generated again: per spec, the SHA-256 of its bytes, the configuration it was
 * generated with and every file written (path relative to the output folder with '/', size and
 * SHA-256). The state belongs to one output folder; a state recorded for another folder is ignored.
 *
 * <p>Stored as JSON (RFC 8259), UTF-8 with {@code \n} line ends, written to a temporary file beside
 * it and moved into place, so a build that stops half-way leaves the previous state or the new one,
 * never a mixture. It is read back with snakeyaml's safe loader (JSON is valid YAML 1.2 for the
 * strings {@link Json} writes: plain double-quoted escapes only). Immutable.
 */
final class BuildState {

    /** The first line's marker; a file without it (or of another version) is not ours to trust. */
    static final String FORMAT = "standin-maven-plugin incremental state 1";

    /** One written file. */
    record FileState(String path, long bytes, String sha256) {
        FileState {
            Objects.requireNonNull(path, "path");
            Objects.requireNonNull(sha256, "sha256");
        }
    }

    /** What one spec was generated from and what it wrote. */
    record SpecState(String specSha256, Map<String, String> configuration, List<FileState> files) {
        SpecState {
            Objects.requireNonNull(specSha256, "specSha256");
            configuration = java.util.Collections.unmodifiableMap(new TreeMap<>(configuration));
            files = List.copyOf(files);
        }
    }

    private final String outputDirectory;
    private final Map<String, SpecState> specs;

    private BuildState(String outputDirectory, Map<String, SpecState> specs) {
        this.outputDirectory = Objects.requireNonNull(outputDirectory, "outputDirectory");
        this.specs = java.util.Collections.unmodifiableMap(new TreeMap<>(specs));
    }

    /** A state with no specs for the given output folder. */
    static BuildState empty(Path outputDirectory) {
        return new BuildState(key(outputDirectory), Map.of());
    }

    /** A state for the output folder with the given specs (keyed by spec name). */
    static BuildState of(Path outputDirectory, Map<String, SpecState> specs) {
        return new BuildState(key(outputDirectory), specs);
    }

    /** The output folder as recorded: absolute and normalised. */
    static String key(Path outputDirectory) {
        return outputDirectory.toAbsolutePath().normalize().toString();
    }

    String outputDirectory() {
        return outputDirectory;
    }

    /** Spec name ('/'-separated path relative to the spec folder) to its state, sorted by name. */
    Map<String, SpecState> specs() {
        return specs;
    }

    /** The outcome of reading a state file: the state, and a note for the log when it was not usable. */
    record Loaded(BuildState state, String problem) {
    }

    /**
     * Reads the state file for {@code outputDirectory}. A missing file gives an empty state; an
     * unreadable, foreign or damaged one gives an empty state and a problem to log; a state kept for
     * another output folder gives an empty state without a problem (its files are left where they are).
     */
    static Loaded read(Path file, Path outputDirectory) {
        String text;
        try {
            text = Files.readString(file, StandardCharsets.UTF_8);
        } catch (NoSuchFileException e) {
            return new Loaded(empty(outputDirectory), null);
        } catch (IOException e) {
            return new Loaded(empty(outputDirectory), "cannot read " + file + ": " + PluginBridge.reason(e));
        }
        try {
            BuildState state = parse(text);
            if (!state.outputDirectory.equals(key(outputDirectory))) {
                return new Loaded(empty(outputDirectory), null);
            }
            return new Loaded(state, null);
        } catch (IllegalArgumentException | YAMLException | ClassCastException e) {
            return new Loaded(empty(outputDirectory), file + " is not a state file this plugin wrote ("
                    + oneLine(e.getMessage()) + ")");
        }
    }

    private static String oneLine(String s) {
        return s == null ? "unreadable" : s.replaceAll("\\s+", " ").trim();
    }

    static BuildState parse(String text) {
        LoaderOptions options = new LoaderOptions();
        options.setAllowDuplicateKeys(false);
        options.setCodePointLimit(Integer.MAX_VALUE);
        Object root = new Yaml(new SafeConstructor(options)).load(text);
        Map<?, ?> top = map(root, "the state");
        if (!FORMAT.equals(top.get("format"))) {
            throw new IllegalArgumentException("format must be \"" + FORMAT + "\": " + top.get("format"));
        }
        String out = string(top.get("outputDirectory"), "outputDirectory");
        Map<String, SpecState> specs = new LinkedHashMap<>();
        for (Map.Entry<?, ?> e : map(top.get("specs"), "specs").entrySet()) {
            String name = string(e.getKey(), "spec name");
            Map<?, ?> s = map(e.getValue(), "spec " + name);
            Map<String, String> configuration = new LinkedHashMap<>();
            for (Map.Entry<?, ?> c : map(s.get("configuration"), "configuration").entrySet()) {
                configuration.put(string(c.getKey(), "configuration key"),
                        c.getValue() == null ? null : string(c.getValue(), "configuration value"));
            }
            List<FileState> files = new ArrayList<>();
            if (!(s.get("files") instanceof List<?> list)) {
                throw new IllegalArgumentException("files of " + name + " must be a list");
            }
            for (Object item : list) {
                Map<?, ?> f = map(item, "file");
                if (!(f.get("bytes") instanceof Number n)) {
                    throw new IllegalArgumentException("bytes must be a number");
                }
                files.add(new FileState(string(f.get("path"), "path"), n.longValue(), string(f.get("sha256"), "sha256")));
            }
            specs.put(name, new SpecState(string(s.get("specSha256"), "specSha256"), configuration, files));
        }
        return new BuildState(out, specs);
    }

    private static Map<?, ?> map(Object o, String what) {
        if (!(o instanceof Map<?, ?> m)) {
            throw new IllegalArgumentException(what + " must be an object");
        }
        return m;
    }

    private static String string(Object o, String what) {
        if (!(o instanceof String s)) {
            throw new IllegalArgumentException(what + " must be a string");
        }
        return s;
    }

    /** The state as JSON text, keys in a fixed order, ending in a line break. */
    String toJson() {
        Map<String, Object> top = new LinkedHashMap<>();
        top.put("format", FORMAT);
        top.put("outputDirectory", outputDirectory);
        Map<String, Object> all = new LinkedHashMap<>();
        for (Map.Entry<String, SpecState> e : specs.entrySet()) {
            SpecState s = e.getValue();
            Map<String, Object> spec = new LinkedHashMap<>();
            spec.put("specSha256", s.specSha256());
            spec.put("configuration", new LinkedHashMap<String, Object>(s.configuration()));
            List<Object> files = new ArrayList<>();
            for (FileState f : s.files()) {
                Map<String, Object> file = new LinkedHashMap<>();
                file.put("path", f.path());
                file.put("bytes", f.bytes());
                file.put("sha256", f.sha256());
                files.add(file);
            }
            spec.put("files", files);
            all.put(e.getKey(), spec);
        }
        top.put("specs", all);
        return Json.write(top);
    }

    /** Writes the state atomically (temporary file beside it, then a move), creating its folder. */
    void write(Path file) throws IOException {
        try (AtomicFile f = AtomicFile.create(file)) {
            Files.write(f.temp(), toJson().getBytes(StandardCharsets.UTF_8));
            f.commit();
        }
    }
}
