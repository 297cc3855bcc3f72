package dev.standin.marginal;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.standin.engine.CompiledSpec;
import dev.standin.engine.Engine;
import dev.standin.sampling.RowSampler;
import dev.standin.spec.Overrides;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.DoubleUnaryOperator;
import java.util.function.IntToDoubleFunction;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.apache.commons.math3.distribution.BetaDistribution;
import org.apache.commons.math3.distribution.BinomialDistribution;
import org.apache.commons.math3.distribution.ChiSquaredDistribution;
import org.apache.commons.math3.distribution.ExponentialDistribution;
import org.apache.commons.math3.distribution.GammaDistribution;
import org.apache.commons.math3.distribution.LogNormalDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.distribution.PascalDistribution;
import org.apache.commons.math3.distribution.PoissonDistribution;
import org.apache.commons.math3.distribution.RealDistribution;
import org.apache.commons.math3.distribution.TriangularDistribution;
import org.apache.commons.math3.distribution.WeibullDistribution;
import org.apache.commons.math3.stat.inference.KolmogorovSmirnovTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Seeded 10^5-row samples of every family through the engine, against commons-math3's distributions:
 * Kolmogorov–Smirnov for continuous families, χ² for discrete ones, both at a false-failure rate of
 * about 1e-6 per check (for a seed drawn at random; the seeds are fixed, so the outcome is too).
 *
 * <p>KS: √n·D<sub>n</sub> is asymptotically Kolmogorov distributed, P(√n D &gt; t) ≈ 2Σ<sub>k≥1</sub>
 * (−1)<sup>k−1</sup>e<sup>−2k²t²</sup> (A. N. Kolmogorov 1933; N. Smirnov 1948); the first term is 1e-6 at
 * t = √(ln(2·10⁶)/2) = 2.6934 and the next is ~1e-25, so t = 2.6934. With the exact CDF of a discrete
 * distribution the test is conservative (fails less often), which covers timestamps (whole seconds).
 *
 * <p>χ²: categories in order, neighbours pooled until each expected count is at least 5 (W. G.
 * Cochran, "Some methods for strengthening the common χ² tests", Biometrics 10, 1954; common
 * practice); Pearson's X² against the 1 − 1e-6 quantile of χ² with (cells − 1) degrees of freedom
 * (commons-math3). One test method makes about 30 checks, so fails by chance with probability ≤ 3e-5.
 */
class FamiliesGoodnessOfFitTest {

    private static final int N = 100_000;
    private static final double KS_CRITICAL = Math.sqrt(Math.log(2e6) / 2);

    private static final String SPEC = "dataset: family-parade\n"
            + "rows: " + N + "\n"
            + "seed: 7070707\n"
            + "columns:\n"
            + "  ln: {dist: lognormal, mean: 48, sd: 15}\n"
            + "  ex: {dist: exponential, mean: 4}\n"
            + "  ga: {dist: gamma, shape: 2.5, scale: 1.2}\n"
            + "  gm: {dist: gamma, mean: 30, sd: 12}\n"
            + "  be: {dist: beta, alpha: 2, beta: 5}\n"
            + "  bm: {dist: beta, mean: 0.3, sd: 0.1}\n"
            + "  we: {dist: weibull, shape: 1.5, scale: 3}\n"
            + "  tr: {dist: triangular, min: 1, mode: 2, max: 5}\n"
            + "  qu: {dist: quantiles, points: {0: 1, 0.5: 4, 0.9: 10, 1: 50}}\n"
            + "  tg: {dist: gamma, shape: 2, scale: 3, min: 1, max: 20}\n"
            + "  tl: {dist: lognormal, meanlog: 0, sdlog: 1, min: 1}\n"
            + "  po: {dist: poisson, mean: 3.5}\n"
            + "  bi: {dist: binomial, trials: 20, p: 0.3}\n"
            + "  nb: {dist: negbinomial, mean: 4, sd: 3}\n"
            + "  np: {dist: negbinomial, size: 3, p: 0.4}\n"
            + "  tp: {dist: poisson, mean: 3.5, min: 2, max: 9}\n"
            + "  bo: {dist: bernoulli, p: 0.2}\n"
            + "  ca: {dist: categorical, levels: {rye: 1, spelt: 2, oat: 5}}\n"
            + "  da: {dist: date, from: 2026-03-01, to: 2026-05-31}\n"
            + "  ts: {dist: timestamp, from: 2026-05-01T00:00:00Z, to: 2026-05-31T23:59:59Z}\n"
            // half the columns through the copula (fromLatent), half by plain inversion (quantile)
            + "correlation:\n"
            + "  measure: spearman\n"
            + "  pairs:\n"
            + "    ln ~ ga: 0.5\n"
            + "    be ~ tr: -0.4\n"
            + "    tg ~ tl: 0.3\n"
            + "    po ~ nb: 0.6\n"
            + "    da ~ ln: 0.2\n"
            + "    tp ~ ga: -0.3\n";

    private static double[][] draw(CompiledSpec c) {
        RowSampler s = new RowSampler(c.spec(), c.model());
        RowSampler.Scratch scratch = s.scratch();
        int k = s.columnCount();
        double[][] d = new double[k][N];
        double[] v = new double[k];
        boolean[] missing = new boolean[k];
        for (int row = 0; row < N; row++) {
            s.draw(row, v, missing, scratch);
            for (int j = 0; j < k; j++) {
                d[j][row] = v[j];
            }
        }
        return d;
    }

    private static int index(CompiledSpec c, String name) {
        for (int i = 0; i < c.spec().columns().size(); i++) {
            if (c.spec().columns().get(i).name().equals(name)) {
                return i;
            }
        }
        throw new AssertionError(name);
    }

    /** √n·D_n against 2.6934; D computed here from the sorted sample and the reference CDF. */
    private static void ks(double[] x, DoubleUnaryOperator cdf, String what) {
        double[] s = x.clone();
        Arrays.sort(s);
        int n = s.length;
        double d = 0;
        for (int i = 0; i < n; i++) {
            double f = cdf.applyAsDouble(s[i]);
            d = Math.max(d, Math.max((i + 1.0) / n - f, f - (double) i / n));
        }
        double stat = Math.sqrt(n) * d;
        assertTrue(stat <= KS_CRITICAL, () -> what + ": √n·D = " + stat + " > " + KS_CRITICAL);
    }

    /** KS with commons-math3's own statistic (an independent implementation of D). */
    private static void ks(double[] x, RealDistribution ref, String what) {
        double d = new KolmogorovSmirnovTest().kolmogorovSmirnovStatistic(ref, x);
        double stat = Math.sqrt(x.length) * d;
        assertTrue(stat <= KS_CRITICAL, () -> what + ": √n·D = " + stat + " > " + KS_CRITICAL);
        ks(x, ref::cumulativeProbability, what);
    }

    /** Pearson's X² over values lo..hi (outside values fail), expected N·pmf(k), neighbours pooled to ≥ 5. */
    private static void chiSquare(double[] x, int lo, int hi, IntToDoubleFunction pmf, String what) {
        long[] counts = new long[hi - lo + 1];
        for (double v : x) {
            assertTrue(v == Math.rint(v) && v >= lo && v <= hi, what + ": value outside " + lo + ".." + hi + ": " + v);
            counts[(int) v - lo]++;
        }
        List<double[]> cells = new ArrayList<>();
        double e = 0;
        double o = 0;
        double total = 0;
        for (int k = lo; k <= hi; k++) {
            total += pmf.applyAsDouble(k);
        }
        for (int k = lo; k <= hi; k++) {
            e += x.length * pmf.applyAsDouble(k) / total;
            o += counts[k - lo];
            if (e >= 5) {
                cells.add(new double[] {o, e});
                e = 0;
                o = 0;
            }
        }
        if (e > 0 || o > 0) {
            // the remainder joins the last cell
            double[] last = cells.get(cells.size() - 1);
            last[0] += o;
            last[1] += e;
        }
        double x2 = 0;
        for (double[] c : cells) {
            x2 += (c[0] - c[1]) * (c[0] - c[1]) / c[1];
        }
        int df = cells.size() - 1;
        double critical = new ChiSquaredDistribution(df).inverseCumulativeProbability(1 - 1e-6);
        double stat = x2;
        assertTrue(stat <= critical, () -> what + ": X² = " + stat + " > " + critical + " (df " + df + ")");
    }

    @Test
    void everyFamilyFollowsItsDistribution() throws Exception {
        CompiledSpec c = Engine.create(Overrides.none()).compile("family-parade.yaml", SPEC.getBytes(StandardCharsets.UTF_8), "");
        double[][] d = draw(c);
        // lognormal from mean 48, sd 15: σ² = ln(1 + (15/48)²), μ = ln 48 − σ²/2 (moments of the lognormal,
        // Johnson, Kotz and Balakrishnan 1994, ch. 14)
        double s2 = Math.log(1 + (15.0 / 48) * (15.0 / 48));
        ks(d[index(c, "ln")], new LogNormalDistribution(Math.log(48) - s2 / 2, Math.sqrt(s2)), "lognormal");
        ks(d[index(c, "ex")], new ExponentialDistribution(4), "exponential");
        ks(d[index(c, "ga")], new GammaDistribution(2.5, 1.2), "gamma");
        // gamma from mean 30, sd 12: shape (30/12)² = 6.25, scale 144/30 = 4.8
        ks(d[index(c, "gm")], new GammaDistribution(6.25, 4.8), "gamma (mean, sd)");
        ks(d[index(c, "be")], new BetaDistribution(2, 5), "beta");
        // beta from mean 0.3, sd 0.1: ν = 0.3·0.7/0.01 − 1 = 20, α = 6, β = 14
        ks(d[index(c, "bm")], new BetaDistribution(6, 14), "beta (mean, sd)");
        ks(d[index(c, "we")], new WeibullDistribution(1.5, 3), "weibull");
        ks(d[index(c, "tr")], new TriangularDistribution(1, 2, 5), "triangular");
        // quantiles: piecewise-linear quantile function, so F is piecewise linear through the points
        double[] qp = {0, 0.5, 0.9, 1};
        double[] qv = {1, 4, 10, 50};
        ks(d[index(c, "qu")], v -> {
            for (int i = 0; i + 1 < qv.length; i++) {
                if (v <= qv[i + 1]) {
                    return qp[i] + (Math.max(v, qv[i]) - qv[i]) / (qv[i + 1] - qv[i]) * (qp[i + 1] - qp[i]);
                }
            }
            return 1.0;
        }, "quantiles");
        // truncated: F(x | [a, b]) = (F(x) − F(a))/(F(b) − F(a)), and never a value outside [a, b]
        GammaDistribution g23 = new GammaDistribution(2, 3);
        double[] tg = d[index(c, "tg")];
        for (double v : tg) {
            assertTrue(v >= 1 && v <= 20, "truncated gamma outside [1, 20]: " + v);
        }
        double ga = g23.cumulativeProbability(1);
        double gb = g23.cumulativeProbability(20);
        ks(tg, v -> (g23.cumulativeProbability(v) - ga) / (gb - ga), "gamma on [1, 20]");
        NormalDistribution std = new NormalDistribution(0, 1);
        double[] tl = d[index(c, "tl")];
        for (double v : tl) {
            assertTrue(v >= 1 && Double.isFinite(v), "truncated lognormal outside [1, ∞): " + v);
        }
        ks(tl, v -> (std.cumulativeProbability(Math.log(v)) - 0.5) / 0.5, "lognormal on [1, ∞)");

        // discrete families: χ² over their support (the far tails pool into the end cells)
        PoissonDistribution po = new PoissonDistribution(null, 3.5, 1e-15, 10_000_000);
        chiSquare(d[index(c, "po")], 0, 40, po::probability, "poisson");
        BinomialDistribution bi = new BinomialDistribution(20, 0.3);
        chiSquare(d[index(c, "bi")], 0, 20, bi::probability, "binomial");
        // negbinomial from mean 4, sd 3: p = 4/9, size 16/5 (not whole, so the pmf is written out:
        // Γ(k + r)/(Γ(r)k!) p^r (1 − p)^k)
        double r = 3.2;
        double p = 4.0 / 9;
        chiSquare(d[index(c, "nb")], 0, 120, k -> Math.exp(org.apache.commons.math3.special.Gamma.logGamma(k + r)
                - org.apache.commons.math3.special.Gamma.logGamma(r) - org.apache.commons.math3.special.Gamma.logGamma(k + 1.0)
                + r * Math.log(p) + k * Math.log1p(-p)), "negbinomial (mean, sd)");
        PascalDistribution np = new PascalDistribution(3, 0.4);
        chiSquare(d[index(c, "np")], 0, 150, np::probability, "negbinomial (size, p)");
        chiSquare(d[index(c, "tp")], 2, 9, po::probability, "poisson on [2, 9]");
        chiSquare(d[index(c, "bo")], 0, 1, k -> k == 1 ? 0.2 : 0.8, "bernoulli");
        chiSquare(d[index(c, "ca")], 0, 2, k -> new double[] {1, 2, 5}[k] / 8, "categorical levels");
        long from = LocalDate.parse("2026-03-01").toEpochDay();
        long to = LocalDate.parse("2026-05-31").toEpochDay();
        double[] days = d[index(c, "da")].clone();
        for (int i = 0; i < N; i++) {
            days[i] -= from;
        }
        chiSquare(days, 0, (int) (to - from), k -> 1.0, "date (uniform over days)");
        long t0 = Instant.parse("2026-05-01T00:00:00Z").getEpochSecond();
        long t1 = Instant.parse("2026-05-31T23:59:59Z").getEpochSecond();
        double[] ts = d[index(c, "ts")];
        for (double v : ts) {
            assertTrue(v == Math.rint(v) && v >= t0 && v <= t1, "timestamp outside the range: " + v);
        }
        // whole seconds, uniform: the exact discrete CDF (⌊x⌋ − t0 + 1)/(t1 − t0 + 1)
        ks(ts, v -> Math.min(1, Math.max(0, (Math.floor(v) - t0 + 1) / (t1 - t0 + 1.0))), "timestamp");
    }

    @Test
    void writtenCsvHasTheDistributionsAndTheirTextForms(@TempDir Path out) throws Exception {
        String spec = "dataset: bakery-tills\nrows: " + N + "\nseed: 31337\ncolumns:\n"
                + "  loaf: {dist: categorical, levels: [rye, spelt, oat, \"seeded, dark\"]}\n"
                + "  member: {dist: bernoulli, p: 0.35}\n"
                + "  baked_on: {dist: date, from: 2026-02-01, to: 2026-02-28}\n"
                + "  sold_at: {dist: timestamp, from: 2026-02-01T06:00:00Z, to: 2026-02-01T18:00:00Z}\n"
                + "  loaves: {dist: negbinomial, size: 2, p: 0.5, max: 12}\n"
                + "correlation:\n  measure: kendall\n  pairs:\n    member ~ loaves: 0.3\n    baked_on ~ sold_at: -0.2\n";
        Engine engine = Engine.create(Overrides.none());
        CompiledSpec c = engine.compile("bakery-tills.yaml", spec.getBytes(StandardCharsets.UTF_8), "");
        engine.generate(c, out);
        Map<String, Integer> loaf = new HashMap<>();
        double[] member = new double[N];
        double[] day = new double[N];
        double[] second = new double[N];
        double[] loaves = new double[N];
        long d0 = LocalDate.parse("2026-02-01").toEpochDay();
        long s0 = Instant.parse("2026-02-01T06:00:00Z").getEpochSecond();
        int n = 0;
        try (Reader reader = Files.newBufferedReader(out.resolve("bakery-tills.csv"), StandardCharsets.UTF_8)) {
            // commons-csv (RFC 4180) reads the file independently of the project's writer
            for (CSVRecord rec : CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).build().parse(reader)) {
                loaf.merge(rec.get("loaf"), 1, Integer::sum);
                String m = rec.get("member");
                assertTrue(m.equals("true") || m.equals("false"), m);
                member[n] = m.equals("true") ? 1 : 0;
                day[n] = LocalDate.parse(rec.get("baked_on")).toEpochDay() - d0;
                String ts = rec.get("sold_at");
                assertTrue(ts.matches("2026-02-01T\\d\\d:\\d\\d:\\d\\dZ"), ts);
                second[n] = Instant.parse(ts).getEpochSecond() - s0;
                loaves[n] = Double.parseDouble(rec.get("loaves"));
                n++;
            }
        }
        assertEquals(N, n);
        assertEquals(java.util.Set.of("rye", "spelt", "oat", "seeded, dark"), loaf.keySet());
        String[] labels = {"rye", "spelt", "oat", "seeded, dark"};
        double[] levels = new double[N];
        int i = 0;
        for (String label : labels) {
            for (int k = 0; k < loaf.get(label); k++) {
                levels[i++] = Arrays.asList(labels).indexOf(label);
            }
        }
        chiSquare(levels, 0, 3, k -> 0.25, "categorical list (equal weights)");
        chiSquare(member, 0, 1, k -> k == 1 ? 0.35 : 0.65, "bernoulli");
        chiSquare(day, 0, 27, k -> 1.0, "date");
        ks(second, v -> Math.min(1, Math.max(0, (Math.floor(v) + 1) / 43_201.0)), "timestamp");
        PascalDistribution nb = new PascalDistribution(2, 0.5);
        chiSquare(loaves, 0, 12, nb::probability, "negbinomial truncated to max 12");
    }
}
