package org.cardwright.library;

import org.cardwright.verify.Tolerance;

/**
 * The limits a part's card must hold, used by check (against the data) and compare (card against card).
 *
 * <p>Defaults: forward voltage 2 mV RMS and 5 mV at any point per temperature (those of {@code verify}, see
 * {@link Tolerance#DEFAULT}); leakage within a factor of 2, since reverse leakage of one part spreads over a factor
 * of a few between samples and with surface condition; capacitance within 10 %, about the spread of an LCR reading
 * on a few-pF junction with fixture compensation; breakdown voltage within 2 % (common practice, no source).
 *
 * @param forward          forward-voltage residual limits [V]
 * @param leakageFactor    largest ratio between two leakage currents that counts as agreement [1]
 * @param capacitanceRelative largest relative capacitance difference that counts as agreement [1]
 * @param breakdownRelative   largest relative breakdown-voltage difference that counts as agreement [1]
 */
public record PartTolerances(Tolerance forward, double leakageFactor, double capacitanceRelative,
                             double breakdownRelative) {
    /** The defaults listed in the class comment. */
    public static final PartTolerances DEFAULT = new PartTolerances(Tolerance.DEFAULT, 2.0, 0.10, 0.02);

    public PartTolerances {
        if (forward == null) {
            throw new IllegalArgumentException("forward tolerance is required");
        }
        if (!(leakageFactor > 1) || !Double.isFinite(leakageFactor)) {
            throw new IllegalArgumentException("leakage factor must be a finite number above 1, got " + leakageFactor);
        }
        if (!(capacitanceRelative > 0) || !(breakdownRelative > 0)) {
            throw new IllegalArgumentException("relative tolerances must be positive");
        }
    }
}
