package dev.standin.engine;

import dev.standin.marginal.Marginal;
import dev.standin.marginal.ValueKind;
import dev.standin.output.AtomicFile;
import dev.standin.output.ByteText;
import dev.standin.output.CellKind;
import dev.standin.output.CsvRowWriter;
import dev.standin.output.JsonRowWriter;
import dev.standin.output.NumberText;
import dev.standin.output.RowWriter;
import dev.standin.report.Check;
import dev.standin.report.DatasetStats;
import dev.standin.report.FidelityChecks;
import dev.standin.report.HtmlReport;
import dev.standin.sampling.RowSampler;
import dev.standin.spec.OutputSpec;
import dev.standin.spec.Spec;
import java.io.IOException;
import java.io.OutputStream;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.DigestOutputStream;
import java.time.Instant;
import java.time.LocalDate;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.List;

/**
 * Streams a compiled spec's rows into its data file while measuring what was written, then writes
 * the report. Memory is bounded by the number of columns, not rows.
 *
 * <p>Rows are made in blocks of {@link #blockRows(int)} consecutive rows, a size that depends on the
 * column count only: a block is drawn ({@link RowSampler#drawBlock}), encoded to bytes
 * ({@link RowEncoder}) and summarised ({@link DatasetStats.Block}) on one thread, and blocks are written
 * and merged into the statistics strictly in row order on the calling thread. With more than one
 * thread, workers make blocks ahead (at most {@code 2·threads + 2} blocks in flight, so memory stays
 * bounded). Every value, every byte and every statistic is therefore the same for any thread count.
 */
final class DatasetWriter {

    private DatasetWriter() {
    }

    /** How many rows pass between two calls of the progress callback. */
    static final long PROGRESS_EVERY = 1L << 16;

    /**
     * Rows per block for a spec with k columns: 4096, halved for wide specs so a block's arrays stay
     * near 2 MB (at least 256 rows). A power of two dividing {@link #PROGRESS_EVERY}.
     */
    static int blockRows(int columns) {
        int target = (1 << 18) / Math.max(columns, 1);
        int b = Integer.highestOneBit(Math.max(target, 1));
        return Math.max(256, Math.min(4096, b));
    }

    /** The default thread count: the processors available to the JVM. */
    static int defaultThreads() {
        return Runtime.getRuntime().availableProcessors();
    }

    static GenerationResult write(CompiledSpec compiled, Path outputRoot, java.util.function.LongConsumer progress)
            throws IOException {
        Spec spec = compiled.spec();
        int k = spec.columns().size();
        DatasetStats stats = new DatasetStats(spec, compiled.model().order());
        Path dataPath = outputRoot.resolve(compiled.dataFile());
        Path reportPath = outputRoot.resolve(compiled.reportFile());
        boolean html = compiled.htmlReport();
        MessageDigest digest = Hashes.sha256();
        long bytes;
        try (AtomicFile data = AtomicFile.create(dataPath); AtomicFile report = AtomicFile.create(reportPath);
             AtomicFile page = html ? AtomicFile.create(outputRoot.resolve(compiled.htmlReportFile())) : null) {
            CountingStream counter;
            try (OutputStream file = Files.newOutputStream(data.temp());
                 OutputStream out = counter = new CountingStream(new DigestOutputStream(file, digest))) {
                Blocks blocks = new Blocks(compiled);
                out.write(blocks.encoder.prologue());
                int threads = compiled.threads() > 0 ? compiled.threads() : defaultThreads();
                blocks.run(threads, stats, out, progress);
                out.write(blocks.encoder.epilogue());
            }
            bytes = counter.count();
            GenerationResult.WrittenFile dataFile = new GenerationResult.WrittenFile(compiled.dataFile(), bytes,
                    Hashes.hex(digest.digest()));
            List<Check> checks = FidelityChecks.of(spec, compiled.model(), stats);
            byte[] json = Report.build(compiled, dataFile, stats, checks).getBytes(StandardCharsets.UTF_8);
            Files.write(report.temp(), json);
            List<GenerationResult.WrittenFile> files = new ArrayList<>(List.of(dataFile));
            files.add(written(compiled.reportFile(), json));
            if (page != null) {
                byte[] htmlBytes = HtmlReport.build(compiled, stats, checks, Report.achieved(compiled, stats))
                        .getBytes(StandardCharsets.UTF_8);
                Files.write(page.temp(), htmlBytes);
                files.add(written(compiled.htmlReportFile(), htmlBytes));
            }
            data.commit();
            report.commit();
            if (page != null) {
                page.commit();
            }
            return new GenerationResult(spec.dataset(), spec.rows(), k, List.copyOf(files), note(compiled), List.copyOf(checks));
        }
    }

    /**
     * Writes the data bytes of rows {@code from .. to − 1} (no header or closing bracket: see
     * {@link RowRanges}) to a stream, one block at a time on the calling thread.
     */
    static void writeRows(CompiledSpec compiled, long from, long to, OutputStream out) throws IOException {
        new RangeWriter(compiled).write(from, to, out);
    }

    /** Writes row ranges of one spec, set up once (sampler tables, encoder, buffers); one thread at a time. */
    static final class RangeWriter {
        private final Blocks blocks;
        private final Block block;

        RangeWriter(CompiledSpec compiled) {
            this.blocks = new Blocks(compiled);
            this.block = blocks.newBlock();
        }

        void write(long from, long to, OutputStream out) throws IOException {
            for (long row = from; row < to; row += blocks.blockRows) {
                int n = (int) Math.min(blocks.blockRows, to - row);
                blocks.make(block, row, n, false);
                block.text.writeTo(out);
            }
        }
    }

    static byte[] prologue(CompiledSpec compiled) {
        return new RowEncoder(compiled.spec()).prologue();
    }

    static byte[] epilogue(CompiledSpec compiled) {
        return new RowEncoder(compiled.spec()).epilogue();
    }

    /** One block's buffers; they travel with the block from the worker that makes it to the writer. */
    private static final class Block {
        long first;
        int n;
        final double[][] values;
        final boolean[][] missing;
        final ByteText text;
        final DatasetStats.Block summary;
        final RowSampler.Scratch scratch;
        final RowEncoder.State state;

        Block(int columns, int rows, RowSampler sampler, RowEncoder encoder, DatasetStats.Block summary) {
            this.values = new double[columns][rows];
            this.missing = new boolean[columns][rows];
            this.text = new ByteText(rows * Math.max(16, 12 * columns));
            this.summary = summary;
            this.scratch = sampler.scratch();
            this.state = encoder.state();
        }
    }

    /** Makes blocks of one compiled spec and hands them to the writer in row order. */
    private static final class Blocks {
        final RowSampler sampler;
        final RowEncoder encoder;
        final int columns;
        final int blockRows;
        final long rows;
        private DatasetStats stats;

        Blocks(CompiledSpec compiled) {
            Spec spec = compiled.spec();
            this.sampler = new RowSampler(spec, compiled.model());
            this.encoder = new RowEncoder(spec);
            this.columns = spec.columns().size();
            this.blockRows = blockRows(columns);
            this.rows = spec.rows();
        }

        Block newBlock() {
            return new Block(columns, blockRows, sampler, encoder, stats == null ? null : stats.newBlock());
        }

        /** Draws, encodes and (with statistics) summarises rows first .. first + n − 1 into the block. */
        void make(Block b, long first, int n, boolean summarise) {
            b.first = first;
            b.n = n;
            b.text.clear();
            sampler.drawBlock(first, n, b.values, b.missing, b.scratch);
            encoder.encode(first, n, b.values, b.missing, b.text, b.state);
            if (summarise) {
                b.summary.compute(n, b.values, b.missing);
            }
        }

        void run(int threads, DatasetStats stats, OutputStream out, java.util.function.LongConsumer progress)
                throws IOException {
            this.stats = stats;
            long blockCount = (rows + blockRows - 1) / blockRows;
            if (threads <= 1 || blockCount <= 1) {
                Block b = newBlock();
                for (long i = 0; i < blockCount; i++) {
                    long first = i * blockRows;
                    make(b, first, (int) Math.min(blockRows, rows - first), true);
                    consume(b, stats, out, progress);
                }
                return;
            }
            int workers = (int) Math.min(threads, blockCount);
            int inFlight = 2 * workers + 2;
            java.util.concurrent.ArrayBlockingQueue<Block> free = new java.util.concurrent.ArrayBlockingQueue<>(inFlight);
            for (int i = 0; i < inFlight; i++) {
                free.add(newBlock());
            }
            java.util.concurrent.ExecutorService pool = java.util.concurrent.Executors.newFixedThreadPool(workers, r -> {
                Thread t = new Thread(r, "standin-rows");
                t.setDaemon(true);
                return t;
            });
            java.util.ArrayDeque<java.util.concurrent.Future<Block>> pending = new java.util.ArrayDeque<>();
            try {
                long next = 0;
                while (next < blockCount && pending.size() < inFlight) {
                    pending.add(submit(pool, free, next++));
                }
                while (!pending.isEmpty()) {
                    Block b = await(pending.poll());
                    consume(b, stats, out, progress);
                    free.add(b);
                    if (next < blockCount) {
                        pending.add(submit(pool, free, next++));
                    }
                }
            } finally {
                pool.shutdownNow();
            }
        }

        private java.util.concurrent.Future<Block> submit(java.util.concurrent.ExecutorService pool,
                                                          java.util.concurrent.BlockingQueue<Block> free, long index) {
            return pool.submit(() -> {
                Block b = free.take();
                long first = index * blockRows;
                make(b, first, (int) Math.min(blockRows, rows - first), true);
                return b;
            });
        }

        private static Block await(java.util.concurrent.Future<Block> f) throws IOException {
            try {
                return f.get();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new java.io.InterruptedIOException("interrupted while generating rows");
            } catch (java.util.concurrent.ExecutionException e) {
                Throwable cause = e.getCause();
                if (cause instanceof RuntimeException re) {
                    throw re;
                }
                if (cause instanceof Error err) {
                    throw err;
                }
                throw new IOException(cause);
            }
        }

        private static void consume(Block b, DatasetStats stats, OutputStream out, java.util.function.LongConsumer progress)
                throws IOException {
            b.text.writeTo(out);
            stats.acceptBlock(b.first, b.n, b.values, b.missing, b.summary);
            if (progress != null) {
                long done = b.first + b.n;
                for (long mark = (b.first / PROGRESS_EVERY + 1) * PROGRESS_EVERY; mark <= done; mark += PROGRESS_EVERY) {
                    progress.accept(mark);
                }
            }
        }
    }

    private static GenerationResult.WrittenFile written(String path, byte[] bytes) {
        return new GenerationResult.WrittenFile(path, bytes.length, Hashes.sha256(bytes));
    }

    /** The written text of a value of the given kind. */
    static String text(ValueKind kind, Marginal m, double value, int decimals) {
        return switch (kind) {
            case NUMBER -> NumberText.format(value, decimals);
            case INTEGER -> Long.toString((long) value);
            case BOOLEAN -> value == 1.0 ? "true" : "false";
            case LABEL -> m.label((int) value);
            case DATE -> LocalDate.ofEpochDay((long) value).toString();
            case TIMESTAMP -> Instant.ofEpochSecond((long) value).toString();
        };
    }

    private static String note(CompiledSpec compiled) {
        var repair = compiled.model().targetRepair();
        var latent = compiled.model().latentRepair();
        if (repair != null && repair.repaired()) {
            return "correlation repaired (max change " + NumberText.fixed(repair.maxChange(), 4) + ")";
        }
        if (latent != null && latent.repaired()) {
            return "latent correlation repaired (max change " + NumberText.fixed(latent.maxChange(), 4) + ")";
        }
        return null;
    }

    /** The row writer of an output format (the CSV one with the spec's formula guard). */
    static RowWriter rowWriter(OutputSpec output, Writer out, List<String> names, CellKind[] kinds) {
        return switch (output.format()) {
            case CSV -> new CsvRowWriter(out, names, kinds, output.header(), output.delimiter(), output.nullText(),
                    output.guardFormulas());
            case JSON -> JsonRowWriter.array(out, names, kinds);
            case JSONL -> JsonRowWriter.lines(out, names, kinds);
        };
    }

    /** Counts the bytes passing through. */
    private static final class CountingStream extends java.io.FilterOutputStream {
        private long count;

        CountingStream(OutputStream out) {
            super(out);
        }

        @Override
        public void write(int b) throws IOException {
            out.write(b);
            count++;
        }

        @Override
        public void write(byte[] b, int off, int len) throws IOException {
            out.write(b, off, len);
            count += len;
        }

        long count() {
            return count;
        }
    }
}
