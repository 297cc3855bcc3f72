package dev.standin.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.standin.sampling.RowSampler;
import dev.standin.spec.Overrides;
import dev.standin.spec.SpecException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Correlation targets through the whole engine: completion, repair, semidefinite targets, messages. */
class CorrelationSpecTest {

    private static final String HEAD = "dataset: pumps\nrows: 2000\nseed: 11\ncolumns:\n"
            + "  a: {dist: normal, mean: 10, sd: 2}\n"
            + "  b: {dist: normal, mean: -3, sd: 0.5}\n"
            + "  c: {dist: normal, mean: 0, sd: 1}\n"
            + "correlation:\n";

    private final Engine engine = Engine.create(Overrides.none());

    private CompiledSpec compile(String correlation) throws SpecException {
        return engine.compile("pumps.yaml", (HEAD + correlation).getBytes(StandardCharsets.UTF_8), "");
    }

    private String problem(String correlation) {
        SpecException e = assertThrows(SpecException.class, () -> compile(correlation));
        assertEquals(1, e.problems().size(), e.getMessage());
        return e.problems().get(0).toString();
    }

    @Test
    void correlationOfOneGivesIdenticalStandardisedColumns() throws Exception {
        CompiledSpec c = compile("  pairs: {a ~ b: 1}\n");
        RowSampler s = new RowSampler(c.spec(), c.model());
        double[] v = new double[3];
        boolean[] missing = new boolean[3];
        RowSampler.Scratch scratch = s.scratch();
        for (long row = 0; row < 500; row++) {
            s.draw(row, v, missing, scratch);
            // ρ = 1: (a − 10)/2 and (b + 3)/0.5 are the same standard normal (exact, not nudged)
            assertEquals((v[0] - 10) / 2, (v[1] + 3) / 0.5, 1e-12);
        }
    }

    @Test
    void correlationOfMinusOneGivesMirrorImages() throws Exception {
        CompiledSpec c = compile("  pairs: {a ~ c: -1}\n");
        RowSampler s = new RowSampler(c.spec(), c.model());
        double[] v = new double[3];
        boolean[] missing = new boolean[3];
        RowSampler.Scratch scratch = s.scratch();
        for (long row = 0; row < 500; row++) {
            s.draw(row, v, missing, scratch);
            assertEquals(-(v[0] - 10) / 2, v[2], 1e-12);
        }
    }

    @Test
    void unspecifiedPairIsCompletedAndReported(@TempDir Path out) throws Exception {
        CompiledSpec c = compile("  pairs: {a ~ b: 0.9, b ~ c: 0.9}\n");
        assertTrue(c.warnings().isEmpty());
        // maximum-determinant completion: 0.9 × 0.9 (Dempster 1972)
        assertEquals(0.81, c.model().used()[0][2], 1e-10);
        engine.generate(c, out);
        String report = Files.readString(out.resolve("pumps.report.json"));
        assertTrue(report.contains("\"method\": \"completion\""), report);
        assertTrue(report.contains("\"a\": \"a\",\n          \"b\": \"c\",\n          \"value\": 0.81"), report);
    }

    @Test
    void repairWithinMaxChangeWarnsWithTheChangedPairs() throws Exception {
        CompiledSpec c = compile("  pairs: {a ~ b: 0.9, b ~ c: 0.9, a ~ c: 0.6}\n  max-change: 0.05\n");
        assertEquals(1, c.warnings().size());
        assertTrue(c.warnings().get(0).startsWith("pumps.yaml:9:10: warning: correlation matrix repaired by nearest (max change 0.0"),
                c.warnings().get(0));
        assertTrue(c.warnings().get(0).contains("a ~ c 0.6 → 0.6"), c.warnings().get(0));
    }

    @Test
    void repairBeyondMaxChangeFailsWithBeforeAndAfter() {
        assertEquals("pumps.yaml:9:10: correlation matrix is not positive semidefinite and repair: nearest would change"
                + " a specified pair by 0.2100, more than max-change 0.05: a ~ b 0.9 → 0.6900, b ~ c 0.9 → 0.6900,"
                + " a ~ c -0.2 → -0.0478; revise these pairs, raise max-change, or set repair: fail to see the diagnosis",
                problem("  pairs: {a ~ b: 0.9, b ~ c: 0.9, a ~ c: -0.2}\n"));
    }

    @Test
    void failPolicyGivesTheDiagnosis() {
        String p = problem("  repair: fail\n  order: [a, b, c]\n  matrix: [[1, 1, 0], [1, 1, 1], [0, 1, 1]]\n");
        // smallest eigenvalue 1 − √2 = −0.4142 (closed form)
        assertTrue(p.startsWith("pumps.yaml:11:11: correlation matrix is not positive semidefinite (smallest eigenvalue -0.4142);"
                + " pairs pulling it down most: "), p);
        assertTrue(p.endsWith("; use repair: nearest or clip to repair it"), p);
    }

    @Test
    void clipRepairsAFullMatrix() throws Exception {
        CompiledSpec c = compile("  repair: clip\n  max-change: 0.5\n  order: [a, b, c]\n  matrix: [[1, 1, 0], [1, 1, 1], [0, 1, 1]]\n");
        assertEquals("clip", c.model().targetRepair().method());
        assertEquals(1, c.warnings().size());
    }

    @Test
    void unknownRepairAndMaxChangeAreRejected() {
        assertEquals("pumps.yaml:10:11: repair must be one of nearest, clip, fail: closest",
                problem("  pairs: {a ~ b: 0.3}\n  repair: closest\n"));
        assertEquals("pumps.yaml:10:15: max-change must be a number from 0 to 2: -1",
                problem("  pairs: {a ~ b: 0.3}\n  max-change: -1\n"));
    }

    @Test
    void unattainablePearsonNamesTheRange() throws Exception {
        String spec = "dataset: pumps\nrows: 10\nseed: 1\ncolumns:\n"
                + "  flow: {dist: normal, mean: 0, sd: 1}\n"
                + "  valve: {dist: uniform, min: 0, max: 1}\n"
                + "correlation:\n  pairs: {flow ~ valve: 0.99}\n";
        SpecException e = assertThrows(SpecException.class,
                () -> engine.compile("pumps.yaml", spec.getBytes(StandardCharsets.UTF_8), ""));
        // Corr(Z, Φ(Z)) = √(3/π) = 0.977 (closed form: E[ZΦ(Z)] = 1/(2√π), sd(Φ(Z)) = 1/√12)
        assertEquals("pumps.yaml:8:25: pearson 0.99 is unattainable for flow ~ valve with these marginals:"
                + " attainable [-0.977, 0.977]; consider measure: spearman", e.problems().get(0).toString());
    }
}
