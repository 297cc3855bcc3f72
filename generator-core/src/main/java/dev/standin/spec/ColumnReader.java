package dev.standin.spec;

import dev.standin.marginal.Marginal;
import dev.standin.marginal.NormalMarginal;
import dev.standin.marginal.UniformMarginal;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Reads one column's mapping: {@code dist}, the family's parameters and the keys common to every
 * random family ({@code min}, {@code max}, {@code decimals}, {@code nulls}).
 */
final class ColumnReader {

    /** Keys every random family accepts besides its own parameters. */
    static final List<String> COMMON_KEYS = List.of("dist", "min", "max", "decimals", "nulls");

    /** Digits after the decimal point: 0 .. 15. */
    static final int MAX_DECIMALS = 15;

    /** A family: its parameter keys and how to build its marginal from them. */
    private interface Family {
        List<String> parameters();

        /** Builds the marginal, or returns null after recording problems. */
        Marginal read(YamlMap m, YamlMap.Num min, YamlMap.Num max);
    }

    private static final Map<String, Family> FAMILIES = new TreeMap<>();

    static {
        FAMILIES.put("normal", new Family() {
            @Override
            public List<String> parameters() {
                return List.of("mean", "sd");
            }

            @Override
            public Marginal read(YamlMap m, YamlMap.Num min, YamlMap.Num max) {
                boolean ok = m.require("normal column", "mean") & m.require("normal column", "sd");
                YamlMap.Num mean = m.number("mean");
                YamlMap.Num sd = m.number("sd");
                if (!ok || mean == null || sd == null) {
                    return null;
                }
                if (!(sd.value() > 0)) {
                    m.problems().add(sd.mark(), "normal: sd must be > 0: " + sd.text());
                    return null;
                }
                double lo = min == null ? Double.NEGATIVE_INFINITY : min.value();
                double hi = max == null ? Double.POSITIVE_INFINITY : max.value();
                try {
                    return NormalMarginal.truncated(mean.value(), sd.value(), lo, hi);
                } catch (IllegalArgumentException e) {
                    m.problems().add(min != null ? min.mark() : max.mark(), "normal: " + e.getMessage());
                    return null;
                }
            }
        });
        FAMILIES.put("uniform", new Family() {
            @Override
            public List<String> parameters() {
                return List.of();
            }

            @Override
            public Marginal read(YamlMap m, YamlMap.Num min, YamlMap.Num max) {
                boolean ok = m.require("uniform column", "min") & m.require("uniform column", "max");
                if (!ok || min == null || max == null) {
                    return null;
                }
                if (!(min.value() < max.value())) {
                    m.problems().add(max.mark(), "uniform: max must be > min: " + max.text() + " <= " + min.text());
                    return null;
                }
                try {
                    return UniformMarginal.of(min.value(), max.value());
                } catch (IllegalArgumentException e) {
                    m.problems().add(max.mark(), "uniform: " + e.getMessage());
                    return null;
                }
            }
        });
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
        List<String> allowed = new ArrayList<>(COMMON_KEYS);
        allowed.addAll(family.parameters());
        int before = m.problems().size();
        m.allowOnly(dist + " column '" + name + "'", allowed);
        YamlMap.Num min = m.number("min");
        YamlMap.Num max = m.number("max");
        Long decimals = m.integer("decimals", 0, MAX_DECIMALS, "a whole number from 0 to " + MAX_DECIMALS);
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
            return null;
        }
        Marginal marginal = family.read(m, min, max);
        if (marginal == null || m.problems().size() > before) {
            return null;
        }
        return new ColumnSpec.Random(name, nameMark, marginal, decimals == null ? -1 : decimals.intValue(), nulls);
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
