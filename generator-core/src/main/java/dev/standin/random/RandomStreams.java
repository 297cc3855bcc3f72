package dev.standin.random;

import java.nio.charset.StandardCharsets;

/**
 * The random contract: every uniform Standin draws is a pure function of (seed, stream, row).
 *
 * <p>A stream is named by the column's name and a purpose ({@link Purpose#VALUE} for the value,
 * {@link Purpose#MISSING} for the missing-value draw), hashed to 64 bits with FNV-1a (Fowler, Noll
 * and Vo; IETF draft-eastlake-fnv) followed by the SplitMix64 finaliser (Steele, Lea and Flood,
 * "Fast splittable pseudorandom number generators", OOPSLA 2014) so that similar names give
 * unrelated streams. The Philox4x32-10 block for key = seed and counter = (row, stream) gives 64
 * bits, of which the top 52 make a uniform in the open interval (0, 1): {@code (bits >>> 12) + 0.5}
 * times 2<sup>-52</sup>, so the values run from 2<sup>-53</sup> to 1 − 2<sup>-53</sup>, all exactly
 * representable (with 53 bits, (2<sup>53</sup> − 1 + 0.5)·2<sup>-53</sup> would round to 1.0). No state is carried from row to row, so any row range is generated
 * exactly as in a whole run, and a column's values do not depend on other columns.
 */
public final class RandomStreams {

    /** What a stream is used for; each purpose of a column has its own stream. */
    public enum Purpose {
        VALUE(1),
        MISSING(2);

        final long code;

        Purpose(long code) {
            this.code = code;
        }
    }

    private static final double TWO_POW_M52 = 0x1.0p-52;

    private RandomStreams() {
    }

    /** The stream identifier of a column's purpose. */
    public static long streamId(String columnName, Purpose purpose) {
        long h = 0xcbf29ce484222325L;
        for (byte b : columnName.getBytes(StandardCharsets.UTF_8)) {
            h ^= (b & 0xFF);
            h *= 0x100000001b3L;
        }
        h ^= purpose.code;
        h *= 0x100000001b3L;
        return mix64(h);
    }

    /** The SplitMix64 finaliser (Steele, Lea and Flood 2014, "mix64"). */
    public static long mix64(long z) {
        z = (z ^ (z >>> 30)) * 0xbf58476d1ce4e5b9L;
        z = (z ^ (z >>> 27)) * 0x94d049bb133111ebL;
        return z ^ (z >>> 31);
    }

    /** The uniform in (0, 1) for (seed, stream, row). */
    public static double uniform(long seed, long stream, long row) {
        long bits = Philox4x32.bits64(seed, row, stream);
        return ((bits >>> 12) + 0.5) * TWO_POW_M52;
    }

    /** {@link #uniform} of rows {@code from .. from + n − 1} into {@code out}; see {@link Lanes}. */
    public static void uniforms(long seed, long stream, long from, double[] out, int n) {
        uniforms(seed, stream, from, out, n, new Lanes());
    }

    /**
     * {@link #uniform} of rows {@code from .. from + n − 1} into {@code out}, the same bits, with a
     * caller's {@link Lanes} (one per thread).
     */
    public static void uniforms(long seed, long stream, long from, double[] out, int n, Lanes lanes) {
        for (int start = 0; start < n; start += Lanes.ROWS) {
            lanes.run(seed, stream, from + start, out, start, Math.min(Lanes.ROWS, n - start));
        }
    }

    /**
     * The Philox4x32-10 rounds of many rows at once, lane by lane: the four counter words of up to
     * {@link #ROWS} rows sit in four int arrays and each round is one loop over the rows, so that
     * HotSpot's superword pass turns it into vector instructions (one row alone is a chain of
     * dependent multiplications). Only int operations appear in the loop: the high half of the
     * unsigned 32 × 32-bit product is assembled from 16-bit halves (the schoolbook method; Knuth,
     * TAOCP vol. 2, section 4.3.1, algorithm M), whose partial products and carries fit in 32 bits.
     * The arrays take 8 KB, so a chunk stays in the first-level cache. Not thread-safe: one per thread.
     */
    public static final class Lanes {
        /** Rows per chunk. */
        static final int ROWS = 512;
        private static final int M0 = (int) Philox4x32.M0;
        private static final int M1 = (int) Philox4x32.M1;
        private static final int M0_HI = M0 >>> 16;
        private static final int M0_LO = M0 & 0xFFFF;
        private static final int M1_HI = M1 >>> 16;
        private static final int M1_LO = M1 & 0xFFFF;

        private final int[] x0 = new int[ROWS];
        private final int[] x1 = new int[ROWS];
        private final int[] x2 = new int[ROWS];
        private final int[] x3 = new int[ROWS];

        /** The high 32 bits of the unsigned product of a and m = mHi·2^16 + mLo. */
        private static int multiplyHigh(int a, int mHi, int mLo) {
            int aLo = a & 0xFFFF;
            int aHi = a >>> 16;
            int mid1 = aHi * mLo + ((aLo * mLo) >>> 16);
            int mid2 = aLo * mHi + (mid1 & 0xFFFF);
            return aHi * mHi + (mid1 >>> 16) + (mid2 >>> 16);
        }

        void run(long seed, long stream, long from, double[] out, int offset, int n) {
            int[] w0 = x0;
            int[] w1 = x1;
            int[] w2 = x2;
            int[] w3 = x3;
            int c2 = (int) stream;
            int c3 = (int) (stream >>> 32);
            for (int r = 0; r < n; r++) {
                long row = from + r;
                w0[r] = (int) row;
                w1[r] = (int) (row >>> 32);
                w2[r] = c2;
                w3[r] = c3;
            }
            int k0 = (int) seed;
            int k1 = (int) (seed >>> 32);
            for (int round = 0; round < Philox4x32.ROUNDS; round++) {
                if (round > 0) {
                    k0 += Philox4x32.W0;
                    k1 += Philox4x32.W1;
                }
                for (int r = 0; r < n; r++) {
                    int a = w0[r];
                    int c = w2[r];
                    int hi0 = multiplyHigh(a, M0_HI, M0_LO);
                    int hi1 = multiplyHigh(c, M1_HI, M1_LO);
                    w0[r] = hi1 ^ w1[r] ^ k0;
                    w2[r] = hi0 ^ w3[r] ^ k1;
                    w1[r] = c * M1;
                    w3[r] = a * M0;
                }
            }
            for (int r = 0; r < n; r++) {
                long bits = ((long) w1[r] << 32) | (w0[r] & 0xFFFFFFFFL);
                out[offset + r] = ((bits >>> 12) + 0.5) * TWO_POW_M52;
            }
        }
    }
}
