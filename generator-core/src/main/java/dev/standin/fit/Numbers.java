package dev.standin.fit;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;

/** Rounding helpers for the numbers written into a fitted spec. */
final class Numbers {

    /** Significant digits kept for fitted parameters: enough that rounding moves no fit measurably. */
    static final int PARAMETER_DIGITS = 6;

    private Numbers() {
    }

    /** The value rounded half-even to {@code digits} significant digits. */
    static double significant(double x, int digits) {
        if (x == 0.0 || !Double.isFinite(x)) {
            return x;
        }
        return new BigDecimal(x).round(new MathContext(digits, RoundingMode.HALF_EVEN)).doubleValue();
    }

    /** The value rounded half-even to {@code decimals} digits after the point. */
    static double fixed(double x, int decimals) {
        return new BigDecimal(x).setScale(decimals, RoundingMode.HALF_EVEN).doubleValue();
    }

    /** The largest multiple of {@code step} at or below x (step a power of ten or 2 or 5 times one). */
    static double floorTo(double x, double step) {
        BigDecimal s = new BigDecimal(stepText(step));
        return new BigDecimal(x).divide(s, 0, RoundingMode.FLOOR).multiply(s).doubleValue();
    }

    /** The smallest multiple of {@code step} at or above x. */
    static double ceilTo(double x, double step) {
        BigDecimal s = new BigDecimal(stepText(step));
        return new BigDecimal(x).divide(s, 0, RoundingMode.CEILING).multiply(s).doubleValue();
    }

    /**
     * A "nice" step (1, 2 or 5 times a power of ten) of at least {@code raw} and at least {@code floor}:
     * the usual axis-rounding series (common practice).
     */
    static double niceStep(double raw, double floor) {
        double target = Math.max(raw, floor);
        if (!(target > 0) || !Double.isFinite(target)) {
            return floor > 0 ? floor : 1.0;
        }
        int exp = (int) StrictMath.floor(StrictMath.log10(target));
        for (int e = exp - 1; e <= exp + 1; e++) {
            for (int m : new int[] {1, 2, 5}) {
                double s = new BigDecimal(m).scaleByPowerOfTen(e).doubleValue();
                if (s >= target * (1 - 1e-12)) {
                    return Math.max(s, floor);
                }
            }
        }
        return new BigDecimal(1).scaleByPowerOfTen(exp + 2).doubleValue();
    }

    /** 10<sup>−decimals</sup> as a double. */
    static double resolution(int decimals) {
        return new BigDecimal(1).scaleByPowerOfTen(-decimals).doubleValue();
    }

    private static String stepText(double step) {
        return dev.standin.output.NumberText.shortest(step);
    }
}
