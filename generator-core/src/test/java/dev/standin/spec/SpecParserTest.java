package dev.standin.spec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import dev.standin.engine.Engine;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Every diagnostic of the spec reader (SpecParser, YamlMap, ColumnReader, CorrelationReader, and the
 * checks Engine.compile adds), asserted as the exact {@code FILE:LINE:COLUMN: message} text. Lines
 * and columns are 1-based and point at the offending key or value; they were counted by hand from
 * the YAML below (YAML 1.1 as read by snakeyaml 2.4). Texts quoted from snakeyaml are its own.
 */
class SpecParserTest {

    private static final String FILE = "specs/ferry.yaml";

    /** Lines 1-4 of most specs here; column definitions start on line 5. */
    private static final String HEAD = "dataset: ferry-crossings\nrows: 100\nseed: 7\ncolumns:\n";

    /** Columns for the correlation cases: lines 5-8, "correlation:" on line 9. */
    private static final String COLS = HEAD
            + "  crossing_id: {dist: sequence}\n"
            + "  wind_knots: {dist: normal, mean: 12.5, sd: 4}\n"
            + "  fare_eur: {dist: normal, mean: 48, sd: 9}\n"
            + "  wait_min: {dist: uniform, min: 0, max: 30}\n";

    private static Spec parse(String yaml) throws SpecException {
        return SpecParser.withOverrides(Overrides.none()).parse(FILE, yaml.getBytes(StandardCharsets.UTF_8));
    }

    private static List<String> problems(byte[] bytes) {
        try {
            SpecParser.withOverrides(Overrides.none()).parse(FILE, bytes);
        } catch (SpecException e) {
            List<String> lines = e.problems().stream().map(SpecProblem::toString).toList();
            assertEquals(String.join("\n", lines), e.getMessage());
            return lines;
        }
        return fail("spec was accepted");
    }

    private static void assertProblems(String yaml, String... expected) {
        assertEquals(Arrays.asList(expected), problems(yaml.getBytes(StandardCharsets.UTF_8)));
    }

    private static String at(int line, int column, String message) {
        return FILE + ":" + line + ":" + column + ": " + message;
    }

    private static String column(String definition) {
        return HEAD + "  " + definition + "\n";
    }

    // ---- a valid spec --------------------------------------------------------------------------

    @Test
    void theDocumentedExampleParses() throws SpecException {
        Spec spec = parse("""
                dataset: ferry-crossings
                rows: 5000
                seed: 424242
                columns:
                  crossing_id: {dist: sequence, start: 1, step: 1}
                  wind_knots:  {dist: normal, mean: 12.5, sd: 4.0, min: 0, decimals: 1}
                  wait_min:    {dist: uniform, min: 0, max: 30, decimals: 0, nulls: 0.02}
                  fare_eur:    {dist: normal, mean: 48, sd: 9, decimals: 2}
                correlation:
                  measure: pearson
                  pairs:
                    wind_knots ~ wait_min: 0.4
                    wind_knots ~ fare_eur: -0.2
                output:
                  format: csv
                """);
        assertEquals("ferry-crossings", spec.dataset());
        assertEquals(5000, spec.rows());
        assertEquals(424242, spec.seed());
        assertEquals(4, spec.columns().size());
        assertEquals(List.of("wind_knots", "wait_min", "fare_eur"), spec.correlation().order());
        assertEquals(OutputFormat.CSV, spec.output().format());
        ColumnSpec.Random wait = (ColumnSpec.Random) spec.column("wait_min");
        assertEquals(0.02, wait.nulls());
        assertEquals(0, wait.decimals());
        // the boundaries that are accepted
        assertEquals(SpecParser.MAX_ROWS, parse(HEAD.replace("rows: 100", "rows: 1099511627776")
                + "  a: {dist: sequence}\n").rows());
        assertEquals(1000, parse(HEAD.replace("rows: 100", "rows: 1e3") + "  a: {dist: sequence}\n").rows());
        assertEquals(Long.MIN_VALUE, parse(HEAD.replace("seed: 7", "seed: -9223372036854775808")
                + "  a: {dist: sequence}\n").seed());
    }

    // ---- the file as a whole -------------------------------------------------------------------

    @Test
    void emptyOrNotAMapping() {
        assertProblems("", at(1, 1, "spec is empty; it needs at least dataset, rows, seed and columns"));
        assertProblems("# only a comment\n", at(1, 1, "spec is empty; it needs at least dataset, rows, seed and columns"));
        assertProblems("- a\n- b\n", at(1, 1, "the spec must be a mapping of keys to values"));
    }

    @Test
    void tooLargeOrNotUtf8() {
        byte[] big = new byte[(4 << 20) + 1];
        Arrays.fill(big, (byte) ' ');
        assertEquals(List.of(at(1, 1, "spec is 4194305 bytes; the limit is 4194304 bytes (4 MiB)")), problems(big));
        // 0xFF never occurs in UTF-8 (RFC 3629, section 1)
        assertEquals(List.of(at(1, 1, "spec is not valid UTF-8 text")), problems(new byte[] {'d', (byte) 0xFF, '\n'}));
    }

    @Test
    void yamlSyntaxErrorsCarryTheirLocation() {
        // " seed: 7" continues the plain scalar "100", and its ':' is where a value cannot start
        assertProblems("dataset: ferry-crossings\nrows: 100\n seed: 7\n", at(3, 6, "not valid YAML: mapping values are not allowed here"));
        // an unclosed flow mapping runs into the end of the stream (line 6, column 1)
        assertProblems(column("fare_eur: {dist: normal, mean: 48, sd: 9"),
                at(6, 1, "not valid YAML: expected ',' or '}', but got <stream end>"));
    }

    @Test
    void billionLaughsIsRejected() {
        // the "billion laughs" entity-expansion attack in YAML form: each level has 9 aliases of the
        // one above; snakeyaml stops at the 51st alias of a collection (LoaderOptions max 50)
        StringBuilder sb = new StringBuilder("a: &a [\"lol\",\"lol\",\"lol\",\"lol\",\"lol\",\"lol\",\"lol\",\"lol\",\"lol\"]\n");
        for (char c = 'b'; c <= 'i'; c++) {
            String prev = "*" + (char) (c - 1);
            sb.append(c).append(": &").append(c).append(" [").append(String.join(",", java.util.Collections.nCopies(9, prev))).append("]\n");
        }
        assertProblems(sb.toString(), at(1, 1, "not valid YAML: Number of aliases for non-scalar nodes exceeds the specified max=50"));
    }

    @Test
    void deepNestingIsRejected() {
        String deep = "dataset: " + "[".repeat(60) + "]".repeat(60) + "\n";
        List<String> p = problems(deep.getBytes(StandardCharsets.UTF_8));
        assertEquals(1, p.size());
        assertTrue(p.get(0).startsWith(FILE + ":") && p.get(0).contains("not valid YAML: Nesting Depth exceeded max 50"), p.get(0));
    }

    @Test
    void unknownTopKeys() {
        assertProblems(HEAD.replace("columns:", "colums:") + "  fare_eur: {dist: normal, mean: 48, sd: 9}\n",
                at(4, 1, "unknown key 'colums' in the spec; did you mean 'columns'? (valid: dataset, rows, seed, columns, correlation, output)"),
                at(1, 1, "the spec is missing the required key 'columns'"));
        assertProblems("owner: me\n" + column("fare_eur: {dist: normal, mean: 48, sd: 9}"),
                at(1, 1, "unknown key 'owner' in the spec (valid: dataset, rows, seed, columns, correlation, output)"));
    }

    @Test
    void missingRequiredKeys() {
        assertProblems("dataset: ferry-crossings\n",
                at(1, 1, "the spec is missing the required key 'rows'"),
                at(1, 1, "the spec is missing the required key 'seed'"),
                at(1, 1, "the spec is missing the required key 'columns'"));
    }

    @Test
    void duplicateKeys() {
        assertProblems("dataset: ferry-crossings\nrows: 100\nseed: 7\nrows: 200\ncolumns:\n  a: {dist: sequence}\n",
                at(4, 1, "duplicate key 'rows' (first given at line 2, column 1)"));
        assertProblems(column("fare_eur: {dist: normal, mean: 48, sd: 9, sd: 10}"),
                at(5, 45, "duplicate key 'sd' (first given at line 5, column 38)"));
    }

    @Test
    void keysMustBePlainTextAndMergeKeysAreRefused() {
        assertProblems("<<: {rows: 5}\n? [a, b]\n: 1\n",
                at(1, 1, "merge keys (<<) are not supported"),
                at(2, 3, "keys must be plain text"),
                at(1, 1, "the spec is missing the required key 'dataset'"),
                at(1, 1, "the spec is missing the required key 'rows'"),
                at(1, 1, "the spec is missing the required key 'seed'"),
                at(1, 1, "the spec is missing the required key 'columns'"));
    }

    @Test
    void tagsAreRejected() {
        // global tags that name Java classes: refused by snakeyaml's tag inspector before anything is read
        assertProblems(HEAD.replace("dataset: ferry-crossings", "dataset: !!java.lang.Object ferry") + "  a: {dist: sequence}\n",
                at(1, 10, "not valid YAML: Global tag is not allowed: tag:yaml.org,2002:java.lang.Object"));
        assertProblems(HEAD.replace("rows: 100", "rows: !!java.lang.Long 100") + "  a: {dist: sequence}\n",
                at(2, 7, "not valid YAML: Global tag is not allowed: tag:yaml.org,2002:java.lang.Long"));
        // local tags and non-text standard tags, wherever they stand: one problem each
        assertProblems(HEAD.replace("dataset: ferry-crossings", "dataset: !ferry x") + "  a: {dist: sequence}\n",
                at(1, 10, "tag !ferry is not allowed; write plain values"));
        assertProblems(HEAD.replace("dataset: ferry-crossings", "dataset: !!binary ZmVycnk=") + "  a: {dist: sequence}\n",
                at(1, 10, "tag tag:yaml.org,2002:binary is not allowed; write plain values"));
        assertProblems("!root\n" + HEAD + "  a: {dist: sequence}\n", at(1, 1, "tag !root is not allowed; write plain values"));
        assertProblems(column("fare_eur: !col {dist: !d normal, mean: 48, sd: 9}") + "output: {header: !flag true}\n",
                at(5, 13, "tag !col is not allowed; write plain values"),
                at(5, 25, "tag !d is not allowed; write plain values"),
                at(6, 18, "tag !flag is not allowed; write plain values"));
        assertProblems(column("!k fare_eur: {dist: normal, mean: 48, sd: 9}"), at(5, 3, "tag !k is not allowed; write plain values"));
    }

    // ---- dataset, rows, seed -------------------------------------------------------------------

    @Test
    void datasetName() {
        String pattern = "dataset must match [a-z0-9][a-z0-9_-]* (at most 128 characters): ";
        assertProblems(HEAD.replace("ferry-crossings", "Ferry Crossings") + "  a: {dist: sequence}\n",
                at(1, 10, pattern + "Ferry Crossings"));
        String long129 = "a".repeat(129);
        assertProblems(HEAD.replace("ferry-crossings", long129) + "  a: {dist: sequence}\n", at(1, 10, pattern + long129));
        assertProblems(HEAD.replace("ferry-crossings", "-ferry") + "  a: {dist: sequence}\n", at(1, 10, pattern + "-ferry"));
        assertProblems(HEAD.replace("ferry-crossings", "{name: x}") + "  a: {dist: sequence}\n", at(1, 10, "dataset must be text"));
        assertProblems(HEAD.replace("dataset: ferry-crossings", "dataset:") + "  a: {dist: sequence}\n", at(1, 9, "dataset must be text"));
    }

    @Test
    void rowsAndSeed() {
        String range = "rows must be a whole number from 0 to 2^40 (1099511627776): ";
        assertProblems(HEAD.replace("rows: 100", "rows: -5") + "  a: {dist: sequence}\n", at(2, 7, range + "-5"));
        assertProblems(HEAD.replace("rows: 100", "rows: 1099511627777") + "  a: {dist: sequence}\n", at(2, 7, range + "1099511627777"));
        assertProblems(HEAD.replace("rows: 100", "rows: 2.5") + "  a: {dist: sequence}\n", at(2, 7, "rows must be a whole number: 2.5"));
        assertProblems(HEAD.replace("rows: 100", "rows: \"100\"") + "  a: {dist: sequence}\n",
                at(2, 7, "rows must be a number, not quoted text: \"100\""));
        assertProblems(HEAD.replace("rows: 100", "rows: '100'") + "  a: {dist: sequence}\n",
                at(2, 7, "rows must be a number, not quoted text: \"100\""));
        assertProblems(HEAD.replace("rows: 100", "rows: .inf") + "  a: {dist: sequence}\n", at(2, 7, "rows must be a finite number: .inf"));
        assertProblems(HEAD.replace("rows: 100", "rows: lots") + "  a: {dist: sequence}\n", at(2, 7, "rows must be a number: lots"));
        assertProblems(HEAD.replace("rows: 100", "rows: [1]") + "  a: {dist: sequence}\n", at(2, 7, "rows must be a number"));
        assertProblems(HEAD.replace("seed: 7", "seed: 9223372036854775808") + "  a: {dist: sequence}\n",
                at(3, 7, "seed must be a 64-bit integer: 9223372036854775808"));
    }

    // ---- columns -------------------------------------------------------------------------------

    @Test
    void columnsBlock() {
        assertProblems(HEAD.replace("columns:", "columns: [a, b]"), at(4, 10, "columns must be a mapping of keys to values"));
        assertProblems(HEAD.replace("columns:", "columns: {}"), at(4, 10, "columns must name at least one column"));
        StringBuilder many = new StringBuilder(HEAD);
        for (int i = 0; i <= SpecParser.MAX_COLUMNS; i++) {
            many.append("  c").append(i).append(": {dist: sequence}\n");
        }
        assertProblems(many.toString(), at(5, 3, "columns has 10001 entries; the limit is 10000"));
    }

    @Test
    void columnNamesAndShapes() {
        String name = "column name must be 1 to 128 characters without '~' or control characters: ";
        assertProblems(column("\"a~b\": {dist: sequence}"), at(5, 3, name + "'a~b'"));
        assertProblems(column("\" padded\": {dist: sequence}"), at(5, 3, name + "' padded'"));
        assertProblems(column("\"tab\\there\": {dist: sequence}"), at(5, 3, name + "'tab\there'"));
        assertProblems(column("fare_eur: 5"), at(5, 13, "column 'fare_eur' must be a mapping of keys to values"));
        assertProblems(column("fare_eur: {mean: 48}"), at(5, 13, "column 'fare_eur' is missing the required key 'dist'"));
        assertProblems(column("fare_eur: {dist: [normal]}"), at(5, 20, "dist must be text"));
    }

    @Test
    void unknownDistAndKeys() {
        assertProblems(column("fare_eur: {dist: normall, mean: 48, sd: 9}"),
                at(5, 20, "unknown dist 'normall'; did you mean 'normal'? (valid: bernoulli, beta, binomial, categorical, date, exponential, gamma, lognormal, negbinomial, normal, poisson, quantiles, sequence, timestamp, triangular, uniform, weibull)"));
        assertProblems(column("fare_eur: {dist: zipfian}"), at(5, 20, "unknown dist 'zipfian' (valid: bernoulli, beta, binomial, categorical, date, exponential, gamma, lognormal, negbinomial, normal, poisson, quantiles, sequence, timestamp, triangular, uniform, weibull)"));
        assertProblems(column("fare_eur: {dist: normal, mean: 48, sdev: 9}"),
                at(5, 38, "unknown key 'sdev' in normal column 'fare_eur'; did you mean 'sd'? (valid: dist, mean, sd, min, max, decimals, nulls)"),
                at(5, 13, "normal column is missing the required key 'sd'"));
        assertProblems(column("crossing_id: {dist: sequence, stop: 5}"),
                at(5, 33, "unknown key 'stop' in sequence column 'crossing_id'; did you mean 'step'? (valid: dist, start, step)"));
    }

    @Test
    void normalParameters() {
        assertProblems(column("fare_eur: {dist: normal, mean: 48, sd: -3}"), at(5, 42, "normal: sd must be > 0: -3"));
        assertProblems(column("fare_eur: {dist: normal, mean: 48, sd: 0}"), at(5, 42, "normal: sd must be > 0: 0"));
        assertProblems(column("fare_eur: {dist: normal, mean: .nan, sd: 9}"), at(5, 34, "mean must be a finite number: .nan"));
        assertProblems(column("fare_eur: {dist: normal, mean: 48, sd: .inf}"), at(5, 42, "sd must be a finite number: .inf"));
        assertProblems(column("fare_eur: {dist: normal, mean: -.Inf, sd: 9}"), at(5, 34, "mean must be a finite number: -.Inf"));
        assertProblems(column("fare_eur: {dist: normal, mean: 1e999, sd: 9}"), at(5, 34, "mean must be a finite number: 1e999"));
        assertProblems(column("fare_eur: {dist: normal, mean: 48, sd: \"9\"}"), at(5, 42, "sd must be a number, not quoted text: \"9\""));
        assertProblems(column("fare_eur: {dist: normal, sd: 9}"), at(5, 13, "normal column is missing the required key 'mean'"));
        assertProblems(column("fare_eur: {dist: normal, mean: 0, sd: 1, min: 100, max: 200}"),
                at(5, 49, "normal: min and max leave no probability to sample: the normal mass in [100, 200] is below 1e-300"));
    }

    @Test
    void minAtLeastMax() {
        assertProblems(column("fare_eur: {dist: normal, mean: 48, sd: 9, min: 50, max: 40}"), at(5, 59, "max must be > min: 40 <= 50"));
        assertProblems(column("fare_eur: {dist: normal, mean: 48, sd: 9, min: 50, max: 50}"), at(5, 59, "max must be > min: 50 <= 50"));
        assertProblems(column("wait_min: {dist: uniform, min: 30, max: 0}"), at(5, 43, "max must be > min: 0 <= 30"));
        assertProblems(column("wait_min: {dist: uniform, max: 30}"), at(5, 13, "uniform column is missing the required key 'min'"));
        assertProblems(column("w: {dist: uniform, min: -1.7e308, max: 1.7e308}"),
                at(5, 42, "uniform: max - min must be finite: 1.7E+308 - -1.7E+308"));
    }

    @Test
    void nullsAndDecimals() {
        assertProblems(column("fare_eur: {dist: normal, mean: 48, sd: 9, nulls: 1}"), at(5, 52, "nulls must be a fraction in [0, 1): 1"));
        assertProblems(column("fare_eur: {dist: normal, mean: 48, sd: 9, nulls: -0.1}"), at(5, 52, "nulls must be a fraction in [0, 1): -0.1"));
        assertProblems(column("fare_eur: {dist: normal, mean: 48, sd: 9, decimals: 16}"),
                at(5, 55, "decimals must be a whole number from 0 to 15: 16"));
        assertProblems(column("fare_eur: {dist: normal, mean: 48, sd: 9, decimals: -1}"),
                at(5, 55, "decimals must be a whole number from 0 to 15: -1"));
        assertProblems(column("fare_eur: {dist: normal, mean: 48, sd: 9, decimals: 1.5}"), at(5, 55, "decimals must be a whole number: 1.5"));
    }

    @Test
    void sequences() {
        assertProblems(column("crossing_id: {dist: sequence, start: 1.5}"), at(5, 40, "start must be a whole number: 1.5"));
        assertProblems(column("crossing_id: {dist: sequence, start: 1, step: 9223372036854775807}"),
                at(5, 49, "sequence overflows a 64-bit integer: start 1 + step 9223372036854775807 × (rows − 1 = 99) is outside ±9223372036854775807"));
        assertProblems(column("crossing_id: {dist: sequence, start: 9223372036854775800}"),
                at(5, 17, "sequence overflows a 64-bit integer: start 9223372036854775800 + step 1 × (rows − 1 = 99) is outside ±9223372036854775807"));
    }

    @Test
    void allProblemsAreReportedAtOnce() {
        assertProblems("dataset: Ferry\nrows: -1\nseed: 7\ncolumns:\n  a: {dist: normal, mean: 1, sd: 0}\n  b: {dist: uniform, min: 2, max: 1}\n",
                at(1, 10, "dataset must match [a-z0-9][a-z0-9_-]* (at most 128 characters): Ferry"),
                at(2, 7, "rows must be a whole number from 0 to 2^40 (1099511627776): -1"));
        assertProblems(HEAD + "  a: {dist: normal, mean: 1, sd: 0}\n  b: {dist: uniform, min: 2, max: 1}\n",
                at(5, 34, "normal: sd must be > 0: 0"),
                at(6, 35, "max must be > min: 1 <= 2"));
    }

    // ---- correlation ---------------------------------------------------------------------------

    @Test
    void correlationBlock() {
        assertProblems(COLS + "correlation: 0.5\n", at(9, 14, "correlation must be a mapping of keys to values"));
        assertProblems(COLS + "correlation:\n  pair:\n    wind_knots ~ fare_eur: 0.3\n",
                at(10, 3, "unknown key 'pair' in correlation; did you mean 'pairs'? (valid: measure, pairs, order, matrix, repair, max-change)"),
                at(10, 3, "correlation needs pairs (\"a ~ b\": value) or order + matrix"));
        assertProblems(COLS + "correlation: {measure: pearson}\n", at(9, 14, "correlation needs pairs (\"a ~ b\": value) or order + matrix"));
        assertProblems(COLS + "correlation:\n  pairs: {wind_knots ~ fare_eur: 0.3}\n  order: [wind_knots, fare_eur]\n  matrix: [[1, 0.3], [0.3, 1]]\n",
                at(10, 3, "correlation takes either pairs or order + matrix, not both"));
        assertProblems(COLS + "correlation:\n  measure: cosine\n  pairs: {wind_knots ~ fare_eur: 0.3}\n",
                at(10, 12, "measure must be one of pearson, spearman, kendall, latent, covariance: cosine"));
        assertProblems(COLS + "correlation:\n  repair: fix\n  pairs: {wind_knots ~ fare_eur: 0.3}\n",
                at(10, 11, "repair must be one of nearest, clip, fail: fix"));
        assertProblems(COLS + "correlation:\n  max-change: 3\n  pairs: {wind_knots ~ fare_eur: 0.3}\n",
                at(10, 15, "max-change must be a number from 0 to 2: 3"));
    }

    @Test
    void pairs() {
        String c = COLS + "correlation:\n  pairs:\n";
        assertProblems(COLS + "correlation:\n  pairs: [a, b]\n", at(10, 10, "pairs must be a mapping of keys to values"));
        assertProblems(COLS + "correlation:\n  pairs: {}\n", at(10, 10, "pairs must give at least one pair \"a ~ b\": value"));
        assertProblems(c + "    wind_knots - fare_eur: 0.3\n",
                at(11, 5, "a pair must be written \"a ~ b\" with two column names: 'wind_knots - fare_eur'"));
        assertProblems(c + "    wind_knots ~ fare_eur ~ wait_min: 0.3\n",
                at(11, 5, "a pair must be written \"a ~ b\" with two column names: 'wind_knots ~ fare_eur ~ wait_min'"));
        assertProblems(c + "    wind_knot ~ fare_eur: 0.3\n",
                at(11, 5, "pair 'wind_knot ~ fare_eur' names unknown column 'wind_knot'; did you mean 'wind_knots'?"));
        assertProblems(c + "    tide ~ fare_eur: 0.3\n", at(11, 5, "pair 'tide ~ fare_eur' names unknown column 'tide'"));
        assertProblems(c + "    crossing_id ~ fare_eur: 0.3\n",
                at(11, 5, "pair 'crossing_id ~ fare_eur' names sequence column 'crossing_id'; a sequence is not random and cannot be correlated"));
        assertProblems(c + "    fare_eur ~ fare_eur: 0.5\n",
                at(11, 5, "pair 'fare_eur ~ fare_eur' pairs a column with itself; its correlation is always 1"));
        assertProblems(c + "    wind_knots ~ fare_eur: high\n", at(11, 28, "pair 'wind_knots ~ fare_eur' must be a number: high"));
        assertProblems(c + "    wind_knots ~ fare_eur: 0.3\n    fare_eur ~ wind_knots: 0.4\n",
                at(12, 5, "pair 'fare_eur ~ wind_knots' is given with a different value (0.3 then 0.4); first at line 11, column 28"));
        assertProblems(c + "    wind_knots ~ fare_eur: 0.3\n    fare_eur ~ wind_knots: 0.30\n",
                at(12, 5, "pair 'fare_eur ~ wind_knots' is given again; first at line 11, column 28"));
        assertProblems(c + "    wind_knots ~ fare_eur: 1.5\n", at(11, 28, "correlation of fare_eur ~ wind_knots must be in [-1, 1]: 1.5"));
        assertProblems(c + "    wind_knots ~ wait_min: -1.01\n", at(11, 28, "correlation of wait_min ~ wind_knots must be in [-1, 1]: -1.01"));
    }

    @Test
    void matrix() {
        String c = COLS + "correlation:\n";
        assertProblems(c + "  order: [wind_knots, fare_eur]\n", at(10, 3, "correlation with a matrix is missing the required key 'matrix'"));
        assertProblems(c + "  order: wind_knots\n  matrix: [[1]]\n", at(10, 10, "order must be a list"));
        assertProblems(c + "  order: [[a], fare_eur]\n  matrix: [[1, 0], [0, 1]]\n", at(10, 11, "order must list column names"));
        assertProblems(c + "  order: [wind_knot, fare_eur]\n  matrix: [[1, 0], [0, 1]]\n",
                at(10, 11, "order names unknown column 'wind_knot'; did you mean 'wind_knots'?"));
        assertProblems(c + "  order: [crossing_id, fare_eur]\n  matrix: [[1, 0], [0, 1]]\n",
                at(10, 11, "order names sequence column 'crossing_id'; a sequence cannot be correlated"));
        assertProblems(c + "  order: [fare_eur, fare_eur]\n  matrix: [[1, 0], [0, 1]]\n", at(10, 21, "order names column 'fare_eur' twice"));
        assertProblems(c + "  order: [fare_eur]\n  matrix: [[1]]\n", at(10, 10, "order must name at least two columns"));
        assertProblems(c + "  order: [wind_knots, fare_eur, wait_min]\n  matrix:\n    - [1, 0.3, 0.1]\n    - [0.3, 1, 0.2]\n",
                at(12, 5, "matrix has 2 rows but order names 3 columns; it must be 3 × 3"));
        assertProblems(c + "  order: [wind_knots, fare_eur]\n  matrix:\n    - [1, 0.3]\n    - 1\n", at(13, 7, "matrix row 2 must be a list of 2 numbers"));
        assertProblems(c + "  order: [wind_knots, fare_eur]\n  matrix:\n    - [1, 0.3]\n    - [0.3]\n", at(13, 7, "matrix row 2 has 1 entries; it must have 2"));
        assertProblems(c + "  order: [wind_knots, fare_eur]\n  matrix:\n    - [1, 0.3]\n    - [0.3, x]\n",
                at(13, 13, "matrix entry [2][2] must be a number: x"));
        assertProblems(c + "  order: [wind_knots, fare_eur]\n  matrix:\n    - [1, 0.3]\n    - [0.4, 1]\n",
                at(13, 8, "matrix is not symmetric: [2][1] (fare_eur ~ wind_knots) is 0.4 but [1][2] is 0.3"));
        assertProblems(c + "  order: [wind_knots, fare_eur]\n  matrix:\n    - [1, 0.3]\n    - [0.3, 0.9]\n",
                at(13, 13, "correlation matrix diagonal must be 1: [2][2] (fare_eur) is 0.9"));
        assertProblems(c + "  order: [wind_knots, fare_eur]\n  matrix:\n    - [1, 1.2]\n    - [1.2, 1]\n",
                at(13, 8, "correlation of fare_eur ~ wind_knots must be in [-1, 1]: 1.2"));
    }

    @Test
    void covariance() {
        assertProblems(COLS + "correlation:\n  measure: covariance\n  pairs:\n    wait_min ~ fare_eur: 10\n",
                at(8, 3, "measure covariance needs normal columns without min or max; column 'wait_min' is uniform"));
        assertProblems(COLS + "  depth_m: {dist: normal, mean: 5, sd: 1, min: 0}\n"
                        + "correlation:\n  measure: covariance\n  pairs:\n    depth_m ~ fare_eur: 1\n",
                at(9, 3, "measure covariance needs normal columns without min or max; column 'depth_m' is normal with bounds"));
        assertProblems(COLS + "correlation:\n  measure: covariance\n  order: [wind_knots, fare_eur]\n  matrix:\n    - [15, 1]\n    - [1, 81]\n",
                at(13, 8, "covariance diagonal [1][1] is the variance of wind_knots and must equal its sd² = 16: 15"));
        assertProblems(COLS + "correlation:\n  measure: covariance\n  order: [wind_knots, fare_eur]\n  matrix:\n    - [0, 1]\n    - [1, 81]\n",
                at(13, 8, "covariance diagonal [1][1] (variance of wind_knots) must be > 0: 0"));
        // |cov| ≤ sd·sd (Cauchy–Schwarz): 4 · 9 = 36
        assertProblems(COLS + "correlation:\n  measure: covariance\n  pairs:\n    wind_knots ~ fare_eur: 40\n",
                at(12, 28, "covariance of fare_eur ~ wind_knots must be within ±sd·sd = ±36: 40"));
    }

    // ---- output --------------------------------------------------------------------------------

    @Test
    void output() {
        String c = column("fare_eur: {dist: normal, mean: 48, sd: 9}") + "output:\n";
        assertProblems(c + "  formt: json\n",
                at(7, 3, "unknown key 'formt' in output; did you mean 'format'? (valid: format, file, header, delimiter, null, guard-formulas, report)"));
        assertProblems(c + "  format: xml\n", at(7, 11, "output format must be one of csv, json, jsonl: xml"));
        String file = "output file must be a plain file name or a relative path of such names"
                + " (letters, digits, '.', '_', '-'; no '..', no absolute path): ";
        assertProblems(c + "  file: ../fixtures/ferry.csv\n", at(7, 9, file + "../fixtures/ferry.csv"));
        assertProblems(c + "  file: /tmp/ferry.csv\n", at(7, 9, file + "/tmp/ferry.csv"));
        // YAML 1.1 reads "yes" as a boolean, but the spec wants true or false
        assertProblems(c + "  header: yes\n", at(7, 11, "header must be true or false"));
        assertProblems(c + "  delimiter: \";;\"\n", at(7, 14, "delimiter must be one character other than '\"', CR or LF: \";;\""));
        assertProblems(c + "  null:\n", at(7, 8, "null must be quoted text, e.g. null: \"NA\" or null: \"\""));
        assertProblems(c + "  null: \"N,A\"\n", at(7, 9, "null text must not contain quotes, the delimiter or line breaks: \"N,A\""));
        assertProblems(c + "  format: [csv]\n", at(7, 11, "format must be text"));
    }

    // ---- checks made when compiling a spec file ------------------------------------------------

    @Test
    void engineCompileChecks(@TempDir Path dir) throws Exception {
        Engine engine = Engine.create(Overrides.none());
        String overwrite = column("fare_eur: {dist: normal, mean: 48, sd: 9}") + "output:\n  file: ferry-crossings.report.json\n";
        SpecException e = assertThrows(SpecException.class,
                () -> engine.compile(FILE, overwrite.getBytes(StandardCharsets.UTF_8), ""));
        assertEquals(at(7, 9, "output file ferry-crossings.report.json would clash with the report files"
                + " (ferry-crossings.report.*, letter case ignored); choose another name"), e.getMessage());
        e = assertThrows(SpecException.class, () -> engine.compile(dir.resolve("missing.yaml"), "specs/missing.yaml", ""));
        assertEquals("specs/missing.yaml:1:1: no such spec file", e.getMessage());
        e = assertThrows(SpecException.class, () -> engine.compile(dir, "specs", ""));
        assertEquals("specs:1:1: is a directory, not a spec file", e.getMessage());
        Path big = dir.resolve("big.yaml");
        Files.write(big, new byte[(4 << 20) + 10]);
        e = assertThrows(SpecException.class, () -> engine.compile(big, "specs/big.yaml", ""));
        assertEquals("specs/big.yaml:1:1: spec is 4194314 bytes; the limit is 4194304 bytes (4 MiB)", e.getMessage());
    }
}
