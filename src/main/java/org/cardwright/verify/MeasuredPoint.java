package org.cardwright.verify;

/**
 * A measured forward I-V point to reproduce.
 *
 * @param voltage     measured terminal voltage [V]
 * @param current     measured terminal current, positive [A]
 * @param temperature device temperature [K]
 * @param source      file it came from
 * @param line        line in that file
 */
public record MeasuredPoint(double voltage, double current, double temperature, String source, int line) {
    public MeasuredPoint {
        if (!(current > 0) || !Double.isFinite(voltage) || !(temperature > 0)) {
            throw new IllegalArgumentException("a forward point needs a positive current, a finite voltage and a temperature above 0 K");
        }
    }
}
