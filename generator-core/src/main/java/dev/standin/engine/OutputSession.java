package dev.standin.engine;

import dev.standin.output.AtomicFile;
import dev.standin.output.DirectoryLock;
import java.io.IOException;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.function.Consumer;
import java.util.function.LongConsumer;

/**
 * One run's hold on an output directory: its {@link DirectoryLock} (so concurrent runs take turns),
 * the path checks made before anything is written, the removal of temporaries left by killed runs,
 * and the generation of each compiled spec. Open it with {@link Engine#openOutput}, generate every
 * spec of the run, then close it; do not call {@link Engine#generate} on the same directory while
 * it is open (that would wait for this session's lock).
 */
public final class OutputSession implements AutoCloseable {

    private final Path root;
    private final DirectoryLock lock;
    private final Instant started;

    private OutputSession(Path root, DirectoryLock lock, Instant started) {
        this.root = root;
        this.lock = lock;
        this.started = started;
    }

    static OutputSession open(Path root, Duration wait, Consumer<String> waiting) throws IOException {
        Instant started = Instant.now();
        return new OutputSession(root, DirectoryLock.acquire(root, wait, waiting), started);
    }

    /** The output directory. */
    public Path root() {
        return root;
    }

    /**
     * Checks every spec's output paths against the directory as it is now (see {@link OutputPaths}),
     * so a batch stops before its first file when any later one could not be written safely.
     */
    public void check(List<CompiledSpec> compiled) throws IOException {
        for (CompiledSpec c : compiled) {
            OutputPaths.checkInside(root, c.outputFiles());
        }
    }

    /**
     * Generates one compiled spec: checks its paths, removes its files' temporaries left by killed
     * runs (older than this session), then writes its data file and reports, each to a temporary
     * file moved into place when complete.
     *
     * @param rowsWritten progress callback, or null (see {@link Engine#generate(CompiledSpec, Path, LongConsumer)})
     */
    public GenerationResult generate(CompiledSpec compiled, LongConsumer rowsWritten) throws IOException {
        OutputPaths.checkInside(root, compiled.outputFiles());
        for (String file : compiled.outputFiles()) {
            AtomicFile.removeStale(root.resolve(file), started);
        }
        return DatasetWriter.write(compiled, root, rowsWritten);
    }

    /** Releases the directory (and removes its lock file). */
    @Override
    public void close() throws IOException {
        lock.close();
    }
}
