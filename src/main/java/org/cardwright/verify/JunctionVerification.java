package org.cardwright.verify;

import java.util.List;
import java.util.Optional;

/**
 * Verification of every data kind given: each section with its own residual unit and limits.
 *
 * @param forward     forward I-V, residuals in mV
 * @param breakdown   reverse breakdown, residuals in mV against limits scaled to the breakdown voltage
 * @param capacitance C-V, residuals in %
 * @param recovery    reverse-recovery records, residuals in ns
 * @param leakage     reverse leakage below breakdown, residuals in decades of current
 * @param notes       things the user must know (points set aside, leakage far above the model, ...)
 */
public record JunctionVerification(Optional<Verification> forward, Optional<Verification> breakdown,
                                   Optional<CapacitanceVerification> capacitance,
                                   Optional<RecoveryVerification> recovery, Optional<LeakageVerification> leakage,
                                   List<String> notes) {
    public JunctionVerification {
        notes = List.copyOf(notes);
    }

    /** True when at least one section was verified and every verified section passes. */
    public boolean pass() {
        boolean any = forward.isPresent() || breakdown.isPresent() || capacitance.isPresent() || recovery.isPresent()
                || leakage.isPresent();
        return any && forward.map(Verification::pass).orElse(true) && breakdown.map(Verification::pass).orElse(true)
                && capacitance.map(CapacitanceVerification::pass).orElse(true)
                && recovery.map(RecoveryVerification::pass).orElse(true)
                && leakage.map(LeakageVerification::pass).orElse(true);
    }
}
