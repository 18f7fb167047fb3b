package org.cardwright.compare;

import java.util.List;

/**
 * Two cards compared.
 *
 * @param nameA       first card's model name and source
 * @param nameB       second card's model name and source
 * @param engine      the engine that simulated both
 * @param parameters  parameter table
 * @param forward     forward voltage at each decade of current at each temperature
 * @param leakage     reverse current at each leakage voltage at each temperature
 * @param capacitance small-signal capacitance at each bias at each temperature
 * @param breakdown   reverse voltage at the breakdown reference current at each temperature, when a card has BV
 * @param notes       what was left out and why
 */
public record CardComparison(String nameA, String nameB, String engine, List<ParameterRow> parameters,
                             List<ForwardRow> forward, List<LeakageRow> leakage, List<CapacitanceRow> capacitance,
                             List<BreakdownRow> breakdown, List<String> notes) {
    public CardComparison {
        parameters = List.copyOf(parameters);
        forward = List.copyOf(forward);
        leakage = List.copyOf(leakage);
        capacitance = List.copyOf(capacitance);
        breakdown = List.copyOf(breakdown);
        notes = List.copyOf(notes);
    }

    /**
     * One parameter of either card.
     *
     * @param keyword the SPICE keyword
     * @param a       card A's value as its card would write it, or empty when not given
     * @param b       card B's value, or empty
     */
    public record ParameterRow(String keyword, String a, String b) {
    }

    /**
     * @param temperature device temperature [K]
     * @param current     forward current [A]
     * @param a           card A's terminal voltage [V]
     * @param b           card B's terminal voltage [V]
     * @param flagged     true when |b - a| exceeds the limit
     */
    public record ForwardRow(double temperature, double current, double a, double b, boolean flagged) {
        /** B minus A [V]. */
        public double difference() {
            return b - a;
        }
    }

    /**
     * @param temperature device temperature [K]
     * @param voltage     reverse voltage, positive [V]
     * @param a           card A's reverse current, positive [A]
     * @param b           card B's reverse current, positive [A]
     * @param flagged     true when either current exceeds the other by more than the limit's factor
     */
    public record LeakageRow(double temperature, double voltage, double a, double b, boolean flagged) {
        /** Card B's current divided by card A's [1]. */
        public double ratio() {
            return b / a;
        }
    }

    /**
     * @param temperature device temperature [K]
     * @param reverseVoltage reverse DC voltage, a positive magnitude (0 at zero bias) [V]
     * @param a           card A's capacitance [F]
     * @param b           card B's capacitance [F]
     * @param flagged     true when the relative difference exceeds the limit
     */
    public record CapacitanceRow(double temperature, double reverseVoltage, double a, double b, boolean flagged) {
        /** (B - A)/A, with A taken as at least 1 fF so that two cards without capacitance compare as equal [1]. */
        public double relative() {
            return (b - a) / Math.max(Math.abs(a), 1e-15);
        }
    }

    /**
     * @param temperature device temperature [K]
     * @param current     the reverse reference current, positive [A]
     * @param a           card A's reverse voltage where its reverse current exceeds its leakage below the knee by
     *                    {@code current}, positive; NaN when A has no BV [V]
     * @param b           card B's, likewise [V]
     * @param flagged     true when only one card breaks down or the relative difference exceeds the limit
     */
    public record BreakdownRow(double temperature, double current, double a, double b, boolean flagged) {
    }

    /** Number of flagged rows over all sections. */
    public long flaggedCount() {
        return forward.stream().filter(ForwardRow::flagged).count() + leakage.stream().filter(LeakageRow::flagged).count()
                + capacitance.stream().filter(CapacitanceRow::flagged).count()
                + breakdown.stream().filter(BreakdownRow::flagged).count();
    }
}
