package dev.standin.output;

import java.io.IOException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.PosixFileAttributeView;
import java.nio.file.attribute.PosixFilePermissions;
import java.nio.file.DirectoryStream;
import java.nio.file.LinkOption;
import java.nio.file.NoSuchFileException;
import java.nio.file.attribute.BasicFileAttributes;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;

/**
 * A file written under a temporary name in its final directory and moved into place atomically
 * when complete, so a reader never sees a half-written file under the final name. Until
 * {@link #commit()} the target is untouched; {@link #close()} without commit deletes the temporary.
 *
 * <p>The temporary is named {@code .<target name>.<digits>.partial}. A process killed while writing
 * (SIGKILL, power loss) cannot delete it, so it stays beside the untouched target; the next run that
 * writes the same target removes such leftovers with {@link #removeStale}, under the output
 * directory's lock (see {@link DirectoryLock}), so it never removes the temporary of a live run.
 */
public final class AtomicFile implements AutoCloseable {

    private final Path target;
    private final Path temp;
    private boolean committed;

    private AtomicFile(Path target, Path temp) {
        this.target = target;
        this.temp = temp;
    }

    /** Creates the directory if needed and a temporary file beside {@code target}. */
    public static AtomicFile create(Path target) throws IOException {
        Path dir = target.toAbsolutePath().getParent();
        Files.createDirectories(dir);
        Path temp = Files.createTempFile(dir, "." + target.getFileName() + ".", ".partial");
        // createTempFile makes an owner-only file; fixtures are ordinary files that others may read
        if (Files.getFileStore(temp).supportsFileAttributeView(PosixFileAttributeView.class)) {
            Files.setPosixFilePermissions(temp, PosixFilePermissions.fromString("rw-r--r--"));
        }
        return new AtomicFile(target, temp);
    }

    /**
     * Deletes the leftover temporaries of {@code target} ({@code .<name>.<digits>.partial} in its
     * directory) last modified before {@code before}. Only call it while holding the directory's
     * {@link DirectoryLock}, which no live run writing there can be without.
     *
     * @return the files deleted
     */
    public static List<Path> removeStale(Path target, Instant before) throws IOException {
        Path dir = target.toAbsolutePath().getParent();
        String prefix = "." + target.getFileName() + ".";
        List<Path> removed = new ArrayList<>();
        if (!Files.isDirectory(dir, LinkOption.NOFOLLOW_LINKS)) {
            return removed;
        }
        try (DirectoryStream<Path> entries = Files.newDirectoryStream(dir, p -> isTemporary(p.getFileName().toString(), prefix))) {
            for (Path p : entries) {
                try {
                    BasicFileAttributes a = Files.readAttributes(p, BasicFileAttributes.class, LinkOption.NOFOLLOW_LINKS);
                    if (a.isRegularFile() && a.lastModifiedTime().toInstant().isBefore(before)) {
                        Files.delete(p);
                        removed.add(p);
                    }
                } catch (NoSuchFileException e) {
                    // already gone
                }
            }
        }
        return removed;
    }

    private static boolean isTemporary(String name, String prefix) {
        if (!name.startsWith(prefix) || !name.endsWith(".partial")) {
            return false;
        }
        String middle = name.substring(prefix.length(), name.length() - ".partial".length());
        return !middle.isEmpty() && middle.chars().allMatch(c -> c >= '0' && c <= '9');
    }

    /** The temporary file to write. */
    public Path temp() {
        return temp;
    }

    public Path target() {
        return target;
    }

    /** Moves the temporary file onto the target, replacing any previous file. */
    public void commit() throws IOException {
        try {
            Files.move(temp, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(temp, target, StandardCopyOption.REPLACE_EXISTING);
        }
        committed = true;
    }

    @Override
    public void close() throws IOException {
        if (!committed) {
            Files.deleteIfExists(temp);
        }
    }
}
