package org.cardwright.verify;

/**
 * A measured I-V point to reproduce at its measured current: forward, or reverse in breakdown.
 *
 * @param voltage     measured terminal voltage [V]
 * @param current     measured terminal current, non-zero [A]
 * @param temperature device temperature [K]
 * @param source      file it came from
 * @param line        line in that file
 * @param sigma       stated 1-sigma uncertainty of the voltage at this current [V]; NaN when none was stated
 */
public record MeasuredPoint(double voltage, double current, double temperature, String source, int line, double sigma) {
    public MeasuredPoint {
        if (current == 0 || !Double.isFinite(current) || !Double.isFinite(voltage) || !(temperature > 0)) {
            throw new IllegalArgumentException("a point to reproduce needs a non-zero current, a finite voltage and a temperature above 0 K");
        }
        if (!Double.isNaN(sigma) && !(sigma > 0)) {
            throw new IllegalArgumentException("a stated uncertainty must be positive, got " + sigma);
        }
    }

    /** A point without a stated uncertainty. */
    public MeasuredPoint(double voltage, double current, double temperature, String source, int line) {
        this(voltage, current, temperature, source, line, Double.NaN);
    }
}
