package dev.standin.output;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.io.StringReader;
import java.io.StringWriter;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;

/**
 * The CSV formula guard. The characters that make a spreadsheet read a cell as a formula
 * ({@code = + - @}, tab, carriage return) and the fix (a leading {@code '}, which spreadsheets show
 * as text) are common practice, as listed on OWASP's "CSV Injection" page. Read back with
 * commons-csv as an independent parser.
 */
class CsvFormulaGuardTest {

    private static final CellKind[] KINDS = {CellKind.TEXT, CellKind.NUMBER, CellKind.TEXT};

    private static String write(boolean guard, String[]... rows) throws IOException {
        StringWriter out = new StringWriter();
        CsvRowWriter w = new CsvRowWriter(out, List.of("=label", "amount", "day"), KINDS, true, ',', "", guard);
        w.begin();
        for (String[] r : rows) {
            w.row(r);
        }
        w.end();
        return out.toString();
    }

    private static List<List<String>> read(String csv) throws IOException {
        return CSVFormat.RFC4180.parse(new StringReader(csv)).getRecords().stream().map(CSVRecord::toList).toList();
    }

    @Test
    void formulaLikeTextGetsAQuoteOnlyWhenAskedFor() throws IOException {
        String[][] rows = {
            {"=1+2", "-3.5", "2026-05-17"},
            {"+44 pier", "12", "2026-05-18"},
            {"-north", "0", "2026-05-19"},
            {"@dock", "7", "2026-05-20"},
            {"\tberth", "1", "2026-05-21"},
            {"\rberth", "2", "2026-05-22"},
            {"harbour", "3", "2026-05-23"},
            {"a=b", "4", "2026-05-24"},
            {"", "5", "2026-05-25"},
        };
        assertEquals(List.of(
                List.of("'=label", "amount", "day"),
                List.of("'=1+2", "-3.5", "2026-05-17"),
                List.of("'+44 pier", "12", "2026-05-18"),
                List.of("'-north", "0", "2026-05-19"),
                List.of("'@dock", "7", "2026-05-20"),
                List.of("'\tberth", "1", "2026-05-21"),
                List.of("'\rberth", "2", "2026-05-22"),
                List.of("harbour", "3", "2026-05-23"),
                List.of("a=b", "4", "2026-05-24"),
                List.of("", "5", "2026-05-25")), read(write(true, rows)));
        // numbers are never changed (a negative amount stays a number), and without the guard nothing is
        assertEquals("=label,amount,day\n=1+2,-3.5,2026-05-17\n", write(false, rows[0]));
        assertEquals("'=label,amount,day\n'=1+2,-3.5,2026-05-17\n\"'\rberth\",2,2026-05-22\n", write(true, rows[0], rows[5]));
    }

    @Test
    void missingValuesAreNotGuarded() throws IOException {
        assertEquals("'=label,amount,day\n,,\n", write(true, new String[] {null, null, null}));
    }
}
