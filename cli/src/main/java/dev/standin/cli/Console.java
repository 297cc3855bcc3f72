package dev.standin.cli;

import java.io.PrintStream;
import java.nio.file.Path;

/**
 * Where a command writes and which folder relative paths are resolved against. Passed in, never
 * taken from {@code System}, so commands run in-process in tests and in parallel.
 *
 * @param out results (summaries, {@code SPEC: ok}, help)
 * @param err problems, one a line
 * @param workingDir the folder that relative spec and output paths are resolved against (absolute)
 */
record Console(PrintStream out, PrintStream err, Path workingDir) {

    /**
     * A path for a message: relative to the working folder when it lies inside it ('/'-separated),
     * otherwise as it is.
     */
    String show(Path path) {
        Path abs = path.toAbsolutePath().normalize();
        Path base = workingDir.toAbsolutePath().normalize();
        if (abs.startsWith(base) && !abs.equals(base)) {
            return base.relativize(abs).toString().replace(java.io.File.separatorChar, '/');
        }
        return abs.toString();
    }
}
