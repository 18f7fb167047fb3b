package org.cardwright.sim;

/**
 * One DC operating condition to simulate: a forced terminal current or voltage at a device temperature.
 *
 * @param forcing     what is forced
 * @param value       the forced current [A] or voltage [V], anode to cathode
 * @param temperature device temperature [K]
 */
public record Bias(Forcing forcing, double value, double temperature) {
    /** What the source forces. */
    public enum Forcing { CURRENT, VOLTAGE }

    public Bias {
        if (forcing == null || !Double.isFinite(value) || !(temperature > 0)) {
            throw new IllegalArgumentException("bias needs a forcing, a finite value and a temperature above 0 K");
        }
    }

    /** A forced current [A] at temperature [K]. */
    public static Bias current(double amperes, double kelvin) {
        return new Bias(Forcing.CURRENT, amperes, kelvin);
    }

    /** A forced voltage [V] at temperature [K]. */
    public static Bias voltage(double volts, double kelvin) {
        return new Bias(Forcing.VOLTAGE, volts, kelvin);
    }
}
