package org.cardwright.fit;

/**
 * How C-V readings were taken, as far as the fit needs to know.
 *
 * @param strayCapacitance known fixture/stray capacitance in parallel with the device, included in every
 *                         reading and subtracted by the fit; 0 when the meter was compensated [F]
 * @param frequency        test-signal frequency of the readings [Hz]
 */
public record CapacitanceOptions(double strayCapacitance, double frequency) {
    /**
     * 1 MHz, the usual test frequency of junction-capacitance data (common practice, no source); it only
     * matters with series resistance in strong forward bias [Hz].
     */
    public static final double DEFAULT_FREQUENCY = 1e6;
    /** No stray capacitance, 1 MHz. */
    public static final CapacitanceOptions DEFAULT = new CapacitanceOptions(0, DEFAULT_FREQUENCY);

    public CapacitanceOptions {
        if (!(strayCapacitance >= 0) || !Double.isFinite(strayCapacitance)) {
            throw new IllegalArgumentException("stray capacitance must be a finite number >= 0, got "
                    + strayCapacitance + " F");
        }
        if (!(frequency > 0) || !Double.isFinite(frequency)) {
            throw new IllegalArgumentException("test frequency must be positive, got " + frequency + " Hz");
        }
    }

    /** These options with a stray capacitance [F]. */
    public CapacitanceOptions withStrayCapacitance(double farads) {
        return new CapacitanceOptions(farads, frequency);
    }
}
