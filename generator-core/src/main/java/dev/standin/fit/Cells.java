package dev.standin.fit;

import java.math.BigDecimal;
import java.time.Instant;
import java.time.LocalDate;
import java.time.OffsetDateTime;
import java.time.format.DateTimeParseException;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * How a single cell is read: which texts mean "missing", and how numbers, booleans, dates and
 * timestamps are recognised. Surrounding white space is ignored everywhere.
 */
public final class Cells {

    /**
     * The texts read as a missing value: empty, {@code NA}, {@code N/A}, {@code null}, {@code NULL},
     * {@code NaN} and {@code -} — the markers written by R, pandas, spreadsheets and SQL exports
     * (common practice).
     */
    public static final Set<String> MISSING = Set.of("", "NA", "N/A", "null", "NULL", "NaN", "-");

    /** Whole numbers; leading zeros (as in codes such as {@code 007}) make a value text. */
    private static final Pattern INTEGER = Pattern.compile("[+-]?(0|[1-9][0-9]{0,17})");
    /** Decimal numbers; the integer part has no leading zeros. */
    private static final Pattern DECIMAL = Pattern.compile("[+-]?((0|[1-9][0-9]*)(\\.[0-9]*)?|\\.[0-9]+)([eE][+-]?[0-9]{1,3})?");
    private static final Pattern DATE = Pattern.compile("[0-9]{4}-[0-9]{2}-[0-9]{2}");
    private static final long TWO_POW_53 = 1L << 53;

    private Cells() {
    }

    /** True when the cell is one of the {@link #MISSING} markers. */
    public static boolean missing(String cell) {
        return cell == null || MISSING.contains(cell.strip());
    }

    /** The whole number, or null when the text is not one (or is beyond ±2<sup>53</sup>, where doubles skip integers). */
    static Long integer(String cell) {
        String t = cell.strip();
        if (!INTEGER.matcher(t).matches()) {
            return null;
        }
        long v = Long.parseLong(t);
        return Math.abs(v) <= TWO_POW_53 ? v : null;
    }

    /** The decimal number as a double, or null. */
    static Double decimal(String cell) {
        String t = cell.strip();
        if (!DECIMAL.matcher(t).matches()) {
            return null;
        }
        double d = Double.parseDouble(t);
        return Double.isFinite(d) ? d : null;
    }

    /** Digits after the decimal point as written ({@code 5.10} has 2; {@code 1.5e-3} has 4), at least 0. */
    static int decimals(String cell) {
        return Math.max(0, new BigDecimal(cell.strip()).scale());
    }

    /** {@code true}/{@code false} in any letter case, or null. */
    static Boolean bool(String cell) {
        String t = cell.strip();
        if (t.equalsIgnoreCase("true")) {
            return Boolean.TRUE;
        }
        if (t.equalsIgnoreCase("false")) {
            return Boolean.FALSE;
        }
        return null;
    }

    /** An ISO date as days since 1970-01-01, or null. */
    static Long date(String cell) {
        String t = cell.strip();
        if (!DATE.matcher(t).matches()) {
            return null;
        }
        try {
            return LocalDate.parse(t).toEpochDay();
        } catch (DateTimeParseException e) {
            return null;
        }
    }

    /** An ISO instant ({@code Z} or an offset) as whole seconds since 1970-01-01T00:00:00Z (floor), or null. */
    static Long timestamp(String cell) {
        String t = cell.strip();
        if (t.length() < 16 || t.indexOf('T') != 10) {
            return null;
        }
        try {
            return Instant.parse(t).getEpochSecond();
        } catch (DateTimeParseException e) {
            try {
                return OffsetDateTime.parse(t).toInstant().getEpochSecond();
            } catch (DateTimeParseException e2) {
                return null;
            }
        }
    }
}
