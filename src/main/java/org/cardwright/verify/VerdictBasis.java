package org.cardwright.verify;

/** What decides a sweep's pass or fail; both figures are always computed and printed. */
public enum VerdictBasis {
    /** The residual RMS against the data's own uncertainty ({@link DataUncertainty}). */
    NOISE,
    /** The fixed engineering limits ({@link Tolerance}, {@link CapacitanceTolerance}). */
    FIXED
}
