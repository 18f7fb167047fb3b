package org.cardwright.card;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;

import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * {@link CardText#lines} is the hand-written line splitter of card text; the reference it must match exactly is
 * the JDK's own {@code String.split("\r\n|\r|\n", -1)} (what the card reader used before), on a seeded family of
 * texts made of line breaks of every kind, empty lines, leading and trailing separators and ordinary characters.
 */
class CardTextLinesTest {
    private static final String[] PIECES = {"\r\n", "\r", "\n", "\n\r", "\r\r\n", "", " ", "a", ".model X D(",
        "+ IS=1e-14", "*", "\u00e9", "\t", "\r\n\r\n", "\n\n"};

    private static String[] reference(String text) {
        return text.split("\r\n|\r|\n", -1);
    }

    @Test
    void edgeCasesMatchTheRegexSplit() {
        for (String t : new String[] {"", "\n", "\r", "\r\n", "\n\r", "\r\r", "\n\n", "a", "a\n", "\na", "a\r\nb",
            "a\rb\nc\r\nd", "a\r", "a\r\r\n", "\r\n\r\n\r\n", "\uFEFF.model X D\r\n"}) {
            assertArrayEquals(reference(t), CardText.lines(t), () -> "text " + escape(t));
        }
    }

    @Test
    void seededFamilyMatchesTheRegexSplit() {
        Random random = new Random(20261203L);
        for (int n = 0; n < 20_000; n++) {
            StringBuilder sb = new StringBuilder();
            int parts = random.nextInt(12);
            for (int p = 0; p < parts; p++) {
                sb.append(PIECES[random.nextInt(PIECES.length)]);
            }
            String t = sb.toString();
            assertArrayEquals(reference(t), CardText.lines(t), () -> "text " + escape(t));
        }
    }

    private static String escape(String t) {
        return t.replace("\r", "\\r").replace("\n", "\\n");
    }
}
