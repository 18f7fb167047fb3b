package org.cardwright.fit;

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

/** The robust loss: a few bad readings are named and barely move the card. */
class RobustExtractionTest {
    /** Issue 2's noisy-data goal, reused: within 0.3 mV of the true curve. */
    private static final double CURVE_TOLERANCE = 0.3e-3;

    @Test
    void badReadingsAreListedAndDoNotBendTheCard() throws Exception {
        DiodeParameters truth = DiodeParameters.of(Map.of(Param.IS, 3e-15, Param.N, 1.03, Param.RS, 0.6,
                Param.ISR, 4e-12, Param.NR, 2.0, Param.EG, 1.12, Param.XTI, 3.0));
        List<FitPoint> clean = ForwardRoundTripTest.simulate(truth, new double[] {-40, 27, 125}, 99, true);
        List<FitPoint> pts = new ArrayList<>();
        for (FitPoint p : clean) {
            // three readings mistyped by 15 to 40 mV (invented faults)
            double v = p.voltage() + (p.line() == 30 ? 0.015 : p.line() == 100 ? -0.04 : p.line() == 170 ? 0.025 : 0);
            pts.add(new FitPoint(p.current(), v, p.temperature(), p.sigma(), "bench.csv", p.line()));
        }
        FitResult plain = new JunctionExtraction(FitSettings.defaults(), CapacitanceOptions.DEFAULT)
                .fit(ExtractionData.forwardOnly(pts));
        FitResult robust = new RobustExtraction(FitSettings.defaults(), CapacitanceOptions.DEFAULT)
                .fit(ExtractionData.forwardOnly(pts));
        String note = robust.warnings().get(0);
        System.out.println(note);
        assertTrue(note.contains("bench.csv:30") && note.contains("bench.csv:100") && note.contains("bench.csv:170"), note);
        double worstPlain = deviation(truth, plain.parameters());
        double worstRobust = deviation(truth, robust.parameters());
        System.out.printf("worst deviation from the true curve: plain %.3f mV, robust %.3f mV%n", worstPlain * 1e3, worstRobust * 1e3);
        assertTrue(worstRobust < CURVE_TOLERANCE, "robust " + worstRobust);
        assertTrue(worstRobust < worstPlain, "the robust card is closer than the plain one");
    }

    private static double deviation(DiodeParameters a, DiodeParameters b) {
        double worst = 0;
        for (double c : new double[] {-40, 27, 125}) {
            DiodeAtTemperature x = TemperatureLaws.at(a, c + 273.15, SimulatorOptions.NGSPICE_DEFAULTS);
            DiodeAtTemperature y = TemperatureLaws.at(b, c + 273.15, SimulatorOptions.NGSPICE_DEFAULTS);
            for (int k = 0; k <= 160; k++) {
                double i = 1e-9 * Math.pow(10, k / 20.0);
                worst = Math.max(worst, Math.abs(DiodeSolver.voltageAtCurrent(x, i) - DiodeSolver.voltageAtCurrent(y, i)));
            }
        }
        return worst;
    }
}
