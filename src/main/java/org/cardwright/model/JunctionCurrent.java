package org.cardwright.model;

/**
 * DC current through the intrinsic junction (inside RS) as a function of the junction voltage, exactly as
 * ngspice 39 computes it for the level-1 diode: Shockley term, recombination term with its
 * ((1 - vd/VJ)^2 + 0.005)^(M/2) factor, high injection, the cubic reverse region, breakdown and GMIN.
 * Equations: docs/model.md section "DC current"; Shockley, "The theory of p-n junctions in semiconductors and
 * p-n junction transistors", Bell Syst. Tech. J. 28 (1949) 435-489; recombination after Sah, Noyce, Shockley,
 * "Carrier generation and recombination in p-n junctions", Proc. IRE 45 (1957) 1228-1243.
 */
public final class JunctionCurrent {
    /** Below this magnitude ngspice does not apply the knee-current scaling [A]. */
    private static final double KNEE_THRESHOLD = 1e-18;

    private JunctionCurrent() {
    }

    /**
     * Junction current at junction voltage {@code vd} [A].
     *
     * @param d  parameters at the device temperature
     * @param vd intrinsic junction voltage [V]
     */
    public static double current(DiodeAtTemperature d, double vd) {
        return evaluate(d, vd, false);
    }

    private static double gradingFactor(double t, double mHalf) {
        return mHalf == 0.25 ? Math.sqrt(Math.sqrt(t)) : Math.pow(t, mHalf);
    }

    /**
     * Exact derivative dI/dvd of {@link #current} [S]. (ngspice's reported recombination conductance has a
     * known slip; this is the true derivative, used for solving and fitting.)
     *
     * @param d  parameters at the device temperature
     * @param vd intrinsic junction voltage [V]
     */
    public static double conductance(DiodeAtTemperature d, double vd) {
        return evaluate(d, vd, true);
    }

    /**
     * The conductance ngspice 39 reports for the junction ({@code @d1[gd]}, the AC conductance, and the g of
     * its diffusion capacitance TT·g) [S]. It equals {@link #conductance} except where the recombination term
     * (ISR) is active: there ngspice takes the derivative of the factor f = ((1 - vd/VJ)^2 + 0.005)^(M/2)
     * without its 1/VJ and multiplies it by the already scaled current I_rec·f (docs/model.md, "DC current",
     * the reported-conductance quirk). The high-injection derivative and GMIN then apply as usual.
     *
     * @param d  parameters at the device temperature
     * @param vd intrinsic junction voltage [V]
     */
    public static double reportedConductance(DiodeAtTemperature d, double vd) {
        double vte = d.emissionCoefficient() * d.thermalVoltage();
        if (!d.hasRecombination() || vd < -3 * vte) {
            return conductance(d, vd);
        }
        double is = d.saturationCurrent();
        double e = Math.exp(vd / vte);
        double vtr = d.recombinationEmission() * d.thermalVoltage();
        double er = Math.exp(vd / vtr);
        double u = 1 - vd / d.junctionPotential();
        double mHalf = d.gradingCoefficient() / 2;
        double t = u * u + 0.005;
        double f = Math.pow(t, mHalf);
        double irec = d.recombinationCurrent() * (er - 1);
        // ngspice's slip: the derivative of f lacks 1/VJ and multiplies the already scaled current irec·f
        double slippedDf = -d.gradingCoefficient() * u * (f / t);
        double i = is * (e - 1) + irec * f;
        double g = is * e / vte + d.recombinationCurrent() * er / vtr * f + irec * f * slippedDf;
        if (d.hasForwardKnee() && i > KNEE_THRESHOLD) {
            double s = Math.sqrt(i / d.forwardKneeCurrent());
            g = g * (1 + s / 2) / ((1 + s) * (1 + s));
        }
        return g + d.gmin();
    }

    /**
     * Xyce's forward branch: I = In sqrt(IKF/(IKF + In)) + Irec, with In = Shockley + GMIN vd; the
     * recombination current is not scaled (shared/reference/diode-model.md section 8).
     */
    private static double xyceForward(DiodeAtTemperature d, double vd, double shockley, double gShockley,
                                      boolean wantConductance, double[] both) {
        double in = shockley + d.gmin() * vd;
        double gin = gShockley + d.gmin();
        double i = in;
        double g = gin;
        if (d.hasForwardKnee()) {
            double ikf = d.forwardKneeCurrent();
            double root = Math.sqrt(ikf / (ikf + in));
            i = in * root;
            g = gin * root * (1 - in / (2 * (ikf + in)));
        }
        if (d.hasRecombination()) {
            double vtr = d.recombinationEmission() * d.thermalVoltage();
            double er = Math.exp(vd / vtr);
            double u = 1 - vd / d.junctionPotential();
            double mHalf = d.gradingCoefficient() / 2;
            double t = u * u + 0.005;
            double f = Math.pow(t, mHalf);
            double irec = d.recombinationCurrent() * (er - 1);
            i += irec * f;
            g += d.recombinationCurrent() * er / vtr * f - irec * d.gradingCoefficient() * u * (f / t) / d.junctionPotential();
        }
        if (both != null) {
            both[1] = g;
            return i;
        }
        return wantConductance ? g : i;
    }

    /**
     * Current and its exact derivative in one evaluation (the solvers need both at every step).
     *
     * @param d   parameters at the device temperature
     * @param vd  intrinsic junction voltage [V]
     * @param out receives {current [A], conductance [S]}
     */
    public static void currentAndConductance(DiodeAtTemperature d, double vd, double[] out) {
        out[0] = evaluate(d, vd, true, out);
    }

    private static double evaluate(DiodeAtTemperature d, double vd, boolean wantConductance) {
        return evaluate(d, vd, wantConductance, null);
    }

    private static double evaluate(DiodeAtTemperature d, double vd, boolean wantConductance, double[] both) {
        double is = d.saturationCurrent();
        double vt = d.thermalVoltage();
        double vte = d.emissionCoefficient() * vt;
        double i;
        double g;
        if (vd >= -3 * vte || !d.flavour().spiceReverse()) {
            double e = Math.exp(vd / vte);
            i = is * (e - 1);
            g = is * e / vte;
            if (d.flavour().xyceKnee()) {
                return xyceForward(d, vd, i, g, wantConductance, both);
            }
            if (d.hasRecombination()) {
                double vtr = d.recombinationEmission() * vt;
                double er = Math.exp(vd / vtr);
                double u = 1 - vd / d.junctionPotential();
                double mHalf = d.gradingCoefficient() / 2;
                double t = u * u + 0.005;
                double f = gradingFactor(t, mHalf);
                double irec = d.recombinationCurrent() * (er - 1);
                i += irec * f;
                if (wantConductance) {
                    double df = -d.gradingCoefficient() * u * (f / t) / d.junctionPotential();
                    g += d.recombinationCurrent() * er / vtr * f + irec * df;
                }
            }
            if (d.hasForwardKnee() && i > KNEE_THRESHOLD) {
                double s = Math.sqrt(i / d.forwardKneeCurrent());
                g = g * (1 + s / 2) / ((1 + s) * (1 + s));
                i = i / (1 + s);
            }
        } else {
            if (!d.hasBreakdown() || vd >= -d.breakdownVoltage()) {
                double r = 3 * vte / (Math.E * vd);
                double a = r * r * r;
                i = -is * (1 + a);
                g = 3 * is * a / vd;
            } else {
                double vb = d.breakdownEmission() * vt;
                double ev = Math.exp(-(d.breakdownVoltage() + vd) / vb);
                i = -is * ev;
                g = is * ev / vb;
            }
            if (d.hasReverseKnee() && i < -KNEE_THRESHOLD) {
                double s = Math.sqrt(-i / d.reverseKneeCurrent());
                g = g * (1 + s / 2) / ((1 + s) * (1 + s));
                i = i / (1 + s);
            }
        }
        i += d.gmin() * vd;
        g += d.gmin();
        if (both != null) {
            both[1] = g;
            return i;
        }
        return wantConductance ? g : i;
    }
}
