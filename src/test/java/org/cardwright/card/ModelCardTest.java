package org.cardwright.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.ArrayList;
import java.util.List;
import org.cardwright.model.DiodeParameters;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class ModelCardTest {
    @ParameterizedTest
    @ValueSource(strings = {"d", "dsw1", "D_fast.v2", "d-1+x", "Zener_5v1"})
    void acceptsSpiceIdentifiers(String name) {
        assertEquals(name, new ModelCard(name, DiodeParameters.defaults(), List.of()).name());
    }

    @ParameterizedTest
    @ValueSource(strings = {"", "9volt", "_d", "d 1", "d(1)", "d=1", "d;1", "d$", "d*", "\u00e9d", ".d"})
    void refusesWhatIsNotASpiceIdentifier(String name) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new ModelCard(name, DiodeParameters.defaults(), List.of()));
        assertEquals(true, e.getMessage().contains("'" + name + "'"), e.getMessage());
    }

    @Test
    void refusesLineBreaksInProvenance() {
        assertThrows(IllegalArgumentException.class,
                () -> new ModelCard("d", DiodeParameters.defaults(), List.of("two\nlines")));
        assertThrows(IllegalArgumentException.class,
                () -> new ModelCard("d", DiodeParameters.defaults(), List.of("carriage\rreturn")));
        assertThrows(NullPointerException.class, () -> new ModelCard(null, DiodeParameters.defaults(), List.of()));
    }

    @Test
    void keepsItsOwnCopyOfTheProvenance() {
        List<String> lines = new ArrayList<>(List.of("first"));
        ModelCard card = new ModelCard("d", DiodeParameters.defaults(), lines);
        lines.add("second");
        assertEquals(List.of("first"), card.provenance());
    }
}
