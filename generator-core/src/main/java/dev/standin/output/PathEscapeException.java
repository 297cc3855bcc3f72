package dev.standin.output;

import java.nio.file.FileSystemException;
import java.nio.file.Path;

/**
 * An output path that would lead outside the output directory through a symbolic link (or a
 * junction) in one of its folders. Nothing has been written when it is thrown. {@link #getFile()}
 * is the folder, {@link #getOtherFile()} where it really leads.
 */
public final class PathEscapeException extends FileSystemException {

    private static final long serialVersionUID = 1L;

    public PathEscapeException(Path folder, Path realTarget, Path realRoot) {
        super(folder.toString(), realTarget == null ? null : realTarget.toString(), realTarget == null
                ? "is a symbolic link to a folder that does not exist; the output directory is " + realRoot
                : "leads to " + realTarget + ", outside the output directory " + realRoot + "; refusing to write through it");
    }

    @Override
    public String getMessage() {
        return getFile() + ": " + getReason();
    }
}
