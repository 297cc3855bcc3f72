package dev.standin.random;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * Philox4x32-10 against the known-answer vectors published with the Random123 library by D. E. Shaw
 * Research (file {@code kat_vectors}, lines {@code philox4x32 10 <ctr0..3> <key0..1> <out0..3>}; the
 * same three vectors are checked by Random123's own known-answer test). Method: Salmon, Moraes, Dror
 * and Shaw, "Parallel random numbers: as easy as 1, 2, 3", SC'11 (2011).
 */
class Philox4x32Test {

    private static int[] block(int[] counter, int key0, int key1) {
        int[] out = new int[4];
        Philox4x32.block(counter, key0, key1, out);
        return out;
    }

    @Test
    void zeroCounterAndKey() {
        // Random123 kat_vectors: philox4x32 10, ctr 0 0 0 0, key 0 0 -> 6627e8d5 e169c58d bc57ac4c 9b00dbd8
        assertArrayEquals(new int[] {0x6627e8d5, 0xe169c58d, 0xbc57ac4c, 0x9b00dbd8},
                block(new int[] {0, 0, 0, 0}, 0, 0));
    }

    @Test
    void allOnesCounterAndKey() {
        // Random123 kat_vectors: philox4x32 10, ctr ffffffff x4, key ffffffff ffffffff
        // -> 408f276d 41c83b0e a20bc7c6 6d5451fd
        assertArrayEquals(new int[] {0x408f276d, 0x41c83b0e, 0xa20bc7c6, 0x6d5451fd},
                block(new int[] {-1, -1, -1, -1}, -1, -1));
    }

    @Test
    void piDigitsCounterAndKey() {
        // Random123 kat_vectors: philox4x32 10, ctr 243f6a88 85a308d3 13198a2e 03707344 (digits of pi),
        // key a4093822 299f31d0 -> d16cfe09 94fdcceb 5001e420 24126ea1
        assertArrayEquals(new int[] {0xd16cfe09, 0x94fdcceb, 0x5001e420, 0x24126ea1},
                block(new int[] {0x243f6a88, 0x85a308d3, 0x13198a2e, 0x03707344}, 0xa4093822, 0x299f31d0));
    }

    @Test
    void blockDoesNotModifyItsCounter() {
        int[] counter = {0x243f6a88, 0x85a308d3, 0x13198a2e, 0x03707344};
        block(counter, 0xa4093822, 0x299f31d0);
        assertArrayEquals(new int[] {0x243f6a88, 0x85a308d3, 0x13198a2e, 0x03707344}, counter);
    }

    @Test
    void bits64OfTheKnownAnswerVectors() {
        // words 1:0 of the pi-digits vector above: 94fdcceb d16cfe09 (Random123 kat_vectors)
        long a = (0x243f6a88L & 0xFFFFFFFFL) | ((long) 0x85a308d3 << 32);
        long b = (0x13198a2eL & 0xFFFFFFFFL) | ((long) 0x03707344 << 32);
        long key = (0xa4093822L & 0xFFFFFFFFL) | ((long) 0x299f31d0 << 32);
        assertEquals(0x94fdccebd16cfe09L, Philox4x32.bits64(key, a, b));
        // words 1:0 of the zero vector: e169c58d 6627e8d5 (Random123 kat_vectors)
        assertEquals(0xe169c58d6627e8d5L, Philox4x32.bits64(0L, 0L, 0L));
        // words 1:0 of the all-ones vector: 41c83b0e 408f276d (Random123 kat_vectors)
        assertEquals(0x41c83b0e408f276dL, Philox4x32.bits64(-1L, -1L, -1L));
    }

    @Test
    void bits64IsWordsOneAndZeroOfTheBlock() {
        // bits64 is a second, unrolled implementation; it must equal block() for the counter
        // (lo(a), hi(a), lo(b), hi(b)) and key (lo(key), hi(key)), as its javadoc states.
        SplittableRandom rnd = new SplittableRandom(20240611L);
        for (int n = 0; n < 20_000; n++) {
            long key = rnd.nextLong();
            long a = n < 10 ? n : rnd.nextLong();
            long b = n < 10 ? -n : rnd.nextLong();
            int[] out = block(new int[] {(int) a, (int) (a >>> 32), (int) b, (int) (b >>> 32)},
                    (int) key, (int) (key >>> 32));
            long expected = ((long) out[1] << 32) | (out[0] & 0xFFFFFFFFL);
            assertEquals(expected, Philox4x32.bits64(key, a, b), () -> "key " + key + " a " + a + " b " + b);
        }
    }
}
