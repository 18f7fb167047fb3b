package org.cardwright.model;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.EnumMap;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * {@link JunctionCurrent.Memo} gives the same doubles as the evaluation without it. The fit's Jacobian uses it for
 * its finite differences, and the cards the fit writes must not move by a bit because of it: the check is exact
 * equality of the bits (an internal invariant; the equations themselves are checked against ngspice elsewhere).
 */
class JunctionCurrentMemoTest {
    private static final Param[] MOVED = {Param.IS, Param.N, Param.ISR, Param.NR, Param.IKF, Param.VJ, Param.M,
        Param.EG, Param.XTI, Param.RS};

    @Test
    void theMemoGivesTheSameBitsAsAFreshEvaluation() {
        Map<Param, Double> v = new EnumMap<>(Param.class);
        v.put(Param.IS, 4e-15);
        v.put(Param.N, 1.03);
        v.put(Param.RS, 0.6);
        v.put(Param.ISR, 2e-11);
        v.put(Param.NR, 1.9);
        v.put(Param.IKF, 0.05);
        v.put(Param.VJ, 0.7);
        v.put(Param.M, 0.5);  // M/2 = 0.25 takes the square-root branch of the grading factor
        DiodeParameters base = DiodeParameters.of(v);
        int compared = 0;
        for (double m : new double[] {0.5, 0.37}) {
            DiodeParameters p = base.with(Param.M, m);
            for (double kelvin : new double[] {233.15, 300.15, 398.15}) {
                DiodeAtTemperature d = TemperatureLaws.at(p, kelvin, SimulatorOptions.NGSPICE_DEFAULTS);
                JunctionCurrent.Memo memo = new JunctionCurrent.Memo();
                for (double vd = -0.06; vd < 0.95; vd += 0.0371) {
                    // in the order of the fit's Jacobian: the unmoved set first, then each parameter up and down
                    same(JunctionCurrent.conductance(d, vd), JunctionCurrent.conductance(d, vd, memo), vd);
                    for (Param q : MOVED) {
                        for (double factor : new double[] {1 + 1e-6, 1 - 1e-6}) {
                            DiodeAtTemperature moved = TemperatureLaws.at(p.with(q, p.get(q) * factor), kelvin,
                                    SimulatorOptions.NGSPICE_DEFAULTS);
                            same(JunctionCurrent.current(moved, vd), JunctionCurrent.current(moved, vd, memo), vd);
                            same(JunctionCurrent.conductance(moved, vd), JunctionCurrent.conductance(moved, vd, memo), vd);
                            compared += 2;
                        }
                    }
                    same(JunctionCurrent.current(d, vd), JunctionCurrent.current(d, vd, memo), vd);
                }
            }
        }
        assertEquals(2 * 3 * 28 * MOVED.length * 4, compared, "every evaluation was compared");
    }

    private static void same(double expected, double actual, double vd) {
        assertEquals(Double.doubleToLongBits(expected), Double.doubleToLongBits(actual),
                () -> "at vd = " + vd + ": " + expected + " against " + actual);
    }
}
