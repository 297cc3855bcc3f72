package dev.standin.spec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import dev.standin.engine.Engine;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Specs written to hurt: alias bombs, tags that would construct objects, huge numbers, huge
 * correlation blocks, thousands of mistakes, and every documented limit at its edge (just inside
 * works, just outside is an exact {@code FILE:LINE:COLUMN: message}). Each hostile case runs under a
 * preemptive timeout, a hang guard rather than a speed check.
 */
class HostileSpecTest {

    private static final String FILE = "specs/depot.yaml";
    private static final String HEAD = "dataset: depot\nrows: 100\nseed: 7\ncolumns:\n";
    private static final Duration HANG_GUARD = Duration.ofSeconds(20);

    private static Spec parse(String yaml) throws SpecException {
        return SpecParser.withOverrides(Overrides.none()).parse(FILE, yaml.getBytes(StandardCharsets.UTF_8));
    }

    private static List<String> problems(String yaml) {
        return assertTimeoutPreemptively(HANG_GUARD, () -> {
            try {
                parse(yaml);
            } catch (SpecException e) {
                return e.problems().stream().map(SpecProblem::toString).toList();
            }
            return fail("spec was accepted");
        });
    }

    private static void assertProblems(String yaml, String... expected) {
        assertEquals(Arrays.asList(expected), problems(yaml));
    }

    private static void assertAccepted(String yaml) {
        assertTimeoutPreemptively(HANG_GUARD, () -> parse(yaml));
    }

    private static String at(int line, int column, String message) {
        return FILE + ":" + line + ":" + column + ": " + message;
    }

    // ---- YAML ----------------------------------------------------------------------------------

    @Test
    void aBillionLaughsIsRejected() {
        // the classic: ten levels of nine aliases each (9^10 "lol"s if expanded); snakeyaml counts
        // aliases to collections while composing and stops at the 51st (LoaderOptions, max 50),
        // without a place in the file
        StringBuilder sb = new StringBuilder(HEAD + "  line: {dist: categorical, levels: [a]}\nlol: &l0 [lol, lol, lol, lol, lol, lol, lol, lol, lol]\n");
        for (int i = 1; i <= 9; i++) {
            sb.append("l").append(i).append(": &l").append(i).append(" [")
                    .append(String.join(", ", Collections.nCopies(9, "*l" + (i - 1)))).append("]\n");
        }
        assertProblems(sb.toString(), at(1, 1, "not valid YAML: Number of aliases for non-scalar nodes exceeds the specified max=50"));
    }

    @Test
    void anAliasGraphUnderTheAliasLimitIsNeverExpanded() {
        // 25 levels of two aliases each stay under the limit of 50 but denote 2^25 leaves; the spec is
        // composed as a graph and read without walking every path, so it is rejected at once. (The
        // anchors stand under an unknown top-level key, one problem each.)
        StringBuilder sb = new StringBuilder("a0: &a0 [x, y]\n");
        for (int i = 1; i <= 24; i++) {
            sb.append("a").append(i).append(": &a").append(i).append(" [*a").append(i - 1).append(", *a").append(i - 1).append("]\n");
        }
        String anchors = sb.toString();
        List<String> p = problems("dataset: depot\nrows: 100\nseed: 7\n" + anchors
                + "columns:\n  line: {dist: categorical, levels: *a24}\n");
        assertEquals(26, p.size(), p.toString());
        // the first item of *a24 is the list anchored as a23, written on line 27
        assertEquals(at(27, 6, "levels must list labels as plain text"), p.get(25));
        p = problems("dataset: depot\nrows: 100\nseed: 7\n" + anchors + "columns:\n  a: {dist: normal, mean: 0, sd: 1}\n"
                + "  b: {dist: normal, mean: 0, sd: 1}\ncorrelation:\n  order: [a, b]\n  matrix: *a24\n");
        assertEquals(26, p.size(), p.toString());
        // row 1 of *a24 is the a23 list (two entries, as order wants); its first entry is the a22 list
        assertEquals(at(26, 6, "matrix entry [1][1] must be a number"), p.get(25));
    }

    @Test
    void tagsThatWouldConstructObjectsAreRefused() {
        assertProblems(HEAD + "  a: !!javax.script.ScriptEngineManager [!!java.net.URLClassLoader [[!!java.net.URL [\"http://x\"]]]]\n",
                at(5, 6, "not valid YAML: Global tag is not allowed: tag:yaml.org,2002:javax.script.ScriptEngineManager"));
        // a %TAG directive turns a short handle into a global tag of any name
        assertProblems("%TAG !j! tag:yaml.org,2002:java.lang.\n---\n" + HEAD.replace("dataset: depot", "dataset: !j!Object x")
                + "  a: {dist: sequence}\n", at(3, 10, "not valid YAML: Global tag is not allowed: tag:yaml.org,2002:java.lang.Object"));
        // standard collection tags outside the plain ones
        assertProblems(HEAD + "  a: !!set {x, y}\n", at(5, 6, "tag tag:yaml.org,2002:set is not allowed; write plain values"));
        assertProblems(HEAD + "  a: !!omap [{x: 1}]\n", at(5, 6, "tag tag:yaml.org,2002:omap is not allowed; write plain values"));
    }

    @Test
    void duplicateKeysNameBothPlacesAtEveryLevel() {
        assertProblems(HEAD + "  line: {dist: categorical, levels: {north: 1, south: 2, north: 3}}\n",
                at(5, 58, "duplicate key 'north' (first given at line 5, column 38)"));
        assertProblems(HEAD + "  a: {dist: normal, mean: 0, sd: 1}\n  b: {dist: normal, mean: 0, sd: 1}\n"
                + "correlation:\n  pairs:\n    a ~ b: 0.5\n    a ~ b: 0.6\n", at(10, 5, "duplicate key 'a ~ b' (first given at line 9, column 5)"));
        assertProblems(HEAD + "  a: {dist: sequence}\noutput:\n  header: true\n  header: false\n",
                at(8, 3, "duplicate key 'header' (first given at line 7, column 3)"));
    }

    @Test
    void nestingDeeperThanFiftyIsRejected() {
        String deep = HEAD + "  a: " + "{x: ".repeat(60) + "1" + "}".repeat(60) + "\n";
        List<String> p = problems(deep);
        assertEquals(1, p.size(), p.toString());
        assertTrue(p.get(0).contains("not valid YAML: Nesting Depth exceeded max 50"), p.get(0));
    }

    @Test
    void aMillionDigitNumberIsRefusedWithoutParsingIt() {
        // BigDecimal needs tens of seconds for a million digits; the length is checked first
        String digits = "1" + "0".repeat(999_000);
        assertProblems(HEAD.replace("rows: 100", "rows: " + digits) + "  a: {dist: sequence}\n",
                at(2, 7, "rows must be a number of at most 100 characters: " + digits.substring(0, 200) + "... (999001 characters)"));
        String hundred = "0." + "0".repeat(97) + "1";
        assertEquals(100, hundred.length());
        assertAccepted(HEAD + "  a: {dist: normal, mean: " + hundred + ", sd: 1}\n");
    }

    @Test
    void thousandsOfMistakesAreListedUpToAHundred() {
        StringBuilder sb = new StringBuilder(HEAD);
        for (int i = 0; i < 5000; i++) {
            sb.append("  c").append(i).append(": {dist: nonsense}\n");
        }
        List<String> p = problems(sb.toString());
        assertEquals(Problems.LISTED + 1, p.size());
        assertTrue(p.get(0).startsWith(at(5, 14, "unknown dist 'nonsense'")), p.get(0));
        assertEquals(at(105, 16, "4900 more problems not listed (the first 100 are above)"), p.get(100));
    }

    // ---- limits at their edges -----------------------------------------------------------------

    @Test
    void rowsFromZeroTo2To40() throws SpecException {
        assertEquals(0, parse(HEAD.replace("rows: 100", "rows: 0") + "  a: {dist: sequence}\n").rows());
        assertEquals(1L << 40, parse(HEAD.replace("rows: 100", "rows: 1099511627776") + "  a: {dist: sequence}\n").rows());
        assertProblems(HEAD.replace("rows: 100", "rows: 1099511627777") + "  a: {dist: sequence}\n",
                at(2, 7, "rows must be a whole number from 0 to 2^40 (1099511627776): 1099511627777"));
        assertProblems(HEAD.replace("rows: 100", "rows: -1") + "  a: {dist: sequence}\n",
                at(2, 7, "rows must be a whole number from 0 to 2^40 (1099511627776): -1"));
    }

    @Test
    void tenThousandColumns() throws SpecException {
        StringBuilder sb = new StringBuilder(HEAD);
        for (int i = 0; i < SpecParser.MAX_COLUMNS; i++) {
            sb.append("  c").append(i).append(": {dist: sequence}\n");
        }
        assertEquals(10_000, parse(sb.toString()).columns().size());
        sb.append("  one_more: {dist: sequence}\n");
        assertProblems(sb.toString(), at(5, 3, "columns has 10001 entries; the limit is 10000"));
    }

    @Test
    void correlationBlocksOfAtMost500Columns() {
        StringBuilder cols = new StringBuilder(HEAD);
        for (int i = 0; i <= SpecParser.MAX_CORRELATED; i++) {
            cols.append("  c").append(i).append(": {dist: normal, mean: 0, sd: 1}\n");
        }
        StringBuilder pairs = new StringBuilder(cols).append("correlation:\n  pairs:\n");
        for (int i = 1; i <= SpecParser.MAX_CORRELATED; i++) {
            pairs.append("    c0 ~ c").append(i).append(": 0.01\n");
        }
        assertProblems(pairs.toString(), at(508, 5, "pairs must involve at most 500 columns: 501"));
        List<String> names = new ArrayList<>();
        for (int i = 0; i <= SpecParser.MAX_CORRELATED; i++) {
            names.add("c" + i);
        }
        String order = cols + "correlation:\n  order: [" + String.join(", ", names) + "]\n  matrix: []\n";
        assertProblems(order, at(507, 10, "order must name at most 500 columns: 501"));
    }

    @Test
    void decimalsFrom0To15() throws SpecException {
        assertEquals(15, ((ColumnSpec.Random) parse(HEAD + "  a: {dist: normal, mean: 0, sd: 1, decimals: 15}\n").columns().get(0)).decimals());
        assertEquals(0, ((ColumnSpec.Random) parse(HEAD + "  a: {dist: normal, mean: 0, sd: 1, decimals: 0}\n").columns().get(0)).decimals());
        assertProblems(HEAD + "  a: {dist: normal, mean: 0, sd: 1, decimals: 16}\n", at(5, 47, "decimals must be a whole number from 0 to 15: 16"));
        assertProblems(HEAD + "  a: {dist: normal, mean: 0, sd: 1, decimals: -1}\n", at(5, 47, "decimals must be a whole number from 0 to 15: -1"));
    }

    @Test
    void onlyFiniteNumbers() {
        // 1.8e308 is past Double.MAX_VALUE (about 1.7977e308, IEEE 754 binary64)
        for (String v : new String[] {".inf", "-.Inf", "+.INF", ".nan", ".NaN", "1.8e308", "-1e309"}) {
            assertProblems(HEAD + "  a: {dist: normal, mean: " + v + ", sd: 1}\n", at(5, 27, "mean must be a finite number: " + v));
        }
        assertAccepted(HEAD + "  a: {dist: normal, mean: 1.7976931348623157e308, sd: 1}\n");
    }

    @Test
    void levelsFrom1To10000() throws SpecException {
        List<String> labels = new ArrayList<>();
        for (int i = 0; i < 10_000; i++) {
            labels.add("l" + i);
        }
        parse(HEAD + "  a: {dist: categorical, levels: [" + String.join(", ", labels) + "]}\n");
        labels.add("l10000");
        assertProblems(HEAD + "  a: {dist: categorical, levels: [" + String.join(", ", labels) + "]}\n",
                at(5, 34, "levels must name 1 to 10000 labels: 10001"));
        assertProblems(HEAD + "  a: {dist: categorical, levels: []}\n", at(5, 34, "levels must name 1 to 10000 labels: 0"));
    }

    @Test
    void quantilePointsFrom2To1000() throws SpecException {
        assertProblems(HEAD + "  a: {dist: quantiles, points: {0: 1}}\n", at(5, 32, "points must have 2 to 1000 entries: 1"));
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < 1000; i++) {
            sb.append(i == 0 ? "" : ", ").append(i == 999 ? "1" : Double.toString(i / 999.0)).append(": ").append(i);
        }
        parse(HEAD + "  a: {dist: quantiles, points: {" + sb + "}}\n");
        assertProblems(HEAD + "  a: {dist: quantiles, points: {" + sb + ", 2: 5000}}\n", at(5, 32, "points must have 2 to 1000 entries: 1001"));
    }

    @Test
    void sequencesAtThe64BitEdges(@TempDir Path dir) throws Exception {
        // start + step × (rows − 1) must stay within [−2^63, 2^63 − 1] (Java Language Specification, 4.2.1)
        String max = "9223372036854775807";
        assertAccepted(HEAD.replace("rows: 100", "rows: 3") + "  a: {dist: sequence, start: 9223372036854775805}\n");
        assertProblems(HEAD.replace("rows: 100", "rows: 4") + "  a: {dist: sequence, start: 9223372036854775805}\n",
                at(5, 7, "sequence overflows a 64-bit integer: start 9223372036854775805 + step 1 × (rows − 1 = 3) is outside ±" + max));
        assertAccepted(HEAD.replace("rows: 100", "rows: 3") + "  a: {dist: sequence, start: -9223372036854775806, step: -1}\n");
        assertProblems(HEAD.replace("rows: 100", "rows: 2") + "  a: {dist: sequence, start: -9223372036854775808, step: -1}\n",
                at(5, 58, "sequence overflows a 64-bit integer: start -9223372036854775808 + step -1 × (rows − 1 = 1) is outside ±" + max));
        // a step that alone overflows when multiplied, and the largest row count with step 0
        assertProblems(HEAD.replace("rows: 100", "rows: 3") + "  a: {dist: sequence, start: 0, step: 4611686018427387904}\n",
                at(5, 39, "sequence overflows a 64-bit integer: start 0 + step 4611686018427387904 × (rows − 1 = 2) is outside ±" + max));
        assertAccepted(HEAD.replace("rows: 100", "rows: 1099511627776") + "  a: {dist: sequence, start: " + max + ", step: 0}\n");
        // and the values written at the edge are exact
        Engine engine = Engine.create(Overrides.none()).withoutHtmlReport();
        String spec = HEAD.replace("rows: 100", "rows: 3") + "  a: {dist: sequence, start: 9223372036854775805}\n"
                + "  b: {dist: sequence, start: -9223372036854775806, step: -1}\n";
        engine.generate(engine.compile(FILE, spec.getBytes(StandardCharsets.UTF_8), ""), dir);
        assertEquals(List.of("a,b", "9223372036854775805,-9223372036854775806", "9223372036854775806,-9223372036854775807",
                max + ",-9223372036854775808"), Files.readAllLines(dir.resolve("depot.csv")));
    }

    // ---- names that would leave the output folder or hit a device ------------------------------

    @Test
    void outputFileNamesStayPlainAndRelative() {
        String file = "output file must be a plain file name or a relative path of such names"
                + " (letters, digits, '.', '_', '-'; no '..', no absolute path): ";
        String c = HEAD + "  a: {dist: sequence}\noutput:\n  file: ";
        for (String bad : new String[] {"../depot.csv", "sub/../../depot.csv", "/etc/depot.csv", "C:depot.csv", "C:/depot.csv",
            "sub\\\\depot.csv", ".hidden.csv", "sub//depot.csv", "sub/./depot.csv", "depot.csv/"}) {
            String shown = bad.replace("\\\\", "\\");
            assertProblems(c + "\"" + bad + "\"\n", at(7, 9, file + shown));
        }
        String device = "output file must not use a name Windows reserves for a device (CON, PRN, AUX, NUL, COM1-COM9, LPT1-LPT9,"
                + " with any extension): ";
        assertProblems(c + "CON.csv\n", at(7, 9, device + "CON.csv"));
        assertProblems(c + "sub/lpt1.tar.gz\n", at(7, 9, device + "sub/lpt1.tar.gz"));
        assertProblems(c + "depot.csv.\n", at(7, 9, "output file names must not end in '.' (Windows drops it): depot.csv."));
        assertProblems(HEAD.replace("dataset: depot", "dataset: nul") + "  a: {dist: sequence}\n",
                at(1, 10, "dataset must not be a name Windows reserves for a device (CON, PRN, AUX, NUL, COM1-COM9, LPT1-LPT9): nul"));
        assertAccepted(c + "console.csv\n");
    }

    @Test
    void theFormulaGuardKey() throws SpecException {
        String c = HEAD + "  a: {dist: sequence}\noutput:\n";
        assertFalse(parse(c + "  format: csv\n").output().guardFormulas(), "off unless asked for");
        assertTrue(parse(c + "  guard-formulas: true\n").output().guardFormulas());
        assertFalse(parse(c + "  guard-formulas: false\n").output().guardFormulas());
        assertProblems(c + "  guard-formulas: yes\n", at(7, 19, "guard-formulas must be true or false"));
        // a format override keeps it
        Spec s = SpecParser.withOverrides(new Overrides(null, null, OutputFormat.JSON))
                .parse(FILE, (c + "  guard-formulas: true\n").getBytes(StandardCharsets.UTF_8));
        assertTrue(s.output().guardFormulas());
    }
}
