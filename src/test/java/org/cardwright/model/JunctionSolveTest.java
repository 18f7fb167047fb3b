package org.cardwright.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * The junction solvers ({@link DiodeSolver}, {@link ShuntedJunction}) against the ngspice 39 equations they invert,
 * over a generated family of junctions: pick a junction voltage, compute the current the ngspice 39 equations give
 * there ({@link JunctionCurrent}: Shockley, recombination with its grading factor, high injection, the cubic reverse
 * region, GMIN), and ask the solver for the voltage back. The solver converges to 1e-14 V; a step that rounded to
 * nothing at the root once sent it into a bisection of the whole bracket, which ended within the tolerance as well,
 * so these checks hold the answer, and the benchmark (verify/bench) shows the cost.
 */
class JunctionSolveTest {
    /**
     * Twice the solvers' convergence tolerance on the junction voltage (1e-14 V, the Newton step at which they stop;
     * the error after a converged Newton step is far smaller) [V].
     */
    private static final double SOLVE_TOLERANCE_V = 2e-14;
    /**
     * The voltage a rounding of the computed current itself moves the root by, in units of one ulp of that current
     * over the conductance: the test's own input is only that exact [1].
     */
    private static final double CURRENT_ROUNDING_ULPS = 8;

    /** A family of junctions: saturation currents over 9 decades, ideality 0.9-2, each optional term on and off. */
    private static List<DiodeAtTemperature> family() {
        List<DiodeAtTemperature> out = new ArrayList<>();
        double[] isValues = {1e-16, 3e-14, 1e-11, 1e-7};
        double[] nValues = {0.9, 1.05, 1.6, 2.0};
        double[] kelvins = {233.15, 300.15, 398.15};
        for (double is : isValues) {
            for (double n : nValues) {
                for (int terms = 0; terms < 4; terms++) {
                    for (double t : kelvins) {
                        Map<Param, Double> v = new EnumMap<>(Param.class);
                        v.put(Param.IS, is);
                        v.put(Param.N, n);
                        v.put(Param.RS, 0.7);
                        if ((terms & 1) != 0) {
                            v.put(Param.ISR, is * 1e3);
                            v.put(Param.NR, 2.1);
                            v.put(Param.VJ, 0.72);
                            v.put(Param.M, 0.42);
                        }
                        if ((terms & 2) != 0) {
                            v.put(Param.IKF, 0.03);
                        }
                        out.add(TemperatureLaws.at(DiodeParameters.of(v), t, SimulatorOptions.NGSPICE_DEFAULTS));
                    }
                }
            }
        }
        return out;
    }

    private static double allowed(DiodeAtTemperature d, double vd, double current) {
        return SOLVE_TOLERANCE_V + CURRENT_ROUNDING_ULPS * Math.ulp(current) / JunctionCurrent.conductance(d, vd);
    }

    @Test
    void forwardCurrentsGiveTheirJunctionVoltageBack() {
        int checked = 0;
        for (DiodeAtTemperature d : family()) {
            for (double vd0 = 0.02; vd0 <= 1.2; vd0 += 0.0137) {
                double current = JunctionCurrent.current(d, vd0);
                if (current > 10) {
                    break;  // beyond any bench current
                }
                double vd = DiodeSolver.junctionVoltageAtCurrent(d, current);
                assertEquals(vd0, vd, allowed(d, vd0, current), () -> d + " at " + current + " A");
                checked++;
            }
        }
        assertTrue(checked > 5000, "the family was generated: " + checked);
    }

    /**
     * Reverse and shunted checks skip the recombination term: ngspice 39 drops it below -3 N Vt (its cubic reverse
     * region carries IS alone), so the reverse current is not monotone across that edge and a current there can have
     * two junction voltages (docs/model.md, "DC current").
     */
    private static boolean monotoneInReverse(DiodeAtTemperature d) {
        return !d.hasRecombination();
    }

    @Test
    void reverseCurrentsGiveTheirJunctionVoltageBack() {
        for (DiodeAtTemperature d : family()) {
            if (!monotoneInReverse(d)) {
                continue;
            }
            for (double vd0 = -0.004; vd0 >= -40; vd0 *= 1.9) {
                double current = JunctionCurrent.current(d, vd0);
                double vd = DiodeSolver.junctionVoltageAtCurrent(d, current);
                assertEquals(vd0, vd, allowed(d, vd0, current), () -> d + " at " + current + " A");
            }
        }
    }

    /** Breakdown junctions (BV, with and without the reverse knee IKR) from -55 to 150 degC. */
    private static List<DiodeAtTemperature> breakdownFamily() {
        List<DiodeAtTemperature> out = new ArrayList<>();
        for (double bv : new double[] {5.6, 40}) {
            for (boolean knee : new boolean[] {false, true}) {
                for (double celsius : new double[] {-55, 27, 150}) {
                    Map<Param, Double> v = new EnumMap<>(Param.class);
                    v.put(Param.IS, 1e-12);
                    v.put(Param.RS, 0.5);
                    v.put(Param.BV, bv);
                    v.put(Param.IBV, 1e-5);
                    if (knee) {
                        v.put(Param.IKR, 2e-3);
                    }
                    out.add(TemperatureLaws.at(DiodeParameters.of(v), celsius + Ngspice39.CELSIUS_TO_KELVIN,
                            SimulatorOptions.NGSPICE_DEFAULTS));
                }
            }
        }
        return out;
    }

    @Test
    void breakdownCurrentsGiveTheirJunctionVoltageBack() {
        // the bracket search doubles its reverse end far into breakdown, where the current and its conductance
        // overflow; the solve must bisect away from there, not stop on a step of 0 (found by ReverseAgainstNgspiceTest)
        for (DiodeAtTemperature d : breakdownFamily()) {
            for (double vd0 = -d.breakdownVoltage() + 0.3; ; vd0 -= 0.0173) {
                double current = JunctionCurrent.current(d, vd0);
                if (current < -1) {
                    break;
                }
                if (current > -1e3 * d.saturationCurrent()) {
                    continue;  // above the knee: the cubic region's plateau, where the voltage is barely defined
                }
                double vd = DiodeSolver.junctionVoltageAtCurrent(d, current);
                // the solve's tolerance is relative above 1 V
                double tolerance = SOLVE_TOLERANCE_V * Math.abs(vd0) + CURRENT_ROUNDING_ULPS * Math.ulp(current)
                        / JunctionCurrent.conductance(d, vd0);
                double at = vd0;
                assertEquals(vd0, vd, tolerance, () -> d + " at " + current + " A (vd " + at + " V)");
            }
        }
    }

    @Test
    void aShuntedJunctionGivesItsJunctionVoltageBack() {
        // F(vd) = Ij(vd)(1 + G RS) + G vd is the terminal current (ShuntedJunction's class comment)
        double[] shunts = {1e-9, 1e-6, 1e-3};
        for (DiodeAtTemperature d : family()) {
            for (double g : shunts) {
                double a = 1 + g * d.seriesResistance();
                for (double vd0 = -2; vd0 <= 1.0; vd0 += 0.0213) {
                    double current = JunctionCurrent.current(d, vd0) * a + g * vd0;
                    if (current > 10) {
                        break;
                    }
                    if (current == 0 || (vd0 < 0 && !monotoneInReverse(d))) {
                        continue;
                    }
                    double vd = ShuntedJunction.junctionVoltageAtCurrent(d, current, g);
                    double slope = JunctionCurrent.conductance(d, vd0) * a + g;
                    double tolerance = SOLVE_TOLERANCE_V + CURRENT_ROUNDING_ULPS * Math.ulp(current) / slope;
                    double at = current;
                    assertEquals(vd0, vd, tolerance, () -> d + " with G = " + g + " at " + at + " A");
                }
            }
        }
    }

    @Test
    void theTerminalVoltageRoundTripsThroughTheCurrentAtIt() {
        // V = vd + RS I at a forced current; the current at that forced voltage must be the same current
        for (DiodeAtTemperature d : family()) {
            for (double current = 1e-9; current < 0.5; current *= 3.7) {
                double v = DiodeSolver.voltageAtCurrent(d, current);
                double back = DiodeSolver.currentAtVoltage(d, v);
                // the voltage is known to its ulp and the solve's tolerance; the current follows through the
                // terminal conductance, at most 1/RS and at most g
                double g = JunctionCurrent.conductance(d, DiodeSolver.junctionVoltageAtCurrent(d, current));
                double dIdV = g / (1 + d.seriesResistance() * g);
                double tolerance = dIdV * (SOLVE_TOLERANCE_V + CURRENT_ROUNDING_ULPS * Math.ulp(v))
                        + CURRENT_ROUNDING_ULPS * Math.ulp(current);
                double at = current;
                assertEquals(current, back, tolerance, () -> d + " at " + at + " A");
            }
        }
    }
}
