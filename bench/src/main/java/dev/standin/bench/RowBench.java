package dev.standin.bench;

import dev.standin.engine.CompiledSpec;
import dev.standin.engine.RowRanges;
import dev.standin.sampling.RowSampler;
import java.io.OutputStream;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Whole rows per row: {@code mixed} is bench/mixed-1m.yaml's 8 columns drawn and encoded to CSV bytes
 * ({@link RowRanges.Writer}, one thread, no statistics); {@code normalsK} are k correlated normal columns,
 * where the factor step w = Lz costs about k²/2 multiply-adds per row ({@code drawOnly} leaves out the
 * encoding, so the growth with k shows).
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
public class RowBench {

    static final int ROWS = 4096;

    @Param({"mixed", "normals5", "normals50", "normals500"})
    String spec;

    CompiledSpec compiled;
    RowRanges.Writer writer;
    RowSampler sampler;
    RowSampler.Scratch scratch;
    double[][] values;
    boolean[][] missing;
    long from;
    final OutputStream sink = OutputStream.nullOutputStream();

    @Setup
    public void setup() throws Exception {
        String yaml = spec.equals("mixed") ? Specs.mixed() : Specs.normals(Integer.parseInt(spec.substring(7)), 1L << 40);
        compiled = Specs.compile(yaml, 1L << 40);
        writer = RowRanges.writer(compiled);
        sampler = new RowSampler(compiled.spec(), compiled.model());
        scratch = sampler.scratch();
        int k = compiled.spec().columns().size();
        values = new double[k][ROWS];
        missing = new boolean[k][ROWS];
    }

    @Benchmark
    @OperationsPerInvocation(ROWS)
    public void drawAndEncode() throws Exception {
        long f = from += ROWS;
        writer.rows(f, f + ROWS, sink);
    }

    @Benchmark
    @OperationsPerInvocation(ROWS)
    public double[][] drawOnly() {
        long f = from += ROWS;
        sampler.drawBlock(f, ROWS, values, missing, scratch);
        return values;
    }
}
