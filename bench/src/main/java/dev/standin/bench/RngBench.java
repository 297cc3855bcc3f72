package dev.standin.bench;

import dev.standin.random.NormalQuantile;
import dev.standin.random.RandomStreams;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/** Philox4x32-10 uniforms and the AS 241 normal transform, per value, over a block of 4096 rows. */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class RngBench {

    static final int N = 4096;
    final double[] u = new double[N];
    final double[] z = new double[N];
    long row;

    @Benchmark
    @OperationsPerInvocation(N)
    public double[] uniform() {
        long from = row += N;
        for (int r = 0; r < N; r++) {
            u[r] = RandomStreams.uniform(1000001L, 0x5DEECE66DL, from + r);
        }
        return u;
    }

    final RandomStreams.Lanes lanes = new RandomStreams.Lanes();

    /** The block form the row sampler calls: the Philox rounds of many rows lane by lane. */
    @Benchmark
    @OperationsPerInvocation(N)
    public double[] uniforms() {
        long from = row += N;
        RandomStreams.uniforms(1000001L, 0x5DEECE66DL, from, u, N, lanes);
        return u;
    }

    @Benchmark
    @OperationsPerInvocation(N)
    public double[] uniformAndNormalOneByOne() {
        long from = row += N;
        for (int r = 0; r < N; r++) {
            z[r] = NormalQuantile.of(RandomStreams.uniform(1000001L, 0x5DEECE66DL, from + r));
        }
        return z;
    }

    @Benchmark
    @OperationsPerInvocation(N)
    public double[] uniformAndNormalBlock() {
        long from = row += N;
        for (int r = 0; r < N; r++) {
            u[r] = RandomStreams.uniform(1000001L, 0x5DEECE66DL, from + r);
        }
        NormalQuantile.of(u, z, N);
        return z;
    }
}
