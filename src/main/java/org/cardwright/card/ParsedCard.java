package org.cardwright.card;

import java.util.List;
import java.util.Objects;
import org.cardwright.model.DiodeParameters;

/**
 * One diode {@code .model} card as read from text.
 *
 * @param name the model name as written
 * @param parameters the values the card gives for parameters the dialect carries [SI; TNOM in kelvin]
 * @param notices one line each, {@code source:line: ...}, for every keyword read but not taken (unknown, not
 *     modelled by cardwright, or not carried by the dialect), with its value as written
 * @param comments the card's {@code *} comment lines without the {@code *} and one following space
 */
public record ParsedCard(String name, DiodeParameters parameters, List<String> notices, List<String> comments) {
    public ParsedCard {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(parameters, "parameters");
        notices = List.copyOf(notices);
        comments = List.copyOf(comments);
    }

    /** The card as a value that can be written again, its comments becoming the provenance lines. */
    public ModelCard toModelCard() {
        return new ModelCard(name, parameters, comments);
    }
}
