package dev.standin.random;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The lane-wise block form of the uniforms gives the same bits as {@link RandomStreams#uniform}
 * (itself checked against Random123's known-answer vectors through {@link Philox4x32}), for lengths
 * inside one chunk and across chunk edges, a reused {@link RandomStreams.Lanes}, and row ranges across
 * 2^32 and near 2^63.
 */
class UniformBlockTest {

    @Test
    void blockEqualsOneAtATime() {
        SplittableRandom rnd = new SplittableRandom(123);
        RandomStreams.Lanes lanes = new RandomStreams.Lanes();
        long[] starts = {0, (1L << 32) - 3, Long.MAX_VALUE - 40, 1L << 40};
        for (int trial = 0; trial < 200; trial++) {
            long seed = rnd.nextLong();
            long stream = rnd.nextLong();
            long from = trial < starts.length ? starts[trial] : rnd.nextLong(0, 1L << 41);
            int[] edges = {RandomStreams.Lanes.ROWS, RandomStreams.Lanes.ROWS + 1, 2 * RandomStreams.Lanes.ROWS};
            int n = trial < edges.length ? edges[trial] : 1 + rnd.nextInt(trial % 2 == 0 ? 37 : 1300);
            double[] out = new double[n];
            if (trial % 3 == 0) {
                RandomStreams.uniforms(seed, stream, from, out, n);
            } else {
                RandomStreams.uniforms(seed, stream, from, out, n, lanes);
            }
            for (int r = 0; r < n; r++) {
                assertEquals(Double.doubleToRawLongBits(RandomStreams.uniform(seed, stream, from + r)),
                        Double.doubleToRawLongBits(out[r]), "row " + (from + r));
            }
        }
    }
}
