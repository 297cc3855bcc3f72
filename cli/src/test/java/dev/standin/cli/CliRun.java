package dev.standin.cli;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

/** One in-process run of {@link Main#run}: its exit code and what it printed. */
record CliRun(int exit, String out, String err) {

    static CliRun in(Path workingDir, String... args) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int exit;
        try (PrintStream o = new PrintStream(out, true, StandardCharsets.UTF_8);
             PrintStream e = new PrintStream(err, true, StandardCharsets.UTF_8)) {
            exit = Main.run(args, o, e, workingDir);
        }
        return new CliRun(exit, out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8));
    }

    List<String> errLines() {
        return err.lines().toList();
    }

    /** Every regular file under a directory, relative and sorted; empty when it does not exist. */
    static List<String> filesUnder(Path dir) throws IOException {
        if (!Files.exists(dir)) {
            return List.of();
        }
        try (Stream<Path> s = Files.walk(dir)) {
            return s.filter(Files::isRegularFile).map(p -> dir.relativize(p).toString().replace('\\', '/')).sorted().toList();
        }
    }

    /** Writes a spec file under the working directory and returns its path. */
    static Path spec(Path workingDir, String name, String text) throws IOException {
        Path p = workingDir.resolve(name);
        Files.createDirectories(p.toAbsolutePath().getParent());
        Files.writeString(p, text, StandardCharsets.UTF_8);
        return p;
    }

    /** A small valid spec (an invented greenhouse); {@code dataset} names it. */
    static String greenhouse(String dataset) {
        return "dataset: " + dataset + "\n"
                + "rows: 50\n"
                + "seed: 20261201\n"
                + "columns:\n"
                + "  reading_id:   {dist: sequence, start: 100, step: 5}\n"
                + "  air_temp_c:   {dist: normal, mean: 24.0, sd: 2.5, decimals: 1}\n"
                + "  humidity_pct: {dist: uniform, min: 40, max: 90, decimals: 0}\n"
                + "correlation:\n"
                + "  measure: pearson\n"
                + "  pairs:\n"
                + "    air_temp_c ~ humidity_pct: -0.3\n"
                + "output:\n"
                + "  format: csv\n";
    }

    /** Fails if the text looks like a Java stack trace or exception dump. */
    static boolean looksLikeStackTrace(String text) {
        return text.contains("\tat ") || text.contains("Exception") || text.contains("Error:");
    }
}
