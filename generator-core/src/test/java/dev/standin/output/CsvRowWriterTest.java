package dev.standin.output;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.io.StringReader;
import java.io.StringWriter;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;

/**
 * CSV output against RFC 4180 section 2 (Y. Shafranovich, "Common Format and MIME Type for
 * Comma-Separated Values (CSV) Files", 2005) and read back with commons-csv as an independent parser.
 * Rule 5: a field may be enclosed in double quotes; rule 6: fields containing line breaks (CR, LF),
 * double quotes or commas should be enclosed in double quotes; rule 7: a double quote inside a
 * quoted field is escaped by preceding it with another double quote. Records end with LF (the
 * writer's documented choice) rather than rule 1's CRLF.
 */
class CsvRowWriterTest {

    private static String write(List<String> names, CellKind[] kinds, boolean header, char delimiter, String nullText,
                                String[]... rows) throws IOException {
        StringWriter out = new StringWriter();
        CsvRowWriter w = new CsvRowWriter(out, names, kinds, header, delimiter, nullText);
        w.begin();
        for (String[] r : rows) {
            w.row(r);
        }
        w.end();
        return out.toString();
    }

    private static String oneText(String value) throws IOException {
        return write(List.of("note"), new CellKind[] {CellKind.TEXT}, false, ',', "", new String[] {value});
    }

    @Test
    void plainFieldsAreNotQuoted() throws IOException {
        // rule 5: quoting is optional; the writer quotes only where rule 6 requires it
        assertEquals("harbour\n", oneText("harbour"));
        assertEquals("x,12.5,7\n", write(List.of("a", "b", "c"),
                new CellKind[] {CellKind.TEXT, CellKind.NUMBER, CellKind.NUMBER}, false, ',', "", new String[] {"x", "12.5", "7"}));
    }

    @Test
    void rule6FieldsWithCommaQuoteCrOrLfAreQuoted() throws IOException {
        assertEquals("\"Pier 4, east\"\n", oneText("Pier 4, east"));
        assertEquals("\"line one\nline two\"\n", oneText("line one\nline two"));
        assertEquals("\"ends with CR\r\"\n", oneText("ends with CR\r"));
        assertEquals("\"a\r\nb\"\n", oneText("a\r\nb"));
    }

    @Test
    void rule7QuotesAreDoubled() throws IOException {
        assertEquals("\"the \"\"Swift\"\" ferry\"\n", oneText("the \"Swift\" ferry"));
        assertEquals("\"\"\"\"\n", oneText("\""));
        assertEquals("\"\"\"\"\"\"\n", oneText("\"\""));
    }

    @Test
    void spacesAndNullTextLookalikesAreQuoted() throws IOException {
        // RFC 4180 rule 4: spaces are part of a field; quoted so that no reader trims them
        assertEquals("\" padded \"\n", oneText(" padded "));
        // a text equal to the missing-value text is quoted so that it reads back as text
        assertEquals("\"\"\n", oneText(""));
        assertEquals("\"NA\",NA\n", write(List.of("a", "b"), new CellKind[] {CellKind.TEXT, CellKind.TEXT}, false, ',', "NA",
                new String[] {"NA", null}));
    }

    @Test
    void missingValuesUseTheNullText() throws IOException {
        assertEquals(",1\n", write(List.of("a", "b"), new CellKind[] {CellKind.NUMBER, CellKind.NUMBER}, false, ',', "",
                new String[] {null, "1"}));
        assertEquals("NA;1\n", write(List.of("a", "b"), new CellKind[] {CellKind.NUMBER, CellKind.NUMBER}, false, ';', "NA",
                new String[] {null, "1"}));
    }

    @Test
    void customDelimiter() throws IOException {
        CellKind[] kinds = {CellKind.TEXT, CellKind.NUMBER};
        // with ';' a comma needs no quotes but a ';' does
        assertEquals("name;fare\nPier 4, east;12.5\n\"a;b\";3\n", write(List.of("name", "fare"), kinds, true, ';', "",
                new String[] {"Pier 4, east", "12.5"}, new String[] {"a;b", "3"}));
        assertEquals("name\tfare\n\"a\tb\"\t3\n", write(List.of("name", "fare"), kinds, true, '\t', "",
                new String[] {"a\tb", "3"}));
    }

    @Test
    void headerOnAndOff() throws IOException {
        CellKind[] kinds = {CellKind.NUMBER, CellKind.NUMBER};
        assertEquals("crossing_id,\"wind, knots\"\n1,12.5\n", write(List.of("crossing_id", "wind, knots"), kinds, true, ',', "",
                new String[] {"1", "12.5"}));
        assertEquals("1,12.5\n", write(List.of("crossing_id", "wind, knots"), kinds, false, ',', "", new String[] {"1", "12.5"}));
        // no rows: the header alone, or nothing
        assertEquals("crossing_id,\"wind, knots\"\n", write(List.of("crossing_id", "wind, knots"), kinds, true, ',', ""));
        assertEquals("", write(List.of("crossing_id", "wind, knots"), kinds, false, ',', ""));
    }

    @Test
    void commonsCsvReadsBackEveryField() throws IOException {
        String[] awkward = {"plain", "Pier 4, east", "say \"ahoy\"", "two\nlines", "cr\rhere", "crlf\r\nhere", " lead",
            "trail ", "", "\"", "ümlaut – dash", "semi;colon", "tab\tbed"};
        List<String> names = new ArrayList<>();
        CellKind[] kinds = new CellKind[awkward.length];
        for (int i = 0; i < awkward.length; i++) {
            names.add("c" + i);
            kinds[i] = CellKind.TEXT;
        }
        for (char delimiter : new char[] {',', ';', '\t', '|'}) {
            String text = write(names, kinds, true, delimiter, "", awkward, awkward);
            List<CSVRecord> records = CSVFormat.RFC4180.builder().setDelimiter(delimiter).build()
                    .parse(new StringReader(text)).getRecords();
            assertEquals(3, records.size(), "delimiter " + delimiter);
            assertEquals(names, Arrays.asList(records.get(0).values()));
            for (int r = 1; r < 3; r++) {
                assertEquals(Arrays.asList(awkward), Arrays.asList(records.get(r).values()), "delimiter " + delimiter);
            }
        }
    }
}
