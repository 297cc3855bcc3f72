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

    /** The value rounded half-even to {@code decimals} digits after the point, in plain notation. */
    public static String fixed(double value, int decimals) {
        requireFinite(value);
        return new BigDecimal(value).setScale(decimals, RoundingMode.HALF_EVEN).toPlainString();
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
