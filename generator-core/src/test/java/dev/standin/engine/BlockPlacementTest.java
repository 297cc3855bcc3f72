package dev.standin.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.standin.output.ByteText;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;
import org.junit.jupiter.api.Test;

/**
 * The hand-over of blocks between the workers that write them and the in-order consumer, one step at
 * a time on the test's thread (the multi-threaded runs are {@code ThreadsAndRowRangesTest}'s). The
 * expected offsets are running sums of the texts' lengths.
 */
class BlockPlacementTest {

    private static final class TestBlock extends BlockPlacement.Placed {
        TestBlock(long index, String text) {
            super(text(text));
            this.index = index;
            holders.set(2);
        }

        private static ByteText text(String s) {
            byte[] b = s.getBytes(StandardCharsets.US_ASCII);
            ByteText t = new ByteText(b.length);
            t.append(b);
            return t;
        }
    }

    /** One positional write as the sink saw it, with what the free blocks held at that moment. */
    private record Write(String text, long position, boolean blockWasFree, int holders) {
    }

    private final BlockingQueue<TestBlock> free = new ArrayBlockingQueue<>(8);
    private final List<Write> writes = new ArrayList<>();
    private final List<TestBlock> written = new ArrayList<>();

    private BlockPlacement<TestBlock> placement(long start, int inFlight) {
        return new BlockPlacement<>((text, position) -> {
            TestBlock b = written.get(writes.size());
            writes.add(new Write(new String(text.toByteArray(), StandardCharsets.US_ASCII), position,
                    free.contains(b), b.holders.get()));
        }, start, inFlight, free);
    }

    @Test
    void aBlockTheConsumerReleasedFirstIsFreedOnlyAfterItsBytesAreWritten() throws Exception {
        // the consumer digests a block's text as soon as it is made, which may be before the worker's
        // positional write returns; the block must not be handed out again before that write is done
        BlockPlacement<TestBlock> placement = placement(10, 4);
        TestBlock b = new TestBlock(0, "abc");
        written.add(b);
        placement.release(b);
        assertTrue(free.isEmpty(), "one release of two");
        placement.made(b);
        assertEquals(List.of(new Write("abc", 10, false, 1)), writes,
                "written at the start, while the worker still held it");
        assertSame(b, free.poll(), "free once written");
        assertTrue(free.isEmpty(), "and only once");
        assertEquals(13, placement.end());
    }

    @Test
    void aBlockTheWorkerReleasedFirstWaitsForTheConsumer() throws Exception {
        BlockPlacement<TestBlock> placement = placement(0, 4);
        TestBlock b = new TestBlock(0, "row\n");
        written.add(b);
        placement.made(b);
        assertEquals(List.of(new Write("row\n", 0, false, 2)), writes);
        assertTrue(free.isEmpty(), "the consumer has not digested it yet");
        placement.release(b);
        assertSame(b, free.poll());
    }

    @Test
    void blocksMadeOutOfOrderAreWrittenByTheWorkerOfTheFirstUnplacedOne() throws Exception {
        BlockPlacement<TestBlock> placement = placement(5, 4);
        TestBlock b0 = new TestBlock(0, "aa");
        TestBlock b1 = new TestBlock(1, "bbb");
        TestBlock b2 = new TestBlock(2, "c");
        TestBlock b3 = new TestBlock(3, "dddd");
        written.addAll(List.of(b0, b1, b2, b3));
        placement.made(b2);
        placement.made(b1);
        assertTrue(writes.isEmpty(), "block 0's length is not known yet");
        assertEquals(5, placement.end());
        placement.made(b0);
        assertEquals(List.of(new Write("aa", 5, false, 2), new Write("bbb", 7, false, 2), new Write("c", 10, false, 2)),
                writes);
        assertEquals(11, placement.end());
        placement.made(b3);
        assertEquals(new Write("dddd", 11, false, 2), writes.get(3));
        assertEquals(15, placement.end());
        for (TestBlock b : written) {
            assertEquals(1, b.holders.get(), "the writer released block " + b.index);
            assertFalse(free.contains(b));
        }
    }

    @Test
    void theRingOfSlotsIsReusedAcrossManyBlocks() throws Exception {
        // indices wrap around the ring of inFlight = 3 slots: block i and block i + 3 share a slot
        BlockPlacement<TestBlock> placement = placement(0, 3);
        long expected = 0;
        for (int round = 0; round < 5; round++) {
            TestBlock[] made = new TestBlock[3];
            for (int i = 0; i < 3; i++) {
                made[i] = new TestBlock(3L * round + i, "x".repeat(round + i + 1));
                written.add(made[i]);
            }
            placement.made(made[2]);
            placement.made(made[0]);
            placement.made(made[1]);
            for (TestBlock b : made) {
                assertEquals(expected, b.offset, "offset of block " + b.index);
                expected += b.text.length();
                placement.release(b);
                assertSame(b, free.poll());
            }
        }
        assertEquals(expected, placement.end());
        assertEquals(15, writes.size());
    }
}
