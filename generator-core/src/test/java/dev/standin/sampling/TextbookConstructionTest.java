package dev.standin.sampling;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import dev.standin.engine.CompiledSpec;
import dev.standin.engine.Engine;
import dev.standin.random.NormalQuantile;
import dev.standin.random.RandomStreams;
import dev.standin.spec.Overrides;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Two correlated normal columns must be exactly the textbook bivariate normal construction
 * X = μx + σx Z1, Y = μy + σy(ρ Z1 + √(1 − ρ²) Z2) with Z1, Z2 independent standard normals (M. E.
 * Johnson, <i>Multivariate Statistical Simulation</i>, Wiley 1987, ch. 4; the Cholesky factor of
 * [[1, ρ], [ρ, 1]]). Z1 and Z2 are Φ^-1 of the two columns' own uniforms, the first in name order
 * being Z1, as the sampler's javadoc states; here they are recomputed from {@link RandomStreams}.
 */
class TextbookConstructionTest {

    private static final long SEED = 987654321L;

    private static String spec(String rho, long rows) {
        // vent_temp is written first but sorts after air_humidity, so the construction also checks
        // that the factor is taken in name order, not spec order
        return "dataset: greenhouse-climate\n"
                + "rows: " + rows + "\n"
                + "seed: " + SEED + "\n"
                + "columns:\n"
                + "  tray: {dist: sequence, start: 1}\n"
                + "  vent_temp: {dist: normal, mean: 21.5, sd: 2.5}\n"
                + "  air_humidity: {dist: normal, mean: 68, sd: 7}\n"
                + "  soil_ph: {dist: normal, mean: 6.4, sd: 0.3}\n"
                + "correlation:\n"
                + "  pairs:\n"
                + "    vent_temp ~ air_humidity: " + rho + "\n";
    }

    private static CompiledSpec compile(String yaml) throws Exception {
        return Engine.create(Overrides.none()).compile("greenhouse.yaml", yaml.getBytes(StandardCharsets.UTF_8), "");
    }

    private static double z(String column, long row) {
        return NormalQuantile.of(RandomStreams.uniform(SEED, RandomStreams.streamId(column, RandomStreams.Purpose.VALUE), row));
    }

    private static void assertClose(double expected, double actual, String what) {
        assertEquals(expected, actual, 1e-12 * Math.max(1.0, Math.abs(expected)), what);
    }

    @Test
    void valuesAreTheTextbookConstruction() throws Exception {
        for (String rhoText : new String[] {"0.4", "-0.2", "0.95", "-0.999", "0"}) {
            double rho = Double.parseDouble(rhoText);
            CompiledSpec compiled = compile(spec(rhoText, 5000));
            RowSampler sampler = new RowSampler(compiled.spec(), compiled.model());
            RowSampler.Scratch scratch = sampler.scratch();
            double[] values = new double[4];
            boolean[] missing = new boolean[4];
            for (long row = 0; row < 5000; row++) {
                sampler.draw(row, values, missing, scratch);
                double z1 = z("air_humidity", row);
                double z2 = z("vent_temp", row);
                String at = "rho " + rhoText + ", row " + row;
                assertEquals(1.0 + row, values[0], 0.0, at);
                assertClose(68 + 7 * z1, values[2], "air_humidity, " + at);
                assertClose(21.5 + 2.5 * (rho * z1 + Math.sqrt(1 - rho * rho) * z2), values[1], "vent_temp, " + at);
                // a column outside the correlation block is μ + σ Φ^-1 of its own uniform
                assertClose(6.4 + 0.3 * z("soil_ph", row), values[3], "soil_ph, " + at);
                for (boolean m : missing) {
                    assertFalse(m);
                }
            }
        }
    }

    @Test
    void writtenFileCarriesTheSameValues(@TempDir Path out) throws Exception {
        // without decimals a value is written as the shortest text that reads back as the same
        // double, so the CSV, parsed by commons-csv, must give the construction's values again
        Engine engine = Engine.create(Overrides.none());
        CompiledSpec compiled = engine.compile("greenhouse.yaml", spec("0.4", 3000).getBytes(StandardCharsets.UTF_8), "");
        engine.generate(compiled, out);
        List<CSVRecord> records;
        try (Reader in = Files.newBufferedReader(out.resolve(compiled.dataFile()), StandardCharsets.UTF_8)) {
            records = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).build().parse(in).getRecords();
        }
        assertEquals(3000, records.size());
        for (int row = 0; row < records.size(); row++) {
            CSVRecord r = records.get(row);
            double z1 = z("air_humidity", row);
            double z2 = z("vent_temp", row);
            assertEquals(String.valueOf(row + 1), r.get("tray"));
            assertClose(68 + 7 * z1, Double.parseDouble(r.get("air_humidity")), "row " + row);
            assertClose(21.5 + 2.5 * (0.4 * z1 + Math.sqrt(1 - 0.16) * z2), Double.parseDouble(r.get("vent_temp")), "row " + row);
            assertClose(6.4 + 0.3 * z("soil_ph", row), Double.parseDouble(r.get("soil_ph")), "row " + row);
        }
    }
}
