package org.cardwright.sim;

/**
 * A simulated DC solution.
 *
 * @param voltage terminal voltage, anode to cathode [V]
 * @param current terminal current, anode to cathode [A]
 */
public record OperatingPoint(double voltage, double current) {
}
