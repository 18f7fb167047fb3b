package org.cardwright.data;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Conditions given from outside a file (a device file, the command line) are read where the file states none,
 * and lose to the file's own statement with a note; the values behave as the data file's settings do.
 */
class GivenConditionsTest {
    /** Decimal arithmetic on the cells, then one rounding to double: a few ulps of a volt [V]. */
    private static final double EXACT_V = 1e-12;
    /** A current of about 4.3 mA from decimal arithmetic: double rounding only, with room (about 1000 ulp) [A]. */
    private static final double CURRENT_ROUNDING_A = 1e-15;
    /** A capacitance of 1.5 pF read from a decimal with a suffix: double rounding only, about 5 ulp [F]. */
    private static final double CAPACITANCE_ROUNDING_F = 1e-27;
    /**
     * 1 MHz read from a decimal with a unit or suffix: 1 uHz, far above double rounding (ulp 1.2e-10 Hz) and far below
     * a misread unit [Hz].
     */
    private static final double FREQUENCY_ROUNDING_HZ = 1e-6;
    private static final String DEVICE = "device file lib/X.device.yaml (data entry at line 7)";

    private static Path file(String name, String... lines) throws IOException {
        Path p = Simulators.tempDir("given-conditions").resolve(name);
        Files.write(p, List.of(lines), StandardCharsets.UTF_8);
        return p;
    }

    @Test
    void aGivenLeadResistanceIsSubtractedAsTheFileSettingWouldBe() throws Exception {
        Path p = file("lead.csv", "# invented", "V,I,T", "0.700,0.010,25", "0.800,0.100,25");
        GivenConditions given = GivenConditions.NONE.with(Condition.LEAD_RESISTANCE,
                Condition.LEAD_RESISTANCE.parse("500 mohm"), DEVICE);
        MeasurementFile f = new MeasurementReader(ReadOptions.defaults()).read(p, given);
        // Ohm's law: the leads drop I * R (fact of the trade)
        assertEquals(0.700 - 0.010 * 0.5, f.iv().get(0).voltage(), EXACT_V);
        assertEquals(0.800 - 0.100 * 0.5, f.iv().get(1).voltage(), EXACT_V);
        assertEquals(DEVICE, f.condition(Condition.LEAD_RESISTANCE).orElseThrow().source());
        assertTrue(f.notices().stream().anyMatch(n -> n.toString().contains("lead resistance 500 mohm from " + DEVICE)),
                f.notices().toString());

        Path stated = file("lead-stated.csv", "# invented", "# lead resistance = 0.1 ohm", "V,I,T", "0.700,0.010,25");
        MeasurementFile g = new MeasurementReader(ReadOptions.defaults()).read(stated, given);
        assertEquals(0.700 - 0.010 * 0.1, g.iv().get(0).voltage(), EXACT_V);
        assertTrue(g.notices().stream().anyMatch(n -> n.toString().contains(
                "lead-stated.csv:2: the file states its lead resistance 100 mohm; 500 mohm given by " + DEVICE + " is not used")),
                g.notices().toString());
    }

    @Test
    void aGivenMeterResistanceAndTemperatureFillWhatTheFileLeavesOut() throws Exception {
        Path log = file("log.csv", "# invented", "Vsupply,Rseries,Vmeter", "5,1000,0.65");
        DataFileException none = assertThrows(DataFileException.class,
                () -> new MeasurementReader(ReadOptions.defaults()).read(log));
        assertTrue(none.getMessage().contains("no T column"), none.getMessage());
        GivenConditions given = GivenConditions.NONE
                .with(Condition.METER_INPUT_RESISTANCE, Condition.METER_INPUT_RESISTANCE.parse("10meg"), DEVICE)
                .with(Condition.TEMPERATURE, Condition.TEMPERATURE.parse("85"), DEVICE);
        MeasurementFile f = new MeasurementReader(ReadOptions.defaults()).read(log, given);
        // Kirchhoff's current law at the diode node (docs/bench-logs.md): (5 - 0.65) / 1000 - 0.65 / 10e6
        assertEquals((5 - 0.65) / 1000 - 0.65 / 10e6, f.iv().get(0).current(), CURRENT_ROUNDING_A);
        assertEquals(85 + 273.15, f.iv().get(0).temperature(), EXACT_V);
        assertTrue(f.notices().stream().anyMatch(n -> n.toString().contains("every point is at the temperature given by "
                + DEVICE)), f.notices().toString());
    }

    @Test
    void valuesAreReadAsSettingsAre() {
        assertEquals(1.5e-12, Condition.STRAY_CAPACITANCE.parse("1.5 pF"), CAPACITANCE_ROUNDING_F);
        assertEquals(1.5e-12, Condition.STRAY_CAPACITANCE.parse("1.5p"), CAPACITANCE_ROUNDING_F);
        assertEquals(1e6, Condition.TEST_FREQUENCY.parse("1 MHz"), FREQUENCY_ROUNDING_HZ);
        assertEquals(1e6, Condition.TEST_FREQUENCY.parse("1meg"), FREQUENCY_ROUNDING_HZ);
        assertEquals(1, Condition.REVERSE_MAGNITUDES.parse("yes"));
        assertEquals(0, Condition.REVERSE_MAGNITUDES.parse("No"));
        assertThrows(IllegalArgumentException.class, () -> Condition.TEST_FREQUENCY.parse("0 Hz"));
        assertThrows(IllegalArgumentException.class, () -> Condition.STRAY_CAPACITANCE.parse("1.5 pA"));
        assertEquals(Condition.STRAY_CAPACITANCE, Condition.byKey("Stray_Capacitance").orElseThrow());
        assertEquals("1.5 pF", Condition.STRAY_CAPACITANCE.text(1.5e-12));
    }
}
