package dev.standin.fit;

import dev.standin.marginal.Families;
import dev.standin.marginal.Marginal;
import java.time.LocalDate;

/**
 * Ends of ranges and quantile tables taken from robust quantiles, never from the real extremes.
 *
 * <p>Reason (privacy): the minimum and maximum of a column are single records — the oldest customer,
 * the largest payment — and copying them into a spec discloses those records. So an end is
 * extrapolated from the 2% and 10% (or 90% and 98%) sample quantiles to probability 0 (or 1) along
 * the line through them, rounded outward to a coarse step, and moved one more step outward should it
 * still land exactly on the real extreme. Quantiles use Hyndman and Fan's definition 7 (linear
 * interpolation between order statistics, R's default; R. J. Hyndman and Y. Fan, "Sample quantiles in
 * statistical packages", The American Statistician 50 (1996) 361-365).
 */
public final class RobustBounds {

    /** The probabilities of a fallback quantile table: deciles plus the two extrapolated ends. */
    static final double[] DECILES = {0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1};

    private RobustBounds() {
    }

    /** The sample quantile of definition 7 for p in [0, 1] of sorted values. */
    public static double quantile(double[] sorted, double p) {
        double h = (sorted.length - 1) * p;
        int lo = (int) Math.floor(h);
        if (lo >= sorted.length - 1) {
            return sorted[sorted.length - 1];
        }
        return sorted[lo] + (h - lo) * (sorted[lo + 1] - sorted[lo]);
    }

    /** The lower end: the line through the 10% and 2% quantiles, extended to probability 0. */
    static double lowerEnd(double[] sorted) {
        double q10 = quantile(sorted, 0.10);
        double q02 = quantile(sorted, 0.02);
        return q10 - (q10 - q02) * (0.10 / 0.08);
    }

    /** The upper end: the line through the 90% and 98% quantiles, extended to probability 1. */
    static double upperEnd(double[] sorted) {
        double q90 = quantile(sorted, 0.90);
        double q98 = quantile(sorted, 0.98);
        return q90 + (q98 - q90) * (0.10 / 0.08);
    }

    /** A fallback quantile table and its written points. */
    record Table(double[] probabilities, double[] values, Marginal marginal) {
    }

    /**
     * A coarse quantile table: the deciles (rounded to one digit beyond the column's decimals) and the
     * two ends extrapolated and rounded outward. Runs of equal deciles (ties in the data) are spread
     * within ±0.4 of the column's resolution, so the table is strictly increasing and yet writes the
     * tied value. Reason (privacy): deciles are each shared by a tenth of the rows, and the ends are not
     * the real extremes (see the class comment).
     *
     * @param nonNegative true when every real value is ≥ 0: the lower end then stops at 0 (a property
     *     of the domain, not a disclosed record), written as 0
     */
    static Table quantileTable(double[] sorted, int decimals, boolean nonNegative) {
        double h = Numbers.resolution(decimals);
        int inner = DECILES.length - 2;
        double[] v = new double[DECILES.length];
        for (int i = 1; i <= inner; i++) {
            v[i] = Numbers.fixed(quantile(sorted, DECILES[i]), decimals + 1);
        }
        // spread runs of equal interior points around their value, within (v − h/2, v + h/2)
        int i = 1;
        while (i <= inner) {
            int j = i;
            while (j + 1 <= inner && v[j + 1] == v[i]) {
                j++;
            }
            int m = j - i + 1;
            if (m > 1) {
                double base = v[i];
                for (int t = 0; t < m; t++) {
                    v[i + t] = base + h * 0.8 * ((double) t / (m - 1) - 0.5);
                }
            }
            i = j + 1;
        }
        for (int k = 1; k <= inner; k++) {
            v[k] = Numbers.fixed(v[k], decimals + 2);
            if (k > 1 && !(v[k] > v[k - 1])) {
                v[k] = Numbers.fixed(v[k - 1] + h / 100, decimals + 2);
            }
        }
        double step = Numbers.niceStep((quantile(sorted, 0.9) - quantile(sorted, 0.1)) / 50, h);
        double lo = Numbers.floorTo(Math.min(lowerEnd(sorted), v[1]), step);
        if (!(lo < v[1])) {
            lo = Numbers.floorTo(v[1] - step, step);
        }
        if (lo == sorted[0]) {
            lo -= step;
        }
        if (nonNegative && lo < -0.45 * h) {
            lo = Math.min(-0.45 * h, v[1] - h / 100);
        }
        double hi = Numbers.ceilTo(Math.max(upperEnd(sorted), v[inner]), step);
        if (!(hi > v[inner])) {
            hi = Numbers.ceilTo(v[inner] + step, step);
        }
        if (hi == sorted[sorted.length - 1]) {
            hi += step;
        }
        v[0] = lo;
        v[DECILES.length - 1] = hi;
        return new Table(DECILES.clone(), v, Families.quantiles(DECILES, v));
    }

    /** Inclusive day range for a date column (days since 1970-01-01). */
    record DayRange(long from, long to) {
        LocalDate fromDate() {
            return LocalDate.ofEpochDay(from);
        }

        LocalDate toDate() {
            return LocalDate.ofEpochDay(to);
        }
    }

    /**
     * The {@code from}/{@code to} of a date column: the robust ends rounded outward to whole months
     * (first and last day) when they span a year or more, else to whole days; moved one unit further
     * out where they fall on the real first or last date.
     */
    static DayRange dates(double[] sorted) {
        double lo = Math.min(lowerEnd(sorted), quantile(sorted, 0.1));
        double hi = Math.max(upperEnd(sorted), quantile(sorted, 0.9));
        long min = (long) sorted[0];
        long max = (long) sorted[sorted.length - 1];
        boolean months = hi - lo >= 365;
        long from = (long) Math.floor(lo);
        long to = (long) Math.ceil(hi);
        if (months) {
            from = LocalDate.ofEpochDay(from).withDayOfMonth(1).toEpochDay();
            LocalDate t = LocalDate.ofEpochDay(to);
            to = t.withDayOfMonth(t.lengthOfMonth()).toEpochDay();
        }
        if (from == min) {
            from = months ? LocalDate.ofEpochDay(from).minusMonths(1).toEpochDay() : from - 1;
        }
        if (to == max) {
            if (months) {
                LocalDate t = LocalDate.ofEpochDay(to).plusMonths(1);
                to = t.withDayOfMonth(t.lengthOfMonth()).toEpochDay();
            } else {
                to = to + 1;
            }
        }
        return new DayRange(from, to);
    }

    /**
     * The {@code from}/{@code to} of a timestamp column in seconds: the robust ends rounded outward to
     * whole minutes (span under two days), hours (under 60 days) or days; moved one unit further out
     * where they fall on the real first or last instant.
     */
    static long[] timestamps(double[] sorted) {
        double lo = Math.min(lowerEnd(sorted), quantile(sorted, 0.1));
        double hi = Math.max(upperEnd(sorted), quantile(sorted, 0.9));
        double span = hi - lo;
        long unit = span < 2 * 86_400 ? 60 : span < 60 * 86_400 ? 3_600 : 86_400;
        long from = Math.floorDiv((long) Math.floor(lo), unit) * unit;
        long to = -Math.floorDiv(-(long) Math.ceil(hi), unit) * unit;
        if (from == (long) sorted[0]) {
            from -= unit;
        }
        if (to == (long) sorted[sorted.length - 1]) {
            to += unit;
        }
        return new long[] {from, to};
    }
}
