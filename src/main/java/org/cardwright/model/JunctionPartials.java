package org.cardwright.model;

/**
 * The junction current of {@link JunctionCurrent}, its conductance and its exact partial derivatives with respect to
 * the quantities at the device temperature that it depends on, all from one evaluation that shares the exponentials.
 * The derivatives are taken at fixed intrinsic voltage vd, branch by branch as {@link JunctionCurrent#current}
 * computes the current (forward with the recombination factor and the high-injection knee, the cubic reverse
 * region below -3·N·Vt, breakdown with the reverse knee, Xyce's forward branch, GMIN); the equations are those of
 * docs/model.md, section "DC current" (ngspice 39's level-1 diode).
 *
 * <p>The fit's Jacobian needs dIj/dp at fixed vd for every card parameter p. By the chain rule
 * dIj/dp = sum_k (dIj/dq_k)(dq_k/dp), with q_k the quantities listed by the index constants below, and dq_k/dp
 * depends on the temperature only, not on the point: one evaluation per point and one dot product per parameter
 * replace two current evaluations per parameter per point (forward-mode differentiation by hand; Griewank and
 * Walther, "Evaluating Derivatives: Principles and Techniques of Algorithmic Differentiation", 2nd ed., SIAM 2008,
 * chapter 3).
 *
 * <p>Where a quantity does not act on the current at {@code vd} (the knee current below the knee threshold, the
 * breakdown quantities above -BV, the recombination quantities without ISR) its derivative is 0. The branch
 * boundaries themselves (vd = -3·N·Vt, vd = -BV, the 1e-18 A knee threshold) are taken as fixed, as a central
 * difference that does not straddle them sees them.
 */
public final class JunctionPartials {
    /** Index of the current Ij(vd) [A] in the output array. */
    public static final int CURRENT = 0;
    /** Index of the conductance dIj/dvd [S], the same double {@link JunctionCurrent#conductance} gives. */
    public static final int CONDUCTANCE = 1;
    /** Index of dIj/dIS(T) [1]. */
    public static final int SATURATION_CURRENT = 2;
    /** Index of dIj/dN [A]. */
    public static final int EMISSION = 3;
    /** Index of dIj/dISR(T) [1]. */
    public static final int RECOMBINATION_CURRENT = 4;
    /** Index of dIj/dNR [A]. */
    public static final int RECOMBINATION_EMISSION = 5;
    /** Index of dIj/dIKF [1]. */
    public static final int FORWARD_KNEE = 6;
    /** Index of dIj/dIKR [1]. */
    public static final int REVERSE_KNEE = 7;
    /** Index of dIj/dBV, BV the effective breakdown voltage after the knee iteration [S]. */
    public static final int BREAKDOWN_VOLTAGE = 8;
    /** Index of dIj/dNBV [A]. */
    public static final int BREAKDOWN_EMISSION = 9;
    /** Index of dIj/dVJ(T) [S]. */
    public static final int JUNCTION_POTENTIAL = 10;
    /** Index of dIj/dM(T) [A]. */
    public static final int GRADING = 11;
    /** Length of the output array. */
    public static final int SIZE = 12;
    /** Index of the first partial derivative; the quantities run from here to {@code SIZE - 1}. */
    public static final int FIRST_QUANTITY = SATURATION_CURRENT;

    /** Below this magnitude ngspice does not apply the knee-current scaling [A] (as {@link JunctionCurrent}). */
    private static final double KNEE_THRESHOLD = 1e-18;

    private JunctionPartials() {
    }

    /**
     * The quantities q_k of {@code d} that the current depends on, at the indices of the partial derivatives
     * ({@code FIRST_QUANTITY} .. {@code SIZE - 1}; the first two entries are left as they are). Knee currents and
     * the breakdown voltage are +infinity when not given.
     *
     * @param d   parameters at the device temperature
     * @param out receives the quantities; length at least {@code SIZE}
     */
    public static void quantities(DiodeAtTemperature d, double[] out) {
        out[SATURATION_CURRENT] = d.saturationCurrent();
        out[EMISSION] = d.emissionCoefficient();
        out[RECOMBINATION_CURRENT] = d.recombinationCurrent();
        out[RECOMBINATION_EMISSION] = d.recombinationEmission();
        out[FORWARD_KNEE] = d.forwardKneeCurrent();
        out[REVERSE_KNEE] = d.reverseKneeCurrent();
        out[BREAKDOWN_VOLTAGE] = d.breakdownVoltage();
        out[BREAKDOWN_EMISSION] = d.breakdownEmission();
        out[JUNCTION_POTENTIAL] = d.junctionPotential();
        out[GRADING] = d.gradingCoefficient();
    }

    /**
     * Current, conductance and the partial derivatives of the current at fixed {@code vd}, in one evaluation.
     * Current and conductance are computed with the same operations as {@link JunctionCurrent#current} and
     * {@link JunctionCurrent#conductance}, so they are the same doubles.
     *
     * @param d   parameters at the device temperature
     * @param vd  intrinsic junction voltage [V]
     * @param out receives {current, conductance, dIj/dq_k ...} at the index constants; length at least {@code SIZE}
     */
    public static void evaluate(DiodeAtTemperature d, double vd, double[] out) {
        java.util.Arrays.fill(out, 0, SIZE, 0.0);
        double is = d.saturationCurrent();
        double vt = d.thermalVoltage();
        double n = d.emissionCoefficient();
        double vte = n * vt;
        double i;
        double g;
        if (vd >= -3 * vte || !d.flavour().spiceReverse()) {
            double e = Math.exp(vd / vte);
            i = is * (e - 1);
            g = is * e / vte;
            out[SATURATION_CURRENT] = e - 1;
            // d exp(vd/(N Vt))/dN = -exp(.)·vd/(N² Vt)
            out[EMISSION] = -is * e * vd / (vte * n);
            if (d.flavour().xyceKnee()) {
                xyceForward(d, vd, i, g, out);
                return;
            }
            if (d.hasRecombination()) {
                double nr = d.recombinationEmission();
                double vtr = nr * vt;
                double er = Math.exp(vd / vtr);
                double vj = d.junctionPotential();
                double u = 1 - vd / vj;
                double m = d.gradingCoefficient();
                double mHalf = m / 2;
                double t = u * u + 0.005;
                double f = gradingFactor(t, mHalf);
                double isr = d.recombinationCurrent();
                double irec = isr * (er - 1);
                i += irec * f;
                double df = -m * u * (f / t) / vj;
                g += isr * er / vtr * f + irec * df;
                out[RECOMBINATION_CURRENT] = (er - 1) * f;
                out[RECOMBINATION_EMISSION] = -isr * er * vd / (vtr * nr) * f;
                // f = t^(M/2), t = (1 - vd/VJ)² + 0.005: df/dVJ = M f u vd / (t VJ²), df/dM = f ln(t) / 2
                out[JUNCTION_POTENTIAL] = irec * m * (f / t) * u * vd / (vj * vj);
                out[GRADING] = irec * f * Math.log(t) / 2;
            }
            if (d.hasForwardKnee() && i > KNEE_THRESHOLD) {
                double ikf = d.forwardKneeCurrent();
                double s = Math.sqrt(i / ikf);
                g = g * (1 + s / 2) / ((1 + s) * (1 + s));
                scaleQuantities(out, (1 + s / 2) / ((1 + s) * (1 + s)));
                // I = i/(1 + s), s = sqrt(i/IKF): dI/dIKF = i s / (2 IKF (1 + s)²)
                out[FORWARD_KNEE] = i * s / (2 * ikf * (1 + s) * (1 + s));
                i = i / (1 + s);
            }
        } else {
            if (!d.hasBreakdown() || vd >= -d.breakdownVoltage()) {
                double r = 3 * vte / (Math.E * vd);
                double a = r * r * r;
                i = -is * (1 + a);
                g = 3 * is * a / vd;
                out[SATURATION_CURRENT] = -(1 + a);
                // a = (3 N Vt/(e vd))³: da/dN = 3a/N
                out[EMISSION] = -is * 3 * a / n;
            } else {
                double nbv = d.breakdownEmission();
                double vb = nbv * vt;
                double bv = d.breakdownVoltage();
                double ev = Math.exp(-(bv + vd) / vb);
                i = -is * ev;
                g = is * ev / vb;
                out[SATURATION_CURRENT] = -ev;
                out[BREAKDOWN_VOLTAGE] = is * ev / vb;
                out[BREAKDOWN_EMISSION] = -is * ev * (bv + vd) / (vb * nbv);
            }
            if (d.hasReverseKnee() && i < -KNEE_THRESHOLD) {
                double ikr = d.reverseKneeCurrent();
                double s = Math.sqrt(-i / ikr);
                g = g * (1 + s / 2) / ((1 + s) * (1 + s));
                scaleQuantities(out, (1 + s / 2) / ((1 + s) * (1 + s)));
                out[REVERSE_KNEE] = i * s / (2 * ikr * (1 + s) * (1 + s));
                i = i / (1 + s);
            }
        }
        out[CURRENT] = i + d.gmin() * vd;
        out[CONDUCTANCE] = g + d.gmin();
    }

    /**
     * Xyce's forward branch (as {@link JunctionCurrent}'s): I = In sqrt(IKF/(IKF + In)) + Irec with
     * In = Shockley + GMIN vd, the recombination current not scaled. {@code out} holds the Shockley partials.
     */
    private static void xyceForward(DiodeAtTemperature d, double vd, double shockley, double gShockley,
                                    double[] out) {
        double in = shockley + d.gmin() * vd;
        double gin = gShockley + d.gmin();
        double i = in;
        double g = gin;
        if (d.hasForwardKnee()) {
            double ikf = d.forwardKneeCurrent();
            double root = Math.sqrt(ikf / (ikf + in));
            double scale = root * (1 - in / (2 * (ikf + in)));
            i = in * root;
            g = gin * root * (1 - in / (2 * (ikf + in)));
            out[SATURATION_CURRENT] *= scale;
            out[EMISSION] *= scale;
            // d/dIKF of In sqrt(IKF/(IKF + In)) = In root In / (2 IKF (IKF + In))
            out[FORWARD_KNEE] = in * root * in / (2 * ikf * (ikf + in));
        }
        if (d.hasRecombination()) {
            double nr = d.recombinationEmission();
            double vtr = nr * d.thermalVoltage();
            double er = Math.exp(vd / vtr);
            double vj = d.junctionPotential();
            double u = 1 - vd / vj;
            double m = d.gradingCoefficient();
            double mHalf = m / 2;
            double t = u * u + 0.005;
            double f = Math.pow(t, mHalf);
            double isr = d.recombinationCurrent();
            double irec = isr * (er - 1);
            i += irec * f;
            g += isr * er / vtr * f - irec * m * u * (f / t) / vj;
            out[RECOMBINATION_CURRENT] = (er - 1) * f;
            out[RECOMBINATION_EMISSION] = -isr * er * vd / (vtr * nr) * f;
            out[JUNCTION_POTENTIAL] = irec * m * (f / t) * u * vd / (vj * vj);
            out[GRADING] = irec * f * Math.log(t) / 2;
        }
        out[CURRENT] = i;
        out[CONDUCTANCE] = g;
    }

    /**
     * dq_k/dx by the central difference of the quantities of two parameter sets moved by {@code span} in one
     * coordinate x (the sets at x + h and x - h, {@code span} = 2h, or one-sided at a bound): (q+ - q-)/span at
     * the indices of the partial derivatives; 0 where the two sets agree, which covers a quantity that is +infinity
     * in both (a knee current or breakdown voltage not given). Null when no quantity moves.
     *
     * @param plus  parameters at the device temperature, x moved up
     * @param minus the same, x moved down
     * @param span  distance between the two values of x [1 on the optimiser's scale]
     */
    public static double[] difference(DiodeAtTemperature plus, DiodeAtTemperature minus, double span) {
        double[] qPlus = new double[SIZE];
        double[] qMinus = new double[SIZE];
        quantities(plus, qPlus);
        quantities(minus, qMinus);
        double[] out = null;
        for (int q = FIRST_QUANTITY; q < SIZE; q++) {
            if (qPlus[q] != qMinus[q]) {
                if (out == null) {
                    out = new double[SIZE];
                }
                out[q] = (qPlus[q] - qMinus[q]) / span;
            }
        }
        return out;
    }

    /**
     * The chain rule: dIj/dx = sum over k of (dIj/dq_k)(dq_k/dx) [A per unit of x].
     *
     * @param partials what {@link #evaluate} gave at the point
     * @param dqdx     what {@link #difference} gave for x; null for none (the sum is 0)
     */
    public static double chain(double[] partials, double[] dqdx) {
        if (dqdx == null) {
            return 0;
        }
        double sum = 0;
        for (int q = FIRST_QUANTITY; q < SIZE; q++) {
            if (dqdx[q] != 0) {
                sum += partials[q] * dqdx[q];
            }
        }
        return sum;
    }

    private static void scaleQuantities(double[] out, double scale) {
        for (int k = FIRST_QUANTITY; k < SIZE; k++) {
            out[k] *= scale;
        }
    }

    private static double gradingFactor(double t, double mHalf) {
        return mHalf == 0.25 ? Math.sqrt(Math.sqrt(t)) : Math.pow(t, mHalf);
    }
}
