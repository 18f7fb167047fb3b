package org.cardwright.library;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.cardwright.card.Dialect;
import org.cardwright.cli.Main;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/** The invented example library in fixtures/library: reproducible data, cards in step with it, cards that pass. */
class LibraryFixturesTest {
    private static final Path LIBRARY = Simulators.projectDir().resolve("fixtures/library");
    /** Both RS values are printed to 7 significant digits on the card: 1e-6 relative covers their rounding [1]. */
    private static final double SEVEN_DIGITS_RELATIVE = 1e-6;

    @Test
    void theCommittedDataAreExactlyWhatTheGeneratorWrites() throws Exception {
        Path fresh = Simulators.tempDir("library-fixture-data");
        LibraryFixtureData.write(fresh);
        Map<String, byte[]> made = Trees.contents(fresh, ".csv");
        Map<String, byte[]> committed = Trees.contents(LIBRARY, ".csv");
        assertEquals(made.keySet(), committed.keySet());
        made.forEach((k, v) -> assertArrayEquals(v, committed.get(k), k));
        for (String k : committed.keySet()) {
            assertTrue(new String(committed.get(k), StandardCharsets.UTF_8).startsWith("# Invented demo data, not a measurement"), k);
        }
    }

    @Test
    void theCommittedCardsAreUpToDateWithTheirDeviceFilesAndData() throws Exception {
        Path copy = Simulators.tempDir("library-fixture-build");
        Trees.copy(LIBRARY, copy);
        List<PartOutcome> parts = new LibraryBuilder(false).build(copy, line -> { });
        assertEquals(3, parts.size());
        parts.forEach(p -> assertEquals(PartOutcome.Status.UP_TO_DATE, p.status(), p.device() + ": " + p.message()
                + " (rebuild with: cardwright build fixtures/library)"));
    }

    @Test
    void everyCardOfTheExampleLibraryPassesTheCheck() {
        StringWriter out = new StringWriter();
        int code = Main.execute(new PrintWriter(out), new PrintWriter(new StringWriter()), "check", LIBRARY.toString());
        assertEquals(0, code, out.toString());
        assertTrue(out.toString().contains("4 cards: 4 passed, 0 not"), out.toString());
    }

    @Test
    void everyCardReadsBackAndRendersToTheSameBytes() throws Exception {
        for (Map.Entry<String, byte[]> e : Trees.contents(LIBRARY, ".lib").entrySet()) {
            String name = e.getKey();
            Dialect d = Dialect.byName(name.substring(name.indexOf('.') + 1, name.lastIndexOf('.')));
            String text = new String(e.getValue(), StandardCharsets.UTF_8);
            assertEquals(text, RoundTrip.rerender(text, d, DeviceFile.DEFAULT_DIGITS), name);
        }
    }

    @Test
    void theTweakInTheDeviceFileIsOnTheCard() throws Exception {
        String card = Files.readString(LIBRARY.resolve("rectifiers/cards/RB4.ngspice.lib"));
        assertTrue(card.contains("* tweak: RS=+5% (others refitted); RS "), card);
        String[] arrow = card.substring(card.indexOf("* tweak:")).split("\n")[0].replaceAll(".*; RS ", "").split(" -> ");
        double before = org.cardwright.card.SpiceNumbers.parse(arrow[0]);
        double after = org.cardwright.card.SpiceNumbers.parse(arrow[1]);
        assertEquals(1.05 * before, after, SEVEN_DIGITS_RELATIVE * after, "RS 5 % above its fitted value (7 digits on the card)");
        assertTrue(card.contains("+ RS=" + arrow[1] + "\n"), card);
    }
}
