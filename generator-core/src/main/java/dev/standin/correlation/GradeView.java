package dev.standin.correlation;

import dev.standin.marginal.Marginal;

/**
 * A marginal seen through its mid-distribution function: values G(F<sup>-1</sup>(p)). The Pearson
 * correlation of two such views is the population Spearman ρ of the originals, ties counted by
 * mid-ranks (Kruskal 1958), so NORTA on grade views solves Spearman targets for discrete columns.
 * For a continuous marginal G = F, so G(F<sup>-1</sup>(p)) = p: the view returns p itself, exactly and
 * without inverting F (whatever F is, its grades are uniform, so the latent of a continuous–discrete
 * Spearman target does not depend on the continuous column's family).
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
        return m.isDiscrete() ? m.grade(m.quantile(p)) : p;
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
