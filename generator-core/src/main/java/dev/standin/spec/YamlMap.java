package dev.standin.spec;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.yaml.snakeyaml.DumperOptions;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;
import org.yaml.snakeyaml.nodes.Tag;

/**
 * A YAML mapping node read as an ordered map from plain-text keys to nodes, with the location of
 * every key and value, and typed readers that record a problem (and return null) on bad input.
 */
final class YamlMap {

    /**
     * The longest number text read, in characters. Far more than any double needs (17 significant
     * digits always read back the same double), and short enough that parsing is instant:
     * BigDecimal's parsing and conversion cost grows faster than the length, so a million-digit
     * literal would take many seconds.
     */
    static final int MAX_NUMBER_CHARS = 100;

    private final String file;
    private final Problems problems;
    private final Node node;
    private final Map<String, NodeTuple> entries = new LinkedHashMap<>();

    private YamlMap(String file, Problems problems, MappingNode node) {
        this.file = file;
        this.problems = problems;
        this.node = node;
        for (NodeTuple t : node.getValue()) {
            String key = keyText(t.getKeyNode());
            if (key == null) {
                continue;
            }
            NodeTuple first = entries.get(key);
            if (first != null) {
                Mark a = mark(first.getKeyNode());
                problems.add(mark(t.getKeyNode()), "duplicate key '" + Names.shown(key) + "' (first given at line " + a.line()
                        + ", column " + a.column() + ")");
                continue;
            }
            entries.put(key, t);
        }
    }

    /** Reads a mapping node, or records "NAME must be a mapping" and returns null. */
    static YamlMap of(String file, Problems problems, Node node, String what) {
        if (!checkTag(file, problems, node)) {
            return null;
        }
        if (!(node instanceof MappingNode)) {
            problems.add(Mark.of(file, node.getStartMark()), what + " must be a mapping of keys to values");
            return null;
        }
        return new YamlMap(file, problems, (MappingNode) node);
    }

    private String keyText(Node key) {
        if (!(key instanceof ScalarNode) || !checkTag(file, problems, key)) {
            problems.add(mark(key), "keys must be plain text");
            return null;
        }
        if (key.getTag().equals(Tag.MERGE)) {
            problems.add(mark(key), "merge keys (<<) are not supported");
            return null;
        }
        return ((ScalarNode) key).getValue();
    }

    /** Only YAML's standard tags are accepted: no global or local tags, no object construction. */
    static boolean checkTag(String file, Problems problems, Node node) {
        Tag tag = node.getTag();
        if (tag.equals(Tag.STR) || tag.equals(Tag.INT) || tag.equals(Tag.FLOAT) || tag.equals(Tag.BOOL)
                || tag.equals(Tag.NULL) || tag.equals(Tag.MAP) || tag.equals(Tag.SEQ) || tag.equals(Tag.MERGE)
                || tag.equals(Tag.TIMESTAMP)) {
            return true;
        }
        problems.add(Mark.of(file, node.getStartMark()), "tag " + tag.getValue() + " is not allowed; write plain values");
        return false;
    }

    Mark mark() {
        return mark(node);
    }

    Mark mark(Node n) {
        return Mark.of(file, n.getStartMark());
    }

    Set<String> keys() {
        return entries.keySet();
    }

    boolean has(String key) {
        return entries.containsKey(key);
    }

    /** The value node of key, or null. */
    Node get(String key) {
        NodeTuple t = entries.get(key);
        return t == null ? null : t.getValueNode();
    }

    /** Where key is written, or this map's start when absent. */
    Mark keyMark(String key) {
        NodeTuple t = entries.get(key);
        return t == null ? mark() : mark(t.getKeyNode());
    }

    Mark valueMark(String key) {
        NodeTuple t = entries.get(key);
        return t == null ? mark() : mark(t.getValueNode());
    }

    Map<String, NodeTuple> entries() {
        return entries;
    }

    /** Records a problem for each key not in allowed, naming the valid ones. Returns true if none. */
    boolean allowOnly(String where, Collection<String> allowed) {
        boolean ok = true;
        for (Map.Entry<String, NodeTuple> e : entries.entrySet()) {
            if (!allowed.contains(e.getKey())) {
                problems.add(mark(e.getValue().getKeyNode()), "unknown key '" + Names.shown(e.getKey()) + "' in " + where
                        + Names.suggestion(e.getKey(), allowed) + " (valid: " + String.join(", ", allowed) + ")");
                ok = false;
            }
        }
        return ok;
    }

    /** Records "missing required key" at the mapping's start. Returns true when present. */
    boolean require(String where, String key) {
        if (!entries.containsKey(key)) {
            problems.add(mark(), where + " is missing the required key '" + key + "'");
            return false;
        }
        return true;
    }

    String string(String key) {
        Node n = get(key);
        if (n == null) {
            return null;
        }
        if (!(n instanceof ScalarNode) || n.getTag().equals(Tag.NULL)) {
            problems.add(mark(n), key + " must be text");
            return null;
        }
        return ((ScalarNode) n).getValue();
    }

    /** A finite number, or null (with a problem recorded when present but bad). */
    Num number(String key) {
        Node n = get(key);
        return n == null ? null : number(key, n);
    }

    Num number(String name, Node n) {
        if (!(n instanceof ScalarNode) || !checkTag(file, problems, n)) {
            problems.add(mark(n), name + " must be a number");
            return null;
        }
        ScalarNode s = (ScalarNode) n;
        String text = s.getValue().trim();
        if (s.getScalarStyle() != DumperOptions.ScalarStyle.PLAIN) {
            problems.add(mark(n), name + " must be a number, not quoted text: \"" + Names.shown(text) + "\"");
            return null;
        }
        if (text.length() > MAX_NUMBER_CHARS) {
            problems.add(mark(n), name + " must be a number of at most " + MAX_NUMBER_CHARS + " characters: "
                    + Names.shown(text));
            return null;
        }
        String lower = text.toLowerCase(java.util.Locale.ROOT);
        if (lower.endsWith(".inf") || lower.equals(".nan")) {
            problems.add(mark(n), name + " must be a finite number: " + text);
            return null;
        }
        BigDecimal value;
        try {
            value = new BigDecimal(text.startsWith("+") ? text.substring(1) : text);
        } catch (NumberFormatException e) {
            problems.add(mark(n), name + " must be a number: " + Names.shown(text));
            return null;
        }
        double d = value.doubleValue();
        if (!Double.isFinite(d)) {
            problems.add(mark(n), name + " must be a finite number: " + text);
            return null;
        }
        return new Num(d, value, text, mark(n));
    }

    /** An integer in [min, max], or null (with a problem recorded when present but bad). */
    Long integer(String key, long min, long max, String range) {
        Node n = get(key);
        if (n == null) {
            return null;
        }
        Num num = number(key, n);
        if (num == null) {
            return null;
        }
        BigInteger whole;
        try {
            whole = num.exact().toBigIntegerExact();
        } catch (ArithmeticException e) {
            problems.add(num.mark(), key + " must be a whole number: " + num.text());
            return null;
        }
        if (whole.compareTo(BigInteger.valueOf(min)) < 0 || whole.compareTo(BigInteger.valueOf(max)) > 0) {
            problems.add(num.mark(), key + " must be " + range + ": " + num.text());
            return null;
        }
        return whole.longValue();
    }

    Boolean bool(String key) {
        Node n = get(key);
        if (n == null) {
            return null;
        }
        if (n instanceof ScalarNode && n.getTag().equals(Tag.BOOL)) {
            String v = ((ScalarNode) n).getValue().toLowerCase(java.util.Locale.ROOT);
            if (v.equals("true")) {
                return Boolean.TRUE;
            }
            if (v.equals("false")) {
                return Boolean.FALSE;
            }
        }
        problems.add(mark(n), key + " must be true or false");
        return null;
    }

    /** A sequence node's items, or null with a problem. */
    List<Node> list(String key) {
        Node n = get(key);
        if (n == null) {
            return null;
        }
        if (!(n instanceof SequenceNode) || !checkTag(file, problems, n)) {
            problems.add(mark(n), key + " must be a list");
            return null;
        }
        return new ArrayList<>(((SequenceNode) n).getValue());
    }

    Problems problems() {
        return problems;
    }

    String file() {
        return file;
    }

    /** A number as written: its double value, exact decimal value, text and place. */
    record Num(double value, BigDecimal exact, String text, Mark mark) {
    }
}
