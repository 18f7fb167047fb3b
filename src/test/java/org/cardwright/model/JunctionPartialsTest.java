package org.cardwright.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.EnumMap;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * {@link JunctionPartials} against numerical derivatives of {@link JunctionCurrent#current} itself: for each
 * temperature-scaled quantity q, Richardson-extrapolated central differences (Richardson, "The approximate
 * arithmetical solution by finite differences of physical problems", Phil. Trans. R. Soc. A 210 (1911) 307-357)
 * of the current with q moved in the record and everything else held, on a seeded family of invented parameter
 * sets, voltages and temperatures (-55 to 150 degC) that covers every branch: forward with and without ISR and
 * IKF, the cubic reverse region, breakdown with and without IKR, Xyce's forward branch and gnucap's forward-only
 * form. Current and conductance must be the very doubles {@link JunctionCurrent} gives (the fit's residuals and
 * its Jacobian use both).
 */
class JunctionPartialsTest {
    /**
     * Agreement |analytic - numerical|·q relative to the larger of the current and the change q·dI/dq [1] (the
     * latter for quantities the current depends on steeply, BV over NBV·Vt up to a few hundred): Richardson-
     * extrapolated central differences with a relative step of 1e-4 are good to about 1e-9 of that here
     * (truncation of order h^4 times the fifth derivative; rounding 1e-16/1e-4); 1e-7 leaves room.
     */
    private static final double AGREEMENT = 1e-7;
    /** Relative step of the central differences: of q, or of the current where it depends on q steeply [1]. */
    private static final double STEP = 1e-4;
    /** Keep this far from a branch boundary (vd = -3 N Vt, vd = -BV), so no difference straddles one [V]. */
    private static final double BOUNDARY_MARGIN = 2e-3;
    /** The current below which ngspice applies no knee scaling, as JunctionCurrent's [A]. */
    private static final double KNEE_THRESHOLD = 1e-18;
    /** A moved current this close to the knee threshold may cross it, where the current has a step [A]. */
    private static final double KNEE_MARGIN = 1e-19;
    /** Absolute floor of the comparison, far below any current compared, for derivatives that are exactly 0 [A]. */
    private static final double ZERO_FLOOR = 1e-30;
    /** Sets drawn per flavour. */
    private static final int SETS = 60;

    private static final int[] QUANTITIES = {JunctionPartials.SATURATION_CURRENT, JunctionPartials.EMISSION,
        JunctionPartials.RECOMBINATION_CURRENT, JunctionPartials.RECOMBINATION_EMISSION, JunctionPartials.FORWARD_KNEE,
        JunctionPartials.REVERSE_KNEE, JunctionPartials.BREAKDOWN_VOLTAGE, JunctionPartials.BREAKDOWN_EMISSION,
        JunctionPartials.JUNCTION_POTENTIAL, JunctionPartials.GRADING};

    @Test
    void partialsMatchRichardsonDifferencesOnEveryBranch() {
        Random random = new Random(1212);
        int[] branches = new int[5];
        int checked = 0;
        for (Flavour flavour : Flavour.values()) {
            SimulatorOptions options = new SimulatorOptions(flavour.defaultGmin(), 1e-3, flavour);
            for (int s = 0; s < SETS; s++) {
                DiodeParameters p = draw(random);
                double celsius = -55 + 205 * random.nextDouble();
                DiodeAtTemperature d = TemperatureLaws.at(p, celsius + 273.15, options);
                for (double vd : voltages(d, random)) {
                    if (nearBoundary(d, vd)) {
                        continue;
                    }
                    branches[branch(d, vd)]++;
                    checked += checkPoint(d, vd);
                }
            }
        }
        for (int b = 0; b < branches.length; b++) {
            assertTrue(branches[b] > 20, "branch " + b + " covered by only " + branches[b] + " voltages");
        }
        assertTrue(checked > 5000, "only " + checked + " derivatives compared");
    }

    @Test
    void currentAndConductanceAreTheSameDoubles() {
        Random random = new Random(1213);
        for (Flavour flavour : Flavour.values()) {
            SimulatorOptions options = new SimulatorOptions(flavour.defaultGmin(), 1e-3, flavour);
            for (int s = 0; s < SETS; s++) {
                DiodeAtTemperature d = TemperatureLaws.at(draw(random), 218.15 + 205 * random.nextDouble(), options);
                double[] out = new double[JunctionPartials.SIZE];
                for (double vd : voltages(d, random)) {
                    JunctionPartials.evaluate(d, vd, out);
                    assertEquals(Double.doubleToLongBits(JunctionCurrent.current(d, vd)),
                            Double.doubleToLongBits(out[JunctionPartials.CURRENT]), () -> "current at " + vd + " " + d);
                    assertEquals(Double.doubleToLongBits(JunctionCurrent.conductance(d, vd)),
                            Double.doubleToLongBits(out[JunctionPartials.CONDUCTANCE]), () -> "g at " + vd + " " + d);
                }
            }
        }
    }

    /** Compares every active quantity's partial at one point; returns how many. */
    private static int checkPoint(DiodeAtTemperature d, double vd) {
        double[] out = new double[JunctionPartials.SIZE];
        JunctionPartials.evaluate(d, vd, out);
        double[] q = new double[JunctionPartials.SIZE];
        JunctionPartials.quantities(d, q);
        // the current without GMIN's share, which no quantity moves: the natural size of a relative change. The
        // differences are taken with GMIN 0 (it only adds GMIN·vd at the end), as its share would otherwise round
        // away the digits of a current far below GMIN·vd; Xyce's forward branch takes GMIN into its knee, so keeps it
        boolean keepGmin = d.flavour().xyceKnee() && vd >= -3 * d.emissionCoefficient() * d.thermalVoltage();
        DiodeAtTemperature base = keepGmin ? d : moved(d, -1, 0, 0.0);
        double size = keepGmin ? Math.abs(out[JunctionPartials.CURRENT])
                : Math.abs(out[JunctionPartials.CURRENT] - d.gmin() * vd);
        int n = 0;
        for (int k : QUANTITIES) {
            if (!(q[k] > 0) || !Double.isFinite(q[k]) || straddlesKnee(base, vd, k, q[k])) {
                continue;
            }
            // the step moves the current by about STEP of itself, or q by STEP where the current depends on q gently
            double h = STEP * (out[k] == 0 ? q[k] : Math.min(q[k], Math.max(size, 1e-300) / Math.abs(out[k])));
            double numerical = richardson(base, vd, k, q[k], h);
            double analytic = out[k];
            double error = Math.abs(analytic - numerical) * q[k];
            assertTrue(error <= AGREEMENT * Math.max(size, Math.abs(analytic) * q[k]) + ZERO_FLOOR,
                    () -> "quantity " + k + " at vd = " + vd + ": analytic " + analytic + ", numerical " + numerical
                            + ", current " + size + ", " + d);
            n++;
        }
        return n;
    }

    private static double richardson(DiodeAtTemperature d, double vd, int k, double q, double h) {
        double coarse = central(d, vd, k, q, h);
        double fine = central(d, vd, k, q, h / 2);
        return (4 * fine - coarse) / 3;
    }

    private static double central(DiodeAtTemperature d, double vd, int k, double q, double h) {
        return (JunctionCurrent.current(moved(d, k, q + h), vd) - JunctionCurrent.current(moved(d, k, q - h), vd))
                / (2 * h);
    }

    /** True when moving quantity k would carry the current across the 1e-18 A knee threshold. */
    private static boolean straddlesKnee(DiodeAtTemperature d, double vd, int k, double q) {
        double[] currents = {JunctionCurrent.current(moved(d, k, q * (1 + STEP)), vd) - d.gmin() * vd,
            JunctionCurrent.current(moved(d, k, q * (1 - STEP)), vd) - d.gmin() * vd};
        for (double c : currents) {
            if (Math.abs(Math.abs(c) - KNEE_THRESHOLD) < KNEE_MARGIN) {
                return true;
            }
        }
        return false;
    }

    private static boolean nearBoundary(DiodeAtTemperature d, double vd) {
        double vte = d.emissionCoefficient() * d.thermalVoltage();
        return Math.abs(vd + 3 * vte) < BOUNDARY_MARGIN
                || (d.hasBreakdown() && Math.abs(vd + d.breakdownVoltage()) < BOUNDARY_MARGIN);
    }

    /** 0 forward, 1 forward with ISR, 2 cubic reverse, 3 breakdown, 4 any branch with a knee acting. */
    private static int branch(DiodeAtTemperature d, double vd) {
        double vte = d.emissionCoefficient() * d.thermalVoltage();
        boolean reverse = vd < -3 * vte && d.flavour().spiceReverse();
        double raw = JunctionCurrent.current(d, vd) - d.gmin() * vd;
        if ((!reverse && d.hasForwardKnee() && raw > 1e-9) || (reverse && d.hasReverseKnee() && raw < -1e-9)) {
            return 4;
        }
        if (!reverse) {
            return d.hasRecombination() ? 1 : 0;
        }
        return d.hasBreakdown() && vd < -d.breakdownVoltage() ? 3 : 2;
    }

    /** Forward voltages up to high injection, reverse ones down into breakdown. */
    private static double[] voltages(DiodeAtTemperature d, Random random) {
        double[] v = new double[16];
        for (int i = 0; i < 10; i++) {
            v[i] = -0.05 + 1.1 * random.nextDouble();
        }
        double bv = d.hasBreakdown() ? d.breakdownVoltage() : 40;
        for (int i = 10; i < 13; i++) {
            v[i] = -bv * (0.3 + 0.65 * random.nextDouble());
        }
        // into breakdown by 1 to 25 times NBV·Vt: currents from about IS to far past IBV
        for (int i = 13; i < v.length; i++) {
            v[i] = -bv - d.breakdownEmission() * d.thermalVoltage() * (1 + 24 * random.nextDouble());
        }
        return v;
    }

    /** An invented parameter set; the optional terms each present about half the time. */
    private static DiodeParameters draw(Random random) {
        Map<Param, Double> v = new EnumMap<>(Param.class);
        v.put(Param.IS, Math.pow(10, -16 + 7 * random.nextDouble()));
        v.put(Param.N, 0.95 + 1.2 * random.nextDouble());
        v.put(Param.RS, 0.1 + random.nextDouble());
        if (random.nextBoolean()) {
            v.put(Param.ISR, Math.pow(10, -13 + 5 * random.nextDouble()));
            v.put(Param.NR, 1.5 + 1.5 * random.nextDouble());
            v.put(Param.VJ, 0.4 + 0.6 * random.nextDouble());
            v.put(Param.M, 0.2 + 0.6 * random.nextDouble());
        }
        if (random.nextBoolean()) {
            v.put(Param.IKF, Math.pow(10, -3 + 2.5 * random.nextDouble()));
        }
        if (random.nextBoolean()) {
            v.put(Param.BV, 3 + 100 * random.nextDouble());
            v.put(Param.IBV, Math.pow(10, -6 + 4 * random.nextDouble()));
            v.put(Param.NBV, 0.8 + 4 * random.nextDouble());
            if (random.nextBoolean()) {
                v.put(Param.IKR, Math.pow(10, -3 + 2 * random.nextDouble()));
            }
        }
        return DiodeParameters.of(v);
    }

    /** {@code d} with quantity {@code k} set to {@code value}, everything else as it is. */
    private static DiodeAtTemperature moved(DiodeAtTemperature d, int k, double value) {
        return moved(d, k, value, d.gmin());
    }

    /** {@code d} with quantity {@code k} (none for -1) set to {@code value} and GMIN {@code gmin}. */
    private static DiodeAtTemperature moved(DiodeAtTemperature d, int k, double value, double gmin) {
        return new DiodeAtTemperature(d.temperature(), d.thermalVoltage(),
                k == JunctionPartials.SATURATION_CURRENT ? value : d.saturationCurrent(),
                k == JunctionPartials.EMISSION ? value : d.emissionCoefficient(),
                k == JunctionPartials.RECOMBINATION_CURRENT ? value : d.recombinationCurrent(),
                k == JunctionPartials.RECOMBINATION_EMISSION ? value : d.recombinationEmission(),
                k == JunctionPartials.FORWARD_KNEE ? value : d.forwardKneeCurrent(),
                k == JunctionPartials.REVERSE_KNEE ? value : d.reverseKneeCurrent(),
                d.seriesResistance(),
                k == JunctionPartials.BREAKDOWN_VOLTAGE ? value : d.breakdownVoltage(),
                k == JunctionPartials.BREAKDOWN_EMISSION ? value : d.breakdownEmission(),
                k == JunctionPartials.JUNCTION_POTENTIAL ? value : d.junctionPotential(),
                k == JunctionPartials.GRADING ? value : d.gradingCoefficient(),
                d.junctionCapacitance(), d.forwardCoefficient(), d.transitTime(), gmin, d.gradingClamped(),
                d.potentialClamped(), d.capacitanceF1(), d.flavour());
    }
}
