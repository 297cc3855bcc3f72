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

    /**
     * {@link #uniform} of rows {@code from .. from + n − 1} into {@code out}, the same bits: the
     * Philox rounds of two rows are interleaved, so the processor overlaps their multiplication
     * chains (a row alone is latency-bound).
     */
    public static void uniforms(long seed, long stream, long from, double[] out, int n) {
        int k0i = (int) seed;
        int k1i = (int) (seed >>> 32);
        int c2i = (int) stream;
        int c3i = (int) (stream >>> 32);
        int r = 0;
        for (; r + 1 < n; r += 2) {
            long a = from + r;
            long b = a + 1;
            int x0 = (int) a;
            int x1 = (int) (a >>> 32);
            int x2 = c2i;
            int x3 = c3i;
            int y0 = (int) b;
            int y1 = (int) (b >>> 32);
            int y2 = c2i;
            int y3 = c3i;
            int k0 = k0i;
            int k1 = k1i;
            for (int round = 0; round < 10; round++) {
                if (round > 0) {
                    k0 += 0x9E3779B9;
                    k1 += 0xBB67AE85;
                }
                long p0 = 0xD2511F53L * (x0 & 0xFFFFFFFFL);
                long p1 = 0xCD9E8D57L * (x2 & 0xFFFFFFFFL);
                long q0 = 0xD2511F53L * (y0 & 0xFFFFFFFFL);
                long q1 = 0xCD9E8D57L * (y2 & 0xFFFFFFFFL);
                int nx0 = (int) (p1 >>> 32) ^ x1 ^ k0;
                int nx2 = (int) (p0 >>> 32) ^ x3 ^ k1;
                int ny0 = (int) (q1 >>> 32) ^ y1 ^ k0;
                int ny2 = (int) (q0 >>> 32) ^ y3 ^ k1;
                x1 = (int) p1;
                x3 = (int) p0;
                x0 = nx0;
                x2 = nx2;
                y1 = (int) q1;
                y3 = (int) q0;
                y0 = ny0;
                y2 = ny2;
            }
            long bx = ((long) x1 << 32) | (x0 & 0xFFFFFFFFL);
            long by = ((long) y1 << 32) | (y0 & 0xFFFFFFFFL);
            out[r] = ((bx >>> 12) + 0.5) * TWO_POW_M52;
            out[r + 1] = ((by >>> 12) + 0.5) * TWO_POW_M52;
        }
        for (; r < n; r++) {
            out[r] = uniform(seed, stream, from + r);
        }
    }
}
