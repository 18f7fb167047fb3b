package org.cardwright.workflow;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.TreeSet;
import org.cardwright.fit.CapacitancePoint;
import org.cardwright.fit.ExtractionData;
import org.cardwright.fit.FitFailedException;
import org.cardwright.fit.FitPoint;
import org.cardwright.fit.RecoveryPoint;
import org.cardwright.fit.ReversePoint;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.JunctionCapacitance;
import org.cardwright.model.JunctionCurrent;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;

/**
 * The measured range of a part (its temperatures, its bias from the most negative voltage to the largest C-V
 * bias, its forward currents), and the check that a card evaluates everywhere in it: VJ(T) positive and every
 * temperature-updated parameter finite at each measured temperature, and the current, the capacitance and the
 * forward voltage finite at a grid of biases across the range. A card that fails is an error where it is made
 * (fit, build, tweak), never written: a simulator would print NaN for it, or refuse it.
 *
 * @param temperatures every measured temperature, ascending [K]
 * @param lowestVoltage the most negative measured voltage of any kind, or 0 [V]
 * @param highestCvVoltage the largest C-V bias; NaN without C-V data [V]
 * @param lowestForwardCurrent the smallest forward current; NaN without forward data [A]
 * @param highestForwardCurrent the largest forward current; NaN without forward data [A]
 */
public record CardRange(List<Double> temperatures, double lowestVoltage, double highestCvVoltage,
                        double lowestForwardCurrent, double highestForwardCurrent) {
    /** Biases and currents evaluated across each span of the range [1]. */
    static final int GRID = 25;

    public CardRange {
        temperatures = List.copyOf(temperatures);
    }

    /** The range the data cover. */
    public static CardRange of(ExtractionData data) {
        TreeSet<Double> t = new TreeSet<>();
        double low = 0;
        double cvHigh = Double.NaN;
        double iLow = Double.NaN;
        double iHigh = Double.NaN;
        for (FitPoint p : data.forward()) {
            t.add(p.temperature());
            iLow = Double.isNaN(iLow) ? p.current() : Math.min(iLow, p.current());
            iHigh = Double.isNaN(iHigh) ? p.current() : Math.max(iHigh, p.current());
        }
        for (ReversePoint p : data.reverse()) {
            t.add(p.temperature());
            low = Math.min(low, p.voltage());
        }
        for (CapacitancePoint p : data.capacitance()) {
            t.add(p.temperature());
            low = Math.min(low, p.voltage());
            cvHigh = Double.isNaN(cvHigh) ? p.voltage() : Math.max(cvHigh, p.voltage());
        }
        for (RecoveryPoint p : data.recovery()) {
            t.add(p.temperature());
        }
        return new CardRange(new ArrayList<>(t), low, cvHigh, iLow, iHigh);
    }

    /**
     * Checks that {@code p} evaluates everywhere in this range.
     *
     * @param what      the card in words, for the message, e.g. "the ngspice card of Z"
     * @param frequency the C-V test frequency [Hz]
     * @throws FitFailedException (exit 4) naming the parameter or quantity, the temperature and the bias
     */
    public void check(String what, DiodeParameters p, SimulatorOptions options, double frequency) {
        for (double kelvin : temperatures) {
            DiodeAtTemperature d;
            try {
                d = org.cardwright.model.TemperatureLaws.at(p, kelvin, options);
            } catch (IllegalArgumentException | ArithmeticException e) {
                throw fail(what, "the temperature update fails (" + e.getMessage() + ")", kelvin, Double.NaN, p);
            }
            if (!(d.junctionPotential() > 0) || !Double.isFinite(d.junctionPotential())) {
                throw fail(what, "VJ(T) = " + num(d.junctionPotential()) + " V", kelvin, Double.NaN, p);
            }
            for (Object[] q : new Object[][] {{"IS(T)", d.saturationCurrent()}, {"ISR(T)", d.recombinationCurrent()},
                    {"RS(T)", d.seriesResistance()}, {"CJ(T)", d.junctionCapacitance()}, {"TT(T)", d.transitTime()}}) {
                double v = (Double) q[1];
                if (!Double.isFinite(v) || v < 0) {
                    throw fail(what, q[0] + " = " + num(v), kelvin, Double.NaN, p);
                }
            }
            for (int k = 0; k <= GRID; k++) {
                double v = lowestVoltage * (1 - (double) k / GRID);
                double i = JunctionCurrent.current(d, v);
                if (!Double.isFinite(i)) {
                    throw fail(what, "the current = " + num(i) + " A", kelvin, v, p);
                }
                if (!Double.isNaN(highestCvVoltage)) {
                    double c = JunctionCapacitance.total(d, v);
                    if (!Double.isFinite(c)) {
                        throw fail(what, "the capacitance = " + num(c) + " F", kelvin, v, p);
                    }
                }
            }
            if (!Double.isNaN(highestCvVoltage) && highestCvVoltage > 0) {
                for (int k = 1; k <= GRID; k++) {
                    double v = highestCvVoltage * k / GRID;
                    double c = JunctionCapacitance.terminalParallel(d, v, frequency);
                    if (!Double.isFinite(c)) {
                        throw fail(what, "the capacitance = " + num(c) + " F", kelvin, v, p);
                    }
                }
            }
            if (!Double.isNaN(lowestForwardCurrent) && lowestForwardCurrent > 0) {
                double span = Math.log(highestForwardCurrent / lowestForwardCurrent);
                for (int k = 0; k <= GRID; k++) {
                    double i = lowestForwardCurrent * Math.exp(span * k / GRID);
                    double v = DiodeSolver.voltageAtCurrent(d, i);
                    if (!Double.isFinite(v)) {
                        throw fail(what, String.format(Locale.ROOT, "the forward voltage at %.4g A = %s V", i, num(v)),
                                kelvin, Double.NaN, p);
                    }
                }
            }
        }
    }

    private FitFailedException fail(String what, String problem, double kelvin, double volts, DiodeParameters p) {
        String hint = problem.startsWith("VJ(T)") || problem.startsWith("the capacitance")
                ? String.format(Locale.ROOT, "; VJ = %s V, M = %s at TNOM: VJ(T) falls by about 2 mV/K, so a VJ this "
                        + "low comes from C-V readings that still hold a fixture's stray capacitance (state it: "
                        + "'# stray capacitance = ...', docs/device-files.md) or from a rule that holds VJ",
                        num(p.get(Param.VJ)), num(p.get(Param.M)))
                : "";
        return new FitFailedException(String.format(Locale.ROOT,
                "%s gives %s at %s degC%s, inside the measured range (%s .. %s degC, %s .. %s V): no card is written%s",
                what, problem, org.cardwright.model.Celsius.twoDecimals(kelvin), Double.isNaN(volts) ? "" : ", " + num(volts) + " V",
                org.cardwright.model.Celsius.twoDecimals(temperatures.get(0)), org.cardwright.model.Celsius.twoDecimals(temperatures.get(temperatures.size() - 1)), num(lowestVoltage),
                num(Double.isNaN(highestCvVoltage) ? 0 : Math.max(0, highestCvVoltage)), hint));
    }

    private static String num(double x) {
        return String.format(Locale.ROOT, "%.4g", x);
    }
}
