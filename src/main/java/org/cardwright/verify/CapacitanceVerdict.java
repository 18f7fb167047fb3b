package org.cardwright.verify;

/**
 * C-V verification summary at one temperature.
 *
 * @param temperature  device temperature [K]
 * @param points       number of points
 * @param rmsPercent   RMS of the residuals [%]
 * @param maxPercent   largest residual magnitude [%]
 * @param worstVoltage terminal voltage at the largest residual [V]
 * @param worstSource  "file:line" of the largest residual
 * @param pass         the verdict (by the data's uncertainty or the fixed limits, as asked)
 * @param noise        the residuals against the data's own uncertainty [%]
 * @param fixedPass    true when the fixed limits hold
 */
public record CapacitanceVerdict(double temperature, int points, double rmsPercent, double maxPercent,
                                 double worstVoltage, String worstSource, boolean pass, DataUncertainty noise,
                                 boolean fixedPass) {

    /** A verdict by the fixed limits alone (no uncertainty figure). */
    public CapacitanceVerdict(double temperature, int points, double rmsPercent, double maxPercent,
                              double worstVoltage, String worstSource, boolean pass) {
        this(temperature, points, rmsPercent, maxPercent, worstVoltage, worstSource, pass,
                new DataUncertainty(Double.NaN, DataUncertainty.NONE, Double.NaN, Double.NaN, true), pass);
    }
}
