package org.cardwright.data;

import static org.cardwright.data.BadFixtures.assertMentions;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.math.BigDecimal;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

/**
 * The unit table. Prefix values are the SI prefixes (SI Brochure, 9th edition, BIPM 2019, table 7); every
 * comparison is exact, because the conversion is decimal and rounds once.
 */
class ColumnUnitTest {

    private static double si(Quantity q, String unit, String value) throws CellProblem {
        return ColumnUnit.parse(q, unit).toSi(new BigDecimal(value)).doubleValue();
    }

    @ParameterizedTest(name = "1 {1} = {2}")
    @CsvSource({
            "VOLTAGE, V, 1", "VOLTAGE, mV, 1e-3", "VOLTAGE, uV, 1e-6", "VOLTAGE, \u00b5V, 1e-6",
            "VOLTAGE, \u03bcV, 1e-6", "VOLTAGE, kV, 1e3", "VOLTAGE, KV, 1e3", "VOLTAGE, mv, 1e-3",
            "CURRENT, A, 1", "CURRENT, mA, 1e-3", "CURRENT, uA, 1e-6", "CURRENT, \u00b5A, 1e-6",
            "CURRENT, UA, 1e-6", "CURRENT, nA, 1e-9", "CURRENT, NA, 1e-9", "CURRENT, pA, 1e-12",
            "CURRENT, fA, 1e-15", "CURRENT, a, 1",
            "CAPACITANCE, F, 1", "CAPACITANCE, mF, 1e-3", "CAPACITANCE, uF, 1e-6", "CAPACITANCE, \u00b5F, 1e-6",
            "CAPACITANCE, nF, 1e-9", "CAPACITANCE, pF, 1e-12", "CAPACITANCE, PF, 1e-12", "CAPACITANCE, fF, 1e-15",
    })
    void prefixesScaleByTheirPowerOfTen(Quantity q, String unit, double expected) throws CellProblem {
        assertEquals(expected, si(q, unit, "1"));
    }

    @ParameterizedTest(name = "{1} {2} = {3} K")
    @CsvSource({
            "TEMPERATURE, degC, 25, 298.15", "TEMPERATURE, \u00b0C, 25, 298.15", "TEMPERATURE, C, -40, 233.15",
            "TEMPERATURE, celsius, 0, 273.15", "TEMPERATURE, DEGC, 100, 373.15",
            "TEMPERATURE, K, 300, 300", "TEMPERATURE, kelvin, 77, 77", "TEMPERATURE, k, 300, 300",
            // NIST Special Publication 811 (2008), appendix B.9: T/K = (t/degF + 459.67)/1.8
            "TEMPERATURE, degF, 77, 298.15", "TEMPERATURE, \u00b0F, 32, 273.15", "TEMPERATURE, fahrenheit, -40, 233.15",
    })
    void temperaturesBecomeKelvin(Quantity q, String unit, String value, double kelvin) throws CellProblem {
        assertEquals(kelvin, si(q, unit, value));
    }

    @Test
    void noUnitMeansSiAndCelsiusForTemperature() {
        assertEquals(0.5, ColumnUnit.implicit(Quantity.VOLTAGE).toSi(new BigDecimal("0.5")).doubleValue());
        assertEquals(298.15, ColumnUnit.implicit(Quantity.TEMPERATURE).toSi(new BigDecimal("25")).doubleValue());
    }

    @Test
    void decimalConversionIsExactWhereBinaryMultiplicationIsNot() throws CellProblem {
        // in binary, 2.1 * 1e-3 and 2.1 / 1000 both give 0.0021000000000000003 (checked with Java 17); the
        // decimal path gives the double nearest 2.1e-3
        assertEquals(2.1e-3, si(Quantity.CURRENT, "mA", "2.1"));
        assertEquals(0.0021, si(Quantity.CURRENT, "uA", "2100"));
    }

    @ParameterizedTest
    @CsvSource({"CURRENT, MA", "VOLTAGE, MV", "CAPACITANCE, MF", "CURRENT, Ma"})
    void capitalMPrefixIsAmbiguous(Quantity q, String unit) {
        CellProblem e = assertThrows(CellProblem.class, () -> ColumnUnit.parse(q, unit));
        assertMentions(e.problem(), "ambiguous unit '" + unit + "'");
    }

    @ParameterizedTest
    @CsvSource({"CURRENT, amps", "VOLTAGE, volt", "CAPACITANCE, pf2", "TEMPERATURE, R", "CURRENT, ''"})
    void unknownSpellingsAreRefused(Quantity q, String unit) {
        CellProblem e = assertThrows(CellProblem.class, () -> ColumnUnit.parse(q, unit));
        assertMentions(e.problem(), "unknown unit '" + unit + "'");
    }

    @Test
    void unitOfAnotherQuantityIsNamed() {
        CellProblem e = assertThrows(CellProblem.class, () -> ColumnUnit.parse(Quantity.CAPACITANCE, "nA"));
        assertMentions(e.problem(), "it is a current unit");
    }
}
