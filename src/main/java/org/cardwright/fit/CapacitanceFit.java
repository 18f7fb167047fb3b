package org.cardwright.fit;

import java.util.List;
import java.util.Optional;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;

/**
 * What a C-V fit produced.
 *
 * @param parameters       the card's parameters: the DC parameters given to the fit plus the fitted CJO, VJ, M
 *                         (and FC, TT where the data determine them) [SI]
 * @param fitted           the capacitance parameters (CJO, VJ, M, FC, TT) the card gives, with origin and
 *                         standard error (scaled by the reduced chi-square)
 * @param correlations     correlations of the fitted parameters
 * @param chiSquare        sum of squared weighted residuals [1]
 * @param reducedChiSquare chi-square per degree of freedom [1]
 * @param points           number of points fitted
 * @param degreesOfFreedom points minus fitted parameters
 * @param evaluations      model evaluations of the final fit
 * @param iterations       optimiser iterations of the final fit
 * @param stopReason       why the optimiser stopped, in words
 * @param residuals        residual statistics per temperature, in %
 * @param terms            decisions about FC and TT
 * @param warnings         plain-language warnings
 * @param options          stray capacitance and test frequency used
 */
public record CapacitanceFit(DiodeParameters parameters, List<FittedParameter> fitted, Correlations correlations,
                             double chiSquare, double reducedChiSquare, int points, int degreesOfFreedom,
                             int evaluations, int iterations, String stopReason, List<CapacitanceResiduals> residuals,
                             List<TermDecision> terms, List<String> warnings, CapacitanceOptions options) {
    public CapacitanceFit {
        fitted = List.copyOf(fitted);
        residuals = List.copyOf(residuals);
        terms = List.copyOf(terms);
        warnings = List.copyOf(warnings);
    }

    /** The result line of one parameter, if the fit reports it. */
    public Optional<FittedParameter> parameter(Param p) {
        return fitted.stream().filter(f -> f.param() == p).findFirst();
    }

    /** Largest RMS residual over the temperatures [%]. */
    public double worstRmsPercent() {
        return residuals.stream().mapToDouble(CapacitanceResiduals::rmsPercent).max().orElse(Double.NaN);
    }
}
