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
 * @param pass         true when both limits hold
 */
public record CapacitanceVerdict(double temperature, int points, double rmsPercent, double maxPercent,
                                 double worstVoltage, String worstSource, boolean pass) {
}
