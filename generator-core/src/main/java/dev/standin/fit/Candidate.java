package dev.standin.fit;

import dev.standin.marginal.Marginal;
import java.util.List;

/**
 * One distribution family fitted to a numeric column, with the numbers used to compare families.
 *
 * @param family the spec's family word
 * @param params the parameters as they are written into the spec (already rounded), in order
 * @param marginal the distribution those written parameters define
 * @param parameters the number of fitted parameters k, for the AIC
 * @param logLikelihood the log-likelihood of the values as written (see {@link FamilyFits})
 * @param ksDistance the Kolmogorov-Smirnov distance D between the data and the fitted distribution
 * @param ksPValue the KS p-value P(D<sub>n</sub> ≥ D) from Kolmogorov's distribution
 */
public record Candidate(String family, List<Param> params, Marginal marginal, int parameters, double logLikelihood,
                        double ksDistance, double ksPValue) {

    /** One parameter: its spec key and its (rounded) value. */
    public record Param(String key, double value) {
    }

    public Candidate {
        params = List.copyOf(params);
    }

    /**
     * Akaike's information criterion 2k − 2 ln L (H. Akaike, "A new look at the statistical model
     * identification", IEEE Trans. Automatic Control 19 (1974) 716-723); smaller is better.
     */
    public double aic() {
        return 2.0 * parameters - 2.0 * logLikelihood;
    }

    /** The parameter with this key, or NaN. */
    public double param(String key) {
        for (Param p : params) {
            if (p.key().equals(key)) {
                return p.value();
            }
        }
        return Double.NaN;
    }
}
