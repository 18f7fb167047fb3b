package org.cardwright.data;

/**
 * One I-V point, in SI units, with the standard (1-sigma) uncertainty of each coordinate where it is known.
 *
 * <p>An uncertainty is stated in the file (dV, dI columns), derived from the instrument accuracy the file
 * states, or propagated from a series-resistor log's tolerances; NaN means nobody said, and a fit must then
 * choose its own weight. The correlation matters where one reading enters both coordinates (the meter reading
 * of a series-resistor log, the current through a 2-wire lead resistance); it is 0 when the errors are
 * independent or either uncertainty is unknown.
 *
 * @param voltage                   anode-to-cathode voltage; reverse points are negative [V]
 * @param current                   current from anode to cathode; reverse points are negative [A]
 * @param temperature               device temperature [K]
 * @param line                      physical 1-based line of the file the point was read from, or 0 when it was
 *                                  not read from a file [1]
 * @param voltageSigma              standard uncertainty of the voltage, positive, or NaN when unknown [V]
 * @param currentSigma              standard uncertainty of the current, positive, or NaN when unknown [A]
 * @param voltageCurrentCorrelation correlation coefficient of the voltage and current errors, in [-1, 1]; 0
 *                                  when either uncertainty is unknown [1]
 */
public record IvPoint(double voltage, double current, double temperature, int line, double voltageSigma,
                      double currentSigma, double voltageCurrentCorrelation) {

    /**
     * Checks that every quantity is finite, the temperature lies above absolute zero, the line is not negative,
     * each uncertainty is NaN or positive and finite, and the correlation lies in [-1, 1] (and is 0 when an
     * uncertainty is unknown).
     */
    public IvPoint {
        PointChecks.finite("voltage", voltage, "V");
        PointChecks.finite("current", current, "A");
        PointChecks.temperature(temperature);
        PointChecks.line(line);
        PointChecks.sigma("voltage", voltageSigma, "V");
        PointChecks.sigma("current", currentSigma, "A");
        if (!(voltageCurrentCorrelation >= -1 && voltageCurrentCorrelation <= 1)) {
            throw new IllegalArgumentException("correlation must lie in [-1, 1], got " + voltageCurrentCorrelation);
        }
        if ((Double.isNaN(voltageSigma) || Double.isNaN(currentSigma)) && voltageCurrentCorrelation != 0) {
            throw new IllegalArgumentException("correlation must be 0 when an uncertainty is unknown, got "
                    + voltageCurrentCorrelation);
        }
    }

    /** A point without stated uncertainties: both sigmas NaN, correlation 0. */
    public IvPoint(double voltage, double current, double temperature, int line) {
        this(voltage, current, temperature, line, Double.NaN, Double.NaN, 0);
    }

    /** A point with uncertainties whose errors are independent (correlation 0); a sigma may be NaN. */
    public IvPoint(double voltage, double current, double temperature, int line, double voltageSigma,
                   double currentSigma) {
        this(voltage, current, temperature, line, voltageSigma, currentSigma, 0);
    }

    /** Whether the voltage's uncertainty is known. */
    public boolean hasVoltageSigma() {
        return !Double.isNaN(voltageSigma);
    }

    /** Whether the current's uncertainty is known. */
    public boolean hasCurrentSigma() {
        return !Double.isNaN(currentSigma);
    }
}
