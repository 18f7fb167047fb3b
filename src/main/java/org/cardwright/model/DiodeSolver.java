package org.cardwright.model;

/**
 * Terminal behaviour of the diode with its series resistance: the voltage across the terminals at a forced
 * current, and the current at a forced terminal voltage.
 *
 * <p>Where the closed form applies (Shockley term only) the start comes from the exact solution of Banwell
 * &amp; Jayakumar, "Exact analytical solution for current flow through diode with series resistance", Electron.
 * Lett. 36(4) (2000) 291-292, doi:10.1049/el:20000301, evaluated in log space when its argument overflows a
 * double; every answer is then polished by a bracketed Newton iteration on the full ngspice equations (GMIN,
 * recombination, high injection, reverse regions), so the result is exact for the whole model.
 */
public final class DiodeSolver {
    private static final int MAX_ITERATIONS = 300;
    /** Convergence on the junction voltage [V]: far below what any simulator or instrument resolves. */
    private static final double VOLTAGE_TOLERANCE = 1e-14;

    private DiodeSolver() {
    }

    /**
     * Terminal voltage at a forced terminal current [V].
     *
     * @param d       parameters at the device temperature
     * @param current terminal current, anode to cathode [A]
     */
    public static double voltageAtCurrent(DiodeAtTemperature d, double current) {
        double vd = junctionVoltageAtCurrent(d, current);
        return vd + current * d.seriesResistance();
    }

    /**
     * Junction voltage (inside RS) at which the junction carries {@code current} [V].
     *
     * @param d       parameters at the device temperature
     * @param current junction current [A]
     */
    public static double junctionVoltageAtCurrent(DiodeAtTemperature d, double current) {
        if (current == 0) {
            return 0;
        }
        double scale = scaleOf(current);
        return junctionVoltage(d, current, scale, asinh(current / scale), new double[2]);
    }

    /**
     * A forced current with what every solve at it needs from the current alone (the scale and the goal of the
     * asinh residual) computed once: for a residual block that solves at the same measured currents in every
     * evaluation of a fit. Immutable.
     */
    public static final class ForcedCurrent {
        private final double current;
        private final double scale;
        private final double goal;

        /** @param current the forced current [A] */
        public ForcedCurrent(double current) {
            this.current = current;
            this.scale = scaleOf(current);
            this.goal = asinh(current / scale);
        }

        /** The forced current [A]. */
        public double current() {
            return current;
        }
    }

    /**
     * {@link #junctionVoltageAtCurrent(DiodeAtTemperature, double)} at a prepared current, the same number to the
     * bit, with {@code scratch} (two doubles, any content, overwritten) for the evaluations instead of a new array.
     */
    public static double junctionVoltageAtCurrent(DiodeAtTemperature d, ForcedCurrent current, double[] scratch) {
        if (current.current == 0) {
            return 0;
        }
        return junctionVoltage(d, current.current, current.scale, current.goal, scratch);
    }

    /**
     * {@link #voltageAtCurrent(DiodeAtTemperature, double)} at a prepared current, the same number to the bit;
     * {@code scratch} as for {@link #junctionVoltageAtCurrent(DiodeAtTemperature, ForcedCurrent, double[])}.
     */
    public static double voltageAtCurrent(DiodeAtTemperature d, ForcedCurrent current, double[] scratch) {
        double vd = junctionVoltageAtCurrent(d, current, scratch);
        return vd + current.current * d.seriesResistance();
    }

    /** The scale of the asinh residual at a forced current [A]: a millionth of it, kept positive. */
    private static double scaleOf(double target) {
        return Math.max(Math.abs(target) * 1e-6, 1e-300);
    }

    private static double junctionVoltage(DiodeAtTemperature d, double current, double scale, double goal,
                                          double[] ig) {
        double lo;
        double hi;
        double start;
        // ig: current and conductance at the last bracket end tried, usually the start itself, whose evaluation the
        // solve then reuses instead of repeating it
        if (current > 0) {
            // Shockley-only start, with the high-injection law inverted exactly: I = S/(1 + sqrt(S/IKF))
            double s = current;
            if (d.hasForwardKnee()) {
                double rootIk = Math.sqrt(d.forwardKneeCurrent());
                double u = (current / rootIk + Math.sqrt(current * current / d.forwardKneeCurrent() + 4 * current)) / 2;
                s = u * u;
            }
            double vte = d.emissionCoefficient() * d.thermalVoltage();
            start = vte * lnOnePlus(s / d.saturationCurrent());
            lo = 0;
            hi = Math.max(start, 1e-6);
            int guard = 0;
            JunctionCurrent.currentAndConductance(d, hi, ig);
            while (ig[0] < current) {
                hi = 2 * hi + 0.1;
                JunctionCurrent.currentAndConductance(d, hi, ig);
                if (++guard > 200) {
                    throw new ArithmeticException("no junction voltage carries " + current + " A");
                }
            }
        } else {
            hi = 0;
            lo = Math.scalb(REVERSE_FIRST_END, reverseDoublings(d, current, ig));
            start = lo;
        }
        return solve(d, current, 0.0, lo, hi, start, ig, current < 0 || hi == start, scale, goal);
    }

    /** The first lower bracket end tried for a reverse current [V]; the next ones double it. */
    private static final double REVERSE_FIRST_END = -1e-3;
    /** Doublings of {@link #REVERSE_FIRST_END} after which no junction voltage is taken to carry the current. */
    private static final int MAX_DOUBLINGS = 200;

    /**
     * The lower bracket end for a reverse current: the first of -1e-3 V, -2e-3 V, -4e-3 V, ... (k doublings) at which
     * the junction carries at least {@code current} (I(lo) &lt;= current, or not a number where the model overflowed),
     * with the current and conductance there left in {@code ig}. Returns k.
     *
     * <p>A plain scan from k = 0 needs k + 1 evaluations, 14 for a 5 V breakdown. As the junction current falls
     * monotonically with the junction voltage (the assumption the bracketed solve rests on), the first k is also found
     * by starting from the k that the breakdown law predicts and walking outward while the current falls short, or
     * inward while the next end in still carries it: the same k, the same end and the same evaluation there, so the
     * solve that follows takes the same steps to the same double; two evaluations where the prediction is right.
     */
    static int reverseDoublings(DiodeAtTemperature d, double current, double[] ig) {
        int k = predictedDoublings(d, current);
        JunctionCurrent.currentAndConductance(d, Math.scalb(REVERSE_FIRST_END, k), ig);
        if (ig[0] > current) {
            // short of the current: outward, as the scan goes
            do {
                if (k >= MAX_DOUBLINGS) {
                    throw new ArithmeticException("no junction voltage carries " + current + " A");
                }
                k++;
                JunctionCurrent.currentAndConductance(d, Math.scalb(REVERSE_FIRST_END, k), ig);
            } while (ig[0] > current);
            return k;
        }
        // carries it: inward while the next end in carries it too, keeping the evaluation at the innermost one
        double i = ig[0];
        double g = ig[1];
        while (k > 0) {
            JunctionCurrent.currentAndConductance(d, Math.scalb(REVERSE_FIRST_END, k - 1), ig);
            if (ig[0] > current) {
                break;
            }
            k--;
            i = ig[0];
            g = ig[1];
        }
        ig[0] = i;
        ig[1] = g;
        return k;
    }

    /**
     * The plain scan {@link #reverseDoublings} stands in for: k = 0, 1, 2, ... until the end carries the current, the
     * evaluation there left in {@code ig}. Kept as the reference its tests compare with.
     */
    static int reverseDoublingsByScan(DiodeAtTemperature d, double current, double[] ig) {
        int k = 0;
        JunctionCurrent.currentAndConductance(d, REVERSE_FIRST_END, ig);
        while (ig[0] > current) {
            if (k >= MAX_DOUBLINGS) {
                throw new ArithmeticException("no junction voltage carries " + current + " A");
            }
            k++;
            JunctionCurrent.currentAndConductance(d, Math.scalb(REVERSE_FIRST_END, k), ig);
        }
        return k;
    }

    /**
     * The doublings of {@link #REVERSE_FIRST_END} that reach the junction voltage at which the breakdown law alone
     * carries {@code current} (the reverse knee inverted as the forward start inverts IKF; GMIN and the cubic region
     * left out): a guess, which {@link #reverseDoublings} checks. 0 without breakdown, where the scan starts.
     */
    private static int predictedDoublings(DiodeAtTemperature d, double current) {
        if (!d.flavour().spiceReverse() || !d.hasBreakdown()) {
            return 0;
        }
        double c = -current;
        // ngspice drops the recombination term below -3 N Vt, so between there and 0 V the reverse current can dip
        // below its value just beyond (docs/model.md, "DC current"): not monotone. Where the current asked for is
        // more than twice the most that stretch can carry, no end in it carries it and beyond it the current is
        // monotone, so the first end is unique; else the scan from k = 0
        double vte = d.emissionCoefficient() * d.thermalVoltage();
        double dip = d.saturationCurrent() + d.gmin() * 3 * vte;
        if (d.flavour().xyceKnee() && d.hasForwardKnee()) {
            // Xyce's knee In sqrt(IKF/(IKF + In)) acts on negative currents too, and grows without bound as In nears -IKF
            if (!(dip < d.forwardKneeCurrent())) {
                return 0;
            }
            dip *= Math.sqrt(d.forwardKneeCurrent() / (d.forwardKneeCurrent() - dip));
        }
        if (d.hasRecombination()) {
            // the grading factor ((1 - vd/VJ)^2 + 0.005)^(M/2) at vd = -3 N Vt, its largest there, is at most the
            // square root of its base (M < 1, base above 1)
            double u = 1 + 3 * vte / d.junctionPotential();
            dip += d.recombinationCurrent() * Math.sqrt(u * u + 0.005);
        }
        if (!(c > 2 * dip)) {
            return 0;
        }
        double s = c;
        if (d.hasReverseKnee()) {
            double rootIk = Math.sqrt(d.reverseKneeCurrent());
            double u = (c / rootIk + Math.sqrt(c * c / d.reverseKneeCurrent() + 4 * c)) / 2;
            s = u * u;
        }
        double v = d.breakdownVoltage() + d.breakdownEmission() * d.thermalVoltage() * Math.log(s / d.saturationCurrent());
        // the binary exponent of v/1e-3 plus one: the first end at or beyond v but where v/1e-3 is a power of two
        // (one step more to walk); NaN (a current below IS) and anything below 1e-3 V fall back to the scan's own ends
        double ratio = v / -REVERSE_FIRST_END;
        return ratio >= 1 ? Math.min(Math.getExponent(ratio) + 1, MAX_DOUBLINGS) : 0;
    }

    /**
     * ln(1 + x) for a start value: Math.log (a compiler intrinsic) where 1 + x loses nothing that matters to a start
     * (x above 1e-4: relative error below 1e-12), Math.log1p (exact, but not an intrinsic and about 10 times slower)
     * below. The solve that follows converges to its own tolerance from either start.
     */
    private static double lnOnePlus(double x) {
        return x > 1e-4 ? Math.log(1 + x) : Math.log1p(x);
    }

    /**
     * Terminal current at a forced terminal voltage [A].
     *
     * @param d       parameters at the device temperature
     * @param voltage terminal voltage, anode to cathode [V]
     */
    public static double currentAtVoltage(DiodeAtTemperature d, double voltage) {
        double r = d.seriesResistance();
        if (r == 0) {
            return JunctionCurrent.current(d, voltage);
        }
        if (voltage == 0) {
            return 0;
        }
        double lo = Math.min(0, voltage);
        double hi = Math.max(0, voltage);
        double start = voltage;
        if (voltage > 0) {
            // Banwell & Jayakumar (2000), Eq. (3): I = (n Vt/R) W0[(Is R/(n Vt)) exp((V + Is R)/(n Vt))] - Is
            double is = d.saturationCurrent();
            double vte = d.emissionCoefficient() * d.thermalVoltage();
            double lnArg = Math.log(is * r / vte) + (voltage + is * r) / vte;
            double i0 = vte / r * LambertW.w0OfExp(lnArg) - is;
            start = Math.min(hi, Math.max(lo, voltage - r * i0));
        }
        double vd = solve(d, voltage, r, lo, hi, start, new double[2], false, 0, voltage);
        // where the junction is stiffer than RS the drop across RS carries the current precisely; where it is
        // softer (reverse bias, tiny currents) V - vd cancels, and the junction equation is the precise side
        return r * JunctionCurrent.conductance(d, vd) > 1 ? (voltage - vd) / r : JunctionCurrent.current(d, vd);
    }

    /**
     * Bracketed Newton iteration for vd + r·I(vd) = target (r = 0: I(vd) = target). The left side rises
     * with vd, so a bracket [lo, hi] with opposite signs always holds the root. For r = 0 the residual is taken
     * through asinh(I/s), which is logarithmic in the exponential regions (so Newton converges there in a few
     * steps from either side) and linear near zero. A step that leaves the bracket, or that does not at least
     * halve the residual's predicted distance as fast as bisection would, is replaced by bisection (the
     * safeguard of Press et al., "Numerical Recipes", routine rtsafe; recalled).
     */
    /** Magnitudes whose squares stay normal doubles [A]. */
    private static final double SQUARE_SAFE_LOW = 1e-150;
    private static final double SQUARE_SAFE_HIGH = 1e150;

    private static double solve(DiodeAtTemperature d, double target, double r, double lo, double hi, double start,
                                double[] ig, boolean startEvaluated, double scale, double goal) {
        // r = 0: scale and goal of the asinh residual, from scaleOf(target); else goal = target and no scale
        double x = start;
        double stepBefore = hi - lo;
        for (int iter = 0; iter < MAX_ITERATIONS; iter++) {
            if (iter > 0 || !startEvaluated) {
                JunctionCurrent.currentAndConductance(d, x, ig);
            }
            double i = ig[0];
            double g = ig[1];
            double f;
            double slope;
            if (r == 0) {
                f = asinh(i / scale) - goal;
                // sqrt of the sum of squares where neither square can overflow or underflow: Math.hypot gives the
                // same to an ulp at several times the cost (a tenth of a forward fit's time went there)
                slope = g / (scale > SQUARE_SAFE_LOW && Math.abs(i) < SQUARE_SAFE_HIGH
                        ? Math.sqrt(i * i + scale * scale) : Math.hypot(i, scale));
            } else {
                f = x + r * i - goal;
                slope = 1 + r * g;
            }
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
                // Newton's own step is below the tolerance: x is the root to within it. Tested before the bracket,
                // since at the root the step can round to nothing (next == x, which is now a bracket end), and
                // bisecting from there would walk the whole bracket down again (40-50 evaluations). Not where the
                // model overflowed: a conductance of +infinity far in breakdown makes every step 0
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

    private static double asinh(double v) {
        double a = Math.abs(v);
        double r = a > 1e8 ? Math.log(2 * a) : Math.log(a + Math.sqrt(a * a + 1));
        return Math.copySign(r, v);
    }
}
