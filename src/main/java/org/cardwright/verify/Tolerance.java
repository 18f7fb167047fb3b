package org.cardwright.verify;

/**
 * Pass limits for forward-voltage residuals, applied at every temperature separately.
 *
 * <p>Defaults: 2 mV RMS and 5 mV at any single point. At N = 1 near room temperature 2 mV of voltage is about
 * 8 % of current, roughly what a card must hold for circuit work; 5 mV allows for the isolated points where a
 * level-1 model bends less sharply than a real part (common practice, no source).
 *
 * @param rms largest allowed RMS residual per temperature [V]
 * @param max largest allowed single residual [V]
 */
public record Tolerance(double rms, double max) {
    /** 2 mV RMS, 5 mV max. */
    public static final Tolerance DEFAULT = new Tolerance(2e-3, 5e-3);

    public Tolerance {
        if (!(rms > 0) || !(max > 0)) {
            throw new IllegalArgumentException("tolerances must be positive");
        }
    }
}
