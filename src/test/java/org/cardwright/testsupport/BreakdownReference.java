package org.cardwright.testsupport;

/**
 * The breakdown knee of a level-1 diode from the ngspice 39 equations, written here independently of cardwright's
 * model code so that tests can check it against something outside the project: IS(T) with EG 1.11 eV and XTI 3,
 * the breakdown knee loop with RELTOL 1e-3, the cubic reverse region and the breakdown branch, each with GMIN,
 * RS 0: the equations of ngspice 39's diode (src/spicelib/devices/dio/diotemp.c and dioload.c) as the reference
 * notes on them transcribe them, sections 2-4.
 */
public final class BreakdownReference {

    /** k/q [V/K] (CODATA 2014 values, as ngspice 39's constants). */
    public static final double K_OVER_Q = 1.38064852e-23 / 1.6021766208e-19;
    /** ngspice's default GMIN [S]. */
    public static final double GMIN = 1e-12;
    /** ngspice's default RELTOL, which ends the knee loop [1]. */
    public static final double RELTOL = 1e-3;
    /** The nominal temperature, 27 degC [K]. */
    private static final double TNOM = 300.15;

    private BreakdownReference() {
    }

    /** IS at {@code kelvin} from the nominal {@code is} (EG 1.11 eV, XTI 3) [A]. */
    public static double saturation(double is, double n, double kelvin) {
        double vt = K_OVER_Q * kelvin;
        return is * Math.exp((kelvin / TNOM - 1) * 1.11 / (n * vt) + (3 / n) * Math.log(kelvin / TNOM));
    }

    /**
     * |V| of the knee: where the reverse current exceeds the current at 80 % of BV(T) by {@code iref} [V].
     */
    public static double knee(double isNom, double n, double bv, double ibv, double nbv, double kelvin, double iref) {
        double vt = K_OVER_Q * kelvin;
        double is = saturation(isNom, n, kelvin);
        double bvEff = bv;
        if (!(ibv < is * bv / vt)) {
            double x = bv - nbv * vt * Math.log(1 + ibv / is);
            for (int k = 0; k < 25; k++) {
                x = bv - nbv * vt * Math.log(ibv / is + 1 - x / vt);
                double ix = is * (Math.exp((bv - x) / (nbv * vt)) - 1 + x / vt);
                if (Math.abs(ix - ibv) <= RELTOL * ibv) {
                    break;
                }
            }
            bvEff = x;
        }
        double vl = 0.8 * bvEff;
        double leak = vl >= 3 * n * vt ? is * (1 + Math.pow(3 * n * vt / (Math.E * -vl), 3)) + GMIN * vl
                : -(is * (Math.exp(-vl / (n * vt)) - 1) - GMIN * vl);
        double target = iref + leak;
        // |I|(x) = IS exp((x - BV_eff)/(NBV Vt)) + GMIN x beyond the knee, solved for x by fixed-point iteration on
        // x = BV_eff + NBV Vt ln((target - GMIN x)/IS), a contraction since GMIN x is tiny against the target
        double x = bvEff;
        for (int k = 0; k < 100; k++) {
            x = bvEff + nbv * vt * Math.log((target - GMIN * x) / is);
        }
        return x;
    }
}
