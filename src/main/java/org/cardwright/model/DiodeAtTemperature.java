package org.cardwright.model;

/**
 * The level-1 diode's parameters after ngspice 39's temperature update, at one device temperature.
 * Built by {@link TemperatureLaws#at}; every field is what the DC and charge equations use directly.
 *
 * @param temperature           device temperature [K]
 * @param thermalVoltage        kT/q at {@code temperature} [V]
 * @param saturationCurrent     IS(T) [A]
 * @param emissionCoefficient   N [1]
 * @param recombinationCurrent  ISR(T) [A]; 0 when ISR is not given
 * @param recombinationEmission NR [1]
 * @param forwardKneeCurrent    IKF [A]; +infinity when IKF is not given
 * @param reverseKneeCurrent    IKR [A]; +infinity when IKR is not given
 * @param seriesResistance      RS(T) [ohm]
 * @param breakdownVoltage      effective breakdown voltage after the knee iteration, positive [V];
 *                              +infinity when BV is not given
 * @param breakdownEmission     NBV [1]
 * @param junctionPotential     VJ(T), after the FC clamp [V]
 * @param gradingCoefficient    M(T), after the 0.9 clamp [1]
 * @param junctionCapacitance   CJ(T) [F]
 * @param forwardCoefficient    FC [1]
 * @param transitTime           TT(T) [s]
 * @param gmin                  parallel conductance [S]
 * @param gradingClamped        true when ngspice would clamp M to 0.9 (and warn)
 * @param potentialClamped      true when ngspice would clamp VJ(T) to 1/FC (and warn)
 * @param capacitanceF1         F1 of the linear capacitance extension above FC·VJ, from the unclamped VJ(T) [V]
 * @param flavour               whose equations evaluate the junction
 */
public record DiodeAtTemperature(
        double temperature,
        double thermalVoltage,
        double saturationCurrent,
        double emissionCoefficient,
        double recombinationCurrent,
        double recombinationEmission,
        double forwardKneeCurrent,
        double reverseKneeCurrent,
        double seriesResistance,
        double breakdownVoltage,
        double breakdownEmission,
        double junctionPotential,
        double gradingCoefficient,
        double junctionCapacitance,
        double forwardCoefficient,
        double transitTime,
        double gmin,
        boolean gradingClamped,
        boolean potentialClamped,
        double capacitanceF1,
        Flavour flavour) {

    /** True when the recombination term (ISR) is active. */
    public boolean hasRecombination() {
        return recombinationCurrent > 0;
    }

    /** True when high-injection (IKF) is active. */
    public boolean hasForwardKnee() {
        return Double.isFinite(forwardKneeCurrent);
    }

    /** True when the reverse knee (IKR) is active. */
    public boolean hasReverseKnee() {
        return Double.isFinite(reverseKneeCurrent);
    }

    /** True when the breakdown region (BV) is active. */
    public boolean hasBreakdown() {
        return Double.isFinite(breakdownVoltage);
    }
}
