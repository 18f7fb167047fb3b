package org.cardwright.compare;

import java.util.List;

/**
 * Where to compare two cards.
 *
 * @param temperatures      device temperatures [K]
 * @param lowestCurrent     first decade of forward current [A]
 * @param highestCurrent    last decade of forward current [A]
 * @param leakageVoltages   reverse voltages for leakage, positive numbers [V]
 * @param capacitanceBiases DC biases for capacitance, anode to cathode (reverse negative) [V]
 * @param frequency         capacitance test frequency [Hz]
 * @param limits            when a difference is flagged
 */
public record ComparisonPlan(List<Double> temperatures, double lowestCurrent, double highestCurrent,
                             List<Double> leakageVoltages, List<Double> capacitanceBiases, double frequency,
                             ComparisonLimits limits) {
    /** LCR meters test small junction capacitance at 1 MHz (common practice, no source) [Hz]. */
    public static final double DEFAULT_FREQUENCY = 1e6;

    public ComparisonPlan {
        temperatures = List.copyOf(temperatures);
        leakageVoltages = List.copyOf(leakageVoltages);
        capacitanceBiases = List.copyOf(capacitanceBiases);
        if (temperatures.isEmpty() || temperatures.stream().anyMatch(t -> !(t > 0))) {
            throw new IllegalArgumentException("at least one temperature above 0 K is needed");
        }
        if (!(lowestCurrent > 0) || !(highestCurrent >= lowestCurrent)) {
            throw new IllegalArgumentException("the current range must be positive and rising");
        }
        if (leakageVoltages.stream().anyMatch(v -> !(v > 0))) {
            throw new IllegalArgumentException("leakage voltages are given as positive reverse voltages");
        }
        if (!(frequency > 0)) {
            throw new IllegalArgumentException("the capacitance frequency must be positive");
        }
    }

    /** The forward currents: every decade from the lowest to the highest [A]. */
    public List<Double> decades() {
        int first = (int) Math.round(Math.log10(lowestCurrent));
        int last = (int) Math.round(Math.log10(highestCurrent));
        java.util.ArrayList<Double> out = new java.util.ArrayList<>();
        for (int k = first; k <= last; k++) {
            out.add(Double.parseDouble("1e" + k));
        }
        return out;
    }
}
