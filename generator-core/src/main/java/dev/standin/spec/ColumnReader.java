package dev.standin.spec;

import dev.standin.marginal.Families;
import dev.standin.marginal.Marginal;
import dev.standin.marginal.NormalMarginal;
import dev.standin.marginal.UniformMarginal;
import dev.standin.marginal.ValueKind;
import java.time.Instant;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;

/**
 * Reads one column's mapping: {@code dist}, one of the family's parameterisations, and the keys
 * common to random families ({@code min}, {@code max}, {@code decimals}, {@code nulls}).
 */
final class ColumnReader {

    /** Digits after the decimal point: 0 .. 15. */
    static final int MAX_DECIMALS = 15;

    /** The most levels a categorical column may have. */
    static final int MAX_LEVELS = 10_000;

    /** The most points a quantiles column may have. */
    static final int MAX_POINTS = 1_000;

    /** How a family uses min and max. */
    private enum Bounds {
        /** min/max truncate the distribution. */
        TRUNCATE,
        /** min/max are the family's own parameters (its support). */
        SUPPORT,
        /** min/max are not accepted. */
        NONE
    }

    /** The parameters given to a family, by key. */
    private record Params(YamlMap map, Map<String, YamlMap.Num> values) {
        double get(String key) {
            return values.get(key).value();
        }

        YamlMap.Num num(String key) {
            return values.get(key);
        }
    }

    @FunctionalInterface
    private interface Builder {
        /** Builds the marginal, or records problems and returns null. */
        Marginal build(Params p);
    }

    /**
     * A family: its parameterisations (each a set of numeric keys; a special key set for non-numeric
     * parameters), how it treats bounds and whether decimals apply.
     */
    private record Family(List<List<String>> forms, List<String> otherKeys, Bounds bounds, boolean decimals, Builder builder) {
    }

    private static final Map<String, Family> FAMILIES = new TreeMap<>();

    private static void family(String name, Bounds bounds, boolean decimals, Builder builder, List<String> otherKeys,
                               List<List<String>> forms) {
        FAMILIES.put(name, new Family(forms, otherKeys, bounds, decimals, builder));
    }

    static {
        family("normal", Bounds.TRUNCATE, true, p -> NormalMarginal.of(p.get("mean"), p.get("sd")), List.of(),
                List.of(List.of("mean", "sd")));
        family("lognormal", Bounds.TRUNCATE, true, p -> p.values().containsKey("meanlog")
                ? Families.lognormal(p.get("meanlog"), p.get("sdlog"))
                : Families.lognormalFromMoments(p.get("mean"), p.get("sd")), List.of(),
                List.of(List.of("meanlog", "sdlog"), List.of("mean", "sd")));
        family("uniform", Bounds.SUPPORT, true, p -> UniformMarginal.of(p.get("min"), p.get("max")), List.of(),
                List.of(List.of("min", "max")));
        family("triangular", Bounds.SUPPORT, true, p -> Families.triangular(p.get("min"), p.get("mode"), p.get("max")),
                List.of(), List.of(List.of("min", "mode", "max")));
        family("exponential", Bounds.TRUNCATE, true, p -> Families.exponential(p.values().containsKey("rate")
                ? p.get("rate") : 1 / positive(p, "mean")), List.of(), List.of(List.of("rate"), List.of("mean")));
        family("gamma", Bounds.TRUNCATE, true, p -> {
            if (p.values().containsKey("scale")) {
                return Families.gamma(p.get("shape"), p.get("scale"));
            }
            if (p.values().containsKey("rate")) {
                return Families.gamma(p.get("shape"), 1 / positive(p, "rate"));
            }
            return Families.gammaFromMoments(p.get("mean"), p.get("sd"));
        }, List.of(), List.of(List.of("shape", "scale"), List.of("shape", "rate"), List.of("mean", "sd")));
        family("beta", Bounds.TRUNCATE, true, p -> p.values().containsKey("alpha")
                ? Families.beta(p.get("alpha"), p.get("beta"))
                : Families.betaFromMoments(p.get("mean"), p.get("sd")), List.of(),
                List.of(List.of("alpha", "beta"), List.of("mean", "sd")));
        family("weibull", Bounds.TRUNCATE, true, p -> Families.weibull(p.get("shape"), p.get("scale")), List.of(),
                List.of(List.of("shape", "scale")));
        family("quantiles", Bounds.TRUNCATE, true, ColumnReader::quantiles, List.of("points"), List.of(List.of()));
        family("poisson", Bounds.TRUNCATE, false, p -> Families.poisson(p.get("mean")), List.of(), List.of(List.of("mean")));
        family("binomial", Bounds.TRUNCATE, false, p -> Families.binomial(whole(p, "trials"), p.get("p")), List.of(),
                List.of(List.of("trials", "p")));
        family("negbinomial", Bounds.TRUNCATE, false, p -> p.values().containsKey("size")
                ? Families.negativeBinomial(p.get("size"), p.get("p"))
                : Families.negativeBinomialFromMoments(p.get("mean"), p.get("sd")), List.of(),
                List.of(List.of("mean", "sd"), List.of("size", "p")));
        family("bernoulli", Bounds.NONE, false, p -> Families.bernoulli(p.get("p")), List.of(), List.of(List.of("p")));
        family("categorical", Bounds.NONE, false, ColumnReader::categorical, List.of("levels"), List.of(List.of()));
        family("date", Bounds.NONE, false, p -> calendar(p, false), List.of("from", "to"), List.of(List.of()));
        family("timestamp", Bounds.NONE, false, p -> calendar(p, true), List.of("from", "to"), List.of(List.of()));
    }

    private ColumnReader() {
    }

    /** The family words a spec may use, sorted. */
    static List<String> families() {
        List<String> all = new ArrayList<>(FAMILIES.keySet());
        all.add("sequence");
        all.sort(null);
        return all;
    }

    /** Reads a column, or returns null after recording its problems. */
    static ColumnSpec read(String name, Mark nameMark, YamlMap m, long rows) {
        if (!m.require("column '" + name + "'", "dist")) {
            return null;
        }
        String dist = m.string("dist");
        if (dist == null) {
            return null;
        }
        if (dist.equals("sequence")) {
            return readSequence(name, nameMark, m, rows);
        }
        Family family = FAMILIES.get(dist);
        if (family == null) {
            m.problems().add(m.valueMark("dist"), "unknown dist '" + dist + "'" + Names.suggestion(dist, families())
                    + " (valid: " + String.join(", ", families()) + ")");
            return null;
        }
        int before = m.problems().size();
        Set<String> parameterKeys = new HashSet<>();
        family.forms().forEach(parameterKeys::addAll);
        List<String> allowed = new ArrayList<>();
        allowed.add("dist");
        for (List<String> form : family.forms()) {
            for (String k : form) {
                if (!allowed.contains(k)) {
                    allowed.add(k);
                }
            }
        }
        allowed.addAll(family.otherKeys());
        if (family.bounds() == Bounds.TRUNCATE) {
            allowed.add("min");
            allowed.add("max");
        }
        if (family.decimals()) {
            allowed.add("decimals");
        }
        allowed.add("nulls");
        m.allowOnly(dist + " column '" + name + "'", allowed);

        // which parameterisation was given
        List<String> form = null;
        if (family.forms().size() == 1 && family.forms().get(0).isEmpty()) {
            form = List.of();
        } else {
            Set<String> given = new HashSet<>();
            for (String k : m.keys()) {
                if (parameterKeys.contains(k)) {
                    given.add(k);
                }
            }
            for (List<String> f : family.forms()) {
                if (given.equals(new HashSet<>(f))) {
                    form = f;
                }
            }
            if (form == null && family.forms().size() == 1 && family.forms().get(0).containsAll(given)) {
                for (String k : family.forms().get(0)) {
                    m.require(dist + " column", k);
                }
                return null;
            }
            if (form == null) {
                m.problems().add(m.valueMark("dist"), dist + " takes " + describe(family.forms())
                        + (given.isEmpty() ? "; none given" : "; given: " + String.join(", ", sorted(given))));
                return null;
            }
        }
        Map<String, YamlMap.Num> values = new LinkedHashMap<>();
        for (String k : form) {
            YamlMap.Num n = m.number(k);
            if (n != null) {
                values.put(k, n);
            }
        }
        YamlMap.Num min = family.bounds() == Bounds.TRUNCATE ? m.number("min") : null;
        YamlMap.Num max = family.bounds() == Bounds.TRUNCATE ? m.number("max") : null;
        if (family.bounds() == Bounds.SUPPORT && values.containsKey("min") && values.containsKey("max")
                && !(values.get("min").value() < values.get("max").value())) {
            m.problems().add(values.get("max").mark(), "max must be > min: " + values.get("max").text() + " <= "
                    + values.get("min").text());
        }
        Long decimals = family.decimals() ? m.integer("decimals", 0, MAX_DECIMALS, "a whole number from 0 to " + MAX_DECIMALS) : null;
        double nulls = 0.0;
        YamlMap.Num nullsNum = m.number("nulls");
        if (nullsNum != null) {
            if (!(nullsNum.value() >= 0 && nullsNum.value() < 1)) {
                m.problems().add(nullsNum.mark(), "nulls must be a fraction in [0, 1): " + nullsNum.text());
            } else {
                nulls = nullsNum.value();
            }
        }
        if (min != null && max != null && !(min.value() < max.value())) {
            m.problems().add(max.mark(), "max must be > min: " + max.text() + " <= " + min.text());
        }
        if (m.problems().size() > before || values.size() < form.size()) {
            return null;
        }
        Params params = new Params(m, values);
        Marginal marginal;
        try {
            marginal = family.builder().build(params);
            if (marginal == null) {
                return null;
            }
            if (min != null || max != null) {
                marginal = Families.truncate(marginal, min == null ? Double.NEGATIVE_INFINITY : min.value(),
                        max == null ? Double.POSITIVE_INFINITY : max.value());
            }
        } catch (IllegalArgumentException e) {
            m.problems().add(blame(m, e.getMessage(), values, min, max), dist + ": " + e.getMessage());
            return null;
        }
        if (m.problems().size() > before) {
            return null;
        }
        int d = decimals == null ? (marginal.valueKind() == ValueKind.NUMBER ? -1 : 0) : decimals.intValue();
        return new ColumnSpec.Random(name, nameMark, marginal, d, nulls);
    }

    /** The place to point at for a parameter error: the parameter it names, else min/max, else dist. */
    private static Mark blame(YamlMap m, String message, Map<String, YamlMap.Num> values, YamlMap.Num min, YamlMap.Num max) {
        for (Map.Entry<String, YamlMap.Num> e : values.entrySet()) {
            if (message.startsWith(e.getKey() + " ")) {
                return e.getValue().mark();
            }
        }
        if (message.startsWith("min") && min != null) {
            return min.mark();
        }
        if ((message.startsWith("max") || message.startsWith("min and max")) && (min != null || max != null)) {
            return min != null ? min.mark() : max.mark();
        }
        if (message.startsWith("sd") && values.containsKey("sd")) {
            return values.get("sd").mark();
        }
        return m.valueMark("dist");
    }

    private static List<String> sorted(Set<String> s) {
        List<String> l = new ArrayList<>(s);
        l.sort(null);
        return l;
    }

    private static String describe(List<List<String>> forms) {
        List<String> parts = new ArrayList<>();
        for (List<String> f : forms) {
            parts.add(String.join(" + ", f));
        }
        if (parts.size() == 1) {
            return parts.get(0);
        }
        return String.join(", ", parts.subList(0, parts.size() - 1)) + " or " + parts.get(parts.size() - 1);
    }

    private static double positive(Params p, String key) {
        double v = p.get(key);
        if (!(v > 0)) {
            throw new IllegalArgumentException(key + " must be > 0: " + p.num(key).text());
        }
        return v;
    }

    private static long whole(Params p, String key) {
        YamlMap.Num n = p.num(key);
        try {
            return n.exact().longValueExact();
        } catch (ArithmeticException e) {
            throw new IllegalArgumentException(key + " must be a whole number: " + n.text());
        }
    }

    private static Marginal quantiles(Params p) {
        YamlMap m = p.map();
        if (!m.require("quantiles column", "points")) {
            return null;
        }
        Node node = m.get("points");
        if (!(node instanceof MappingNode mapping)) {
            m.problems().add(m.valueMark("points"), "points must be a mapping of probability to value, e.g. {0: 1, 0.5: 4, 1: 20}");
            return null;
        }
        List<NodeTuple> tuples = mapping.getValue();
        if (tuples.size() < 2 || tuples.size() > MAX_POINTS) {
            m.problems().add(m.valueMark("points"), "points must have 2 to " + MAX_POINTS + " entries: " + tuples.size());
            return null;
        }
        double[] probs = new double[tuples.size()];
        double[] values = new double[tuples.size()];
        for (int i = 0; i < tuples.size(); i++) {
            YamlMap.Num prob = m.number("point probability", tuples.get(i).getKeyNode());
            YamlMap.Num value = m.number("point value", tuples.get(i).getValueNode());
            if (prob == null || value == null) {
                return null;
            }
            if (!(prob.value() >= 0 && prob.value() <= 1)) {
                m.problems().add(prob.mark(), "point probability must be in [0, 1]: " + prob.text());
                return null;
            }
            if (i > 0 && !(prob.value() > probs[i - 1])) {
                m.problems().add(prob.mark(), "point probabilities must be strictly increasing: " + prob.text());
                return null;
            }
            if (i > 0 && !(value.value() > values[i - 1])) {
                m.problems().add(value.mark(), "point values must be strictly increasing: " + value.text());
                return null;
            }
            probs[i] = prob.value();
            values[i] = value.value();
        }
        if (probs[0] != 0 || probs[probs.length - 1] != 1) {
            m.problems().add(m.valueMark("points"), "points must include probabilities 0 and 1 (the smallest and largest value)");
            return null;
        }
        return Families.quantiles(probs, values);
    }

    private static Marginal categorical(Params p) {
        YamlMap m = p.map();
        if (!m.require("categorical column", "levels")) {
            return null;
        }
        Node node = m.get("levels");
        List<String> labels = new ArrayList<>();
        List<Double> weights = new ArrayList<>();
        if (node instanceof SequenceNode seq) {
            for (Node item : seq.getValue()) {
                if (!(item instanceof ScalarNode s)) {
                    m.problems().add(m.mark(item), "levels must list labels as plain text");
                    return null;
                }
                labels.add(s.getValue());
                weights.add(1.0);
            }
        } else if (node instanceof MappingNode) {
            YamlMap levels = YamlMap.of(m.file(), m.problems(), node, "levels");
            if (levels == null) {
                return null;
            }
            for (Map.Entry<String, NodeTuple> e : levels.entries().entrySet()) {
                YamlMap.Num w = levels.number("weight of level '" + e.getKey() + "'", e.getValue().getValueNode());
                if (w == null) {
                    return null;
                }
                if (!(w.value() > 0)) {
                    m.problems().add(w.mark(), "weight of level '" + e.getKey() + "' must be > 0: " + w.text());
                    return null;
                }
                labels.add(e.getKey());
                weights.add(w.value());
            }
        } else {
            m.problems().add(m.valueMark("levels"), "levels must be a list of labels or a mapping of label to weight");
            return null;
        }
        if (labels.isEmpty() || labels.size() > MAX_LEVELS) {
            m.problems().add(m.valueMark("levels"), "levels must name 1 to " + MAX_LEVELS + " labels: " + labels.size());
            return null;
        }
        if (new HashSet<>(labels).size() != labels.size()) {
            m.problems().add(m.valueMark("levels"), "levels must not repeat a label");
            return null;
        }
        double[] w = new double[weights.size()];
        for (int i = 0; i < w.length; i++) {
            w[i] = weights.get(i);
        }
        return Families.categorical(labels.toArray(new String[0]), w);
    }

    private static Marginal calendar(Params p, boolean timestamp) {
        YamlMap m = p.map();
        String what = timestamp ? "timestamp column" : "date column";
        if (!m.require(what, "from") | !m.require(what, "to")) {
            return null;
        }
        long[] ends = new long[2];
        String[] keys = {"from", "to"};
        for (int i = 0; i < 2; i++) {
            String text = m.string(keys[i]);
            if (text == null) {
                return null;
            }
            try {
                ends[i] = timestamp ? Instant.parse(text).getEpochSecond() : LocalDate.parse(text).toEpochDay();
            } catch (DateTimeParseException e) {
                m.problems().add(m.valueMark(keys[i]), keys[i] + " must be an ISO-8601 " + (timestamp
                        ? "UTC instant such as 2026-03-01T08:30:00Z" : "date such as 2026-03-01") + ": " + text);
                return null;
            }
        }
        if (ends[1] < ends[0]) {
            m.problems().add(m.valueMark("to"), "to must not be before from: " + m.string("to") + " < " + m.string("from"));
            return null;
        }
        return timestamp ? Families.timestamps(ends[0], ends[1]) : Families.dates(ends[0], ends[1]);
    }

    private static ColumnSpec readSequence(String name, Mark nameMark, YamlMap m, long rows) {
        int before = m.problems().size();
        m.allowOnly("sequence column '" + name + "'", List.of("dist", "start", "step"));
        Long start = m.integer("start", Long.MIN_VALUE, Long.MAX_VALUE, "a 64-bit integer");
        Long step = m.integer("step", Long.MIN_VALUE, Long.MAX_VALUE, "a 64-bit integer");
        if (m.problems().size() > before) {
            return null;
        }
        long s = start == null ? 1 : start;
        long d = step == null ? 1 : step;
        if (rows > 0) {
            try {
                Math.addExact(s, Math.multiplyExact(d, rows - 1));
            } catch (ArithmeticException e) {
                m.problems().add(m.has("step") ? m.valueMark("step") : m.keyMark("dist"), "sequence overflows a 64-bit integer: start "
                        + s + " + step " + d + " × (rows − 1 = " + (rows - 1) + ") is outside ±9223372036854775807");
                return null;
            }
        }
        return new ColumnSpec.Sequence(name, nameMark, s, d);
    }

}
