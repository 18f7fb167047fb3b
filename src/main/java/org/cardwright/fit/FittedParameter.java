package org.cardwright.fit;

import org.cardwright.model.Param;

/**
 * One parameter of a fit result.
 *
 * @param param         the parameter
 * @param value         the value on the card [SI]
 * @param standardError one standard error, scaled by the reduced chi-square [SI]; NaN when not fitted
 * @param origin        how the value came about
 * @param initialValue  the closed-form start value the global fit began from [SI]; NaN when not fitted
 */
public record FittedParameter(Param param, double value, double standardError, Origin origin, double initialValue) {

    /** How a parameter got its value. */
    public enum Origin {
        /** Adjusted by the least-squares fit. */
        FITTED,
        /** Held at a value the user gave. */
        FIXED_BY_USER,
        /** Held at the device-kind preset because the data cannot determine it. */
        PRESET,
        /**
         * Held at a value cardwright chose inside the data because the data fix only a combination: IBV, the
         * current at which BV is stated.
         */
        CHOSEN
    }

    /** True when the fit adjusted this parameter. */
    public boolean fitted() {
        return origin == Origin.FITTED;
    }

    /** Standard error relative to the value [1]; NaN when not fitted or the value is 0. */
    public double relativeError() {
        return standardError / Math.abs(value);
    }
}
