package dev.standin.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.standin.engine.CompiledSpec;
import dev.standin.engine.Engine;
import dev.standin.engine.GenerationResult;
import dev.standin.random.NormalQuantile;
import dev.standin.random.RandomStreams;
import dev.standin.spec.Overrides;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.apache.commons.math3.distribution.ChiSquaredDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.stat.inference.KolmogorovSmirnovTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class FidelityChecksTest {

    private static final String SPEC = "dataset: orchard\nrows: 20000\nseed: 31\ncolumns:\n"
            + "  tree: {dist: sequence}\n"
            + "  apples: {dist: poisson, mean: 40}\n"
            + "  weight_kg: {dist: gamma, mean: 12, sd: 4, decimals: 2}\n"
            + "  height_m: {dist: normal, mean: 3.2, sd: 0.6, min: 1, decimals: 2, nulls: 0.05}\n"
            + "  variety: {dist: categorical, levels: {cox: 5, gala: 3, jonagold: 2}}\n"
            + "  sprayed: {dist: bernoulli, p: 0.3}\n"
            + "correlation:\n  measure: spearman\n  pairs:\n    apples ~ weight_kg: 0.6\n    height_m ~ weight_kg: 0.4\n"
            + "    sprayed ~ apples: -0.2\n";

    private static CompiledSpec compile(String spec) throws Exception {
        return Engine.create(Overrides.none()).compile("orchard.yaml", spec.getBytes(StandardCharsets.UTF_8), "");
    }

    @Test
    void constantsMatchPublishedValues() {
        // two-sided normal critical value for α = 1e-6: Φ⁻¹(1 − 5e-7) (AS 241; commons-math3 as an independent check)
        assertEquals(new NormalDistribution().inverseCumulativeProbability(1 - 5e-7), FidelityChecks.Z, 1e-4);
        assertEquals(NormalQuantile.of(1 - 5e-7), FidelityChecks.Z, 1e-4);
        // asymptotic Kolmogorov critical constant √(−ln(α/2)/2): at α = 0.05 the published value is 1.36
        // (Smirnov 1948; e.g. Massey 1951, JASA 46, table 1, "1.36/√n" for n > 35)
        assertEquals(1.36, Math.sqrt(-Math.log(0.05 / 2) / 2), 0.005);
        assertEquals(Math.sqrt(-Math.log(FidelityChecks.ALPHA / 2) / 2), FidelityChecks.KS_CONSTANT, 1e-4);
        // χ² quantile used for the critical value: 95% point with 10 df is 18.307 (Abramowitz & Stegun table 26.8)
        assertEquals(18.307, new ChiSquaredDistribution(null, 10).inverseCumulativeProbability(0.95), 1e-3);
    }

    @Test
    void ksDistanceAgreesWithCommonsMath() {
        SplittableRandom random = new SplittableRandom(4);
        double[] x = new double[3000];
        for (int i = 0; i < x.length; i++) {
            x[i] = NormalQuantile.of(random.nextDouble(1e-12, 1)) * 2 + 5;
        }
        var marginal = dev.standin.marginal.NormalMarginal.of(5, 2);
        double ours = FidelityChecks.ksDistance(marginal, x, 0.0);
        // commons-math3's KolmogorovSmirnovTest statistic against N(5, 2²), an independent implementation
        double theirs = new KolmogorovSmirnovTest().kolmogorovSmirnovStatistic(new NormalDistribution(null, 5, 2), x);
        assertEquals(theirs, ours, 1e-12);
    }

    @Test
    void pearsonVarianceOfBivariateNormalIsTheClassicalOne() {
        // for bivariate normal data n·Var(r) → (1 − ρ²)² (Fisher 1915; Stuart & Ord 1994 example 10.6)
        double rho = 0.6;
        List<double[]> rows = new ArrayList<>();
        for (long n = 0; n < 20000; n++) {
            double z1 = NormalQuantile.of(RandomStreams.uniform(9, 1, n));
            double z2 = NormalQuantile.of(RandomStreams.uniform(9, 2, n));
            rows.add(new double[] {z1, rho * z1 + Math.sqrt(1 - rho * rho) * z2});
        }
        double v = FidelityChecks.pearsonAsymptoticVariance(rows, 0, 1, rho);
        // sampling error of the fourth moments at n = 20000 is a few percent (common practice: 10% band)
        assertEquals(Math.pow(1 - rho * rho, 2), v, 0.1 * Math.pow(1 - rho * rho, 2));
    }

    @Test
    void aCorrectGeneratorPassesEveryCheck(@TempDir Path out) throws Exception {
        // each check has a false-failure rate below 1e-6 (see FidelityChecks); with ~25 checks per seed and
        // 3 seeds the chance this test fails for a correct generator is below 1e-4
        for (long seed : new long[] {1, 2, 3}) {
            CompiledSpec c = Engine.create(new Overrides(seed, null, null)).withoutHtmlReport()
                    .compile("orchard.yaml", SPEC.getBytes(StandardCharsets.UTF_8), "");
            GenerationResult r = Engine.create(Overrides.none()).generate(c, out);
            assertTrue(r.failedChecks().isEmpty(), () -> "seed " + seed + ": " + r.failedChecks());
            assertTrue(r.checks().stream().filter(ch -> ch.pass() != null).count() >= 20, r.checks()::toString);
        }
    }

    @Test
    void aShiftedMeanIsCaught() throws Exception {
        CompiledSpec c = compile(SPEC);
        DatasetStats stats = new DatasetStats(c.spec(), c.model().order());
        var sampler = new dev.standin.sampling.RowSampler(c.spec(), c.model());
        var scratch = sampler.scratch();
        double[] v = new double[6];
        boolean[] missing = new boolean[6];
        for (long row = 0; row < 20000; row++) {
            sampler.draw(row, v, missing, scratch);
            // a wrong sampler: height shifted by 0.04 m; the tolerance is 4.89 SE + half the rounding step =
            // 4.89 × 0.6/√19000 + 0.005 ≈ 0.026 m, so the shift is caught
            v[3] += 0.04;
            stats.accept(row, v, missing);
        }
        List<Check> checks = FidelityChecks.of(c.spec(), c.model(), stats);
        Check mean = checks.stream().filter(ch -> ch.name().equals("mean of height_m")).findFirst().orElseThrow();
        assertFalse(mean.pass(), mean::describe);
        Check other = checks.stream().filter(ch -> ch.name().equals("mean of weight_kg")).findFirst().orElseThrow();
        assertTrue(other.pass(), other::describe);
    }

    @Test
    void aWrongCorrelationAndAWrongFrequencyAreCaught() throws Exception {
        CompiledSpec c = compile(SPEC);
        DatasetStats stats = new DatasetStats(c.spec(), c.model().order());
        var sampler = new dev.standin.sampling.RowSampler(c.spec(), c.model());
        var scratch = sampler.scratch();
        double[] v = new double[6];
        boolean[] missing = new boolean[6];
        for (long row = 0; row < 20000; row++) {
            sampler.draw(row, v, missing, scratch);
            v[2] = 12 + 4 * NormalQuantile.of(RandomStreams.uniform(77, 5, row)); // weight drawn independently
            if (row % 10 == 0) {
                v[4] = 2; // too many jonagold
            }
            stats.accept(row, v, missing);
        }
        List<Check> checks = FidelityChecks.of(c.spec(), c.model(), stats);
        assertFalse(find(checks, "spearman of apples ~ weight_kg").pass());
        assertFalse(find(checks, "chi-square of variety").pass());
    }

    @Test
    void tiedColumnsPassTheirRankChecks(@TempDir Path out) throws Exception {
        // a ~ b = 1 and b ~ c = −1: the columns are one variable up to sign and monotone maps, so their
        // ranks agree (or mirror) except where rounding to 4 decimals ties values in one column and not
        // in the other; Spearman is then 1 and −1 up to those ties (definition of ranks)
        String spec = "dataset: tide-gauges\nrows: 500\nseed: 9\ncolumns:\n"
                + "  a: {dist: normal, mean: 0, sd: 1, decimals: 4}\n"
                + "  b: {dist: lognormal, meanlog: 0, sdlog: 0.5, decimals: 4}\n"
                + "  c: {dist: normal, mean: 3, sd: 2, decimals: 4}\n"
                + "  d: {dist: normal, mean: 0, sd: 1, decimals: 4}\n"
                + "correlation:\n  measure: spearman\n  pairs: {a ~ b: 1, b ~ c: -1, c ~ d: 0.4}\n";
        CompiledSpec c = Engine.create(Overrides.none()).withoutHtmlReport()
                .compile("tides.yaml", spec.getBytes(StandardCharsets.UTF_8), "");
        GenerationResult r = Engine.create(Overrides.none()).generate(c, out);
        assertTrue(r.failedChecks().isEmpty(), () -> r.failedChecks().toString());
        Check ab = find(r.checks(), "spearman of a ~ b");
        assertEquals(1.0, ab.achieved(), 1e-5);
        assertEquals(-1.0, find(r.checks(), "spearman of b ~ c").achieved(), 1e-5);
        assertEquals(Boolean.TRUE, ab.pass());
    }

    @Test
    void tinyRowCountsSaySoInsteadOfPassing(@TempDir Path out) throws Exception {
        CompiledSpec c = Engine.create(new Overrides(null, 20L, null)).withoutHtmlReport()
                .compile("orchard.yaml", SPEC.getBytes(StandardCharsets.UTF_8), "");
        GenerationResult r = Engine.create(Overrides.none()).generate(c, out);
        Check mean = find(r.checks(), "mean of weight_kg");
        assertNull(mean.pass());
        assertTrue(mean.note().contains("no useful power"), mean.note());
    }

    private static Check find(List<Check> checks, String name) {
        return checks.stream().filter(ch -> ch.name().equals(name)).findFirst()
                .orElseThrow(() -> new AssertionError("no check " + name + " in " + checks));
    }
}
