package org.cardwright.model;

import java.util.Locale;

/**
 * A temperature in kelvin written as degrees Celsius (0 degC = {@link Ngspice39#CELSIUS_TO_KELVIN} K): the one
 * formatter for tables, messages and card headers.
 */
public final class Celsius {
    private Celsius() {
    }

    /** One decimal, e.g. "25.0", "-40.0": tables and messages. */
    public static String oneDecimal(double kelvin) {
        return String.format(Locale.ROOT, "%.1f", kelvin - Ngspice39.CELSIUS_TO_KELVIN);
    }

    /** Two decimals, e.g. "85.00": messages that name a temperature taken from the data to the hundredth. */
    public static String twoDecimals(double kelvin) {
        return String.format(Locale.ROOT, "%.2f", kelvin - Ngspice39.CELSIUS_TO_KELVIN);
    }

    /**
     * The shortest exact decimal of the Celsius value after rounding to 1e-9 degC, e.g. "25", "-40", "27.5": text that
     * must be canonical (device files, card headers, build records).
     */
    public static String shortest(double kelvin) {
        double c = kelvin - Ngspice39.CELSIUS_TO_KELVIN;
        double rounded = Math.round(c * 1e9) / 1e9;
        return new java.math.BigDecimal(Double.toString(rounded)).stripTrailingZeros().toPlainString()
                .toLowerCase(Locale.ROOT);
    }
}
