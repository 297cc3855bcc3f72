package dev.standin.output;

import java.io.IOException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.PosixFileAttributeView;
import java.nio.file.attribute.PosixFilePermissions;

/**
 * A file written under a temporary name in its final directory and moved into place atomically
 * when complete, so a reader never sees a half-written file under the final name. Until
 * {@link #commit()} the target is untouched; {@link #close()} without commit deletes the temporary.
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
