package dev.standin.engine;

import dev.standin.correlation.CorrelationRepair;
import dev.standin.marginal.DiscreteTable;
import dev.standin.marginal.ValueKind;
import dev.standin.output.Json;
import dev.standin.report.Check;
import dev.standin.report.DatasetStats;
import dev.standin.report.Moments;
import dev.standin.report.RankStatistics;
import dev.standin.sampling.LatentModel;
import dev.standin.spec.ColumnSpec;
import dev.standin.spec.CorrelationSpec;
import dev.standin.spec.Spec;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The {@code <dataset>.report.json} beside each data file: what was asked, what was written, what
 * it measures and the fidelity checks. No timestamps or absolute paths, so it is as reproducible as
 * the data.
 */
final class Report {

    private Report() {
    }

    /** The achieved correlation matrix in the spec's measure, in the model's order. */
    static double[][] achieved(CompiledSpec compiled, DatasetStats stats) {
        CorrelationSpec cs = compiled.spec().correlation();
        int k = compiled.model().order().size();
        double[][] achieved = new double[k][k];
        List<double[]> rows = stats.sample().rows();
        for (int a = 0; a < k; a++) {
            for (int b = 0; b < a; b++) {
                double v = switch (cs.measure()) {
                    case COVARIANCE -> stats.pair(a, b).covariance();
                    case PEARSON, LATENT -> stats.pair(a, b).correlation();
                    case SPEARMAN, KENDALL -> RankStatistics.correlation(cs.measure(), rows, stats.pairColumn(a),
                            stats.pairColumn(b));
                };
                achieved[a][b] = v;
                achieved[b][a] = v;
            }
            double sd = stats.moments(stats.pairColumn(a)).sd();
            achieved[a][a] = cs.measure() == CorrelationSpec.Measure.COVARIANCE ? sd * sd : 1.0;
        }
        return achieved;
    }

    /** The JSON report; {@code achieved} is {@link #achieved} (null without a correlation block). */
    static String build(CompiledSpec compiled, GenerationResult.WrittenFile data, DatasetStats stats, List<Check> checks,
                        double[][] achieved) {
        Spec spec = compiled.spec();
        Map<String, Object> root = new LinkedHashMap<>();
        Map<String, Object> tool = new LinkedHashMap<>();
        tool.put("name", ToolInfo.name());
        tool.put("version", ToolInfo.version());
        root.put("tool", tool);
        root.put("dataset", spec.dataset());
        root.put("rows", spec.rows());
        root.put("seed", spec.seed());
        Map<String, Object> specInfo = new LinkedHashMap<>();
        specInfo.put("file", spec.file());
        specInfo.put("sha256", compiled.specSha256());
        root.put("spec", specInfo);
        root.put("format", spec.output().format().word());
        Map<String, Object> file = new LinkedHashMap<>();
        file.put("path", data.path());
        file.put("bytes", data.bytes());
        file.put("sha256", data.sha256());
        root.put("files", List.of(file));

        List<Object> columns = new ArrayList<>();
        for (int i = 0; i < spec.columns().size(); i++) {
            columns.add(column(spec, i, stats));
        }
        root.put("columns", columns);

        CorrelationSpec cs = spec.correlation();
        if (cs == null) {
            root.put("correlation", null);
        } else {
            LatentModel model = compiled.model();
            Map<String, Object> corr = new LinkedHashMap<>();
            corr.put("measure", cs.measure().word());
            corr.put("order", model.order());
            corr.put("requested", cs.requested());
            corr.put("used", model.used());
            corr.put("latent", model.latent());
            corr.put("achieved", achieved);
            boolean ranks = cs.measure() == CorrelationSpec.Measure.SPEARMAN || cs.measure() == CorrelationSpec.Measure.KENDALL;
            corr.put("achievedFrom", ranks ? "seeded sample of " + stats.sample().size() + " rows" : "all rows");
            corr.put("repair", repair(model.targetRepair(), model.order(), cs.repair().word()));
            corr.put("latentRepair", model.latentRepair() == null ? null
                    : repair(model.latentRepair(), model.order(), cs.repair().word()));
            root.put("correlation", corr);
        }
        root.put("checks", checks(checks));
        return Json.write(root);
    }

    private static Map<String, Object> column(Spec spec, int i, DatasetStats stats) {
        ColumnSpec c = spec.columns().get(i);
        Moments m = stats.moments(i);
        Map<String, Object> col = new LinkedHashMap<>();
        col.put("name", c.name());
        col.put("dist", c.dist());
        Map<String, Object> target = new LinkedHashMap<>();
        boolean label = false;
        if (c instanceof ColumnSpec.Random r) {
            ValueKind kind = r.marginal().valueKind();
            label = kind == ValueKind.LABEL;
            if (kind == ValueKind.DATE || kind == ValueKind.TIMESTAMP) {
                col.put("unit", kind == ValueKind.DATE ? "days since 1970-01-01" : "seconds since 1970-01-01T00:00:00Z");
            }
            if (!label) {
                target.put("mean", r.marginal().mean());
                target.put("sd", r.marginal().sd());
            }
            target.put("nulls", r.nulls());
            if (kind == ValueKind.LABEL || kind == ValueKind.BOOLEAN) {
                DiscreteTable table = (DiscreteTable) r.marginal();
                long[] counts = stats.counts(i);
                List<Object> levels = new ArrayList<>();
                for (int level = 0; level < table.size(); level++) {
                    Map<String, Object> l = new LinkedHashMap<>();
                    l.put("label", r.marginal().label(level));
                    l.put("target", table.probability(level));
                    l.put("achieved", m.count() == 0 ? null : (double) counts[level] / m.count());
                    levels.add(l);
                }
                col.put("levels", levels);
            }
        } else {
            ColumnSpec.Sequence s = (ColumnSpec.Sequence) c;
            double n = spec.rows();
            target.put("mean", spec.rows() == 0 ? null : s.start() + s.step() * (n - 1) / 2);
            target.put("sd", spec.rows() < 2 ? null : Math.abs((double) s.step()) * StrictMath.sqrt(n * (n + 1) / 12));
            target.put("nulls", 0.0);
        }
        col.put("target", target);
        Map<String, Object> achieved = new LinkedHashMap<>();
        if (!label) {
            achieved.put("mean", m.mean());
            achieved.put("sd", m.sd());
            achieved.put("min", m.min());
            achieved.put("max", m.max());
        }
        long total = m.count() + m.missing();
        achieved.put("nulls", total == 0 ? null : (double) m.missing() / total);
        col.put("achieved", achieved);
        return col;
    }

    private static List<Object> checks(List<Check> checks) {
        List<Object> out = new ArrayList<>();
        for (Check c : checks) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("name", c.name());
            m.put("target", c.target());
            m.put("achieved", c.achieved());
            m.put("tolerance", c.tolerance());
            m.put("pass", c.pass());
            if (c.note() != null) {
                m.put("note", c.note());
            }
            out.add(m);
        }
        return out;
    }

    private static Map<String, Object> repair(CorrelationRepair.Outcome outcome, List<String> order, String policy) {
        Map<String, Object> r = new LinkedHashMap<>();
        r.put("policy", policy);
        r.put("method", outcome.method());
        r.put("iterations", outcome.iterations());
        r.put("maxChange", outcome.maxChange());
        r.put("frobenius", outcome.frobenius());
        List<Object> changed = new ArrayList<>();
        for (CorrelationRepair.Change ch : outcome.changed()) {
            if (changed.size() == 10) {
                break;
            }
            Map<String, Object> c = new LinkedHashMap<>();
            c.put("a", order.get(ch.j()));
            c.put("b", order.get(ch.i()));
            c.put("from", ch.from());
            c.put("to", ch.to());
            changed.add(c);
        }
        r.put("changed", changed);
        List<Object> completed = new ArrayList<>();
        for (CorrelationRepair.Change ch : outcome.completed()) {
            Map<String, Object> c = new LinkedHashMap<>();
            c.put("a", order.get(ch.j()));
            c.put("b", order.get(ch.i()));
            c.put("value", ch.to());
            completed.add(c);
        }
        r.put("completed", completed);
        return r;
    }
}
