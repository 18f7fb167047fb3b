package org.cardwright.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.junit.jupiter.api.Test;

/**
 * The Xyce dialect's conversions (shared/reference/diode-model.md section 8: BV(T) = BV (1 + TBV1 dT), NR
 * defaulting to 2). Xyce is not installed here, so the checks are the conversions and a byte-stable round trip.
 */
class XyceDialectTest {
    /** TBV1 is written to 7 significant digits (3.548387e-4): TCV = -TBV1 BV is good to about 1e-10 V/K [V/K]. */
    private static final double TCV_FROM_SEVEN_DIGITS = 1e-9;
    /** TCV = -TBV1 BV from exact decimal inputs: double rounding only, with room (about 1000 ulp of 5 mV/K) [V/K]. */
    private static final double TCV_ROUNDING = 1e-15;
    private static final DiodeParameters ZENER = DiodeParameters.of(Map.of(Param.IS, 3e-15, Param.N, 1.01,
            Param.ISR, 2e-11, Param.BV, 6.2, Param.IBV, 5e-4, Param.NBV, 3.0, Param.TCV, -2.2e-3, Param.TNOM, 300.15));

    @Test
    void breakdownTempcoIsWrittenAsTbv1RelativeToBvAndReadBack() {
        CardWriter.Rendered r = new CardWriter(Optional.empty()).render(new ModelCard("Z1", ZENER, List.of("test")),
                Dialect.XYCE, 7);
        assertTrue(r.text().contains("+ TBV1=0.0003548387"), r.text()); // 2.2e-3 / 6.2 = 3.548387e-4 per K
        assertFalse(r.text().contains("TCV"), "Xyce does not know TCV");
        assertTrue(r.text().contains("+ NR=1"), "NR stated, as Xyce's own default is 2");
        ParsedCard back = new CardReader().parse(r.text(), "z1.xyce.lib", Dialect.XYCE);
        assertEquals(-2.2e-3, back.parameters().get(Param.TCV), TCV_FROM_SEVEN_DIGITS, "to the seven digits of TBV1");
        assertEquals(1.0, back.parameters().get(Param.NR));
        String again = new CardWriter(Optional.empty()).render(back.toModelCard(), Dialect.XYCE, 7).text();
        assertEquals(r.text(), again, "re-read and re-rendered, byte for byte");
    }

    @Test
    void aHandWrittenXyceCardWithoutNrTakesXycesDefault() {
        ParsedCard c = new CardReader().parse(".MODEL DX D (IS=1f ISR=10p BV=5 TBV1=1m)\n", "dx.cir", Dialect.XYCE);
        assertEquals(2.0, c.parameters().get(Param.NR), "Xyce's NR default");
        assertEquals(-5e-3, c.parameters().get(Param.TCV), TCV_ROUNDING, "TCV = -TBV1 BV");
    }
}
