package dev.standin.bench;

import dev.standin.engine.CompiledSpec;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Compiling a spec with k correlated columns: the check of the matrix, its repair when needed, the
 * measure → latent map and the factorisation ({@code normals}: a positive definite latent matrix, so
 * check and Cholesky only; {@code spearmanBand}: Spearman targets mapped to latent correlations and
 * checked). Single shots: the setup happens once per spec.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 1)
@Measurement(iterations = 3)
@Fork(1)
public class SetupBench {

    @Param({"5", "50", "500"})
    int k;

    @Benchmark
    public CompiledSpec normals() throws Exception {
        return Specs.compile(Specs.normals(k, 1000));
    }

    @Benchmark
    public CompiledSpec spearmanBand() throws Exception {
        return Specs.compile(Specs.spearmanBand(k));
    }
}
