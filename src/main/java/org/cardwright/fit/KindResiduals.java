package org.cardwright.fit;

/**
 * Residual statistics of one data kind other than forward I-V at one temperature, in that kind's own unit.
 *
 * @param kind        e.g. "breakdown", "C-V", "reverse recovery"
 * @param temperature device temperature [K]
 * @param points      number of points
 * @param rms         RMS residual, in {@code unit}
 * @param max         largest residual magnitude, in {@code unit}
 * @param unit        "mV", "%" or "ns"
 * @param worst       "file:line" of the largest residual
 */
public record KindResiduals(String kind, double temperature, int points, double rms, double max, String unit,
                            String worst) {
}
