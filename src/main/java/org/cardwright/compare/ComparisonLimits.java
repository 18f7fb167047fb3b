package org.cardwright.compare;

/**
 * When two cards count as different.
 *
 * @param forwardVoltage      largest forward-voltage difference that counts as agreement [V]
 * @param leakageFactor       largest ratio of two leakage currents that counts as agreement [1]
 * @param capacitanceRelative largest relative capacitance difference that counts as agreement [1]
 * @param breakdownRelative   largest relative breakdown-voltage difference that counts as agreement [1]
 */
public record ComparisonLimits(double forwardVoltage, double leakageFactor, double capacitanceRelative,
                               double breakdownRelative) {
    public ComparisonLimits {
        if (!(forwardVoltage > 0) || !(leakageFactor > 1) || !(capacitanceRelative > 0) || !(breakdownRelative > 0)) {
            throw new IllegalArgumentException("comparison limits must be positive (the leakage factor above 1)");
        }
    }
}
