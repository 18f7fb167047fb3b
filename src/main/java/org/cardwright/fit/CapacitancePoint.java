package org.cardwright.fit;

/**
 * One C-V measurement as the fit sees it: the small-signal capacitance read at a DC terminal voltage.
 *
 * @param voltage     DC terminal voltage, anode to cathode; reverse bias is negative [V]
 * @param capacitance measured capacitance as read, stray capacitance still included, positive [F]
 * @param temperature device temperature [K]
 * @param sigma       one-standard-deviation uncertainty of the reading [F]
 * @param source      the file the point came from, for messages
 * @param line        the line in that file, for messages (0 when not from a file)
 */
public record CapacitancePoint(double voltage, double capacitance, double temperature, double sigma, String source,
                               int line) {
    /**
     * Relative part of the default uncertainty: 0.5 % of the reading, an LCR meter's typical basic accuracy
     * (common practice, no source) [1].
     */
    public static final double DEFAULT_RELATIVE_UNCERTAINTY = 0.005;
    /** Absolute part of the default uncertainty, 20 fF (common practice, no source) [F]. */
    public static final double DEFAULT_ABSOLUTE_UNCERTAINTY = 20e-15;

    public CapacitancePoint {
        if (!Double.isFinite(voltage)) {
            throw new IllegalArgumentException(where(source, line) + ": voltage must be finite, got " + voltage + " V");
        }
        if (!(capacitance > 0) || !Double.isFinite(capacitance)) {
            throw new IllegalArgumentException(where(source, line) + ": capacitance must be positive, got "
                    + capacitance + " F");
        }
        if (!(temperature > 0) || !Double.isFinite(temperature)) {
            throw new IllegalArgumentException(where(source, line) + ": temperature must be above 0 K, got "
                    + temperature + " K");
        }
        if (!(sigma > 0) || !Double.isFinite(sigma)) {
            throw new IllegalArgumentException(where(source, line) + ": uncertainty must be positive, got " + sigma + " F");
        }
        if (source == null) {
            throw new IllegalArgumentException("a C-V point needs a source name (use \"\" when there is none)");
        }
    }

    /** A point whose uncertainty is the default 0.5 % of the reading + 20 fF. */
    public static CapacitancePoint withDefaultSigma(double voltage, double capacitance, double temperature,
                                                    String source, int line) {
        return new CapacitancePoint(voltage, capacitance, temperature, defaultSigma(capacitance), source, line);
    }

    /** The default uncertainty of a reading: 0.5 % of it + 20 fF (common practice, no source) [F]. */
    public static double defaultSigma(double capacitance) {
        return DEFAULT_RELATIVE_UNCERTAINTY * Math.abs(capacitance) + DEFAULT_ABSOLUTE_UNCERTAINTY;
    }

    /** "file:line" for messages. */
    public String where() {
        return where(source, line);
    }

    private static String where(String source, int line) {
        return source + ":" + line;
    }
}
