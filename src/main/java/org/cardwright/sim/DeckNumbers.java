package org.cardwright.sim;

/**
 * Writes numbers into simulator decks: the shortest decimal that reads back as the same double
 * ({@link Double#toString}), so a deck never carries anything but digits, a point, a sign and an exponent.
 */
public final class DeckNumbers {
    private DeckNumbers() {
    }

    /**
     * {@code value} as a deck number, e.g. {@code 1.0E-14}, {@code -1000.0}.
     *
     * @throws IllegalArgumentException when the value is NaN or infinite
     */
    public static String format(double value) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("a simulator deck takes finite numbers only, got " + value);
        }
        return Double.toString(value);
    }
}
