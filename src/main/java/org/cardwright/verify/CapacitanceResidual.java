package org.cardwright.verify;

/**
 * One C-V point of a verification.
 *
 * @param point             the measurement
 * @param deviceCapacitance the reading minus the stray capacitance [F]
 * @param simulated         simulated capacitance of the device at the measured voltage [F]
 */
public record CapacitanceResidual(CapacitanceMeasurement point, double deviceCapacitance, double simulated) {
    /** 100 (simulated - device)/device [%]. */
    public double residualPercent() {
        return 100 * (simulated - deviceCapacitance) / deviceCapacitance;
    }
}
