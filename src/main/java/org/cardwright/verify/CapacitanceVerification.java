package org.cardwright.verify;

import java.util.List;

/**
 * The outcome of re-simulating a card's capacitance at every measured C-V point.
 *
 * @param cardName         model name
 * @param engine           description of the engine that simulated it
 * @param tolerance        limits applied
 * @param strayCapacitance stray capacitance subtracted from every reading [F]
 * @param frequency        test-signal frequency simulated [Hz]
 * @param perTemperature   summary per temperature
 * @param points           every point with its residual, in input order
 * @param notes            things the user must know
 */
public record CapacitanceVerification(String cardName, String engine, CapacitanceTolerance tolerance,
                                      double strayCapacitance, double frequency,
                                      List<CapacitanceVerdict> perTemperature, List<CapacitanceResidual> points,
                                      List<String> notes) {
    public CapacitanceVerification {
        perTemperature = List.copyOf(perTemperature);
        points = List.copyOf(points);
        notes = List.copyOf(notes);
    }

    /** True when every temperature passes. */
    public boolean pass() {
        return !perTemperature.isEmpty() && perTemperature.stream().allMatch(CapacitanceVerdict::pass);
    }
}
