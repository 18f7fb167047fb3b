package org.cardwright.model;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * The Xyce and gnucap flavours of the equations, against the statements of shared/reference/diode-model.md
 * sections 8 and 9 (read from those simulators' sources; Xyce itself is not installed here).
 */
class FlavourTest {
    /** The knee ratio is a closed form of the current; only double rounding separates it from sqrt(0.5) or 0.5 [1]. */
    private static final double KNEE_RATIO_TOLERANCE = 1e-9;
    /** Central difference with h = 0.1 uV: its truncation and rounding error stay below 1 ppm of the slope [1]. */
    private static final double DERIVATIVE_RELATIVE = 1e-6;
    /** 1e-18 S: an absolute floor for the difference quotient where the conductance itself is near zero [S]. */
    private static final double DERIVATIVE_FLOOR_S = 1e-18;
    /** Half a unit in the last printed digit of the reference's "2.8e-5 relative" [1]. */
    private static final double KQ_RATIO_TOLERANCE = 0.05e-5;
    /** Below one ulp of a 30 mV thermal voltage (3.5e-18 V): the same product k/q T must give the same double [V]. */
    private static final double VT_ROUNDING_V = 1e-18;
    /** A current of about 2e-11 A: double rounding only, with room (about 300 ulp) [A]. */
    private static final double CURRENT_ROUNDING_A = 1e-24;
    /**
     * 5 %: ngspice's CJO temperature law moves C at 125 degC far more than this (the check only needs "it moves") [1].
     */
    private static final double SCALING_SEEN = 0.05;
    private static final DiodeParameters KNEE = DiodeParameters.of(Map.of(Param.IS, 1e-14, Param.IKF, 1e-2));

    @Test
    void atTheKneeXyceKeepsSeventyOnePercentWhereNgspiceKeepsHalf() {
        // reference section 8: "at I = IKF Xyce gives 0.707·I where ngspice gives 0.5·I"
        for (Flavour f : new Flavour[] {Flavour.NGSPICE_39, Flavour.XYCE}) {
            DiodeAtTemperature d = TemperatureLaws.at(KNEE, 300.15, new SimulatorOptions(0, 1e-3, f));
            double vd = d.emissionCoefficient() * d.thermalVoltage() * Math.log(1e-2 / 1e-14 + 1);
            double ratio = JunctionCurrent.current(d, vd) / 1e-2;
            assertEquals(f == Flavour.XYCE ? Math.sqrt(0.5) : 0.5, ratio, KNEE_RATIO_TOLERANCE, f.label());
        }
    }

    @Test
    void xyceConductanceIsTheDerivativeOfItsCurrent() {
        DiodeParameters p = DiodeParameters.of(Map.of(Param.IS, 2e-14, Param.N, 1.05, Param.IKF, 5e-3,
                Param.ISR, 1e-11, Param.NR, 2.0, Param.VJ, 0.7, Param.M, 0.4));
        DiodeAtTemperature d = TemperatureLaws.at(p, 320, Flavour.XYCE.options());
        for (double vd = -0.05; vd < 0.95; vd += 0.05) {
            double h = 1e-7;
            double fd = (JunctionCurrent.current(d, vd + h) - JunctionCurrent.current(d, vd - h)) / (2 * h);
            assertEquals(fd, JunctionCurrent.conductance(d, vd), DERIVATIVE_RELATIVE * Math.abs(fd) + DERIVATIVE_FLOOR_S, "at " + vd);
        }
    }

    @Test
    void olderConstantsMoveTheThermalVoltageByTheirRatio() {
        // reference section 1: the older k/q is 2.8e-5 relative below ngspice 39's
        double ratio = Flavour.XYCE.kOverQ() / Flavour.NGSPICE_39.kOverQ();
        assertEquals(1 - 2.8e-5, ratio, KQ_RATIO_TOLERANCE);
        DiodeAtTemperature d = TemperatureLaws.at(KNEE, 350, Flavour.GNUCAP_2017.options());
        assertEquals(Flavour.GNUCAP_2017.kOverQ() * 350, d.thermalVoltage(), VT_ROUNDING_V);
    }

    @Test
    void gnucapSaturatesAtMinusIsInReverseWithoutBreakdown() {
        // reference section 9: "the reverse current saturates at exactly -Is"; gnucap's 1e-12 S from each node
        // to ground (found by running it) stands beside the junction as GMIN
        DiodeParameters p = DiodeParameters.of(Map.of(Param.IS, 1e-12, Param.BV, 5.0));
        DiodeAtTemperature d = TemperatureLaws.at(p, 300.15, Flavour.GNUCAP_2017.options());
        assertEquals(-1e-12 - 1e-12 * 20, JunctionCurrent.current(d, -20), CURRENT_ROUNDING_A, "no breakdown at -20 V");
    }

    @Test
    void gnucapKeepsJunctionCapacitanceAtItsNominalValue() {
        // reference section 9: gnucap has "no temperature scaling of CJO, PB or RS"; confirmed against gnucap in
        // GnucapCapacitanceTest (same C at 125 and -40 degC as at TNOM)
        DiodeParameters p = DiodeParameters.of(Map.of(Param.CJO, 20e-12, Param.VJ, 0.75, Param.M, 0.33));
        DiodeAtTemperature hot = TemperatureLaws.at(p, 398.15, Flavour.GNUCAP_2017.options());
        assertEquals(20e-12, hot.junctionCapacitance(), 0);
        assertEquals(0.75, hot.junctionPotential(), 0);
        DiodeAtTemperature ng = TemperatureLaws.at(p, 398.15, Flavour.NGSPICE_39.options());
        assertEquals(true, Math.abs(ng.junctionCapacitance() / 20e-12 - 1) > SCALING_SEEN, "ngspice does scale it");
    }
}
