package org.cardwright.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The shortcuts the fit's residual blocks take through {@link DiodeSolver} give the same doubles as the plain solve,
 * to the bit: a measured current prepared once ({@link DiodeSolver.ForcedCurrent}) and the reverse solve's bracket
 * end found from the breakdown law's guess instead of by doubling from -1 mV. The cards the fit writes must not move
 * by a bit because of them, so the checks are exact equality of the bits (an internal invariant, as
 * JunctionPartialsTest checks the partials' current); the solve itself is checked against the equations it inverts in
 * {@link JunctionSolveTest} and against ngspice elsewhere. A seeded family: forward, reverse and breakdown currents,
 * with and without recombination, high injection, reverse knee and breakdown, -55 to 150 degC, every flavour.
 */
class PreparedSolveTest {
    private static final long SEED = 1212;
    private static final int JUNCTIONS = 400;
    private static final int CURRENTS = 40;

    /** Junctions drawn from the seeded family, with the flavour of each. */
    private static List<DiodeAtTemperature> family() {
        Random r = new Random(SEED);
        List<DiodeAtTemperature> out = new ArrayList<>();
        Flavour[] flavours = Flavour.values();
        while (out.size() < JUNCTIONS) {
            Map<Param, Double> v = new EnumMap<>(Param.class);
            double is = Math.pow(10, -17 + 10 * r.nextDouble());
            v.put(Param.IS, is);
            v.put(Param.N, 0.8 + 1.7 * r.nextDouble());
            v.put(Param.RS, 5 * r.nextDouble());
            if (r.nextBoolean()) {
                v.put(Param.ISR, is * Math.pow(10, 6 * r.nextDouble()));
                v.put(Param.NR, 1.5 + r.nextDouble());
                v.put(Param.VJ, 0.4 + 0.6 * r.nextDouble());
                v.put(Param.M, 0.2 + 0.7 * r.nextDouble());
            }
            if (r.nextBoolean()) {
                v.put(Param.IKF, Math.pow(10, -4 + 4 * r.nextDouble()));
            }
            if (r.nextInt(4) > 0) {
                v.put(Param.BV, 1 + 200 * r.nextDouble() * r.nextDouble());
                v.put(Param.IBV, Math.pow(10, -9 + 7 * r.nextDouble()));
                if (r.nextBoolean()) {
                    v.put(Param.NBV, 0.5 + 3 * r.nextDouble());
                }
                if (r.nextBoolean()) {
                    v.put(Param.IKR, Math.pow(10, -5 + 5 * r.nextDouble()));
                }
            }
            double kelvin = -55 + 205 * r.nextDouble() + Ngspice39.CELSIUS_TO_KELVIN;
            Flavour f = flavours[r.nextInt(flavours.length)];
            out.add(TemperatureLaws.at(DiodeParameters.of(v), kelvin,
                    new SimulatorOptions(Ngspice39.DEFAULT_GMIN, 1e-3, f)));
        }
        return out;
    }

    /** Currents for one junction: log-uniform of either sign, and the currents at junction voltages to 1.3 BV. */
    private static double[] currents(DiodeAtTemperature d, Random r) {
        double[] out = new double[CURRENTS];
        for (int j = 0; j < out.length; j++) {
            if (d.hasBreakdown() && j % 2 == 0) {
                out[j] = JunctionCurrent.current(d, -1.3 * d.breakdownVoltage() * r.nextDouble());
            } else {
                out[j] = (r.nextBoolean() ? 1 : -1) * Math.pow(10, -16 + 17 * r.nextDouble());
            }
        }
        return out;
    }

    @Test
    void aPreparedCurrentSolvesToTheSameBits() {
        Random r = new Random(SEED + 1);
        double[] scratch = new double[2];
        int compared = 0;
        for (DiodeAtTemperature d : family()) {
            for (double current : currents(d, r)) {
                if (!Double.isFinite(current)) {
                    continue;
                }
                DiodeSolver.ForcedCurrent prepared = new DiodeSolver.ForcedCurrent(current);
                same(DiodeSolver.junctionVoltageAtCurrent(d, current),
                        DiodeSolver.junctionVoltageAtCurrent(d, prepared, scratch), d, current);
                same(DiodeSolver.voltageAtCurrent(d, current), DiodeSolver.voltageAtCurrent(d, prepared, scratch), d,
                        current);
                compared++;
            }
        }
        assertTrue(compared > JUNCTIONS * CURRENTS * 9 / 10, "the family was generated: " + compared);
    }

    @Test
    void theGuessedReverseBracketEndIsTheScansEnd() {
        Random r = new Random(SEED + 2);
        double[] guessed = new double[2];
        double[] scanned = new double[2];
        int compared = 0;
        int beyondFirst = 0;
        for (DiodeAtTemperature d : family()) {
            for (double current : currents(d, r)) {
                if (!(current < 0) || !Double.isFinite(current)) {
                    continue;
                }
                int k = DiodeSolver.reverseDoublings(d, current, guessed);
                int expected = DiodeSolver.reverseDoublingsByScan(d, current, scanned);
                double at = current;
                assertEquals(expected, k, () -> d + " at " + at + " A");
                same(scanned[0], guessed[0], d, current);
                same(scanned[1], guessed[1], d, current);
                compared++;
                if (k > 3) {
                    beyondFirst++;
                }
            }
        }
        assertTrue(compared > 5000, "reverse currents compared: " + compared);
        assertTrue(beyondFirst > 1000, "breakdown currents, where the guess is taken, compared: " + beyondFirst);
    }

    private static void same(double expected, double actual, DiodeAtTemperature d, double current) {
        assertEquals(Double.doubleToLongBits(expected), Double.doubleToLongBits(actual),
                () -> d + " at " + current + " A: " + expected + " against " + actual);
    }
}
