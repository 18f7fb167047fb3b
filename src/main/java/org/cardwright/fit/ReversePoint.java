package org.cardwright.fit;

/**
 * One reverse I-V measurement: both voltage and current negative (anode-to-cathode sign convention).
 *
 * @param voltage     terminal voltage, negative [V]
 * @param current     terminal current, negative [A]
 * @param temperature device temperature [K]
 * @param sigma       1-sigma uncertainty of the voltage at this current [V]
 * @param source      the file it came from
 * @param line        the line in that file
 */
public record ReversePoint(double voltage, double current, double temperature, double sigma, String source, int line) {
    public ReversePoint {
        if (!(current < 0) || !(voltage < 0) || !Double.isFinite(voltage) || !Double.isFinite(current)) {
            throw new IllegalArgumentException("a reverse point needs negative voltage and current, got V=" + voltage
                    + " I=" + current);
        }
        if (!(temperature > 0) || !(sigma > 0)) {
            throw new IllegalArgumentException("reverse point needs a temperature above 0 K and a positive uncertainty");
        }
    }

    /** "file:line" for messages. */
    public String where() {
        return source + ":" + line;
    }
}
