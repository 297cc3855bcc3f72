package dev.standin.fit;

import dev.standin.engine.ToolInfo;
import dev.standin.marginal.Families;
import dev.standin.marginal.Marginal;
import dev.standin.marginal.UniformMarginal;
import dev.standin.output.NumberText;
import java.math.BigDecimal;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * Fits a stand-in spec to a real table: each column's type and distribution, the missing fraction and
 * a Spearman correlation block, written as a spec that Standin's own parser reads.
 *
 * <h2>Privacy safeguards (all on)</h2>
 * <ul>
 *   <li><b>No raw rows or cells.</b> The spec holds fitted parameters, rounded deciles, proportions and
 *   correlations; the only data text copied is the label of a category seen at least K times. Reason:
 *   a copied row or cell is a disclosed record.</li>
 *   <li><b>Rare categories merged.</b> Levels seen fewer than K times ({@link FitOptions#minCategoryCount},
 *   default 10) become one level ({@link FitOptions#otherLabel}); if those rows are themselves fewer than
 *   K, they are left out of the weights. Reason: a rare label can single out the few rows that carry it.</li>
 *   <li><b>Identifiers and free text not modelled.</b> A text column whose values are all distinct, or
 *   a whole-number column whose values are all distinct and dense (or whose name ends in id, key,
 *   no, nr or number), is written as {@code sequence} 1, 2, 3, ...; a text column in which more than
 *   half of the values occur once is left out. Reason: their values are the records themselves, and as
 *   categories every one of them would be copied (or merged into nothing useful).</li>
 *   <li><b>Robust bounds.</b> Date and timestamp ranges and the ends of quantile tables come from robust
 *   quantiles rounded outward, never the real minimum or maximum ({@link RobustBounds}). Reason: the
 *   extremes are single records.</li>
 *   <li><b>Coarse quantile tables.</b> A column that no family fits gets deciles only. Reason: a fine
 *   table would approach the sorted data itself.</li>
 *   <li><b>Formula guard.</b> The spec turns on {@code guard-formulas} in its output block. Reason: a
 *   stand-in is often opened in a spreadsheet, where a label such as {@code =HYPERLINK(...)} would run.</li>
 * </ul>
 * These reduce but do not remove disclosure risk ({@link FitResult#CAUTION}); the fitted spec's sample
 * is checked by {@link DisclosureCheck}.
 */
public final class Fitter {

    /** The level of the KS test that rejects a family (Kolmogorov's distribution). */
    public static final double KS_ALPHA = 0.001;

    /** The most columns in one correlation block (the spec parser's limit). */
    static final int MAX_CORRELATED = 500;

    private static final Pattern ID_NAME = Pattern.compile("(?i)(^|.*[_ .-])(id|key|no|nr|number)$|.*[a-z0-9]Id$|^ID$");
    private static final Set<String> WINDOWS_DEVICES = Set.of("con", "prn", "aux", "nul", "com1", "com2", "com3", "com4",
            "com5", "com6", "com7", "com8", "com9", "lpt1", "lpt2", "lpt3", "lpt4", "lpt5", "lpt6", "lpt7", "lpt8", "lpt9");

    private final FitOptions options;
    private final List<String> notes = new ArrayList<>();

    private Fitter(FitOptions options) {
        this.options = options;
    }

    /**
     * Fits a spec to a table.
     *
     * @throws FitException when a header name cannot be a spec column name, the table has no rows, or
     *     the other-label collides with a kept level
     */
    public static FitResult fit(CsvTable table, FitOptions options) throws FitException {
        return new Fitter(options).run(table);
    }

    private FitResult run(CsvTable table) throws FitException {
        if (table.size() == 0) {
            throw FitException.at(table.file(), 2, 1, "data file has a header but no records; a fit needs at least one");
        }
        for (int j = 0; j < table.header().size(); j++) {
            String name = table.header().get(j);
            if (name.length() > 128 || name.indexOf('~') >= 0 || !name.strip().equals(name)
                    || name.chars().anyMatch(Character::isISOControl)) {
                throw FitException.at(table.file(), 1, table.headerColumns()[j], "column " + (j + 1) + " name must be 1 to 128"
                        + " characters without '~', control characters or surrounding spaces to be a spec column: \"" + name + "\"");
            }
        }
        List<ColumnFit> columns = new ArrayList<>();
        for (int j = 0; j < table.header().size(); j++) {
            columns.add(column(ColumnData.of(table, j), table.size()));
        }
        List<Dependence.Input> inputs = new ArrayList<>();
        for (ColumnFit c : columns) {
            if (c.correlated() && inputs.size() < MAX_CORRELATED) {
                inputs.add(new Dependence.Input(c.name(), c.codes(), c.marginal(), c.kind() == ColumnKind.TEXT));
            } else if (c.correlated()) {
                notes.add("column '" + c.name() + "': left out of the correlation block (the spec allows " + MAX_CORRELATED
                        + " correlated columns)");
            }
        }
        Dependence.Result dep = inputs.size() >= 2 ? Dependence.estimate(inputs) : null;
        String dataset = options.dataset() != null ? options.dataset() : datasetName(table.file());
        long rows = options.rows() != null ? options.rows() : table.size();
        long seed = options.seedOrDefault();
        if (columns.stream().allMatch(c -> c.role() == ColumnFit.Role.DROPPED)) {
            throw FitException.at(table.file(), 1, 1, "no column can be modelled (each is empty, free text or has too few"
                    + " rows per value); nothing to fit");
        }
        String text = SpecText.write(table, dataset, rows, seed, columns, dep);
        return new FitResult(text, dataset, rows, seed, table.size(), columns, dep, notes);
    }

    /** The dataset name derived from a file name: its base name in lower case, other characters as '-'. */
    static String datasetName(String file) {
        String base = file.replace('\\', '/');
        base = base.substring(base.lastIndexOf('/') + 1);
        int dot = base.lastIndexOf('.');
        if (dot > 0) {
            base = base.substring(0, dot);
        }
        String s = base.toLowerCase(Locale.ROOT).replaceAll("[^a-z0-9_-]+", "-").replaceAll("^[^a-z0-9]+", "")
                .replaceAll("-+$", "");
        if (s.isEmpty()) {
            s = "fitted";
        }
        if (s.length() > 120) {
            s = s.substring(0, 120);
        }
        return WINDOWS_DEVICES.contains(s) ? s + "-data" : s;
    }

    private ColumnFit column(ColumnData c, int n) throws FitException {
        return switch (c.kind()) {
            case EMPTY -> dropped(c, "every cell is missing; left out");
            case TEXT -> text(c, n);
            case BOOLEAN -> bool(c, n);
            case DATE -> date(c, n);
            case TIMESTAMP -> timestamp(c, n);
            case INTEGER, DECIMAL -> numeric(c, n);
        };
    }

    private ColumnFit dropped(ColumnData c, String note) {
        notes.add("column '" + c.name() + "': " + note);
        return new ColumnFit(c.name(), c.kind(), ColumnFit.Role.DROPPED, null, List.of(), List.of(c.name() + ": " + note),
                note, null, 0, List.of(), null, Double.NaN, Double.NaN, Double.NaN, List.of(), null);
    }

    private ColumnFit sequence(ColumnData c, String note) {
        notes.add("column '" + c.name() + "': " + note);
        return new ColumnFit(c.name(), c.kind(), ColumnFit.Role.SEQUENCE, "sequence",
                List.of(YamlText.string(c.name()) + ": {dist: sequence, start: 1, step: 1}"),
                List.of(c.name() + ": " + note), note, null, 0, List.of(), null, Double.NaN, Double.NaN, Double.NaN,
                List.of(), null);
    }

    /** The fraction of missing values as written: 4 decimals, at least 0.0001 when any is missing, below 1. */
    private static double nulls(ColumnData c, int n) {
        if (c.missing() == 0) {
            return 0;
        }
        double f = Numbers.fixed((double) c.missing() / n, 4);
        return Math.min(Math.max(f, 0.0001), 0.9999);
    }

    private static String nullsKey(double nulls) {
        return nulls > 0 ? ", nulls: " + YamlText.number(nulls) : "";
    }

    private static String describe(ColumnData c) {
        return c.name() + ": " + c.kind().word() + ", " + c.present() + " values" + (c.missing() > 0 ? ", " + c.missing()
                + " missing" : "");
    }

    // ---- numbers ------------------------------------------------------------------------------

    private ColumnFit numeric(ColumnData c, int n) {
        double[] sorted = c.sortedPresent();
        boolean whole = c.kind() == ColumnKind.INTEGER;
        int decimals = whole ? 0 : c.decimals();
        int distinct = distinct(sorted);
        double mean = mean(sorted);
        double sd = sd(sorted, mean);
        if (looksLikeIdentifier(c)) {
            return sequence(c, "every value is a distinct whole number: looks like an identifier; written as a sequence"
                    + " 1, 2, 3, ... instead of its values");
        }
        double nulls = nulls(c, n);
        List<String> comments = new ArrayList<>();
        double h = Numbers.resolution(decimals);
        comments.add(describe(c) + ", " + decimals + " decimal" + (decimals == 1 ? "" : "s") + "; mean " + sig(mean)
                + ", sd " + sig(sd));
        if (distinct == 1) {
            if (sorted.length < options.minCategoryCount()) {
                return dropped(c, "a single value seen fewer than " + options.minCategoryCount() + " times; left out");
            }
            double v = sorted[0];
            double lo = v - 0.4 * h;
            double hi = v + 0.4 * h;
            Marginal m = UniformMarginal.of(lo, hi);
            comments.add("one value only (seen " + sorted.length + " times): a uniform within ±0.4 of the last decimal, which writes it");
            String yaml = YamlText.string(c.name()) + ": {dist: uniform, min: " + YamlText.number(lo) + ", max: "
                    + YamlText.number(hi) + ", decimals: " + decimals + nullsKey(nulls) + "}";
            return new ColumnFit(c.name(), c.kind(), ColumnFit.Role.MODELLED, "uniform", List.of(yaml), comments, null, m,
                    nulls, List.of(), null, 0.0, mean, sd, List.of(), null);
        }
        List<Candidate> candidates = FamilyFits.fit(sorted, decimals, whole);
        Candidate chosen = null;
        for (Candidate cand : candidates) {
            if (cand.ksPValue() >= KS_ALPHA && (chosen == null || cand.aic() < chosen.aic())) {
                chosen = cand;
            }
        }
        comments.add(String.format(Locale.ROOT, "  %-12s %12s %8s %8s", "family", "AIC", "KS D", "KS p"));
        for (Candidate cand : candidates) {
            comments.add(String.format(Locale.ROOT, "  %-12s %12s %8s %8s", cand.family(), NumberText.fixed(cand.aic(), 1),
                    NumberText.fixed(cand.ksDistance(), 4), pValue(cand.ksPValue())));
        }
        String yaml;
        String family;
        Marginal marginal;
        double ks;
        if (chosen != null) {
            comments.add("chosen: " + chosen.family() + ", the lowest AIC among the families that the KS test does not reject"
                    + " at alpha = " + KS_ALPHA);
            StringBuilder sb = new StringBuilder(YamlText.string(c.name()) + ": {dist: " + chosen.family());
            for (Candidate.Param p : chosen.params()) {
                sb.append(", ").append(p.key()).append(": ").append(YamlText.number(p.value()));
            }
            if (!chosen.marginal().isDiscrete()) {
                sb.append(", decimals: ").append(decimals);
            }
            yaml = sb.append(nullsKey(nulls)).append('}').toString();
            family = chosen.family();
            marginal = chosen.marginal();
            ks = chosen.ksDistance();
        } else {
            RobustBounds.Table t = RobustBounds.quantileTable(sorted, decimals, sorted[0] >= 0);
            ks = FamilyFits.ksDistance(sorted, t.marginal(), h);
            comments.add("every family is rejected by the KS test at alpha = " + KS_ALPHA + ": a coarse quantile table"
                    + " (deciles; ends extrapolated from the 2%/10% and 90%/98% quantiles, rounded outward), KS D "
                    + NumberText.fixed(ks, 4));
            StringBuilder sb = new StringBuilder(YamlText.string(c.name()) + ": {dist: quantiles, points: {");
            for (int i = 0; i < t.probabilities().length; i++) {
                if (i > 0) {
                    sb.append(", ");
                }
                sb.append(YamlText.number(t.probabilities()[i])).append(": ").append(YamlText.number(t.values()[i]));
            }
            yaml = sb.append("}, decimals: ").append(decimals).append(nullsKey(nulls)).append('}').toString();
            family = "quantiles";
            marginal = t.marginal();
        }
        return new ColumnFit(c.name(), c.kind(), ColumnFit.Role.MODELLED, family, List.of(yaml), comments, null, marginal,
                nulls, candidates, chosen, ks, mean, sd, List.of(), c.values());
    }

    private static String pValue(double p) {
        return p < 1e-4 ? "<0.0001" : NumberText.fixed(p, 4);
    }

    private static String sig(double x) {
        return Double.isFinite(x) ? NumberText.shortest(Numbers.significant(x, 4)) : "n/a";
    }

    private static int distinct(double[] sorted) {
        int d = sorted.length == 0 ? 0 : 1;
        for (int i = 1; i < sorted.length; i++) {
            if (sorted[i] != sorted[i - 1]) {
                d++;
            }
        }
        return d;
    }

    private static double mean(double[] v) {
        double s = 0;
        for (double x : v) {
            s += x;
        }
        return s / v.length;
    }

    private static double sd(double[] v, double mean) {
        if (v.length < 2) {
            return Double.NaN;
        }
        double s = 0;
        for (double x : v) {
            s += (x - mean) * (x - mean);
        }
        return StrictMath.sqrt(s / (v.length - 1));
    }

    /**
     * True for a column that looks like an identifier: text whose values are all distinct, or whole
     * numbers all distinct and dense (range at most twice the count) or named like a key (ending in id,
     * key, no, nr or number).
     */
    static boolean looksLikeIdentifier(ColumnData c) {
        if (c.present() < 2) {
            return false;
        }
        if (c.kind() == ColumnKind.TEXT) {
            Set<String> seen = new java.util.HashSet<>();
            for (String t : c.texts()) {
                if (t != null && !seen.add(t)) {
                    return false;
                }
            }
            return true;
        }
        if (c.kind() == ColumnKind.INTEGER) {
            double[] sorted = c.sortedPresent();
            return distinct(sorted) == sorted.length && (sorted[sorted.length - 1] - sorted[0] + 1 <= 2.0 * sorted.length
                    || ID_NAME.matcher(c.name()).matches());
        }
        return false;
    }

    // ---- booleans, dates, timestamps -------------------------------------------------------------

    private ColumnFit bool(ColumnData c, int n) {
        long trues = 0;
        for (double v : c.values()) {
            if (v == 1.0) {
                trues++;
            }
        }
        long falses = c.present() - trues;
        double p = Numbers.fixed((double) trues / c.present(), 4);
        double nulls = nulls(c, n);
        List<String> comments = new ArrayList<>(List.of(describe(c) + "; bernoulli with p the share of true"));
        String note = null;
        long minority = Math.min(trues, falses);
        if (minority > 0 && minority < options.minCategoryCount()) {
            note = "only " + minority + " value" + (minority == 1 ? " is " : "s are ") + (trues < falses ? "true" : "false")
                    + " (fewer than " + options.minCategoryCount() + "): p rests on few rows";
            notes.add("column '" + c.name() + "': " + note);
            comments.add("note: " + note);
        }
        String yaml = YamlText.string(c.name()) + ": {dist: bernoulli, p: " + YamlText.number(p) + nullsKey(nulls) + "}";
        boolean constant = p == 0.0 || p == 1.0;
        return new ColumnFit(c.name(), c.kind(), ColumnFit.Role.MODELLED, "bernoulli", List.of(yaml), comments, note,
                Families.bernoulli(p), nulls, List.of(), null, Double.NaN, Double.NaN, Double.NaN, List.of(),
                constant ? null : c.values());
    }

    private ColumnFit date(ColumnData c, int n) {
        double[] sorted = c.sortedPresent();
        RobustBounds.DayRange r = RobustBounds.dates(sorted);
        Marginal m = Families.dates(r.from(), r.to());
        double nulls = nulls(c, n);
        double ks = FamilyFits.ksDistance(sorted, m, 1.0);
        List<String> comments = List.of(describe(c) + "; uniform over the days from .. to (the spec's date family),"
                + " ends from robust quantiles rounded outward; KS D " + NumberText.fixed(ks, 4));
        String yaml = YamlText.string(c.name()) + ": {dist: date, from: " + r.fromDate() + ", to: " + r.toDate()
                + nullsKey(nulls) + "}";
        return new ColumnFit(c.name(), c.kind(), ColumnFit.Role.MODELLED, "date", List.of(yaml), comments, null, m, nulls,
                List.of(), null, ks, Double.NaN, Double.NaN, List.of(), r.from() == r.to() ? null : c.values());
    }

    private ColumnFit timestamp(ColumnData c, int n) {
        double[] sorted = c.sortedPresent();
        long[] r = RobustBounds.timestamps(sorted);
        Marginal m = Families.timestamps(r[0], r[1]);
        double nulls = nulls(c, n);
        double ks = FamilyFits.ksDistance(sorted, m, 1.0);
        List<String> comments = List.of(describe(c) + "; uniform over the seconds from .. to (the spec's timestamp"
                + " family), ends from robust quantiles rounded outward; KS D " + NumberText.fixed(ks, 4));
        String yaml = YamlText.string(c.name()) + ": {dist: timestamp, from: " + Instant.ofEpochSecond(r[0]) + ", to: "
                + Instant.ofEpochSecond(r[1]) + nullsKey(nulls) + "}";
        return new ColumnFit(c.name(), c.kind(), ColumnFit.Role.MODELLED, "timestamp", List.of(yaml), comments, null, m,
                nulls, List.of(), null, ks, Double.NaN, Double.NaN, List.of(), c.values());
    }

    // ---- text -----------------------------------------------------------------------------------

    private ColumnFit text(ColumnData c, int n) throws FitException {
        Map<String, Integer> counts = new HashMap<>();
        for (String t : c.texts()) {
            if (t != null) {
                counts.merge(t, 1, Integer::sum);
            }
        }
        int present = c.present();
        if (counts.size() == present && present >= 2) {
            return sequence(c, "every value is distinct: looks like an identifier; written as a sequence 1, 2, 3, ..."
                    + " instead of its values");
        }
        long singletons = counts.values().stream().filter(v -> v == 1).count();
        if (singletons * 2 > present) {
            return dropped(c, singletons + " of " + present + " values occur only once: looks like free text or an"
                    + " identifier; left out");
        }
        int k = options.minCategoryCount();
        List<String> kept = new ArrayList<>();
        int rareLevels = 0;
        int rareRows = 0;
        for (Map.Entry<String, Integer> e : counts.entrySet()) {
            if (e.getValue() >= k) {
                kept.add(e.getKey());
            } else {
                rareLevels++;
                rareRows += e.getValue();
            }
        }
        kept.sort(Fitter::compareLabels);
        String other = options.otherLabel();
        boolean otherLevel = rareLevels > 0 && rareRows >= k;
        if (otherLevel && kept.contains(other)) {
            throw FitException.option("other-label must differ from the levels of column '" + c.name() + "': " + other);
        }
        if (kept.isEmpty() && !otherLevel) {
            return dropped(c, "every level is seen fewer than " + k + " times; left out");
        }
        if (kept.size() + (otherLevel ? 1 : 0) > 10_000) {
            return dropped(c, (kept.size() + (otherLevel ? 1 : 0)) + " levels, more than a categorical column may have"
                    + " (10000); left out");
        }
        String note = null;
        if (rareLevels > 0) {
            note = otherLevel
                    ? rareLevels + " level" + (rareLevels == 1 ? "" : "s") + " seen fewer than " + k + " times merged into '"
                    + other + "' (" + rareRows + " rows)"
                    : rareLevels + " level" + (rareLevels == 1 ? "" : "s") + " seen fewer than " + k + " times (" + rareRows
                    + " rows together, also fewer than " + k + ") left out of the weights";
            notes.add("column '" + c.name() + "': " + note);
        }
        List<String> levels = new ArrayList<>(kept);
        if (otherLevel) {
            levels.add(other);
        }
        Map<String, Integer> index = new LinkedHashMap<>();
        for (int i = 0; i < levels.size(); i++) {
            index.put(levels.get(i), i);
        }
        double total = 0;
        double[] counted = new double[levels.size()];
        for (Map.Entry<String, Integer> e : counts.entrySet()) {
            Integer i = index.get(e.getKey());
            if (i == null && otherLevel) {
                i = index.get(other);
            }
            if (i != null) {
                counted[i] += e.getValue();
                total += e.getValue();
            }
        }
        double[] weights = new double[levels.size()];
        for (int i = 0; i < weights.length; i++) {
            weights[i] = Math.max(Numbers.fixed(counted[i] / total, 4), 0.0001);
        }
        double[] codes = new double[c.values().length];
        for (int r = 0; r < codes.length; r++) {
            String t = c.texts()[r];
            Integer i = t == null ? null : index.get(t);
            if (t != null && i == null && otherLevel) {
                i = index.get(other);
            }
            codes[r] = i == null ? Double.NaN : i;
        }
        double nulls = nulls(c, n);
        List<String> yaml = new ArrayList<>();
        yaml.add(YamlText.string(c.name()) + ":");
        yaml.add("  dist: categorical");
        yaml.add("  levels:");
        for (int i = 0; i < levels.size(); i++) {
            yaml.add("    " + YamlText.string(levels.get(i)) + ": " + YamlText.number(weights[i]));
        }
        if (nulls > 0) {
            yaml.add("  nulls: " + YamlText.number(nulls));
        }
        List<String> comments = new ArrayList<>();
        comments.add(describe(c) + "; " + levels.size() + " level" + (levels.size() == 1 ? "" : "s")
                + " (each seen at least " + k + " times), weights the shares of the rows");
        if (note != null) {
            comments.add("note: " + note);
        }
        Marginal m = Families.categorical(levels.toArray(new String[0]), weights);
        return new ColumnFit(c.name(), c.kind(), ColumnFit.Role.MODELLED, "categorical", yaml, comments, note, m, nulls,
                List.of(), null, Double.NaN, Double.NaN, Double.NaN, levels, levels.size() > 1 ? codes : null);
    }

    /**
     * The order of levels in the spec (which the copula's latent scale follows): numerically when both
     * labels are numbers, else by UTF-16 code units (String order, the same on every platform).
     */
    static int compareLabels(String a, String b) {
        BigDecimal x = number(a);
        BigDecimal y = number(b);
        if (x != null && y != null) {
            int c = x.compareTo(y);
            return c != 0 ? c : a.compareTo(b);
        }
        if (x != null) {
            return -1;
        }
        if (y != null) {
            return 1;
        }
        return a.compareTo(b);
    }

    private static BigDecimal number(String s) {
        try {
            return s.length() <= 40 ? new BigDecimal(s) : null;
        } catch (NumberFormatException e) {
            return null;
        }
    }

    static final Comparator<String> LABEL_ORDER = Fitter::compareLabels;

    static String version() {
        return ToolInfo.name() + " " + ToolInfo.version();
    }
}
