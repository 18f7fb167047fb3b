package org.cardwright.model;

/**
 * The SPICE level-1 diode temperature update exactly as ngspice 39 performs it (ngspice source
 * {@code src/spicelib/devices/dio/diotemp.c}; equations restated in docs/model.md).
 *
 * <p>Saturation-current law: IS(T) = IS exp[(T/Tnom - 1) EG/(N Vt) + (XTI/N) ln(T/Tnom)] (ngspice manual,
 * junction-diode temperature equations; Antognetti &amp; Massobrio, "Semiconductor Device Modeling with SPICE",
 * 2nd ed., McGraw-Hill 1993). Junction potential and capacitance: the SPICE3 form (TLEVC = 0) built on the
 * band gap Eg(T) = 1.16 - 7.02e-4 T^2/(T + 1108) eV (Varshni, Physica 34 (1967) 149).
 */
public final class TemperatureLaws {
    /** Band gap of silicon at the 300.15 K reference, as the constant ngspice writes [eV]. */
    private static final double BAND_GAP_AT_REFERENCE = 1.1150877;
    /** Capacitance temperature coefficient of the SPICE3 law [1/K]. */
    private static final double CAPACITANCE_TEMPCO = 4e-4;
    /** Largest number of breakdown-knee iterations ngspice 39 performs. */
    private static final int KNEE_ITERATIONS = 25;

    private TemperatureLaws() {
    }

    /**
     * The parameters in force at device temperature {@code kelvin}.
     *
     * @param p       the card's parameters
     * @param kelvin  device temperature [K]
     * @param options GMIN and RELTOL
     */
    public static DiodeAtTemperature at(DiodeParameters p, double kelvin, SimulatorOptions options) {
        if (!(kelvin > 0)) {
            throw new IllegalArgumentException("temperature must be above 0 K, got " + kelvin);
        }
        double t = kelvin;
        double tnom = p.nominalTemperature();
        double dt = t - tnom;
        double kq = options.flavour().kOverQ();
        double vt = kq * t;
        double n = p.get(Param.N);

        double is = saturationCurrentAt(p.get(Param.IS), n, p.get(Param.EG), p.get(Param.XTI), t, tnom, kq);
        double isr = 0;
        double nr = p.get(Param.NR);
        if (p.isGiven(Param.ISR)) {
            isr = saturationCurrentAt(p.get(Param.ISR), nr, p.get(Param.EG), p.get(Param.XTI), t, tnom, kq);
        }
        double rs = p.get(Param.RS) * (1 + p.get(Param.TRS1) * dt + p.get(Param.TRS2) * dt * dt);

        // grading coefficient, clamped at 0.9 as ngspice 39 does (even at T = Tnom)
        double m = p.get(Param.M);
        boolean mClamped = m > Ngspice39.GRADING_MAX;
        if (mClamped) {
            m = Ngspice39.GRADING_MAX;
        }

        // junction potential and capacitance, SPICE3 law (TLEVC = 0)
        double vj = p.get(Param.VJ);
        double phiNom = potentialShift(tnom, kq);
        double vj0 = (vj - phiNom) * Ngspice39.REFERENCE_TEMPERATURE / tnom;
        double vjT = potentialShift(t, kq) + t / Ngspice39.REFERENCE_TEMPERATURE * vj0;
        double gOld = (vj - vj0) / vj0;
        double gNew = (vjT - vj0) / vj0;
        double cjT = p.get(Param.CJO)
                / (1 + m * (CAPACITANCE_TEMPCO * (tnom - Ngspice39.REFERENCE_TEMPERATURE) - gOld))
                * (1 + m * (CAPACITANCE_TEMPCO * (t - Ngspice39.REFERENCE_TEMPERATURE) - gNew));
        if (!options.flavour().scalesCapacitance()) {
            // gnucap 2017: no temperature scaling of the junction potential and capacitance
            vjT = vj;
            cjT = p.get(Param.CJO);
        }
        double fc = p.get(Param.FC);
        double f1 = vjT * (1 - Math.pow(1 - fc, 1 - m)) / (1 - m);
        boolean vjClamped = fc * vjT > 1;
        if (vjClamped) {
            vjT = 1 / fc;
        }

        double bvEff = Double.POSITIVE_INFINITY;
        double nbv = p.get(Param.NBV);
        if (p.isGiven(Param.BV) && options.flavour().spiceReverse()) {
            double bv = p.get(Param.BV);
            double tcv = p.get(Param.TCV);
            double bvT = p.get(Param.TLEV) == 0 ? bv - tcv * dt : bv * (1 - tcv * dt);
            bvEff = breakdownKnee(bvT, p.get(Param.IBV), is, nbv, vt, options.reltol());
        }

        return new DiodeAtTemperature(t, vt, is, n, isr, nr,
                p.isGiven(Param.IKF) ? p.get(Param.IKF) : Double.POSITIVE_INFINITY,
                p.isGiven(Param.IKR) ? p.get(Param.IKR) : Double.POSITIVE_INFINITY,
                rs, bvEff, nbv, vjT, m, cjT, fc, p.get(Param.TT), options.gmin(), mClamped, vjClamped, f1,
                options.flavour());
    }

    /**
     * IS(T) = IS exp[(T/Tnom - 1) EG/(N Vt) + (XTI/N) ln(T/Tnom)] [A]; the same law serves ISR with NR.
     *
     * @param isNominal saturation current at Tnom [A]
     * @param emission  N (or NR) [1]
     * @param eg        activation energy [eV]
     * @param xti       temperature exponent [1]
     * @param t         device temperature [K]
     * @param tnom      nominal temperature [K]
     */
    public static double saturationCurrentAt(double isNominal, double emission, double eg, double xti,
                                             double t, double tnom) {
        return saturationCurrentAt(isNominal, emission, eg, xti, t, tnom, Ngspice39.K_OVER_Q);
    }

    /**
     * The same law with an explicit k/q, for simulators and references that use other constants.
     *
     * @param kOverQ Boltzmann constant over elementary charge [V/K]
     */
    public static double saturationCurrentAt(double isNominal, double emission, double eg, double xti,
                                             double t, double tnom, double kOverQ) {
        double vt = kOverQ * t;
        double ratio = t / tnom;
        return isNominal * Math.exp((ratio - 1) * eg / (emission * vt) + xti / emission * Math.log(ratio));
    }

    /** phi(T) = -3 Vt ln(T/Tref) + Eg(T) - 1.1150877 T/Tref, the SPICE3 junction-potential shift [V]. */
    private static double potentialShift(double t, double kOverQ) {
        double vt = kOverQ * t;
        double ratio = t / Ngspice39.REFERENCE_TEMPERATURE;
        return -3 * vt * Math.log(ratio) + Ngspice39.bandGap(t) - BAND_GAP_AT_REFERENCE * ratio;
    }

    /**
     * Effective breakdown voltage after ngspice 39's knee adjustment (a fixed-point iteration that makes the
     * current at -BV equal IBV to within RELTOL·IBV, at most 25 steps, kept even when not converged).
     *
     * @param bvT    BV at the device temperature [V]
     * @param ibv    current at breakdown [A]
     * @param is     IS(T) [A]
     * @param nbv    breakdown emission coefficient [1]
     * @param vt     thermal voltage [V]
     * @param reltol the knee tolerance, RELTOL [1]
     * @return effective breakdown voltage [V]
     */
    public static double breakdownKnee(double bvT, double ibv, double is, double nbv, double vt, double reltol) {
        double cbv = ibv;
        if (cbv < is * bvT / vt) {
            return bvT;
        }
        double tol = reltol * cbv;
        double vb = nbv * vt;
        double x = bvT - vb * Math.log(1 + cbv / is);
        for (int i = 0; i < KNEE_ITERATIONS; i++) {
            x = bvT - vb * Math.log(cbv / is + 1 - x / vt);
            double ix = is * (Math.exp((bvT - x) / vb) - 1 + x / vt);
            if (Math.abs(ix - cbv) <= tol) {
                break;
            }
        }
        return x;
    }
}
