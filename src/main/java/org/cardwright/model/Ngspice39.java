package org.cardwright.model;

/**
 * Physical constants and fixed numbers exactly as ngspice 39 uses them, so that the built-in evaluator agrees
 * with the reference simulator to better than 1e-6.
 *
 * <p>ngspice 39 uses the CODATA 2014 pair for k and q (ngspice source {@code src/include/ngspice/const.h});
 * CODATA 2018 differs by 2.8e-5 relative in k/q, which alone moves forward current by about 8e-4 at 0.7 V.
 */
public final class Ngspice39 {
    /** Boltzmann constant, CODATA 2014 [J/K]. */
    public static final double BOLTZMANN = 1.38064852e-23;
    /** Elementary charge, CODATA 2014 [C]. */
    public static final double CHARGE = 1.6021766208e-19;
    /** k/q as ngspice computes it in double precision [V/K]. */
    public static final double K_OVER_Q = BOLTZMANN / CHARGE;
    /** Offset between the Celsius and Kelvin scales [K]. */
    public static final double CELSIUS_TO_KELVIN = 273.15;
    /** Reference temperature of the SPICE temperature laws, 27 degrees C [K]. */
    public static final double REFERENCE_TEMPERATURE = 300.15;
    /** Default conductance in parallel with every junction [S]. */
    public static final double DEFAULT_GMIN = 1e-12;
    /** Default relative tolerance, which also sets the breakdown-knee tolerance [1]. */
    public static final double DEFAULT_RELTOL = 1e-3;
    /** Floor under the saturation current [A]. */
    public static final double EPSMIN = 1e-28;
    /** Largest grading coefficient ngspice 39 accepts before clamping [1]. */
    public static final double GRADING_MAX = 0.9;

    private Ngspice39() {
    }

    /** Thermal voltage kT/q at temperature {@code kelvin} [V]. */
    public static double thermalVoltage(double kelvin) {
        return K_OVER_Q * kelvin;
    }

    /** SPICE silicon band gap Eg(T) = 1.16 - 7.02e-4 T^2/(T + 1108) [eV] (Varshni form as in ngspice). */
    public static double bandGap(double kelvin) {
        return 1.16 - 7.02e-4 * kelvin * kelvin / (kelvin + 1108.0);
    }
}
