package org.cardwright.verify;

import java.util.List;

/**
 * The outcome of re-simulating a card at every measured point.
 *
 * @param cardName        model name
 * @param engine          description of the engine that simulated it
 * @param tolerance       limits applied
 * @param perTemperature  summary per temperature
 * @param points          every point with its residual, in input order
 * @param notes           things the user must know (points set aside, and why)
 */
public record Verification(String cardName, String engine, Tolerance tolerance, List<TemperatureVerdict> perTemperature,
                           List<PointResidual> points, List<String> notes) {
    public Verification {
        perTemperature = List.copyOf(perTemperature);
        points = List.copyOf(points);
        notes = List.copyOf(notes);
    }

    /** True when every temperature passes. */
    public boolean pass() {
        return !perTemperature.isEmpty() && perTemperature.stream().allMatch(TemperatureVerdict::pass);
    }
}
