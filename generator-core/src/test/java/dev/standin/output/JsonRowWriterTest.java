package dev.standin.output;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.StringWriter;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * JSON and JSON Lines output read back with Jackson (an independent RFC 8259 parser, strict about
 * unescaped control characters and trailing content). RFC 8259 section 7: quotation mark, reverse
 * solidus and the control characters U+0000..U+001F must be escaped in strings.
 */
class JsonRowWriterTest {

    private final ObjectMapper mapper = new ObjectMapper()
            .enable(DeserializationFeature.USE_BIG_DECIMAL_FOR_FLOATS)
            .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
            .enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION);

    private static String write(boolean array, List<String> names, CellKind[] kinds, String[]... rows) throws IOException {
        StringWriter out = new StringWriter();
        RowWriter w = array ? JsonRowWriter.array(out, names, kinds) : JsonRowWriter.lines(out, names, kinds);
        w.begin();
        for (String[] r : rows) {
            w.row(r);
        }
        w.end();
        return out.toString();
    }

    /** Every character from U+0000 to U+007F, plus U+2028, U+2029, a non-BMP character and text. */
    private static String awkwardText() {
        StringBuilder sb = new StringBuilder();
        for (char c = 0; c < 0x80; c++) {
            sb.append(c);
        }
        return sb.append("\u2028\u2029 gr\u00fc\u00df \uD83D\uDEA2 \"quoted\" back\\slash").toString();
    }

    @Test
    void arrayOfObjectsParsesAndKeepsTypes() throws IOException {
        List<String> names = List.of("crossing_id", "wind_knots", "note", "on_time");
        CellKind[] kinds = {CellKind.NUMBER, CellKind.NUMBER, CellKind.TEXT, CellKind.BOOLEAN};
        String text = write(true, names, kinds,
                new String[] {"1", "12.5", "calm", "true"},
                new String[] {"2", null, awkwardText(), "false"},
                new String[] {"3", "1.5E-9", null, null});
        JsonNode root = mapper.readTree(text);
        assertTrue(root.isArray());
        assertEquals(3, root.size());
        JsonNode first = root.get(0);
        assertTrue(first.get("crossing_id").isIntegralNumber());
        assertEquals(0, new BigDecimal("12.5").compareTo(first.get("wind_knots").decimalValue()));
        assertEquals("calm", first.get("note").textValue());
        assertTrue(first.get("on_time").isBoolean());
        assertTrue(first.get("on_time").booleanValue());
        JsonNode second = root.get(1);
        assertTrue(second.get("wind_knots").isNull());
        assertEquals(awkwardText(), second.get("note").textValue());
        assertFalse(second.get("on_time").booleanValue());
        JsonNode third = root.get(2);
        assertEquals(0, new BigDecimal("1.5E-9").compareTo(third.get("wind_knots").decimalValue()));
        assertTrue(third.get("note").isNull());
        assertTrue(third.get("on_time").isNull());
        List<String> keys = new ArrayList<>();
        first.fieldNames().forEachRemaining(keys::add);
        assertEquals(names, keys);
        // the text ends with a newline after the closing bracket
        assertTrue(text.endsWith("\n]\n"), text);
    }

    @Test
    void controlCharactersAreEscapedNotRaw() throws IOException {
        String text = write(false, List.of("note"), new CellKind[] {CellKind.TEXT}, new String[] {awkwardText()});
        // RFC 8259 §7: no raw control character may appear inside the string; the only raw
        // control character in the output is the record's terminating LF
        String body = text.substring(0, text.length() - 1);
        for (int i = 0; i < body.length(); i++) {
            assertTrue(body.charAt(i) >= 0x20, "raw control character U+" + Integer.toHexString(body.charAt(i)) + " at " + i);
        }
        assertTrue(body.contains("\\\"quoted\\\""));
        assertTrue(body.contains("back\\\\slash"));
        assertTrue(body.contains("\\n") && body.contains("\\r") && body.contains("\\t") && body.contains("\\b") && body.contains("\\f"));
        assertTrue(body.contains("\\u0000") && body.contains("\\u001f"));
        assertEquals(awkwardText(), mapper.readTree(body).get("note").textValue());
    }

    @Test
    void keysAreEscapedToo() throws IOException {
        List<String> names = List.of("a\"b", "tab\tkey", "back\\slash");
        String text = write(false, names, new CellKind[] {CellKind.NUMBER, CellKind.NUMBER, CellKind.NUMBER},
                new String[] {"1", "2", "3"});
        JsonNode row = mapper.readTree(text.trim());
        assertEquals(1, row.get("a\"b").intValue());
        assertEquals(2, row.get("tab\tkey").intValue());
        assertEquals(3, row.get("back\\slash").intValue());
    }

    @Test
    void jsonLinesIsOneObjectPerLine() throws IOException {
        // JSON Lines (jsonlines.org): UTF-8, each line a valid JSON value, lines ended by \n
        List<String> names = List.of("crossing_id", "note");
        CellKind[] kinds = {CellKind.NUMBER, CellKind.TEXT};
        String text = write(false, names, kinds,
                new String[] {"1", "two\nlines"}, new String[] {"2", null}, new String[] {"3", "x"});
        assertTrue(text.endsWith("\n"));
        String[] lines = text.substring(0, text.length() - 1).split("\n", -1);
        assertEquals(3, lines.length);
        List<Map<String, Object>> parsed = new ArrayList<>();
        for (String line : lines) {
            JsonNode node = mapper.readTree(line);
            assertTrue(node.isObject(), line);
            Map<String, Object> m = new LinkedHashMap<>();
            node.fields().forEachRemaining(e -> m.put(e.getKey(), e.getValue().isNull() ? null : e.getValue().asText()));
            parsed.add(m);
        }
        assertEquals("two\nlines", parsed.get(0).get("note"));
        assertEquals(null, parsed.get(1).get("note"));
        assertTrue(parsed.get(1).containsKey("note"), "a missing value is an explicit null");
        assertEquals("3", parsed.get(2).get("crossing_id"));
    }

    @Test
    void emptyDataset() throws IOException {
        CellKind[] kinds = {CellKind.NUMBER};
        String array = write(true, List.of("a"), kinds);
        assertEquals("[]\n", array);
        JsonNode root = mapper.readTree(array);
        assertTrue(root.isArray());
        assertEquals(0, root.size());
        // JSON Lines with no rows is an empty file (no lines)
        assertEquals("", write(false, List.of("a"), kinds));
    }

    @Test
    void reportSerialiserOutputParses() throws IOException {
        // Json.write (the report writer) must give RFC 8259 JSON with the same content
        Map<String, Object> root = new LinkedHashMap<>();
        root.put("name", awkwardText());
        root.put("count", 3L);
        root.put("ratio", 0.1);
        root.put("tiny", 1.5e-300);
        root.put("nan", Double.NaN);
        root.put("flag", Boolean.TRUE);
        root.put("nothing", null);
        root.put("vector", new double[] {1.0, -2.5});
        root.put("matrix", new double[][] {{1.0, 0.4}, {0.4, 1.0}});
        root.put("empty", List.of());
        root.put("emptyMap", Map.of());
        root.put("list", List.of("a", 1, List.of(Map.of("k", "v"))));
        String text = Json.write(root);
        JsonNode node = mapper.readTree(text);
        assertEquals(awkwardText(), node.get("name").textValue());
        assertEquals(3, node.get("count").longValue());
        assertEquals(0, new BigDecimal("0.1").compareTo(node.get("ratio").decimalValue()));
        assertEquals(1.5e-300, node.get("tiny").doubleValue());
        assertTrue(node.get("nan").isNull(), "non-finite numbers become null");
        assertTrue(node.get("flag").booleanValue());
        assertTrue(node.get("nothing").isNull());
        assertEquals(-2.5, node.get("vector").get(1).doubleValue());
        assertEquals(0.4, node.get("matrix").get(1).get(0).doubleValue());
        assertEquals(0, node.get("empty").size());
        assertEquals(0, node.get("emptyMap").size());
        assertEquals("v", node.get("list").get(2).get(0).get("k").textValue());
    }
}
