package org.cardwright.data;

/**
 * One reverse-recovery measurement: forward current before switching, reverse current during recovery (a
 * negative number in the anode-to-cathode convention), the measured recovery time, and the temperature.
 *
 * @param forwardCurrent forward current, positive [A]
 * @param reverseCurrent reverse current, negative [A]
 * @param recoveryTime   measured recovery time, positive [s]
 * @param temperature    device temperature [K]
 * @param line           physical line in the file
 */
public record RecoveryRecord(double forwardCurrent, double reverseCurrent, double recoveryTime, double temperature,
                             int line) {
    public RecoveryRecord {
        if (!(forwardCurrent > 0) || !(reverseCurrent < 0) || !(recoveryTime > 0) || !(temperature > 0)
                || !Double.isFinite(forwardCurrent) || !Double.isFinite(reverseCurrent) || !Double.isFinite(recoveryTime)) {
            throw new IllegalArgumentException("a recovery record needs IF > 0, IR < 0, trr > 0 and T > 0 K");
        }
    }
}
