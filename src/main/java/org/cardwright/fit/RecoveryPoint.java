package org.cardwright.fit;

/**
 * One reverse-recovery record: the diode carries {@code forwardCurrent}, is switched to a reverse current of
 * magnitude {@code reverseCurrent}, and the measured recovery (storage) time is {@code recoveryTime}.
 *
 * @param forwardCurrent forward current before switching, positive [A]
 * @param reverseCurrent reverse current during recovery, as a positive magnitude [A]
 * @param recoveryTime   measured recovery time [s]
 * @param temperature    device temperature [K]
 * @param sigma          1-sigma uncertainty of the recovery time [s]
 * @param source         the file it came from
 * @param line           the line in that file
 */
public record RecoveryPoint(double forwardCurrent, double reverseCurrent, double recoveryTime, double temperature,
                            double sigma, String source, int line) {
    public RecoveryPoint {
        if (!(forwardCurrent > 0) || !(reverseCurrent > 0) || !(recoveryTime > 0) || !(temperature > 0) || !(sigma > 0)) {
            throw new IllegalArgumentException("a recovery record needs positive IF, |IR|, trr, temperature and uncertainty");
        }
    }

    /**
     * The charge-control factor ln(1 + IF/IR) that multiplies the transit time [1]: storage time
     * ts = TT ln(1 + IF/IR) (Kingston, "Switching time in junction diodes and junction transistors", Proc. IRE
     * 42 (1954) 829-834; citation recalled).
     */
    public double chargeControlFactor() {
        return Math.log1p(forwardCurrent / reverseCurrent);
    }
}
