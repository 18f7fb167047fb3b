package org.cardwright.library;

import java.util.List;

/**
 * What a build did with one part.
 *
 * @param device    the device file, relative to the library root
 * @param model     the model name, or the file name when the device file could not be read
 * @param status    what happened
 * @param message   one line for the user
 * @param written   cards written (library-relative)
 * @param unchanged cards whose text came out the same and were left untouched (library-relative)
 * @param seconds   time spent on the part [s]
 * @param notes     what the fit set aside or changed
 * @param warnings  the fit's warnings (non-identifiable parameters, strong correlations, no breakdown reached, leakage
 *                  beyond the card, ...), shown for every part built
 */
public record PartOutcome(String device, String model, Status status, String message, List<String> written,
                          List<String> unchanged, double seconds, List<String> notes, List<String> warnings) {

    /** An outcome without fit warnings. */
    public PartOutcome(String device, String model, Status status, String message, List<String> written,
                       List<String> unchanged, double seconds, List<String> notes) {
        this(device, model, status, message, written, unchanged, seconds, notes, List.of());
    }

    /** What happened to a part. */
    public enum Status {
        /** Recipe and cards as recorded: nothing fitted, nothing written. */
        UP_TO_DATE,
        /** Fitted; changed cards written. */
        BUILT,
        /** A card was edited by hand and the build was not allowed to replace it. */
        REFUSED_EDITED,
        /** The device file or its data is wrong. */
        BAD_INPUT,
        /** The data cannot support a fit. */
        FIT_FAILED,
        /** A card or the state file could not be written. */
        WRITE_FAILED
    }

    public PartOutcome {
        written = List.copyOf(written);
        unchanged = List.copyOf(unchanged);
        notes = List.copyOf(notes);
        warnings = List.copyOf(warnings);
    }

    /** True when the part is in order after the build. */
    public boolean ok() {
        return status == Status.UP_TO_DATE || status == Status.BUILT;
    }
}
