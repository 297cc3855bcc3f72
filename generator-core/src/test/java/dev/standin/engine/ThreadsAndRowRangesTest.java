package dev.standin.engine;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.standin.marginal.Marginal;
import dev.standin.marginal.ValueKind;
import dev.standin.output.CellKind;
import dev.standin.output.RowWriter;
import dev.standin.report.DatasetStats;
import dev.standin.report.Moments;
import dev.standin.sampling.RowSampler;
import dev.standin.spec.ColumnSpec;
import dev.standin.spec.Overrides;
import dev.standin.spec.Spec;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The block pipeline's promises: the data file and both reports are the same bytes for any thread
 * count; any partition of the rows into {@link RowRanges} concatenates to the data file; and the
 * encoded bytes equal what the format's row writers ({@link dev.standin.output.CsvRowWriter},
 * {@link dev.standin.output.JsonRowWriter}) write for the cell texts of {@link DatasetWriter#text},
 * one row at a time (the path every earlier version took, kept here as the reference).
 */
class ThreadsAndRowRangesTest {

    /** Every kind of cell: sequence, fixed and shortest numbers, counts, flags, labels needing quotes, dates, timestamps, nulls. */
    private static final String KINDS = """
            dataset: bakery-orders
            rows: 20011
            seed: 8675309
            columns:
              order_no:   {dist: sequence, start: 1000, step: 3}
              dough_kg:   {dist: gamma, mean: 310, sd: 45, decimals: 3}
              rise_share: {dist: beta, mean: 0.62, sd: 0.12, decimals: 4, nulls: 0.05}
              oven_min:   {dist: weibull, shape: 1.8, scale: 42}
              crumbs:     {dist: lognormal, mean: 4, sd: 2, decimals: 0}
              temp_c:     {dist: normal, mean: 21, sd: 3, decimals: 2, nulls: 0.1}
              trays:      {dist: poisson, mean: 3.2}
              loaf:       {dist: categorical, levels: {"rye, dark": 2, "say \\"cheese\\"": 1, "=SUM(A1)": 1, " spaced ": 1}}
              glazed:     {dist: bernoulli, p: 0.3, nulls: 0.01}
              baked_on:   {dist: date, from: 2026-01-01, to: 2026-12-31}
              sold_at:    {dist: timestamp, from: 2026-01-01T00:00:00Z, to: 2026-12-31T23:59:59Z}
              wait_s:     {dist: exponential, mean: 40, decimals: 1}
            correlation:
              measure: spearman
              pairs:
                dough_kg ~ rise_share: 0.5
                dough_kg ~ oven_min: 0.3
                rise_share ~ trays: 0.2
                temp_c ~ loaf: 0.25
                glazed ~ temp_c: 0.3
            """;

    @TempDir
    Path temp;

    private static CompiledSpec compile(String yaml) throws Exception {
        return Engine.create(Overrides.none()).compile("spec.yaml", yaml.getBytes(StandardCharsets.UTF_8), "");
    }

    private static String withOutput(String yaml, String output) {
        return yaml + "output:\n" + output;
    }

    private List<byte[]> generate(CompiledSpec c, int threads, String dir) throws IOException {
        Path out = temp.resolve(dir);
        Engine.create(Overrides.none()).generate(c.withThreads(threads), out);
        List<byte[]> files = new ArrayList<>();
        for (String f : c.outputFiles()) {
            files.add(Files.readAllBytes(out.resolve(f)));
        }
        return files;
    }

    @Test
    void anyThreadCountWritesTheSameBytes() throws Exception {
        for (String output : new String[] {"  format: csv\n", "  format: json\n", "  format: jsonl\n"}) {
            CompiledSpec c = compile(withOutput(KINDS, output));
            List<byte[]> one = generate(c, 1, "t1" + output.hashCode());
            for (int threads : new int[] {2, 3, 7}) {
                List<byte[]> many = generate(c, threads, "t" + threads + "-" + output.hashCode());
                for (int f = 0; f < one.size(); f++) {
                    assertArrayEquals(one.get(f), many.get(f), c.outputFiles().get(f) + " with " + threads + " threads");
                }
            }
        }
    }

    /**
     * Many more blocks than are in flight (149 blocks of 4096 rows, at most 2·threads + 2 in flight), so
     * blocks are recycled and placed out of order, and more than {@link DatasetWriter#WARM_UP_BLOCKS},
     * so the pool grows to every worker during the run; the last block is partial.
     */
    @Test
    void manyBlocksInFlightWriteTheSameBytes() throws Exception {
        String yaml = """
                dataset: greenhouse-readings
                rows: 610001
                seed: 20261202
                columns:
                  air_c:    {dist: normal, mean: 22, sd: 3, decimals: 2}
                  lux:      {dist: gamma, mean: 900, sd: 250, decimals: 1, nulls: 0.02}
                  misting:  {dist: bernoulli, p: 0.2}
                correlation:
                  measure: spearman
                  pairs:
                    air_c ~ lux: 0.6
                    lux ~ misting: -0.3
                """;
        CompiledSpec c = compile(yaml);
        assertEquals(4096, DatasetWriter.blockRows(3));
        assertTrue(c.spec().rows() / 4096 > DatasetWriter.WARM_UP_BLOCKS);
        List<byte[]> one = generate(c, 1, "many-t1");
        // 70 threads: 142 blocks in flight, past WARM_UP_BLOCKS before the first is consumed
        for (int threads : new int[] {2, 3, 5, 70}) {
            List<byte[]> many = generate(c, threads, "many-t" + threads);
            for (int f = 0; f < one.size(); f++) {
                assertArrayEquals(one.get(f), many.get(f), c.outputFiles().get(f) + " with " + threads + " threads");
            }
        }
    }

    /** While the JIT warms up, one processor is left to it, but never fewer than one worker. */
    @Test
    void warmUpLeavesOneProcessorToTheCompiler() {
        assertEquals(1, DatasetWriter.warmUpWorkers(2, 2));
        assertEquals(15, DatasetWriter.warmUpWorkers(16, 16));
        assertEquals(4, DatasetWriter.warmUpWorkers(4, 16));
        assertEquals(1, DatasetWriter.warmUpWorkers(3, 1));
        assertEquals(1, DatasetWriter.warmUpWorkers(1, 8));
    }

    @Test
    void rowRangesOfAnyPartitionConcatenateToTheDataFile() throws Exception {
        SplittableRandom rnd = new SplittableRandom(42);
        for (String output : new String[] {"  format: csv\n", "  format: json\n", "  format: jsonl\n"}) {
            CompiledSpec c = compile(withOutput(KINDS, output));
            byte[] whole = generate(c, 2, "whole" + output.hashCode()).get(0);
            long rows = c.spec().rows();
            RowRanges.Writer writer = RowRanges.writer(c);
            for (int attempt = 0; attempt < 3; attempt++) {
                ByteArrayOutputStream joined = new ByteArrayOutputStream();
                joined.write(RowRanges.prologue(c));
                long from = 0;
                while (from < rows) {
                    // cut points anywhere: inside blocks, at block edges, empty ranges; the one-shot
                    // call and a reused writer alike
                    long to = Math.min(rows, from + (attempt == 0 ? 4096 : rnd.nextLong(0, 9000)));
                    if (attempt == 2) {
                        writer.rows(from, to, joined);
                    } else {
                        RowRanges.rows(c, from, to, joined);
                    }
                    from = to;
                }
                joined.write(RowRanges.epilogue(c));
                assertArrayEquals(whole, joined.toByteArray(), "partition " + attempt + " of " + output.trim());
            }
        }
        CompiledSpec c = compile(withOutput(KINDS, "  format: csv\n"));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> RowRanges.rows(c, 5, 4, new ByteArrayOutputStream()));
        assertEquals("row range must satisfy 0 <= from <= to <= 20011: [5, 4)", e.getMessage());
    }

    /** The data file the one-row-at-a-time way: draw, text per cell, the format's row writer. */
    private static byte[] reference(CompiledSpec c) throws IOException {
        Spec spec = c.spec();
        List<ColumnSpec> columns = spec.columns();
        int k = columns.size();
        List<String> names = new ArrayList<>();
        CellKind[] kinds = new CellKind[k];
        for (int i = 0; i < k; i++) {
            ColumnSpec col = columns.get(i);
            names.add(col.name());
            ValueKind vk = col instanceof ColumnSpec.Random r ? r.marginal().valueKind() : ValueKind.INTEGER;
            kinds[i] = switch (vk) {
                case NUMBER, INTEGER -> CellKind.NUMBER;
                case BOOLEAN -> CellKind.BOOLEAN;
                case LABEL, DATE, TIMESTAMP -> CellKind.TEXT;
            };
        }
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (Writer out = new OutputStreamWriter(bytes, StandardCharsets.UTF_8)) {
            RowWriter w = DatasetWriter.rowWriter(spec.output(), out, names, kinds);
            w.begin();
            RowSampler s = new RowSampler(spec, c.model());
            RowSampler.Scratch scratch = s.scratch();
            double[] v = new double[k];
            boolean[] missing = new boolean[k];
            String[] cells = new String[k];
            for (long row = 0; row < spec.rows(); row++) {
                s.draw(row, v, missing, scratch);
                for (int i = 0; i < k; i++) {
                    ColumnSpec col = columns.get(i);
                    if (missing[i]) {
                        cells[i] = null;
                    } else if (col instanceof ColumnSpec.Random r) {
                        Marginal m = r.marginal();
                        cells[i] = DatasetWriter.text(m.valueKind(), m, v[i], r.decimals());
                    } else {
                        cells[i] = Long.toString(s.sequenceValue(i, row));
                    }
                }
                w.row(cells);
            }
            w.end();
        }
        return bytes.toByteArray();
    }

    @Test
    void encodedBytesEqualTheRowWritersOutput() throws Exception {
        String[] outputs = {
            "  format: csv\n",
            "  format: csv\n  delimiter: \";\"\n  null: NA\n  header: false\n",
            // delimiters that occur inside number texts force quoting of those cells
            "  format: csv\n  delimiter: \".\"\n",
            "  format: csv\n  delimiter: \"-\"\n",
            "  format: csv\n  guard-formulas: true\n",
            "  format: json\n",
            "  format: jsonl\n",
        };
        for (String output : outputs) {
            CompiledSpec c = compile(withOutput(KINDS.replace("rows: 20011", "rows: 3001"), output));
            byte[] written = generate(c, 2, "enc" + output.hashCode()).get(0);
            assertArrayEquals(reference(c), written, output);
        }
        // no rows at all
        CompiledSpec empty = compile(withOutput(KINDS.replace("rows: 20011", "rows: 0"), "  format: json\n"));
        assertArrayEquals(reference(empty), generate(empty, 3, "empty").get(0));
    }

    @Test
    void blockStatisticsAgreeWithRowByRowWelford() throws Exception {
        // the merged block moments (Chan, Golub and LeVeque's update) against Welford's update row by
        // row over the same written values; both are backward stable, so they agree to a few ulps of
        // the data's scale (Chan, Golub and LeVeque 1983, section 3)
        CompiledSpec c = compile(withOutput(KINDS, "  format: csv\n"));
        Spec spec = c.spec();
        int k = spec.columns().size();
        DatasetStats rowByRow = new DatasetStats(spec, c.model().order());
        DatasetStats blocks = new DatasetStats(spec, c.model().order());
        RowSampler s = new RowSampler(spec, c.model());
        RowSampler.Scratch scratch = s.scratch();
        int n = 1000;
        double[][] values = new double[k][n];
        boolean[][] missing = new boolean[k][n];
        DatasetStats.Block summary = blocks.newBlock();
        double[] v = new double[k];
        boolean[] miss = new boolean[k];
        for (long first = 0; first < spec.rows(); first += n) {
            int m = (int) Math.min(n, spec.rows() - first);
            s.drawBlock(first, m, values, missing, scratch);
            for (int r = 0; r < m; r++) {
                s.draw(first + r, v, miss, scratch);
                for (int i = 0; i < k; i++) {
                    assertEquals(Double.doubleToRawLongBits(v[i]), Double.doubleToRawLongBits(values[i][r]), "block = row");
                    assertEquals(miss[i], missing[i][r]);
                }
                rowByRow.accept(first + r, v, miss);
            }
            summary.compute(m, values, missing);
            blocks.acceptBlock(first, m, values, missing, summary);
        }
        for (int i = 0; i < k; i++) {
            Moments a = rowByRow.moments(i);
            Moments b = blocks.moments(i);
            assertEquals(a.count(), b.count());
            assertEquals(a.missing(), b.missing());
            assertEquals(a.min(), b.min());
            assertEquals(a.max(), b.max());
            double scale = Math.abs(a.mean()) + a.sd();
            assertEquals(a.mean(), b.mean(), 1e-12 * scale, "mean of column " + i);
            assertEquals(a.sd(), b.sd(), 1e-12 * scale, "sd of column " + i);
            if (rowByRow.histogram(i) != null) {
                for (int bin = 0; bin < rowByRow.histogram(i).bins(); bin++) {
                    assertEquals(rowByRow.histogram(i).count(bin), blocks.histogram(i).count(bin));
                }
                assertEquals(rowByRow.histogram(i).below(), blocks.histogram(i).below());
                assertEquals(rowByRow.histogram(i).above(), blocks.histogram(i).above());
            }
            if (rowByRow.counts(i) != null) {
                assertArrayEquals(rowByRow.counts(i), blocks.counts(i));
            }
        }
        for (int a = 0; a < rowByRow.correlatedCount(); a++) {
            for (int b = 0; b < a; b++) {
                assertEquals(rowByRow.pair(a, b).count(), blocks.pair(a, b).count());
                assertEquals(rowByRow.pair(a, b).correlation(), blocks.pair(a, b).correlation(), 1e-12);
            }
        }
        List<double[]> sa = rowByRow.sample().rows();
        List<double[]> sb = blocks.sample().rows();
        assertEquals(sa.size(), sb.size());
        for (int r = 0; r < sa.size(); r++) {
            assertArrayEquals(sa.get(r), sb.get(r));
        }
        assertTrue(sa.size() > 1000);
    }
}
