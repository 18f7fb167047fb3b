package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.JunctionCapacitance;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;
import org.junit.jupiter.api.Test;

/** The closed-form C-V start: inversion of the TLEVC 0 laws, and the scan-and-regress fit on exact data. */
class CapacitanceStartTest {
    /** The inversion is exact algebra on affine/proportional laws: rounding only [1]. */
    private static final double ROUNDING = 1e-12;
    /** Golden-section search stops far below this on exact data [V]. */
    private static final double POTENTIAL_TOLERANCE = 1e-7;

    @Test
    void toNominalInvertsTheTemperatureLaws() {
        double tnom = 273.15 + 40;
        DiodeParameters card = DiodeParameters.of(Map.of(Param.CJO, 22e-12, Param.VJ, 0.71, Param.M, 0.37,
                Param.TNOM, tnom));
        for (double t : new double[] {218.15, 300.15, 423.15}) {
            DiodeAtTemperature d = TemperatureLaws.at(card, t, SimulatorOptions.NGSPICE_DEFAULTS);
            double[] back = CapacitanceStart.toNominal(d.junctionCapacitance(), d.junctionPotential(), 0.37, t, tnom);
            assertEquals(22e-12, back[0], ROUNDING * 22e-12, "CJO from " + t + " K");
            assertEquals(0.71, back[1], ROUNDING, "VJ from " + t + " K");
        }
    }

    @Test
    void exactDepletionDataGiveTheirParametersBack() {
        DiodeParameters card = DiodeParameters.of(Map.of(Param.CJO, 3.3e-12, Param.VJ, 0.45, Param.M, 0.52));
        DiodeAtTemperature d = TemperatureLaws.at(card, 300.15, SimulatorOptions.NGSPICE_DEFAULTS);
        List<CapacitancePoint> pts = new ArrayList<>();
        for (double v : new double[] {-30, -10, -3, -1, -0.3, 0, 0.1}) {
            pts.add(CapacitancePoint.withDefaultSigma(v, JunctionCapacitance.total(d, v), 300.15, "exact", pts.size() + 1));
        }
        CapacitanceStart.Depletion s = CapacitanceStart.reverse(pts, 0);
        assertEquals(6, s.points(), "the forward point is left out of the start");
        assertEquals(0.45, s.junctionPotential(), POTENTIAL_TOLERANCE);
        assertEquals(0.52, s.gradingCoefficient(), POTENTIAL_TOLERANCE);
        assertEquals(3.3e-12, s.junctionCapacitance(), POTENTIAL_TOLERANCE * 3.3e-12);
    }

    @Test
    void twoReverseVoltagesAreNotEnough() {
        List<CapacitancePoint> pts = List.of(CapacitancePoint.withDefaultSigma(-1, 2e-12, 300, "f", 1),
                CapacitancePoint.withDefaultSigma(-2, 1.7e-12, 300, "f", 2),
                CapacitancePoint.withDefaultSigma(-2, 1.7e-12, 300, "f", 3));
        assertThrows(IllegalArgumentException.class, () -> CapacitanceStart.reverse(pts, 0));
    }
}
