package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.JunctionCapacitance;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;
import org.junit.jupiter.api.Test;

/**
 * Issue 9, items 1, 2 and 5 together: the family of high-bandgap (LED-like) junctions with C-V data whose VJ is
 * 1.4 to 2.0 V (a wide-gap junction's built-in potential; common practice, no source), read by a chamber logger
 * that writes each row's own temperature (within 0.15 K of the set point). The recombination factor's VJ and M are
 * the depletion VJ and M, so the C-V data set them for the forward fit as well; every member has an exact fit.
 * Invented members, made by the built-in ngspice 39 equations (1e-8 relative to ngspice 39, model/DiodeSolverTest),
 * each row at its own logged temperature.
 */
class HighBandgapCapacitanceFamilyTest {
    private static final double[] FORWARD_CELSIUS = {-20, 25, 60, 85};
    private static final double[] CV_CELSIUS = {25, 85};
    private static final int MEMBERS = 4;
    /** The logger's wander around the set point (MakeCorpus.WANDER) [K]. */
    private static final double WANDER = 0.15;
    /** C-V test frequency [Hz]. */
    private static final double FREQUENCY = 1e6;
    /** LCR meter noise of the noisy variant: 0.1 % of the reading + 2 fF (as the corpus' LCR rows) [1], [F]. */
    private static final double CV_RELATIVE_NOISE = 1e-3;
    private static final double CV_ABSOLUTE_NOISE = 2e-15;
    /** Issue 9: C within 1 % (noisy); the noise-free variant ten times tighter [1]. */
    private static final double C_NOISY = 0.01;
    private static final double C_NOISE_FREE = 0.001;

    /** One invented member, drawn over the family and seeded. */
    static DiodeParameters member(long seed) {
        Random rnd = FamilyData.random(seed);
        DiodeParameters forward = HighBandgapFamilyTest.member(seed);
        double vj = FamilyData.uniform(rnd, 1.4, 2.0);
        double m = FamilyData.uniform(rnd, 0.3, 0.5);
        double cjo = FamilyData.logUniform(rnd, 5e-12, 1e-10);
        return forward.with(Param.VJ, vj).with(Param.M, m).with(Param.CJO, cjo);
    }

    private static double logged(double celsius, Random rnd) {
        return FamilyData.kelvin(celsius + WANDER * (2 * rnd.nextDouble() - 1));
    }

    static ExtractionData data(DiodeParameters truth, long seed, boolean noisy) {
        Random rows = FamilyData.random(seed * 31 + 1);
        Random noise = noisy ? FamilyData.random(seed * 31 + 2) : null;
        List<FitPoint> fwd = new ArrayList<>();
        int line = 1;
        for (double c : FORWARD_CELSIUS) {
            for (int k = 0; k <= 60; k++) {
                double i = 1e-9 * Math.pow(30e-3 / 1e-9, k / 60.0);
                double t = logged(c, rows);
                double v = DiodeSolver.voltageAtCurrent(TemperatureLaws.at(truth, t, SimulatorOptions.NGSPICE_DEFAULTS), i);
                if (noise != null) {
                    v += FamilyData.VOLTAGE_NOISE * noise.nextGaussian();
                }
                fwd.add(new FitPoint(i, v, t, 1e-3, "family", line++));
            }
        }
        List<CapacitancePoint> cv = new ArrayList<>();
        for (double c : CV_CELSIUS) {
            for (int k = 0; k <= 22; k++) {
                double v = 0.5 - 5.5 * k / 22.0;
                double t = logged(c, rows);
                DiodeAtTemperature d = TemperatureLaws.at(truth, t, SimulatorOptions.NGSPICE_DEFAULTS);
                double cap = JunctionCapacitance.terminalParallel(d, v, FREQUENCY);
                if (noise != null) {
                    cap += (CV_RELATIVE_NOISE * cap + CV_ABSOLUTE_NOISE) * noise.nextGaussian();
                }
                cv.add(new CapacitancePoint(v, cap, t, CapacitancePoint.defaultSigma(cap), "family-cv", line++));
            }
        }
        return new ExtractionData(fwd, List.of(), cv, List.of());
    }

    private static void check(boolean noisy) throws Exception {
        StringBuilder failures = new StringBuilder();
        for (int k = 0; k < MEMBERS; k++) {
            long seed = 9900 + k;
            DiodeParameters truth = member(seed);
            ExtractionData data = data(truth, seed, noisy);
            String result;
            double worstV;
            double worstC = 0;
            try {
                FitResult fit = new JunctionExtraction(FitSettings.defaults().withKind(DeviceKind.LED),
                        new CapacitanceOptions(0, FREQUENCY)).fit(data);
                worstV = FamilyData.worstForwardDeviation(truth, fit.parameters(), data.forward());
                for (CapacitancePoint p : data.capacitance()) {
                    double a = JunctionCapacitance.terminalParallel(
                            TemperatureLaws.at(truth, p.temperature(), SimulatorOptions.NGSPICE_DEFAULTS), p.voltage(), FREQUENCY);
                    double b = JunctionCapacitance.terminalParallel(
                            TemperatureLaws.at(fit.parameters(), p.temperature(), SimulatorOptions.NGSPICE_DEFAULTS), p.voltage(), FREQUENCY);
                    worstC = Math.max(worstC, Math.abs(b / a - 1));
                }
                result = fit.parameters().givenValues() + " " + fit.warnings();
            } catch (FitInputException | FitFailedException e) {
                worstV = Double.POSITIVE_INFINITY;
                worstC = Double.POSITIVE_INFINITY;
                result = "refused: " + e.getMessage();
            }
            System.out.printf(Locale.ROOT, "LED C-V member %d (%s): forward %.4f mV, C %.4f %%%n  truth %s%n  fit   %s%n",
                    k, noisy ? "noisy" : "noise-free", worstV * 1e3, worstC * 100, truth.givenValues(), result);
            double vLimit = noisy ? FamilyData.FORWARD_NOISY : FamilyData.FORWARD_NOISE_FREE;
            double cLimit = noisy ? C_NOISY : C_NOISE_FREE;
            if (!(worstV < vLimit) || !(worstC < cLimit)) {
                failures.append(String.format(Locale.ROOT, " member %d: %.4f mV, C %.4f %%;", k, worstV * 1e3, worstC * 100));
            }
        }
        assertEquals("", failures.toString());
    }

    @Test
    void noiseFreeMembersComeBackExact() throws Exception {
        check(false);
    }

    @Test
    void noisyMembersComeBackWithinTheTargets() throws Exception {
        check(true);
    }
}
