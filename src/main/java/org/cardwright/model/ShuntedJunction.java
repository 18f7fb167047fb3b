package org.cardwright.model;

/**
 * The diode (junction inside its series resistance) with a linear conductance G between its terminals: a
 * surface-leakage path or a solar cell's shunt resistance. It is not a SPICE diode parameter; a card carries it
 * as a resistor beside the diode in a subcircuit. The terminal current is
 *
 * <pre>
 *     I = Ij(vd) + G·V,    V = vd + RS·Ij(vd)
 * </pre>
 *
 * so at a forced terminal current the junction voltage solves F(vd) = Ij(vd)·(1 + G·RS) + G·vd − I = 0, which
 * rises with vd (Ij does, and G, RS ≥ 0). That root is found by the same bracketed Newton iteration as
 * {@link DiodeSolver} (Press et al., "Numerical Recipes", routine rtsafe; recalled), so the result is exact for
 * the whole model. The equivalent circuit of a junction with series and shunt resistance is the usual one of
 * the trade (e.g. the single-diode solar-cell model; common practice, no source).
 */
public final class ShuntedJunction {
    private static final int MAX_ITERATIONS = 400;
    /** Convergence on the junction voltage [V]: far below what any simulator or instrument resolves. */
    private static final double VOLTAGE_TOLERANCE = 1e-14;

    private ShuntedJunction() {
    }

    /**
     * Junction voltage (inside RS) at a forced terminal current [V].
     *
     * @param d       parameters at the device temperature
     * @param current terminal current, anode to cathode [A]
     * @param shunt   conductance between the terminals, 0 for none [S]
     */
    public static double junctionVoltageAtCurrent(DiodeAtTemperature d, double current, double shunt) {
        if (!(shunt >= 0) || !Double.isFinite(shunt)) {
            throw new IllegalArgumentException("shunt conductance must be finite and not negative, got " + shunt);
        }
        if (shunt == 0 || current == 0) {
            return DiodeSolver.junctionVoltageAtCurrent(d, current);
        }
        double rs = d.seriesResistance();
        double a = 1 + shunt * rs;
        double lo;
        double hi;
        double[] ig = new double[2];
        if (current > 0) {
            // the junction carries less than I/(1 + G·RS); the Shockley term alone carrying that sets a first upper
            // point, raised until F is positive there (high injection can need more voltage)
            lo = 0;
            double vte = d.emissionCoefficient() * d.thermalVoltage();
            hi = Math.max(vte * Math.log1p(current / a / d.saturationCurrent()), 1e-6);
            int guard = 0;
            JunctionCurrent.currentAndConductance(d, hi, ig);
            while (ig[0] * a + shunt * hi < current) {
                hi = 2 * hi + 0.1;
                JunctionCurrent.currentAndConductance(d, hi, ig);
                if (++guard > 200) {
                    throw new ArithmeticException("no junction voltage carries " + current + " A");
                }
            }
        } else {
            hi = 0;
            // F is negative where the shunt alone carries I, as the junction adds current of the same sign
            lo = current / shunt;
        }
        double x = current > 0 ? hi : lo;
        double stepBefore = hi - lo;
        for (int iter = 0; iter < MAX_ITERATIONS; iter++) {
            // forward, the first point is the upper bracket end, evaluated already
            if (iter > 0 || current < 0) {
                JunctionCurrent.currentAndConductance(d, x, ig);
            }
            double f = ig[0] * a + shunt * x - current;
            double slope = ig[1] * a + shunt;
            if (f == 0) {
                return x;
            }
            if (f > 0) {
                hi = x;
            } else {
                lo = x;
            }
            double next = x - f / slope;
            if (Double.isFinite(f) && Double.isFinite(slope)
                    && Math.abs(next - x) <= VOLTAGE_TOLERANCE * Math.max(1, Math.abs(x))) {
                // converged; tested before the bracket, as in DiodeSolver (a step that rounds to nothing at the root
                // leaves next on a bracket end, and bisecting from there costs 40-50 evaluations; not where the
                // model overflowed)
                return next;
            }
            if (!(next > lo && next < hi) || Math.abs(2 * (next - x)) > Math.abs(stepBefore)) {
                next = 0.5 * (lo + hi);
            }
            stepBefore = next - x;
            if (Math.abs(next - x) <= VOLTAGE_TOLERANCE * Math.max(1, Math.abs(x)) || hi - lo <= VOLTAGE_TOLERANCE) {
                return next;
            }
            x = next;
        }
        return x;
    }

    /**
     * Terminal voltage at a forced terminal current [V].
     *
     * @param d       parameters at the device temperature
     * @param current terminal current, anode to cathode [A]
     * @param shunt   conductance between the terminals, 0 for none [S]
     */
    public static double voltageAtCurrent(DiodeAtTemperature d, double current, double shunt) {
        if (shunt == 0) {
            return DiodeSolver.voltageAtCurrent(d, current);
        }
        double vd = junctionVoltageAtCurrent(d, current, shunt);
        return vd + d.seriesResistance() * JunctionCurrent.current(d, vd);
    }

    /**
     * Terminal current at a forced terminal voltage [A]: the diode's current plus G·V.
     *
     * @param d       parameters at the device temperature
     * @param voltage terminal voltage, anode to cathode [V]
     * @param shunt   conductance between the terminals, 0 for none [S]
     */
    public static double currentAtVoltage(DiodeAtTemperature d, double voltage, double shunt) {
        return DiodeSolver.currentAtVoltage(d, voltage) + shunt * voltage;
    }
}
