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

    /**
     * Parallel capacitance at the terminals, as an LCR meter in parallel mode reads it: with the junction
     * admittance Y_j = g + jB (B = 2 pi f C, g from {@link JunctionCurrent#reportedConductance}) in series
     * with RS(T), Y = Y_j/(1 + RS Y_j) and Im(Y)/(2 pi f) = C/((1 + RS g)^2 + (RS B)^2) [F]. Without RS this
     * is {@link #total} at the terminal voltage.
     *
     * @param d               parameters at the device temperature
     * @param terminalVoltage DC terminal voltage, anode to cathode [V]
     * @param frequency       test-signal frequency, positive [Hz]
     */
    public static double terminalParallel(DiodeAtTemperature d, double terminalVoltage, double frequency) {
        double rs = d.seriesResistance();
        double vd = junctionVoltage(d, terminalVoltage);
        double c = total(d, vd);
        if (rs == 0) {
            return c;
        }
        double g = JunctionCurrent.reportedConductance(d, vd);
        double real = 1 + rs * g;
        double imag = rs * 2 * Math.PI * frequency * c;
        return c / (real * real + imag * imag);
    }

    /**
     * Junction voltage vd inside RS(T) at DC terminal voltage {@code terminalVoltage} [V]: the terminal voltage
     * itself without RS, else V - RS·I(V) from {@link DiodeSolver#currentAtVoltage}.
     *
     * @param d               parameters at the device temperature
     * @param terminalVoltage DC terminal voltage, anode to cathode [V]
     */
    public static double junctionVoltage(DiodeAtTemperature d, double terminalVoltage) {
        double rs = d.seriesResistance();
        return rs == 0 ? terminalVoltage : terminalVoltage - rs * DiodeSolver.currentAtVoltage(d, terminalVoltage);
    }
}
