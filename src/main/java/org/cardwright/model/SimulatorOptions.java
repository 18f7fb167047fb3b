package org.cardwright.model;

/**
 * Circuit-level numbers that change the diode's equations: the parallel GMIN conductance and RELTOL, which
 * ngspice 39 also uses as the tolerance of its breakdown-knee iteration.
 *
 * @param gmin    conductance in parallel with the junction, inside RS [S]
 * @param reltol  relative tolerance of the breakdown-knee iteration [1]
 * @param flavour whose equations evaluate the card
 */
public record SimulatorOptions(double gmin, double reltol, Flavour flavour) {
    /** The ngspice 39 defaults: GMIN 1e-12 S, RELTOL 1e-3. */
    public static final SimulatorOptions NGSPICE_DEFAULTS =
            new SimulatorOptions(Ngspice39.DEFAULT_GMIN, Ngspice39.DEFAULT_RELTOL, Flavour.NGSPICE_39);

    /** ngspice 39's equations with the given GMIN [S] and RELTOL [1]. */
    public SimulatorOptions(double gmin, double reltol) {
        this(gmin, reltol, Flavour.NGSPICE_39);
    }

    public SimulatorOptions {
        if (flavour == null) {
            throw new IllegalArgumentException("a flavour is required");
        }
        if (!(gmin >= 0) || !Double.isFinite(gmin)) {
            throw new IllegalArgumentException("gmin must be a finite number >= 0, got " + gmin);
        }
        if (!(reltol > 0 && reltol < 1)) {
            throw new IllegalArgumentException("reltol must lie in (0, 1), got " + reltol);
        }
    }
}
