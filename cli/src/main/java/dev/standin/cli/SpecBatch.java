package dev.standin.cli;

import dev.standin.engine.CompiledSpec;
import dev.standin.engine.Engine;
import dev.standin.spec.Mark;
import dev.standin.spec.SpecException;
import dev.standin.spec.SpecProblem;
import java.io.File;
import java.io.IOException;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Every spec named on a command line, compiled before anything is written: each one's compiled form
 * or its problems, plus the problems that only show between specs (two specs writing the same
 * output file).
 */
final class SpecBatch {

    /**
     * One spec as named on the command line.
     *
     * @param name the display name: the path as given, '/'-separated
     * @param compiled the compiled spec, or {@code null} when it has problems or could not be read
     * @param problems its problems, each {@code FILE:LINE:COLUMN: message}
     * @param readFailure a one-line I/O failure message, or {@code null}
     */
    record Entry(String name, CompiledSpec compiled, List<SpecProblem> problems, String readFailure) {

        boolean ok() {
            return compiled != null && problems.isEmpty() && readFailure == null;
        }
    }

    private final List<Entry> entries;

    private SpecBatch(List<Entry> entries) {
        this.entries = List.copyOf(entries);
    }

    /**
     * Compiles every spec, then checks that no two of them write the same file.
     *
     * @param specs the SPEC operands as given
     */
    static SpecBatch compile(Engine engine, List<String> specs, Console console) {
        List<Entry> entries = new ArrayList<>();
        for (String spec : specs) {
            entries.add(compileOne(engine, spec, console));
        }
        return new SpecBatch(checkCollisions(entries));
    }

    private static Entry compileOne(Engine engine, String spec, Console console) {
        String name = File.separatorChar == '/' ? spec : spec.replace(File.separatorChar, '/');
        Path file;
        try {
            file = console.workingDir().resolve(spec);
        } catch (InvalidPathException e) {
            return new Entry(name, null, List.of(SpecProblem.at(Mark.startOf(name), "not a valid file path: " + e.getReason())), null);
        }
        try {
            return new Entry(name, engine.compile(file, name, ""), List.of(), null);
        } catch (SpecException e) {
            return new Entry(name, null, e.problems(), null);
        } catch (IOException e) {
            return new Entry(name, null, List.of(), "standin: cannot read " + name + ": " + IoErrors.reason(e, console));
        }
    }

    /**
     * Adds a problem to each spec whose data or report files are already written by an earlier spec
     * on the command line, or whose data file takes a name of an earlier spec's report family
     * ({@code <dataset>.report.*} in its folder) or the other way round, one line per earlier spec.
     * Paths are compared ignoring case, since on case-insensitive file systems (the defaults on macOS
     * and Windows) such files would overwrite each other.
     */
    private static List<Entry> checkCollisions(List<Entry> entries) {
        Map<String, Claim> claimed = new HashMap<>();
        List<Claim> reportFamilies = new ArrayList<>();
        List<Claim> dataFiles = new ArrayList<>();
        List<Entry> checked = new ArrayList<>();
        for (Entry e : entries) {
            if (!e.ok()) {
                checked.add(e);
                continue;
            }
            CompiledSpec c = e.compiled();
            Map<String, List<String>> clashes = new LinkedHashMap<>();
            boolean dataClashes = false;
            for (String file : c.outputFiles()) {
                Claim earlier = claimed.get(file.toLowerCase(Locale.ROOT));
                if (earlier != null) {
                    String as = earlier.path().equals(file) ? "" : " (as " + earlier.path() + ")";
                    clashes.computeIfAbsent(earlier.spec(), k -> new ArrayList<>()).add(file + as);
                    dataClashes |= file.equals(c.dataFile());
                }
            }
            String family = reportFamily(c);
            String data = c.dataFile().toLowerCase(Locale.ROOT);
            Mark fileMark = c.spec().output().fileMark() != null ? c.spec().output().fileMark() : Mark.startOf(e.name());
            List<SpecProblem> familyProblems = new ArrayList<>();
            for (Claim f : reportFamilies) {
                if (data.startsWith(f.path()) && !clashes.containsKey(f.spec())) {
                    familyProblems.add(SpecProblem.at(fileMark, "output file " + c.dataFile() + " takes a name of the report files "
                            + f.path() + "* of " + f.spec() + " (letter case ignored); give one of the two specs another dataset name"
                            + " or output file"));
                }
            }
            for (Claim d : dataFiles) {
                if (d.path().toLowerCase(Locale.ROOT).startsWith(family) && !clashes.containsKey(d.spec())) {
                    familyProblems.add(SpecProblem.at(Mark.startOf(e.name()), "the report files " + family + "* would take the"
                            + " name of " + d.path() + ", the output file of " + d.spec() + " (letter case ignored); give one of the"
                            + " two specs another dataset name or output file"));
                }
            }
            if (!familyProblems.isEmpty() && clashes.isEmpty()) {
                checked.add(new Entry(e.name(), null, familyProblems, null));
                continue;
            }
            if (clashes.isEmpty()) {
                for (String file : c.outputFiles()) {
                    claimed.put(file.toLowerCase(Locale.ROOT), new Claim(e.name(), file));
                }
                reportFamilies.add(new Claim(e.name(), family));
                dataFiles.add(new Claim(e.name(), c.dataFile()));
                checked.add(e);
                continue;
            }
            Mark at = dataClashes && c.spec().output().fileMark() != null ? c.spec().output().fileMark() : Mark.startOf(e.name());
            List<SpecProblem> problems = new ArrayList<>();
            for (Map.Entry<String, List<String>> clash : clashes.entrySet()) {
                List<String> files = clash.getValue();
                String what = files.size() == 1 ? "output file " + files.get(0) + " is" : "output files " + listed(files) + " are";
                String fix = clash.getKey().equals(e.name()) ? "the spec is named twice on the command line"
                        : "give one of the two specs another dataset name or output file";
                problems.add(SpecProblem.at(at, what + " also written by " + clash.getKey() + "; " + fix));
            }
            checked.add(new Entry(e.name(), null, problems, null));
        }
        return checked;
    }

    private record Claim(String spec, String path) {
    }

    /** The lower-case prefix of every name in a spec's report family: {@code dir/<dataset>.report.}. */
    private static String reportFamily(CompiledSpec c) {
        String report = c.reportFile();
        return report.substring(0, report.length() - "json".length()).toLowerCase(Locale.ROOT);
    }

    /** "a", "a and b", "a, b and c". */
    private static String listed(List<String> items) {
        if (items.size() <= 2) {
            return String.join(" and ", items);
        }
        return String.join(", ", items.subList(0, items.size() - 1)) + " and " + items.get(items.size() - 1);
    }

    List<Entry> entries() {
        return entries;
    }

    /** The compiled specs, in command-line order; complete only when {@link #exitCode()} is 0. */
    List<CompiledSpec> compiled() {
        return entries.stream().filter(Entry::ok).map(Entry::compiled).toList();
    }

    /** 0 when every spec compiled; 1 when one could not be read; otherwise 2 for spec problems. */
    int exitCode() {
        if (entries.stream().anyMatch(e -> e.readFailure() != null)) {
            return 1;
        }
        return entries.stream().allMatch(Entry::ok) ? 0 : 2;
    }

    /** Prints every problem and read failure, one a line, in command-line order. */
    /** Prints every compiled spec's warnings (a correlation repair within max-change, and the like) to stderr. */
    void printWarnings(Console console) {
        for (Entry e : entries) {
            if (e.compiled() != null) {
                e.compiled().warnings().forEach(console.err()::println);
            }
        }
    }

    void printFailures(Console console) {
        for (Entry e : entries) {
            for (SpecProblem p : e.problems()) {
                console.err().println(p);
            }
            if (e.readFailure() != null) {
                console.err().println(e.readFailure());
            }
        }
    }
}
