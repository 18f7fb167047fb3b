package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.Param;
import org.cardwright.model.TemperatureLaws;
import org.junit.jupiter.api.Test;

/**
 * Issue 9, item 3: the family of leaky high-N junctions in breakdown, whose IS(T) at the top temperature reaches
 * IBV·Vt/BV, where ngspice's knee iteration stops adjusting BV (diode-model.md section 3). There BV and IBV no
 * longer trade off across temperatures, and a fit that holds IBV "where the data lie" leaves breakdown residuals
 * of a large share of a volt and a TCV that only absorbs the mismatch. The breakdown voltage at every measured
 * current and temperature must come back within the 0.05 % (noise-free: 0.005 %).
 */
class LeakyBreakdownFamilyTest {
    private static final double[] CELSIUS = {25, 75, 125, 150};
    private static final int MEMBERS = 6;
    /** Issue 9 acceptance: BV(T) within 0.05 % on noisy data [1]. */
    private static final double BREAKDOWN_NOISY = 5e-4;
    /** Issue 9 acceptance: noise-free variants ten times tighter [1]. */
    private static final double BREAKDOWN_NOISE_FREE = 5e-5;
    /** Breakdown currents: 1 uA to 10 mA, 4 per decade [A]. */
    private static final double[] REVERSE_CURRENTS = new double[17];

    static {
        for (int k = 0; k < REVERSE_CURRENTS.length; k++) {
            REVERSE_CURRENTS[k] = -1e-6 * Math.pow(10, k / 4.0);
        }
    }

    /** One invented member, seeded. */
    static DiodeParameters member(long seed) {
        Random rnd = FamilyData.random(seed);
        double n = FamilyData.uniform(rnd, 1.5, 2.5);
        double bv = FamilyData.logUniform(rnd, 20, 200);
        double nbv = FamilyData.uniform(rnd, 1, 4);
        double ibv = FamilyData.logUniform(rnd, 1e-6, 1e-4);
        // BV(T) = BV - TCV (T - TNOM): an avalanche BV rising by 0.02 to 0.1 %/K (common practice, no source)
        double tcv = -bv * FamilyData.uniform(rnd, 2e-4, 1e-3);
        double rs = FamilyData.logUniform(rnd, 0.5, 5);
        double eg = 1.11;
        double xti = 3;
        // IS(T) at the top temperature between 0.3 and 3 times IBV Vt/BV(T): the knee iteration stops there
        double tTop = FamilyData.kelvin(CELSIUS[CELSIUS.length - 1]);
        double tnom = Ngspice39.REFERENCE_TEMPERATURE;
        double bvTop = bv - tcv * (tTop - tnom);
        double isTop = FamilyData.logUniform(rnd, 0.3, 3) * ibv * Ngspice39.thermalVoltage(tTop) / bvTop;
        double is = isTop / TemperatureLaws.saturationCurrentAt(1.0, n, eg, xti, tTop, tnom);
        return DiodeParameters.of(Map.of(Param.IS, is, Param.N, n, Param.RS, rs, Param.EG, eg, Param.XTI, xti,
                Param.BV, bv, Param.IBV, ibv, Param.NBV, nbv, Param.TCV, tcv));
    }

    private static void check(boolean noisy, double forwardTolerance, double breakdownTolerance) throws Exception {
        StringBuilder failures = new StringBuilder();
        for (int m = 0; m < MEMBERS; m++) {
            DiodeParameters truth = member(9300 + m);
            Random rnd = noisy ? FamilyData.random(93 + m) : null;
            List<FitPoint> fwd = FamilyData.forward(truth, CELSIUS, 1e-6, 0.1, 8, rnd);
            List<ReversePoint> rev = FamilyData.reverse(truth, CELSIUS, REVERSE_CURRENTS, rnd);
            FitResult fit = new JunctionExtraction(FitSettings.defaults(), new CapacitanceOptions(0, 1e6))
                    .fit(new ExtractionData(fwd, rev, List.of(), List.of()));
            double f = FamilyData.worstForwardDeviation(truth, fit.parameters(), fwd);
            double b = FamilyData.worstReverseDeviation(truth, fit.parameters(), rev);
            System.out.printf(Locale.ROOT, "member %d %s: forward %.4f mV, breakdown %.5f %%%n  truth %s%n  fit   %s%n  %s%n",
                    m, noisy ? "noisy" : "noise-free", f * 1e3, b * 100, truth.givenValues(),
                    fit.parameters().givenValues(), fit.terms());
            if (!(f < forwardTolerance) || !(b < breakdownTolerance)) {
                failures.append(String.format(Locale.ROOT, " member %d: forward %.4f mV, breakdown %.5f %%;", m, f * 1e3, b * 100));
            }
        }
        assertTrue(failures.length() == 0, "deviation from the generating card:" + failures);
    }

    @Test
    void noiseFreeBreakdownComesBackAtEveryTemperature() throws Exception {
        check(false, FamilyData.FORWARD_NOISE_FREE, BREAKDOWN_NOISE_FREE);
    }

    @Test
    void noisyBreakdownComesBackAtEveryTemperature() throws Exception {
        check(true, FamilyData.FORWARD_NOISY, BREAKDOWN_NOISY);
    }
}
