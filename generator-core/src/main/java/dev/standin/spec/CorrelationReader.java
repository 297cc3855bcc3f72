package dev.standin.spec;

import dev.standin.correlation.RepairPolicy;
import dev.standin.spec.CorrelationSpec.Measure;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;

/**
 * Reads the {@code correlation:} block, written either as {@code pairs:} ("a ~ b": value) or as
 * {@code order:} with a full {@code matrix:}, and checks everything that does not need linear
 * algebra: names, sizes, symmetry, diagonal and range. Positive definiteness is checked later, by
 * the factorisation.
 */
final class CorrelationReader {

    private static final List<String> KEYS = List.of("measure", "pairs", "order", "matrix", "repair", "max-change");

    private CorrelationReader() {
    }

    static CorrelationSpec read(String file, Problems problems, Node node, List<ColumnSpec> columns) {
        YamlMap m = YamlMap.of(file, problems, node, "correlation");
        if (m == null) {
            return null;
        }
        int before = problems.size();
        m.allowOnly("correlation", KEYS);
        Measure measure = Measure.PEARSON;
        String word = m.string("measure");
        if (word != null) {
            measure = null;
            for (Measure candidate : Measure.values()) {
                if (candidate.word().equals(word)) {
                    measure = candidate;
                }
            }
            if (measure == null) {
                problems.add(m.valueMark("measure"), "measure must be one of " + Measure.choices() + ": " + word);
                return null;
            }
        }
        RepairPolicy repair = RepairPolicy.NEAREST;
        String repairWord = m.string("repair");
        if (repairWord != null) {
            repair = RepairPolicy.parse(repairWord);
            if (repair == null) {
                problems.add(m.valueMark("repair"), "repair must be one of " + RepairPolicy.choices() + ": " + repairWord);
                return null;
            }
        }
        double maxChange = CorrelationSpec.DEFAULT_MAX_CHANGE;
        YamlMap.Num mc = m.number("max-change");
        if (mc != null) {
            if (!(mc.value() >= 0 && mc.value() <= 2)) {
                problems.add(mc.mark(), "max-change must be a number from 0 to 2: " + mc.text());
                return null;
            }
            maxChange = mc.value();
        }
        boolean pairs = m.has("pairs");
        boolean matrix = m.has("matrix") || m.has("order");
        if (pairs == matrix) {
            problems.add(m.mark(), pairs ? "correlation takes either pairs or order + matrix, not both"
                    : "correlation needs pairs (\"a ~ b\": value) or order + matrix");
            return null;
        }
        Map<String, ColumnSpec> byName = new LinkedHashMap<>();
        for (ColumnSpec c : columns) {
            byName.put(c.name(), c);
        }
        CorrelationSpec spec = pairs ? readPairs(m, measure, byName) : readMatrix(m, measure, byName);
        if (spec == null || problems.size() > before) {
            return null;
        }
        spec = new CorrelationSpec(spec.measure(), spec.mark(), spec.order(), spec.requested(), spec.fromPairs(),
                spec.entryMarks(), repair, maxChange);
        checkMeasure(m, spec, byName);
        return problems.size() > before ? null : spec;
    }

    private static CorrelationSpec readPairs(YamlMap m, Measure measure, Map<String, ColumnSpec> byName) {
        Problems problems = m.problems();
        YamlMap pairs = YamlMap.of(m.file(), problems, m.get("pairs"), "pairs");
        if (pairs == null) {
            return null;
        }
        record Pair(String a, String b, YamlMap.Num value) {
        }
        List<Pair> read = new ArrayList<>();
        Map<String, Pair> seen = new HashMap<>();
        for (Map.Entry<String, NodeTuple> e : pairs.entries().entrySet()) {
            Mark keyMark = pairs.mark(e.getValue().getKeyNode());
            String[] parts = e.getKey().split("~", -1);
            if (parts.length != 2 || parts[0].isBlank() || parts[1].isBlank()) {
                problems.add(keyMark, "a pair must be written \"a ~ b\" with two column names: '" + Names.shown(e.getKey()) + "'");
                continue;
            }
            String a = parts[0].strip();
            String b = parts[1].strip();
            boolean known = true;
            for (String name : new String[] {a, b}) {
                if (!byName.containsKey(name)) {
                    problems.add(keyMark, "pair '" + Names.shown(e.getKey()) + "' names unknown column '" + Names.shown(name) + "'"
                            + (problems.full() ? "" : Names.suggestion(name, byName.keySet())));
                    known = false;
                } else if (byName.get(name) instanceof ColumnSpec.Sequence) {
                    problems.add(keyMark, "pair '" + e.getKey() + "' names sequence column '" + name
                            + "'; a sequence is not random and cannot be correlated");
                    known = false;
                }
            }
            if (a.equals(b)) {
                problems.add(keyMark, "pair '" + e.getKey() + "' pairs a column with itself; its correlation is always 1");
                continue;
            }
            YamlMap.Num value = pairs.number("pair '" + e.getKey() + "'", e.getValue().getValueNode());
            if (!known || value == null) {
                continue;
            }
            String key = a.compareTo(b) < 0 ? a + "\u0000" + b : b + "\u0000" + a;
            Pair earlier = seen.get(key);
            if (earlier != null) {
                Mark first = earlier.value().mark();
                String how = earlier.value().exact().compareTo(value.exact()) == 0 ? "again" : "with a different value ("
                        + earlier.value().text() + " then " + value.text() + ")";
                problems.add(keyMark, "pair '" + a + " ~ " + b + "' is given " + how + "; first at line " + first.line()
                        + ", column " + first.column());
                continue;
            }
            Pair p = new Pair(a, b, value);
            seen.put(key, p);
            read.add(p);
        }
        if (read.isEmpty()) {
            if (problems.isEmpty()) {
                problems.add(pairs.mark(), "pairs must give at least one pair \"a ~ b\": value");
            }
            return null;
        }
        java.util.Set<String> named = new java.util.HashSet<>();
        for (Pair p : read) {
            named.add(p.a());
            named.add(p.b());
        }
        if (named.size() > SpecParser.MAX_CORRELATED) {
            problems.add(pairs.mark(), "pairs must involve at most " + SpecParser.MAX_CORRELATED + " columns: " + named.size());
            return null;
        }
        List<String> order = new ArrayList<>();
        for (String name : byName.keySet()) {
            if (named.contains(name)) {
                order.add(name);
            }
        }
        int k = order.size();
        Map<String, Integer> index = new HashMap<>();
        for (int i = 0; i < k; i++) {
            index.put(order.get(i), i);
        }
        double[][] values = new double[k][k];
        Mark[][] marks = new Mark[k][k];
        for (double[] row : values) {
            Arrays.fill(row, Double.NaN);
        }
        for (Pair p : read) {
            int i = index.get(p.a());
            int j = index.get(p.b());
            values[i][j] = p.value().value();
            values[j][i] = p.value().value();
            marks[i][j] = p.value().mark();
            marks[j][i] = p.value().mark();
        }
        for (int i = 0; i < k; i++) {
            values[i][i] = diagonal(measure, byName.get(order.get(i)));
        }
        return new CorrelationSpec(measure, m.valueMark("pairs"), order, values, true, marks, RepairPolicy.NEAREST,
                CorrelationSpec.DEFAULT_MAX_CHANGE);
    }

    /** The diagonal implied for pairs: 1 for a correlation, the variance sd² for a covariance. */
    private static double diagonal(Measure measure, ColumnSpec c) {
        if (measure == Measure.COVARIANCE && c instanceof ColumnSpec.Random r) {
            double sd = r.marginal().sd();
            return sd * sd;
        }
        return 1.0;
    }

    private static CorrelationSpec readMatrix(YamlMap m, Measure measure, Map<String, ColumnSpec> byName) {
        Problems problems = m.problems();
        if (!m.require("correlation with a matrix", "order") | !m.require("correlation with a matrix", "matrix")) {
            return null;
        }
        List<Node> orderNodes = m.list("order");
        List<Node> rowNodes = m.list("matrix");
        if (orderNodes == null || rowNodes == null) {
            return null;
        }
        if (orderNodes.size() > SpecParser.MAX_CORRELATED) {
            problems.add(m.valueMark("order"), "order must name at most " + SpecParser.MAX_CORRELATED + " columns: "
                    + orderNodes.size());
            return null;
        }
        List<String> order = new ArrayList<>();
        boolean ok = true;
        for (Node n : orderNodes) {
            if (!(n instanceof ScalarNode)) {
                problems.add(m.mark(n), "order must list column names");
                ok = false;
                continue;
            }
            String name = ((ScalarNode) n).getValue();
            if (!byName.containsKey(name)) {
                problems.add(m.mark(n), "order names unknown column '" + Names.shown(name) + "'"
                        + (problems.full() ? "" : Names.suggestion(name, byName.keySet())));
                ok = false;
            } else if (byName.get(name) instanceof ColumnSpec.Sequence) {
                problems.add(m.mark(n), "order names sequence column '" + name + "'; a sequence cannot be correlated");
                ok = false;
            } else if (order.contains(name)) {
                problems.add(m.mark(n), "order names column '" + name + "' twice");
                ok = false;
            }
            order.add(name);
        }
        if (!ok) {
            return null;
        }
        int k = order.size();
        if (k < 2) {
            problems.add(m.valueMark("order"), "order must name at least two columns");
            return null;
        }
        if (rowNodes.size() != k) {
            problems.add(m.valueMark("matrix"), "matrix has " + rowNodes.size() + " rows but order names " + k
                    + " columns; it must be " + k + " × " + k);
            return null;
        }
        double[][] values = new double[k][k];
        Mark[][] marks = new Mark[k][k];
        for (int i = 0; i < k; i++) {
            Node rowNode = rowNodes.get(i);
            if (!(rowNode instanceof SequenceNode)) {
                problems.add(m.mark(rowNode), "matrix row " + (i + 1) + " must be a list of " + k + " numbers");
                return null;
            }
            List<Node> cells = ((SequenceNode) rowNode).getValue();
            if (cells.size() != k) {
                problems.add(m.mark(rowNode), "matrix row " + (i + 1) + " has " + cells.size() + " entries; it must have " + k);
                return null;
            }
            for (int j = 0; j < k; j++) {
                YamlMap.Num v = m.number("matrix entry [" + (i + 1) + "][" + (j + 1) + "]", cells.get(j));
                if (v == null) {
                    return null;
                }
                values[i][j] = v.value();
                marks[i][j] = v.mark();
            }
        }
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < i; j++) {
                if (values[i][j] != values[j][i]) {
                    problems.add(marks[i][j], "matrix is not symmetric: [" + (i + 1) + "][" + (j + 1) + "] ("
                            + order.get(i) + " ~ " + order.get(j) + ") is " + text(values[i][j]) + " but ["
                            + (j + 1) + "][" + (i + 1) + "] is " + text(values[j][i]));
                    return null;
                }
            }
        }
        return new CorrelationSpec(measure, m.valueMark("matrix"), order, values, false, marks, RepairPolicy.NEAREST,
                CorrelationSpec.DEFAULT_MAX_CHANGE);
    }

    private static void checkMeasure(YamlMap m, CorrelationSpec spec, Map<String, ColumnSpec> byName) {
        Problems problems = m.problems();
        int k = spec.size();
        double[][] v = spec.requested();
        Mark[][] marks = spec.entryMarks();
        if (spec.measure() == Measure.COVARIANCE) {
            for (String name : spec.order()) {
                ColumnSpec.Random r = (ColumnSpec.Random) byName.get(name);
                if (!r.marginal().isLinearInLatent()) {
                    problems.add(r.mark(), "measure covariance needs normal columns without min or max; column '" + name
                            + "' is " + r.dist() + (r.marginal().family().equals("normal") ? " with bounds" : ""));
                    return;
                }
            }
            for (int i = 0; i < k; i++) {
                if (!(v[i][i] > 0)) {
                    problems.add(marks[i][i], "covariance diagonal [" + (i + 1) + "][" + (i + 1) + "] (variance of "
                            + spec.order().get(i) + ") must be > 0: " + text(v[i][i]));
                    return;
                }
                ColumnSpec.Random r = (ColumnSpec.Random) byName.get(spec.order().get(i));
                double sd = r.marginal().sd();
                if (!spec.fromPairs() && Math.abs(v[i][i] - sd * sd) > 1e-9 * sd * sd) {
                    problems.add(marks[i][i], "covariance diagonal [" + (i + 1) + "][" + (i + 1) + "] is the variance of "
                            + spec.order().get(i) + " and must equal its sd² = " + text(sd * sd) + ": " + text(v[i][i]));
                    return;
                }
            }
            for (int i = 0; i < k; i++) {
                for (int j = 0; j < i; j++) {
                    double bound = Math.sqrt(v[i][i] * v[j][j]);
                    if (!Double.isNaN(v[i][j]) && Math.abs(v[i][j]) > bound * (1 + 1e-12)) {
                        problems.add(marks[i][j], "covariance of " + spec.order().get(i) + " ~ " + spec.order().get(j)
                                + " must be within ±sd·sd = ±" + text(bound) + ": " + text(v[i][j]));
                    }
                }
            }
            return;
        }
        for (int i = 0; i < k; i++) {
            if (v[i][i] != 1.0) {
                problems.add(marks[i][i], "correlation matrix diagonal must be 1: [" + (i + 1) + "][" + (i + 1) + "] ("
                        + spec.order().get(i) + ") is " + text(v[i][i]));
                return;
            }
        }
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < i; j++) {
                if (!Double.isNaN(v[i][j]) && !(Math.abs(v[i][j]) <= 1.0)) {
                    problems.add(marks[i][j], "correlation of " + spec.order().get(i) + " ~ " + spec.order().get(j)
                            + " must be in [-1, 1]: " + text(v[i][j]));
                }
            }
        }
    }

    private static String text(double d) {
        return dev.standin.output.NumberText.shortest(d);
    }
}
