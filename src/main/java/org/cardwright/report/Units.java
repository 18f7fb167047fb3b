package org.cardwright.report;

import java.util.Locale;

/** Display formatting for people: engineering prefixes, millivolts, degrees Celsius. */
public final class Units {
    private static final String[] PREFIX = {"f", "p", "n", "u", "m", "", "k", "M", "G"};

    private Units() {
    }

    /** e.g. 1.00n, 47.5m, 12.0 (three significant digits, SI prefix) followed by the unit. */
    public static String engineering(double value, String unit) {
        if (value == 0 || !Double.isFinite(value)) {
            return (Double.isFinite(value) ? "0" : String.valueOf(value)) + (unit.isEmpty() ? "" : " " + unit);
        }
        // round to three significant digits first, so 999.9999p shows as 1.00 nA, not 1000 pA
        double rounded = Double.parseDouble(String.format(Locale.ROOT, "%.2e", value));
        int exp = (int) Math.floor(Math.log10(Math.abs(rounded)) / 3);
        exp = Math.max(-5, Math.min(3, exp));
        double scaled = rounded / Math.pow(1000, exp);
        String digits = Math.abs(scaled) >= 100 ? "%.0f" : Math.abs(scaled) >= 10 ? "%.1f" : "%.2f";
        return String.format(Locale.ROOT, digits, scaled) + " " + PREFIX[exp + 5] + unit;
    }

    /** Kelvin to a Celsius string with one decimal. */
    public static String celsius(double kelvin) {
        return org.cardwright.model.Celsius.oneDecimal(kelvin);
    }

    /** Volts as millivolts with the given decimals. */
    public static String millivolts(double volts, int decimals) {
        return String.format(Locale.ROOT, "%." + decimals + "f", volts * 1e3);
    }
}
