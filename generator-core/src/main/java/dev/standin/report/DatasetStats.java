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
