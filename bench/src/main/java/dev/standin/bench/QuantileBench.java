package dev.standin.bench;

import dev.standin.marginal.Families;
import dev.standin.marginal.LatentQuantile;
import dev.standin.marginal.Marginal;
import java.util.SplittableRandom;
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
 * Each family's Gaussian-copula map F⁻¹(Φ(z)) per value: the fast form the sampler uses
 * ({@link LatentQuantile}) against the exact map it replaces ({@link Marginal#fromLatent}), on
 * standard normal latents. The families and parameters are bench/mixed-1m.yaml's.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class QuantileBench {

    static final int N = 1024;

    @Param({"gamma", "beta", "weibull", "lognormal", "poisson", "categorical", "bernoulli"})
    String family;

    Marginal marginal;
    LatentQuantile fast;
    final double[] z = new double[N];
    final double[] out = new double[N];

    @Setup
    public void setup() {
        marginal = switch (family) {
            case "gamma" -> Families.gammaFromMoments(310, 45);
            case "beta" -> Families.betaFromMoments(0.62, 0.12);
            case "weibull" -> Families.weibull(1.8, 420);
            case "lognormal" -> Families.lognormalFromMoments(48, 15);
            case "poisson" -> Families.poisson(3.2);
            case "categorical" -> Families.categorical(new String[] {"upper", "lower", "cabin", "car"}, new double[] {4, 3, 2, 1});
            default -> Families.bernoulli(0.07);
        };
        fast = LatentQuantile.of(marginal);
        SplittableRandom rnd = new SplittableRandom(5);
        for (int i = 0; i < N; i++) {
            z[i] = rnd.nextGaussian();
        }
    }

    @Benchmark
    @OperationsPerInvocation(N)
    public double[] fast() {
        fast.fromLatent(z, out, N);
        return out;
    }

    @Benchmark
    @OperationsPerInvocation(N)
    public double[] exact() {
        for (int i = 0; i < N; i++) {
            out[i] = marginal.fromLatent(z[i]);
        }
        return out;
    }
}
