package org.cardwright.data;

/** Constructor checks shared by the point records. */
final class PointChecks {
    private PointChecks() {
    }

    static void finite(String quantity, double value, String unit) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException(quantity + " must be a finite number, got " + value + " " + unit);
        }
    }

    static void temperature(double kelvin) {
        if (!Double.isFinite(kelvin) || !(kelvin > 0)) {
            throw new IllegalArgumentException(
                    "temperature must be a finite number above absolute zero, got " + kelvin + " K");
        }
    }

    /** A standard uncertainty: NaN (unknown), or positive and finite. */
    static void sigma(String quantity, double sigma, String unit) {
        if (!Double.isNaN(sigma) && !(sigma > 0 && Double.isFinite(sigma))) {
            throw new IllegalArgumentException("uncertainty of the " + quantity
                    + " must be positive and finite, or NaN when unknown, got " + sigma + " " + unit);
        }
    }

    static void line(int line) {
        if (line < 0) {
            throw new IllegalArgumentException("line must not be negative, got " + line);
        }
    }
}
