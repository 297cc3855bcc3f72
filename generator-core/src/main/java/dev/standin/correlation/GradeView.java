package dev.standin.correlation;

import dev.standin.marginal.Marginal;

/**
 * A marginal seen through its mid-distribution function: values G(F<sup>-1</sup>(p)). The Pearson
 * correlation of two such views is the population Spearman ρ of the originals, ties counted by
 * mid-ranks (Kruskal 1958), so NORTA on grade views solves Spearman targets for discrete columns.
 */
final class GradeView implements Marginal {

    private final Marginal m;

    GradeView(Marginal m) {
        this.m = m;
    }

    Marginal base() {
        return m;
    }

    @Override
    public boolean isDiscrete() {
        return m.isDiscrete();
    }

    @Override
    public String family() {
        return "grade of " + m.family();
    }

    @Override
    public double quantile(double p) {
        return m.grade(m.quantile(p));
    }

    @Override
    public double cdf(double x) {
        throw new UnsupportedOperationException("not needed");
    }

    @Override
    public double mean() {
        return 0.5;
    }

    @Override
    public double sd() {
        throw new UnsupportedOperationException("not needed");
    }
}
