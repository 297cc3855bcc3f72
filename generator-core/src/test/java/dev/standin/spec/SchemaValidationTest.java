package dev.standin.spec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.networknt.schema.Error;
import com.networknt.schema.Schema;
import com.networknt.schema.SchemaLocation;
import com.networknt.schema.SchemaRegistry;
import com.networknt.schema.SpecificationVersion;
import java.io.IOException;
import java.lang.reflect.Field;
import java.lang.reflect.Method;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The editor schema {@code dev/standin/spec.schema.json} (shipped in the core jar) checked with an
 * independent JSON Schema validator, networknt json-schema-validator, under draft 2020-12
 * (json-schema.org, "JSON Schema Validation" 2020-12): the schema itself is valid against the draft's
 * meta-schema; every spec the parser accepts (the example specs, whatever is in example-specs/specs
 * when the test runs, the integration-test and benchmark specs, the README's example) passes it;
 * known-bad specs fail it and the parser alike; and its keys and families are exactly the parser's.
 *
 * <p>Schema and YAML-to-JSON conversion come from {@link SpecSchema}: a JSON tree with the types the
 * parser gives each scalar (a plain scalar that reads as a number is a number, {@code true}/{@code false}
 * are booleans, YAML nulls are null, everything else, quoted text and dates, is a string).
 */
class SchemaValidationTest {

    private static SpecSchema schema;
    private static JsonNode schemaNode;
    private static Path repo;

    @BeforeAll
    static void load() throws IOException {
        schema = SpecSchema.load();
        schemaNode = schema.node();
        // The test runs in generator-core/; the repository is its parent.
        repo = Path.of("").toAbsolutePath().getParent();
        assertTrue(Files.isDirectory(repo.resolve("example-specs/specs")), "no example-specs/specs under " + repo);
    }

    private static List<String> parserErrors(String name, String yaml) {
        try {
            SpecParser.withOverrides(null).parse(name, yaml.getBytes(StandardCharsets.UTF_8));
            return List.of();
        } catch (SpecException e) {
            return e.problems().stream().map(SpecProblem::toString).collect(Collectors.toList());
        }
    }

    // --- the schema itself ------------------------------------------------------------------------

    @Test
    void theSchemaIsValidDraft202012() {
        assertEquals("https://json-schema.org/draft/2020-12/schema", schemaNode.get("$schema").asText());
        // The draft's meta-schema, bundled with the validator.
        Schema meta = SchemaRegistry.withDefaultDialect(SpecificationVersion.DRAFT_2020_12)
                .getSchema(SchemaLocation.of("https://json-schema.org/draft/2020-12/schema"));
        List<Error> errors = meta.validate(schemaNode);
        assertEquals(List.of(), errors.stream().map(Error::toString).collect(Collectors.toList()));
    }

    @Test
    void theRepositoryCopyIsTheShippedOne() throws IOException {
        // The README points editors at generator-core/src/main/resources/dev/standin/spec.schema.json.
        JsonNode inRepo = new ObjectMapper().readTree(repo.resolve("generator-core/src/main/resources"
                + SpecSchema.RESOURCE).toFile());
        assertEquals(inRepo, schemaNode);
    }

    // --- every spec the parser accepts passes --------------------------------------------------------

    /** The specs of the repository: examples (whatever is there now), integration tests, benchmarks. */
    private static List<Path> corpus() throws IOException {
        List<Path> specs = new ArrayList<>();
        for (String folder : List.of("example-specs/specs", "it/src/it", "bench")) {
            Path root = repo.resolve(folder);
            if (!Files.isDirectory(root)) {
                continue;
            }
            try (Stream<Path> walk = Files.walk(root)) {
                walk.filter(Files::isRegularFile).filter(p -> {
                    String n = p.getFileName().toString().toLowerCase(Locale.ROOT);
                    return (n.endsWith(".yaml") || n.endsWith(".yml")) && !p.toString().contains("/target/");
                }).sorted().forEach(specs::add);
            }
        }
        return specs;
    }

    @Test
    void everyExampleSpecPassesTheSchemaAndTheParser() throws IOException {
        List<Path> examples;
        try (Stream<Path> walk = Files.walk(repo.resolve("example-specs/specs"))) {
            examples = walk.filter(p -> p.toString().endsWith(".yaml") || p.toString().endsWith(".yml")).sorted()
                    .collect(Collectors.toList());
        }
        assertFalse(examples.isEmpty());
        for (Path p : examples) {
            String yaml = Files.readString(p, StandardCharsets.UTF_8);
            String name = repo.relativize(p).toString();
            assertEquals(List.of(), parserErrors(name, yaml), name + " (parser)");
            assertEquals(List.of(), schema.errors(yaml), name + " (schema)");
        }
    }

    @Test
    void everySpecTheParserAcceptsPassesTheSchema() throws IOException {
        int accepted = 0;
        for (Path p : corpus()) {
            String yaml = Files.readString(p, StandardCharsets.UTF_8);
            String name = repo.relativize(p).toString();
            if (parserErrors(name, yaml).isEmpty()) {
                accepted++;
                assertEquals(List.of(), schema.errors(yaml), name);
            }
        }
        assertTrue(accepted >= 10, "only " + accepted + " specs found");
    }

    @Test
    void theReadmeExamplePassesTheSchema() throws IOException {
        String readme = Files.readString(repo.resolve("README.md"), StandardCharsets.UTF_8);
        Matcher m = Pattern.compile("## A spec\\s+```yaml\\n(.*?)```", Pattern.DOTALL).matcher(readme);
        assertTrue(m.find(), "README.md has no yaml block under '## A spec'");
        assertEquals(List.of(), parserErrors("README.md", m.group(1)));
        assertEquals(List.of(), schema.errors(m.group(1)));
    }

    // --- every parameterisation and key, by hand -------------------------------------------------

    private static String spec(String column, String rest) {
        return "dataset: probe\nrows: 10\nseed: 1\ncolumns:\n  id: {dist: sequence}\n  x: " + column + "\n"
                + "  y: {dist: normal, mean: 0, sd: 1}\n" + rest;
    }

    @Test
    void everyParameterisationAndOptionalKeyIsAccepted() {
        // One column per family and parameterisation (README "Columns" table), with the optional keys.
        List<String> columns = List.of(
                "{dist: normal, mean: 10, sd: 2, min: 0, max: 30, decimals: 1, nulls: 0.1}",
                "{dist: lognormal, meanlog: 1, sdlog: 0.5}",
                "{dist: lognormal, mean: 48, sd: 15, decimals: 2}",
                "{dist: uniform, min: 0, max: 30, decimals: 0, nulls: 0.02}",
                "{dist: triangular, min: 1, mode: 2, max: 5}",
                "{dist: exponential, rate: 0.5, max: 20}",
                "{dist: exponential, mean: 2}",
                "{dist: gamma, shape: 2, scale: 3}",
                "{dist: gamma, shape: 2, rate: 0.5}",
                "{dist: gamma, mean: 6, sd: 3, min: 1}",
                "{dist: beta, alpha: 2, beta: 5}",
                "{dist: beta, mean: 0.3, sd: 0.1}",
                "{dist: weibull, shape: 1.5, scale: 10}",
                "{dist: quantiles, points: {0: 1, 0.5: 4, 1: 20}, decimals: 2}",
                "{dist: poisson, mean: 3.5, max: 20}",
                "{dist: binomial, trials: 10, p: 0.3}",
                "{dist: negbinomial, mean: 4, sd: 3}",
                "{dist: negbinomial, size: 2, p: 0.4}",
                "{dist: bernoulli, p: 0.2, nulls: 0.1}",
                "{dist: categorical, levels: {upper: 3, lower: 5, cabin: 1}}",
                "{dist: categorical, levels: [deck, saloon, 3]}",
                "{dist: date, from: 2026-04-01, to: 2026-09-30}",
                "{dist: timestamp, from: 2026-04-01T08:30:00Z, to: \"2026-04-02T00:00:00+02:00\"}",
                "{dist: sequence, start: -5, step: 2}");
        for (String c : columns) {
            String yaml = spec(c, "");
            assertEquals(List.of(), parserErrors("probe.yaml", yaml), c + " (parser)");
            assertEquals(List.of(), schema.errors(yaml), c + " (schema)");
        }
        List<String> blocks = List.of(
                "correlation:\n  measure: spearman\n  pairs:\n    x ~ y: 0.3\n  repair: clip\n  max-change: 0.1\n",
                "correlation:\n  measure: kendall\n  pairs: {\"x~y\": -0.2}\n",
                "correlation:\n  measure: latent\n  order: [x, y]\n  matrix: [[1, 0.5], [0.5, 1]]\n  repair: fail\n",
                "output:\n  format: CSV\n  file: out/probe-1.csv\n  header: false\n  delimiter: \";\"\n  null: \"NA\"\n"
                        + "  guard-formulas: true\n",
                "output:\n  format: jsonl\n");
        for (String b : blocks) {
            String yaml = spec("{dist: normal, mean: 10, sd: 2}", b);
            assertEquals(List.of(), parserErrors("probe.yaml", yaml), b + " (parser)");
            assertEquals(List.of(), schema.errors(yaml), b + " (schema)");
        }
    }

    // --- known-bad specs ----------------------------------------------------------------------------

    @Test
    void knownBadSpecsFailTheSchemaAsTheyFailTheParser() {
        String good = "{dist: normal, mean: 10, sd: 2}";
        Map<String, String> bad = new java.util.LinkedHashMap<>();
        bad.put("unknown top-level key", spec(good, "colour: blue\n"));
        bad.put("unknown column key", spec("{dist: normal, mean: 10, sd: 2, median: 3}", ""));
        bad.put("unknown dist", spec("{dist: gaussian, mean: 10, sd: 2}", ""));
        bad.put("missing parameter", spec("{dist: normal, mean: 10}", ""));
        bad.put("missing dist", spec("{mean: 10, sd: 2}", ""));
        bad.put("missing seed", spec(good, "").replace("seed: 1\n", ""));
        bad.put("two parameterisations at once", spec("{dist: gamma, shape: 2, scale: 3, rate: 1}", ""));
        bad.put("half of each parameterisation", spec("{dist: lognormal, meanlog: 1, sd: 2}", ""));
        bad.put("rows of the wrong type", spec(good, "").replace("rows: 10", "rows: many"));
        bad.put("quoted number", spec("{dist: normal, mean: 10, sd: \"2\"}", ""));
        bad.put("header of the wrong type", spec(good, "output:\n  header: yes\n"));
        bad.put("levels of the wrong type", spec("{dist: categorical, levels: 5}", ""));
        bad.put("min on a family without bounds", spec("{dist: bernoulli, p: 0.5, min: 0}", ""));
        bad.put("decimals on an integer family", spec("{dist: poisson, mean: 3, decimals: 1}", ""));
        bad.put("nulls of 1", spec("{dist: normal, mean: 10, sd: 2, nulls: 1}", ""));
        bad.put("decimals above 15", spec("{dist: normal, mean: 10, sd: 2, decimals: 16}", ""));
        bad.put("negative sd", spec("{dist: normal, mean: 10, sd: -2}", ""));
        bad.put("nulls on a sequence", spec("{dist: sequence, nulls: 0.1}", ""));
        bad.put("pair without ~", spec(good, "correlation:\n  pairs:\n    x and y: 0.4\n"));
        bad.put("pairs and a matrix", spec(good, "correlation:\n  pairs: {x ~ y: 0.4}\n  order: [x, y]\n"
                + "  matrix: [[1, 0.4], [0.4, 1]]\n"));
        bad.put("neither pairs nor a matrix", spec(good, "correlation:\n  measure: pearson\n"));
        bad.put("unknown measure", spec(good, "correlation:\n  measure: cosine\n  pairs: {x ~ y: 0.4}\n"));
        bad.put("unknown repair", spec(good, "correlation:\n  pairs: {x ~ y: 0.4}\n  repair: nearest-ish\n"));
        bad.put("max-change above 2", spec(good, "correlation:\n  pairs: {x ~ y: 0.4}\n  max-change: 3\n"));
        bad.put("unknown format", spec(good, "output:\n  format: xml\n"));
        bad.put("output file leaving the folder", spec(good, "output:\n  file: ../probe.csv\n"));
        bad.put("output file named for a device", spec(good, "output:\n  file: nul.csv\n"));
        bad.put("two-character delimiter", spec(good, "output:\n  delimiter: \";;\"\n"));
        bad.put("upper-case dataset", spec(good, "").replace("dataset: probe", "dataset: Probe"));
        bad.put("no columns", "dataset: probe\nrows: 10\nseed: 1\ncolumns: {}\n");
        bad.put("date not ISO", spec("{dist: date, from: 2026/04/01, to: 2026-09-30}", ""));
        bad.put("column name with ~", spec(good, "").replace("  y: ", "  y~z: "));
        for (Map.Entry<String, String> e : bad.entrySet()) {
            assertFalse(parserErrors("probe.yaml", e.getValue()).isEmpty(), e.getKey() + ": the parser accepts it");
            assertFalse(schema.errors(e.getValue()).isEmpty(), e.getKey() + ": the schema accepts it");
        }
    }

    // --- the schema's keys are the parser's ----------------------------------------------------------

    @SuppressWarnings("unchecked")
    private static <T> T privateStatic(Class<?> type, String field) throws ReflectiveOperationException {
        Field f = type.getDeclaredField(field);
        f.setAccessible(true);
        return (T) f.get(null);
    }

    private static TreeSet<String> names(JsonNode object) {
        TreeSet<String> s = new TreeSet<>();
        object.fieldNames().forEachRemaining(s::add);
        return s;
    }

    @Test
    void theSchemaHasExactlyTheParsersKeysAndFamilies() throws ReflectiveOperationException {
        JsonNode defs = schemaNode.get("$defs");
        List<String> top = privateStatic(SpecParser.class, "TOP_KEYS");
        List<String> output = privateStatic(SpecParser.class, "OUTPUT_KEYS");
        List<String> correlation = privateStatic(CorrelationReader.class, "KEYS");
        assertEquals(new TreeSet<>(top), names(schemaNode.get("properties")));
        assertEquals(new TreeSet<>(output), names(defs.get("output").get("properties")));
        assertEquals(new TreeSet<>(correlation), names(defs.get("correlation").get("properties")));

        List<String> families = ColumnReader.families();
        List<String> inSchema = new ArrayList<>();
        defs.get("column").get("properties").get("dist").get("enum").forEach(n -> inSchema.add(n.asText()));
        assertEquals(families, inSchema);

        // Each family's keys as ColumnReader.read allows them: dist, every parameter of every form, the
        // other keys, min/max when they truncate, decimals when the family has them, and nulls.
        Map<String, Object> table = privateStatic(ColumnReader.class, "FAMILIES");
        for (Map.Entry<String, Object> e : table.entrySet()) {
            Object family = e.getValue();
            TreeSet<String> allowed = new TreeSet<>(List.of("dist", "nulls"));
            for (List<String> form : ColumnReaderAccess.<List<List<String>>>get(family, "forms")) {
                allowed.addAll(form);
            }
            allowed.addAll(ColumnReaderAccess.<List<String>>get(family, "otherKeys"));
            if (ColumnReaderAccess.get(family, "bounds").toString().equals("TRUNCATE")) {
                allowed.addAll(List.of("min", "max"));
            }
            if (ColumnReaderAccess.<Boolean>get(family, "decimals")) {
                allowed.add("decimals");
            }
            assertEquals(allowed, names(defs.get(e.getKey()).get("properties")), e.getKey());
        }
        assertEquals(new TreeSet<>(List.of("dist", "start", "step")), names(defs.get("sequence").get("properties")));
    }

    /** Reads a component of ColumnReader's private Family record. */
    private static final class ColumnReaderAccess {
        @SuppressWarnings("unchecked")
        static <T> T get(Object record, String component) throws ReflectiveOperationException {
            Method m = record.getClass().getDeclaredMethod(component);
            m.setAccessible(true);
            return (T) m.invoke(record);
        }
    }

    @Test
    void theConverterGivesTheParsersTypes() {
        // The YAML-to-JSON step must not hide type errors: quoted numbers stay strings, yes/no stay text.
        JsonNode n = SpecSchema.toJson("a: 1\nb: \"1\"\nc: 1.5e3\nd: yes\ne: true\nf: ~\ng: 2026-04-01\nh: +7\n");
        assertTrue(n.get("a").isIntegralNumber());
        assertTrue(n.get("b").isTextual());
        assertTrue(n.get("c").isNumber());
        assertTrue(n.get("d").isTextual());
        assertTrue(n.get("e").isBoolean());
        assertTrue(n.get("f").isNull());
        assertTrue(n.get("g").isTextual());
        assertEquals(7, n.get("h").asInt());
        Iterator<String> keys = n.fieldNames();
        assertEquals("a", keys.next());
    }
}
