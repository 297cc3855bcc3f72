package dev.standin.output;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.SplittableRandom;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/**
 * {@link NumberText} against a reference that works on the exact binary value with integer
 * arithmetic only: a finite double is m·2<sup>e</sup> (IEEE 754-2008, binary64), and rounding half
 * to even to d decimals is a division of integers with the remainder compared to half the divisor.
 * No {@code Double.toString} and no {@code BigDecimal} rounding are involved in the reference.
 */
class NumberTextTest {

    /** RFC 8259 section 6 number grammar. */
    private static final Pattern JSON_NUMBER = Pattern.compile("-?(0|[1-9][0-9]*)(\\.[0-9]+)?([eE][+-]?[0-9]+)?");

    /** x rounded half-even to d decimals, in plain notation, by integer arithmetic on m·2^e. */
    static String fixedReference(double x, int d) {
        long bits = Double.doubleToRawLongBits(x);
        boolean negative = bits < 0;
        int biased = (int) ((bits >>> 52) & 0x7FF);
        long m = bits & ((1L << 52) - 1);
        int e;
        if (biased == 0) {
            e = -1074;
        } else {
            m |= 1L << 52;
            e = biased - 1075;
        }
        BigInteger num = BigInteger.valueOf(m).multiply(BigInteger.TEN.pow(d));
        BigInteger den = BigInteger.ONE;
        if (e >= 0) {
            num = num.shiftLeft(e);
        } else {
            den = den.shiftLeft(-e);
        }
        BigInteger[] qr = num.divideAndRemainder(den);
        BigInteger q = qr[0];
        int cmp = qr[1].shiftLeft(1).compareTo(den);
        if (cmp > 0 || (cmp == 0 && q.testBit(0))) {
            q = q.add(BigInteger.ONE);
        }
        StringBuilder digits = new StringBuilder(q.toString());
        while (digits.length() < d + 1) {
            digits.insert(0, '0');
        }
        if (d > 0) {
            digits.insert(digits.length() - d, '.');
        }
        if (negative && q.signum() != 0) {
            digits.insert(0, '-');
        }
        return digits.toString();
    }

    @Test
    void referenceAgreesWithHandWorkedValues() {
        // the reference itself, on values worked by hand: 0.125 = 1/8 exactly
        assertEquals("0.12", fixedReference(0.125, 2));
        assertEquals("-1.50", fixedReference(-1.5, 2));
        assertEquals("2", fixedReference(2.5, 0));
        assertEquals("0", fixedReference(-0.4, 0));
    }

    @Test
    void fixedEdgeCases() {
        // 0.125 = 1/8 is exact, a tie at 2 decimals: half-even gives 0.12 (IEEE 754 roundTiesToEven)
        assertEquals("0.12", NumberText.fixed(0.125, 2));
        // 0.375 = 3/8 exact, tie: 0.38 (8 is even)
        assertEquals("0.38", NumberText.fixed(0.375, 2));
        // 2.675 is really 2.67499999999999982236431605997495353221893310546875 (its exact binary
        // value; the Python tutorial's "Floating Point Arithmetic" chapter uses round(2.675, 2) == 2.67)
        assertEquals("2.67", NumberText.fixed(2.675, 2));
        // negative values that round to zero, and −0.0, have no sign (NumberText's contract)
        assertEquals("0.00", NumberText.fixed(-0.001, 2));
        assertEquals("0.00", NumberText.fixed(-0.0, 2));
        assertEquals("0", NumberText.fixed(-0.5, 0));
        assertEquals("0.000000000000000", NumberText.fixed(-Double.MIN_VALUE, 15));
        // ties to even at 0 decimals: 0.5 → 0, 1.5 → 2, 2.5 → 2, −2.5 → −2
        assertEquals("0", NumberText.fixed(0.5, 0));
        assertEquals("2", NumberText.fixed(1.5, 0));
        assertEquals("2", NumberText.fixed(2.5, 0));
        assertEquals("-2", NumberText.fixed(-2.5, 0));
        // 1e15 is an exact integer in binary64
        assertEquals("1000000000000000.00", NumberText.fixed(1e15, 2));
        assertEquals("1000000000000000", NumberText.fixed(1e15, 0));
        // 1e23 is not exact: its binary value is 99999999999999991611392 (the classic example)
        assertEquals("99999999999999991611392", NumberText.fixed(1e23, 0));
        // large and small against the integer reference
        for (double x : new double[] {1e300, -1e300, Double.MAX_VALUE, 1.0 / 3, 1e-5, 1e-16, Double.MIN_NORMAL,
            Double.MIN_VALUE, 123456.789, -0.0049999999999999999, 0.005, 0.015, 0.025, 1.005, 9.995, 999999.9995}) {
            for (int d = 0; d <= 15; d++) {
                assertEquals(fixedReference(x, d), NumberText.fixed(x, d), x + " with " + d + " decimals");
            }
        }
        // plain notation: no exponent even for huge values
        assertFalse(NumberText.fixed(Double.MAX_VALUE, 0).contains("E"));
        assertEquals(309, NumberText.fixed(Double.MAX_VALUE, 0).length());
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> NumberText.fixed(Double.NaN, 2));
        assertEquals("value must be finite: NaN", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> NumberText.shortest(Double.POSITIVE_INFINITY));
    }

    /** A seeded mix of magnitudes: any finite bit pattern, decimal-looking values, exact ties. */
    private static double sample(SplittableRandom rnd, int kind, int d) {
        switch (kind) {
            case 0: {
                double x;
                do {
                    x = Double.longBitsToDouble(rnd.nextLong());
                } while (!Double.isFinite(x));
                return x;
            }
            case 1:
                return (rnd.nextDouble() * 2 - 1) * Math.pow(10, rnd.nextInt(-12, 16));
            case 2:
                // a decimal with d + 1 digits after the point, typed as a literal would be: the
                // nearest double to a value that is a decimal tie, just above or below it
                return (rnd.nextLong(-10_000_000L, 10_000_000L) * 10 + 5) / Math.pow(10, d + 1);
            default:
                // an exact binary tie at d decimals: x = (2j + 1)/2^(d + 1) gives x·10^d = (2j + 1)·5^d/2,
                // an odd multiple of 1/2
                return (2 * rnd.nextLong(-1_000_000L, 1_000_000L) + 1) / Math.pow(2, d + 1);
        }
    }

    /** appendFixed writes BigDecimal's half-even text after what the builder holds, on seeded values and the edges. */
    @Test
    void appendFixedEqualsBigDecimalHalfEven() {
        SplittableRandom rnd = new SplittableRandom(20261202L);
        byte[] scratch = new byte[NumberText.MAX_FIXED_CHARS];
        StringBuilder sb = new StringBuilder();
        for (int n = 0; n < 200_000; n++) {
            int d = rnd.nextInt(16);
            double x = n % 5 == 4 ? rnd.nextDouble(-50, 1200) : sample(rnd, n % 4, d);
            sb.setLength(0);
            sb.append('M');
            NumberText.appendFixed(sb, x, d, scratch);
            assertEquals("M" + bigDecimalFixed(x, d).replaceFirst("^-(0\\.?0*)$", "$1"), sb.toString(),
                    Double.doubleToRawLongBits(x) + "L with " + d);
        }
        for (double x : new double[] {-0.0, 0.05, 0.15, -0.04, 1e15, 1e300, -Double.MAX_VALUE, Double.MIN_VALUE}) {
            sb.setLength(0);
            NumberText.appendFixed(sb, x, 1, scratch);
            assertEquals(NumberText.fixed(x, 1), sb.toString(), x + " with 1 decimal");
        }
        assertThrows(IllegalArgumentException.class, () -> NumberText.appendFixed(new StringBuilder(), Double.NaN, 1, scratch));
    }

    @Test
    void fixedMatchesTheIntegerReferenceOnSeededValues() {
        SplittableRandom rnd = new SplittableRandom(4511638L);
        for (int n = 0; n < 100_000; n++) {
            int d = rnd.nextInt(16);
            double x = sample(rnd, n % 4, d);
            assertEquals(fixedReference(x, d), NumberText.fixed(x, d), () -> Double.doubleToRawLongBits(x) + "L with " + d);
        }
    }

    /** Significant digits of a decimal text (trailing zeros of an integer part not counted). */
    private static int significantDigits(String text) {
        return new BigDecimal(text).stripTrailingZeros().precision();
    }

    private static void checkShortest(double x) {
        String s = NumberText.shortest(x);
        assertEquals(Double.doubleToRawLongBits(x == 0 ? 0.0 : x), Double.doubleToRawLongBits(Double.parseDouble(s)),
                () -> "round trip of " + Double.doubleToRawLongBits(x) + "L: " + s);
        assertTrue(JSON_NUMBER.matcher(s).matches(), () -> "valid JSON number: " + s);
        int p = significantDigits(s);
        assertTrue(p <= 17, () -> s + " has " + p + " significant digits");
        double magnitude = Math.abs(x);
        boolean plain = magnitude == 0 || (magnitude >= 1e-7 && magnitude < 1e21);
        assertEquals(plain, !s.contains("E"), () -> "notation of " + s);
        if (p > 15) {
            // the fewest digits from 15 to 17: no decimal with p − 1 digits reads back as x. The
            // decimals that read back as x form an interval around x, so it suffices to try the
            // nearest (p − 1)-digit decimals below and above x.
            BigDecimal exact = new BigDecimal(x);
            for (RoundingMode mode : new RoundingMode[] {RoundingMode.FLOOR, RoundingMode.CEILING}) {
                BigDecimal shorter = exact.round(new MathContext(p - 1, mode));
                assertTrue(shorter.doubleValue() != x, () -> s + " is not the shortest: " + shorter + " reads back too");
            }
        }
    }

    @Test
    void shortestEdgeCases() {
        assertEquals("0", NumberText.shortest(0.0));
        assertEquals("0", NumberText.shortest(-0.0));
        assertEquals("0.1", NumberText.shortest(0.1));
        assertEquals("100", NumberText.shortest(100.0));
        assertEquals("0.00001", NumberText.shortest(1e-5));
        assertEquals("0.0000001", NumberText.shortest(1e-7));
        assertEquals("1E-8", NumberText.shortest(1e-8));
        assertEquals("1.5E-9", NumberText.shortest(1.5e-9));
        assertEquals("1E+21", NumberText.shortest(1e21));
        assertEquals("100000000000000000000", NumberText.shortest(1e20));
        // 1/3 and 2/3 need 16 digits (Double.toString gives 0.3333333333333333 and
        // 0.6666666666666666, from memory)
        assertEquals("0.3333333333333333", NumberText.shortest(1.0 / 3));
        assertEquals("0.6666666666666666", NumberText.shortest(2.0 / 3));
        // Double.MAX_VALUE needs all 17: 1.7976931348623157E308 (Java's Double.MAX_VALUE javadoc gives
        // (2 − 2^-52)·2^1023 = 1.7976931348623157e308)
        assertEquals("1.7976931348623157E+308", NumberText.shortest(Double.MAX_VALUE));
        assertEquals("-1.7976931348623157E+308", NumberText.shortest(-Double.MAX_VALUE));
        for (double x : new double[] {Double.MIN_VALUE, Double.MIN_NORMAL, Math.PI, Math.E, 0.1 + 0.2, 1e23, 9007199254740993.0}) {
            checkShortest(x);
            checkShortest(-x);
        }
    }

    @Test
    void shortestRoundTripsOnSeededValuesAndPowersOfTwo() {
        SplittableRandom rnd = new SplittableRandom(8259L);
        for (int n = 0; n < 100_000; n++) {
            checkShortest(sample(rnd, n % 3, rnd.nextInt(16)));
        }
        // powers of two: the interval of decimals that read back is lopsided there (the gap below
        // is half the gap above), the one place where the nearest decimal may not be the shortest
        for (int k = -1074; k <= 1023; k++) {
            checkShortest(Math.scalb(1.0, k));
            checkShortest(Math.nextDown(Math.scalb(1.0, k)));
        }
    }
    /** BigDecimal's own half-even rounding of the exact binary value (java.math.BigDecimal javadoc). */
    private static String bigDecimalFixed(double x, int d) {
        return new BigDecimal(x).setScale(d, RoundingMode.HALF_EVEN).toPlainString();
    }

    @Test
    void fastFixedEqualsBigDecimalHalfEvenOnMillionsOfSeededValues() {
        // the fast path (exact 128-bit integer arithmetic) against BigDecimal.setScale(HALF_EVEN):
        // 2,000,000 seeded values over the sampler's four kinds and a column-like kind (values of a
        // few hundred with 3 or 4 decimals, the common case)
        SplittableRandom rnd = new SplittableRandom(20260401L);
        ByteText out = new ByteText(64);
        for (int n = 0; n < 2_000_000; n++) {
            int d = rnd.nextInt(16);
            int kind = n % 5;
            double x = kind == 4 ? rnd.nextDouble(-1000, 1000) : sample(rnd, kind, d);
            if (kind == 4) {
                d = 3 + (n & 1);
            }
            String expected = bigDecimalFixed(x, d);
            out.clear();
            double written = out.appendFixed(x, d);
            if (!expected.equals(out.toString())) {
                assertEquals(expected, out.toString(), Double.doubleToRawLongBits(x) + "L with " + d);
            }
            // the value handed to the statistics is exactly what the text reads back as
            double parsed = Double.parseDouble(expected);
            if (Double.doubleToRawLongBits(written) != Double.doubleToRawLongBits(parsed == 0 ? 0.0 : parsed)) {
                assertEquals(parsed, written, Double.doubleToRawLongBits(x) + "L with " + d + " read back");
            }
        }
    }

    @Test
    void fastFixedEdgeCasesAgainstBigDecimal() {
        ByteText out = new ByteText(8);
        double[] edges = {0.0, -0.0, 1e15, -1e15, Math.nextUp(1e15), Math.nextDown(1e15), 0x1.0p53, Math.nextDown(0x1.0p53),
            0x1.0p52 + 0.5, 0x1.0p62, 4.611686018427388E18, 9.223372036854775E18, 1e17, 1e18, 1e19, 1e22,
            Double.MIN_VALUE, -Double.MIN_VALUE, Double.MIN_NORMAL, Math.nextDown(Double.MIN_NORMAL), Double.MAX_VALUE,
            0.5, 1.5, 2.5, -0.5, -1.5, 0.05, 0.005, 0.0005, 0.125, 0.375, 2.675, 1.0005, 999.9995, 9.9999999999999995e-4,
            // half an ulp around decimal ties: the nearest doubles below and above x.5 at 3 decimals
            Math.nextDown(0.0625), Math.nextUp(0.0625), Math.nextDown(1.0625), Math.nextUp(1.0625), 0.0625, 1.0625,
            1e-300, 123456789.123456789, 4503599627370495.5, 4503599627370497.0};
        for (double base : edges) {
            for (double x : new double[] {base, -base, Math.nextUp(base), Math.nextDown(base)}) {
                if (!Double.isFinite(x)) {
                    continue;
                }
                for (int dd = 0; dd <= 15; dd++) {
                    int d = dd;
                    String expected = bigDecimalFixed(x, d);
                    assertEquals(expected, NumberText.fixed(x, d), () -> Double.doubleToRawLongBits(x) + "L");
                    out.clear();
                    double written = out.appendFixed(x, d);
                    assertEquals(expected, out.toString(), () -> Double.doubleToRawLongBits(x) + "L with " + d);
                    assertEquals(Double.parseDouble(expected) + 0.0, written + 0.0, () -> expected + " read back");
                }
            }
        }
        // exact binary ties at every decimal count: x·10^d is an odd multiple of 1/2
        for (int d = 0; d <= 15; d++) {
            for (long j = -2000; j <= 2000; j++) {
                double x = (2 * j + 1) / Math.pow(2, d + 1);
                assertEquals(bigDecimalFixed(x, d), NumberText.fixed(x, d), x + " with " + d);
            }
        }
        out.clear();
        out.appendLong(0);
        out.append((byte) ',');
        out.appendLong(-9876543210L);
        out.append((byte) ',');
        out.appendLong(Long.MIN_VALUE);
        out.append((byte) ',');
        out.appendLong(Long.MAX_VALUE);
        assertEquals("0,-9876543210," + Long.MIN_VALUE + "," + Long.MAX_VALUE, out.toString());
        assertThrows(IllegalArgumentException.class, () -> new ByteText(8).appendFixed(Double.NaN, 2));
    }
}
