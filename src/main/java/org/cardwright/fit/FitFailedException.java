package org.cardwright.fit;

/** The optimiser could not finish a fit (no convergence within its budget, or a numerical breakdown). */
public final class FitFailedException extends RuntimeException implements org.cardwright.failure.KnownFailure {
    private static final long serialVersionUID = 1L;

    public FitFailedException(String message) {
        super(message);
    }

    @Override
    public org.cardwright.failure.FailureKind kind() {
        return org.cardwright.failure.FailureKind.FIT;
    }
}
