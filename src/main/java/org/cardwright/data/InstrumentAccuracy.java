package org.cardwright.data;

/**
 * An instrument's stated accuracy as a bound on the error of one reading: a fraction of the reading plus an
 * absolute part (fixed, or counts times the size of a count), {@code limit = fraction * |reading| + absolute}.
 *
 * <p>A stated bound is read as the half-width of a rectangular (uniform) distribution, whose standard
 * uncertainty is the half-width divided by the square root of 3: JCGM 100:2008, "Evaluation of measurement
 * data: Guide to the expression of uncertainty in measurement" (GUM), section 4.3.7. The same rule turns a
 * resistor tolerance into a standard uncertainty.
 *
 * @param fractionOfReading the "% of reading" part as a fraction, not negative [1]
 * @param absolute          the fixed part, counts already multiplied by the size of a count, not negative;
 *                          in the unit of the reading [V or A]
 * @param written           the setting as the file writes it, for messages
 */
record InstrumentAccuracy(double fractionOfReading, double absolute, String written) {

    /** Standard uncertainty of a quantity uniformly distributed within +-1: 1/sqrt(3) (GUM 4.3.7) [1]. */
    static final double UNIFORM_SIGMA_PER_HALF_WIDTH = 1 / Math.sqrt(3);

    InstrumentAccuracy {
        if (!(fractionOfReading >= 0) || !Double.isFinite(fractionOfReading)
                || !(absolute >= 0) || !Double.isFinite(absolute) || fractionOfReading + absolute == 0) {
            throw new IllegalArgumentException("accuracy must be finite, not negative, and not zero: "
                    + fractionOfReading + " of reading + " + absolute);
        }
    }

    /** The bound on the error of a reading, in the reading's unit [V or A]. */
    double limit(double reading) {
        return fractionOfReading * Math.abs(reading) + absolute;
    }

    /** The standard (1-sigma) uncertainty of a reading: the bound over sqrt(3) [V or A]. */
    double standardUncertainty(double reading) {
        return limit(reading) * UNIFORM_SIGMA_PER_HALF_WIDTH;
    }
}
