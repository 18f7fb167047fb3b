package org.cardwright.verify;

/** What decides a sweep's pass or fail; both figures are always computed and printed. */
public enum VerdictBasis {
    /** The residual RMS against the data's own uncertainty ({@link DataUncertainty}). */
    NOISE,
    /** The fixed engineering limits ({@link Tolerance}, {@link CapacitanceTolerance}). */
    FIXED;

    /** The basis a user names, in any case: noise or fixed. */
    public static VerdictBasis byName(String name) {
        String n = name == null ? "" : name.trim();
        for (VerdictBasis b : values()) {
            if (b.name().equalsIgnoreCase(n)) {
                return b;
            }
        }
        throw new IllegalArgumentException("unknown verdict basis '" + name + "'; valid names: noise, fixed");
    }
}
