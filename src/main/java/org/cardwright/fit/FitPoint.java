package org.cardwright.fit;

/**
 * One forward I-V measurement as the fit sees it: a current at which the terminal voltage was measured.
 *
 * @param current     measured terminal current, positive [A]
 * @param voltage     measured terminal voltage [V]
 * @param temperature device temperature [K]
 * @param sigma       one-standard-deviation uncertainty of the voltage residual [V]
 * @param source      the file the point came from, for messages
 * @param line        the line in that file, for messages (0 when not from a file)
 */
public record FitPoint(double current, double voltage, double temperature, double sigma, String source, int line) {
    public FitPoint {
        if (!(current > 0) || !Double.isFinite(current)) {
            throw new IllegalArgumentException("forward current must be positive, got " + current);
        }
        if (!Double.isFinite(voltage)) {
            throw new IllegalArgumentException("voltage must be finite, got " + voltage);
        }
        if (!(temperature > 0)) {
            throw new IllegalArgumentException("temperature must be above 0 K, got " + temperature);
        }
        if (!(sigma > 0) || !Double.isFinite(sigma)) {
            throw new IllegalArgumentException("uncertainty must be positive, got " + sigma);
        }
    }

    /** "file:line" for messages. */
    public String where() {
        return source + ":" + line;
    }
}
