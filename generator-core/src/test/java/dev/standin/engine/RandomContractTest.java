package dev.standin.engine;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.standin.spec.OutputFormat;
import dev.standin.spec.Overrides;
import java.io.IOException;
import java.io.StringReader;
import java.math.BigDecimal;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The random contract of {@link dev.standin.random.RandomStreams} seen from the outside: every value
 * is a function of (seed, column name, row) and the column's own definition only. Files are read
 * back with independent parsers (commons-csv for RFC 4180, Jackson for JSON).
 */
class RandomContractTest {

    private static final String FERRY = "dataset: ferry-crossings\n"
            + "rows: 1000\n"
            + "seed: 424242\n"
            + "columns:\n"
            + "  crossing_id: {dist: sequence, start: 1, step: 1}\n"
            + "  wind_knots:  {dist: normal, mean: 12.5, sd: 4.0, min: 0, decimals: 1}\n"
            + "  wait_min:    {dist: uniform, min: 0, max: 30, decimals: 0, nulls: 0.02}\n"
            + "  fare_eur:    {dist: normal, mean: 48, sd: 9, decimals: 2}\n"
            + "  deck_load_t: {dist: normal, mean: 310, sd: 45}\n"
            + "correlation:\n"
            + "  measure: pearson\n"
            + "  pairs:\n"
            + "    wind_knots ~ wait_min: 0.4\n"
            + "    wind_knots ~ fare_eur: -0.2\n"
            + "output:\n"
            + "  format: csv\n";

    private static final List<String> NAMES = List.of("crossing_id", "wind_knots", "wait_min", "fare_eur", "deck_load_t");

    @TempDir
    Path temp;

    private int runs;

    /** The data and report bytes of one generation, each run in a fresh engine and folder. */
    private record Output(byte[] data, byte[] report, GenerationResult result, CompiledSpec compiled) {
        String text() {
            return new String(data, StandardCharsets.UTF_8);
        }
    }

    private Output generate(String yaml, Overrides overrides) throws Exception {
        Engine engine = Engine.create(overrides);
        CompiledSpec compiled = engine.compile("ferry.yaml", yaml.getBytes(StandardCharsets.UTF_8), "");
        Path out = temp.resolve("run" + runs++);
        GenerationResult result = engine.generate(compiled, out);
        return new Output(Files.readAllBytes(out.resolve(compiled.dataFile())),
                Files.readAllBytes(out.resolve(compiled.reportFile())), result, compiled);
    }

    private Output generate(String yaml) throws Exception {
        return generate(yaml, Overrides.none());
    }

    /** Column name → cell texts by row; a missing value is null. Parsed by commons-csv. */
    private static Map<String, List<String>> csvColumns(String text) throws IOException {
        Map<String, List<String>> columns = new LinkedHashMap<>();
        List<CSVRecord> records = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).build()
                .parse(new StringReader(text)).getRecords();
        for (CSVRecord r : records) {
            for (Map.Entry<String, String> e : r.toMap().entrySet()) {
                columns.computeIfAbsent(e.getKey(), k -> new ArrayList<>()).add(e.getValue().isEmpty() ? null : e.getValue());
            }
        }
        return columns;
    }

    private static List<JsonNode> jsonLines(String text) throws IOException {
        ObjectMapper mapper = new ObjectMapper().enable(DeserializationFeature.USE_BIG_DECIMAL_FOR_FLOATS);
        List<JsonNode> rows = new ArrayList<>();
        for (String line : text.split("\n", -1)) {
            if (!line.isEmpty()) {
                rows.add(mapper.readTree(line));
            }
        }
        return rows;
    }

    private static String withRows(String yaml, long rows) {
        return yaml.replace("rows: 1000\n", "rows: " + rows + "\n");
    }

    @Test
    void fewerRowsArePrefixOfMoreRows() throws Exception {
        String all = generate(FERRY).text();
        String hundred = generate(withRows(FERRY, 100)).text();
        String[] lines = all.split("\n", -1);
        // header + 1000 records, each ended by \n
        assertEquals(1002, lines.length);
        String prefix = String.join("\n", Arrays.copyOf(lines, 101)) + "\n";
        assertEquals(prefix, hundred);
        // the rows override (command line / Maven property) gives the same bytes as the spec's rows
        assertEquals(hundred, generate(FERRY, new Overrides(null, 100L, null)).text());
        // and a single row, and zero rows (header only)
        assertEquals(lines[0] + "\n" + lines[1] + "\n", generate(withRows(FERRY, 1)).text());
        assertEquals(lines[0] + "\n", generate(withRows(FERRY, 0)).text());
    }

    @Test
    void fewerRowsArePrefixInJsonLines() throws Exception {
        Overrides jsonl = new Overrides(null, null, OutputFormat.JSONL);
        String all = generate(FERRY, jsonl).text();
        String some = generate(withRows(FERRY, 250), jsonl).text();
        assertTrue(all.startsWith(some), "250-row JSON Lines file is a prefix of the 1000-row one");
        assertEquals(250, some.split("\n").length);
    }

    @Test
    void reorderingColumnsLeavesValuesUnchanged() throws Exception {
        String reordered = "dataset: ferry-crossings\n"
                + "rows: 1000\n"
                + "seed: 424242\n"
                + "columns:\n"
                + "  deck_load_t: {dist: normal, mean: 310, sd: 45}\n"
                + "  fare_eur:    {dist: normal, mean: 48, sd: 9, decimals: 2}\n"
                + "  wait_min:    {dist: uniform, min: 0, max: 30, decimals: 0, nulls: 0.02}\n"
                + "  crossing_id: {dist: sequence, start: 1, step: 1}\n"
                + "  wind_knots:  {dist: normal, mean: 12.5, sd: 4.0, min: 0, decimals: 1}\n"
                + "correlation:\n"
                + "  pairs:\n"
                + "    fare_eur ~ wind_knots: -0.2\n"
                + "    wait_min ~ wind_knots: 0.4\n";
        Map<String, List<String>> a = csvColumns(generate(FERRY).text());
        Map<String, List<String>> b = csvColumns(generate(reordered).text());
        assertEquals(List.of("deck_load_t", "fare_eur", "wait_min", "crossing_id", "wind_knots"), new ArrayList<>(b.keySet()));
        for (String name : NAMES) {
            assertEquals(a.get(name), b.get(name), name);
        }
    }

    @Test
    void otherColumnsDecimalsAndParametersLeaveAColumnUnchanged() throws Exception {
        Map<String, List<String>> base = csvColumns(generate(FERRY).text());
        // fare_eur with 4 decimals instead of 2, deck_load_t with another sd, one more column
        String changed = FERRY
                .replace("fare_eur:    {dist: normal, mean: 48, sd: 9, decimals: 2}",
                        "fare_eur:    {dist: normal, mean: 48, sd: 9, decimals: 4}")
                .replace("deck_load_t: {dist: normal, mean: 310, sd: 45}",
                        "deck_load_t: {dist: normal, mean: 310, sd: 60, decimals: 3}\n"
                        + "  cabin_temp: {dist: uniform, min: 18, max: 24}");
        Map<String, List<String>> other = csvColumns(generate(changed).text());
        for (String name : List.of("crossing_id", "wind_knots", "wait_min")) {
            assertEquals(base.get(name), other.get(name), name);
        }
        // the changed column itself: 4 decimals rounded half-even to 2 give the 2-decimal text
        // except where the 4-decimal text is itself a tie (xx.xx50), which double rounding may move
        List<String> two = base.get("fare_eur");
        List<String> four = other.get("fare_eur");
        int compared = 0;
        for (int i = 0; i < two.size(); i++) {
            if (!four.get(i).endsWith("50")) {
                assertEquals(new BigDecimal(two.get(i)), new BigDecimal(four.get(i)).setScale(2, java.math.RoundingMode.HALF_EVEN), "row " + i);
                compared++;
            }
        }
        assertTrue(compared > 900);
        assertNotEquals(base.get("deck_load_t"), other.get("deck_load_t"), "a changed column does change");
    }

    @Test
    void outputFormatLeavesValuesUnchanged() throws Exception {
        Map<String, List<String>> csv = csvColumns(generate(FERRY).text());
        for (OutputFormat format : new OutputFormat[] {OutputFormat.JSONL, OutputFormat.JSON}) {
            String text = generate(FERRY, new Overrides(null, null, format)).text();
            List<JsonNode> rows;
            if (format == OutputFormat.JSONL) {
                rows = jsonLines(text);
            } else {
                JsonNode array = new ObjectMapper().enable(DeserializationFeature.USE_BIG_DECIMAL_FOR_FLOATS).readTree(text);
                assertTrue(array.isArray());
                rows = new ArrayList<>();
                array.forEach(rows::add);
            }
            assertEquals(1000, rows.size());
            for (int i = 0; i < rows.size(); i++) {
                JsonNode row = rows.get(i);
                List<String> keys = new ArrayList<>();
                row.fieldNames().forEachRemaining(keys::add);
                assertEquals(NAMES, keys, "keys in spec order");
                for (String name : NAMES) {
                    String cell = csv.get(name).get(i);
                    JsonNode v = row.get(name);
                    if (cell == null) {
                        assertTrue(v.isNull(), name + " row " + i + " is null in " + format);
                    } else {
                        assertTrue(v.isNumber(), name + " is a JSON number");
                        assertEquals(0, new BigDecimal(cell).compareTo(v.decimalValue()), name + " row " + i + " in " + format);
                    }
                }
            }
        }
    }

    @Test
    void nullsUseTheirOwnStream() throws Exception {
        Map<String, List<String>> base = csvColumns(generate(FERRY).text());
        String withNulls = FERRY
                .replace("fare_eur:    {dist: normal, mean: 48, sd: 9, decimals: 2}",
                        "fare_eur:    {dist: normal, mean: 48, sd: 9, decimals: 2, nulls: 0.25}")
                .replace("decimals: 0, nulls: 0.02}", "decimals: 0}");
        Map<String, List<String>> other = csvColumns(generate(withNulls).text());
        for (String name : List.of("crossing_id", "wind_knots", "deck_load_t")) {
            assertEquals(base.get(name), other.get(name), name);
        }
        int missing = 0;
        for (int i = 0; i < 1000; i++) {
            // fare_eur: where it is present it is the value it had without nulls
            String fare = other.get("fare_eur").get(i);
            if (fare == null) {
                missing++;
            } else {
                assertEquals(base.get("fare_eur").get(i), fare, "fare_eur row " + i);
            }
            // wait_min: without nulls, every row present, and equal where it was present before
            String before = base.get("wait_min").get(i);
            String after = other.get("wait_min").get(i);
            assertTrue(after != null, "wait_min row " + i);
            if (before != null) {
                assertEquals(before, after, "wait_min row " + i);
            }
        }
        // Binomial(1000, 0.25): mean 250, sd 13.7; ± 6 sd (false failure < 1e-8, normal approximation)
        assertTrue(Math.abs(missing - 250) <= 6 * Math.sqrt(1000 * 0.25 * 0.75), "missing " + missing);
        assertTrue(base.get("wait_min").contains(null), "the base spec has some missing wait_min");
    }

    @Test
    void sameSpecTwiceGivesIdenticalBytes() throws Exception {
        Output a = generate(FERRY);
        Output b = generate(FERRY);
        assertArrayEquals(a.data(), b.data());
        assertArrayEquals(a.report(), b.report());
        Output c = generate(FERRY, new Overrides(null, null, OutputFormat.JSON));
        Output d = generate(FERRY, new Overrides(null, null, OutputFormat.JSON));
        assertArrayEquals(c.data(), d.data());
        assertArrayEquals(c.report(), d.report());
        // a different seed gives different data (so the comparisons above can fail)
        assertFalse(Arrays.equals(a.data(), generate(FERRY, new Overrides(1L, null, null)).data()));
    }

    @Test
    void resultAndReportDescribeTheWrittenFile() throws Exception {
        Output a = generate(FERRY);
        GenerationResult.WrittenFile file = a.result().files().get(0);
        // size and SHA-256 (FIPS 180-4, via the JDK's MessageDigest) of the bytes on disk
        assertEquals(a.data().length, file.bytes());
        String sha = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(a.data()));
        assertEquals(sha, file.sha256());
        assertEquals("ferry-crossings.csv", file.path());
        assertEquals("ferry-crossings.report.json", a.compiled().reportFile());
        assertTrue(a.result().summary().startsWith("ferry-crossings: 1000 rows × 5 columns → ferry-crossings.csv ("
                + a.data().length + " bytes)"), a.result().summary());
        // the report is valid JSON (RFC 8259, read by Jackson) and names the same file
        JsonNode report = new ObjectMapper().readTree(a.report());
        assertEquals("ferry-crossings", report.get("dataset").asText());
        assertEquals(1000, report.get("rows").asLong());
        assertEquals(424242, report.get("seed").asLong());
        assertEquals(sha, report.get("files").get(0).get("sha256").asText());
        assertEquals(a.data().length, report.get("files").get(0).get("bytes").asLong());
        String specSha = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(FERRY.getBytes(StandardCharsets.UTF_8)));
        assertEquals(specSha, report.get("spec").get("sha256").asText());
        assertEquals(5, report.get("columns").size());
    }
}
