package dev.standin.random;

/**
 * The Philox4x32-10 counter-based generator: a keyed bijection of a 128-bit counter, so the random
 * bits for any (key, counter) are computed directly, with no state and no sequence to replay.
 *
 * <p>Method: J. K. Salmon, M. A. Moraes, R. O. Dror and D. E. Shaw, "Parallel random numbers: as
 * easy as 1, 2, 3", Proc. SC'11 (2011), section 3.3; constants as in the authors' Random123 library.
 * The implementation is plain 32-bit integer arithmetic, so its output is identical on every JVM.
 * Checked against Random123's published known-answer vectors ({@code kat_vectors}).
 */
public final class Philox4x32 {

    // package-private: RandomStreams.Lanes runs the same rounds lane by lane
    static final long M0 = 0xD2511F53L;
    static final long M1 = 0xCD9E8D57L;
    static final int W0 = 0x9E3779B9;
    static final int W1 = 0xBB67AE85;
    static final int ROUNDS = 10;

    private Philox4x32() {
    }

    /**
     * Encrypts one counter block.
     *
     * @param counter four 32-bit counter words; not modified
     * @param key0 first key word
     * @param key1 second key word
     * @param out receives the four output words
     */
    public static void block(int[] counter, int key0, int key1, int[] out) {
        int c0 = counter[0];
        int c1 = counter[1];
        int c2 = counter[2];
        int c3 = counter[3];
        int k0 = key0;
        int k1 = key1;
        for (int round = 0; round < ROUNDS; round++) {
            if (round > 0) {
                k0 += W0;
                k1 += W1;
            }
            long p0 = M0 * (c0 & 0xFFFFFFFFL);
            long p1 = M1 * (c2 & 0xFFFFFFFFL);
            int hi0 = (int) (p0 >>> 32);
            int lo0 = (int) p0;
            int hi1 = (int) (p1 >>> 32);
            int lo1 = (int) p1;
            c0 = hi1 ^ c1 ^ k0;
            c1 = lo1;
            c2 = hi0 ^ c3 ^ k1;
            c3 = lo0;
        }
        out[0] = c0;
        out[1] = c1;
        out[2] = c2;
        out[3] = c3;
    }

    /**
     * The first 64 output bits of the block for counter (lo64(a), hi64(a), lo64(b), hi64(b)):
     * output words 1 and 0 as the high and low halves.
     */
    public static long bits64(long key, long a, long b) {
        int c0 = (int) a;
        int c1 = (int) (a >>> 32);
        int c2 = (int) b;
        int c3 = (int) (b >>> 32);
        int k0 = (int) key;
        int k1 = (int) (key >>> 32);
        for (int round = 0; round < ROUNDS; round++) {
            if (round > 0) {
                k0 += W0;
                k1 += W1;
            }
            long p0 = M0 * (c0 & 0xFFFFFFFFL);
            long p1 = M1 * (c2 & 0xFFFFFFFFL);
            int n0 = (int) (p1 >>> 32) ^ c1 ^ k0;
            int n2 = (int) (p0 >>> 32) ^ c3 ^ k1;
            c1 = (int) p1;
            c3 = (int) p0;
            c0 = n0;
            c2 = n2;
        }
        return ((long) c1 << 32) | (c0 & 0xFFFFFFFFL);
    }
}
