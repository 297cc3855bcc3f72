package dev.standin.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import dev.standin.spec.OutputFormat;
import org.junit.jupiter.api.Test;

class OptionValuesTest {

    @Test
    void rowsAcceptsTheWholeRangeAndNothingElse() throws UsageException {
        assertEquals(0, OptionValues.rows("t", "0"));
        // 2^40 = 1099511627776 (closed form), the spec format's largest row count
        assertEquals(1L << 40, OptionValues.rows("t", "1099511627776"));
        for (String bad : new String[] {"1099511627777", "-1", "1e6", "7.0", " 7", "", "0x10", "99999999999999999999"}) {
            assertThrows(UsageException.class, () -> OptionValues.rows("t", bad), bad);
        }
    }

    @Test
    void seedAcceptsEvery64BitValue() throws UsageException {
        // the int64 range is [-2^63, 2^63 - 1] (Java Language Specification 4.2.1)
        assertEquals(Long.MIN_VALUE, OptionValues.seed("t", "-9223372036854775808"));
        assertEquals(Long.MAX_VALUE, OptionValues.seed("t", "9223372036854775807"));
        assertEquals(42, OptionValues.seed("t", "+42"));
        assertThrows(UsageException.class, () -> OptionValues.seed("t", "-9223372036854775809"));
        assertThrows(UsageException.class, () -> OptionValues.seed("t", "twelve"));
    }

    @Test
    void formatIsOneOfTheThreeWords() throws UsageException {
        assertEquals(OutputFormat.CSV, OptionValues.format("t", "csv"));
        assertEquals(OutputFormat.JSON, OptionValues.format("t", "json"));
        assertEquals(OutputFormat.JSONL, OptionValues.format("t", "jsonl"));
        UsageException e = assertThrows(UsageException.class, () -> OptionValues.format("t", "tsv"));
        assertEquals("--format must be one of csv, json, jsonl: tsv", e.getMessage());
    }
}
