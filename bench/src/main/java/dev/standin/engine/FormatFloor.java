package dev.standin.engine;

import dev.standin.output.ByteText;
import dev.standin.sampling.RowSampler;
import dev.standin.spec.Overrides;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.DigestOutputStream;
import java.security.MessageDigest;

/**
 * The "format and write only" floor of bench/compare.sh: the spec's rows encoded by the same
 * {@link RowEncoder} and written through the same stream stack as a real run (file, SHA-256 digest,
 * byte count), but from values drawn once: the first block is drawn, and every block re-encodes a
 * copy of it at its own row numbers. No drawing, no statistics, no report. What a run costs above
 * this is the price of the random draws, the copula maps and the statistics.
 *
 * <p>{@code java -cp bench/target/benchmarks.jar dev.standin.engine.FormatFloor SPEC OUT_FILE [ROWS]}
 */
public final class FormatFloor {

    private FormatFloor() {
    }

    public static void main(String[] args) throws Exception {
        long start = System.nanoTime();
        Long rows = args.length > 2 ? Long.parseLong(args[2]) : null;
        CompiledSpec c = Engine.create(new Overrides(null, rows, null)).compile(Path.of(args[0]), args[0], "");
        long total = c.spec().rows();
        int k = c.spec().columns().size();
        int block = DatasetWriter.blockRows(k);
        RowSampler sampler = new RowSampler(c.spec(), c.model());
        RowEncoder encoder = new RowEncoder(c.spec());
        double[][] drawn = new double[k][block];
        boolean[][] missing = new boolean[k][block];
        sampler.drawBlock(0, (int) Math.min(block, total), drawn, missing, sampler.scratch());
        double[][] values = new double[k][block];
        ByteText text = new ByteText(block * 16 * k);
        RowEncoder.State state = encoder.state();
        MessageDigest digest = MessageDigest.getInstance("SHA-256");
        long bytes = 0;
        try (OutputStream out = new DigestOutputStream(Files.newOutputStream(Path.of(args[1])), digest)) {
            byte[] prologue = encoder.prologue();
            out.write(prologue);
            bytes += prologue.length;
            for (long first = 0; first < total; first += block) {
                int n = (int) Math.min(block, total - first);
                for (int i = 0; i < k; i++) {
                    System.arraycopy(drawn[i], 0, values[i], 0, n);
                }
                text.clear();
                encoder.encode(first, n, values, missing, text, state);
                text.writeTo(out);
                bytes += text.length();
            }
            out.write(encoder.epilogue());
        }
        digest.digest();
        System.err.printf("format-floor rows=%d bytes=%d seconds=%.3f%n", total, bytes, (System.nanoTime() - start) / 1e9);
    }
}
