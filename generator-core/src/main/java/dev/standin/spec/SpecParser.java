package dev.standin.spec;

import java.io.StringReader;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Deque;
import java.util.HashSet;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.composer.Composer;
import org.yaml.snakeyaml.error.MarkedYAMLException;
import org.yaml.snakeyaml.error.YAMLException;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;
import org.yaml.snakeyaml.parser.ParserImpl;
import org.yaml.snakeyaml.reader.StreamReader;
import org.yaml.snakeyaml.resolver.Resolver;

/**
 * Parses spec format v1 from YAML into a checked {@link Spec}.
 *
 * <p>The YAML is composed into snakeyaml's node tree (never constructed into objects), so every
 * value keeps its line and column for messages, and only YAML's standard tags are accepted. A parser
 * holds no state between calls apart from its options; use one per thread or execution.
 */
public final class SpecParser {

    /**
     * The largest spec file accepted, in bytes: 4 MiB, room for a full 500 × 500 matrix (the largest
     * correlation block) written with four decimals.
     */
    public static final int MAX_SPEC_BYTES = 4 << 20;

    /** The size limit as the error messages give it. */
    public static final String MAX_SPEC_SIZE = MAX_SPEC_BYTES + " bytes (" + (MAX_SPEC_BYTES >> 20) + " MiB)";

    /** The largest number of rows: 2<sup>40</sup>. */
    public static final long MAX_ROWS = 1L << 40;

    /** The largest number of columns in one spec. */
    public static final int MAX_COLUMNS = 10_000;

    /**
     * The most columns one correlation block may involve. The target, its completion and repair are
     * dense k × k matrices with O(k³) work per iteration, and NORTA solves one root per pair (124,750
     * pairs at 500 columns), so larger blocks are refused outright. The cost below the limit depends
     * on how many pairs are left free: completing a 100-column chain of pairs (4,851 free pairs) took
     * about 15 s on a 2-core machine, so a block near the limit with few pairs given runs for a long time.
     */
    public static final int MAX_CORRELATED = 500;

    /** The key of the CSV formula guard in the {@code output:} block. */
    public static final String GUARD_FORMULAS = "guard-formulas";

    private static final Pattern DATASET = Pattern.compile("[a-z0-9][a-z0-9_-]*");
    private static final int MAX_NAME_LENGTH = 128;
    private static final List<String> TOP_KEYS = List.of("dataset", "rows", "seed", "columns", "correlation", "output");
    private static final List<String> OUTPUT_KEYS = List.of("format", "file", "header", "delimiter", "null", GUARD_FORMULAS,
            "report");

    private final Overrides overrides;

    private SpecParser(Overrides overrides) {
        this.overrides = overrides;
    }

    /** A parser that applies the given overrides to every spec it reads. */
    public static SpecParser withOverrides(Overrides overrides) {
        return new SpecParser(overrides == null ? Overrides.none() : overrides);
    }

    /**
     * Parses and checks one spec.
     *
     * @param file the name used in messages and reports (e.g. the path relative to the spec folder)
     * @param bytes the file's bytes, UTF-8
     * @throws SpecException listing every problem found, each with its line and column
     */
    public Spec parse(String file, byte[] bytes) throws SpecException {
        if (bytes.length > MAX_SPEC_BYTES) {
            throw new SpecException(SpecProblem.at(Mark.startOf(file), "spec is " + bytes.length
                    + " bytes; the limit is " + MAX_SPEC_SIZE));
        }
        String text;
        try {
            text = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT).decode(ByteBuffer.wrap(bytes)).toString();
        } catch (CharacterCodingException e) {
            throw new SpecException(SpecProblem.at(Mark.startOf(file), "spec is not valid UTF-8 text"));
        }
        Node root = compose(file, text);
        checkTags(file, root);
        Problems problems = new Problems();
        Spec spec = readSpec(file, root, problems);
        problems.throwIfAny();
        return spec;
    }

    private static Node compose(String file, String text) throws SpecException {
        LoaderOptions options = new LoaderOptions();
        options.setAllowDuplicateKeys(false);
        options.setMaxAliasesForCollections(50);
        options.setNestingDepthLimit(50);
        options.setCodePointLimit(MAX_SPEC_BYTES);
        options.setAllowRecursiveKeys(false);
        // Only the node graph is read (what Yaml.compose does, without building a Yaml object's
        // constructor, representer and dumper options): no Java object is ever constructed from the
        // document, and the typed readers take it from there.
        try {
            Composer composer = new Composer(new ParserImpl(new StreamReader(new StringReader(text)), options),
                    new Resolver(), options);
            Node root = composer.getSingleNode();
            if (root == null) {
                throw new SpecException(SpecProblem.at(Mark.startOf(file), "spec is empty; it needs at least dataset, rows, seed and columns"));
            }
            return root;
        } catch (MarkedYAMLException e) {
            org.yaml.snakeyaml.error.Mark m = e.getProblemMark() != null ? e.getProblemMark() : e.getContextMark();
            String what = e.getProblem() != null ? e.getProblem() : e.getMessage();
            throw new SpecException(SpecProblem.at(Mark.of(file, m), "not valid YAML: " + oneLine(what)));
        } catch (YAMLException e) {
            throw new SpecException(SpecProblem.at(Mark.startOf(file), "not valid YAML: " + oneLine(e.getMessage())));
        }
    }

    /**
     * Rejects a tag outside YAML's standard ones on any node, wherever it stands, with one problem
     * per tagged node in document order. (snakeyaml itself rejects global tags such as
     * {@code !!java.lang.Object}; this catches local tags such as {@code !x} and non-scalar standard
     * tags such as {@code !!binary}, which the typed readers would otherwise read as plain text.)
     */
    private static void checkTags(String file, Node root) throws SpecException {
        Problems problems = new Problems();
        Set<Node> seen = Collections.newSetFromMap(new IdentityHashMap<>());
        Deque<Node> todo = new ArrayDeque<>();
        todo.push(root);
        while (!todo.isEmpty()) {
            Node n = todo.pop();
            if (!seen.add(n)) {
                continue;
            }
            YamlMap.checkTag(file, problems, n);
            if (n instanceof MappingNode m) {
                List<NodeTuple> tuples = m.getValue();
                for (int i = tuples.size() - 1; i >= 0; i--) {
                    todo.push(tuples.get(i).getValueNode());
                    todo.push(tuples.get(i).getKeyNode());
                }
            } else if (n instanceof SequenceNode q) {
                List<Node> items = q.getValue();
                for (int i = items.size() - 1; i >= 0; i--) {
                    todo.push(items.get(i));
                }
            }
        }
        problems.throwIfAny();
    }

    private static String oneLine(String s) {
        return s == null ? "" : s.replaceAll("\\s+", " ").trim();
    }

    private Spec readSpec(String file, Node root, Problems problems) {
        YamlMap top = YamlMap.of(file, problems, root, "the spec");
        if (top == null) {
            return null;
        }
        top.allowOnly("the spec", TOP_KEYS);
        boolean complete = top.require("the spec", "dataset") & top.require("the spec", "rows")
                & top.require("the spec", "seed") & top.require("the spec", "columns");

        String dataset = top.string("dataset");
        if (dataset != null && (!DATASET.matcher(dataset).matches() || dataset.length() > MAX_NAME_LENGTH)) {
            problems.add(top.valueMark("dataset"), "dataset must match [a-z0-9][a-z0-9_-]* (at most "
                    + MAX_NAME_LENGTH + " characters): " + Names.shown(dataset));
            dataset = null;
        } else if (dataset != null && windowsDevice(dataset)) {
            problems.add(top.valueMark("dataset"), "dataset must not be a name Windows reserves for a device ("
                    + WINDOWS_DEVICES_SHOWN + "): " + dataset);
            dataset = null;
        }
        Long rows = top.integer("rows", 0, MAX_ROWS, "a whole number from 0 to 2^40 (1099511627776)");
        Long seed = top.integer("seed", Long.MIN_VALUE, Long.MAX_VALUE, "a 64-bit integer");
        if (overrides.rows() != null) {
            rows = overrides.rows();
        }
        if (overrides.seed() != null) {
            seed = overrides.seed();
        }
        List<ColumnSpec> columns = top.has("columns") && rows != null ? readColumns(top, rows) : null;
        CorrelationSpec correlation = null;
        if (top.has("correlation") && columns != null) {
            correlation = CorrelationReader.read(file, problems, top.get("correlation"), columns);
        }
        OutputSpec output = top.has("output") ? readOutput(file, problems, top.get("output")) : OutputSpec.defaults();
        if (output != null && overrides.format() != null) {
            output = new OutputSpec(overrides.format(), output.file(), output.fileMark(), output.header(),
                    output.delimiter(), output.nullText(), output.guardFormulas(), output.htmlReport());
        }
        if (!complete || dataset == null || rows == null || seed == null || columns == null || output == null
                || !problems.isEmpty()) {
            return null;
        }
        return new Spec(file, dataset, rows, seed, columns, correlation, output);
    }

    private static List<ColumnSpec> readColumns(YamlMap top, long rows) {
        Problems problems = top.problems();
        YamlMap map = YamlMap.of(top.file(), problems, top.get("columns"), "columns");
        if (map == null) {
            return null;
        }
        if (map.entries().isEmpty()) {
            problems.add(map.mark(), "columns must name at least one column");
            return null;
        }
        if (map.entries().size() > MAX_COLUMNS) {
            problems.add(map.mark(), "columns has " + map.entries().size() + " entries; the limit is " + MAX_COLUMNS);
            return null;
        }
        List<ColumnSpec> columns = new ArrayList<>();
        boolean ok = true;
        for (Map.Entry<String, NodeTuple> e : map.entries().entrySet()) {
            String name = e.getKey();
            Mark nameMark = map.mark(e.getValue().getKeyNode());
            if (!validColumnName(name)) {
                problems.add(nameMark, "column name must be 1 to " + MAX_NAME_LENGTH
                        + " characters without '~' or control characters: '" + name + "'");
                ok = false;
                continue;
            }
            YamlMap column = YamlMap.of(top.file(), problems, e.getValue().getValueNode(), "column '" + name + "'");
            if (column == null) {
                ok = false;
                continue;
            }
            ColumnSpec c = ColumnReader.read(name, nameMark, column, rows);
            if (c == null) {
                ok = false;
            } else {
                columns.add(c);
            }
        }
        return ok ? columns : null;
    }

    static boolean validColumnName(String name) {
        if (name.isEmpty() || name.length() > MAX_NAME_LENGTH || name.indexOf('~') >= 0 || !name.strip().equals(name)) {
            return false;
        }
        return name.chars().noneMatch(Character::isISOControl);
    }

    private static OutputSpec readOutput(String file, Problems problems, Node node) {
        YamlMap m = YamlMap.of(file, problems, node, "output");
        if (m == null) {
            return null;
        }
        int before = problems.size();
        m.allowOnly("output", OUTPUT_KEYS);
        OutputFormat format = OutputFormat.CSV;
        String f = m.string("format");
        if (f != null) {
            format = OutputFormat.parse(f).orElse(null);
            if (format == null) {
                problems.add(m.valueMark("format"), "output format must be one of " + OutputFormat.choices() + ": " + f);
            }
        }
        String outFile = m.string("file");
        if (outFile != null && !validFileName(outFile)) {
            problems.add(m.valueMark("file"), "output file must be a plain file name or a relative path of such names"
                    + " (letters, digits, '.', '_', '-'; no '..', no absolute path): " + Names.shown(outFile));
        } else if (outFile != null) {
            for (String part : outFile.split("/")) {
                if (windowsDevice(part)) {
                    problems.add(m.valueMark("file"), "output file must not use a name Windows reserves for a device ("
                            + WINDOWS_DEVICES_SHOWN + ", with any extension): " + outFile);
                    break;
                }
                if (part.endsWith(".")) {
                    problems.add(m.valueMark("file"), "output file names must not end in '.' (Windows drops it): " + outFile);
                    break;
                }
            }
        }
        Boolean header = m.bool("header");
        Boolean guard = m.bool(GUARD_FORMULAS);
        Boolean report = m.bool("report");
        char delimiter = ',';
        String d = m.string("delimiter");
        if (d != null) {
            if (d.length() != 1 || d.charAt(0) == '"' || d.charAt(0) == '\n' || d.charAt(0) == '\r') {
                problems.add(m.valueMark("delimiter"), "delimiter must be one character other than '\"', CR or LF: \"" + d + "\"");
            } else {
                delimiter = d.charAt(0);
            }
        }
        String nullText = "";
        if (m.has("null")) {
            Node n = m.get("null");
            if (n instanceof ScalarNode && n.getTag().equals(org.yaml.snakeyaml.nodes.Tag.NULL)) {
                problems.add(m.valueMark("null"), "null must be quoted text, e.g. null: \"NA\" or null: \"\"");
            } else {
                nullText = m.string("null");
                if (nullText != null && (nullText.indexOf('"') >= 0 || nullText.indexOf(delimiter) >= 0
                        || nullText.indexOf('\n') >= 0 || nullText.indexOf('\r') >= 0)) {
                    problems.add(m.valueMark("null"), "null text must not contain quotes, the delimiter or line breaks: \"" + nullText + "\"");
                }
            }
        }
        if (problems.size() > before) {
            return null;
        }
        return new OutputSpec(format, outFile, outFile == null ? null : m.valueMark("file"),
                header == null || header, delimiter, nullText == null ? "" : nullText, guard != null && guard,
                report == null || report);
    }

    private static final Pattern WINDOWS_DEVICE = Pattern.compile("(con|prn|aux|nul|com[1-9]|lpt[1-9])(\\..*)?",
            Pattern.CASE_INSENSITIVE);
    private static final String WINDOWS_DEVICES_SHOWN = "CON, PRN, AUX, NUL, COM1-COM9, LPT1-LPT9";

    /**
     * True for a name that Windows resolves to a device rather than a file, with or without an
     * extension ("Naming Files, Paths, and Namespaces", Microsoft's Win32 documentation).
     */
    static boolean windowsDevice(String name) {
        return WINDOWS_DEVICE.matcher(name).matches();
    }

    private static final Pattern FILE_PART = Pattern.compile("[A-Za-z0-9_][A-Za-z0-9._-]*");

    static boolean validFileName(String name) {
        if (name.isEmpty() || name.length() > 255) {
            return false;
        }
        Set<String> seen = new HashSet<>();
        for (String part : name.split("/", -1)) {
            if (!FILE_PART.matcher(part).matches() || part.equals("..") || part.equals(".")) {
                return false;
            }
            seen.add(part);
        }
        return !seen.isEmpty();
    }
}
