package dev.standin.sampling;

import dev.standin.marginal.LatentQuantile;
import dev.standin.marginal.Marginal;
import dev.standin.random.NormalQuantile;
import dev.standin.random.RandomStreams;
import dev.standin.spec.ColumnSpec;
import dev.standin.spec.Spec;
import java.util.List;

/**
 * Draws rows of a spec: for each row, each column's value and whether it is missing.
 *
 * <p>For row n, every random column c has a uniform u<sub>c</sub> = U(seed, stream(c, value), n)
 * (see {@link RandomStreams}). A column outside the correlation block is F<sub>c</sub><sup>-1</sup>(u<sub>c</sub>).
 * For the correlated block, z<sub>q</sub> = Φ<sup>-1</sup>(u) of the stream of the column driving latent
 * dimension q (canonical order, or pivot order for a semidefinite target), w = L z with L the
 * {@link LatentModel}'s factor, and the value is μ + σw<sub>c</sub> for an unbounded normal
 * column and F<sub>c</sub><sup>-1</sup>(Φ(w<sub>c</sub>)) otherwise (the Gaussian copula, through
 * {@link Marginal#fromLatent(double)}, which keeps the upper tail's precision). A
 * sequence is start + step·n. Missing values come from their own stream, so they never shift
 * other draws. Every value is thus a pure function of (seed, column, row, spec), and any row range
 * is drawn exactly as in a whole run.
 *
 * <p>The maps F<sup>-1</sup> and F<sup>-1</sup>∘Φ are evaluated through each marginal's
 * {@link LatentQuantile} (exact, or agreeing with the exact map to about 1e-13 relative), built once per
 * sampler. Rows can be drawn one at a time ({@link #draw}) or as a block of consecutive rows in
 * column-major arrays ({@link #drawBlock}); both compute every value with the same operations in the
 * same order, so they give the same bits.
 *
 * <p>Instances are immutable and may be shared by threads; each thread needs its own {@link Scratch}.
 */
public final class RowSampler {

    private final long seed;
    private final int columnCount;
    private final boolean[] isSequence;
    private final long[] start;
    private final long[] step;
    private final Marginal[] marginals;
    private final double[] nulls;
    private final long[] valueStream;
    private final long[] missingStream;
    /** Position of each column in the canonical latent order, or -1. */
    private final int[] latentIndex;
    /** Column index whose value stream drives each latent dimension. */
    private final int[] latentColumn;
    private final double[][] factor;
    /**
     * Each factor row's nonzero entries (indices and values, in increasing index order): a term
     * l·z with l = 0 adds ±0.0, which never changes a sum that started at +0.0, so leaving it out
     * gives the same bits and saves the work for block-structured targets.
     */
    private final int[][] factorIndex;
    private final double[][] factorValue;
    /** The fast maps of each random column (null for sequences). */
    private final LatentQuantile[] maps;

    public RowSampler(Spec spec, LatentModel model) {
        List<ColumnSpec> columns = spec.columns();
        this.seed = spec.seed();
        this.columnCount = columns.size();
        this.isSequence = new boolean[columnCount];
        this.start = new long[columnCount];
        this.step = new long[columnCount];
        this.marginals = new Marginal[columnCount];
        this.nulls = new double[columnCount];
        this.valueStream = new long[columnCount];
        this.missingStream = new long[columnCount];
        this.latentIndex = new int[columnCount];
        List<String> canonical = model.canonicalOrder();
        int[] canonicalColumn = new int[canonical.size()];
        for (int i = 0; i < columnCount; i++) {
            ColumnSpec c = columns.get(i);
            valueStream[i] = RandomStreams.streamId(c.name(), RandomStreams.Purpose.VALUE);
            missingStream[i] = RandomStreams.streamId(c.name(), RandomStreams.Purpose.MISSING);
            latentIndex[i] = canonical.indexOf(c.name());
            if (latentIndex[i] >= 0) {
                canonicalColumn[latentIndex[i]] = i;
            }
            if (c instanceof ColumnSpec.Sequence s) {
                isSequence[i] = true;
                start[i] = s.start();
                step[i] = s.step();
            } else {
                ColumnSpec.Random r = (ColumnSpec.Random) c;
                marginals[i] = r.marginal();
                nulls[i] = r.nulls();
            }
        }
        this.factor = model.factor();
        this.factorIndex = new int[factor.length][];
        this.factorValue = new double[factor.length][];
        for (int p = 0; p < factor.length; p++) {
            int nz = 0;
            for (double l : factor[p]) {
                if (l != 0.0) {
                    nz++;
                }
            }
            factorIndex[p] = new int[nz];
            factorValue[p] = new double[nz];
            for (int q = 0, j = 0; q < factor[p].length; q++) {
                if (factor[p][q] != 0.0) {
                    factorIndex[p][j] = q;
                    factorValue[p][j++] = factor[p][q];
                }
            }
        }
        this.maps = new LatentQuantile[columnCount];
        for (int i = 0; i < columnCount; i++) {
            if (marginals[i] != null) {
                maps[i] = LatentQuantile.of(marginals[i]);
            }
        }
        int[] source = model.latentSource();
        this.latentColumn = new int[source.length];
        for (int q = 0; q < source.length; q++) {
            latentColumn[q] = canonicalColumn[source[q]];
        }
    }

    /** Per-thread working arrays. */
    public final class Scratch {
        final double[] z = new double[latentColumn.length];
        final RandomStreams.Lanes lanes = new RandomStreams.Lanes();
        double[][] zBlock = new double[latentColumn.length][0];
        double[] wBlock = new double[0];
        double[] uBlock = new double[0];

        void ensure(int n) {
            if (wBlock.length < n) {
                zBlock = new double[latentColumn.length][n];
                wBlock = new double[n];
                uBlock = new double[n];
            }
        }
    }

    public Scratch scratch() {
        return new Scratch();
    }

    /** The fast map of a random column (null for a sequence column). */
    public LatentQuantile map(int column) {
        return maps[column];
    }

    public int columnCount() {
        return columnCount;
    }

    public boolean isSequence(int column) {
        return isSequence[column];
    }

    /** The value of a sequence column at a row: start + step·row (the parser checked it fits). */
    public long sequenceValue(int column, long row) {
        return start[column] + step[column] * row;
    }

    /**
     * Draws one row.
     *
     * @param values receives each random column's value (sequence columns: the value as a double)
     * @param missing receives whether each column's value is missing
     */
    public void draw(long row, double[] values, boolean[] missing, Scratch scratch) {
        double[] z = scratch.z;
        int k = z.length;
        for (int p = 0; p < k; p++) {
            z[p] = NormalQuantile.of(RandomStreams.uniform(seed, valueStream[latentColumn[p]], row));
        }
        for (int i = 0; i < columnCount; i++) {
            if (isSequence[i]) {
                values[i] = (double) sequenceValue(i, row);
                missing[i] = false;
                continue;
            }
            missing[i] = nulls[i] > 0 && RandomStreams.uniform(seed, missingStream[i], row) < nulls[i];
            int p = latentIndex[i];
            if (p < 0) {
                values[i] = maps[i].quantile(RandomStreams.uniform(seed, valueStream[i], row));
                continue;
            }
            int[] idx = factorIndex[p];
            double[] lrow = factorValue[p];
            double w = 0;
            for (int j = 0; j < lrow.length; j++) {
                w += lrow[j] * z[idx[j]];
            }
            values[i] = maps[i].fromLatent(w);
        }
    }

    /**
     * Draws rows {@code from .. from + n − 1} into column-major arrays, exactly as {@link #draw} would
     * one row at a time: {@code values[column][r]} and {@code missing[column][r]} for row from + r.
     */
    public void drawBlock(long from, int n, double[][] values, boolean[][] missing, Scratch scratch) {
        scratch.ensure(n);
        double[][] z = scratch.zBlock;
        double[] w = scratch.wBlock;
        double[] u = scratch.uBlock;
        int k = z.length;
        for (int p = 0; p < k; p++) {
            RandomStreams.uniforms(seed, valueStream[latentColumn[p]], from, u, n, scratch.lanes);
            NormalQuantile.of(u, z[p], n);
        }
        for (int i = 0; i < columnCount; i++) {
            double[] v = values[i];
            boolean[] miss = missing[i];
            if (isSequence[i]) {
                sequence(i, from, v, miss, n);
                continue;
            }
            double share = nulls[i];
            if (share > 0) {
                RandomStreams.uniforms(seed, missingStream[i], from, u, n, scratch.lanes);
                flagMissing(u, share, miss, n);
            } else {
                java.util.Arrays.fill(miss, 0, n, false);
            }
            LatentQuantile map = maps[i];
            int p = latentIndex[i];
            if (p < 0) {
                RandomStreams.uniforms(seed, valueStream[i], from, u, n, scratch.lanes);
                quantiles(map, u, v, n);
                continue;
            }
            factorStep(factorValue[p], factorIndex[p], z, w, n);
            map.fromLatent(w, v, n);
        }
    }

    // The per-row loops below are methods of their own (as are the maps' and the streams'): the JIT
    // compiles each small loop on its own, soon after the first blocks, instead of recompiling one
    // large method with every loop inlined (first on stack replacement, then whole), which kept
    // the first few hundred thousand rows of a run in slower code.

    private void sequence(int column, long from, double[] v, boolean[] miss, int n) {
        for (int r = 0; r < n; r++) {
            v[r] = (double) sequenceValue(column, from + r);
            miss[r] = false;
        }
    }

    private static void flagMissing(double[] u, double share, boolean[] miss, int n) {
        for (int r = 0; r < n; r++) {
            miss[r] = u[r] < share;
        }
    }

    private static void quantiles(LatentQuantile map, double[] u, double[] v, int n) {
        for (int r = 0; r < n; r++) {
            v[r] = map.quantile(u[r]);
        }
    }

    /** w = L<sub>p</sub> · z over the factor row's non-zero entries, summed in the order draw() sums them so the bits agree. */
    private static void factorStep(double[] lrow, int[] idx, double[][] z, double[] w, int n) {
        java.util.Arrays.fill(w, 0, n, 0.0);
        for (int j = 0; j < lrow.length; j++) {
            axpy(lrow[j], z[idx[j]], w, n);
        }
    }

    private static void axpy(double l, double[] zq, double[] w, int n) {
        for (int r = 0; r < n; r++) {
            w[r] += l * zq[r];
        }
    }
}
