package dev.standin.bench;

import dev.standin.correlation.CorrelationRepair;
import dev.standin.correlation.RepairPolicy;
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
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Repairing a hand-written k × k target that is not positive semidefinite ({@link Specs#perturbedFactor}):
 * {@code nearest} (Higham's alternating projections with Anderson acceleration), {@code clip}
 * (eigenvalue clipping) and {@code compileSpec} (the whole spec: parsing the k² entries, the check,
 * the repair and the factor). Single shots: a repair happens once per spec.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 1)
@Measurement(iterations = 3)
@Fork(1)
public class RepairBench {

    @Param({"50", "200", "500"})
    int k;

    double[][] target;
    String spec;

    @Setup
    public void setUp() {
        target = Specs.perturbedFactor(k, 42);
        spec = Specs.latentSpec(target);
    }

    @Benchmark
    public CorrelationRepair.Outcome nearest() throws Exception {
        return CorrelationRepair.repair(target, RepairPolicy.NEAREST);
    }

    @Benchmark
    public CorrelationRepair.Outcome clip() throws Exception {
        return CorrelationRepair.repair(target, RepairPolicy.CLIP);
    }

    @Benchmark
    public CompiledSpec compileSpec() throws Exception {
        return Specs.compile(spec);
    }
}
