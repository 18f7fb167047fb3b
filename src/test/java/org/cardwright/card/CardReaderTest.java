package org.cardwright.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.stream.Stream;
import org.cardwright.model.Param;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The hand-written corpus in fixtures/cards. Expected values are worked out by hand from the SPICE number rules
 * (suffix table of ngspice 39; M is milli; letters after a suffix ignored; 3k3 is 3000) and TNOM's degrees C
 * to kelvin offset; {@link CardSimulatorTest} also has ngspice 39 read the same files and compares.
 */
class CardReaderTest {
    /**
     * Relative tolerance on a read value [1]: decimal-to-double conversion is exact to half an ulp, and TNOM's
     * 273.15 K offset adds one more rounding, so a few ulp is the most that may separate two correct readings.
     */
    private static final double READ_TOLERANCE = 1e-15;

    private static final String HEADER = "Invented test input for the cardwright card reader; not data of any real part.";

    private final CardReader reader = new CardReader();

    static Stream<Arguments> corpus() {
        return Stream.of(
                Arguments.of("one-line.mod", Dialect.NGSPICE, "DSIG1", values(
                        Param.IS, 3.1e-9, Param.N, 1.84, Param.RS, 0.82, Param.CJO, 1.6e-12, Param.VJ, 0.71,
                        Param.M, 0.36, Param.TT, 4.2e-9, Param.BV, 80.0, Param.IBV, 2e-6), 0),
                Arguments.of("continuation.mod", Dialect.NGSPICE, "drect2", values(
                        Param.IS, 12.5e-9, Param.N, 1.72, Param.RS, 28e-3, Param.CJO, 55e-12, Param.VJ, 0.42,
                        Param.M, 0.38, Param.TT, 3.1e-6, Param.BV, 400.0, Param.IBV, 10e-6), 0),
                Arguments.of("lower-no-parens.mod", Dialect.NGSPICE, "dlow", values(
                        Param.IS, 3e-15, Param.N, 1.02, Param.RS, 1.5, Param.CJO, 0.9e-12, Param.VJ, 0.8,
                        Param.M, 0.45, Param.FC, 0.45), 0),
                // Is=2.5Na: nano, "a" ignored; Rs=50mOhm: milli; Bv=3k3: 3000 as ngspice 39 reads it
                Arguments.of("mixed-case-units.mod", Dialect.NGSPICE, "DmIxEd", values(
                        Param.IS, 2.5e-9, Param.N, 1.8, Param.RS, 0.05, Param.CJO, 1.2e-12, Param.VJ, 0.6,
                        Param.M, 0.45, Param.TT, 4.7e-6, Param.BV, 3000.0, Param.IBV, 1e-6, Param.IKF, 10e-3), 0),
                Arguments.of("aliases.mod", Dialect.NGSPICE, "dalias", values(
                        Param.IS, 1.5e-14, Param.N, 1.03, Param.CJO, 3e-12, Param.VJ, 0.71, Param.M, 0.29,
                        Param.IKF, 0.2, Param.BV, 6.2, Param.IBV, 5e-3, Param.TRS1, 2.5e-3, Param.TNOM, 298.15), 0),
                Arguments.of("unknown-parameter.mod", Dialect.NGSPICE, "dextra", values(
                        Param.IS, 1e-13, Param.N, 1.1, Param.RS, 2.0), 3),
                Arguments.of("exponent-forms.mod", Dialect.NGSPICE, "dexp", values(
                        Param.IS, 1.5e-9, Param.N, 1.25, Param.RS, 0.75, Param.TT, 2e-9, Param.BV, 120.0,
                        Param.IBV, 1e-3, Param.TCV, -0.05, Param.TLEV, 1.0, Param.EG, 1.11), 0),
                Arguments.of("recombination-knee.mod", Dialect.NGSPICE, "dfull", values(
                        Param.IS, 2.5e-9, Param.N, 1.8, Param.RS, 0.05, Param.ISR, 1e-12, Param.NR, 2.0,
                        Param.IKF, 0.01, Param.IKR, 1e-3, Param.EG, 1.11, Param.XTI, 3.0, Param.TRS1, 1e-3,
                        Param.TRS2, 1e-6, Param.CJO, 200e-12, Param.VJ, 0.6, Param.M, 0.45, Param.FC, 0.5,
                        Param.TT, 5e-6, Param.BV, 100.0, Param.IBV, 5e-6, Param.NBV, 2.0, Param.TCV, 0.05,
                        Param.TLEV, 0.0, Param.RTH0, 100.0, Param.TNOM, 298.15), 0),
                Arguments.of("schottky-tnom.mod", Dialect.NGSPICE, "dsch", values(
                        Param.IS, 3.2e-6, Param.N, 1.04, Param.RS, 0.045, Param.EG, 0.69, Param.XTI, 2.0,
                        Param.CJO, 380e-12, Param.VJ, 0.35, Param.M, 0.5, Param.TNOM, 298.15), 0),
                Arguments.of("gnucap-style.ckt", Dialect.GNUCAP, "dgn", values(
                        Param.IS, 7.5e-9, Param.N, 1.6, Param.RS, 0.3, Param.CJO, 40e-12, Param.VJ, 0.65,
                        // gnucap raises T/Tnom to its xti; in ngspice meaning that is XTI = N * xti = 1.6 * 3
                        Param.M, 0.4, Param.EG, 1.11, Param.XTI, 4.8, Param.TNOM, 300.15), 1),
                Arguments.of("spice3-classic.mod", Dialect.SPICE3, "D3C", values(
                        Param.IS, 1e-14, Param.N, 1.0, Param.CJO, 2e-12, Param.VJ, 0.7, Param.M, 0.5), 3));
    }

    private static Map<Param, Double> values(Object... pairs) {
        Map<Param, Double> m = new EnumMap<>(Param.class);
        for (int i = 0; i < pairs.length; i += 2) {
            m.put((Param) pairs[i], (Double) pairs[i + 1]);
        }
        return m;
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("corpus")
    void readsTheCorpus(String file, Dialect dialect, String name, Map<Param, Double> expected, int noticeCount)
            throws Exception {
        ParsedCard card = reader.read(Fixtures.card(file), dialect);
        assertEquals(name, card.name());
        assertEquals(expected.keySet(), card.parameters().givenParameters(), file + ": parameters given");
        for (Map.Entry<Param, Double> e : expected.entrySet()) {
            double got = card.parameters().get(e.getKey());
            assertEquals(e.getValue(), got, Math.abs(e.getValue()) * READ_TOLERANCE, file + " " + e.getKey());
        }
        assertEquals(noticeCount, card.notices().size(), file + " notices: " + card.notices());
        assertEquals(HEADER, card.comments().get(0), file + ": provenance header");
    }

    @Test
    void commentsBetweenContinuationLinesBelongToTheCard() throws Exception {
        ParsedCard card = reader.read(Fixtures.card("continuation.mod"), Dialect.NGSPICE);
        assertEquals(List.of(HEADER, "Style: one parameter per continuation line, comment lines between them.",
                "series resistance from the high-current end of an imaginary sweep"), card.comments());
    }

    @Test
    void unknownAndUnsupportedKeywordsAreReportedWithTheirValues() throws Exception {
        Path file = Fixtures.card("unknown-parameter.mod");
        List<String> notices = reader.read(file, Dialect.NGSPICE).notices();
        String where = file + ":4: ";
        assertTrue(notices.get(0).startsWith(where) && notices.get(0).contains("unknown parameter 'FOO=3'"),
                notices.get(0));
        assertTrue(notices.get(1).startsWith(where) && notices.get(1).contains("'TM1=1m'")
                && notices.get(1).contains("known to ngspice 39"), notices.get(1));
        assertTrue(notices.get(2).startsWith(where) && notices.get(2).contains("'KF=1e-16'"), notices.get(2));
    }

    @Test
    void aParameterTheDialectLacksIsReportedNotTaken() throws Exception {
        Path spice3 = Fixtures.card("spice3-classic.mod");
        List<String> notices = reader.read(spice3, Dialect.SPICE3).notices();
        assertTrue(notices.get(0).startsWith(spice3 + ":3: ") && notices.get(0).contains("'ISR=1E-12'")
                && notices.get(0).contains("not carried by SPICE3f5"), notices.get(0));
        Path gnucap = Fixtures.card("gnucap-style.ckt");
        String bv = reader.read(gnucap, Dialect.GNUCAP).notices().get(0);
        assertTrue(bv.startsWith(gnucap + ":3: ") && bv.contains("'bv=50' (BV) is not carried by gnucap"), bv);
        // the same spice3 card read as ngspice takes ISR and leaves only the noise parameters
        ParsedCard asNgspice = reader.read(spice3, Dialect.NGSPICE);
        assertEquals(1e-12, asNgspice.parameters().get(Param.ISR));
        assertEquals(2, asNgspice.notices().size(), asNgspice.notices().toString());
    }

    @Test
    void aSecondCardIsRefusedAndAGivenNameMustMatch() throws Exception {
        Path file = Fixtures.card("two-models.lib");
        CardFormatException many = assertThrows(CardFormatException.class, () -> reader.read(file, Dialect.NGSPICE));
        assertTrue(many.getMessage().startsWith(file + ":6: refused a second .model statement after the .model"),
                many.getMessage());
        assertThrows(CardFormatException.class, () -> reader.read(file, Dialect.NGSPICE, Optional.of("DPAIR2")));

        Path one = Fixtures.card("one-line.mod");
        assertEquals("DSIG1", reader.read(one, Dialect.NGSPICE, Optional.of("dsig1")).name());
        CardFormatException other = assertThrows(CardFormatException.class,
                () -> reader.read(one, Dialect.NGSPICE, Optional.of("dsig2")));
        assertTrue(other.getMessage().contains("no .model named dsig2; the card holds 'DSIG1'"), other.getMessage());
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
        "bad-number.mod          | 4 | 'N=1..8'",
        "bad-no-model.mod        | 3 | 'D1 a 0 dmissing'",
        "netlist-fragment.cir    | 3 | 'V1 a 0 DC 0.65'",
        "two-models.lib          | 6 | '.model dpair2 D(IS=10n N=1.7 RS=0.2)'",
        "bad-type.mod            | 3 | 'NPN'",
        "bad-duplicate-alias.mod | 6 | 'CJ0=3p'",
        "bad-continuation.mod    | 3 | '+ IS=1n N=2'",
        "bad-missing-equals.mod  | 4 | 'N'",
        "bad-range.mod           | 4 | 'M=1.5'",
        "bad-name.mod            | 3 | '9volt'",
        "bad-no-type.mod         | 3 | 'IS'",
        "bad-repeated-name.lib   | 4 | 'DTWICE'",
        "bad-no-value.mod        | 3 | 'N='"
    })
    void badCardsNameFileLineAndText(String file, int line, String rawText) {
        Path path = Fixtures.card(file);
        CardFormatException e = assertThrows(CardFormatException.class, () -> reader.read(path, Dialect.NGSPICE));
        String where = line > 0 ? path + ":" + line + ": " : path + ": ";
        assertTrue(e.getMessage().startsWith(where), "expected " + where + " in: " + e.getMessage());
        assertTrue(e.getMessage().contains(rawText), "expected " + rawText + " in: " + e.getMessage());
        assertFalse(e.getMessage().contains("\n"), "one line: " + e.getMessage());
        assertEquals(path.toString(), e.source());
        assertEquals(line, e.line());
    }

    @Test
    void duplicateMessageNamesBothSpellings() {
        CardFormatException e = assertThrows(CardFormatException.class,
                () -> reader.read(Fixtures.card("bad-duplicate-alias.mod"), Dialect.NGSPICE));
        assertTrue(e.getMessage().contains("CJO already given as CJO on line 4"), e.getMessage());
    }

    @Test
    void readsTextFromMemoryWithWindowsLineEndingsAndAByteOrderMark() {
        String text = "\uFEFF* invented\r\n.model dwin D(IS=1n\r\n+ N=2)\r\n";
        ParsedCard card = reader.parse(text, "memory", Dialect.NGSPICE);
        assertEquals(1e-9, card.parameters().get(Param.IS));
        assertEquals(2.0, card.parameters().get(Param.N));
        assertEquals(List.of("invented"), card.comments());
    }

    @Test
    void aSpellingAnotherSimulatorUsesIsReportedAsSuch() {
        ParsedCard card = reader.parse(".model djs D(JS=1n N=1.1)", "memory", Dialect.SPICE3);
        assertFalse(card.parameters().isGiven(Param.IS));
        assertEquals(List.of("memory:1: 'JS=1n' is not a SPICE3f5 spelling of IS; ignored"), card.notices());
    }

    @Test
    void aValueMayStandOnTheLineAfterItsName() {
        ParsedCard card = reader.parse(".model dsplit D IS =\n+ 4n N\n+ = 1.3\n", "memory", Dialect.NGSPICE);
        assertEquals(4e-9, card.parameters().get(Param.IS), 4e-9 * READ_TOLERANCE);
        assertEquals(1.3, card.parameters().get(Param.N));
        CardFormatException e = assertThrows(CardFormatException.class,
                () -> reader.parse(".model dsplit D IS =\n+ 4n N\n+ = x1\n", "memory", Dialect.NGSPICE));
        assertTrue(e.getMessage().startsWith("memory:3: not a number: 'N=x1'"), e.getMessage());
    }

    @Test
    void theFirstLineIsNotSkipped() {
        ParsedCard card = reader.parse(".model dfirst D(IS=3n)", "memory", Dialect.NGSPICE);
        assertEquals(3e-9, card.parameters().get(Param.IS), 3e-9 * READ_TOLERANCE);
    }

    @Test
    void errorsFromMemoryNameTheSource() {
        CardFormatException e = assertThrows(CardFormatException.class,
                () -> reader.parse("* x\n.model dq D(IS=1n RS=-1)\n", "typed card", Dialect.NGSPICE));
        assertTrue(e.getMessage().startsWith("typed card:2: "), e.getMessage());
        assertTrue(e.getMessage().contains("'RS=-1'"), e.getMessage());
    }

    @Test
    void aRefusedLineIsQuotedShortAndEscaped() {
        String hostile = ".model desc D(IS=1n)\n.control \u001b[2J\u0000" + "x".repeat(200) + "\n";
        CardFormatException e = assertThrows(CardFormatException.class,
                () -> reader.parse(hostile, "esc.lib", Dialect.NGSPICE));
        assertTrue(e.getMessage().startsWith("esc.lib:2: refused a simulator control block (.control) after the"),
                e.getMessage());
        assertTrue(e.getMessage().contains("'.control \\u001b[2J\\u0000xxx"), e.getMessage());
        assertTrue(e.getMessage().endsWith("...'"), e.getMessage());
        assertTrue(e.getMessage().chars().allMatch(c -> c >= 0x20 && c < 0x7f), "printable ASCII only");
    }
}
