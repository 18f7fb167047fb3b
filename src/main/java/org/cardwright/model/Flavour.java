package org.cardwright.model;

/**
 * Whose equations: the level-1 diode as ngspice 39, Xyce, or gnucap 2017 compute it. Parameters keep their
 * ngspice meaning everywhere in cardwright; a flavour changes only how they are evaluated
 * (shared/reference/diode-model.md sections 8 and 9, and docs/dialects.md).
 *
 * <ul>
 *   <li>Constants: ngspice 39 uses the CODATA 2014 k and q; Xyce and gnucap keep the older pair
 *       k = 1.3806226e-23 J/K, q = 1.6021918e-19 C, whose k/q is 2.8e-5 lower.</li>
 *   <li>High injection: ngspice divides the whole junction current by 1 + sqrt(I/IKF); Xyce multiplies the
 *       Shockley current (with GMIN) by sqrt(IKF/(IKF + I)) and leaves the recombination current alone.</li>
 *   <li>Reverse bias: ngspice and Xyce have the cubic reverse region and breakdown; gnucap's default diode
 *       uses the Shockley expression at every bias and has no breakdown and no GMIN.</li>
 * </ul>
 * Xyce is not packaged for Debian, so its flavour follows the reading of its source recorded in the reference,
 * not a run of Xyce.
 */
public enum Flavour {
    /** ngspice 39, the reference simulator. */
    NGSPICE_39("ngspice 39", Ngspice39.K_OVER_Q, false, true, Ngspice39.DEFAULT_GMIN),
    /** Berkeley SPICE3f5: ngspice's equations with the older constants. */
    SPICE3F5("SPICE3f5", OlderConstants.K_OVER_Q, false, true, Ngspice39.DEFAULT_GMIN),
    /** Xyce levels 1 and 2 (current releases). */
    XYCE("Xyce", OlderConstants.K_OVER_Q, true, true, Ngspice39.DEFAULT_GMIN),
    /**
     * gnucap 2017.10.03 with default FLAGS. It has no GMIN in the diode, but it connects 1e-12 S from every node
     * to ground, which for a diode to ground acts as the same parallel conductance (found by running gnucap). It
     * does not scale CJO or VJ (PB) with temperature; RS has no temperature coefficient in gnucap's card at all.
     */
    GNUCAP_2017("gnucap 2017", OlderConstants.K_OVER_Q, false, false, Ngspice39.DEFAULT_GMIN);

    private final String label;
    private final double kOverQ;
    private final boolean xyceKnee;
    private final boolean spiceReverse;
    private final double gmin;

    Flavour(String label, double kOverQ, boolean xyceKnee, boolean spiceReverse, double gmin) {
        this.label = label;
        this.kOverQ = kOverQ;
        this.xyceKnee = xyceKnee;
        this.spiceReverse = spiceReverse;
        this.gmin = gmin;
    }

    /** For messages and card headers. */
    public String label() {
        return label;
    }

    /** Boltzmann constant over elementary charge as this simulator uses it [V/K]. */
    public double kOverQ() {
        return kOverQ;
    }

    /** True for Xyce's high-injection law. */
    public boolean xyceKnee() {
        return xyceKnee;
    }

    /** True when CJO and VJ follow the SPICE3 temperature law; gnucap 2017 keeps them at their TNOM values. */
    public boolean scalesCapacitance() {
        return this != GNUCAP_2017;
    }

    /** True when reverse bias has SPICE's cubic region and breakdown; false: the Shockley expression throughout. */
    public boolean spiceReverse() {
        return spiceReverse;
    }

    /** The simulator's default parallel conductance [S]. */
    public double defaultGmin() {
        return gmin;
    }

    /** Default options for this flavour: its GMIN and a RELTOL of 1e-3. */
    public SimulatorOptions options() {
        return new SimulatorOptions(gmin, Ngspice39.DEFAULT_RELTOL, this);
    }

    /** The pre-2014 constants that SPICE3f5, Xyce and gnucap keep. */
    public static final class OlderConstants {
        /** Boltzmann constant [J/K]. */
        public static final double BOLTZMANN = 1.3806226e-23;
        /** Elementary charge [C]. */
        public static final double CHARGE = 1.6021918e-19;
        /** k/q [V/K]. */
        public static final double K_OVER_Q = BOLTZMANN / CHARGE;

        private OlderConstants() {
        }
    }
}
