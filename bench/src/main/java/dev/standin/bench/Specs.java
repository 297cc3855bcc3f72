package dev.standin.bench;

import dev.standin.engine.CompiledSpec;
import dev.standin.engine.Engine;
import dev.standin.spec.Overrides;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/** Specs the benchmarks share: the reference job and generated wide specs (an invented scenario: a sensor hall). */
final class Specs {

    private Specs() {
    }

    /** bench/mixed-1m.yaml from the working directory (the repository root or bench/), or its text built in. */
    static String mixed() throws Exception {
        for (Path p : new Path[] {Path.of("bench/mixed-1m.yaml"), Path.of("mixed-1m.yaml"), Path.of("../bench/mixed-1m.yaml")}) {
            if (Files.isRegularFile(p)) {
                return Files.readString(p, StandardCharsets.UTF_8);
            }
        }
        throw new IllegalStateException("run from the repository root: bench/mixed-1m.yaml not found");
    }

    /**
     * k normal columns under a latent correlation matrix 0.5<sup>|i − j|</sup> (AR(1), positive definite
     * for any k), written out in full so no completion or repair runs: the factor's cost alone.
     */
    static String normals(int k, long rows) {
        return matrixSpec("dataset: sensor-hall\nrows: " + rows + "\nseed: 77\n", "{dist: normal, mean: 20, sd: 2, decimals: 3}",
                k, "  measure: latent\n", (i, j) -> {
                    int d = Math.abs(i - j);
                    return d == 0 ? "1" : d > 30 ? "0" : Double.toString(Math.pow(0.5, d));
                });
    }

    /**
     * k uniform columns with a Spearman target of 0.3 between neighbours and 0.09 two apart, the rest
     * 0, given in full: the Spearman → latent map and the check and repair of the matrix (not the
     * factor alone).
     */
    static String spearmanBand(int k) {
        return matrixSpec("dataset: sensor-hall\nrows: 1000\nseed: 78\n", "{dist: uniform, min: 0, max: 1, decimals: 3}",
                k, "  measure: spearman\n", (i, j) -> {
                    int d = Math.abs(i - j);
                    return d == 0 ? "1" : d == 1 ? "0.3" : d == 2 ? "0.09" : "0";
                });
    }

    /**
     * A k × k target as people write one by hand: a 5-factor correlation matrix (loadings of length
     * √0.8) plus uniform ±0.1 noise on every pair, rounded to 2 decimals. Not positive semidefinite
     * for k beyond a few dozen, so it needs the repair.
     */
    static double[][] perturbedFactor(int k, long seed) {
        java.util.SplittableRandom random = new java.util.SplittableRandom(seed);
        double[][] loadings = new double[k][5];
        for (int i = 0; i < k; i++) {
            double norm = 0;
            for (int f = 0; f < 5; f++) {
                loadings[i][f] = random.nextDouble(-1, 1);
                norm += loadings[i][f] * loadings[i][f];
            }
            for (int f = 0; f < 5; f++) {
                loadings[i][f] *= Math.sqrt(0.8 / norm);
            }
        }
        double[][] a = new double[k][k];
        for (int i = 0; i < k; i++) {
            a[i][i] = 1;
            for (int j = 0; j < i; j++) {
                double v = 0;
                for (int f = 0; f < 5; f++) {
                    v += loadings[i][f] * loadings[j][f];
                }
                v = Math.max(-1, Math.min(1, Math.round((v + random.nextDouble(-0.1, 0.1)) * 100) / 100.0));
                a[i][j] = v;
                a[j][i] = v;
            }
        }
        return a;
    }

    /** k latent normal columns with the given full matrix (no marginal maps): the check and repair of the matrix. */
    static String latentSpec(double[][] matrix) {
        return matrixSpec("dataset: sensor-hall\nrows: 1000\nseed: 79\n", "{dist: normal, mean: 0, sd: 1, decimals: 3}",
                matrix.length, "  measure: latent\n  max-change: 1\n", (i, j) -> i.equals(j) ? "1" : Double.toString(matrix[i][j]));
    }

    /** A spec of k columns s0 .. s(k−1), all of the given definition, with the full matrix written out cell by cell. */
    private static String matrixSpec(String head, String column, int k, String measure,
                                      java.util.function.BiFunction<Integer, Integer, String> cell) {
        StringBuilder sb = new StringBuilder(head).append("columns:\n");
        for (int i = 0; i < k; i++) {
            sb.append("  s").append(i).append(": ").append(column).append('\n');
        }
        sb.append("correlation:\n").append(measure).append("  order: [");
        for (int i = 0; i < k; i++) {
            sb.append(i > 0 ? ", " : "").append('s').append(i);
        }
        sb.append("]\n  matrix:\n");
        for (int i = 0; i < k; i++) {
            sb.append("    - [");
            for (int j = 0; j < k; j++) {
                sb.append(j > 0 ? "," : "").append(cell.apply(i, j));
            }
            sb.append("]\n");
        }
        return sb.toString();
    }

    static CompiledSpec compile(String yaml) throws Exception {
        return Engine.create(Overrides.none()).withoutHtmlReport().compile("bench.yaml", yaml.getBytes(StandardCharsets.UTF_8), "");
    }

    static CompiledSpec compile(String yaml, long rows) throws Exception {
        return Engine.create(new Overrides(null, rows, null)).withoutHtmlReport()
                .compile("bench.yaml", yaml.getBytes(StandardCharsets.UTF_8), "");
    }
}
