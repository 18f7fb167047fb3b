package org.cardwright.fit;

/** The data given to a fit cannot support it; the message names the file, the line and the value. */
public final class FitInputException extends Exception implements org.cardwright.failure.KnownFailure {
    private static final long serialVersionUID = 1L;

    public FitInputException(String message) {
        super(message);
    }

    @Override
    public org.cardwright.failure.FailureKind kind() {
        return org.cardwright.failure.FailureKind.FIT;
    }
}
