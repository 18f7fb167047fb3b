package org.cardwright.report;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Numbers in our JSON writer keep their value: nothing is cut to a whole number or to a long's range. */
class JsonTest {
    @Test
    void decimalsAndBigIntegersAreWrittenExactly() {
        assertEquals("[\n  0.25,\n  -1.5E-7,\n  123456789012345678901234567890,\n  42,\n  2.5\n]\n",
                Json.write(List.of(new BigDecimal("0.25"), new BigDecimal("-1.5E-7"),
                        new BigInteger("123456789012345678901234567890"), 42L, 2.5)));
    }

    @Test
    void aWrittenDecimalReadsBackAsTheSameNumber() {
        BigDecimal v = new BigDecimal("3.14159265358979323846");
        assertEquals(0, v.compareTo(new BigDecimal(Json.write(v).strip())));
    }
}
