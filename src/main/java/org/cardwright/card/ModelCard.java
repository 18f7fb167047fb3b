package org.cardwright.card;

import java.util.List;
import java.util.Objects;
import java.util.regex.Pattern;
import org.cardwright.model.DiodeParameters;

/**
 * A diode {@code .model} card as a value: the model name, the given parameters and the provenance lines that head
 * the card as comments.
 *
 * @param name the model name, a SPICE identifier: starts with a letter, then letters, digits and {@code _ . - +}
 * @param parameters the given parameter values [SI]
 * @param provenance comment lines, without the leading {@code *}; none may contain a line break
 */
public record ModelCard(String name, DiodeParameters parameters, List<String> provenance) {
    private static final Pattern SPICE_IDENTIFIER = Pattern.compile("[A-Za-z][A-Za-z0-9_.+-]*");

    public ModelCard {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(parameters, "parameters");
        Objects.requireNonNull(provenance, "provenance");
        if (!isSpiceIdentifier(name)) {
            throw new IllegalArgumentException("model name '" + name
                    + "' is not a SPICE identifier (a letter, then letters, digits, _ . - +)");
        }
        provenance = List.copyOf(provenance);
        for (String line : provenance) {
            if (line.chars().anyMatch(c -> Character.isISOControl(c) && c != '\t')) {
                throw new IllegalArgumentException("provenance line holds a line break or control character: '"
                        + line.replaceAll("\\p{Cntrl}", "?") + "'");
            }
        }
    }

    /** True when {@code text} may serve as a model name: a letter, then letters, digits and {@code _ . - +}. */
    public static boolean isSpiceIdentifier(String text) {
        return text != null && SPICE_IDENTIFIER.matcher(text).matches();
    }
}
