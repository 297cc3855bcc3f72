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
import java.io.InterruptedIOException;
import java.io.OutputStream;
import java.io.Writer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.security.MessageDigest;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinTask;
import java.util.concurrent.Future;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.concurrent.ThreadPoolExecutor;
import java.util.concurrent.TimeUnit;
import java.util.function.LongConsumer;

/**
 * Streams a compiled spec's rows into its data file while measuring what was written, then writes
 * the report. Memory is bounded by the number of columns, not rows.
 *
 * <p>Rows are made in blocks of {@link #blockRows(int)} consecutive rows, a size that depends on the
 * column count only: a block is drawn ({@link RowSampler#drawBlock}), encoded to bytes
 * ({@link RowEncoder}) and summarised ({@link DatasetStats.Block}) on one thread, and blocks are digested
 * and merged into the statistics strictly in row order on the calling thread. With more than one
 * thread, workers make blocks ahead (at most {@code 2·threads + 2} blocks in flight, so memory stays
 * bounded) and each block is written to its place in the file by a worker ({@link BlockPlacement}), mostly
 * the one that made it, so the bytes are copied to the kernel from the cache they were made in. Every
 * value, every byte and every statistic is therefore the same for any thread count.
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

    /**
     * Blocks made before every worker starts: while the JIT compiles the hot code of a fresh JVM
     * (its compiler threads need a processor), the pool leaves one processor free for it
     * ({@link #warmUpWorkers}). On the 2-core reference machine this made two threads about 10% faster
     * at 1,000,000 and at 10,000,000 rows of the reference job (README, Performance). Which worker
     * makes a block never changes its bytes.
     */
    static final long WARM_UP_BLOCKS = 128;

    /** Workers for the first {@link #WARM_UP_BLOCKS} blocks: one processor left to the JIT, at least one worker. */
    static int warmUpWorkers(int workers, int processors) {
        return Math.max(1, Math.min(workers, processors - 1));
    }

    /** The default thread count: the processors available to the JVM. */
    static int defaultThreads() {
        return Runtime.getRuntime().availableProcessors();
    }

    static GenerationResult write(CompiledSpec compiled, Path outputRoot, LongConsumer progress)
            throws IOException {
        Spec spec = compiled.spec();
        int k = spec.columns().size();
        DatasetStats stats = new DatasetStats(spec, compiled.model().order());
        Path dataPath = outputRoot.resolve(compiled.dataFile());
        Path reportPath = outputRoot.resolve(compiled.reportFile());
        boolean html = compiled.htmlReport();
        MessageDigest digest = Hashes.sha256();
        long bytes;
        int threads = compiled.threads() > 0 ? compiled.threads() : defaultThreads();
        // with more than one thread, the reports' independent parts are made side by side too
        boolean parallel = threads > 1;
        try (AtomicFile data = AtomicFile.create(dataPath); AtomicFile report = AtomicFile.create(reportPath);
             AtomicFile page = html ? AtomicFile.create(outputRoot.resolve(compiled.htmlReportFile())) : null) {
            try (FileChannel file = FileChannel.open(data.temp(), StandardOpenOption.WRITE,
                    StandardOpenOption.TRUNCATE_EXISTING)) {
                Blocks blocks = new Blocks(compiled);
                DataFile out = new DataFile(file, digest);
                out.append(blocks.encoder.prologue());
                blocks.run(threads, stats, out, progress);
                out.append(blocks.encoder.epilogue());
                bytes = out.length();
            }
            GenerationResult.WrittenFile dataFile = new GenerationResult.WrittenFile(compiled.dataFile(), bytes,
                    Hashes.hex(digest.digest()));
            List<Check> checks = FidelityChecks.of(spec, compiled.model(), stats, parallel);
            // the achieved matrix once, on this thread (it asks the shared sample for ranks)
            double[][] achieved = spec.correlation() == null ? null : Report.achieved(compiled, stats);
            ForkJoinTask<byte[]> htmlTask = page == null ? null : ForkJoinTask.adapt(() -> HtmlReport.build(compiled,
                    stats, checks, achieved).getBytes(StandardCharsets.UTF_8));
            if (htmlTask != null && parallel) {
                htmlTask.fork();
            }
            byte[] json = Report.build(compiled, dataFile, stats, checks, achieved).getBytes(StandardCharsets.UTF_8);
            Files.write(report.temp(), json);
            List<GenerationResult.WrittenFile> files = new ArrayList<>(List.of(dataFile));
            files.add(written(compiled.reportFile(), json));
            if (page != null) {
                byte[] htmlBytes = parallel ? htmlTask.join() : htmlTask.invoke();
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

    /** One block's buffers; they travel with the block from the worker that makes it to its writer and the in-order consumer. */
    private static final class Block extends BlockPlacement.Placed {
        long first;
        int n;
        final double[][] values;
        final boolean[][] missing;
        final DatasetStats.Block summary;
        final RowSampler.Scratch scratch;
        final RowEncoder.State state;

        Block(int columns, int rows, RowSampler sampler, RowEncoder encoder, DatasetStats.Block summary) {
            super(new ByteText(rows * Math.max(16, 12 * columns)));
            this.values = new double[columns][rows];
            this.missing = new boolean[columns][rows];
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

        void run(int threads, DatasetStats stats, DataFile out, LongConsumer progress) throws IOException {
            this.stats = stats;
            long blockCount = (rows + blockRows - 1) / blockRows;
            if (threads <= 1 || blockCount <= 1) {
                Block b = newBlock();
                for (long i = 0; i < blockCount; i++) {
                    long first = i * blockRows;
                    make(b, first, (int) Math.min(blockRows, rows - first), true);
                    out.writeAtEnd(b.text);
                    consume(b, stats, out, progress);
                }
                return;
            }
            int workers = (int) Math.min(threads, blockCount);
            int inFlight = 2 * workers + 2;
            BlockingQueue<Block> free = new ArrayBlockingQueue<>(inFlight);
            for (int i = 0; i < inFlight; i++) {
                free.add(newBlock());
            }
            BlockPlacement<Block> placement = new BlockPlacement<>(out::writeAt, out.length(), inFlight, free);
            int warmUpWorkers = warmUpWorkers(workers, Runtime.getRuntime().availableProcessors());
            ThreadPoolExecutor pool = new ThreadPoolExecutor(warmUpWorkers, workers, 0L, TimeUnit.MILLISECONDS,
                    new LinkedBlockingQueue<>(), r -> {
                        Thread t = new Thread(r, "standin-rows");
                        t.setDaemon(true);
                        return t;
                    });
            ArrayDeque<Future<Block>> pending = new ArrayDeque<>();
            try {
                long next = 0;
                while (next < blockCount && pending.size() < inFlight) {
                    pending.add(submit(pool, free, placement, next++));
                }
                while (!pending.isEmpty()) {
                    Block b = await(pending.poll());
                    consume(b, stats, out, progress);
                    placement.release(b);
                    if (next < blockCount) {
                        // (>=: with 64 workers or more the first blocks in flight already pass the mark)
                        if (next >= WARM_UP_BLOCKS && pool.getCorePoolSize() < workers) {
                            pool.setCorePoolSize(workers);
                        }
                        pending.add(submit(pool, free, placement, next++));
                    }
                }
                out.skipTo(placement.end());
            } finally {
                pool.shutdownNow();
            }
        }

        private Future<Block> submit(ExecutorService pool, BlockingQueue<Block> free, BlockPlacement<Block> placement,
                                     long index) {
            return pool.submit(() -> {
                Block b = free.take();
                b.index = index;
                b.holders.set(2);
                long first = index * blockRows;
                make(b, first, (int) Math.min(blockRows, rows - first), true);
                placement.made(b);
                return b;
            });
        }

        private static Block await(Future<Block> f) throws IOException {
            try {
                return f.get();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new InterruptedIOException("interrupted while generating rows");
            } catch (ExecutionException e) {
                Throwable cause = e.getCause();
                if (cause instanceof RuntimeException re) {
                    throw re;
                }
                if (cause instanceof Error err) {
                    throw err;
                }
                if (cause instanceof IOException io) {
                    throw io;
                }
                throw new IOException(cause);
            }
        }

        private static void consume(Block b, DatasetStats stats, DataFile out, LongConsumer progress) {
            out.digest(b.text);
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

    /**
     * The data file being written: its digest, fed in file order on the calling thread, and the end
     * of what has been placed so far.
     */
    private static final class DataFile {
        private final FileChannel channel;
        private final MessageDigest digest;
        private long length;

        DataFile(FileChannel channel, MessageDigest digest) {
            this.channel = channel;
            this.digest = digest;
        }

        /** Writes bytes at a position without digesting them (a worker placing its block). */
        void writeAt(ByteText text, long position) throws IOException {
            text.writeTo(channel, position);
        }

        /** Writes bytes at the end without digesting them ({@link #digest} does, in file order). */
        void writeAtEnd(ByteText text) throws IOException {
            text.writeTo(channel, length);
            length += text.length();
        }

        /** Writes and digests bytes at the end. */
        void append(byte[] bytes) throws IOException {
            ByteText text = new ByteText(bytes.length);
            text.append(bytes);
            writeAtEnd(text);
            digest(text);
        }

        /** Feeds the digest a text that a worker writes (or wrote) at its place. */
        void digest(ByteText text) {
            text.updateDigest(digest);
        }

        /** Moves the end past the texts the workers placed. */
        void skipTo(long end) {
            length = end;
        }

        long length() {
            return length;
        }
    }

}
