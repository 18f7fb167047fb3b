package org.cardwright.verify;

import static org.junit.jupiter.api.Assertions.assertEquals;

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

/** Verification counts the points that lie beyond three of their own stated uncertainties. */
class StatedUncertaintyVerifierTest {
    @Test
    void pointsFarOutsideTheirStatedUncertaintyAreCounted() throws Exception {
        DiodeParameters p = DiodeParameters.of(Map.of(Param.IS, 1e-14, Param.RS, 0.5));
        DiodeAtTemperature d = TemperatureLaws.at(p, 300.15, SimulatorOptions.NGSPICE_DEFAULTS);
        List<MeasuredPoint> pts = new ArrayList<>();
        for (int k = 0; k < 10; k++) {
            double i = 1e-6 * Math.pow(10, k / 3.0);
            double v = DiodeSolver.voltageAtCurrent(d, i);
            // stated 0.1 mV; two points are off by 0.5 mV (5 sigma), one by 0.2 mV (2 sigma), the rest exact
            double off = k == 2 || k == 7 ? 0.5e-3 : k == 4 ? 0.2e-3 : 0;
            pts.add(new MeasuredPoint(v + off, i, 300.15, "bench.csv", k + 2, 0.1e-3));
        }
        pts.add(new MeasuredPoint(0.7, 1e-3, 300.15, "plain.csv", 2)); // no stated uncertainty: not counted
        Verification v = new Verifier(new BuiltinEngine(SimulatorOptions.NGSPICE_DEFAULTS), Tolerance.DEFAULT)
                .verify(CardUnderTest.ngspice("x", p), pts, List.of());
        TemperatureVerdict t = v.perTemperature().get(0);
        assertEquals(10, t.stated());
        assertEquals(2, t.beyondThree());
    }
}
