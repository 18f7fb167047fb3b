package org.cardwright.verify;

/**
 * Pass limits for capacitance residuals, applied at every temperature separately, relative to the measured
 * device capacitance.
 *
 * <p>Defaults: 1 % RMS and 3 % at any single point. An LCR meter reads junction capacitance to about 0.5 % +
 * 20 fF; a level-1 card that follows the data within twice that on average, and within three times the RMS limit
 * at its worst point (where the power law bends less than a real profile), is good for circuit work (common
 * practice, no source).
 *
 * @param rmsPercent largest allowed RMS residual per temperature [%]
 * @param maxPercent largest allowed single residual [%]
 */
public record CapacitanceTolerance(double rmsPercent, double maxPercent) {
    /** 1 % RMS, 3 % max. */
    public static final CapacitanceTolerance DEFAULT = new CapacitanceTolerance(1.0, 3.0);

    public CapacitanceTolerance {
        if (!(rmsPercent > 0) || !(maxPercent > 0) || !Double.isFinite(rmsPercent) || !Double.isFinite(maxPercent)) {
            throw new IllegalArgumentException("capacitance tolerances must be positive percentages, got "
                    + rmsPercent + " % RMS and " + maxPercent + " % max");
        }
    }
}
