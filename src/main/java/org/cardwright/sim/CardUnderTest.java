package org.cardwright.sim;

import org.cardwright.model.DiodeParameters;

/**
 * A model card as the engines need it: the parameters for the built-in evaluator and the card text, exactly as
 * written to disk, for an external simulator (so that what is proven is the file, not a copy of it).
 *
 * @param name       model name on the card
 * @param parameters the card's parameters [SI]
 * @param text       the card text, a `.model` statement with comments
 */
public record CardUnderTest(String name, DiodeParameters parameters, String text) {
    public CardUnderTest {
        if (name == null || name.isBlank() || parameters == null || text == null) {
            throw new IllegalArgumentException("a card needs a name, parameters and text");
        }
    }
}
