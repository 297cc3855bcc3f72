package dev.standin.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.standin.spec.SpecSchema;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Fitted specs validate against the project's JSON Schema of the spec format
 * (dev/standin/spec.schema.json, draft 2020-12), checked with the networknt json-schema-validator
 * (test scope) through {@link SpecSchema}: YAML becomes JSON with the parser's scalar rules, plain
 * numbers as numbers, booleans and null by YAML's tags, everything else text.
 */
class FittedSpecSchemaTest {

    static SpecSchema schema;

    @BeforeAll
    static void load() throws Exception {
        schema = SpecSchema.load();
    }

    static List<String> errors(String yaml) {
        return schema.errors(yaml);
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
