package dev.standin.fit;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;

/** The hand-written RFC 4180 reader against Apache Commons CSV 1.10.0 (test scope) and RFC 4180's rules. */
class CsvReaderTest {

    /** Every record as Commons CSV's RFC 4180 format reads it (its documented CSVFormat.RFC4180). */
    private static List<List<String>> commons(String text) throws IOException {
        List<List<String>> out = new ArrayList<>();
        try (CSVParser p = CSVFormat.RFC4180.parse(new StringReader(text))) {
            for (CSVRecord r : p) {
                out.add(r.toList());
            }
        }
        return out;
    }

    private static List<List<String>> ours(String text) throws FitException {
        CsvTable t = CsvReader.parse("t.csv", text);
        List<List<String>> out = new ArrayList<>();
        out.add(t.header());
        for (String[] r : t.rows()) {
            out.add(List.of(r));
        }
        return out;
    }

    @Test
    void quotedFieldsEmbeddedLineBreaksAndDoubledQuotesReadAsCommonsCsvReadsThem() throws Exception {
        String[] cases = {
            "a,b\n1,2\n",
            "a,b\r\n1,2\r\n",
            "a,b\n1,2",
            "a,b\n\"x,y\",\"he said \"\"hi\"\"\"\n",
            "a,b\n\"line one\nline two\",3\n",
            "a,b\r\n\"line one\r\nline two\",3\r\n",
            "a,b\n\"\",\n",
            "a,b,c\n,,\n\"\",\"\",\"\"\n",
            "name,note\nx,5\" pipe\n",          // a quote inside an unquoted field is kept, as Commons CSV does
            "a,b\n\"ünïcödé ✓\",\"日本\"\n",
            "a,b\n1,2\r3,4\r",                   // lone CR record ends
        };
        for (String c : cases) {
            assertEquals(commons(c), ours(c), c);
        }
    }

    /**
     * Random tables written with RFC 4180 quoting (quotes doubled, fields with ',', '"', CR or LF
     * quoted; randomly also quoting other fields), with CRLF or LF record ends and with or without a
     * final line break, read by both parsers. Fixed seed; the fields draw from a small alphabet rich in
     * the special characters.
     */
    @Test
    void randomRfc4180TablesReadAsCommonsCsvReadsThem() throws Exception {
        SplittableRandom rnd = new SplittableRandom(20261201);
        String alphabet = "ab ,\"\n\r\t;é1";
        for (int t = 0; t < 400; t++) {
            int cols = 2 + rnd.nextInt(4);
            int rows = 1 + rnd.nextInt(6);
            String eol = rnd.nextBoolean() ? "\r\n" : "\n";
            StringBuilder sb = new StringBuilder();
            for (int r = 0; r <= rows; r++) {
                for (int c = 0; c < cols; c++) {
                    if (c > 0) {
                        sb.append(',');
                    }
                    StringBuilder f = new StringBuilder();
                    int len = r == 0 ? 1 + rnd.nextInt(4) : rnd.nextInt(6);
                    for (int i = 0; i < len; i++) {
                        f.append(alphabet.charAt(rnd.nextInt(alphabet.length())));
                    }
                    String field = r == 0 ? "h" + c + f.toString().replaceAll("[^a-z1]", "") : f.toString();
                    boolean special = field.matches("(?s).*[,\"\r\n].*");
                    if (special || rnd.nextInt(4) == 0) {
                        sb.append('"').append(field.replace("\"", "\"\"")).append('"');
                    } else {
                        sb.append(field);
                    }
                }
                if (r < rows || rnd.nextBoolean()) {
                    sb.append(eol);
                }
            }
            String text = sb.toString();
            List<List<String>> expected = commons(text);
            // a record that is one empty unquoted line is skipped by ours (it cannot be a record of a
            // table with 2+ columns) and read as one empty field by Commons CSV: such tables are not generated
            assertEquals(expected, ours(text), text);
        }
    }

    @Test
    void blankLinesAreSkippedInMultiColumnFilesAndAreMissingValuesInSingleColumnOnes() throws Exception {
        CsvTable t = CsvReader.parse("t.csv", "a,b\n1,2\n\n3,4\n\n");
        assertEquals(2, t.size());
        assertArrayEquals(new int[] {2, 4}, t.lines());
        CsvTable one = CsvReader.parse("t.csv", "a\n1\n\n2\n");
        assertEquals(3, one.size());
        assertEquals("", one.rows().get(1)[0]);
    }

    @Test
    void aByteOrderMarkIsSkipped() throws Exception {
        assertEquals(List.of("a", "b"), CsvReader.parse("t.csv", "\uFEFFa,b\n1,2\n").header());
    }

    private static String problem(String text) {
        return assertThrows(FitException.class, () -> CsvReader.parse("t.csv", text)).getMessage();
    }

    @Test
    void malformedFilesAreOneLineErrorsAtFileLineColumn() {
        assertEquals("t.csv:2:3: quoted field is not closed: a '\"' is missing before the end of the file",
                problem("a,b\n1,\"open\n2,3\n"));
        assertEquals("t.csv:2:6: a quoted field must end at its closing '\"'; found 'x' after it (write \"\" for a quote"
                + " inside the field)", problem("a,b\n1,\"q\"x,\n"));
        assertEquals("t.csv:3:1: record has 3 fields; the header has 2", problem("a,b\n1,2\n1,2,3\n"));
        assertEquals("t.csv:1:3: column name 'a' is given twice (columns 1 and 2); column names must be distinct",
                problem("a,a\n1,2\n"));
        assertEquals("t.csv:1:3: column 2 has no name; every header field must name its column", problem("a,,c\n1,2,3\n"));
        assertEquals("t.csv:1:1: data file is empty; it needs a header row naming the columns", problem(""));
        // the line of a record after a quoted field with a line break is counted from the physical lines
        assertEquals("t.csv:4:1: record has 1 field; the header has 2", problem("a,b\n\"x\ny\",1\nz\n"));
    }

    @Test
    void invalidUtf8IsAnErrorAtItsLine() {
        byte[] bytes = "a,b\n1,2\n3,".getBytes(StandardCharsets.UTF_8);
        byte[] bad = java.util.Arrays.copyOf(bytes, bytes.length + 2);
        bad[bytes.length] = (byte) 0xC3;
        bad[bytes.length + 1] = (byte) 0x28; // 0xC3 must be followed by a continuation byte (RFC 3629)
        FitException e = assertThrows(FitException.class, () -> CsvReader.decode("t.csv", bad));
        assertEquals("t.csv:3:3: data file is not valid UTF-8 text (byte 11)", e.getMessage());
    }
}
