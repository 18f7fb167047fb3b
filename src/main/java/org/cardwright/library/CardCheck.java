package org.cardwright.library;

import java.util.Optional;
import org.cardwright.verify.JunctionVerification;
import org.cardwright.verify.Verification;

/**
 * The check of one card of a library against its part's data.
 *
 * @param device       device file, relative to the library root
 * @param model        model name (the device file's name when it could not be read)
 * @param card         card file, relative to the library root (the device file when there is no card to name)
 * @param status       the verdict
 * @param message      one line for the user
 * @param verification the forward I-V section of the re-simulation, when one ran and the data hold forward points
 * @param seconds      time spent [s]
 * @param all          the re-simulation of every data kind the part has, when one ran
 */
public record CardCheck(String device, String model, String card, Status status, String message,
                        Optional<Verification> verification, double seconds, Optional<JunctionVerification> all) {

    /** A check with no re-simulation of every kind (the form every check had before). */
    public CardCheck(String device, String model, String card, Status status, String message,
                     Optional<Verification> verification, double seconds) {
        this(device, model, card, status, message, verification, seconds, Optional.empty());
    }

    /** Verdicts. */
    public enum Status {
        /** The card reproduces its data within the part's tolerances and was built from the current inputs. */
        PASS,
        /** The card does not reproduce its data within the part's tolerances. */
        FAIL,
        /** The card reproduces its data, but the device file, data, templates or cardwright's version changed since it was built. */
        OUTDATED,
        /** The card does not exist. */
        MISSING,
        /** The device file, the card or the data could not be read, or the simulator failed. */
        ERROR,
        /**
         * The engine asked for does not speak the card's dialect (a gnucap or Xyce card and ngspice, say): the card
         * was not run, which is neither a pass nor a failure.
         */
        NOT_CHECKABLE
    }

    /** True for PASS. */
    public boolean passed() {
        return status == Status.PASS;
    }

    /** True when the card was not run because the engine does not speak its dialect. */
    public boolean notCheckable() {
        return status == Status.NOT_CHECKABLE;
    }
}
