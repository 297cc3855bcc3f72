package dev.standin.report;

import dev.standin.marginal.DiscreteTable;
import dev.standin.marginal.Marginal;
import dev.standin.marginal.ValueKind;
import dev.standin.spec.ColumnSpec;
import dev.standin.spec.Spec;
import java.util.List;

/**
 * Everything measured about a dataset while it is written, in memory bounded by the column count
 * (never the row count): per column exact streaming moments, missing counts, a histogram over the
 * target's central range and, for small discrete supports, exact value counts; per correlated pair
 * streaming co-moments; and a seeded bottom-k {@link RowSample} of whole rows for rank statistics,
 * goodness-of-fit tests and the scatter plots.
 */
public final class DatasetStats {

    /** Histogram bins per column. */
    public static final int BINS = 40;

    /** Discrete supports up to this size get exact value counts. */
    public static final int MAX_COUNTED = 100_000;

    /** The most sample cells (rows × columns) kept, bounding memory to about 16 MB. */
    static final int MAX_SAMPLE_CELLS = 2_000_000;

    private final List<ColumnSpec> columns;
    private final Moments[] moments;
    private final Histogram[] histograms;
    private final long[][] counts;
    private final long[] countOffset;
    private final int[] pairColumn;
    private final PairMoments[][] pairs;
    private final RowSample sample;
    private final double[] scratch;

    public DatasetStats(Spec spec, List<String> correlated) {
        this.columns = spec.columns();
        int k = columns.size();
        moments = new Moments[k];
        histograms = new Histogram[k];
        counts = new long[k][];
        countOffset = new long[k];
        for (int i = 0; i < k; i++) {
            moments[i] = new Moments();
            ColumnSpec c = columns.get(i);
            if (c instanceof ColumnSpec.Random r) {
                Marginal m = r.marginal();
                if (m instanceof DiscreteTable t && t.size() <= MAX_COUNTED) {
                    counts[i] = new long[t.size()];
                    countOffset[i] = t.lowest();
                }
                if (m.valueKind() != ValueKind.LABEL) {
                    double lo = m.quantile(0.001);
                    double hi = m.quantile(0.999);
                    if (m.isDiscrete()) {
                        lo -= 0.5;
                        hi += 0.5;
                    }
                    histograms[i] = new Histogram(lo, hi, BINS);
                }
            } else {
                ColumnSpec.Sequence s = (ColumnSpec.Sequence) c;
                double first = s.start();
                double last = s.start() + (double) s.step() * Math.max(spec.rows() - 1, 0);
                histograms[i] = new Histogram(Math.min(first, last), Math.max(first, last), BINS);
            }
        }
        pairColumn = new int[correlated.size()];
        for (int p = 0; p < pairColumn.length; p++) {
            pairColumn[p] = indexOf(correlated.get(p));
        }
        pairs = new PairMoments[pairColumn.length][pairColumn.length];
        for (int a = 0; a < pairs.length; a++) {
            for (int b = 0; b < a; b++) {
                pairs[a][b] = new PairMoments();
            }
        }
        int capacity = Math.max(1000, Math.min(RowSample.DEFAULT_SIZE, MAX_SAMPLE_CELLS / Math.max(k, 1)));
        sample = new RowSample(spec.seed(), capacity);
        scratch = new double[k];
    }

    private int indexOf(String name) {
        for (int i = 0; i < columns.size(); i++) {
            if (columns.get(i).name().equals(name)) {
                return i;
            }
        }
        throw new IllegalArgumentException("no column " + name);
    }

    /** Adds one written row: each column's written value (as a number) and whether it is missing. */
    public void accept(long row, double[] written, boolean[] missing) {
        for (int i = 0; i < written.length; i++) {
            if (missing[i]) {
                moments[i].addMissing();
                scratch[i] = Double.NaN;
                continue;
            }
            double x = written[i];
            scratch[i] = x;
            moments[i].add(x);
            if (histograms[i] != null) {
                histograms[i].add(x);
            }
            if (counts[i] != null) {
                long j = (long) x - countOffset[i];
                if (j >= 0 && j < counts[i].length) {
                    counts[i][(int) j]++;
                }
            }
        }
        for (int a = 0; a < pairColumn.length; a++) {
            int ca = pairColumn[a];
            if (missing[ca]) {
                continue;
            }
            for (int b = 0; b < a; b++) {
                int cb = pairColumn[b];
                if (!missing[cb]) {
                    pairs[a][b].add(written[ca], written[cb]);
                }
            }
        }
        sample.offer(row, scratch);
    }

    /**
     * Adds a block of consecutive written rows, {@code firstRow .. firstRow + n − 1}, given column-major
     * ({@code written[column][r]}, {@code missing[column][r]}) together with their {@link Block} summary.
     * Moments and co-moments are merged by Chan, Golub and LeVeque's pairwise update ({@link Moments#merge}),
     * so blocks must be added in row order with a block size that does not depend on the thread count:
     * the statistics are then the same bits for any number of threads. Counts, histograms and the
     * bottom-k sample are exact in any case.
     */
    public void acceptBlock(long firstRow, int n, double[][] written, boolean[][] missing, Block block) {
        int k = moments.length;
        for (int i = 0; i < k; i++) {
            moments[i].merge(block.count[i], block.mean[i], block.m2[i], block.min[i], block.max[i], n - block.count[i]);
            if (histograms[i] != null) {
                histograms[i].addCounts(block.bins[i]);
            }
            if (counts[i] != null) {
                countValues(counts[i], countOffset[i], written[i], missing[i], n);
            }
        }
        int pc = pairColumn.length;
        for (int a = 0, idx = 0; a < pc; a++) {
            for (int b = 0; b < a; b++, idx++) {
                pairs[a][b].merge(block.pairCount[idx], block.pairMeanX[idx], block.pairMeanY[idx], block.pairM2x[idx],
                        block.pairM2y[idx], block.pairCxy[idx]);
            }
        }
        offerRows(firstRow, n, written, missing);
    }

    // The per-row loops of acceptBlock are methods of their own: small compilation units, which the
    // JIT compiles in a fraction of the time one large method with them inlined takes.

    /** Adds the present values of one column's block to its exact value counts. */
    private static void countValues(long[] c, long offset, double[] x, boolean[] miss, int n) {
        for (int r = 0; r < n; r++) {
            if (!miss[r]) {
                long j = (long) x[r] - offset;
                if (j >= 0 && j < c.length) {
                    c[(int) j]++;
                }
            }
        }
    }

    /** Offers the block's rows that the bottom-k sample admits. */
    private void offerRows(long firstRow, int n, double[][] written, boolean[][] missing) {
        for (int r = 0; r < n; r++) {
            long row = firstRow + r;
            if (sample.admits(row)) {
                offerRow(row, r, written, missing);
            }
        }
    }

    private void offerRow(long row, int r, double[][] written, boolean[][] missing) {
        int k = moments.length;
        for (int i = 0; i < k; i++) {
            scratch[i] = missing[i][r] ? Double.NaN : written[i][r];
        }
        sample.offer(row, scratch);
    }

    /** A new, empty block summary for this dataset's columns; one per thread, reusable. */
    public Block newBlock() {
        return new Block();
    }

    /**
     * The statistics of one block of written rows that can be computed apart from the others (on any
     * thread): per column the count, mean, sum of squared deviations, minimum, maximum and histogram
     * counts; per correlated pair the same over rows where both are present plus the sum of cross
     * products. Means by summation, then deviations from them (the two-pass algorithm; Chan, Golub and
     * LeVeque 1983, section 2), with four interleaved partial sums in a fixed order.
     */
    public final class Block {
        final long[] count;
        final double[] mean;
        final double[] m2;
        final double[] min;
        final double[] max;
        final long[][] bins;
        final long[] pairCount;
        final double[] pairMeanX;
        final double[] pairMeanY;
        final double[] pairM2x;
        final double[] pairM2y;
        final double[] pairCxy;
        private final boolean[] complete;
        private double[][] dev = new double[0][0];

        Block() {
            int k = moments.length;
            count = new long[k];
            mean = new double[k];
            m2 = new double[k];
            min = new double[k];
            max = new double[k];
            bins = new long[k][];
            for (int i = 0; i < k; i++) {
                if (histograms[i] != null) {
                    bins[i] = new long[histograms[i].bins() + 2];
                }
            }
            int pc = pairColumn.length;
            int pairCountTotal = pc * (pc - 1) / 2;
            pairCount = new long[pairCountTotal];
            pairMeanX = new double[pairCountTotal];
            pairMeanY = new double[pairCountTotal];
            pairM2x = new double[pairCountTotal];
            pairM2y = new double[pairCountTotal];
            pairCxy = new double[pairCountTotal];
            complete = new boolean[k];
        }

        /** Summarises rows 0 .. n − 1 of the column-major arrays. */
        public void compute(int n, double[][] written, boolean[][] missing) {
            int k = moments.length;
            if (dev.length < k || (k > 0 && dev[0].length < n)) {
                dev = new double[k][n];
            }
            for (int i = 0; i < k; i++) {
                column(i, n, written[i], missing[i]);
            }
            int pc = pairColumn.length;
            for (int a = 0, idx = 0; a < pc; a++) {
                int ca = pairColumn[a];
                for (int bb = 0; bb < a; bb++, idx++) {
                    int cb = pairColumn[bb];
                    if (complete[ca] && complete[cb]) {
                        pairCount[idx] = n;
                        pairMeanX[idx] = mean[ca];
                        pairMeanY[idx] = mean[cb];
                        pairM2x[idx] = m2[ca];
                        pairM2y[idx] = m2[cb];
                        pairCxy[idx] = dot(dev[ca], dev[cb], n);
                    } else {
                        pairWithMissing(idx, n, written[ca], missing[ca], written[cb], missing[cb]);
                    }
                }
            }
        }

        /** One column's count, mean, sum of squared deviations, extremes and histogram counts. */
        private void column(int i, int n, double[] x, boolean[] miss) {
            double[] d = dev[i];
            boolean all = !anyMissing(miss, n);
            complete[i] = all;
            if (all) {
                count[i] = n;
                double mu = n == 0 ? 0.0 : sum(x, n) / n;
                mean[i] = mu;
                deviations(x, mu, d, n, i);
                m2[i] = dot(d, d, n);
            } else {
                withMissing(i, n, x, miss, d);
            }
            long[] b = bins[i];
            if (b != null) {
                java.util.Arrays.fill(b, 0);
                binValues(histograms[i], b, x, miss, n);
            }
        }

        /** d[r] = x[r] − mu, and the column's minimum and maximum. */
        private void deviations(double[] x, double mu, double[] d, int n, int i) {
            double lo = Double.POSITIVE_INFINITY;
            double hi = Double.NEGATIVE_INFINITY;
            for (int r = 0; r < n; r++) {
                double v = x[r];
                d[r] = v - mu;
                if (v < lo) {
                    lo = v;
                }
                if (v > hi) {
                    hi = v;
                }
            }
            min[i] = lo;
            max[i] = hi;
        }

        /** The summary of a column with missing values in the block (deviations 0 where missing). */
        private void withMissing(int i, int n, double[] x, boolean[] miss, double[] d) {
            long cnt = 0;
            double lo = Double.POSITIVE_INFINITY;
            double hi = Double.NEGATIVE_INFINITY;
            double s = 0;
            for (int r = 0; r < n; r++) {
                if (!miss[r]) {
                    double v = x[r];
                    s += v;
                    cnt++;
                    if (v < lo) {
                        lo = v;
                    }
                    if (v > hi) {
                        hi = v;
                    }
                }
            }
            double mu = cnt == 0 ? 0.0 : s / cnt;
            double s2 = 0;
            for (int r = 0; r < n; r++) {
                if (!miss[r]) {
                    double e = x[r] - mu;
                    d[r] = e;
                    s2 += e * e;
                } else {
                    d[r] = 0.0;
                }
            }
            count[i] = cnt;
            mean[i] = mu;
            m2[i] = s2;
            min[i] = lo;
            max[i] = hi;
        }

        private void pairWithMissing(int idx, int n, double[] x, boolean[] mx, double[] y, boolean[] my) {
            long cnt = 0;
            double sx = 0;
            double sy = 0;
            for (int r = 0; r < n; r++) {
                if (!mx[r] && !my[r]) {
                    cnt++;
                    sx += x[r];
                    sy += y[r];
                }
            }
            double mux = cnt == 0 ? 0.0 : sx / cnt;
            double muy = cnt == 0 ? 0.0 : sy / cnt;
            double qx = 0;
            double qy = 0;
            double qxy = 0;
            for (int r = 0; r < n; r++) {
                if (!mx[r] && !my[r]) {
                    double dx = x[r] - mux;
                    double dy = y[r] - muy;
                    qx += dx * dx;
                    qy += dy * dy;
                    qxy += dx * dy;
                }
            }
            pairCount[idx] = cnt;
            pairMeanX[idx] = mux;
            pairMeanY[idx] = muy;
            pairM2x[idx] = qx;
            pairM2y[idx] = qy;
            pairCxy[idx] = qxy;
        }
    }

    private static boolean anyMissing(boolean[] miss, int n) {
        boolean any = false;
        for (int r = 0; r < n; r++) {
            if (miss[r]) {
                any = true;
            }
        }
        return any;
    }

    private static void binValues(Histogram h, long[] b, double[] x, boolean[] miss, int n) {
        for (int r = 0; r < n; r++) {
            if (!miss[r]) {
                b[1 + h.bin(x[r])]++;
            }
        }
    }

    /** Σ x[r] for r &lt; n with four interleaved partial sums (fixed order, so always the same bits). */
    private static double sum(double[] x, int n) {
        double s0 = 0;
        double s1 = 0;
        double s2 = 0;
        double s3 = 0;
        int r = 0;
        for (; r + 3 < n; r += 4) {
            s0 += x[r];
            s1 += x[r + 1];
            s2 += x[r + 2];
            s3 += x[r + 3];
        }
        for (; r < n; r++) {
            s0 += x[r];
        }
        return (s0 + s1) + (s2 + s3);
    }

    /** Σ x[r]·y[r] for r &lt; n, four interleaved partial sums. */
    private static double dot(double[] x, double[] y, int n) {
        double s0 = 0;
        double s1 = 0;
        double s2 = 0;
        double s3 = 0;
        int r = 0;
        for (; r + 3 < n; r += 4) {
            s0 += x[r] * y[r];
            s1 += x[r + 1] * y[r + 1];
            s2 += x[r + 2] * y[r + 2];
            s3 += x[r + 3] * y[r + 3];
        }
        for (; r < n; r++) {
            s0 += x[r] * y[r];
        }
        return (s0 + s1) + (s2 + s3);
    }

    public List<ColumnSpec> columns() {
        return columns;
    }

    public Moments moments(int column) {
        return moments[column];
    }

    /** The histogram of a column, or null (categorical columns). */
    public Histogram histogram(int column) {
        return histograms[column];
    }

    /** Exact value counts of a small discrete column, index = value − {@link #countOffset(int)}, or null. */
    public long[] counts(int column) {
        return counts[column];
    }

    public long countOffset(int column) {
        return countOffset[column];
    }

    /** Co-moments of correlated pair (a, b), a &gt; b, in the correlation order. */
    public PairMoments pair(int a, int b) {
        return pairs[a][b];
    }

    /** The column index of correlated position p. */
    public int pairColumn(int p) {
        return pairColumn[p];
    }

    public int correlatedCount() {
        return pairColumn.length;
    }

    public RowSample sample() {
        return sample;
    }
}
