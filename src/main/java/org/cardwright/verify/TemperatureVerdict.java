package org.cardwright.verify;

/**
 * Verification summary at one temperature.
 *
 * @param temperature  device temperature [K]
 * @param points       number of points
 * @param rms          RMS of simulated minus measured voltage [V]
 * @param max          largest residual magnitude [V]
 * @param worstCurrent current at the largest residual [A]
 * @param worstSource  "file:line" of the largest residual
 * @param pass         the verdict (by the data's uncertainty or the fixed limits, as asked)
 * @param stated       points with a stated uncertainty
 * @param beyondThree  of those, how many lie more than three of their own standard uncertainties off
 * @param noise        the residuals against the data's own uncertainty [V]
 * @param fixedPass    true when the fixed limits hold
 */
public record TemperatureVerdict(double temperature, int points, double rms, double max, double worstCurrent,
                                 String worstSource, boolean pass, int stated, int beyondThree,
                                 DataUncertainty noise, boolean fixedPass) {

    /** A verdict by the fixed limits alone (no uncertainty figure). */
    public TemperatureVerdict(double temperature, int points, double rms, double max, double worstCurrent,
                              String worstSource, boolean pass, int stated, int beyondThree) {
        this(temperature, points, rms, max, worstCurrent, worstSource, pass, stated, beyondThree,
                new DataUncertainty(Double.NaN, DataUncertainty.NONE, Double.NaN, Double.NaN, true), pass);
    }
}
