package org.cardwright.fit;

import java.util.List;
import java.util.Optional;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;

/**
 * Everything a fit produced: the parameter set for the card, per-parameter values and standard errors,
 * correlations, chi-square, residuals per temperature, the optimiser's stopping reason, which optional terms
 * went in, and plain-language warnings.
 *
 * @param parameters       the parameters for the card [SI]
 * @param fitted           every parameter the card gives, with its origin and standard error
 * @param correlations     correlations of the fitted parameters
 * @param chiSquare        sum of squared weighted residuals [1]
 * @param reducedChiSquare chi-square per degree of freedom [1]
 * @param points           number of points fitted
 * @param degreesOfFreedom points minus fitted parameters
 * @param evaluations      model evaluations of the final fit
 * @param iterations       optimiser iterations of the final fit
 * @param stopReason       why the optimiser stopped, in words
 * @param residuals        forward residual statistics per temperature
 * @param otherResiduals   residual statistics of the other data kinds, in their own units
 * @param terms            decisions about optional terms
 * @param warnings         plain-language warnings
 * @param shunt            the resistor fitted between the terminals beside the junction, when the data show one
 */
public record FitResult(DiodeParameters parameters, List<FittedParameter> fitted, Correlations correlations,
                        double chiSquare, double reducedChiSquare, int points, int degreesOfFreedom,
                        int evaluations, int iterations, String stopReason, List<SweepResiduals> residuals,
                        List<KindResiduals> otherResiduals, List<TermDecision> terms, List<String> warnings,
                        Optional<ShuntResistance> shunt) {
    public FitResult {
        java.util.Objects.requireNonNull(shunt, "shunt");
        fitted = List.copyOf(fitted);
        residuals = List.copyOf(residuals);
        otherResiduals = List.copyOf(otherResiduals);
        terms = List.copyOf(terms);
        warnings = List.copyOf(warnings);
    }

    /** A result without a shunt resistor (the form every fit had before shunts were fitted). */
    public FitResult(DiodeParameters parameters, List<FittedParameter> fitted, Correlations correlations,
                     double chiSquare, double reducedChiSquare, int points, int degreesOfFreedom,
                     int evaluations, int iterations, String stopReason, List<SweepResiduals> residuals,
                     List<KindResiduals> otherResiduals, List<TermDecision> terms, List<String> warnings) {
        this(parameters, fitted, correlations, chiSquare, reducedChiSquare, points, degreesOfFreedom, evaluations,
                iterations, stopReason, residuals, otherResiduals, terms, warnings, Optional.empty());
    }

    /** This result with {@code resistor} as its shunt. */
    public FitResult withShunt(ShuntResistance resistor) {
        return new FitResult(parameters, fitted, correlations, chiSquare, reducedChiSquare, points, degreesOfFreedom,
                evaluations, iterations, stopReason, residuals, otherResiduals, terms, warnings, Optional.of(resistor));
    }

    /** The result line of one parameter, if the card gives it. */
    public Optional<FittedParameter> parameter(Param p) {
        return fitted.stream().filter(f -> f.param() == p).findFirst();
    }

    /** Largest forward RMS residual over the temperatures [V]; 0 when there were no forward data. */
    public double worstRms() {
        return residuals.stream().mapToDouble(SweepResiduals::rms).max().orElse(0);
    }

    /**
     * What this result gives up against {@code better}, kind by kind: the worst RMS residual of each data kind
     * in both, e.g. "forward 20.312 mV (0.254 mV with every term), breakdown 174.1 mV (0.7 mV with every term)".
     */
    public String costAgainst(FitResult better) {
        StringBuilder sb = new StringBuilder();
        if (!residuals.isEmpty()) {
            sb.append(String.format(java.util.Locale.ROOT, "forward %.3f mV (%.3f mV with every term)",
                    worstRms() * 1e3, better.worstRms() * 1e3));
        }
        java.util.Map<String, Double> mine = worstOtherByKind();
        java.util.Map<String, Double> theirs = better.worstOtherByKind();
        for (java.util.Map.Entry<String, Double> e : theirs.entrySet()) {
            if (!mine.containsKey(e.getKey())) {
                sb.append(sb.length() == 0 ? "" : ", ").append(e.getKey()).append(" not carried");
            }
        }
        for (java.util.Map.Entry<String, Double> e : mine.entrySet()) {
            String unit = otherResiduals.stream().filter(k -> k.kind().equals(e.getKey())).findFirst().orElseThrow().unit();
            sb.append(sb.length() == 0 ? "" : ", ").append(String.format(java.util.Locale.ROOT, "%s %.3f %s (%.3f %s with every term)",
                    e.getKey(), e.getValue(), unit, theirs.getOrDefault(e.getKey(), Double.NaN), unit));
        }
        return sb.toString();
    }

    /** Worst RMS residual of each other data kind, in that kind's unit. */
    private java.util.Map<String, Double> worstOtherByKind() {
        java.util.Map<String, Double> m = new java.util.LinkedHashMap<>();
        for (KindResiduals k : otherResiduals) {
            m.merge(k.kind(), k.rms(), Math::max);
        }
        return m;
    }
}
