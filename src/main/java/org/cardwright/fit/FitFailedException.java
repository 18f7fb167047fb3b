package org.cardwright.fit;

/** The optimiser could not finish a fit (no convergence within its budget, or a numerical breakdown). */
public final class FitFailedException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public FitFailedException(String message) {
        super(message);
    }
}
