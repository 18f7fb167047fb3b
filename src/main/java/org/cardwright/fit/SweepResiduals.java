package org.cardwright.fit;

/**
 * Residual statistics (model minus measurement, in terminal voltage) of the points at one temperature.
 *
 * @param temperature  device temperature [K]
 * @param points       number of points
 * @param lowCurrent   smallest measured current [A]
 * @param highCurrent  largest measured current [A]
 * @param rms          root-mean-square residual [V]
 * @param max          largest residual magnitude [V]
 * @param worstCurrent current at which the largest residual occurs [A]
 */
public record SweepResiduals(double temperature, int points, double lowCurrent, double highCurrent,
                             double rms, double max, double worstCurrent) {
}
