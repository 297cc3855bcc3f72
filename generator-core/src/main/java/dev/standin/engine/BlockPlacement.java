package dev.standin.engine;

import dev.standin.output.ByteText;
import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.atomic.AtomicInteger;

/**
 * Gives each block made by a worker its offset in the data file, which is known once every earlier
 * block's length is: the worker whose block is the first unplaced one places it and every later
 * block already made, and writes them (positional writes, so workers write at once). A block goes
 * back to the free blocks when both its writer and the in-order consumer have released it, in
 * either order; so a block is never handed out again while its bytes are still being written.
 *
 * @param <B> the blocks placed
 */
final class BlockPlacement<B extends BlockPlacement.Placed> {

    /** Where the bytes go: a positional write of a text at a position of the data file. */
    @FunctionalInterface
    interface Sink {
        void write(ByteText text, long position) throws IOException;
    }

    /** What placement needs of a block: its index in row order, its text, its offset and its holders. */
    static class Placed {
        long index;
        /** Where the block's text goes in the data file, once every earlier block's length is known. */
        long offset;
        final ByteText text;
        /** Set to 2 when handed out: the writer and the in-order consumer each release the block once. */
        final AtomicInteger holders = new AtomicInteger();

        Placed(ByteText text) {
            this.text = text;
        }
    }

    private final Sink sink;
    private final Placed[] waiting;
    private final BlockingQueue<B> free;
    private long nextIndex;
    private long nextOffset;

    /**
     * @param start    the offset of block 0 (the end of what precedes the rows)
     * @param inFlight how many blocks exist: indices in [first unplaced, first unplaced + inFlight) only
     *                 are ever made and not yet placed
     * @param free     where a block goes once both holders have released it
     */
    BlockPlacement(Sink sink, long start, int inFlight, BlockingQueue<B> free) {
        this.sink = sink;
        this.waiting = new Placed[inFlight];
        this.free = free;
        this.nextOffset = start;
    }

    /**
     * Called by the worker that made a block, with its holders set to 2. Blocks with index in
     * [nextIndex, nextIndex + inFlight) only are ever waiting (a block's task is submitted after the
     * block inFlight before it was consumed), so a ring of inFlight slots holds them.
     */
    void made(B b) throws IOException {
        List<B> ready = new ArrayList<>();
        synchronized (this) {
            waiting[(int) (b.index % waiting.length)] = b;
            if (b.index != nextIndex) {
                return;
            }
            int slot = (int) (nextIndex % waiting.length);
            for (Placed w = waiting[slot]; w != null && w.index == nextIndex; w = waiting[slot]) {
                waiting[slot] = null;
                w.offset = nextOffset;
                nextOffset += w.text.length();
                nextIndex++;
                @SuppressWarnings("unchecked") // only B are ever put in waiting
                B block = (B) w;
                ready.add(block);
                slot = (int) (nextIndex % waiting.length);
            }
        }
        for (B w : ready) {
            sink.write(w.text, w.offset);
            release(w);
        }
    }

    /** Releases a block; the second release returns it to the free blocks. */
    void release(B b) {
        if (b.holders.decrementAndGet() == 0) {
            free.add(b);
        }
    }

    /** The end of the placed blocks. */
    synchronized long end() {
        return nextOffset;
    }
}
