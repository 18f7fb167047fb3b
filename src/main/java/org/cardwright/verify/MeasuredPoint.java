package org.cardwright.verify;

/**
 * A measured I-V point to reproduce at its measured current: forward, or reverse in breakdown.
 *
 * @param voltage     measured terminal voltage [V]
 * @param current     measured terminal current, non-zero [A]
 * @param temperature device temperature [K]
 * @param source      file it came from
 * @param line        line in that file
 */
public record MeasuredPoint(double voltage, double current, double temperature, String source, int line) {
    public MeasuredPoint {
        if (current == 0 || !Double.isFinite(current) || !Double.isFinite(voltage) || !(temperature > 0)) {
            throw new IllegalArgumentException("a point to reproduce needs a non-zero current, a finite voltage and a temperature above 0 K");
        }
    }
}
