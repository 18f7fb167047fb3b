package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.JunctionCapacitance;
import org.cardwright.model.JunctionCurrent;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;
import org.junit.jupiter.api.Test;

/**
 * Issue 9, item 4: the family of leaky junctions whose diffusion capacitance TT·g is a visible share of C at 0 V
 * and small reverse bias at the top temperature (g from the forward parameters, as ngspice computes it:
 * model/JunctionCapacitance). C-V data are taken in reverse bias and at 0 V only. C must come back within the
 * issue's 1 % and TT within 5 % (noise-free: ten times tighter).
 */
class DiffusionAtZeroBiasFamilyTest {
    private static final double[] CELSIUS = {25, 85, 125};
    private static final int MEMBERS = 5;
    /** Test frequency of the invented LCR meter [Hz]. */
    private static final double FREQUENCY = 1e6;
    /** Issue 9 acceptance: C within 1 % on noisy data [1]. */
    private static final double C_NOISY = 0.01;
    /** Issue 9 acceptance: TT within 5 % on noisy data [1]. */
    private static final double TT_NOISY = 0.05;
    /** Noise of the invented C-V readings: 0.3 % of the reading (1 sigma), as for the current [1]. */
    private static final double C_NOISE = 3e-3;

    /** One invented member, seeded: TT·g at 0 V and the top temperature is 3 to 15 % of C there. */
    static DiodeParameters member(long seed) {
        Random rnd = FamilyData.random(seed);
        double n = FamilyData.uniform(rnd, 1.5, 2.5);
        double rs = FamilyData.logUniform(rnd, 0.5, 5);
        double tTop = FamilyData.kelvin(CELSIUS[CELSIUS.length - 1]);
        double tnom = Ngspice39.REFERENCE_TEMPERATURE;
        double isTop = FamilyData.logUniform(rnd, 1e-8, 1e-6);
        double is = isTop / TemperatureLaws.saturationCurrentAt(1.0, n, 1.11, 3, tTop, tnom);
        double cjo = FamilyData.logUniform(rnd, 10e-12, 300e-12);
        double vj = FamilyData.uniform(rnd, 0.5, 0.9);
        double m = FamilyData.uniform(rnd, 0.3, 0.5);
        DiodeParameters dep = DiodeParameters.of(Map.of(Param.IS, is, Param.N, n, Param.RS, rs, Param.EG, 1.11,
                Param.XTI, 3.0, Param.CJO, cjo, Param.VJ, vj, Param.M, m));
        DiodeAtTemperature d = TemperatureLaws.at(dep, tTop, SimulatorOptions.NGSPICE_DEFAULTS);
        double share = FamilyData.uniform(rnd, 0.03, 0.15);
        double tt = share / (1 - share) * JunctionCapacitance.depletion(d, 0) / JunctionCurrent.reportedConductance(d, 0);
        return dep.with(Param.TT, tt);
    }

    static List<CapacitancePoint> capacitance(DiodeParameters truth, Random rnd) {
        List<CapacitancePoint> pts = new ArrayList<>();
        int line = 1;
        for (double c : CELSIUS) {
            DiodeAtTemperature d = TemperatureLaws.at(truth, FamilyData.kelvin(c), SimulatorOptions.NGSPICE_DEFAULTS);
            for (double v : new double[] {-10, -7, -5, -3, -2, -1.5, -1, -0.7, -0.5, -0.3, -0.2, -0.1, -0.05, 0}) {
                double cap = JunctionCapacitance.terminalParallel(d, v, FREQUENCY);
                if (rnd != null) {
                    cap *= 1 + C_NOISE * rnd.nextGaussian();
                }
                pts.add(new CapacitancePoint(v, cap, FamilyData.kelvin(c), CapacitancePoint.defaultSigma(cap), "family-cv", line++));
            }
        }
        return pts;
    }

    private static void check(boolean noisy, double forwardTolerance, double cTolerance, double ttTolerance) throws Exception {
        StringBuilder failures = new StringBuilder();
        for (int k = 0; k < MEMBERS; k++) {
            DiodeParameters truth = member(9400 + k);
            Random rnd = noisy ? FamilyData.random(94 + k) : null;
            List<FitPoint> fwd = FamilyData.forward(truth, CELSIUS, 1e-6, 0.1, 8, rnd);
            List<CapacitancePoint> cv = capacitance(truth, rnd);
            FitResult fit = new JunctionExtraction(FitSettings.defaults(), new CapacitanceOptions(0, FREQUENCY))
                    .fit(new ExtractionData(fwd, List.of(), cv, List.of()));
            double f = FamilyData.worstForwardDeviation(truth, fit.parameters(), fwd);
            double worstC = 0;
            for (CapacitancePoint p : cv) {
                DiodeAtTemperature a = TemperatureLaws.at(truth, p.temperature(), SimulatorOptions.NGSPICE_DEFAULTS);
                DiodeAtTemperature b = TemperatureLaws.at(fit.parameters(), p.temperature(), SimulatorOptions.NGSPICE_DEFAULTS);
                double ca = JunctionCapacitance.terminalParallel(a, p.voltage(), FREQUENCY);
                double cb = JunctionCapacitance.terminalParallel(b, p.voltage(), FREQUENCY);
                worstC = Math.max(worstC, Math.abs(cb / ca - 1));
            }
            double tt = fit.parameters().isGiven(Param.TT) ? fit.parameters().get(Param.TT) : 0;
            double ttError = Math.abs(tt / truth.get(Param.TT) - 1);
            System.out.printf(Locale.ROOT, "member %d %s: forward %.4f mV, C %.4f %%, TT %.3f %%%n  truth %s%n  fit   %s%n", k,
                    noisy ? "noisy" : "noise-free", f * 1e3, worstC * 100, ttError * 100, truth.givenValues(),
                    fit.parameters().givenValues());
            if (!(f < forwardTolerance) || !(worstC < cTolerance) || !(ttError < ttTolerance)) {
                failures.append(String.format(Locale.ROOT, " member %d: forward %.4f mV, C %.4f %%, TT %.3f %%;", k,
                        f * 1e3, worstC * 100, ttError * 100));
            }
        }
        assertTrue(failures.length() == 0, "deviation from the generating card:" + failures);
    }

    @Test
    void noiseFreeCapacitanceAndTransitTimeComeBack() throws Exception {
        check(false, FamilyData.FORWARD_NOISE_FREE, C_NOISY / 10, TT_NOISY / 10);
    }

    @Test
    void noisyCapacitanceAndTransitTimeComeBack() throws Exception {
        check(true, FamilyData.FORWARD_NOISY, C_NOISY, TT_NOISY);
    }

    /** Lets a probe run one variant from the command line. */
    static void run(boolean noisy) throws Exception {
        if (noisy) {
            check(true, FamilyData.FORWARD_NOISY, C_NOISY, TT_NOISY);
        } else {
            check(false, FamilyData.FORWARD_NOISE_FREE, C_NOISY / 10, TT_NOISY / 10);
        }
    }
}
