package org.cardwright.workflow;

/** An output file cannot be written, or would overwrite one the user did not allow us to replace. */
public final class OutputException extends Exception implements org.cardwright.failure.KnownFailure {
    private static final long serialVersionUID = 1L;

    public OutputException(String message) {
        super(message);
    }

    public OutputException(String message, Throwable cause) {
        super(message, cause);
    }

    @Override
    public org.cardwright.failure.FailureKind kind() {
        return org.cardwright.failure.FailureKind.OUTPUT;
    }
}
