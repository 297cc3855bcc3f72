package dev.standin.fit;

import dev.standin.output.NumberText;
import dev.standin.random.RandomStreams;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Compares a synthetic table with the real one it stands in for: how many synthetic rows are
 * identical to a real row, and how close synthetic rows sit to their closest real record compared
 * with how close real rows sit to each other.
 *
 * <p><b>Distance.</b> Over the columns both tables have (identifier-like columns left out, since their
 * values differ by construction): for numeric, date and timestamp columns the absolute difference
 * divided by the real column's standard deviation (L1 on standardised values), plus 1 for each
 * boolean or categorical column whose values differ, and 1 where a value is missing on one side only.
 * This is the distance to closest record (DCR) used for synthetic-data privacy checks; the L1 form
 * makes one standard deviation count as much as one category mismatch (as in Gower's coefficient,
 * J. C. Gower, Biometrics 27 (1971) 857-871, up to scaling by the sd instead of the range).
 *
 * <p><b>Holdout baseline.</b> The real rows are split in half at random (seeded). Rows of half B are
 * real rows the model could have seen, yet they are distinct records: their DCR to half A is how close
 * real records naturally sit. Synthetic rows are measured against the same half A. The check flags
 * (a) a 5th percentile of synthetic DCR below the holdout's — some synthetic rows are closer to real
 * records than real records are to each other, the sign of copied or memorised rows; "below" beyond
 * sampling error, i.e. below the distribution-free lower 97.5% confidence bound of the holdout's 5th
 * percentile ({@link #lowerBoundRank}), since for a model that is exactly right both distributions are
 * the same and a plain comparison would flag half the time — and (b) a share
 * of synthetic rows identical to a row of half A that exceeds the holdout's share by more than two
 * binomial standard errors.
 *
 * <p><b>Bounded work.</b> Exact matches are counted on every row by hashing. DCR needs every pair, so at
 * most {@value #SAMPLE_LIMIT} rows of each side are used: a seeded sample of the synthetic rows and of
 * half B as queries, and of half A as the reference; 2,000 × 2,000 distances per side.
 *
 * <p>The check reduces but does not remove disclosure risk, and passing it is no anonymisation
 * guarantee: it sees only rows close in distance, not facts that can be inferred by other means.
 */
public final class DisclosureCheck {

    /** The most rows of each side used for distances. */
    public static final int SAMPLE_LIMIT = 2_000;

    private static final String MISSING_KEY = "\u0001";

    private DisclosureCheck() {
    }

    /**
     * The outcome.
     *
     * @param realRows rows of the real table
     * @param syntheticRows rows of the synthetic table
     * @param numeric the columns compared by standardised difference
     * @param categorical the columns compared by mismatch
     * @param excluded columns left out, each with its reason
     * @param syntheticMatches synthetic rows identical to some real row (all rows of both)
     * @param syntheticMatchesA synthetic rows identical to some row of half A
     * @param holdoutRows rows of half B; holdoutMatches of them are identical to a row of half A
     * @param referenceRows rows of half A used as the DCR reference
     * @param syntheticDcr 5th, 25th and 50th percentiles of synthetic DCR (empty without a baseline)
     * @param holdoutDcr the same for half B
     * @param reasons why it is flagged (empty when not)
     */
    public record Report(int realRows, int syntheticRows, List<String> numeric, List<String> categorical,
                         List<String> excluded, long syntheticMatches, long syntheticMatchesA, int holdoutRows,
                         long holdoutMatches, int halfARows, int referenceRows, int syntheticQueries, int holdoutQueries,
                         double[] syntheticDcr, double[] holdoutDcr, List<String> reasons, long seed) {

        public boolean flagged() {
            return !reasons.isEmpty();
        }

        /** Synthetic rows identical to some real row, as a share of the synthetic rows. */
        public double matchShare() {
            return syntheticRows == 0 ? 0 : (double) syntheticMatches / syntheticRows;
        }

        /** The report as printed, one line each. */
        public List<String> lines() {
            List<String> l = new ArrayList<>();
            l.add("Disclosure check: " + syntheticRows + " synthetic rows against " + realRows + " real rows, on "
                    + (numeric.size() + categorical.size()) + " columns (" + numeric.size() + " numeric, " + categorical.size()
                    + " categorical or boolean).");
            for (String e : excluded) {
                l.add("  Not compared: " + e + ".");
            }
            l.add("  Identical to a real row: " + syntheticMatches + " of " + syntheticRows + " synthetic rows ("
                    + percent(matchShare()) + ").");
            if (syntheticDcr.length == 0) {
                l.add("  No holdout baseline: the real table needs at least 2 rows and the synthetic at least 1.");
            } else {
                l.add("  Holdout baseline: the real rows split in half at random (seed " + seed + "); " + holdoutMatches
                        + " of " + holdoutRows + " rows of half B are identical to a row of half A ("
                        + percent((double) holdoutMatches / holdoutRows) + "); synthetic rows identical to a row of half A: "
                        + percent(syntheticRows == 0 ? 0 : (double) syntheticMatchesA / syntheticRows) + ".");
                l.add("  Distance to closest record (DCR) in half A (" + referenceRows + " of its " + halfARows
                        + " rows): the sum of |difference| / real sd over numeric columns plus 1 per categorical mismatch"
                        + " (and per value missing on one side).");
                l.add("    synthetic, " + syntheticQueries + " rows:  5th percentile " + NumberText.fixed(syntheticDcr[0], 4)
                        + ", quartile " + NumberText.fixed(syntheticDcr[1], 4) + ", median " + NumberText.fixed(syntheticDcr[2], 4));
                l.add("    real half B, " + holdoutQueries + " rows:  5th percentile " + NumberText.fixed(holdoutDcr[0], 4)
                        + ", quartile " + NumberText.fixed(holdoutDcr[1], 4) + ", median " + NumberText.fixed(holdoutDcr[2], 4));
            }
            if (reasons.isEmpty()) {
                l.add("  Result: not flagged: synthetic rows sit no closer to real rows than real rows sit to each other.");
            } else {
                for (String r : reasons) {
                    l.add("  Result: FLAGGED: " + r + ".");
                }
            }
            l.add("  At most " + SAMPLE_LIMIT + " rows of each side enter the distances (seeded samples).");
            l.add("  This reduces but does not remove disclosure risk; it is not an anonymisation guarantee. Personal data"
                    + " needs your privacy review under local rules.");
            return l;
        }

        /** One line for summaries. */
        public String summary() {
            String base = percent(matchShare()) + " of synthetic rows identical to a real row";
            if (syntheticDcr.length > 0) {
                base += "; DCR 5th percentile " + NumberText.fixed(syntheticDcr[0], 4) + " (real holdout "
                        + NumberText.fixed(holdoutDcr[0], 4) + ")";
            }
            return (reasons.isEmpty() ? "not flagged: " : "FLAGGED: ") + base;
        }
    }

    private static String percent(double share) {
        return NumberText.fixed(100 * share, 2) + "%";
    }

    /** How a compared column is read. */
    private record Compared(String name, int realIndex, int syntheticIndex, ColumnKind kind, double sd) {
        boolean numeric() {
            return kind.numeric();
        }
    }

    /**
     * Compares the tables.
     *
     * @param seed the seed of the holdout split and of the samples
     * @throws FitException when the tables share no column that can be compared
     */
    public static Report compare(CsvTable real, CsvTable synthetic, long seed) throws FitException {
        List<Compared> columns = new ArrayList<>();
        List<String> numeric = new ArrayList<>();
        List<String> categorical = new ArrayList<>();
        List<String> excluded = new ArrayList<>();
        for (int j = 0; j < real.header().size(); j++) {
            String name = real.header().get(j);
            int s = synthetic.column(name);
            if (s < 0) {
                excluded.add("'" + name + "' (not in the synthetic table)");
                continue;
            }
            ColumnData d = ColumnData.of(real, j);
            if (d.kind() == ColumnKind.EMPTY) {
                excluded.add("'" + name + "' (every real value missing)");
                continue;
            }
            if (Fitter.looksLikeIdentifier(d)) {
                excluded.add("'" + name + "' (an identifier: every real value distinct)");
                continue;
            }
            double sd = 1.0;
            if (d.kind().numeric()) {
                double[] v = d.sortedPresent();
                double m = Arrays.stream(v).average().orElse(0);
                double ss = 0;
                for (double x : v) {
                    ss += (x - m) * (x - m);
                }
                sd = v.length > 1 ? StrictMath.sqrt(ss / (v.length - 1)) : 0;
                if (!(sd > 0)) {
                    sd = 1.0;
                }
                numeric.add(name);
            } else {
                categorical.add(name);
            }
            columns.add(new Compared(name, j, s, d.kind(), sd));
        }
        for (String name : synthetic.header()) {
            if (real.column(name) < 0) {
                excluded.add("'" + name + "' (only in the synthetic table)");
            }
        }
        if (columns.isEmpty()) {
            throw FitException.at(synthetic.file(), 1, 1, "shares no comparable column with " + real.file()
                    + "; the header names must match");
        }
        Map<String, Integer> dictionary = new HashMap<>();
        Rows r = rows(real, columns, false, dictionary);
        Rows s = rows(synthetic, columns, true, dictionary);

        Set<String> realKeys = new HashSet<>(Arrays.asList(r.keys));
        long syntheticMatches = Arrays.stream(s.keys).filter(realKeys::contains).count();

        int n = real.size();
        int[] order = shuffled(n, seed, "disclosure holdout split");
        int halfA = (n + 1) / 2;
        int halfB = n - halfA;
        if (halfB < 1 || synthetic.size() < 1) {
            return new Report(n, synthetic.size(), numeric, categorical, excluded, syntheticMatches, 0, 0, 0, halfA, 0, 0, 0,
                    new double[0], new double[0], List.of(), seed);
        }
        Set<String> aKeys = new HashSet<>();
        for (int i = 0; i < halfA; i++) {
            aKeys.add(r.keys[order[i]]);
        }
        long holdoutMatches = 0;
        for (int i = halfA; i < n; i++) {
            if (aKeys.contains(r.keys[order[i]])) {
                holdoutMatches++;
            }
        }
        long syntheticMatchesA = Arrays.stream(s.keys).filter(aKeys::contains).count();

        int ref = Math.min(halfA, SAMPLE_LIMIT);
        int[] reference = Arrays.copyOfRange(order, 0, ref);
        int hq = Math.min(halfB, SAMPLE_LIMIT);
        int[] holdout = Arrays.copyOfRange(order, halfA, halfA + hq);
        int[] synOrder = shuffled(synthetic.size(), seed, "disclosure synthetic sample");
        int sq = Math.min(synthetic.size(), SAMPLE_LIMIT);
        int[] synQueries = Arrays.copyOf(synOrder, sq);

        double[] holdoutDcr = dcr(r, holdout, r, reference);
        double[] syntheticDcr = dcr(s, synQueries, r, reference);
        double[] hq3 = {quantile(holdoutDcr, 0.05), quantile(holdoutDcr, 0.25), quantile(holdoutDcr, 0.5)};
        double[] sq3 = {quantile(syntheticDcr, 0.05), quantile(syntheticDcr, 0.25), quantile(syntheticDcr, 0.5)};

        List<String> reasons = new ArrayList<>();
        int rank = lowerBoundRank(holdoutDcr.length, 0.05, 0.025);
        double bound = holdoutDcr[rank - 1];
        if (sq3[0] < bound) {
            reasons.add("synthetic rows sit closer to real rows than real rows sit to each other (5th percentile of"
                    + " synthetic DCR " + NumberText.fixed(sq3[0], 4) + " < " + NumberText.fixed(bound, 4)
                    + ", the lower 97.5% confidence bound of the holdout's 5th percentile " + NumberText.fixed(hq3[0], 4) + ")");
        }
        double pb = (double) holdoutMatches / halfB;
        double ps = (double) syntheticMatchesA / synthetic.size();
        double se = StrictMath.sqrt(Math.max(pb, 1.0 / halfB) * (1 - Math.min(pb, 1 - 1.0 / halfB)) / halfB);
        if (ps > pb + 2 * se) {
            reasons.add("more synthetic rows than real holdout rows are identical to a row of half A (" + percent(ps) + " > "
                    + percent(pb) + " + 2 standard errors)");
        }
        return new Report(n, synthetic.size(), numeric, categorical, excluded, syntheticMatches, syntheticMatchesA, halfB,
                holdoutMatches, halfA, ref, sq, hq, sq3, hq3, reasons, seed);
    }

    /** The compared columns of a table as standardised numbers and category codes, with exact-match keys. */
    private record Rows(double[][] z, int[][] codes, String[] keys) {
    }

    private static Rows rows(CsvTable t, List<Compared> columns, boolean synthetic, Map<String, Integer> dictionary) {
        int n = t.size();
        int nn = (int) columns.stream().filter(Compared::numeric).count();
        int nc = columns.size() - nn;
        double[][] z = new double[n][nn];
        int[][] codes = new int[n][nc];
        String[] keys = new String[n];
        for (int i = 0; i < n; i++) {
            String[] row = t.rows().get(i);
            StringBuilder key = new StringBuilder();
            int a = 0;
            int b = 0;
            for (Compared c : columns) {
                String cell = row[synthetic ? c.syntheticIndex() : c.realIndex()];
                if (c.numeric()) {
                    double v = number(cell, c.kind());
                    z[i][a++] = Double.isNaN(v) ? Double.NaN : v / c.sd();
                    key.append(Double.isNaN(v) ? MISSING_KEY : NumberText.shortest(v));
                } else {
                    String text = text(cell, c.kind(), synthetic);
                    codes[i][b++] = text == null ? -1 : dictionary.computeIfAbsent(text, k -> dictionary.size());
                    key.append(text == null ? MISSING_KEY : text);
                }
                key.append('\u0000');
            }
            keys[i] = key.toString();
        }
        return new Rows(z, codes, keys);
    }

    private static double number(String cell, ColumnKind kind) {
        if (Cells.missing(cell)) {
            return Double.NaN;
        }
        Long l = switch (kind) {
            case DATE -> Cells.date(cell);
            case TIMESTAMP -> Cells.timestamp(cell);
            default -> null;
        };
        if (l != null) {
            return l;
        }
        Double d = Cells.decimal(cell);
        return d == null ? Double.NaN : d;
    }

    /** A categorical cell's text; booleans in lower case; a spreadsheet guard quote removed from synthetic text. */
    private static String text(String cell, ColumnKind kind, boolean synthetic) {
        if (Cells.missing(cell)) {
            return null;
        }
        String t = cell.strip();
        if (kind == ColumnKind.BOOLEAN) {
            Boolean b = Cells.bool(t);
            return b == null ? t : b.toString();
        }
        if (synthetic && t.length() > 1 && t.charAt(0) == '\'' && "=+-@\t\r".indexOf(t.charAt(1)) >= 0) {
            return t.substring(1);
        }
        return t;
    }

    /** For each query row, the distance to its closest reference row, sorted ascending. */
    private static double[] dcr(Rows queries, int[] queryRows, Rows reference, int[] referenceRows) {
        double[] out = new double[queryRows.length];
        for (int q = 0; q < queryRows.length; q++) {
            double[] zq = queries.z()[queryRows[q]];
            int[] cq = queries.codes()[queryRows[q]];
            double best = Double.POSITIVE_INFINITY;
            for (int r : referenceRows) {
                double d = distance(zq, cq, reference.z()[r], reference.codes()[r], best);
                if (d < best) {
                    best = d;
                }
            }
            out[q] = best;
        }
        Arrays.sort(out);
        return out;
    }

    /** The DCR distance; stops early once it exceeds {@code bound}. */
    static double distance(double[] za, int[] ca, double[] zb, int[] cb, double bound) {
        double d = 0;
        for (int i = 0; i < ca.length; i++) {
            if (ca[i] != cb[i]) {
                d += 1;
            }
        }
        for (int i = 0; i < za.length && d < bound; i++) {
            boolean ma = Double.isNaN(za[i]);
            boolean mb = Double.isNaN(zb[i]);
            if (ma || mb) {
                d += ma && mb ? 0 : 1;
            } else {
                d += Math.abs(za[i] - zb[i]);
            }
        }
        return d;
    }

    /**
     * The rank l (1-based) of the order statistic that is a distribution-free lower confidence bound
     * for the p-quantile of m values: the largest l with P(Bin(m, p) ≤ l − 1) ≤ alpha, so that
     * P(X<sub>(l)</sub> ≤ ξ<sub>p</sub>) ≥ 1 − alpha (W. J. Conover, <i>Practical Nonparametric
     * Statistics</i>, 3rd ed., Wiley 1999, §3.2). When m is too small for any (0.95<sup>m</sup> &gt;
     * alpha for p = 0.05, m &lt; 72), the smallest value (l = 1).
     */
    static int lowerBoundRank(int m, double p, double alpha) {
        org.apache.commons.math3.distribution.BinomialDistribution b =
                new org.apache.commons.math3.distribution.BinomialDistribution(null, m, p);
        int l = 1;
        while (l + 1 <= m && b.cumulativeProbability(l) <= alpha) {
            l++;
        }
        return l;
    }

    private static double quantile(double[] sorted, double p) {
        return sorted.length == 0 ? Double.NaN : RobustBounds.quantile(sorted, p);
    }

    /** A seeded permutation of 0..n−1 (Fisher-Yates with Philox uniforms; Knuth, TAOCP vol. 2, Algorithm 3.4.2P). */
    static int[] shuffled(int n, long seed, String purpose) {
        int[] a = new int[n];
        for (int i = 0; i < n; i++) {
            a[i] = i;
        }
        long stream = RandomStreams.streamId(purpose, RandomStreams.Purpose.VALUE);
        for (int i = n - 1; i > 0; i--) {
            int j = (int) Math.floor(RandomStreams.uniform(seed, stream, i) * (i + 1));
            j = Math.min(j, i);
            int t = a[i];
            a[i] = a[j];
            a[j] = t;
        }
        return a;
    }
}
