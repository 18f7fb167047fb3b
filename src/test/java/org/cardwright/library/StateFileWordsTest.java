package org.cardwright.library;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Issue 11, "Words": the state file beside a part's cards says "inputs" for the hash of what the cards were made
 * from (not a fab's "recipe", not make's "build record"), and a state file written with the earlier word still
 * reads, so an existing library is not rebuilt for a change of wording.
 */
class StateFileWordsTest {
    private static final String HASH = "ec51bce72fd9e4b700aa40e67d0ee59793d1de979dbf328c5ea43b65203866da";

    @Test
    void theStateFileSpeaksOfInputsAndReadsTheEarlierWord() throws Exception {
        Path dir = Simulators.tempDir("state-file-words");
        Path old = dir.resolve("OLD.state");
        Files.writeString(old, "# cardwright build record of model OLD\nrecipe " + HASH + "\ncard OLD.ngspice.lib " + HASH + "\n");
        BuildState read = BuildState.read(old).orElseThrow();
        assertEquals(HASH, read.recipe());
        assertTrue(read.wrote("OLD.ngspice.lib", HASH));

        String text = read.text("OLD");
        assertTrue(text.contains("\ninputs " + HASH + "\n"), text);
        assertTrue(text.startsWith("# cardwright state file of model OLD"), text);
        for (String word : new String[] {"recipe", "build record", "stale"}) {
            assertFalse(text.toLowerCase(java.util.Locale.ROOT).contains(word), "'" + word + "' in: " + text);
        }
        Path now = dir.resolve("NOW.state");
        Files.writeString(now, text);
        assertEquals(read, BuildState.read(now).orElseThrow(), "the new wording reads back the same");
    }

    @Test
    void theExampleLibraryCardsSayInputs() throws Exception {
        Path card = Simulators.projectDir().resolve("fixtures/library/switching/SW1.ngspice.lib");
        String text = Files.readString(card);
        assertTrue(text.contains("\n* inputs sha256 "), text);
        assertFalse(text.contains("recipe"), text);
    }
}
