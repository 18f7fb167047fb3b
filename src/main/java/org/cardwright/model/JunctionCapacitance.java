package org.cardwright.model;

/**
 * Small-signal capacitance of the intrinsic junction (inside RS) at junction voltage vd, exactly as ngspice 39
 * reports it ({@code @d1[cd]}, and the susceptance of AC analysis divided by the angular frequency): depletion
 * capacitance plus diffusion capacitance.
 *
 * <p>Depletion capacitance of a graded junction, C = CJ (1 - vd/VJ)^(-M) below FC·VJ, continued above it by
 * the straight line C = (CJ/F2)(F3 + M vd/VJ) with F2 = (1 - FC)^(1 + M) and F3 = 1 - FC (1 + M) (the SPICE2
 * form: Nagel, "SPICE2: A computer program to simulate semiconductor circuits", ERL Memo M520, UC Berkeley,
 * 1975; Antognetti &amp; Massobrio, "Semiconductor Device Modeling with SPICE", 2nd ed., McGraw-Hill 1993,
 * ch. 1). Diffusion capacitance TT·g of the charge-control model, with g the conductance ngspice reports
 * ({@link JunctionCurrent#reportedConductance}: after high injection, including GMIN and ngspice's
 * recombination-conductance slip). Equations restated in docs/model.md, "Charge, capacitance and AC".
 */
public final class JunctionCapacitance {
    private JunctionCapacitance() {
    }

    /**
     * Total junction capacitance, depletion plus diffusion [F].
     *
     * @param d  parameters at the device temperature
     * @param vd intrinsic junction voltage [V]
     */
    public static double total(DiodeAtTemperature d, double vd) {
        return depletion(d, vd) + diffusion(d, vd);
    }

    /**
     * Depletion capacitance with the linear continuation above FC·VJ(T) [F]. VJ(T) is the value after
     * ngspice's 1/FC clamp, so with the clamp the threshold is 1 V.
     *
     * @param d  parameters at the device temperature
     * @param vd intrinsic junction voltage [V]
     */
    public static double depletion(DiodeAtTemperature d, double vd) {
        double cj = d.junctionCapacitance();
        if (cj == 0) {
            return 0;
        }
        double vj = d.junctionPotential();
        double m = d.gradingCoefficient();
        double fc = d.forwardCoefficient();
        if (vd < fc * vj) {
            return cj * Math.exp(-m * Math.log(1 - vd / vj));
        }
        double f2 = Math.exp((1 + m) * Math.log(1 - fc));
        double f3 = 1 - fc * (1 + m);
        return cj / f2 * (f3 + m * vd / vj);
    }

    /**
     * Diffusion capacitance TT(T)·g, with g the conductance ngspice reports [F]. In reverse bias this leaves
     * the floor TT·GMIN, as in ngspice.
     *
     * @param d  parameters at the device temperature
     * @param vd intrinsic junction voltage [V]
     */
    public static double diffusion(DiodeAtTemperature d, double vd) {
        double tt = d.transitTime();
        return tt == 0 ? 0 : tt * JunctionCurrent.reportedConductance(d, vd);
    }
}
