package dev.standin.output;

import java.io.IOException;
import java.io.InterruptedIOException;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.BasicFileAttributes;
import java.time.Duration;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.function.Consumer;

/**
 * An exclusive lock on an output directory, held by one Standin run at a time, so that two runs
 * (two processes, or two builds in one JVM) writing into the same directory take turns instead of
 * interleaving: without it each file would still be complete (see {@link AtomicFile}), but a data
 * file of one run could end up beside the report of the other, and a run could not tell a killed
 * run's leftover temporaries from a live run's.
 *
 * <p>Between processes the lock is an operating-system lock ({@link FileChannel#tryLock(long, long,
 * boolean)}: POSIX {@code fcntl}, Windows {@code LockFileEx}) on the file {@value #FILE_NAME} in the
 * directory. The operating system releases it when the process dies, however it dies, so a killed
 * run never leaves the directory locked. The lock covers one byte far past the end of the file, so
 * the file stays readable on Windows, whose locks are mandatory.
 *
 * <p>The holder deletes the file before releasing it, so a finished run leaves nothing behind. A
 * waiter may therefore lock a file that has just been deleted; so after locking it checks that the
 * path still leads to the same file, comparing {@link BasicFileAttributes#fileKey()} (device and
 * inode) read before opening and after locking, without opening the file again: on POSIX, closing
 * any descriptor of a file drops every {@code fcntl} lock the process holds on it, which is also
 * why runs inside one JVM first take turns on an in-memory table of held directories and only
 * then touch the file. (That table is this project's one piece of static mutable state: a
 * concurrent map whose only purpose is to keep parallel builds ({@code mvn -T}) of one JVM apart.)
 * Where the file system has no file keys (Windows) the file is not deleted, and stays, empty.
 *
 * <p>Operating-system locks may not work on some network file systems (NFS without a lock
 * manager); there two runs are not kept apart, though each file is still written atomically.
 */
public final class DirectoryLock implements AutoCloseable {

    /** The lock file's name in the locked directory. */
    public static final String FILE_NAME = ".standin.lock";

    /** How long a run waits for another by default: 5 minutes. */
    public static final Duration DEFAULT_WAIT = Duration.ofMinutes(5);

    private static final long LOCK_POSITION = Long.MAX_VALUE - 1;
    private static final long POLL_MILLIS = 50;

    /** The directories (real paths) locked by some run of this JVM. */
    private static final Set<Path> HELD = ConcurrentHashMap.newKeySet();

    private final Path file;
    private final Path key;
    private final FileChannel channel;
    private final FileLock lock;
    private final boolean delete;

    private DirectoryLock(Path file, Path key, FileChannel channel, FileLock lock, boolean delete) {
        this.file = file;
        this.key = key;
        this.channel = channel;
        this.lock = lock;
        this.delete = delete;
    }

    /**
     * Locks {@code directory}, creating it if needed, waiting at most {@code wait} for another run.
     *
     * @param waiting told once, with a line such as {@code waiting for out/.standin.lock (held by
     *     another Standin run)}, when the lock is held by another run; may be null
     * @throws OutputBusyException when another run still holds it after {@code wait}
     * @throws IOException when the directory or the lock file cannot be created or locked
     */
    public static DirectoryLock acquire(Path directory, Duration wait, Consumer<String> waiting) throws IOException {
        Files.createDirectories(directory);
        Path file = directory.resolve(FILE_NAME);
        Path key = directory.toRealPath();
        Waiter waiter = new Waiter(file, wait, waiting);
        while (!HELD.add(key)) {
            waiter.pause();
        }
        try {
            while (true) {
                DirectoryLock lock = tryOnce(file, key);
                if (lock != null) {
                    return lock;
                }
                waiter.pause();
            }
        } catch (IOException | RuntimeException | Error e) {
            HELD.remove(key);
            throw e;
        }
    }

    /** One attempt: the lock, or null when another process holds it. */
    private static DirectoryLock tryOnce(Path file, Path key) throws IOException {
        while (true) {
            Object before = fileKey(file);
            FileChannel channel = open(file);
            if (channel == null) {
                return null;
            }
            FileLock lock;
            try {
                lock = channel.tryLock(LOCK_POSITION, 1, false);
            } catch (IOException | RuntimeException e) {
                channel.close();
                throw e;
            }
            if (lock == null) {
                channel.close();
                return null;
            }
            Object after = fileKey(file);
            if (before != null && before.equals(after)) {
                return new DirectoryLock(file, key, channel, lock, true);
            }
            if (before == null && after == null && Files.exists(file, LinkOption.NOFOLLOW_LINKS)) {
                // no file keys here (Windows): the file is never deleted, so the one locked is the one at the path
                return new DirectoryLock(file, key, channel, lock, false);
            }
            // the file was missing before opening, or was replaced meanwhile: lock the one at the path now
            lock.release();
            channel.close();
        }
    }

    private static Object fileKey(Path file) throws IOException {
        try {
            return Files.readAttributes(file, BasicFileAttributes.class, LinkOption.NOFOLLOW_LINKS).fileKey();
        } catch (NoSuchFileException e) {
            return null;
        }
    }

    /** Opens the lock file without following a link in its place; null while a deleted one lingers (Windows). */
    private static FileChannel open(Path file) throws IOException {
        if (Files.isSymbolicLink(file)) {
            throw new java.nio.file.FileSystemException(file.toString(), null,
                    "is a symbolic link; the lock file must be a plain file (remove the link)");
        }
        try {
            return FileChannel.open(file, StandardOpenOption.CREATE, StandardOpenOption.WRITE, LinkOption.NOFOLLOW_LINKS);
        } catch (AccessDeniedException e) {
            if (Files.exists(file, LinkOption.NOFOLLOW_LINKS)) {
                return null;
            }
            throw e;
        }
    }

    /** Tells the caller once that it waits, sleeps between attempts, and gives up after the wait. */
    private static final class Waiter {
        private final Path file;
        private final long start = System.nanoTime();
        private final Duration wait;
        private final Consumer<String> waiting;
        private boolean told;

        Waiter(Path file, Duration wait, Consumer<String> waiting) {
            this.file = file;
            this.wait = wait;
            this.waiting = waiting;
        }

        void pause() throws IOException {
            long waited = System.nanoTime() - start;
            long limit = wait.toNanos();
            if (!told && waiting != null) {
                waiting.accept("waiting for " + file + " (held by another Standin run)");
                told = true;
            }
            if (waited >= limit) {
                throw new OutputBusyException(file, wait);
            }
            try {
                Thread.sleep(Math.max(1, Math.min(POLL_MILLIS, (limit - waited) / 1_000_000)));
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new InterruptedIOException("interrupted while waiting for " + file);
            }
        }
    }

    /** The lock file. */
    public Path file() {
        return file;
    }

    /** Deletes the lock file (where file keys exist) and releases the lock. */
    @Override
    public void close() throws IOException {
        try {
            if (delete) {
                Files.deleteIfExists(file);
            }
        } finally {
            try {
                lock.release();
            } finally {
                try {
                    channel.close();
                } finally {
                    HELD.remove(key);
                }
            }
        }
    }
}
