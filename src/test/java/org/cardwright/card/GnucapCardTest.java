package org.cardwright.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The gnucap dialect's value conversion: gnucap 2017.10.03 raises T/Tnom to XTI in its saturation-current law,
 * ngspice 39 to XTI/N (diode-model.md sections 2 and 9, read from both simulators' sources), so a gnucap card
 * states XTI/N. Whether gnucap then reproduces ngspice's law is proven against gnucap itself in
 * {@code org.cardwright.sim.GnucapEngineTest}; here: the conversion, its inverse, and gnucap's default XTI.
 */
class GnucapCardTest {
    /** Relative error allowed on a converted value: one division and one multiplication, a few ulp [1]. */
    private static final double CONVERSION_TOLERANCE = 1e-15;
    /**
     * Forward voltages of two gnucap runs that must be identical; both print 15 digits of the same computation,
     * so allow one unit in the 14th digit [V].
     */
    private static final double SAME_RUN_TOLERANCE = 1e-13;
    /** 1 mV: XTI = 2 against 3 at 125 degC moves VF by millivolts, so a smaller change means XTI was ignored [V]. */
    private static final double XTI_CHANGE_SEEN_V = 1e-3;

    @TempDir
    Path folder;

    private static DiodeParameters invented() {
        // invented values, no real part: a junction with N = 1.6 and XTI = 3.5, stated at 40 degC
        return DiodeParameters.defaults().with(Param.IS, 7.5e-9).with(Param.N, 1.6).with(Param.RS, 0.3)
                .with(Param.XTI, 3.5).with(Param.EG, 1.05).with(Param.TNOM, 313.15);
    }

    @Test
    void ngspiceAndSpice3CardsStateTheValuesUnchanged() {
        DiodeParameters p = invented();
        for (Dialect d : List.of(Dialect.NGSPICE, Dialect.SPICE3)) {
            assertSame(p, d.toCard(p), d.shortName());
            assertSame(p, d.fromCard(p), d.shortName());
        }
    }

    @Test
    void aGnucapCardStatesXtiOverN() {
        DiodeParameters card = Dialect.GNUCAP.toCard(invented());
        assertEquals(3.5 / 1.6, card.get(Param.XTI), 3.5 / 1.6 * CONVERSION_TOLERANCE);
        for (Param p : List.of(Param.IS, Param.N, Param.RS, Param.EG, Param.TNOM)) {
            assertEquals(invented().get(p), card.get(p), p + " is not converted");
        }
        DiodeParameters back = Dialect.GNUCAP.fromCard(card);
        assertEquals(3.5, back.get(Param.XTI), 3.5 * CONVERSION_TOLERANCE);
        assertEquals(invented().givenParameters(), back.givenParameters());
    }

    @Test
    void withNOtherThanOneTheDefaultXtiIsStatedOnAGnucapCard() {
        // ngspice's default XTI = 3 acts as (T/Tnom)^(3/N); gnucap's own default would act as (T/Tnom)^3
        DiodeParameters p = DiodeParameters.defaults().with(Param.IS, 1e-12).with(Param.N, 2.0);
        DiodeParameters card = Dialect.GNUCAP.toCard(p);
        assertTrue(card.isGiven(Param.XTI));
        assertEquals(1.5, card.get(Param.XTI), 1.5 * CONVERSION_TOLERANCE);

        DiodeParameters nIsOne = DiodeParameters.defaults().with(Param.IS, 1e-12).with(Param.N, 1.0);
        assertFalse(Dialect.GNUCAP.toCard(nIsOne).isGiven(Param.XTI), "N = 1: nothing to convert, nothing added");
    }

    @Test
    void aHandWrittenGnucapCardWithoutXtiMeansGnucapsDefaultOfThree() {
        ParsedCard card = new CardReader().parse("* invented\n.model dh d (is=1n n=1.5)\n", "hand.ckt",
                Dialect.GNUCAP);
        assertEquals(Dialect.GNUCAP_DEFAULT_XTI * 1.5, card.parameters().get(Param.XTI),
                Dialect.GNUCAP_DEFAULT_XTI * 1.5 * CONVERSION_TOLERANCE, "ngspice meaning of gnucap's (T/Tnom)^3 with N = 1.5");
    }

    @Test
    void writerAndReaderConvertAndTheRestOfTheProgramSeesNgspiceMeaning() {
        ModelCard card = new ModelCard("dconv", invented(), List.of("Invented card, not data of any real part"));
        String text = new CardWriter(Optional.empty()).render(card, Dialect.GNUCAP, 7).text();
        assertTrue(text.contains("\n+ xti=2.1875\n"), "3.5 / 1.6 = 2.1875 on the card:\n" + text);
        String ngspiceText = new CardWriter(Optional.empty()).render(card, Dialect.NGSPICE, 7).text();
        assertTrue(ngspiceText.contains("\n+ XTI=3.5\n"), ngspiceText);

        ParsedCard read = new CardReader().parse(text, "dconv.lib", Dialect.GNUCAP);
        assertEquals(3.5, read.parameters().get(Param.XTI), 3.5 * CONVERSION_TOLERANCE);
        assertEquals(text, new CardWriter(Optional.empty()).render(read.toModelCard(), Dialect.GNUCAP, 7).text(),
                "re-rendering a read card gives the same bytes");
    }

    @Test
    void gnucapsDefaultXtiIsThree() throws Exception {
        // Outside reference: gnucap itself. Two cards, one without XTI and one with XTI=3, forced to 1 mA at
        // 125 degC (far from TNOM = 27 degC, where XTI matters): the voltages must be the same number.
        ExternalSimulator gnucap = ExternalSimulator.gnucap();
        String deck = String.join("\n",
                "gnucap default xti",
                ".model mnone d (is=1p n=1.5)",
                ".model mthree d (is=1p n=1.5 xti=" + Dialect.GNUCAP_DEFAULT_XTI + ")",
                ".model mtwo d (is=1p n=1.5 xti=2)",
                "I1 0 a dc 1m", "D1 a 0 mnone",
                "I2 0 b dc 1m", "D2 b 0 mthree",
                "I3 0 c dc 1m", "D3 c 0 mtwo",
                ".options numdgt=15",
                ".print op v(a) v(b) v(c)",
                ".op 125",
                ".end", "");
        Path file = folder.resolve("xti.ckt");
        Files.writeString(file, deck, StandardCharsets.UTF_8);
        String output = gnucap.runBatch(file);
        ExternalSimulator.assertNoneOf(output, List.of("bad parameter", "no match", "error"), "default XTI deck");
        Matcher m = Pattern.compile("(?m)^\\s*125\\.\\s+(\\S+)\\s+(\\S+)\\s+(\\S+)\\s*$").matcher(output);
        assertTrue(m.find(), output);
        double none = Double.parseDouble(m.group(1));
        double three = Double.parseDouble(m.group(2));
        double two = Double.parseDouble(m.group(3));
        assertEquals(three, none, SAME_RUN_TOLERANCE, "no XTI on the card acts as XTI = 3");
        // negative control: the comparison can fail, another XTI moves the voltage by millivolts
        assertTrue(Math.abs(two - none) > XTI_CHANGE_SEEN_V, "XTI = 2 differs: " + two + " V against " + none + " V");
    }
}
