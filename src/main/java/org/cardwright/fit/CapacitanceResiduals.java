package org.cardwright.fit;

/**
 * Capacitance residual statistics at one temperature, relative to the measured device capacitance (reading
 * minus stray capacitance).
 *
 * @param temperature device temperature [K]
 * @param points      number of points
 * @param lowVoltage  lowest measured terminal voltage [V]
 * @param highVoltage highest measured terminal voltage [V]
 * @param rmsPercent  root-mean-square of 100 (C_model - C_device)/C_device [%]
 * @param maxPercent  largest magnitude of that residual [%]
 * @param worstVoltage terminal voltage of the largest residual [V]
 * @param worstSource "file:line" of the largest residual
 */
public record CapacitanceResiduals(double temperature, int points, double lowVoltage, double highVoltage,
                                   double rmsPercent, double maxPercent, double worstVoltage, String worstSource) {
}
