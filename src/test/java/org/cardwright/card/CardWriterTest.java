package org.cardwright.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.TimeZone;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class CardWriterTest {
    private static final int DIGITS = 6;

    @TempDir
    Path folder;

    static ModelCard switchingDiode() {
        Map<Param, Double> v = new EnumMap<>(Param.class);
        v.put(Param.TNOM, 298.15);
        v.put(Param.IS, 2.5e-9);
        v.put(Param.N, 1.8);
        v.put(Param.RS, 0.05);
        v.put(Param.ISR, 1e-12);
        v.put(Param.IKF, 0.01);
        v.put(Param.CJO, 2e-10);
        v.put(Param.VJ, 0.6);
        v.put(Param.M, 0.45);
        v.put(Param.TT, 5e-6);
        v.put(Param.BV, 100.0);
        v.put(Param.IBV, 5e-6);
        return new ModelCard("dsw1", DiodeParameters.of(v),
                List.of("Invented example card, not data of any real part", "", "fitted on a made-up bench"));
    }

    @Test
    void writesTheNgspiceLayoutInParameterOrder() {
        CardWriter.Rendered r = new CardWriter(Optional.empty()).render(switchingDiode(), Dialect.NGSPICE, DIGITS);
        // the layout is our own design; TNOM on the card is in degrees C (298.15 K -> 25)
        String expected = """
                * Invented example card, not data of any real part
                *
                * fitted on a made-up bench
                .model dsw1 D(
                + IS=2.5n
                + N=1.8
                + RS=0.05
                + ISR=1p
                + IKF=10m
                + CJO=200p
                + VJ=0.6
                + M=0.45
                + TT=5u
                + BV=100
                + IBV=5u
                + TNOM=25
                + )
                """;
        assertEquals(expected, r.text());
        assertEquals(List.of(), r.dropped());
    }

    @Test
    void leavesOutAndListsWhatTheDialectDoesNotCarry() {
        CardWriter writer = new CardWriter(Optional.empty());
        CardWriter.Rendered spice3 = writer.render(switchingDiode(), Dialect.SPICE3, DIGITS);
        assertEquals(List.of(Param.ISR, Param.IKF), spice3.dropped());
        assertFalse(spice3.text().contains("ISR"));
        assertFalse(spice3.text().contains("IKF"));
        assertTrue(spice3.text().contains("+ BV=100\n"));

        CardWriter.Rendered gnucap = writer.render(switchingDiode(), Dialect.GNUCAP, DIGITS);
        assertEquals(List.of(Param.ISR, Param.IKF, Param.BV, Param.IBV), gnucap.dropped());
        assertTrue(gnucap.text().contains(".model dsw1 d (\n+ is=2.5n\n"), gnucap.text());
        assertFalse(gnucap.text().contains("bv="));
    }

    @Test
    void sameCardGivesTheSameBytesWhateverTheLocaleAndZone() {
        String first = new CardWriter(Optional.empty()).render(switchingDiode(), Dialect.NGSPICE, DIGITS).text();
        Locale locale = Locale.getDefault();
        TimeZone zone = TimeZone.getDefault();
        try {
            Locale.setDefault(Locale.GERMANY);
            TimeZone.setDefault(TimeZone.getTimeZone("Pacific/Chatham"));
            for (Dialect d : Dialect.values()) {
                String a = new CardWriter(Optional.empty()).render(switchingDiode(), d, DIGITS).text();
                String b = new CardWriter(Optional.empty()).render(switchingDiode(), d, DIGITS).text();
                assertEquals(a, b, d.shortName());
                assertFalse(a.contains("\r"), "only \\n line endings");
                assertTrue(a.lines().filter(l -> l.startsWith("+")).noneMatch(l -> l.contains(",")),
                        "no decimal commas");
            }
            assertEquals(first, new CardWriter(Optional.empty()).render(switchingDiode(), Dialect.NGSPICE, DIGITS).text());
        } finally {
            Locale.setDefault(locale);
            TimeZone.setDefault(zone);
        }
    }

    @Test
    void aCardWithNothingGivenStillHasItsModelLine() {
        ModelCard empty = new ModelCard("dnone", DiodeParameters.defaults(), List.of());
        assertEquals(".model dnone D(\n+ )\n",
                new CardWriter(Optional.empty()).render(empty, Dialect.NGSPICE, DIGITS).text());
    }

    @Test
    void significantDigitsAreApplied() {
        ModelCard card = new ModelCard("d3", DiodeParameters.defaults().with(Param.IS, 1.23456789e-14), List.of());
        CardWriter writer = new CardWriter(Optional.empty());
        assertTrue(writer.render(card, Dialect.NGSPICE, 3).text().contains("+ IS=12.3f\n"));
        assertTrue(writer.render(card, Dialect.NGSPICE, 9).text().contains("+ IS=12.3456789f\n"));
        assertThrows(IllegalArgumentException.class, () -> writer.render(card, Dialect.NGSPICE, 0));
        assertThrows(IllegalArgumentException.class, () -> writer.render(card, Dialect.NGSPICE, 16));
    }

    @Test
    void aUserTemplateOverridesTheBundledOneOfTheSameName() throws Exception {
        Files.writeString(folder.resolve("ngspice.ftl"),
                "* own layout\r\n.model ${name} D(<#list parameters as p> ${p.keyword}=${p.value}</#list>)\r\n",
                StandardCharsets.UTF_8);
        CardWriter writer = new CardWriter(Optional.of(folder));
        ModelCard card = new ModelCard("dx", DiodeParameters.defaults().with(Param.IS, 1e-14)
                .with(Param.N, 1.05), List.of());
        assertEquals("* own layout\n.model dx D( IS=10f N=1.05)\n", writer.render(card, Dialect.NGSPICE, DIGITS).text());
        // no spice3.ftl in the folder: the bundled one is used
        assertEquals(".model dx D(\n+ IS=10f\n+ N=1.05\n+ )\n", writer.render(card, Dialect.SPICE3, DIGITS).text());
    }

    @Test
    void aBrokenTemplateNamesItsFileAndLine() throws Exception {
        Files.writeString(folder.resolve("ngspice.ftl"), "* header\n.model ${name} D(${nosuchthing})\n",
                StandardCharsets.UTF_8);
        CardWriter writer = new CardWriter(Optional.of(folder));
        CardTemplateException e = assertThrows(CardTemplateException.class,
                () -> writer.render(switchingDiode(), Dialect.NGSPICE, DIGITS));
        assertTrue(e.getMessage().startsWith(folder.resolve("ngspice.ftl") + ":2: "), e.getMessage());
        assertFalse(e.getMessage().contains("\n"), "one-line message: " + e.getMessage());

        Files.writeString(folder.resolve("spice3.ftl"), "<#list parameters as p>\n${p.keyword}\n",
                StandardCharsets.UTF_8);
        CardTemplateException syntax = assertThrows(CardTemplateException.class,
                () -> writer.render(switchingDiode(), Dialect.SPICE3, DIGITS));
        assertTrue(syntax.getMessage().startsWith(folder.resolve("spice3.ftl") + ":"), syntax.getMessage());
        assertFalse(syntax.getMessage().contains("\n"), "one-line message: " + syntax.getMessage());
    }

    @Test
    void aTemplateFolderThatIsNotAFolderIsRefused() {
        assertThrows(IllegalArgumentException.class,
                () -> new CardWriter(Optional.of(folder.resolve("missing"))));
    }

    @Test
    void aCardReadBackWritesTheSameBytes() {
        CardWriter writer = new CardWriter(Optional.empty());
        CardReader reader = new CardReader();
        List<ModelCard> cards = new java.util.ArrayList<>(RandomCards.generate(40, 11));
        cards.add(switchingDiode());
        for (Dialect d : Dialect.values()) {
            for (int digits : new int[] {3, 6, 15}) {
                for (ModelCard card : cards) {
                    String once = writer.render(card, d, digits).text();
                    ParsedCard parsed = reader.parse(once, "written.mod", d);
                    assertEquals(List.of(), parsed.notices(), once);
                    String twice = writer.render(parsed.toModelCard(), d, digits).text();
                    assertEquals(once, twice, d + " " + digits + " digits");
                    assertEquals(card.provenance(), parsed.comments());
                }
            }
        }
    }

    /**
     * The bundled layouts are written without the template engine (BuiltinLayout); they must give exactly the bytes
     * that the bundled templates give through FreeMarker, for every dialect, with and without provenance (empty
     * provenance lines too), every parameter given or none, and every number of digits.
     */
    @Test
    void theBundledLayoutsWrittenDirectlyAreTheBundledTemplatesByteForByte() {
        CardWriter direct = new CardWriter(Optional.empty());
        CardWriter engine = CardWriter.templatesOnly(Optional.empty());
        List<ModelCard> cards = new java.util.ArrayList<>(RandomCards.generate(20, 20261203L));
        cards.add(switchingDiode());
        cards.add(new ModelCard("dnone", DiodeParameters.of(Map.of()), List.of()));
        cards.add(new ModelCard("D_Mixed.Case-1", switchingDiode().parameters(), List.of("", "  indented", "x")));
        int compared = 0;
        for (ModelCard card : cards) {
            for (Dialect d : Dialect.values()) {
                for (int digits : new int[] {SpiceNumbers.MIN_SIGNIFICANT_DIGITS, DIGITS, SpiceNumbers.MAX_SIGNIFICANT_DIGITS}) {
                    CardWriter.Rendered a = direct.render(card, d, digits);
                    CardWriter.Rendered b = engine.render(card, d, digits);
                    assertEquals(b.text(), a.text(), card.name() + " " + d);
                    assertEquals(b.dropped(), a.dropped(), card.name() + " " + d);
                    compared++;
                }
            }
        }
        assertEquals(cards.size() * Dialect.values().length * 3, compared);
    }

    /** A folder without a template of the dialect's name leaves that dialect to the bundled layout. */
    @Test
    void aTemplateFolderWithoutTheDialectsTemplateGivesTheBundledBytes() throws Exception {
        Files.writeString(folder.resolve("gnucap.ftl"), "<#list parameters as p>${p.keyword}</#list>\n", StandardCharsets.UTF_8);
        String bundled = new CardWriter(Optional.empty()).render(switchingDiode(), Dialect.NGSPICE, DIGITS).text();
        String withFolder = new CardWriter(Optional.of(folder)).render(switchingDiode(), Dialect.NGSPICE, DIGITS).text();
        assertEquals(bundled, withFolder);
    }
}
