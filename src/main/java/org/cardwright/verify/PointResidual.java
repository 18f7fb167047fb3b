package org.cardwright.verify;

/**
 * One point of a verification.
 *
 * @param point     the measurement
 * @param simulated simulated terminal voltage at the measured current [V]
 */
public record PointResidual(MeasuredPoint point, double simulated) {
    /** Simulated minus measured voltage [V]. */
    public double residual() {
        return simulated - point.voltage();
    }
}
