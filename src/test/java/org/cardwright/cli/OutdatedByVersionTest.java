package org.cardwright.cli;

import org.cardwright.testsupport.TestCopies;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.cardwright.data.Sha256;
import org.cardwright.library.DeviceFileReader;
import org.cardwright.library.Recipe;
import org.cardwright.workflow.ToolVersion;
import org.junit.jupiter.api.Test;

/**
 * Issue 11, left open after its second round: a card built by another cardwright version must read as outdated. The
 * inputs digest holds the version (docs/library.md, "Inputs digest"); here a part of the invented example library
 * (fixtures/library/switching, SW1) is made to look exactly as an older version would have left it (its card header
 * names that version, the state file holds the digest that version computes and the card's hash), and check must say
 * outdated, naming both versions, and build must rebuild it.
 */
class OutdatedByVersionTest {
    /** A version this build is not. */
    private static final String OTHER = "0.0.9";

    @Test
    void aCardAnotherVersionBuiltIsOutdatedAndRebuilt() throws Exception {
        String version = ToolVersion.get();
        assertNotEquals("unknown", version, "the build's version reaches the classes");
        assertNotEquals(OTHER, version);
        Path dir = TestCopies.libraryFolder("switching", "outdated-by-version");
        Path device = dir.resolve("SW1.device.yaml");
        Path card = dir.resolve("SW1.ngspice.lib");
        Path state = dir.resolve("SW1.state");
        // as this version left it: up to date
        CliRun fresh = CliRun.of("check", dir.toString());
        assertEquals(ExitCodes.OK, fresh.exitCode(), fresh.describe());

        // the digest holds the version: the same inputs under another version give another digest
        Recipe recipe = Recipe.of(new DeviceFileReader().read(device));
        assertTrue(recipe.text().contains("\ntool " + version + "\n"), recipe.text());
        String otherDigest = Sha256.hex(recipe.text().replace("\ntool " + version + "\n", "\ntool " + OTHER + "\n"));
        assertNotEquals(recipe.sha256(), otherDigest);

        // the part as the other version would have left it: header, card hash and digest
        String text = Files.readString(card, StandardCharsets.UTF_8)
                .replace("written by cardwright " + version + " ", "written by cardwright " + OTHER + " ")
                .replace("* inputs sha256 " + recipe.sha256(), "* inputs sha256 " + otherDigest);
        assertTrue(text.contains("cardwright " + OTHER) && text.contains(otherDigest), text);
        Files.writeString(card, text, StandardCharsets.UTF_8);
        String stateText = Files.readString(state, StandardCharsets.UTF_8)
                .replace("inputs " + recipe.sha256(), "inputs " + otherDigest)
                .replaceAll("(?m)^card SW1\\.ngspice\\.lib \\S+$", "card SW1.ngspice.lib " + Sha256.hex(text));
        Files.writeString(state, stateText, StandardCharsets.UTF_8);

        CliRun old = CliRun.of("check", dir.toString());
        assertEquals(ExitCodes.NOT_REPRODUCED, old.exitCode(), old.describe());
        String line = old.out().lines().filter(l -> l.startsWith("SW1.ngspice.lib: ")).findFirst().orElseThrow();
        assertTrue(line.startsWith("SW1.ngspice.lib: outdated: reproduces its data ("), line);
        assertTrue(line.endsWith("but it was built by cardwright " + OTHER + " and this is cardwright " + version
                + "; run cardwright build"), line);

        CliRun build = CliRun.of("build", dir.toString());
        assertEquals(ExitCodes.OK, build.exitCode(), build.describe());
        assertTrue(build.out().contains("1 built, 0 up to date"), build.describe());
        assertTrue(Files.readString(card, StandardCharsets.UTF_8).contains("written by cardwright " + version + " "));
        CliRun again = CliRun.of("check", dir.toString());
        assertEquals(ExitCodes.OK, again.exitCode(), again.describe());
    }
}
