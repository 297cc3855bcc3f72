package dev.standin.engine;

import dev.standin.output.PathEscapeException;
import dev.standin.spec.Mark;
import dev.standin.spec.Spec;
import dev.standin.spec.SpecException;
import dev.standin.spec.SpecProblem;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

/**
 * The rules that keep a spec's files inside the output directory and apart from each other.
 *
 * <p>When compiling (nothing on disk is looked at): the spec parser already limits {@code
 * output.file} and dataset names to relative paths of plain names (no {@code ..}, no absolute path,
 * no drive letter, no backslash, no Windows device name); here the data file must not take a name
 * of the report family {@code <dataset>.report.*} in its folder, compared ignoring letter case
 * because macOS and Windows file systems do by default, and the output sub-folder must be relative.
 *
 * <p>When generating, before anything is written: each folder on the way from the output directory
 * to a file that already exists must really be inside the output directory once symbolic links are
 * resolved ({@link Path#toRealPath}). A link in the file's own place is not followed: the finished
 * file is moved over it, replacing the link.
 */
final class OutputPaths {

    /** The report family's infix: every {@code <dataset>.report.*} name beside the data file is reserved. */
    static final String REPORT_INFIX = ".report.";

    private OutputPaths() {
    }

    /** Checks the output sub-folder given by a caller: relative, '/'-separated names, no '.' or '..'. */
    static String subfolder(String displayName, String outputSubdir) throws SpecException {
        if (outputSubdir == null || outputSubdir.isEmpty()) {
            return "";
        }
        String t = outputSubdir.replace('\\', '/');
        while (t.endsWith("/")) {
            t = t.substring(0, t.length() - 1);
        }
        boolean ok = !t.isEmpty() && !t.startsWith("/") && !(t.length() >= 2 && t.charAt(1) == ':');
        for (String part : t.split("/", -1)) {
            ok &= !part.isEmpty() && !part.equals(".") && !part.equals("..");
        }
        if (!ok) {
            throw new SpecException(SpecProblem.at(Mark.startOf(displayName),
                    "output folder must be a relative path inside the output directory: " + outputSubdir));
        }
        return t;
    }

    /** Refuses a data file whose name is one of the report family's, ignoring letter case. */
    static void checkNotReport(Spec spec, String displayName, String dataPath) throws SpecException {
        String name = dataPath.substring(dataPath.lastIndexOf('/') + 1).toLowerCase(Locale.ROOT);
        String reserved = (spec.dataset() + REPORT_INFIX).toLowerCase(Locale.ROOT);
        if (name.startsWith(reserved)) {
            Mark at = spec.output().fileMark() != null ? spec.output().fileMark() : Mark.startOf(displayName);
            throw new SpecException(SpecProblem.at(at, "output file " + dataPath.substring(dataPath.lastIndexOf('/') + 1)
                    + " would clash with the"
                    + " report files (" + spec.dataset() + REPORT_INFIX + "*, letter case ignored); choose another name"));
        }
    }

    /**
     * Checks, before anything is written, that every existing folder between {@code root} and each of
     * the files leads inside {@code root} once links are resolved.
     *
     * @param root the output directory (it may not exist yet)
     * @param files the files, relative to root, '/'-separated
     * @throws PathEscapeException naming the first folder that leads outside
     */
    static void checkInside(Path root, List<String> files) throws IOException {
        if (!Files.exists(root)) {
            return;
        }
        Path realRoot = root.toRealPath();
        for (String file : files) {
            String[] parts = file.split("/");
            Path at = root;
            for (int i = 0; i < parts.length - 1; i++) {
                at = at.resolve(parts[i]);
                if (!Files.exists(at, LinkOption.NOFOLLOW_LINKS)) {
                    break;
                }
                Path real;
                try {
                    real = at.toRealPath();
                } catch (NoSuchFileException e) {
                    throw new PathEscapeException(at, null, realRoot);
                }
                if (!real.startsWith(realRoot)) {
                    throw new PathEscapeException(at, real, realRoot);
                }
            }
        }
    }
}
