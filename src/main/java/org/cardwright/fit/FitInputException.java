package org.cardwright.fit;

/** The data given to a fit cannot support it; the message names the file, the line and the value. */
public final class FitInputException extends Exception {
    private static final long serialVersionUID = 1L;

    public FitInputException(String message) {
        super(message);
    }
}
