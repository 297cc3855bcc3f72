package dev.standin.bench;

import dev.standin.output.ByteText;
import dev.standin.output.NumberText;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.infra.Blackhole;

/** Fixed-decimal text of values like bench/mixed-1m.yaml's (hundreds, 3 decimals): bytes, String, BigDecimal. */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class FormatBench {

    static final int N = 1024;
    final double[] x = new double[N];
    final ByteText out = new ByteText(64 * N);

    @Setup
    public void setup() {
        SplittableRandom rnd = new SplittableRandom(3);
        for (int i = 0; i < N; i++) {
            x[i] = 310 + 45 * rnd.nextGaussian();
        }
    }

    @Benchmark
    @OperationsPerInvocation(N)
    public double bytesAndReadBack() {
        out.clear();
        double s = 0;
        for (int i = 0; i < N; i++) {
            s += out.appendFixed(x[i], 3);
            out.append((byte) ',');
        }
        return s;
    }

    @Benchmark
    @OperationsPerInvocation(N)
    public void string(Blackhole bh) {
        for (int i = 0; i < N; i++) {
            bh.consume(NumberText.fixed(x[i], 3));
        }
    }

    @Benchmark
    @OperationsPerInvocation(N)
    public void bigDecimalAndParse(Blackhole bh) {
        // what every cell cost before: BigDecimal text, then Double.parseDouble of it for the statistics
        for (int i = 0; i < N; i++) {
            String s = new BigDecimal(x[i]).setScale(3, RoundingMode.HALF_EVEN).toPlainString();
            bh.consume(Double.parseDouble(s));
        }
    }
}
