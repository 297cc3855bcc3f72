package dev.standin.output;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;

/**
 * Decimal text of doubles that is identical on every JDK and locale.
 *
 * <p>{@code Double.toString} is not used: its output changed in JDK 19 (JDK-4511638). Instead:
 * <ul>
 *   <li>{@link #fixed(double, int)}: the exact binary value rounded half-even to the given number
 *   of decimals ({@link BigDecimal#setScale(int, RoundingMode)}), so 0.125 with 2 decimals is
 *   0.12 and 2.675 (really 2.67499999...) is 2.67;</li>
 *   <li>{@link #shortest(double)}: the fewest significant digits from 15 to 17 that read back as the
 *   same double ({@link Double#parseDouble} is correctly rounded on every JDK), trailing zeros
 *   stripped.</li>
 * </ul>
 * Negative zero, and negative values that round to zero, are written without a sign.
 */
public final class NumberText {

    private static final MathContext[] DIGITS = {
        new MathContext(15, RoundingMode.HALF_EVEN),
        new MathContext(16, RoundingMode.HALF_EVEN),
        new MathContext(17, RoundingMode.HALF_EVEN),
    };

    private static final MathContext[] UP = {
        new MathContext(15, RoundingMode.CEILING),
        new MathContext(16, RoundingMode.CEILING),
        new MathContext(17, RoundingMode.CEILING),
    };

    private static final MathContext[] DOWN = {
        new MathContext(15, RoundingMode.FLOOR),
        new MathContext(16, RoundingMode.FLOOR),
        new MathContext(17, RoundingMode.FLOOR),
    };

    private NumberText() {
    }

    /** 10<sup>d</sup> for d = 0..18, exact as longs. */
    private static final long[] POW10 = {
        1L, 10L, 100L, 1_000L, 10_000L, 100_000L, 1_000_000L, 10_000_000L, 100_000_000L, 1_000_000_000L,
        10_000_000_000L, 100_000_000_000L, 1_000_000_000_000L, 10_000_000_000_000L, 100_000_000_000_000L,
        1_000_000_000_000_000L, 10_000_000_000_000_000L, 100_000_000_000_000_000L, 1_000_000_000_000_000_000L,
    };

    /** 10<sup>d</sup> for d = 0..22, each exact in binary64. */
    private static final double[] POW10_DOUBLE = {
        1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18,
        1e19, 1e20, 1e21, 1e22,
    };

    /** Returned by {@link #scaledHalfEven} when the fast path does not apply. */
    public static final long NO_FAST_PATH = Long.MIN_VALUE;

    /** The value rounded half-even to {@code decimals} digits after the point, in plain notation. */
    public static String fixed(double value, int decimals) {
        requireFinite(value);
        long q = scaledHalfEven(value, decimals);
        if (q == NO_FAST_PATH) {
            return new BigDecimal(value).setScale(decimals, RoundingMode.HALF_EVEN).toPlainString();
        }
        byte[] buf = new byte[MAX_FIXED_CHARS];
        int end = writeScaled(q, value < 0, decimals, buf, 0);
        return new String(buf, 0, end, java.nio.charset.StandardCharsets.ISO_8859_1);
    }

    /**
     * Appends {@link #fixed(double, int)} of a finite value to a builder without making a String:
     * the digits go through {@code scratch} (at least {@link #MAX_FIXED_CHARS} bytes, reused by the
     * caller). For text built from many numbers, such as a chart's coordinates.
     */
    public static void appendFixed(StringBuilder sb, double value, int decimals, byte[] scratch) {
        requireFinite(value);
        long q = scaledHalfEven(value, decimals);
        if (q == NO_FAST_PATH) {
            sb.append(fixed(value, decimals));
            return;
        }
        int end = writeScaled(q, value < 0, decimals, scratch, 0);
        for (int i = 0; i < end; i++) {
            sb.append((char) scratch[i]);
        }
    }

    /** The longest text {@link #writeScaled} produces: sign, 19 digits, point, leading zeros. */
    public static final int MAX_FIXED_CHARS = 40;

    /**
     * |value|·10<sup>decimals</sup> rounded half-even to an integer, computed exactly: a finite double
     * is m·2<sup>e</sup> with an integer m &lt; 2<sup>53</sup> (IEEE 754-2008 binary64), so
     * m·10<sup>d</sup> &lt; 2<sup>103</sup> is an exact 128-bit product, and dividing it by
     * 2<sup>−e</sup> is a shift whose remainder, compared to half the divisor, decides the rounding
     * (ties to the even quotient). This is the same integer computation as
     * {@code new BigDecimal(value).setScale(decimals, HALF_EVEN)}, without allocation.
     *
     * @param decimals 0..15
     * @return the rounded magnitude, at most 2<sup>62</sup>, or {@link #NO_FAST_PATH} when it would be
     *     larger or |value| ≥ 2<sup>53</sup> (then use BigDecimal)
     */
    public static long scaledHalfEven(double value, int decimals) {
        long bits = Double.doubleToRawLongBits(value);
        int biased = (int) ((bits >>> 52) & 0x7FF);
        long m = bits & 0xFFFFFFFFFFFFFL;
        int e;
        if (biased == 0) {
            e = -1074;
        } else {
            m |= 1L << 52;
            e = biased - 1075;
        }
        if (m == 0) {
            return 0;
        }
        if (e > 0 || decimals < 0 || decimals > 15) {
            return NO_FAST_PATH;
        }
        long p = POW10[decimals];
        // m < 2^53 and p < 2^50, both non-negative: the signed high word is the unsigned one
        long hi = Math.multiplyHigh(m, p);
        long lo = m * p;
        int s = -e;
        if (s == 0) {
            return hi != 0 || lo < 0 || lo > (1L << 62) ? NO_FAST_PATH : lo;
        }
        if (s >= 105) {
            // the product is below 2^103 < 2^(s−2): less than half the divisor, so it rounds to 0
            return 0;
        }
        long q;
        int cmp;
        if (s < 64) {
            if ((hi >>> s) != 0) {
                return NO_FAST_PATH;
            }
            q = (hi << (64 - s)) | (lo >>> s);
            if (q < 0 || q > (1L << 62)) {
                return NO_FAST_PATH;
            }
            // the common case, without a data-dependent branch: rem and half are below 2^63, so
            // half − rem is negative exactly when rem > half; on a tie, round to the even quotient
            long rem = lo & ((1L << s) - 1);
            long half = 1L << (s - 1);
            return q + (((half - rem) >>> 63) | ((rem == half ? 1L : 0L) & q));
        } else if (s == 64) {
            q = hi;
            cmp = Long.compareUnsigned(lo, 1L << 63);
        } else {
            q = hi >>> (s - 64);
            long remHi = hi & ((1L << (s - 64)) - 1);
            long halfHi = 1L << (s - 65);
            cmp = remHi != halfHi ? Long.compareUnsigned(remHi, halfHi) : (lo != 0 ? 1 : 0);
        }
        if (q < 0 || q > (1L << 62)) {
            return NO_FAST_PATH;
        }
        if (cmp > 0 || (cmp == 0 && (q & 1) != 0)) {
            q++;
        }
        return q;
    }

    /**
     * Writes the text of a magnitude from {@link #scaledHalfEven}: {@code decimals} digits after the
     * point, at least one before it, a minus sign only when negative and not zero (so −0.0 and
     * negative values that round to zero have none), as ASCII bytes.
     *
     * @return the position after the text
     */
    public static int writeScaled(long q, boolean negative, int decimals, byte[] buf, int pos) {
        if (negative && q != 0) {
            buf[pos++] = '-';
        }
        int intDigits = Math.max(1, digitCount(q) - decimals);
        int end = pos + intDigits + (decimals > 0 ? decimals + 1 : 0);
        int i = end;
        if (q <= Integer.MAX_VALUE) {
            writeSmall((int) q, decimals, buf, pos, i);
            return end;
        }
        long v = q;
        // the fraction: exactly `decimals` digits, two at a time from the right
        int f = decimals;
        while (f >= 2) {
            long t = v / 100;
            int pair = (int) (v - t * 100);
            v = t;
            buf[--i] = DIGIT_ONES[pair];
            buf[--i] = DIGIT_TENS[pair];
            f -= 2;
        }
        if (f == 1) {
            long t = v / 10;
            buf[--i] = (byte) ('0' + (int) (v - t * 10));
            v = t;
        }
        if (decimals > 0) {
            buf[--i] = '.';
        }
        // the integer part, at least one digit
        while (v >= 100) {
            long t = v / 100;
            int pair = (int) (v - t * 100);
            v = t;
            buf[--i] = DIGIT_ONES[pair];
            buf[--i] = DIGIT_TENS[pair];
        }
        if (v >= 10) {
            buf[--i] = DIGIT_ONES[(int) v];
            buf[--i] = DIGIT_TENS[(int) v];
        } else if (i > pos) {
            buf[--i] = (byte) ('0' + (int) v);
        }
        return end;
    }

    /** {@link #writeScaled}'s digits for q below 2<sup>31</sup>, in int arithmetic (the common case). */
    private static void writeSmall(int v, int decimals, byte[] buf, int pos, int end) {
        int i = end;
        int f = decimals;
        while (f >= 2) {
            int t = v / 100;
            int pair = v - t * 100;
            v = t;
            buf[--i] = DIGIT_ONES[pair];
            buf[--i] = DIGIT_TENS[pair];
            f -= 2;
        }
        if (f == 1) {
            int t = v / 10;
            buf[--i] = (byte) ('0' + (v - t * 10));
            v = t;
        }
        if (decimals > 0) {
            buf[--i] = '.';
        }
        while (v >= 100) {
            int t = v / 100;
            int pair = v - t * 100;
            v = t;
            buf[--i] = DIGIT_ONES[pair];
            buf[--i] = DIGIT_TENS[pair];
        }
        if (v >= 10) {
            buf[--i] = DIGIT_ONES[v];
            buf[--i] = DIGIT_TENS[v];
        } else if (i > pos) {
            buf[--i] = (byte) ('0' + v);
        }
    }

    /** The tens and ones digit of 0..99, as ASCII. */
    private static final byte[] DIGIT_TENS = new byte[100];
    private static final byte[] DIGIT_ONES = new byte[100];

    static {
        for (int i = 0; i < 100; i++) {
            DIGIT_TENS[i] = (byte) ('0' + i / 10);
            DIGIT_ONES[i] = (byte) ('0' + i % 10);
        }
    }

    /** Decimal digits of a non-negative long (1 for 0). */
    static int digitCount(long v) {
        if (v < 10) {
            return 1;
        }
        // 64 − leading zeros gives the binary length; ×1233/4096 approximates log10(2) (the common
        // practice of Hacker's Delight, 2nd ed., section 11-4), then one comparison corrects it
        int guess = ((64 - Long.numberOfLeadingZeros(v | 1)) * 1233) >>> 12;
        return guess < 18 && v >= POW10[guess + 1] ? guess + 2 : (v >= POW10[guess] ? guess + 1 : guess);
    }

    /**
     * The double nearest to q·10<sup>−decimals</sup> (negated when {@code negative} and q ≠ 0), which is
     * what {@link Double#parseDouble} returns for the text {@link #writeScaled} wrote: for q &lt; 2<sup>53</sup>
     * both q and 10<sup>d</sup> (d ≤ 22) are exact doubles, so one correctly rounded IEEE division gives
     * the correctly rounded quotient (Clinger, "How to read floating point numbers accurately", PLDI
     * 1990, the fast path). Larger q is parsed from its text.
     */
    public static double scaledValue(long q, boolean negative, int decimals) {
        if (q == 0) {
            return 0.0;
        }
        double x;
        if (q < (1L << 53)) {
            x = (double) q / POW10_DOUBLE[decimals];
        } else {
            byte[] buf = new byte[MAX_FIXED_CHARS];
            int end = writeScaled(q, false, decimals, buf, 0);
            x = Double.parseDouble(new String(buf, 0, end, java.nio.charset.StandardCharsets.ISO_8859_1));
        }
        return negative ? -x : x;
    }

    /**
     * The shortest decimal text (15 to 17 significant digits) that reads back as {@code value}: plain
     * notation for magnitudes in [1e-7, 1e21), otherwise scientific ({@code 1.5E-9}), both valid JSON.
     */
    public static String shortest(double value) {
        requireFinite(value);
        if (value == 0.0) {
            return "0";
        }
        BigDecimal exact = new BigDecimal(value);
        BigDecimal rounded = exact;
        for (int i = 0; i < DIGITS.length; i++) {
            rounded = exact.round(DIGITS[i]);
            if (rounded.doubleValue() == value) {
                break;
            }
            // at a power of two the decimals that read back are lopsided around the value (the gap
            // below is half the gap above), so the nearest decimal can miss while the nearest one on
            // the other side reads back
            BigDecimal other = exact.round(rounded.compareTo(exact) < 0 ? UP[i] : DOWN[i]);
            if (other.doubleValue() == value) {
                rounded = other;
                break;
            }
        }
        rounded = rounded.stripTrailingZeros();
        double magnitude = Math.abs(value);
        if (magnitude >= 1e-7 && magnitude < 1e21) {
            return rounded.toPlainString();
        }
        return rounded.toString();
    }

    /** {@link #fixed} when decimals ≥ 0, else {@link #shortest}. */
    public static String format(double value, int decimals) {
        return decimals >= 0 ? fixed(value, decimals) : shortest(value);
    }

    private static void requireFinite(double value) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("value must be finite: " + value);
        }
    }
}
