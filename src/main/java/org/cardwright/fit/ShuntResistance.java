package org.cardwright.fit;

/**
 * A resistor between the diode's terminals, fitted with the junction: surface or edge leakage, or a solar
 * cell's shunt resistance. It is not a SPICE diode parameter; the card that carries it is a subcircuit of the
 * diode and this resistor.
 *
 * @param resistance    the fitted resistance [ohm]
 * @param standardError its standard error, scaled by the reduced chi-square like every other; NaN when not
 *                      available [ohm]
 */
public record ShuntResistance(double resistance, double standardError) {
    public ShuntResistance {
        if (!(resistance > 0) || !Double.isFinite(resistance)) {
            throw new IllegalArgumentException("a shunt resistance must be positive and finite, got " + resistance);
        }
    }

    /** The conductance 1/R [S]. */
    public double conductance() {
        return 1 / resistance;
    }
}
