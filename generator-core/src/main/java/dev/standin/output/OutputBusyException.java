package dev.standin.output;

import java.nio.file.FileSystemException;
import java.nio.file.Path;
import java.time.Duration;

/**
 * Another Standin run held an output directory's {@link DirectoryLock} for longer than this run
 * would wait. {@link #getFile()} is the lock file; the message reads
 * {@code out/.standin.lock: held by another Standin run; gave up after 300 s}.
 */
public final class OutputBusyException extends FileSystemException {

    private static final long serialVersionUID = 1L;

    OutputBusyException(Path lockFile, Duration waited) {
        super(lockFile.toString(), null, "held by another Standin run; gave up after " + seconds(waited));
    }

    private static String seconds(Duration d) {
        long ms = d.toMillis();
        return ms % 1000 == 0 ? ms / 1000 + " s" : ms + " ms";
    }
}
