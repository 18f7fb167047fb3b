package org.cardwright.data;

/**
 * One C-V point, in SI units.
 *
 * @param voltage     anode-to-cathode voltage; reverse bias is negative [V]
 * @param capacitance small-signal capacitance of the device, always positive [F]
 * @param temperature device temperature [K]
 * @param line        physical 1-based line of the file the point was read from, or 0 when it was not read from
 *                    a file [1]
 */
public record CvPoint(double voltage, double capacitance, double temperature, int line) {

    /** Checks that every quantity is finite, the capacitance is positive and the temperature lies above 0 K. */
    public CvPoint {
        PointChecks.finite("voltage", voltage, "V");
        PointChecks.finite("capacitance", capacitance, "F");
        if (!(capacitance > 0)) {
            throw new IllegalArgumentException("capacitance must be positive, got " + capacitance + " F");
        }
        PointChecks.temperature(temperature);
        PointChecks.line(line);
    }
}
