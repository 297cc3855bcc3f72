package dev.standin.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.standin.engine.CompiledSpec;
import dev.standin.engine.Engine;
import dev.standin.spec.Overrides;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;
import org.apache.commons.math3.stat.correlation.SpearmansCorrelation;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Fisher's iris data (R. A. Fisher, "The use of multiple measurements in taxonomic problems",
 * Annals of Eugenics 7 (1936) 179-188; public domain), copied from the Debian package python3-sklearn
 * 1.2.1+dfsg-1, /usr/lib/python3/dist-packages/sklearn/datasets/data/iris.csv, with a header row
 * and species names instead of codes (see src/test/resources/dev/standin/fit/iris.SOURCE.md).
 */
class IrisFitTest {

    static final List<String> NUMERIC = List.of("sepal_length", "sepal_width", "petal_length", "petal_width");

    static CsvTable iris;
    static FitResult fit;

    @BeforeAll
    static void fitIris() throws Exception {
        iris = CsvReader.read(Path.of("src/test/resources/dev/standin/fit/iris.csv"), "iris.csv");
        fit = Fitter.fit(iris, FitOptions.defaults());
    }

    @Test
    void theDataAreReadAsPublished() {
        assertEquals(150, iris.size());
        assertEquals(150, fit.sourceRows());
        // the means of R's datasets::iris, summary(iris): 5.843, 3.057, 3.758, 1.199 (from memory)
        double[] published = {5.843, 3.057, 3.758, 1.199};
        for (int i = 0; i < 4; i++) {
            ColumnFit c = fit.column(NUMERIC.get(i));
            assertEquals(ColumnKind.DECIMAL, c.kind());
            assertEquals(published[i], Math.round(c.mean() * 1000) / 1000.0, 0.0, c.name());
        }
        ColumnFit species = fit.column("species");
        assertEquals("categorical", species.family());
        assertEquals(List.of("setosa", "versicolor", "virginica"), species.levels());
    }

    @Test
    void eachFittedMarginalHasThePublishedMeanWithinTwoStandardErrors() {
        double[] published = {5.843, 3.057, 3.758, 1.199};
        // the sample sds of iris (R: sapply(iris[1:4], sd): 0.828, 0.436, 1.765, 0.762; from memory)
        double[] sds = {0.828, 0.436, 1.765, 0.762};
        for (int i = 0; i < 4; i++) {
            ColumnFit c = fit.column(NUMERIC.get(i));
            double se = sds[i] / Math.sqrt(150);
            assertTrue(Math.abs(c.marginal().mean() - published[i]) <= 2 * se,
                    c.name() + ": " + c.family() + " mean " + c.marginal().mean());
            assertEquals(1, c.yaml().size());
            assertTrue(c.yaml().get(0).contains("decimals: 1"), c.yaml().get(0));
        }
    }

    @Test
    void ourSpearmanEqualsCommonsMath() {
        double[][] columns = numericColumns(iris);
        SpearmansCorrelation reference = new SpearmansCorrelation();
        for (int i = 0; i < 4; i++) {
            for (int j = 0; j < i; j++) {
                assertEquals(reference.correlation(columns[i], columns[j]), Dependence.spearman(columns[i], columns[j]), 1e-12);
            }
        }
    }

    /**
     * 5000 rows generated from the fitted spec have the real Spearman matrix (commons-math3's
     * SpearmansCorrelation on both tables) within 4 standard errors of a Spearman estimate from 5000
     * rows (Fisher z variance 1.06/(n − 3); Fieller, Hartley and Pearson 1957; from memory), plus the
     * change the fit made to keep the matrix valid, plus 0.02 for the ties that rounding to one
     * decimal adds (an allowance; iris's petal width has 22 distinct values).
     */
    @Test
    void theSyntheticSpearmanMatrixIsCloseToTheRealOne(@TempDir Path dir) throws Exception {
        Engine engine = Engine.create(new Overrides(null, 5000L, null)).withoutHtmlReport();
        CompiledSpec c = engine.compile("iris.yaml", fit.specText().getBytes(StandardCharsets.UTF_8), "");
        assertEquals(List.of(), c.warnings());
        engine.generate(c, dir);
        CsvTable synthetic = CsvReader.read(dir.resolve(c.dataFile()), "iris-synthetic.csv");
        assertEquals(5000, synthetic.size());
        double[][] real = numericColumns(iris);
        double[][] syn = numericColumns(synthetic);
        SpearmansCorrelation sc = new SpearmansCorrelation();
        double allowance = fit.dependence().repairChange() + 0.02;
        for (int i = 0; i < 4; i++) {
            for (int j = 0; j < i; j++) {
                double r = sc.correlation(real[i], real[j]);
                double s = sc.correlation(syn[i], syn[j]);
                double se = (1 - r * r) * Math.sqrt(1.06 / (5000 - 3));
                assertTrue(Math.abs(s - r) <= 4 * se + allowance, NUMERIC.get(i) + " ~ " + NUMERIC.get(j) + ": synthetic "
                        + s + ", real " + r);
            }
        }
        // species in the synthetic rows: a third each (binomial sd sqrt(n/9·2/3) ≈ 33 rows; 4 sd = 133)
        int species = synthetic.column("species");
        for (String level : List.of("setosa", "versicolor", "virginica")) {
            long count = synthetic.rows().stream().filter(row -> row[species].equals(level)).count();
            assertTrue(Math.abs(count - 5000 / 3.0) <= 133, level + ": " + count);
        }
    }

    @Test
    void noRealExtremeIsCopiedIntoAQuantileTable() {
        for (String name : NUMERIC) {
            ColumnFit c = fit.column(name);
            if (!c.family().equals("quantiles")) {
                continue;
            }
            double[] sorted = ColumnData.of(iris, iris.column(name)).sortedPresent();
            String yaml = c.yaml().get(0);
            String points = yaml.substring(yaml.indexOf("points: {") + 9, yaml.indexOf('}'));
            String[] entries = points.split(", ");
            double first = Double.parseDouble(entries[0].split(": ")[1]);
            double last = Double.parseDouble(entries[entries.length - 1].split(": ")[1]);
            assertFalse(first == sorted[0], name + " lower end is the real minimum " + first);
            assertFalse(last == sorted[sorted.length - 1], name + " upper end is the real maximum " + last);
            assertEquals(11, entries.length, "deciles plus two ends: " + points);
        }
    }

    static double[][] numericColumns(CsvTable t) {
        double[][] out = new double[4][t.size()];
        for (int i = 0; i < 4; i++) {
            int col = t.column(NUMERIC.get(i));
            for (int r = 0; r < t.size(); r++) {
                out[i][r] = Double.parseDouble(t.rows().get(r)[col]);
            }
        }
        return out;
    }
}
