package org.cardwright.sim;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.regex.Pattern;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;

/**
 * A model card as the engines need it: the parameters for the built-in evaluator, and the name and the values as
 * the card states them (keyword and number, in the card's own dialect) for an external simulator. No card text
 * travels here: a simulator deck is written from the validated name and numbers alone ({@link #modelStatement}),
 * so nothing a card file holds besides them can reach a simulator.
 *
 * @param name       model name on the card: a letter, then letters, digits and {@code _ . - +}
 * @param parameters the card's parameters [SI, ngspice 39 meaning]
 * @param settings   the values the card states, keyword and number as the card's simulator reads them, in order
 * @param shuntResistance a resistor between the diode's terminals, as a subcircuit card carries it; positive
 *                   infinity for none. Every engine adds it itself (the built-in one to its equations, the
 *                   simulators as a resistor element in their decks) [ohm]
 */
public record CardUnderTest(String name, DiodeParameters parameters, List<Setting> settings, double shuntResistance) {
    private static final Pattern MODEL_NAME = Pattern.compile("[A-Za-z][A-Za-z0-9_.+-]*");
    private static final Pattern KEYWORD = Pattern.compile("[A-Za-z][A-Za-z0-9_]*");

    /**
     * One {@code keyword=value} of the card.
     *
     * @param keyword a parameter keyword: a letter, then letters, digits and underscores
     * @param value   the value as the card states it, finite [the card's unit: TNOM in degrees C]
     */
    public record Setting(String keyword, double value) {
        public Setting {
            if (keyword == null || !KEYWORD.matcher(keyword).matches()) {
                throw new IllegalArgumentException("not a parameter keyword: " + keyword);
            }
            if (!Double.isFinite(value)) {
                throw new IllegalArgumentException(keyword + " is not a finite number: " + value);
            }
        }
    }

    public CardUnderTest {
        if (name == null || !MODEL_NAME.matcher(name).matches()) {
            throw new IllegalArgumentException("model name is not a SPICE identifier: " + name);
        }
        Objects.requireNonNull(parameters, "parameters");
        settings = List.copyOf(settings);
        if (!(shuntResistance > 0)) {
            throw new IllegalArgumentException("a shunt resistance must be positive (infinity for none), got " + shuntResistance);
        }
    }

    /** A card without a shunt resistor. */
    public CardUnderTest(String name, DiodeParameters parameters, List<Setting> settings) {
        this(name, parameters, settings, Double.POSITIVE_INFINITY);
    }

    /** The same card with a resistor between its terminals [ohm]. */
    public CardUnderTest withShunt(double resistance) {
        return new CardUnderTest(name, parameters, settings, resistance);
    }

    /** True when a resistor lies between the terminals. */
    public boolean hasShunt() {
        return Double.isFinite(shuntResistance);
    }

    /** The conductance between the terminals, 0 for none [S]. */
    public double shuntConductance() {
        return hasShunt() ? 1 / shuntResistance : 0;
    }

    /**
     * A card stated in ngspice 39 keywords and meaning: every given parameter, in {@link Param} order, under its
     * ngspice keyword (TNOM in degrees C).
     */
    public static CardUnderTest ngspice(String name, DiodeParameters parameters) {
        List<Setting> settings = new ArrayList<>();
        for (Param p : Param.values()) {
            if (parameters.isGiven(p)) {
                settings.add(new Setting(p.keyword(), p.toCardValue(parameters.get(p))));
            }
        }
        return new CardUnderTest(name, parameters, settings);
    }

    /**
     * The {@code .model} statement for a simulator deck, one value per continuation line, every number written by
     * {@link DeckNumbers}: {@code .model NAME D(\n+ IS=1.0E-14\n+ N=1.5\n+ )\n}.
     */
    public String modelStatement() {
        StringBuilder sb = new StringBuilder(".model ").append(name).append(" D(\n");
        for (Setting s : settings) {
            sb.append("+ ").append(s.keyword()).append('=').append(DeckNumbers.format(s.value())).append('\n');
        }
        return sb.append("+ )\n").toString();
    }
}
