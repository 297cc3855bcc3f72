package dev.standin.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/** The disclosure check on worked examples whose answers follow from the definitions. */
class DisclosureCheckTest {

    /** An invented greenhouse log: two sensor readings and a zone, with a fixed seed. */
    static CsvTable greenhouse(int n, long seed) {
        SplittableRandom rnd = new SplittableRandom(seed);
        List<String[]> rows = new ArrayList<>();
        String[] zones = {"north", "south", "east"};
        for (int i = 0; i < n; i++) {
            rows.add(new String[] {String.format(Locale.ROOT, "%.2f", 20 + 4 * rnd.nextGaussian()),
                String.format(Locale.ROOT, "%.1f", 60 + 10 * rnd.nextGaussian()), zones[rnd.nextInt(3)]});
        }
        return CsvTable.of("greenhouse.csv", List.of("temp_c", "humidity", "zone"), rows);
    }

    @Test
    void aCopyOfTheRealRowsIsFlagged() throws Exception {
        CsvTable real = greenhouse(600, 1);
        CsvTable copy = CsvTable.of("copy.csv", real.header(), real.rows());
        DisclosureCheck.Report r = DisclosureCheck.compare(real, copy, 7);
        assertEquals(1.0, r.matchShare(), 0.0);
        assertTrue(r.flagged(), r.lines().toString());
        // half of the copied rows are rows of half A: DCR 0, so the 5th percentile is 0
        assertEquals(0.0, r.syntheticDcr()[0], 0.0);
        assertEquals(2, r.reasons().size(), r.reasons().toString());
    }

    @Test
    void independentDrawsFromTheSameLawAreNotFlagged() throws Exception {
        // rows from the very law of the real rows are what a perfect model gives; they are as close to half A
        // as half B is, so neither the DCR rule nor the exact-match rule may flag them
        CsvTable real = greenhouse(1000, 2);
        CsvTable other = greenhouse(3000, 3);
        DisclosureCheck.Report r = DisclosureCheck.compare(real, other, 7);
        assertFalse(r.flagged(), r.lines().toString());
        assertEquals(2000, r.syntheticQueries());
        assertEquals(500, r.holdoutQueries());
        assertEquals(500, r.referenceRows());
    }

    /**
     * Real rows: 50 × (0, 0, north) and 50 × (10, 10, north). Each numeric column's sd (divisor n − 1)
     * is √(100 · 25 / 99). A synthetic row (1, 0, south) is at L1 distance 1/sd + 1 from the closest
     * real row (0, 0, north), one (5, missing, north) at 5/sd + 1 from either; every real row of half B
     * has an identical row in half A (distance 0), the holdout's exact-match share is 100 %.
     */
    @Test
    void theDistanceIsTheDocumentedOne() throws Exception {
        List<String[]> realRows = new ArrayList<>();
        for (int i = 0; i < 100; i++) {
            realRows.add(i % 2 == 0 ? new String[] {"0", "0", "north"} : new String[] {"10", "10", "north"});
        }
        CsvTable real = CsvTable.of("real.csv", List.of("a", "b", "zone"), realRows);
        List<String[]> synRows = new ArrayList<>();
        for (int i = 0; i < 40; i++) {
            synRows.add(i < 20 ? new String[] {"1", "0", "south"} : new String[] {"5", "", "north"});
        }
        CsvTable syn = CsvTable.of("syn.csv", List.of("a", "b", "zone"), synRows);
        DisclosureCheck.Report r = DisclosureCheck.compare(real, syn, 11);
        double sd = Math.sqrt(100 * 25 / 99.0);
        assertEquals(1 / sd + 1, r.syntheticDcr()[0], 1e-12);
        assertEquals(1 / sd + 1, r.syntheticDcr()[1], 1e-12);
        assertEquals((1 / sd + 1 + 5 / sd + 1) / 2, r.syntheticDcr()[2], 1e-12); // median of 20 + 20 values
        assertEquals(0.0, r.holdoutDcr()[0], 0.0);
        assertEquals(r.holdoutRows(), r.holdoutMatches());
        assertEquals(0, r.syntheticMatches());
        assertFalse(r.flagged(), r.lines().toString());
        assertEquals(List.of("a", "b"), r.numeric());
        assertEquals(List.of("zone"), r.categorical());
    }

    @Test
    void identifierColumnsAreNotCompared() throws Exception {
        List<String[]> rows = new ArrayList<>();
        for (int i = 0; i < 50; i++) {
            rows.add(new String[] {"R-" + i, String.valueOf(i % 5)});
        }
        CsvTable real = CsvTable.of("r.csv", List.of("ref", "v"), rows);
        DisclosureCheck.Report r = DisclosureCheck.compare(real, real, 1);
        assertEquals(List.of("'ref' (an identifier: every real value distinct)"), r.excluded());
        assertEquals(List.of("v"), r.numeric());
    }

    /**
     * The lower confidence bound's rank: the largest l with P(Bin(m, 0.05) ≤ l − 1) ≤ 0.025, worked out
     * from the binomial probabilities: m = 72 gives 1 (0.95^72 = 0.0249), m = 200 gives 4 (P(≤ 3) =
     * 0.0091, P(≤ 4) = 0.0266), m = 2000 gives 81.
     */
    @Test
    void theLowerBoundRankIsTheBinomialOne() {
        assertEquals(1, DisclosureCheck.lowerBoundRank(72, 0.05, 0.025));
        assertEquals(1, DisclosureCheck.lowerBoundRank(10, 0.05, 0.025));
        assertEquals(4, DisclosureCheck.lowerBoundRank(200, 0.05, 0.025));
        assertEquals(81, DisclosureCheck.lowerBoundRank(2000, 0.05, 0.025));
    }

    @Test
    void theReportSaysWhatItIsNot() throws Exception {
        CsvTable real = greenhouse(100, 5);
        List<String> lines = DisclosureCheck.compare(real, greenhouse(100, 6), 3).lines();
        assertTrue(lines.stream().anyMatch(l -> l.contains("reduces but does not remove disclosure risk")));
        assertTrue(lines.stream().anyMatch(l -> l.contains("not an anonymisation guarantee")));
        assertTrue(lines.stream().anyMatch(l -> l.contains("privacy review under local rules")));
        assertTrue(lines.stream().anyMatch(l -> l.contains("At most 2000 rows of each side")));
    }
}
