package dev.standin.correlation;

/**
 * The 64-point Gauss–Hermite rule (weight e<sup>−x²</sup> on the real line; Abramowitz and Stegun
 * 25.4.46) as commons-math3 3.6.1 computes it ({@code GaussIntegratorFactory.hermite(64)}), held
 * as exact binary constants because computing it takes about 60 ms of a cold start: that factory
 * builds every rule of order 1 .. 64 on the way. The rule is symmetric, so the nodes and weights of
 * the non-negative half are kept and mirrored. {@code HermiteRule64Test} checks every node and
 * weight bit for bit against the library, so an upgrade of commons-math3 that changes them fails
 * the build instead of changing the latent matrices silently.
 */
final class HermiteRule64 {

    /** The number of nodes. */
    static final int POINTS = 64;

    /** The non-negative nodes x<sub>32</sub> .. x<sub>63</sub>, increasing. */
    private static final double[] HALF_POINTS = {
            0x1.1b3e351975fp-3, 0x1.a8f2d48f38dc8p-2, 0x1.6243a3f5a7736p-1, 0x1.f04414f234fdap-1,
            0x1.3f48826da302ap0, 0x1.86a0abb285de4p0, 0x1.ce365f93cf99cp0, 0x1.0b0afd5ecfdc2p1,
            0x1.2f263e3fc0fc4p1, 0x1.5373d53008b5ep1, 0x1.77fb1c9cd77e2p1, 0x1.9cc3feb6bf2fp1,
            0x1.c1d71216eda4cp1, 0x1.e73dbc4123e88p1, 0x1.06812de21a3c6p2, 0x1.19983e2da985ap2,
            0x1.2cea8c2d5becp2, 0x1.407f760441412p2, 0x1.545f70c352acp2, 0x1.68944f8775d56p2,
            0x1.7d29a318df80ep2, 0x1.922d3d6ed237ep2, 0x1.a7afeb57f7b3p2, 0x1.bdc682b1615eap2,
            0x1.d48b7a3f5892ap2, 0x1.ec216d1175464p2, 0x1.025ba56fe7ffap3, 0x1.0f47eb12802cp3,
            0x1.1d082f43b5926p3, 0x1.2bf0ec4bbd874p3, 0x1.3ca632273e53p3, 0x1.50d6004101deep3
    };

    /** Their weights. */
    private static final double[] HALF_WEIGHTS = {
            0x1.15e3f6b3fb7d3p-2, 0x1.dd2c5ed238c4fp-3, 0x1.5f9cd3b09aae4p-3, 0x1.bc68c3df0a797p-4,
            0x1.e132abb01c27ep-5, 0x1.bdb2314d1e253p-6, 0x1.6074351cb88d4p-7, 0x1.dad1d9330e9fdp-9,
            0x1.0faade5c71e1cp-10, 0x1.072cec6e5b7dep-12, 0x1.adfe7d70945d7p-15, 0x1.26e4a230a6826p-17,
            0x1.51c87bcda63adp-20, 0x1.4129caed4087bp-23, 0x1.f769c9258bcb1p-27, 0x1.4299efb18e7ep-30,
            0x1.4eebb9532a4ep-34, 0x1.169a34c096d1ep-38, 0x1.6eab73c784217p-43, 0x1.780a9dc5eddb9p-48,
            0x1.272b606752201p-53, 0x1.5b13b13641e7fp-59, 0x1.29b8d6b5a0385p-65, 0x1.689b21be39ac1p-72,
            0x1.27d283064d008p-79, 0x1.377019fb1eb9cp-87, 0x1.8744c90f013bcp-96, 0x1.08c59ce9737d7p-105,
            0x1.4b38692f1ca7fp-116, 0x1.2a05ed54fc2d1p-128, 0x1.df7bb8cdef51fp-143, 0x1.9e3b11dc90623p-161
    };

    private HermiteRule64() {
    }

    /** The 64 nodes in increasing order (a new array). */
    static double[] points() {
        double[] x = new double[POINTS];
        int h = POINTS / 2;
        for (int i = 0; i < h; i++) {
            x[h + i] = HALF_POINTS[i];
            x[h - 1 - i] = -HALF_POINTS[i];
        }
        return x;
    }

    /** The weights of {@link #points()}, in the same order (a new array). */
    static double[] weights() {
        double[] w = new double[POINTS];
        int h = POINTS / 2;
        for (int i = 0; i < h; i++) {
            w[h + i] = HALF_WEIGHTS[i];
            w[h - 1 - i] = HALF_WEIGHTS[i];
        }
        return w;
    }
}
