package org.cardwright.model;

/**
 * Static self-heating as ngspice 39 computes it for a diode with RTH0 given and its thermal node used
 * ({@code D1 a k tj NAME thermal}): the junction sits at T = T0 + RTH0·P, where P = I·V is the power the
 * diode dissipates at DC, and every temperature law is evaluated at that T (shared/reference/diode-model.md,
 * section 6). Without RTH0 these methods give the isothermal answer.
 */
public final class SelfHeating {
    private static final int MAX_ITERATIONS = 100;
    /** Convergence of the temperature rise [K]. */
    private static final double RISE_TOLERANCE = 1e-10;
    /** Step for the numerical derivative of the voltage with temperature [K]. */
    private static final double DT = 1e-3;

    private SelfHeating() {
    }

    /**
     * Temperature rise of the junction above {@code ambient} at a forced current [K].
     *
     * @param p       card parameters (RTH0 given or not)
     * @param ambient device temperature without self-heating [K]
     * @param current forced terminal current [A]
     * @param options GMIN and RELTOL
     */
    public static double riseAtCurrent(DiodeParameters p, double ambient, double current, SimulatorOptions options) {
        if (!p.isGiven(Param.RTH0) || current == 0) {
            return 0;
        }
        double rth = p.get(Param.RTH0);
        // g(dT) = dT - RTH0 I V(T0 + dT) rises with dT (V falls with T at fixed current), so Newton from 0
        // moves monotonically to the single root
        double dt = 0;
        for (int k = 0; k < MAX_ITERATIONS; k++) {
            double v = voltage(p, ambient + dt, current, options);
            double g = dt - rth * current * v;
            double dv = (voltage(p, ambient + dt + DT, current, options) - v) / DT;
            double slope = 1 - rth * current * dv;
            double next = dt - g / (slope > 0.05 ? slope : 0.05);
            if (ambient + next <= 0) {
                next = 0.5 * (dt - ambient);
            }
            if (Math.abs(next - dt) < RISE_TOLERANCE) {
                return next;
            }
            dt = next;
        }
        return dt;
    }

    /**
     * Terminal voltage at a forced current with the junction heated by its own dissipation [V].
     *
     * @param p       card parameters
     * @param ambient device temperature without self-heating [K]
     * @param current forced terminal current [A]
     * @param options GMIN and RELTOL
     */
    public static double voltageAtCurrent(DiodeParameters p, double ambient, double current, SimulatorOptions options) {
        double rise = riseAtCurrent(p, ambient, current, options);
        return voltage(p, ambient + rise, current, options);
    }

    /**
     * Terminal current at a forced voltage with the junction heated by its own dissipation [A]. The rise is
     * found by bisection on [0, RTH0·|V|·|I(T0)|·10]; a runaway with no steady state returns NaN.
     */
    public static double currentAtVoltage(DiodeParameters p, double ambient, double voltage, SimulatorOptions options) {
        if (!p.isGiven(Param.RTH0) || voltage == 0) {
            return DiodeSolver.currentAtVoltage(TemperatureLaws.at(p, ambient, options), voltage);
        }
        double rth = p.get(Param.RTH0);
        double lo = 0;
        double hi = Math.max(1, 10 * rth * Math.abs(voltage * DiodeSolver.currentAtVoltage(TemperatureLaws.at(p, ambient, options), voltage)));
        for (int k = 0; k < 200 && hi - lo > RISE_TOLERANCE; k++) {
            double mid = 0.5 * (lo + hi);
            double i = DiodeSolver.currentAtVoltage(TemperatureLaws.at(p, ambient + mid, options), voltage);
            if (mid - rth * i * voltage > 0) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return DiodeSolver.currentAtVoltage(TemperatureLaws.at(p, ambient + 0.5 * (lo + hi), options), voltage);
    }

    private static double voltage(DiodeParameters p, double t, double current, SimulatorOptions options) {
        return DiodeSolver.voltageAtCurrent(TemperatureLaws.at(p, t, options), current);
    }
}
