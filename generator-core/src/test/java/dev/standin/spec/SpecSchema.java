package dev.standin.spec;

import static org.junit.jupiter.api.Assertions.assertNotNull;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.networknt.schema.Schema;
import com.networknt.schema.SchemaLocation;
import com.networknt.schema.SchemaRegistry;
import com.networknt.schema.SpecificationVersion;
import java.io.IOException;
import java.io.InputStream;
import java.io.StringReader;
import java.math.BigDecimal;
import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;
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
 * Test support for {@link SchemaValidationTest} and {@code fit.FittedSpecSchemaTest} (public only
 * because they live in two packages): the editor schema {@code dev/standin/spec.schema.json} from the
 * class path, compiled by the networknt json-schema-validator under draft 2020-12, and YAML turned into
 * a JSON tree through snakeyaml's node tree with the types the parser gives each scalar: a plain scalar
 * that reads as a number is a number, {@code true}/{@code false} are booleans, YAML nulls are null,
 * everything else (quoted text, dates) is a string.
 */
public final class SpecSchema {

    /** Where the schema lives in the core jar (and so on the test class path). */
    public static final String RESOURCE = "/dev/standin/spec.schema.json";

    private final JsonNode node;
    private final Schema schema;

    private SpecSchema(JsonNode node, Schema schema) {
        this.node = node;
        this.schema = schema;
    }

    /** Reads the schema from the class path and compiles it (draft 2020-12). */
    public static SpecSchema load() throws IOException {
        JsonNode node;
        try (InputStream in = SpecSchema.class.getResourceAsStream(RESOURCE)) {
            assertNotNull(in, RESOURCE + " is not on the class path");
            node = new ObjectMapper().readTree(in);
        }
        Schema schema = SchemaRegistry.withDefaultDialect(SpecificationVersion.DRAFT_2020_12)
                .getSchema(SchemaLocation.of("urn:standin:spec:1"), node);
        return new SpecSchema(node, schema);
    }

    /** The schema document as read. */
    public JsonNode node() {
        return node;
    }

    /** The schema's complaints about a YAML spec, each {@code LOCATION: message}; empty when it passes. */
    public List<String> errors(String yaml) {
        return schema.validate(toJson(yaml)).stream().map(e -> e.getInstanceLocation() + ": " + e.getMessage())
                .collect(Collectors.toList());
    }

    /** A YAML document as a JSON tree with the parser's scalar types (an empty document is null). */
    public static JsonNode toJson(String yaml) {
        Node root = new Yaml(new SafeConstructor(new LoaderOptions())).compose(new StringReader(yaml));
        return root == null ? JsonNodeFactory.instance.nullNode() : toJson(root);
    }

    private static JsonNode toJson(Node n) {
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
            // As YamlMap.number: a plain scalar that BigDecimal reads (a leading '+' allowed) and that is finite.
            String t = text.trim();
            try {
                BigDecimal d = new BigDecimal(t.startsWith("+") ? t.substring(1) : t);
                if (Double.isFinite(d.doubleValue())) {
                    return d.scale() <= 0 && !t.contains(".") && !t.toLowerCase(Locale.ROOT).contains("e")
                            ? f.numberNode(d.toBigIntegerExact()) : f.numberNode(d);
                }
            } catch (NumberFormatException | ArithmeticException e) {
                // not a number: a string
            }
        }
        return f.textNode(text);
    }
}
