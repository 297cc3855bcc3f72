package dev.standin.fit;

import dev.standin.output.NumberText;
import dev.standin.spec.SpecParser;
import java.util.List;

/** Writes a fitted spec: the header comment, the columns with their fit comments, the correlation block. */
final class SpecText {

    private SpecText() {
    }

    static String write(CsvTable table, String dataset, long rows, long seed, List<ColumnFit> columns,
                        Dependence.Result dep) {
        StringBuilder sb = new StringBuilder();
        String source = table.file().replace('\\', '/');
        source = source.substring(source.lastIndexOf('/') + 1);
        int family = 0;
        int quantiles = 0;
        int categorical = 0;
        int other = 0;
        int sequences = 0;
        int dropped = 0;
        ColumnFit worst = null;
        for (ColumnFit c : columns) {
            switch (c.role()) {
                case SEQUENCE -> sequences++;
                case DROPPED -> dropped++;
                default -> {
                    if (c.family().equals("quantiles")) {
                        quantiles++;
                    } else if (c.chosen() != null) {
                        family++;
                    } else if (c.family().equals("categorical")) {
                        categorical++;
                    } else {
                        other++;
                    }
                    if ((c.chosen() != null || c.family().equals("quantiles"))
                            && (worst == null || c.ksDistance() > worst.ksDistance())) {
                        worst = c;
                    }
                }
            }
        }
        line(sb, "Standin spec fitted by " + Fitter.version() + " from " + source + ": " + table.size() + " rows, "
                + columns.size() + " columns");
        line(sb, "  (" + family + " fitted by a family, " + quantiles + " by a quantile table, " + categorical + " categorical, "
                + other + " boolean/date/timestamp/constant; " + sequences + " identifiers written as sequences, " + dropped
                + " left out).");
        if (worst != null) {
            line(sb, "Fit quality: largest Kolmogorov-Smirnov distance " + NumberText.fixed(worst.ksDistance(), 4) + " ("
                    + worst.name() + ", " + worst.family() + "); each column's candidates are listed above it. Families are");
            line(sb, "  chosen by AIC among those the KS test does not reject at alpha = " + Fitter.KS_ALPHA + ".");
        }
        if (dep != null) {
            line(sb, "Correlation: Spearman's rho over " + dep.order().size() + " columns"
                    + (dep.repairChange() > 0.00005 ? "; making it valid changed a latent pair by at most "
                    + NumberText.fixed(dep.repairChange(), 4) : "") + ".");
        }
        line(sb, "");
        for (String c : FitResult.CAUTION) {
            line(sb, c);
        }
        sb.append("dataset: ").append(dataset).append('\n');
        sb.append("rows: ").append(rows).append('\n');
        sb.append("seed: ").append(seed).append('\n');
        sb.append("columns:\n");
        boolean first = true;
        for (ColumnFit c : columns) {
            if (!first) {
                sb.append('\n');
            }
            first = false;
            for (String comment : c.comments()) {
                sb.append("  # ").append(YamlText.comment(comment)).append('\n');
            }
            if (c.note() != null && c.role() == ColumnFit.Role.MODELLED && c.comments().stream().noneMatch(x -> x.contains(c.note()))) {
                sb.append("  # note: ").append(YamlText.comment(c.note())).append('\n');
            }
            for (String y : c.yaml()) {
                sb.append("  ").append(y).append('\n');
            }
        }
        if (dep != null) {
            sb.append("\ncorrelation:\n");
            sb.append("  measure: spearman\n");
            sb.append("  # Spearman's rho of the real rows (pairwise complete), made valid for the Gaussian copula;\n");
            sb.append("  # pairs with a categorical column are latent correlations (levels in the order written).\n");
            sb.append("  pairs:\n");
            List<String> order = dep.order();
            for (int i = 0; i < order.size(); i++) {
                for (int j = i + 1; j < order.size(); j++) {
                    sb.append("    ").append(YamlText.quoted(order.get(i) + " ~ " + order.get(j))).append(": ")
                            .append(NumberText.fixed(dep.written()[j][i], 4)).append('\n');
                }
            }
        }
        sb.append("\noutput:\n");
        sb.append("  format: csv\n");
        sb.append("  header: true\n");
        // the formula guard: a stand-in is often opened in a spreadsheet (see Fitter's safeguards)
        sb.append("  ").append(SpecParser.GUARD_FORMULAS).append(": true\n");
        return sb.toString();
    }

    private static void line(StringBuilder sb, String text) {
        sb.append(text.isEmpty() ? "#" : "# " + YamlText.comment(text)).append('\n');
    }
}
