package org.cardwright.data;

/**
 * One I-V point, in SI units.
 *
 * @param voltage     anode-to-cathode voltage; reverse points are negative [V]
 * @param current     current from anode to cathode; reverse points are negative [A]
 * @param temperature device temperature [K]
 * @param line        physical 1-based line of the file the point was read from, or 0 when it was not read from
 *                    a file [1]
 */
public record IvPoint(double voltage, double current, double temperature, int line) {

    /** Checks that every quantity is finite, the temperature lies above absolute zero and the line is not negative. */
    public IvPoint {
        PointChecks.finite("voltage", voltage, "V");
        PointChecks.finite("current", current, "A");
        PointChecks.temperature(temperature);
        PointChecks.line(line);
    }
}
