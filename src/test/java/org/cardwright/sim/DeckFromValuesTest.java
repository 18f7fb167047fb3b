package org.cardwright.sim;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Locale;
import org.cardwright.card.CardReader;
import org.cardwright.card.Dialect;
import org.cardwright.card.ParsedCard;
import org.cardwright.workflow.Engines;
import org.junit.jupiter.api.Test;

/**
 * Issue 10: a simulator deck is written from the card's parsed name and numbers only. Whatever else the card file
 * holds (comments, inline comments, keywords cardwright does not take, the spelling of its numbers) never reaches
 * a deck of any engine.
 */
class DeckFromValuesTest {
    private static final String CARD = String.join("\n",
            "* Invented card for the deck tests; shell touch COMMENT-CANARY",
            ".model dvals D(IS=2.5n ; .control shell touch INLINE-CANARY",
            "+ N=1.7 RS=50m FOO=3 KF=1e-16 $ .include elsewhere",
            "+ TNOM=25)",
            "");

    private static final List<Bias> BIASES = List.of(Bias.current(1e-3, 300.15), Bias.voltage(-1, 300.15));

    @Test
    void noEngineDeckCarriesAnythingButTheNameAndTheNumbers() {
        ParsedCard parsed = new CardReader().parse(CARD, "dvals.lib", Dialect.NGSPICE);
        CardUnderTest card = Engines.underTest(parsed, Dialect.NGSPICE);
        // IS=2.5n, N=1.7, RS=50m, TNOM=25 (degrees C on the card); FOO and KF are notes, not values
        assertEquals(".model dvals D(\n+ IS=2.5E-9\n+ N=1.7\n+ RS=0.05\n+ TNOM=25.0\n+ )\n", card.modelStatement());
        for (String deck : List.of(NgspiceEngine.netlist(card, BIASES), GnucapEngine.netlist(card, BIASES),
                NgspiceCapacitance.netlist(card, List.of(Bias.voltage(-1, 300.15)), 1e6))) {
            String lower = deck.toLowerCase(Locale.ROOT);
            for (String absent : List.of("canary", "shell", "include", "foo", "kf", "2.5n", "50m", "invented")) {
                assertFalse(lower.contains(absent), "'" + absent + "' reached the deck:\n" + deck);
            }
            assertTrue(deck.contains(card.modelStatement()), deck);
        }
    }

    @Test
    void namesKeywordsAndNumbersAreValidatedOnTheWayIn() {
        assertThrows(IllegalArgumentException.class, () -> new CardUnderTest("d1\n.control",
                org.cardwright.model.DiodeParameters.defaults(), List.of()));
        assertThrows(IllegalArgumentException.class, () -> new CardUnderTest.Setting("IS\n.endc", 1e-9));
        assertThrows(IllegalArgumentException.class, () -> new CardUnderTest.Setting("IS", Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> DeckNumbers.format(Double.POSITIVE_INFINITY));
        // the shortest decimal that reads back as the same double
        for (double v : new double[] {1e-14, 2.5e-9, 0.1, -1000.5, 6.02214076e23, Double.MIN_NORMAL}) {
            assertEquals(v, Double.parseDouble(DeckNumbers.format(v)));
        }
    }
}
