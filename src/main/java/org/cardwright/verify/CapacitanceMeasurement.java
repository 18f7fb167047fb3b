package org.cardwright.verify;

/**
 * A measured C-V point to reproduce.
 *
 * @param voltage     DC terminal voltage, anode to cathode [V]
 * @param capacitance capacitance as read, stray capacitance still included, positive [F]
 * @param temperature device temperature [K]
 * @param source      file it came from
 * @param line        line in that file
 */
public record CapacitanceMeasurement(double voltage, double capacitance, double temperature, String source, int line) {
    public CapacitanceMeasurement {
        if (!Double.isFinite(voltage) || !(capacitance > 0) || !Double.isFinite(capacitance) || !(temperature > 0)) {
            throw new IllegalArgumentException(source + ":" + line + ": a C-V point needs a finite voltage, a positive "
                    + "capacitance and a temperature above 0 K, got " + voltage + " V, " + capacitance + " F, "
                    + temperature + " K");
        }
    }

    /** "file:line" for messages. */
    public String where() {
        return source + ":" + line;
    }
}
