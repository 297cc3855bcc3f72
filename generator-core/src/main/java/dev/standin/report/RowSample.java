package dev.standin.report;

import dev.standin.random.RandomStreams;
import java.util.ArrayList;
import java.util.List;
import java.util.PriorityQueue;

/**
 * A fixed-size, seeded sample of rows for statistics that need whole columns (ranks): bottom-k
 * sampling, which keeps the k rows with the smallest priority hash(seed, row) (E. Cohen and H.
 * Kaplan, "Summarizing data using bottom-k sketches", PODC 2007). Priorities depend only on the
 * row index, so the sample is the same whatever order or partition the rows arrive in, and memory
 * is bounded by k whatever the row count.
 */
public final class RowSample {

    /** The default sample size. */
    public static final int DEFAULT_SIZE = 10_000;

    private final long seed;
    private final int capacity;
    private final PriorityQueue<Entry> heap;
    /** The list {@link #rows()} gave, until the next row is kept. */
    private Rows rows;

    private record Entry(long priority, long row, double[] values) {
    }

    public RowSample(long seed, int capacity) {
        this.seed = RandomStreams.mix64(seed ^ 0x5EED5A4B1E5L);
        this.capacity = capacity;
        this.heap = new PriorityQueue<>(capacity + 1, (a, b) -> Long.compareUnsigned(b.priority, a.priority) != 0
                ? Long.compareUnsigned(b.priority, a.priority) : Long.compare(b.row, a.row));
    }

    /** True when {@link #offer} would keep the row now (so a caller can skip assembling its values). */
    public boolean admits(long row) {
        if (heap.size() < capacity) {
            return true;
        }
        long priority = priority(row);
        Entry top = heap.peek();
        return Long.compareUnsigned(priority, top.priority) < 0 || priority == top.priority && row < top.row;
    }

    private long priority(long row) {
        return RandomStreams.mix64(seed + row * 0x9E3779B97F4A7C15L);
    }

    /** Offers a row; values use NaN for missing. The array is copied only when kept. */
    public void offer(long row, double[] values) {
        long priority = priority(row);
        if (heap.size() == capacity) {
            Entry top = heap.peek();
            if (Long.compareUnsigned(priority, top.priority) > 0
                    || priority == top.priority && row > top.row) {
                return;
            }
            heap.poll();
        }
        heap.add(new Entry(priority, row, values.clone()));
        rows = null;
    }

    /**
     * The kept rows' values, in row order. The list remembers each complete column's average ranks
     * once asked for them ({@link RankStatistics}), so the rank correlations of many pairs rank each
     * column once; the same list is returned until another row is kept, so the fidelity checks and
     * both reports share those ranks. Reading the rows is safe from any thread; asking for ranks is
     * for one thread at a time.
     */
    public List<double[]> rows() {
        if (rows == null) {
            List<Entry> all = new ArrayList<>(heap);
            all.sort((a, b) -> Long.compare(a.row, b.row));
            List<double[]> out = new ArrayList<>(all.size());
            for (Entry e : all) {
                out.add(e.values);
            }
            rows = new Rows(out);
        }
        return rows;
    }

    /** An unmodifiable list of sampled rows with a memo of each column's ranks. */
    static final class Rows extends java.util.AbstractList<double[]> implements java.util.RandomAccess {
        private final List<double[]> rows;
        private final java.util.Map<Integer, double[]> ranks = new java.util.HashMap<>();

        Rows(List<double[]> rows) {
            this.rows = rows;
        }

        @Override
        public double[] get(int index) {
            return rows.get(index);
        }

        @Override
        public int size() {
            return rows.size();
        }

        /** The average ranks of a column in row order, or null when it has a missing value. */
        double[] completeRanks(int column) {
            return ranks.computeIfAbsent(column, c -> {
                double[] x = new double[rows.size()];
                for (int i = 0; i < x.length; i++) {
                    x[i] = rows.get(i)[c];
                    if (Double.isNaN(x[i])) {
                        return null;
                    }
                }
                return RankStatistics.averageRanks(x);
            });
        }
    }

    /** The values of two columns in the rows where both are present, in row order: x[i] and y[i] share a row. */
    record Pair(double[] x, double[] y) {
    }

    /**
     * Columns a and b of the rows where neither is missing (NaN), in the rows' order; a == b gives the
     * column's present values.
     */
    static Pair pairwiseComplete(List<double[]> rows, int a, int b) {
        int n = 0;
        for (double[] r : rows) {
            if (!Double.isNaN(r[a]) && !Double.isNaN(r[b])) {
                n++;
            }
        }
        double[] x = new double[n];
        double[] y = new double[n];
        int i = 0;
        for (double[] r : rows) {
            if (!Double.isNaN(r[a]) && !Double.isNaN(r[b])) {
                x[i] = r[a];
                y[i] = r[b];
                i++;
            }
        }
        return new Pair(x, y);
    }

    /** The kept rows' values, smallest priority first: any prefix is itself a seeded random sample. */
    public List<double[]> rowsByPriority() {
        List<Entry> all = new ArrayList<>(heap);
        all.sort((a, b) -> Long.compareUnsigned(a.priority, b.priority) != 0 ? Long.compareUnsigned(a.priority, b.priority)
                : Long.compare(a.row, b.row));
        List<double[]> out = new ArrayList<>(all.size());
        for (Entry e : all) {
            out.add(e.values);
        }
        return out;
    }

    public int size() {
        return heap.size();
    }
}
