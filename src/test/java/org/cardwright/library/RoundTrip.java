package org.cardwright.library;

import java.util.Optional;
import org.cardwright.card.CardReader;
import org.cardwright.card.CardWriter;
import org.cardwright.card.Dialect;
import org.cardwright.card.ParsedCard;

/** Reads a card and writes it again with the bundled template: the round trip the library relies on. */
final class RoundTrip {
    private RoundTrip() {
    }

    static String rerender(String text, Dialect dialect, int digits) {
        ParsedCard parsed = new CardReader().parse(text, "round-trip", dialect);
        if (!parsed.notices().isEmpty()) {
            throw new AssertionError("a card cardwright wrote drew notices: " + parsed.notices());
        }
        return new CardWriter(Optional.empty()).render(parsed.toModelCard(), dialect, digits).text();
    }
}
