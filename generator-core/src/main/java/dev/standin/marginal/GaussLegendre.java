package dev.standin.marginal;

/**
 * Gauss–Legendre rules on [0, 1] (weight 1; Abramowitz and Stegun 25.4.29, mapped from [−1, 1]) of
 * 16, 20 and 32 points, as commons-math3 3.6.1 computes them ({@code GaussIntegratorFactory.legendre(n,
 * 0, 1)}), held as exact binary constants: that factory builds every rule of order 1 .. n on the way
 * (about 20 ms of a cold start for these three, plus the C2 compiler's time on its loop). {@code
 * GaussLegendreTest} checks every node and weight bit for bit against the library, so an upgrade of
 * commons-math3 that changes them fails the build instead of changing results silently. Used by
 * {@link QuantileMoments} (32 points) and the correlation package (16 and 20).
 */
public final class GaussLegendre {

    private static final double[] POINTS_16 = {
            0x1.5b4f66ca1e08p-8, 0x1.c60a99e9065p-6, 0x1.132ff2bac6df8p-4, 0x1.f4ee8896e365p-4,
            0x1.874b732542e9p-3, 0x1.157ed32de2c47p-2, 0x1.6fd1a8cdee642p-2, 0x1.cf5a853312ac1p-2,
            0x1.1852bd6676aap-1, 0x1.48172b9908cdfp-1, 0x1.754096690e9dcp-1, 0x1.9e2d2336af45cp-1,
            0x1.c1622eed23936p-1, 0x1.dd9a01a8a7241p-1, 0x1.f1cfab30b7cd8p-1, 0x1.fd4961326bc3fp-1
    };
    private static final double[] WEIGHTS_16 = {
            0x1.bcddab4b7c206p-7, 0x1.fdfb1a2c1264bp-6, 0x1.85c4ee79cc25bp-5, 0x1.fe7af2bad386ap-5,
            0x1.325f61bca3cc3p-4, 0x1.5a6ebbb5a75fdp-4, 0x1.75f8c77e0c01p-4, 0x1.83feae80e4dfbp-4,
            0x1.83feae80e4dfbp-4, 0x1.75f8c77e0c01p-4, 0x1.5a6ebbb5a75fdp-4, 0x1.325f61bca3cc3p-4,
            0x1.fe7af2bad386ap-5, 0x1.85c4ee79cc25bp-5, 0x1.fdfb1a2c1264bp-6, 0x1.bcddab4b7c206p-7
    };
    private static final double[] POINTS_20 = {
            0x1.c252f9c719p-9, 0x1.27245842896p-6, 0x1.677cdf460137p-5, 0x1.497d0a840a46p-4,
            0x1.03c191972b564p-3, 0x1.74ae580b1de48p-3, 0x1.f4df47d810014p-3, 0x1.40a998754d69ep-2,
            0x1.8b5fa725b5d1p-2, 0x1.d8d1840ce8f2ap-2, 0x1.13973df98b86bp-1, 0x1.3a502c6d25178p-1,
            0x1.5fab33c5594b1p-1, 0x1.82c82e09fbffbp-1, 0x1.a2d469fd3886ep-1, 0x1.bf0f9b9a352a7p-1,
            0x1.d6d05eaf7eb74p-1, 0x1.e988320b9fec9p-1, 0x1.f6c6dd3debb5p-1, 0x1.fe3dad0638e7p-1
    };
    private static final double[] WEIGHTS_20 = {
            0x1.209680274e8d9p-7, 0x1.4c9b5ea53b671p-6, 0x1.00b467df7e473p-5, 0x1.5519fe196e24bp-5,
            0x1.a1817a317a824p-5, 0x1.e41ff31573b4ap-5, 0x1.0db2c5db26e04p-4, 0x1.230348f34a538p-4,
            0x1.31819b52c5994p-4, 0x1.38d6c490a3376p-4, 0x1.38d6c490a3376p-4, 0x1.31819b52c5994p-4,
            0x1.230348f34a538p-4, 0x1.0db2c5db26e04p-4, 0x1.e41ff31573b4ap-5, 0x1.a1817a317a824p-5,
            0x1.5519fe196e24bp-5, 0x1.00b467df7e473p-5, 0x1.4c9b5ea53b671p-6, 0x1.209680274e8d9p-7
    };
    private static final double[] POINTS_32 = {
            0x1.66a18fbf64ap-10, 0x1.d77b63ad0c9p-8, 0x1.20aae7fac456p-6, 0x1.0a9fed30405fp-5,
            0x1.a8ab25d459a3p-5, 0x1.347ec0a5e57b8p-4, 0x1.a4e5adf8ed0e8p-4, 0x1.123ed9c52d88cp-3,
            0x1.590aec76f00ecp-3, 0x1.a62dd72d3a6b8p-3, 0x1.f8ef3af329ac4p-3, 0x1.2844a541c8387p-2,
            0x1.5615518d42105p-2, 0x1.857c20798fdadp-2, 0x1.b607c563a0372p-2, 0x1.e74437b7733b6p-2,
            0x1.0c5de42446625p-1, 0x1.24fc1d4e2fe47p-1, 0x1.3d41efc33812ap-1, 0x1.54f557395ef7ep-1,
            0x1.6bddad5f1be3cp-1, 0x1.81c431433594fp-1, 0x1.96748a34b1652p-1, 0x1.a9bd44e243fc5p-1,
            0x1.bb70498eb49ddp-1, 0x1.cb634a40e25e3p-1, 0x1.d97027eb43509p-1, 0x1.e5754da2ba65dp-1,
            0x1.ef56012cfbfa1p-1, 0x1.f6faa8c029dd5p-1, 0x1.fc510938a5e6ep-1, 0x1.ff4caf38204dbp-1
    };
    private static final double[] WEIGHTS_32 = {
            0x1.cbf8bc743cc8ap-9, 0x1.0aa3c248696d5p-7, 0x1.a0060a8532012p-7, 0x1.18c5800a355d6p-6,
            0x1.5ee963a335487p-6, 0x1.a1c6ae961fcp-6, 0x1.e0bd76c924988p-6, 0x1.0d9b9a62cac16p-5,
            0x1.2854103b35e14p-5, 0x1.40483e126fd1cp-5, 0x1.553ee25ebebc5p-5, 0x1.6705e18e13edp-5,
            0x1.7572bdb3f6e52p-5, 0x1.8062fc0f6feeep-5, 0x1.87bc776f8c6d8p-5, 0x1.8b6d9eaec77bp-5,
            0x1.8b6d9eaec77bp-5, 0x1.87bc776f8c6d8p-5, 0x1.8062fc0f6feeep-5, 0x1.7572bdb3f6e52p-5,
            0x1.6705e18e13edp-5, 0x1.553ee25ebebc5p-5, 0x1.40483e126fd1cp-5, 0x1.2854103b35e14p-5,
            0x1.0d9b9a62cac16p-5, 0x1.e0bd76c924988p-6, 0x1.a1c6ae961fcp-6, 0x1.5ee963a335487p-6,
            0x1.18c5800a355d6p-6, 0x1.a0060a8532012p-7, 0x1.0aa3c248696d5p-7, 0x1.cbf8bc743cc8ap-9
    };

    private GaussLegendre() {
    }

    /** The n nodes in increasing order (a new array); n is 16, 20 or 32. */
    public static double[] points(int n) {
        return rule(n, true).clone();
    }

    /** The n weights, in the nodes' order (a new array); n is 16, 20 or 32. */
    public static double[] weights(int n) {
        return rule(n, false).clone();
    }

    private static double[] rule(int n, boolean points) {
        return switch (n) {
            case 16 -> points ? POINTS_16 : WEIGHTS_16;
            case 20 -> points ? POINTS_20 : WEIGHTS_20;
            case 32 -> points ? POINTS_32 : WEIGHTS_32;
            default -> throw new IllegalArgumentException("n must be 16, 20 or 32: " + n);
        };
    }
}
