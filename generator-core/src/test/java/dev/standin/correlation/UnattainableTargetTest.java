package dev.standin.correlation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.standin.engine.CompiledSpec;
import dev.standin.engine.Engine;
import dev.standin.sampling.RowSampler;
import dev.standin.spec.Overrides;
import dev.standin.spec.SpecException;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

/** Targets a pair's marginals cannot reach, and pairs with a categorical column, through Engine.compile. */
class UnattainableTargetTest {

    private final Engine engine = Engine.create(Overrides.none());

    private CompiledSpec compile(String yaml) throws SpecException {
        return engine.compile("harbour.yaml", yaml.getBytes(StandardCharsets.UTF_8), "");
    }

    private String onlyProblem(String yaml) {
        SpecException e = assertThrows(SpecException.class, () -> compile(yaml));
        assertEquals(1, e.problems().size(), e.getMessage());
        return e.problems().get(0).toString();
    }

    @Test
    void pearsonTargetBeyondTheLognormalRangeNamesBothColumnsAndTheRange() {
        // lognormals with σ = 1 and 2 reach only [−0.0901, 0.6658] (Embrechts, McNeil and Straumann 2002;
        // see NortaClosedFormTest), so 0.9 is unattainable; the message points at the pair's value
        String yaml = "dataset: harbour\nrows: 10\nseed: 1\ncolumns:\n"
                + "  cargo_t: {dist: lognormal, meanlog: 0, sdlog: 1}\n"
                + "  wait_h: {dist: lognormal, meanlog: 1, sdlog: 2}\n"
                + "correlation:\n  measure: pearson\n  pairs:\n    cargo_t ~ wait_h: 0.9\n";
        assertEquals("harbour.yaml:10:23: pearson 0.9 is unattainable for cargo_t ~ wait_h with these marginals:"
                + " attainable [-0.090, 0.666]; consider measure: spearman", onlyProblem(yaml));
    }

    @Test
    void kendallTargetBeyondTwoBernoullisRangeIsRefused() {
        // for two Bernoulli columns τ_b is the φ coefficient (DiscreteTargetsExactTest), whose range is set
        // by the Fréchet bounds of the 2×2 table: p = 0.2, q = 0.7, sd = √(0.2·0.8·0.7·0.3) = 0.183303:
        // [(0 − 0.14)/sd, (0.2 − 0.14)/sd] = [−0.763763, 0.327327] (closed form)
        String yaml = "dataset: harbour\nrows: 10\nseed: 1\ncolumns:\n"
                + "  late: {dist: bernoulli, p: 0.2}\n"
                + "  rain: {dist: bernoulli, p: 0.7}\n"
                + "correlation:\n  measure: kendall\n  pairs:\n    late ~ rain: 0.5\n";
        assertEquals("harbour.yaml:10:18: kendall 0.5 is unattainable for late ~ rain with these marginals:"
                + " attainable [-0.764, 0.327]", onlyProblem(yaml));
    }

    @Test
    void everyUnattainablePairIsReportedAtOnce() {
        String yaml = "dataset: harbour\nrows: 10\nseed: 1\ncolumns:\n"
                + "  a: {dist: exponential, rate: 1}\n"
                + "  b: {dist: exponential, rate: 2}\n"
                + "  c: {dist: normal, mean: 0, sd: 1}\n"
                + "correlation:\n  measure: pearson\n  pairs:\n    a ~ b: -0.8\n    a ~ c: 0.95\n";
        SpecException e = assertThrows(SpecException.class, () -> compile(yaml));
        assertEquals(2, e.problems().size(), e.getMessage());
        // Exp ~ Exp reaches down to 1 − π²/6 = −0.645 (from memory); Exp ~ normal: ±E[Z g(Z)]/sd g with
        // g(z) = −ln Φ(−z), whose value 0.903 is read off NortaPearson here (the check is the wording)
        String all = e.getMessage();
        assertTrue(all.contains("pearson -0.8 is unattainable for a ~ b with these marginals: attainable [-0.645, 1.000]"), all);
        assertTrue(all.contains("pearson 0.95 is unattainable for a ~ c with these marginals: attainable [-0.903, 0.903]"), all);
    }

    @Test
    void categoricalPairsAreOnTheLatentScaleUnderEveryMeasure() throws Exception {
        for (String measure : new String[] {"pearson", "spearman", "kendall", "latent"}) {
            // 0.95 against a lognormal would be unattainable as a Pearson value correlation; with a
            // categorical column the number is the latent correlation itself, so it compiles unchanged
            String yaml = "dataset: harbour\nrows: 20000\nseed: 5\ncolumns:\n"
                    + "  berth: {dist: categorical, levels: [north, east, south]}\n"
                    + "  fee: {dist: lognormal, meanlog: 3, sdlog: 1.5}\n"
                    + "correlation:\n  measure: " + measure + "\n  pairs:\n    berth ~ fee: 0.95\n";
            CompiledSpec c = compile(yaml);
            assertEquals(0.95, c.model().latent()[0][1], 0.0, measure);
            assertEquals(0.95, c.model().used()[0][1], 0.0, measure);
            // levels follow their written order along the latent: mean log-fee rises north < east < south
            RowSampler s = new RowSampler(c.spec(), c.model());
            RowSampler.Scratch scratch = s.scratch();
            double[] v = new double[2];
            boolean[] missing = new boolean[2];
            double[] sum = new double[3];
            int[] count = new int[3];
            for (int row = 0; row < 20_000; row++) {
                s.draw(row, v, missing, scratch);
                sum[(int) v[0]] += Math.log(v[1]);
                count[(int) v[0]]++;
            }
            // with latent 0.95 and equal thirds, E[ln fee | level] = 3 + 1.5·0.95·E[Z | Z in third]
            // = 3 ∓ 1.5·0.95·1.0911 (E[Z | Z > Φ^-1(2/3)] = φ(0.4307)/(1/3) = 1.0911; closed form)
            // and 3 in the middle; the sample means are within 0.05 of these (sd of a mean ≈ 0.6/√6667 =
            // 0.007, so 0.05 is 7 SE)
            double[] expected = {3 - 1.5 * 0.95 * 1.0911, 3, 3 + 1.5 * 0.95 * 1.0911};
            for (int k = 0; k < 3; k++) {
                assertEquals(expected[k], sum[k] / count[k], 0.05, measure + " level " + k);
            }
        }
    }
}
