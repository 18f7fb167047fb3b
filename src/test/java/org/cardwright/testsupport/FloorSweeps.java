package org.cardwright.testsupport;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;

/**
 * The family of forward sweeps that the instrument-floor rule must sort correctly: invented junctions evaluated
 * with the built-in ngspice 39 equations ({@link DiodeSolver}, {@link TemperatureLaws}; GMIN included), over a
 * range of point densities, noise levels, sweep modes and meter floors, with seeded Gaussian noise. Nothing here
 * is a measurement or describes a real part.
 *
 * <p>A member's meter floor is either absent, an offset (the meter adds a constant current that wanders by
 * {@value #FLOOR_WANDER} of itself, one sigma: its own noise at the floor) or a resolution (readings rounded to a
 * quantum, with {@value #QUANTUM_WANDER} counts of reading noise, one sigma). Readings of zero or less current are
 * kept in {@link Sweep#rows()} but are not forward points; {@link Sweep#forward()} drops them as the reader does.
 */
public final class FloorSweeps {
    /** The meter's own scatter at its floor, relative to the floor current, one sigma [1]. */
    public static final double FLOOR_WANDER = 0.2;
    /** The meter's reading noise at its resolution, one sigma [counts]. */
    public static final double QUANTUM_WANDER = 0.3;
    /** The lowest voltage of every sweep [V]: a bench sweep starts just above 0 V. */
    public static final double LOW_VOLTAGE = 1e-3;

    /** Points per sweep in the family [1]. */
    public static final int[] DENSITIES = {20, 100, 1_000, 10_000, 100_000};

    /** An invented part: its card, the temperature of its sweep and the top current of the sweep. */
    public record Part(String name, DiodeParameters card, double celsius, double topCurrent) {
    }

    /** Noise of the bench, one sigma: on the voltage [V] and relative on the current [1]. */
    public record Noise(String name, double voltage, double relativeCurrent) {
    }

    /** How the meter limits small readings. */
    public enum FloorKind { NONE, OFFSET, QUANTUM }

    /** A meter floor: its kind and its current (the offset, or the quantum) [A]. */
    public record Floor(FloorKind kind, double current) {
        @Override
        public String toString() {
            return kind == FloorKind.NONE ? "no floor"
                    : String.format(Locale.ROOT, "%s %.0e A", kind.name().toLowerCase(Locale.ROOT), current);
        }
    }

    /** Voltage steps (the current read) or current steps (log-spaced, the voltage read). */
    public enum Mode { VOLTAGE_STEPS, CURRENT_STEPS }

    /** One member of the family. */
    public record Member(Part part, int points, Noise noise, Floor floor, Mode mode, long seed) {
        @Override
        public String toString() {
            return String.format(Locale.ROOT, "%s %d pts %s %s %s", part.name(), points, noise.name(), floor,
                    mode == Mode.VOLTAGE_STEPS ? "V-steps" : "I-steps");
        }
    }

    /**
     * One generated row.
     *
     * @param voltage     the voltage as read [V]
     * @param current     the current as read, after the meter's floor [A]
     * @param trueCurrent the junction's current at its true voltage, before noise and floor [A]
     * @param line        a 1-based row number, unique in the sweep
     */
    public record Row(double voltage, double current, double trueCurrent, int line) {
    }

    /** A generated sweep and its device temperature [K]. */
    public record Sweep(Member member, double kelvin, List<Row> rows) {
        /** The rows with positive current: what reaches the floor rule. */
        public List<Row> forward() {
            return rows.stream().filter(r -> r.current() > 0).toList();
        }
    }

    private FloorSweeps() {
    }

    /** The invented parts: a signal junction, a rectifier with recombination, a Schottky (high IS), an LED-like junction. */
    public static List<Part> parts() {
        return List.of(
                new Part("signal", card(Map.of(Param.IS, 1e-14, Param.N, 1.0, Param.RS, 0.8)), 25, 0.1),
                new Part("rectifier", card(Map.of(Param.IS, 1e-13, Param.N, 1.05, Param.RS, 0.05, Param.ISR, 1e-10,
                        Param.NR, 2.0)), 125, 1.0),
                new Part("schottky", card(Map.of(Param.IS, 1e-8, Param.N, 1.05, Param.RS, 0.3, Param.EG, 0.69,
                        Param.XTI, 2.0)), 25, 0.1),
                new Part("led-like", card(Map.of(Param.IS, 1e-20, Param.N, 2.0, Param.RS, 4.0, Param.EG, 2.0)), 25,
                        0.03));
    }

    /** No noise; a quiet bench (0.1 mV, 0.5 %); a noisy bench (1 mV, 3 %). */
    public static List<Noise> noises() {
        return List.of(new Noise("noise-free", 0, 0), new Noise("quiet", 1e-4, 5e-3), new Noise("noisy", 1e-3, 0.03));
    }

    /** No floor; offsets of 1 pA, 100 pA and 10 nA; resolutions of 1 pA and 10 nA. */
    public static List<Floor> floors() {
        return List.of(new Floor(FloorKind.NONE, 0), new Floor(FloorKind.OFFSET, 1e-12),
                new Floor(FloorKind.OFFSET, 1e-10), new Floor(FloorKind.OFFSET, 1e-8),
                new Floor(FloorKind.QUANTUM, 1e-12), new Floor(FloorKind.QUANTUM, 1e-8));
    }

    /** Every member: parts x densities x noises x floors x modes, each with its own seed. */
    public static List<Member> family() {
        List<Member> all = new ArrayList<>();
        long seed = 1;
        for (Part p : parts()) {
            for (int n : DENSITIES) {
                for (Noise noise : noises()) {
                    for (Floor f : floors()) {
                        for (Mode m : Mode.values()) {
                            all.add(new Member(p, n, noise, f, m, seed++));
                        }
                    }
                }
            }
        }
        return all;
    }

    /**
     * The noise-free truth of a part's sweep: voltage steps from {@link #LOW_VOLTAGE} to the voltage of the top
     * current, or current steps log-spaced between the currents at those two voltages. Each entry is {V, I}.
     */
    public static double[][] truth(Part part, int points, Mode mode) {
        DiodeAtTemperature d = at(part);
        double vTop = DiodeSolver.voltageAtCurrent(d, part.topCurrent());
        double iLow = DiodeSolver.currentAtVoltage(d, LOW_VOLTAGE);
        double[][] out = new double[points][];
        for (int k = 0; k < points; k++) {
            double u = k / (points - 1.0);
            if (mode == Mode.VOLTAGE_STEPS) {
                double v = LOW_VOLTAGE + u * (vTop - LOW_VOLTAGE);
                out[k] = new double[] {v, DiodeSolver.currentAtVoltage(d, v)};
            } else {
                double i = iLow * Math.pow(part.topCurrent() / iLow, u);
                out[k] = new double[] {DiodeSolver.voltageAtCurrent(d, i), i};
            }
        }
        return out;
    }

    /** The member's sweep from its noise-free truth (see {@link #truth}): noise, then the meter's floor. */
    public static Sweep sweep(Member m, double[][] truth) {
        Random random = new Random(m.seed());
        List<Row> rows = new ArrayList<>(truth.length);
        for (int k = 0; k < truth.length; k++) {
            double v = truth[k][0] + m.noise().voltage() * random.nextGaussian();
            double i = truth[k][1] * (1 + m.noise().relativeCurrent() * random.nextGaussian());
            double f = m.floor().current();
            double read = switch (m.floor().kind()) {
                case NONE -> i;
                case OFFSET -> i + f * (1 + FLOOR_WANDER * random.nextGaussian());
                case QUANTUM -> f * Math.rint(i / f + QUANTUM_WANDER * random.nextGaussian());
            };
            rows.add(new Row(v, read, truth[k][1], k + 1));
        }
        return new Sweep(m, kelvin(m.part()), rows);
    }

    /** The member's sweep, computing its truth. */
    public static Sweep sweep(Member m) {
        return sweep(m, truth(m.part(), m.points(), m.mode()));
    }

    /** The device temperature of a part's sweep [K]. */
    public static double kelvin(Part p) {
        return p.celsius() + Ngspice39.CELSIUS_TO_KELVIN;
    }

    private static DiodeAtTemperature at(Part p) {
        return TemperatureLaws.at(p.card(), kelvin(p), SimulatorOptions.NGSPICE_DEFAULTS);
    }

    private static DiodeParameters card(Map<Param, Double> values) {
        return DiodeParameters.of(new EnumMap<>(values));
    }
}
