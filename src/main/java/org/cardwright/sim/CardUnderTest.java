package org.cardwright.sim;

import org.cardwright.model.DiodeParameters;

/**
 * A model card as the engines need it: the parameters for the built-in evaluator and the card text, exactly as
 * written to disk, for an external simulator (so that what is proven is the file, not a copy of it).
 *
 * @param name       model name on the card
 * @param parameters the card's parameters [SI]
 * @param text       the card text, a `.model` statement with comments
 * @param shuntResistance a resistor between the diode's terminals, as a subcircuit card carries it; positive
 *                   infinity for none. Every engine adds it itself (the built-in one to its equations, the
 *                   simulators as a resistor element in their decks) [ohm]
 */
public record CardUnderTest(String name, DiodeParameters parameters, String text, double shuntResistance) {
    public CardUnderTest {
        if (name == null || name.isBlank() || parameters == null || text == null) {
            throw new IllegalArgumentException("a card needs a name, parameters and text");
        }
        if (!(shuntResistance > 0)) {
            throw new IllegalArgumentException("a shunt resistance must be positive (infinity for none), got " + shuntResistance);
        }
    }

    /** A card without a shunt resistor. */
    public CardUnderTest(String name, DiodeParameters parameters, String text) {
        this(name, parameters, text, Double.POSITIVE_INFINITY);
    }

    /** True when a resistor lies between the terminals. */
    public boolean hasShunt() {
        return Double.isFinite(shuntResistance);
    }

    /** The conductance between the terminals, 0 for none [S]. */
    public double shuntConductance() {
        return hasShunt() ? 1 / shuntResistance : 0;
    }
}
