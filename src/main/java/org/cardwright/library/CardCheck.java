package org.cardwright.library;

import java.util.Optional;
import org.cardwright.verify.Verification;

/**
 * The check of one card of a library against its part's data.
 *
 * @param device       device file, relative to the library root
 * @param model        model name (the device file's name when it could not be read)
 * @param card         card file, relative to the library root (the device file when there is no card to name)
 * @param status       the verdict
 * @param message      one line for the user
 * @param verification the re-simulation, when one ran
 * @param seconds      time spent [s]
 */
public record CardCheck(String device, String model, String card, Status status, String message,
                        Optional<Verification> verification, double seconds) {
    /** Verdicts. */
    public enum Status {
        /** The card reproduces its data within the part's tolerances and was built from the current inputs. */
        PASS,
        /** The card does not reproduce its data within the part's tolerances. */
        FAIL,
        /** The card reproduces its data, but the device file, data or templates changed since it was built. */
        OUTDATED,
        /** The card does not exist. */
        MISSING,
        /** The device file, the card or the data could not be read, or the simulator failed. */
        ERROR
    }

    /** True for PASS. */
    public boolean passed() {
        return status == Status.PASS;
    }
}
