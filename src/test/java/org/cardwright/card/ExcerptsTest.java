package org.cardwright.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Excerpts of untrusted text in messages: one line, short, control characters visible as escapes. */
class ExcerptsTest {

    @Test
    void anExcerptIsOneShortLineWithEveryControlCharacterEscaped() {
        String environ = "HOME=/home/x\u0000PATH=/bin\u0000API_TOKEN=" + "k".repeat(500) + "\n\r\t\u001b[2J\u007f"; // hygiene: not a path (an environment text to escape)
        String e = Excerpts.of(environ);
        assertFalse(e.chars().anyMatch(Character::isISOControl), e);
        assertTrue(e.endsWith("..."), e);
        // at most MAX_CHARS characters of the text, each shown as at most six (a \\uXXXX escape), and the "..."
        assertTrue(e.length() <= 6 * Excerpts.MAX_CHARS + 3, e);
        assertEquals("HOME=/home/x\\u0000PATH=/bin\\u0000API_TOKEN=", e.substring(0, 43)); // hygiene: not a path
        assertEquals("a\\nb\\\\c", Excerpts.of("a\nb\\c"));
        assertEquals("'25 \\u00b0C'", Excerpts.quoted("25 \u00b0C"));
        assertEquals("abc", Excerpts.of("abcdef", 3).replace("...", ""));
    }
}
