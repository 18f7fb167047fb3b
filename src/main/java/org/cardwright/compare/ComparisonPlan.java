package org.cardwright.compare;

import java.util.List;

/**
 * Where to compare two cards. One sign convention for every bias: a reverse-bias quantity (leakage voltage,
 * capacitance voltage, breakdown current) is a positive magnitude, as a datasheet writes VR and IR.
 *
 * @param temperatures        device temperatures [K]
 * @param lowestCurrent       first decade of forward current [A]
 * @param highestCurrent      last decade of forward current [A]
 * @param leakageVoltages     reverse voltages for leakage, positive magnitudes [V]
 * @param capacitanceVoltages reverse voltages for capacitance, positive magnitudes (0 for zero bias) [V]
 * @param breakdownCurrent    the breakdown reference current, a positive magnitude; NaN for the cards' own IBV [A]
 * @param frequency           capacitance test frequency [Hz]
 * @param limits              when a difference is flagged
 */
public record ComparisonPlan(List<Double> temperatures, double lowestCurrent, double highestCurrent,
                             List<Double> leakageVoltages, List<Double> capacitanceVoltages, double breakdownCurrent,
                             double frequency, ComparisonLimits limits) {
    /** LCR meters test small junction capacitance at 1 MHz (common practice, no source) [Hz]. */
    public static final double DEFAULT_FREQUENCY = 1e6;

    public ComparisonPlan {
        temperatures = List.copyOf(temperatures);
        leakageVoltages = List.copyOf(leakageVoltages);
        capacitanceVoltages = List.copyOf(capacitanceVoltages);
        if (temperatures.isEmpty() || temperatures.stream().anyMatch(t -> !(t > 0))) {
            throw new IllegalArgumentException("at least one temperature above 0 K is needed");
        }
        if (!(lowestCurrent > 0) || !(highestCurrent >= lowestCurrent)) {
            throw new IllegalArgumentException("the current range must be positive and rising");
        }
        if (leakageVoltages.stream().anyMatch(v -> !(v > 0) || Double.isInfinite(v))) {
            throw new IllegalArgumentException("leakage voltages are reverse voltages given as positive magnitudes");
        }
        if (capacitanceVoltages.stream().anyMatch(v -> !(v >= 0) || Double.isInfinite(v))) {
            throw new IllegalArgumentException("capacitance voltages are reverse voltages given as magnitudes, 0 or more");
        }
        if (!Double.isNaN(breakdownCurrent) && !(breakdownCurrent > 0 && Double.isFinite(breakdownCurrent))) {
            throw new IllegalArgumentException("the breakdown current is a reverse current given as a positive magnitude");
        }
        if (!(frequency > 0)) {
            throw new IllegalArgumentException("the capacitance frequency must be positive");
        }
    }

    /** As the canonical constructor, with the breakdown reference current taken from the cards' IBV. */
    public ComparisonPlan(List<Double> temperatures, double lowestCurrent, double highestCurrent,
                          List<Double> leakageVoltages, List<Double> capacitanceVoltages, double frequency,
                          ComparisonLimits limits) {
        this(temperatures, lowestCurrent, highestCurrent, leakageVoltages, capacitanceVoltages, Double.NaN, frequency,
                limits);
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
