package dev.standin.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.networknt.schema.Schema;
import com.networknt.schema.SchemaLocation;
import com.networknt.schema.SchemaRegistry;
import com.networknt.schema.SpecificationVersion;
import java.io.InputStream;
import java.io.StringReader;
import java.math.BigDecimal;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.yaml.snakeyaml.DumperOptions;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.constructor.SafeConstructor;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;
import org.yaml.snakeyaml.nodes.Tag;

/**
 * Fitted specs validate against the project's JSON Schema of the spec format
 * (dev/standin/spec.schema.json, draft 2020-12), checked with the networknt json-schema-validator
 * (test scope). YAML becomes JSON with the parser's scalar rules: plain numbers as numbers, booleans
 * and null by YAML's tags, everything else text.
 */
class FittedSpecSchemaTest {

    static Schema schema;

    @BeforeAll
    static void load() throws Exception {
        try (InputStream in = FittedSpecSchemaTest.class.getResourceAsStream("/dev/standin/spec.schema.json")) {
            assertNotNull(in, "spec.schema.json is not on the class path");
            JsonNode node = new ObjectMapper().readTree(in);
            schema = SchemaRegistry.withDefaultDialect(SpecificationVersion.DRAFT_2020_12)
                    .getSchema(SchemaLocation.of("urn:standin:spec:1"), node);
        }
    }

    static JsonNode toJson(Node n) {
        JsonNodeFactory f = JsonNodeFactory.instance;
        if (n instanceof MappingNode m) {
            ObjectNode o = f.objectNode();
            for (NodeTuple t : m.getValue()) {
                o.set(((ScalarNode) t.getKeyNode()).getValue(), toJson(t.getValueNode()));
            }
            return o;
        }
        if (n instanceof SequenceNode s) {
            ArrayNode a = f.arrayNode();
            s.getValue().forEach(item -> a.add(toJson(item)));
            return a;
        }
        ScalarNode s = (ScalarNode) n;
        String text = s.getValue();
        if (s.getTag().equals(Tag.NULL)) {
            return f.nullNode();
        }
        if (s.getTag().equals(Tag.BOOL) && (text.equalsIgnoreCase("true") || text.equalsIgnoreCase("false"))) {
            return f.booleanNode(text.equalsIgnoreCase("true"));
        }
        if (s.getScalarStyle() == DumperOptions.ScalarStyle.PLAIN) {
            String t = text.trim();
            try {
                BigDecimal d = new BigDecimal(t.startsWith("+") ? t.substring(1) : t);
                if (Double.isFinite(d.doubleValue())) {
                    return d.scale() <= 0 && !t.contains(".") && !t.toLowerCase(Locale.ROOT).contains("e")
                            ? f.numberNode(d.toBigIntegerExact()) : f.numberNode(d);
                }
            } catch (NumberFormatException | ArithmeticException e) {
                // text
            }
        }
        return f.textNode(text);
    }

    static List<String> errors(String yaml) {
        Node root = new Yaml(new SafeConstructor(new LoaderOptions())).compose(new StringReader(yaml));
        return schema.validate(toJson(root)).stream().map(e -> e.getInstanceLocation() + ": " + e.getMessage())
                .collect(Collectors.toList());
    }

    @Test
    void theIrisSpecValidates() throws Exception {
        FitResult fit = Fitter.fit(CsvReader.read(Path.of("src/test/resources/dev/standin/fit/iris.csv"), "iris.csv"),
                FitOptions.defaults());
        assertEquals(List.of(), errors(fit.specText()));
        assertTrue(fit.specText().contains("\n  guard-formulas: true\n"), fit.specText());
    }

    @Test
    void theBakerySpecWithSequencesDatesBooleansAndNullsValidates() throws Exception {
        PrivacySafeguardsTest.fitBakery();
        assertEquals(List.of(), errors(PrivacySafeguardsTest.fit.specText()));
    }

    @Test
    void aSchemaViolationIsSeen() {
        // the check can fail: a fitted-looking spec with a key the format does not have
        assertTrue(!errors("dataset: x\nrows: 1\nseed: 1\ncolumns:\n  a: {dist: normal, mean: 0, sd: 1, tails: 2}\n").isEmpty());
    }
}
