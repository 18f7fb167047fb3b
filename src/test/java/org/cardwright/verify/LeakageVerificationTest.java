package org.cardwright.verify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;
import org.cardwright.sim.BuiltinEngine;
import org.cardwright.sim.CardUnderTest;
import org.junit.jupiter.api.Test;

/** Leakage below breakdown is held to its own limits, in decades of current. */
class LeakageVerificationTest {
    private static final DiodeParameters CARD = DiodeParameters.of(Map.of(Param.IS, 1e-12, Param.RS, 1.0));
    /** Decades of a ratio computed from the same engine's currents: log10 rounding only [decades]. */
    private static final double DECADE_ROUNDING = 1e-9;

    private static List<MeasuredPoint> points(double factor) {
        DiodeAtTemperature d = TemperatureLaws.at(CARD, 300.15, SimulatorOptions.NGSPICE_DEFAULTS);
        List<MeasuredPoint> out = new ArrayList<>();
        for (double v : new double[] {-1, -2, -5, -10}) {
            out.add(new MeasuredPoint(v, factor * DiodeSolver.currentAtVoltage(d, v), 300.15, "leak.csv", out.size() + 2));
        }
        return out;
    }

    @Test
    void theCardsOwnLeakagePassesAndAHundredfoldExcessFails() throws Exception {
        BuiltinEngine engine = new BuiltinEngine(SimulatorOptions.NGSPICE_DEFAULTS);
        CardUnderTest card = CardUnderTest.ngspice("x", CARD);
        LeakageVerification same = LeakageVerification.of(engine, card, points(1.0));
        assertTrue(same.pass());
        assertEquals(0.0, same.perTemperature().get(0).maxDecades(), DECADE_ROUNDING);
        LeakageVerification excess = LeakageVerification.of(engine, card, points(100.0));
        assertFalse(excess.pass());
        assertEquals(2.0, excess.perTemperature().get(0).rmsDecades(), DECADE_ROUNDING, "a factor of 100 is two decades");
        assertTrue(excess.notes().get(0).contains("surface or shunt leakage"));
    }
}
