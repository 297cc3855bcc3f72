package dev.standin.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.standin.engine.CompiledSpec;
import dev.standin.engine.Engine;
import dev.standin.spec.Overrides;
import dev.standin.spec.Spec;
import dev.standin.spec.SpecParser;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The privacy safeguards on an invented bakery chain's order table (no real records): rare categories
 * merged, identifiers and free text not modelled, robust bounds, no raw cells in the spec; and that
 * the spec it gives parses with Standin's own parser and generates.
 */
class PrivacySafeguardsTest {

    static final int N = 400;
    static CsvTable table;
    static FitResult fit;
    static List<String> uniqueTexts = new ArrayList<>();

    /** Builds the table: a fixed seed, so it is the same table on every run. */
    @BeforeAll
    static void fitBakery() throws Exception {
        SplittableRandom rnd = new SplittableRandom(4242);
        List<String[]> rows = new ArrayList<>();
        String[] common = {"harbour", "old-town", "station"};
        for (int i = 0; i < N; i++) {
            String orderId = String.valueOf(1000 + i);
            String customer = String.format(Locale.ROOT, "C-%05d", 7 * i + 3);
            // free text: most notes unique, a tenth the same short phrase
            String note = i % 10 == 0 ? "ring twice" : "deliver to door " + (i * 31 + 17) + " ring twice";
            String branch;
            if (i < 6) {
                branch = "lighthouse";              // 6 rows: rare
            } else if (i < 10) {
                branch = "mill-lane";               // 4 rows: rare (rare total 10 = K, so merged into 'other')
            } else {
                branch = common[rnd.nextInt(3)];
            }
            String tin = i < 3 ? "tin-" + i : "tin-common"; // 3 rare levels, 3 rows together: below K, left out
            String total = i % 25 == 0 ? "NA" : String.format(Locale.ROOT, "%.2f", 8 + 30 * rnd.nextDouble() * rnd.nextDouble());
            String ordered = LocalDate.of(2026, 3, 1).plusDays(rnd.nextInt(120)).toString();
            String delivered = rnd.nextInt(5) == 0 ? "false" : "true";
            rows.add(new String[] {orderId, customer, note, branch, tin, total, ordered, delivered});
            uniqueTexts.add(customer);
            if (i % 10 != 0) {
                uniqueTexts.add(note);
            }
        }
        table = CsvTable.of("bakery-orders.csv", List.of("order_id", "customer_ref", "note", "branch", "tin", "total_eur",
                "ordered_on", "delivered"), rows);
        fit = Fitter.fit(table, FitOptions.defaults());
    }

    @Test
    void rareCategoriesAreMergedIntoOneLevelAndTheirLabelsAreNotWritten() {
        ColumnFit branch = fit.column("branch");
        assertEquals(List.of("harbour", "old-town", "station", "other"), branch.levels());
        assertFalse(fit.specText().contains("lighthouse"), "a label seen 6 times must not be copied");
        assertFalse(fit.specText().contains("mill-lane"), "a label seen 4 times must not be copied");
        assertTrue(fit.notes().contains("column 'branch': 2 levels seen fewer than 10 times merged into 'other' (10 rows)"),
                fit.notes().toString());
        // the weights are the shares of the rows: 'other' is 10 of 400
        assertTrue(branch.yaml().contains("    other: 0.025"), branch.yaml().toString());

        ColumnFit tin = fit.column("tin");
        assertEquals(List.of("tin-common"), tin.levels());
        for (int i = 0; i < 3; i++) {
            assertFalse(fit.specText().contains("tin-" + i));
        }
        assertTrue(fit.notes().contains("column 'tin': 3 levels seen fewer than 10 times (3 rows together, also fewer"
                + " than 10) left out of the weights"), fit.notes().toString());
    }

    @Test
    void aLargerThresholdAndAnotherLabelAreHonoured() throws Exception {
        FitResult strict = Fitter.fit(table, new FitOptions(null, null, null, 200, "rare-branches"));
        // with K = 200 the three common branches (about 130 rows each) are rare too
        assertEquals(List.of("rare-branches"), strict.column("branch").levels());
        FitException e = assertThrows(FitException.class, () -> Fitter.fit(table, new FitOptions(null, null, null, 10, "harbour")));
        assertEquals("other-label must differ from the levels of column 'branch': harbour", e.getMessage());
    }

    @Test
    void identifiersBecomeSequencesAndFreeTextIsLeftOut() {
        assertEquals(ColumnFit.Role.SEQUENCE, fit.column("order_id").role());
        assertEquals(ColumnFit.Role.SEQUENCE, fit.column("customer_ref").role());
        assertEquals(ColumnFit.Role.DROPPED, fit.column("note").role());
        assertTrue(fit.specText().contains("order_id: {dist: sequence, start: 1, step: 1}"));
        assertTrue(fit.specText().contains("customer_ref: {dist: sequence, start: 1, step: 1}"));
        assertFalse(fit.specText().contains("\n  note:"), "free text must not be a column");
        assertTrue(fit.notes().contains("column 'note': 360 of 400 values occur only once: looks like free text or an"
                + " identifier; left out"), fit.notes().toString());
        assertFalse(fit.specText().contains("ring twice"));
        for (String t : uniqueTexts) {
            assertFalse(fit.specText().contains(t), "raw cell copied: " + t);
        }
        // the real first order number is not copied either: the sequence starts at 1
        assertFalse(fit.specText().contains("1000"));
    }

    @Test
    void dateBoundsComeFromRobustQuantilesNotTheRealExtremes() {
        double[] days = ColumnData.of(table, table.column("ordered_on")).sortedPresent();
        String yaml = fit.column("ordered_on").yaml().get(0);
        String first = LocalDate.ofEpochDay((long) days[0]).toString();
        String last = LocalDate.ofEpochDay((long) days[days.length - 1]).toString();
        assertFalse(yaml.contains(first), yaml + " contains the first real date " + first);
        assertFalse(yaml.contains(last), yaml + " contains the last real date " + last);
        assertTrue(yaml.startsWith("ordered_on: {dist: date, from: 2026-"), yaml);
    }

    @Test
    void missingMarkersBecomeNulls() {
        ColumnFit total = fit.column("total_eur");
        assertEquals(ColumnKind.DECIMAL, total.kind());
        assertEquals(16.0 / N, total.nulls(), 0.0); // every 25th row is NA
        assertTrue(total.yaml().get(0).contains("nulls: 0.04"), total.yaml().get(0));
        assertTrue(total.yaml().get(0).contains("decimals: 2"), total.yaml().get(0));
        ColumnFit delivered = fit.column("delivered");
        assertEquals("bernoulli", delivered.family());
    }

    @Test
    void theMarkersReadAsMissingAreTheDocumentedOnes() {
        for (String m : List.of("", " ", "NA", "N/A", "null", "NULL", "NaN", "-")) {
            assertTrue(Cells.missing(m), m);
        }
        for (String m : List.of("0", "n/a!", "none", "--")) {
            assertFalse(Cells.missing(m), m);
        }
    }

    @Test
    void typesAreInferredAsDocumented() throws Exception {
        CsvTable t = CsvReader.parse("types.csv", "i,d,b,dt,ts,code,txt\n"
                + "1,1.5,true,2026-01-02,2026-01-02T03:04:05Z,007,a\n"
                + "-2,2,FALSE,2026-02-03,2026-01-02T03:04:05+01:00,012,b\n"
                + "NA,1e-3,,,,,\n");
        List<ColumnKind> kinds = new ArrayList<>();
        for (int j = 0; j < t.header().size(); j++) {
            kinds.add(ColumnData.of(t, j).kind());
        }
        assertEquals(List.of(ColumnKind.INTEGER, ColumnKind.DECIMAL, ColumnKind.BOOLEAN, ColumnKind.DATE,
                ColumnKind.TIMESTAMP, ColumnKind.TEXT, ColumnKind.TEXT), kinds);
        // 1e-3 is written with 3 decimals; the offset instant is read as UTC 02:04:05 (ISO 8601)
        assertEquals(3, ColumnData.of(t, 1).decimals());
        assertEquals(java.time.Instant.parse("2026-01-02T02:04:05Z").getEpochSecond(), ColumnData.of(t, 4).values()[1], 0.0);
    }

    @Test
    void theSpecParsesWithStandinsOwnParserAndGenerates(@TempDir Path dir) throws Exception {
        Spec spec = SpecParser.withOverrides(Overrides.none()).parse("bakery.yaml", fit.specText().getBytes(StandardCharsets.UTF_8));
        assertEquals("bakery-orders", spec.dataset());
        assertEquals(N, spec.rows());
        assertEquals(List.of("order_id", "customer_ref", "branch", "tin", "total_eur", "ordered_on", "delivered"),
                spec.columns().stream().map(c -> c.name()).toList());
        Engine engine = Engine.create(Overrides.none()).withoutHtmlReport();
        CompiledSpec c = engine.compile("bakery.yaml", fit.specText().getBytes(StandardCharsets.UTF_8), "");
        assertEquals(List.of(), c.warnings());
        engine.generate(c, dir);
        CsvTable out = CsvReader.read(dir.resolve(c.dataFile()), "out.csv");
        assertEquals(N, out.size());
        Path schema = Path.of("src/main/resources/dev/standin/spec.schema.json");
        // the project's JSON Schema for specs, when it exists, is checked by the schema's own tests; note its absence
        if (!Files.exists(schema)) {
            System.out.println("spec.schema.json is absent: the fitted spec is checked by the parser only");
        }
    }

    @Test
    void awkwardNamesAndLabelsAreQuotedSoTheParserReadsThemBack() throws Exception {
        List<String[]> rows = new ArrayList<>();
        String[] labels = {"yes", "1:20", "a: b", "#hash", "\"q\"", "~", "ünï"};
        for (int i = 0; i < 70; i++) {
            rows.add(new String[] {labels[i % labels.length], String.valueOf(i % 3 == 0)});
        }
        CsvTable t = CsvTable.of("odd.csv", List.of("label: odd", "on"), rows);
        FitResult r = Fitter.fit(t, FitOptions.defaults());
        Spec spec = SpecParser.withOverrides(Overrides.none()).parse("odd.yaml", r.specText().getBytes(StandardCharsets.UTF_8));
        assertEquals(List.of("label: odd", "on"), spec.columns().stream().map(c -> c.name()).toList());
        dev.standin.spec.ColumnSpec.Random c = (dev.standin.spec.ColumnSpec.Random) spec.column("label: odd");
        List<String> read = new ArrayList<>();
        for (int i = 0; i < labels.length; i++) {
            read.add(c.marginal().label(i));
        }
        List<String> expected = new ArrayList<>(List.of(labels));
        expected.sort(Fitter::compareLabels);
        assertEquals(expected, read);
    }

    @Test
    void theDatasetNameIsDerivedFromTheFileName() {
        assertEquals("bakery-orders", Fitter.datasetName("data/bakery-orders.csv"));
        assertEquals("ferry-log-2026", Fitter.datasetName("Ferry Log 2026.CSV"));
        assertEquals("con-data", Fitter.datasetName("con.csv"));
        assertEquals("fitted", Fitter.datasetName("...csv"));
        assertNotEquals("", Fitter.datasetName("_.csv"));
    }

    @Test
    void settingsOutsideTheirRangeNameTheSetting() {
        assertEquals("min-category-count must be a whole number from 1 to 1000000: 0",
                assertThrows(IllegalArgumentException.class, () -> new FitOptions(null, null, null, 0, "other")).getMessage());
        assertEquals("dataset must match [a-z0-9][a-z0-9_-]* (at most 128 characters): Bad Name",
                assertThrows(IllegalArgumentException.class, () -> new FitOptions("Bad Name", null, null, 10, "other")).getMessage());
    }
}
