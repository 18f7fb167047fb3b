package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
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
import org.junit.jupiter.api.Test;

/** Edges that real data reach: a parameter at its bound, and a gap between leakage and breakdown. */
class FitEdgeCasesTest {
    /** RS of a diode without one, from noise-free data: at (or next to) zero, 1 uohm [ohm]. */
    private static final double ZERO_RS_OHM = 1e-6;
    /** IS from noise-free data within 0.1 % of its 1e-14 A: the fit's convergence [A]. */
    private static final double NOISE_FREE_IS_A = 1e-17;
    /** IKF within 5 % from data with 0.2 mV and 0.1 % noise (a judgement of the estimate's spread, no source) [1]. */
    private static final double NOISY_IKF_RELATIVE = 0.05;

    @Test
    void aPartWithoutSeriesResistanceFitsWithRsAtItsBound() throws Exception {
        DiodeParameters truth = DiodeParameters.of(Map.of(Param.IS, 1e-14, Param.N, 1.0));
        DiodeAtTemperature d = TemperatureLaws.at(truth, 300.15, SimulatorOptions.NGSPICE_DEFAULTS);
        List<FitPoint> pts = new ArrayList<>();
        for (int k = 0; k <= 48; k++) {
            double i = 1e-9 * Math.pow(10, k / 8.0);
            pts.add(new FitPoint(i, DiodeSolver.voltageAtCurrent(d, i), 300.15, 1e-3, "synthetic", k + 1));
        }
        FitResult r = new JunctionExtraction(FitSettings.defaults(), CapacitanceOptions.DEFAULT).fit(ExtractionData.forwardOnly(pts));
        assertEquals(0.0, r.parameters().get(Param.RS), ZERO_RS_OHM, "RS at (or next to) zero");
        assertEquals(1e-14, r.parameters().get(Param.IS), NOISE_FREE_IS_A);
    }

    @Test
    void theLastLeakagePointBeforeAGapIsNotTakenForBreakdown() {
        List<ReversePoint> rev = new ArrayList<>();
        double[][] rows = {{-1, -1.1e-12}, {-2, -2.1e-12}, {-3, -3.2e-12},
            {-6.20, -1e-5}, {-6.25, -1e-4}, {-6.30, -1e-3}, {-6.36, -1e-2}};
        for (int i = 0; i < rows.length; i++) {
            rev.add(new ReversePoint(rows[i][0], rows[i][1], 298.15, 1e-3, "zener.csv", i + 2));
        }
        ReverseAnalysis.Split s = ReverseAnalysis.split(rev);
        assertEquals(4, s.breakdown().size(), "the four points from -6.2 V");
        assertEquals(3, s.leakage().size(), "-1, -2 and -3 V");
        assertTrue(s.leakage().stream().anyMatch(p -> p.voltage() == -3));
    }

    @Test
    void aTermTakenEarlyIsDroppedWhenTheRightOnesExplainTheData() throws Exception {
        // a base-emitter junction with a strong knee and no self-heating: taken greedily, RTH0 first stands in for
        // part of the knee; once IKF is in, the backward check must take it out again
        DiodeParameters truth = DiodeParameters.of(Map.of(Param.IS, 3e-16, Param.N, 1.0, Param.RS, 12.0,
                Param.ISR, 5e-13, Param.NR, 1.8, Param.IKF, 3e-3));
        java.util.Random r = new java.util.Random(3);
        List<FitPoint> pts = new ArrayList<>();
        for (double c : new double[] {0, 50, 100}) {
            DiodeAtTemperature d = TemperatureLaws.at(truth, c + 273.15, SimulatorOptions.NGSPICE_DEFAULTS);
            for (int k = 0; k <= 64; k++) {
                double i = 1e-9 * Math.pow(10, k / 8.0);
                double v = DiodeSolver.voltageAtCurrent(d, i) + 2e-4 * r.nextGaussian();
                pts.add(new FitPoint(i * (1 + 1e-3 * r.nextGaussian()), v, c + 273.15, 1e-3, "be.csv", pts.size() + 2));
            }
        }
        FitResult fit = new JunctionExtraction(FitSettings.defaults().withKind(DeviceKind.BASE_EMITTER), CapacitanceOptions.DEFAULT)
                .fit(ExtractionData.forwardOnly(pts));
        assertTrue(!fit.parameters().isGiven(Param.RTH0), "no self-heating on the card: " + fit.terms());
        assertTrue(fit.parameters().isGiven(Param.IKF) && fit.parameters().isGiven(Param.ISR), fit.terms().toString());
        assertEquals(3e-3, fit.parameters().get(Param.IKF), NOISY_IKF_RELATIVE * 3e-3);
    }
}
