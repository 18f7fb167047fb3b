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
 * @param pass         true when both limits hold
 * @param stated       points with a stated uncertainty
 * @param beyondThree  of those, how many lie more than three of their own standard uncertainties off
 */
public record TemperatureVerdict(double temperature, int points, double rms, double max, double worstCurrent,
                                 String worstSource, boolean pass, int stated, int beyondThree) {
}
