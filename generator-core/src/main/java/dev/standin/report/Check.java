package dev.standin.report;

/**
 * One fidelity check of a written dataset against its spec.
 *
 * @param name what is checked, e.g. {@code mean of wind_knots} or {@code spearman of a ~ b}
 * @param target the value the spec implies (for test statistics: their expected value under the spec)
 * @param achieved what the written data gave
 * @param tolerance the largest |achieved − target| accepted (for KS and χ²: the critical value of the statistic)
 * @param pass true or false; null when the check has no power at this row count (see note)
 * @param note why a check was not made, or how its tolerance was derived
 */
public record Check(String name, double target, double achieved, double tolerance, Boolean pass, String note) {

    /** True unless the check was made and failed. */
    public boolean ok() {
        return pass == null || pass;
    }

    /** One line for logs, e.g. {@code mean of fare: 48.3 vs target 48 (tolerance 0.12)}. */
    public String describe() {
        String verdict = pass == null ? "not checked" : pass ? "ok" : "FAILED";
        return name + ": " + verdict + " — achieved " + text(achieved) + ", target " + text(target) + ", tolerance "
                + text(tolerance) + (note == null ? "" : " (" + note + ")");
    }

    private static String text(double v) {
        return Double.isFinite(v) ? dev.standin.output.NumberText.shortest(Math.abs(v) >= 1e-4 || v == 0
                ? Double.parseDouble(String.format(java.util.Locale.ROOT, "%.6g", v)) : v) : "n/a";
    }
}
