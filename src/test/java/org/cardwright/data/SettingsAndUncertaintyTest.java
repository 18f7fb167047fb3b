package org.cardwright.data;

import static org.cardwright.data.BadFixtures.assertMentions;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.math.BigDecimal;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * File settings, SPICE suffixes, resistance units and per-point uncertainties of point tables. Expected values
 * are written out from their definitions (SI prefixes, SPICE suffixes as the ngspice 39 manual lists them, the
 * GUM's uniform-distribution rule) and compared exactly where the reader converts in decimal.
 */
class SettingsAndUncertaintyTest {
    /** sqrt(3), the ratio of a uniform distribution's half-width to its standard deviation (GUM 4.3.7) [1]. */
    private static final double SQRT3 = Math.sqrt(3);
    /** Double arithmetic of a few operations: rounding only [1]. */
    private static final double ROUNDING = 1e-14;

    @TempDir
    Path dir;

    private final MeasurementReader reader = new MeasurementReader(ReadOptions.defaults());

    @ParameterizedTest(name = "{0} = {1}")
    @CsvSource({"1.2m, 1.2e-3", "10meg, 1e7", "10MEG, 1e7", "3.3k, 3.3e3", "3.3K, 3.3e3", "47u, 4.7e-5",
            "2.5n, 2.5e-9", "2.5N, 2.5e-9", "1p, 1e-12", "1f, 1e-15", "2g, 2e9", "1t, 1e12", "1e-3m, 1e-6",
            "-4.5u, -4.5e-6", "5M, 5e-3", "0.5, 0.5"})
    void spiceSuffixesScaleAsSpiceReadsThem(String text, double expected) throws CellProblem {
        assertEquals(expected, CellNumber.parse(text, false).value().doubleValue());
    }

    @ParameterizedTest
    @ValueSource(strings = {"5 mA", "1.2mV", "10megohm", "3k3", "1mil", "1a", "k", "1x"})
    void anythingAfterTheSuffixIsRefused(String text) {
        assertThrows(CellProblem.class, () -> CellNumber.parse(text, false));
    }

    @Test
    void decimalCommaOnlyWhereTheFileAllowsIt() throws CellProblem {
        assertEquals(new BigDecimal("0.65"), CellNumber.parse("0,65", true).value());
        assertEquals(new BigDecimal("-2.2e-3"), CellNumber.parse("-2,2m", true).value());
        assertMentions(assertThrows(CellProblem.class, () -> CellNumber.parse("0,65", false)).problem(),
                "decimal comma is read only in files whose cells are separated by semicolons or tabs");
        assertThrows(CellProblem.class, () -> CellNumber.parse("1,234.5", true));
        assertEquals("not a finite number", assertThrows(CellProblem.class,
                () -> CellNumber.parse("NaN", true)).problem());
    }

    @ParameterizedTest(name = "1 {0} = {1} ohm")
    @CsvSource({"ohm, 1", "\u03a9, 1", "mohm, 1e-3", "mOhm, 1e-3", "kohm, 1e3", "kOhm, 1e3", "KOHM, 1e3",
            "Mohm, 1e6", "MOhm, 1e6", "M\u03a9, 1e6", "megohm, 1e6", "Gohm, 1e9"})
    void resistanceUnitsFollowSiCase(String unit, double expected) throws CellProblem {
        assertEquals(expected, ColumnUnit.parse(Quantity.RESISTANCE, unit).toSi(BigDecimal.ONE).doubleValue());
    }

    @ParameterizedTest
    @ValueSource(strings = {"MOHM", "mOHM", "Mohms"})
    void resistanceUnitsThatCaseCannotSettleAreRefused(String unit) {
        CellProblem e = assertThrows(CellProblem.class, () -> ColumnUnit.parse(Quantity.RESISTANCE, unit));
        assertTrue(e.problem().contains("ambiguous") || e.problem().contains("unknown"), e.problem());
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
            "10 Mohm   | 1e7", "10meg | 1e7", "10 megohm | 1e7", "1 Gohm | 1e9", "120 mohm | 0.12",
            "0.12      | 0.12", "2.2k | 2200", "4,7 kohm | 4700"})
    void resistanceSettingsAreRead(String text, double expected) throws CellProblem {
        assertEquals(expected, FileSettings.quantity(text, Quantity.RESISTANCE, true));
    }

    @Test
    void settingKeysIgnoreCaseBlanksUnderscoresAndHyphens() {
        assertEquals(SettingKey.METER_INPUT_RESISTANCE, SettingKey.of("Meter_Input-Resistance").orElseThrow());
        assertEquals(SettingKey.LEAD_RESISTANCE, SettingKey.of("  lead   resistance ").orElseThrow());
        assertTrue(SettingKey.of("operator").isEmpty());
    }

    @Test
    void modelLinesInCommentsAreNotSettings() {
        assertTrue(Preamble.commentSetting(1, "#   .model D1 D(IS=2e-14 N=1.05)").isEmpty());
        assertTrue(Preamble.commentSetting(1, "# (.options reltol=1e-7)").isEmpty());
        assertEquals("lead resistance", Preamble.commentSetting(1, "# lead resistance = 0.1 ohm").orElseThrow().key());
    }

    @Test
    void instrumentAccuracyGivesAUniformSigmaPerPoint() throws Exception {
        MeasurementFile f = reader.read(write("spec.csv", String.join("\n",
                "# voltmeter accuracy = 0.015 % + 2 counts",
                "# voltmeter resolution = 10 uV",
                "# ammeter accuracy = 0.1 % of reading + 5 nA",
                "V,I,T",
                "0.65,1e-3,25",
                "-5,-2e-9,25", "")));
        IvPoint p = f.iv().get(0);
        // limit = 0.015 % of 0.65 V + 2 * 10 uV; sigma = limit / sqrt(3)  (GUM 4.3.7)
        assertRelative((0.00015 * 0.65 + 2e-5) / SQRT3, p.voltageSigma(), "sigma V");
        assertRelative((0.001 * 1e-3 + 5e-9) / SQRT3, p.currentSigma(), "sigma I");
        assertEquals(0.0, p.voltageCurrentCorrelation());
        IvPoint reverse = f.iv().get(1);
        assertRelative((0.00015 * 5 + 2e-5) / SQRT3, reverse.voltageSigma(), "sigma V of a negative reading");
        assertRelative((0.001 * 2e-9 + 5e-9) / SQRT3, reverse.currentSigma(), "sigma I of a negative reading");
        assertTrue(f.notices().stream().anyMatch(n -> n.message().startsWith("per-point uncertainty: V from "
                + "voltmeter accuracy")), f.notices().toString());
    }

    @Test
    void statedColumnsWinAndEmptyCellsFallBackToTheSpec() throws Exception {
        MeasurementFile f = reader.read(write("stated.csv", String.join("\n",
                "# ammeter accuracy = 1 %",
                "V,I [mA],dV [mV],dI [uA],T",
                "0.65,1,0.2,3,25",
                "0.70,4,0.2,,25",
                "0.75,9,,,25", "")));
        assertEquals(List.of(2e-4, 2e-4, Double.NaN), f.iv().stream().map(IvPoint::voltageSigma).toList());
        assertEquals(3e-6, f.iv().get(0).currentSigma());
        assertRelative(0.01 * 4e-3 / SQRT3, f.iv().get(1).currentSigma(), "fallback sigma I");
        assertFalse(f.iv().get(2).hasVoltageSigma());
        assertTrue(f.iv().get(2).hasCurrentSigma());
    }

    @Test
    void leadResistanceCorrectsVAndCorrelatesItsError() throws Exception {
        MeasurementFile f = reader.read(write("leads.csv", String.join("\n",
                "# lead resistance = 0.25 ohm",
                "V,I,dV,dI,T",
                "0.9,0.08,1e-4,2e-4,25", "")));
        IvPoint p = f.iv().get(0);
        assertEquals(0.88, p.voltage(), "0.9 - 0.08 * 0.25, in decimal");
        // V = Vm - R I: u(V)^2 = u(Vm)^2 + R^2 u(I)^2, cov(V, I) = -R u(I)^2 (GUM 5.1.2, 5.2.2)
        double sigmaV = Math.sqrt(1e-8 + 0.0625 * 4e-8);
        assertRelative(sigmaV, p.voltageSigma(), "sigma V");
        assertRelative(-0.25 * 4e-8 / (sigmaV * 2e-4), p.voltageCurrentCorrelation(), "correlation");
    }

    @Test
    void fileTemperatureSettingFillsRowsAndOutranksTheOption() throws Exception {
        MeasurementReader withOption = new MeasurementReader(ReadOptions.defaults().withDefaultTemperature(300));
        MeasurementFile f = withOption.read(write("t.csv", "# temperature = 85 degC\nV,I\n0.5,1e-5\n"));
        assertEquals(358.15, f.iv().get(0).temperature());
        assertTrue(f.notices().stream().anyMatch(n -> n.message().contains("the given temperature 300.0 K")
                && n.message().contains("is not used")), f.notices().toString());
        MeasurementFile rows = reader.read(write("t-rows.csv", "# temperature = 300 K\nV,I,T\n0.5,1e-5,\n0.6,1e-4,25\n"));
        assertEquals(List.of(300.0, 298.15), rows.iv().stream().map(IvPoint::temperature).toList());
    }

    @Test
    void settingsThatDoNotApplyOrComeTooLateAreNoted() throws Exception {
        MeasurementFile f = reader.read(write("cv.csv", String.join("\n",
                "# lead resistance = 0.1 ohm",
                "# resistor tolerance = 1 %",
                "V,C [pF],T",
                "-1,3.9,25",
                "# voltmeter accuracy = 0.1 %",
                "-2,3.1,25", "")));
        List<String> messages = f.notices().stream().map(Notice::toString).toList();
        assertTrue(messages.stream().anyMatch(m -> m.contains(":1: settings 'lead resistance' (line 1), "
                + "'resistor tolerance' (line 2) not used: they do not apply to a C-V file")), messages.toString());
        assertTrue(messages.stream().anyMatch(m -> m.contains(":5: setting 'voltmeter accuracy' after the header "
                + "row is not read")), messages.toString());
    }

    @Test
    void capitalMSuffixInACellIsReadAsMilliAndNoted() throws Exception {
        MeasurementFile f = reader.read(write("m.csv", "V,I,T\n650M,1e-3,25\n"));
        assertEquals(0.65, f.iv().get(0).voltage());
        assertMentions(f.notices().get(0).message(), "M is milli (1e-3), not mega; write meg for mega");
    }

    @Test
    void aSemicolonFileCanBeForcedAndThenNeedsNoDetection() throws Exception {
        MeasurementReader forced = new MeasurementReader(ReadOptions.defaults().withDelimiter(';'));
        MeasurementFile f = forced.read(write("forced.csv", "V;I [mA];T\n0,5;1,5;25\n"));
        assertEquals(List.of(new IvPoint(0.5, 1.5e-3, 298.15, 2)), f.iv());
        assertTrue(f.notices().isEmpty(), f.notices().toString());
    }

    @Test
    void ivPointChecksItsUncertainties() {
        assertThrows(IllegalArgumentException.class, () -> new IvPoint(0.5, 1e-3, 300, 1, 0, 1e-6));
        assertThrows(IllegalArgumentException.class, () -> new IvPoint(0.5, 1e-3, 300, 1, -1e-3, 1e-6));
        assertThrows(IllegalArgumentException.class,
                () -> new IvPoint(0.5, 1e-3, 300, 1, Double.POSITIVE_INFINITY, 1e-6));
        assertThrows(IllegalArgumentException.class, () -> new IvPoint(0.5, 1e-3, 300, 1, 1e-3, 1e-6, 1.5));
        assertThrows(IllegalArgumentException.class,
                () -> new IvPoint(0.5, 1e-3, 300, 1, Double.NaN, 1e-6, -0.5));
        IvPoint plain = new IvPoint(0.5, 1e-3, 300, 1);
        assertFalse(plain.hasVoltageSigma() || plain.hasCurrentSigma());
        assertEquals(0.0, plain.voltageCurrentCorrelation());
        assertEquals(plain, new IvPoint(0.5, 1e-3, 300, 1, Double.NaN, Double.NaN, 0));
        assertEquals(-0.9, new IvPoint(0.5, 1e-3, 300, 1, 1e-3, 1e-6, -0.9).voltageCurrentCorrelation());
    }

    private Path write(String name, String content) throws IOException {
        return Files.writeString(dir.resolve(name), content, StandardCharsets.UTF_8);
    }

    private static void assertRelative(double expected, double actual, String what) {
        assertTrue(Math.abs(actual - expected) <= ROUNDING * Math.abs(expected),
                what + ": expected " + expected + ", got " + actual);
    }
}
