package dev.standin.engine;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.concurrent.TimeUnit;

/** A child JVM running {@link OutputChildMain} on this JVM's classpath, its output lines collected as they come. */
final class ChildJvm implements AutoCloseable {

    private final Process process;
    private final BlockingQueue<String> lines = new LinkedBlockingQueue<>();
    private final List<String> all = java.util.Collections.synchronizedList(new ArrayList<>());
    private final Thread reader;

    private ChildJvm(Process process) {
        this.process = process;
        this.reader = new Thread(() -> {
            try (BufferedReader r = new BufferedReader(new InputStreamReader(process.getInputStream(), StandardCharsets.UTF_8))) {
                for (String line; (line = r.readLine()) != null; ) {
                    all.add(line);
                    lines.add(line);
                }
            } catch (IOException e) {
                // the child was killed
            }
        });
        reader.setDaemon(true);
        reader.start();
    }

    /** Starts {@code OutputChildMain MODE OUT WAIT_MS ROWS SPEC...}. */
    static ChildJvm start(String mode, Path out, long waitMillis, String rows, Path... specs) throws IOException {
        List<String> command = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-Xshare:auto", "-XX:TieredStopAtLevel=1", "-cp", System.getProperty("java.class.path"),
                OutputChildMain.class.getName(), mode, out.toString(), Long.toString(waitMillis), rows));
        for (Path s : specs) {
            command.add(s.toString());
        }
        return new ChildJvm(new ProcessBuilder(command).redirectErrorStream(true).start());
    }

    /** Waits for a line starting with {@code prefix} (a hang guard of {@code seconds}, not a timing check). */
    String await(String prefix, long seconds) throws InterruptedException {
        long end = System.nanoTime() + TimeUnit.SECONDS.toNanos(seconds);
        while (System.nanoTime() < end) {
            String line = lines.poll(100, TimeUnit.MILLISECONDS);
            if (line != null && line.startsWith(prefix)) {
                return line;
            }
            if (line == null && !process.isAlive() && lines.isEmpty() && !reader.isAlive()) {
                break;
            }
        }
        throw new AssertionError("child never printed '" + prefix + "'; output so far: " + output());
    }

    /** Sends one line to the child's standard input. */
    void tell(String line) throws IOException {
        Writer w = new OutputStreamWriter(process.getOutputStream(), StandardCharsets.UTF_8);
        w.write(line + "\n");
        w.flush();
    }

    /** Waits for the child to exit (hang guard) and returns its exit code. */
    int exit(long seconds) throws InterruptedException {
        if (!process.waitFor(seconds, TimeUnit.SECONDS)) {
            process.destroyForcibly();
            throw new AssertionError("child did not finish; output: " + output());
        }
        reader.join(TimeUnit.SECONDS.toMillis(10));
        return process.exitValue();
    }

    /** SIGKILL on POSIX ({@link Process#destroyForcibly()}), then waits until it is gone. */
    void kill() throws InterruptedException {
        process.destroyForcibly();
        process.waitFor(60, TimeUnit.SECONDS);
    }

    String output() {
        synchronized (all) {
            return String.join("\n", all);
        }
    }

    @Override
    public void close() {
        if (process.isAlive()) {
            process.destroyForcibly();
        }
    }
}
