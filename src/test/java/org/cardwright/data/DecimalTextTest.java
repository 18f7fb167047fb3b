package org.cardwright.data;

import static org.cardwright.data.BadFixtures.assertMentions;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.math.BigDecimal;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** Reading a cell as a decimal number: what passes, and what is refused that Double.parseDouble would take. */
class DecimalTextTest {

    @ParameterizedTest
    @ValueSource(strings = {"1", "-1.5", "+2.", ".25", "3e-9", "3E+9", " 0.5 ", "-0", "1.0e0"})
    void plainDecimalsAreRead(String text) throws CellProblem {
        assertEquals(new BigDecimal(text.strip()), DecimalText.parse(text));
    }

    @ParameterizedTest
    @ValueSource(strings = {"NaN", "nan", "-NaN", "Infinity", "-Infinity", "+inf", "INF", "1.#INF", "-1.#IND",
            "\u221e"})
    void nanAndInfinityAreRefusedAsNotFinite(String text) {
        CellProblem e = assertThrows(CellProblem.class, () -> DecimalText.parse(text));
        assertEquals("not a finite number", e.problem());
    }

    @ParameterizedTest
    @ValueSource(strings = {"1d", "2f", "0x1p3", "1,5", "1.2.3", "e5", "--1", "1e", "OVLD", "#DIV/0!", "5 mA"})
    void otherTextIsRefusedAsNotANumber(String text) {
        CellProblem e = assertThrows(CellProblem.class, () -> DecimalText.parse(text));
        assertEquals("not a number", e.problem());
    }

    @Test
    void emptyCellIsNamedAsSuch() {
        CellProblem e = assertThrows(CellProblem.class, () -> DecimalText.parse("  "));
        assertEquals("empty cell", e.problem());
    }

    @Test
    void valuesOutsideDoubleRangeAreRefusedNotRounded() {
        assertMentions(assertThrows(CellProblem.class,
                () -> DecimalText.toDouble(new BigDecimal("1e400"))).problem(), "too large");
        assertMentions(assertThrows(CellProblem.class,
                () -> DecimalText.toDouble(new BigDecimal("1e-400"))).problem(), "too small");
        assertMentions(assertThrows(CellProblem.class,
                () -> DecimalText.parse("1e99999999999")).problem(), "out of range");
    }
}
