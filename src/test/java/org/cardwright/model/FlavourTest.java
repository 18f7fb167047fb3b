package org.cardwright.model;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * The Xyce and gnucap flavours of the equations, against the statements of shared/reference/diode-model.md
 * sections 8 and 9 (read from those simulators' sources; Xyce itself is not installed here).
 */
class FlavourTest {
    private static final DiodeParameters KNEE = DiodeParameters.of(Map.of(Param.IS, 1e-14, Param.IKF, 1e-2));

    @Test
    void atTheKneeXyceKeepsSeventyOnePercentWhereNgspiceKeepsHalf() {
        // reference section 8: "at I = IKF Xyce gives 0.707·I where ngspice gives 0.5·I"
        for (Flavour f : new Flavour[] {Flavour.NGSPICE_39, Flavour.XYCE}) {
            DiodeAtTemperature d = TemperatureLaws.at(KNEE, 300.15, new SimulatorOptions(0, 1e-3, f));
            double vd = d.emissionCoefficient() * d.thermalVoltage() * Math.log(1e-2 / 1e-14 + 1);
            double ratio = JunctionCurrent.current(d, vd) / 1e-2;
            assertEquals(f == Flavour.XYCE ? Math.sqrt(0.5) : 0.5, ratio, 1e-9, f.label());
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
            assertEquals(fd, JunctionCurrent.conductance(d, vd), 1e-6 * Math.abs(fd) + 1e-18, "at " + vd);
        }
    }

    @Test
    void olderConstantsMoveTheThermalVoltageByTheirRatio() {
        // reference section 1: the older k/q is 2.8e-5 relative below ngspice 39's
        double ratio = Flavour.XYCE.kOverQ() / Flavour.NGSPICE_39.kOverQ();
        assertEquals(1 - 2.8e-5, ratio, 0.05e-5);
        DiodeAtTemperature d = TemperatureLaws.at(KNEE, 350, Flavour.GNUCAP_2017.options());
        assertEquals(Flavour.GNUCAP_2017.kOverQ() * 350, d.thermalVoltage(), 1e-18);
    }

    @Test
    void gnucapSaturatesAtMinusIsInReverseWithoutBreakdown() {
        // reference section 9: "the reverse current saturates at exactly -Is"; gnucap's 1e-12 S from each node
        // to ground (found by running it) stands beside the junction as GMIN
        DiodeParameters p = DiodeParameters.of(Map.of(Param.IS, 1e-12, Param.BV, 5.0));
        DiodeAtTemperature d = TemperatureLaws.at(p, 300.15, Flavour.GNUCAP_2017.options());
        assertEquals(-1e-12 - 1e-12 * 20, JunctionCurrent.current(d, -20), 1e-24, "no breakdown at -20 V");
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
        assertEquals(true, Math.abs(ng.junctionCapacitance() / 20e-12 - 1) > 0.05, "ngspice does scale it");
    }
}
