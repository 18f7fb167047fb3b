package org.cardwright.fit;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.JunctionCapacitance;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;

/**
 * Seeded data of a family of invented junctions for the issue 9 family tests, made with the built-in ngspice 39
 * equations ({@link DiodeSolver}, {@link JunctionCapacitance}; these match ngspice 39 to about 1e-8 relative,
 * as model/DiodeSolverTest and the simulator round trips check). Noise, where asked for, is Gaussian with the
 * issue 9 figures, "0.1 mV or 0.3 % of current": forward points get 0.1 mV on the voltage read at a forced current
 * (0.3 % of current would be N·Vt·0.003, about 0.1 mV too, below the series-resistance region, but I·RS·0.003,
 * far more, above it); reverse points get both, since in breakdown 0.3 % of current moves the voltage by
 * NBV·Vt·0.003 only.
 */
final class FamilyData {
    /** Issue 9: voltage noise of the noisy variants (1 sigma) [V]. */
    static final double VOLTAGE_NOISE = 0.1e-3;
    /** Issue 9: current noise of the noisy variants (1 sigma, relative) [1]. */
    static final double CURRENT_NOISE = 3e-3;
    /** Issue 9 acceptance: forward within this of the generating card, noisy data [V]. */
    static final double FORWARD_NOISY = 0.3e-3;
    /** Issue 9 acceptance: noise-free variants are ten times tighter [V]. */
    static final double FORWARD_NOISE_FREE = 0.03e-3;

    private FamilyData() {
    }

    /**
     * A generator for member {@code seed} of a family. The seed is scrambled first: java.util.Random gives
     * nearly equal first draws for neighbouring seeds.
     */
    static Random random(long seed) {
        return new Random(new java.util.SplittableRandom(seed).nextLong());
    }

    static double kelvin(double celsius) {
        return celsius + Ngspice39.CELSIUS_TO_KELVIN;
    }

    /** Log-uniform value between {@code lo} and {@code hi}. */
    static double logUniform(Random rnd, double lo, double hi) {
        return Math.exp(Math.log(lo) + rnd.nextDouble() * Math.log(hi / lo));
    }

    static double uniform(Random rnd, double lo, double hi) {
        return lo + rnd.nextDouble() * (hi - lo);
    }

    /**
     * Forward points of {@code truth}, {@code perDecade} per decade from {@code low} to {@code high} at every
     * temperature, with the noise of issue 9 when {@code rnd} is not null. The stated sigma is the default 1 mV.
     */
    static List<FitPoint> forward(DiodeParameters truth, double[] celsius, double low, double high, int perDecade,
                                  Random rnd) {
        List<FitPoint> pts = new ArrayList<>();
        int steps = (int) Math.round(Math.log10(high / low) * perDecade);
        int line = 1;
        for (double c : celsius) {
            DiodeAtTemperature d = TemperatureLaws.at(truth, kelvin(c), SimulatorOptions.NGSPICE_DEFAULTS);
            for (int k = 0; k <= steps; k++) {
                double i = low * Math.pow(high / low, (double) k / steps);
                double v = DiodeSolver.voltageAtCurrent(d, i);
                if (rnd != null) {
                    v += VOLTAGE_NOISE * rnd.nextGaussian();
                }
                pts.add(new FitPoint(i, v, kelvin(c), 1e-3, "family", line++));
            }
        }
        return pts;
    }

    /**
     * Reverse points of {@code truth} at the given (negative) currents at every temperature, with the noise of issue
     * 9 when {@code rnd} is not null; the stated sigma is the reader's default for reverse points (1 mV + 0.02 %).
     */
    static List<ReversePoint> reverse(DiodeParameters truth, double[] celsius, double[] currents, Random rnd) {
        List<ReversePoint> pts = new ArrayList<>();
        int line = 1;
        for (double c : celsius) {
            DiodeAtTemperature d = TemperatureLaws.at(truth, kelvin(c), SimulatorOptions.NGSPICE_DEFAULTS);
            for (double i0 : currents) {
                double i = i0;
                double v = DiodeSolver.voltageAtCurrent(d, i);
                if (rnd != null) {
                    v += VOLTAGE_NOISE * rnd.nextGaussian();
                    i *= 1 + CURRENT_NOISE * rnd.nextGaussian();
                }
                pts.add(new ReversePoint(v, i, kelvin(c), 1e-3 + 2e-4 * Math.abs(v), "family-reverse", line++));
            }
        }
        return pts;
    }

    /** Worst relative difference of the terminal voltage of two cards at the currents of {@code points} [1]. */
    static double worstReverseDeviation(DiodeParameters truth, DiodeParameters fitted, List<ReversePoint> points) {
        double worst = 0;
        for (ReversePoint p : points) {
            DiodeAtTemperature a = TemperatureLaws.at(truth, p.temperature(), SimulatorOptions.NGSPICE_DEFAULTS);
            DiodeAtTemperature b = TemperatureLaws.at(fitted, p.temperature(), SimulatorOptions.NGSPICE_DEFAULTS);
            double va = DiodeSolver.voltageAtCurrent(a, p.current());
            double vb = DiodeSolver.voltageAtCurrent(b, p.current());
            worst = Math.max(worst, Math.abs(vb / va - 1));
        }
        return worst;
    }

    /**
     * Worst difference of the terminal voltage of two cards over the measured current range of each temperature of
     * {@code points}, 20 points per decade [V].
     */
    static double worstForwardDeviation(DiodeParameters truth, DiodeParameters fitted, List<FitPoint> points) {
        java.util.Map<Double, double[]> range = new java.util.TreeMap<>();
        for (FitPoint p : points) {
            range.merge(p.temperature(), new double[] {p.current(), p.current()},
                    (a, b) -> new double[] {Math.min(a[0], b[0]), Math.max(a[1], b[1])});
        }
        double worst = 0;
        for (java.util.Map.Entry<Double, double[]> e : range.entrySet()) {
            DiodeAtTemperature a = TemperatureLaws.at(truth, e.getKey(), SimulatorOptions.NGSPICE_DEFAULTS);
            DiodeAtTemperature b = TemperatureLaws.at(fitted, e.getKey(), SimulatorOptions.NGSPICE_DEFAULTS);
            double lo = e.getValue()[0];
            double hi = e.getValue()[1];
            int steps = Math.max(2, (int) Math.ceil(Math.log10(hi / lo) * 20));
            for (int k = 0; k <= steps; k++) {
                double i = lo * Math.pow(hi / lo, (double) k / steps);
                worst = Math.max(worst, Math.abs(DiodeSolver.voltageAtCurrent(a, i) - DiodeSolver.voltageAtCurrent(b, i)));
            }
        }
        return worst;
    }
}
