package org.cardwright.fit;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.cardwright.model.ShuntedJunction;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;

/**
 * A seeded family of invented junctions, each with and without a resistor between its terminals, for the
 * shunt tests. The data are invented (no real part); they are made by the built-in ngspice 39 equations
 * ({@link ShuntedJunction}), optionally with seeded Gaussian noise.
 *
 * <p>The resistors span 10 kOhm to 10 MOhm; each part's forward sweep starts where its resistor carries most
 * of the current (the shunt is visible), and runs to a current where the series resistance shows, 12 points a
 * decade (the same currents at every temperature, set where the resistor shows at the first). Reverse leakage is
 * taken at forced voltages from -0.5 V to -10 V. A wandering part logs each row at its own temperature, within
 * {@value #WANDER} K of the set point, as a chamber logger does.
 */
final class ShuntedParts {
    /**
     * Forward voltage noise, 1 sigma: one count of a 4.5-digit meter on its 2 V range, the meter issue 9 names for
     * its corpus (common practice, no source; conservative against the 0.029 mV of half-count quantization) [V].
     */
    static final double FORWARD_NOISE = 0.1e-3;
    /** Reverse voltage noise, 1 sigma: one count of the same meter on its 20 V range [V]. */
    static final double REVERSE_NOISE = 1e-3;
    /** Relative current noise, 0.1 % (issue 2) [1]. */
    static final double CURRENT_NOISE = 1e-3;
    /** Forward points per decade of current, a source-measure unit's log sweep. */
    static final int PER_DECADE = 12;
    /** A chamber logger's reading wanders within this much of the set point, row by row [K]. */
    static final double WANDER = 0.15;

    /** One invented part. */
    record Part(String name, DiodeParameters junction, double shunt, double[] celsius, double lowCurrent,
                double highCurrent, boolean wanders) {
        boolean shunted() {
            return shunt > 0;
        }

        /** The part without its resistor, over the same currents. */
        Part withoutShunt() {
            return new Part(name + "-plain", junction, 0, celsius, lowCurrent, highCurrent, wanders);
        }

        /** The same part swept up to {@code current} [A]. */
        Part upTo(double current) {
            return new Part(name, junction, shunt, celsius, lowCurrent, current, wanders);
        }

        /** The same part with each row's logged temperature wandering about its set point. */
        Part wandering() {
            return new Part(name, junction, shunt, celsius, lowCurrent, highCurrent, true);
        }
    }

    private ShuntedParts() {
    }

    private static DiodeParameters params(Object... kv) {
        Map<Param, Double> m = new java.util.EnumMap<>(Param.class);
        for (int i = 0; i < kv.length; i += 2) {
            m.put((Param) kv[i], ((Number) kv[i + 1]).doubleValue());
        }
        return DiodeParameters.of(m);
    }

    /** The family: every junction with a resistor (10 kOhm .. 10 MOhm), with and without RS. */
    static List<Part> family() {
        List<Part> out = new ArrayList<>();
        // small signal junction with RS, 150 kOhm: the case of issue 9, item 7
        out.add(part("sig-150k", params(Param.IS, 2e-15, Param.N, 1.03, Param.RS, 0.9), 150e3, new double[] {27}));
        // the same junction without RS, 10 MOhm
        out.add(part("sig-10M", params(Param.IS, 2e-15, Param.N, 1.03), 10e6, new double[] {27}));
        // a leaky rectifier-like junction with recombination, 10 kOhm, two temperatures
        out.add(part("rect-10k", params(Param.IS, 4e-11, Param.N, 1.6, Param.RS, 0.08, Param.ISR, 2e-9,
                Param.NR, 2.2), 10e3, new double[] {27, 85}));
        // a large, cell-like junction without RS, 1 MOhm
        out.add(part("cell-1M", params(Param.IS, 3e-12, Param.N, 1.35), 1e6, new double[] {25}));
        // a small junction with recombination beside the resistor, two temperatures, the logger wandering
        out.add(part("sig-isr-150k", params(Param.IS, 1e-15, Param.N, 1.0, Param.RS, 1.2, Param.ISR, 5e-12,
                Param.NR, 2.0), 150e3, new double[] {25, 85}).wandering());
        // a leaky high-N power junction with high injection up to 150 degC: the same sweep at every temperature,
        // so the resistor dominates the lowest currents when cold and carries only a few per cent when hot
        // (swept to 1 A, where the high injection shows)
        out.add(part("power-2M", params(Param.IS, 1e-10, Param.N, 1.6, Param.RS, 0.05, Param.IKF, 1.5), 2e6,
                new double[] {25, 100, 150}).upTo(1.0));
        return out;
    }

    /** A part whose sweep starts where the resistor carries about 90 % of the current. */
    static Part part(String name, DiodeParameters junction, double shunt, double[] celsius) {
        SimulatorOptions o = SimulatorOptions.NGSPICE_DEFAULTS;
        DiodeAtTemperature d = TemperatureLaws.at(junction, celsius[0] + 273.15, o);
        // the voltage where the junction carries a ninth of what the resistor does
        double lo = 0;
        double hi = 2;
        for (int i = 0; i < 200; i++) {
            double v = 0.5 * (lo + hi);
            double junctionCurrent = org.cardwright.model.DiodeSolver.currentAtVoltage(d, v);
            if (junctionCurrent * 9 < v / shunt) {
                lo = v;
            } else {
                hi = v;
            }
        }
        double low = ShuntedJunction.currentAtVoltage(d, lo, 1 / shunt);
        return new Part(name, junction, shunt, celsius, low, 0.1, false);
    }

    /** Forward points of {@code part}, {@value #PER_DECADE} a decade, at each temperature. */
    static List<FitPoint> forward(Part part, long seed, boolean noisy) {
        Random rnd = new Random(seed);
        List<FitPoint> out = new ArrayList<>();
        int line = 1;
        for (double c : part.celsius()) {
            int steps = (int) Math.round(PER_DECADE * Math.log10(part.highCurrent() / part.lowCurrent()));
            for (int k = 0; k <= steps; k++) {
                double t = c + 273.15 + (part.wanders() ? WANDER * (2 * rnd.nextDouble() - 1) : 0);
                DiodeAtTemperature d = TemperatureLaws.at(part.junction(), t, SimulatorOptions.NGSPICE_DEFAULTS);
                double i = part.lowCurrent() * Math.pow(part.highCurrent() / part.lowCurrent(), k / (double) steps);
                double v = ShuntedJunction.voltageAtCurrent(d, i, part.shunted() ? 1 / part.shunt() : 0);
                if (noisy) {
                    v += rnd.nextGaussian() * FORWARD_NOISE;
                    i *= 1 + CURRENT_NOISE * rnd.nextGaussian();
                }
                out.add(new FitPoint(i, v, t, 1e-3, part.name() + ".csv", line++));
            }
        }
        return out;
    }

    /** Reverse leakage points of {@code part} at forced voltages, each temperature. */
    static List<ReversePoint> reverse(Part part, long seed, boolean noisy) {
        Random rnd = new Random(seed + 1);
        List<ReversePoint> out = new ArrayList<>();
        int line = 1000;
        for (double c : part.celsius()) {
            for (double v : new double[] {-0.5, -1, -2, -3, -5, -7, -10}) {
                double t = c + 273.15 + (part.wanders() ? WANDER * (2 * rnd.nextDouble() - 1) : 0);
                DiodeAtTemperature d = TemperatureLaws.at(part.junction(), t, SimulatorOptions.NGSPICE_DEFAULTS);
                double i = ShuntedJunction.currentAtVoltage(d, v, part.shunted() ? 1 / part.shunt() : 0);
                double vm = v;
                if (noisy) {
                    vm += rnd.nextGaussian() * REVERSE_NOISE;
                    i *= 1 + CURRENT_NOISE * rnd.nextGaussian();
                }
                out.add(new ReversePoint(vm, i, t, 1e-3 + 2e-4 * Math.abs(vm), part.name() + ".csv", line++));
            }
        }
        return out;
    }

    /** Forward and reverse data together. */
    static ExtractionData data(Part part, long seed, boolean noisy) {
        return new ExtractionData(forward(part, seed, noisy), reverse(part, seed, noisy), List.of(), List.of());
    }
}
