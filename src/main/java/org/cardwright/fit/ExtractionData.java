package org.cardwright.fit;

import java.util.List;

/**
 * Everything measured on one part, sorted by kind, in SI units with per-point uncertainties.
 *
 * @param forward     forward I-V points (positive current)
 * @param reverse     reverse I-V points (negative voltage and current): leakage and breakdown
 * @param capacitance C-V points
 * @param recovery    reverse-recovery records
 */
public record ExtractionData(List<FitPoint> forward, List<ReversePoint> reverse, List<CapacitancePoint> capacitance,
                             List<RecoveryPoint> recovery) {
    public ExtractionData {
        forward = List.copyOf(forward);
        reverse = List.copyOf(reverse);
        capacitance = List.copyOf(capacitance);
        recovery = List.copyOf(recovery);
    }

    /** Forward data only. */
    public static ExtractionData forwardOnly(List<FitPoint> forward) {
        return new ExtractionData(forward, List.of(), List.of(), List.of());
    }

    /** True when nothing at all was given. */
    public boolean isEmpty() {
        return forward.isEmpty() && reverse.isEmpty() && capacitance.isEmpty() && recovery.isEmpty();
    }
}
