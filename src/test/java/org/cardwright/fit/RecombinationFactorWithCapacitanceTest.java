package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.JunctionCapacitance;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;
import org.junit.jupiter.api.Test;

/**
 * Issue 9, item 5 with C-V data: VJ and M of the recombination factor are the depletion VJ and M, so with C-V data
 * they come from the joint fit of both kinds, and the forward stage says so.
 */
class RecombinationFactorWithCapacitanceTest {
    private static final double[] CELSIUS = {-40, 25, 85, 125};
    /** Noise-free: issue 9's 1 % for C, ten times tighter, applied to VJ and M, which set C [1]. */
    private static final double RELATIVE = 1e-3;

    @Test
    void vjAndMComeFromTheCapacitanceData() throws Exception {
        StringBuilder failures = new StringBuilder();
        for (int k = 0; k < 3; k++) {
            DiodeParameters truth = RecombinationFactorFamilyTest.member(9500 + k).with(Param.CJO, 2e-12);
            List<FitPoint> fwd = FamilyData.forward(truth, CELSIUS, 1e-10, 10e-3, 8, null);
            List<CapacitancePoint> cv = new ArrayList<>();
            int line = 1;
            for (double c : new double[] {25, 85}) {
                DiodeAtTemperature d = TemperatureLaws.at(truth, FamilyData.kelvin(c), SimulatorOptions.NGSPICE_DEFAULTS);
                for (double v : new double[] {-5, -3, -2, -1, -0.5, -0.2, 0, 0.2}) {
                    double cap = JunctionCapacitance.terminalParallel(d, v, 1e6);
                    cv.add(new CapacitancePoint(v, cap, FamilyData.kelvin(c), CapacitancePoint.defaultSigma(cap), "family-cv", line++));
                }
            }
            FitResult fit = new JunctionExtraction(FitSettings.defaults().withKind(DeviceKind.BASE_EMITTER),
                    new CapacitanceOptions(0, 1e6)).fit(new ExtractionData(fwd, List.of(), cv, List.of()));
            double worst = FamilyData.worstForwardDeviation(truth, fit.parameters(), fwd);
            TermDecision factor = fit.terms().stream().filter(t -> t.term().equals(ForwardExtraction.RECOMBINATION_FACTOR))
                    .findFirst().orElseThrow();
            System.out.printf(Locale.ROOT, "member %d with C-V: worst %.4f mV, VJ %.4f (%.4f), M %.4f (%.4f); %s%n", k,
                    worst * 1e3, fit.parameters().get(Param.VJ), truth.get(Param.VJ), fit.parameters().get(Param.M),
                    truth.get(Param.M), factor.reason());
            assertTrue(factor.reason().contains("C-V"), factor.reason());
            if (!(worst < FamilyData.FORWARD_NOISE_FREE)
                    || Math.abs(fit.parameters().get(Param.VJ) / truth.get(Param.VJ) - 1) > RELATIVE
                    || Math.abs(fit.parameters().get(Param.M) / truth.get(Param.M) - 1) > RELATIVE) {
                failures.append(String.format(Locale.ROOT, " member %d: %.4f mV, VJ %.4f, M %.4f;", k, worst * 1e3,
                        fit.parameters().get(Param.VJ), fit.parameters().get(Param.M)));
            }
        }
        assertEquals("", failures.toString());
    }
}
