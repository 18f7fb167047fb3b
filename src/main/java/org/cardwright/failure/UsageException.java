package org.cardwright.failure;

/**
 * A value given on the command line (or in a request built from it) is wrong: exit 2. It stays an
 * {@link IllegalArgumentException} so that callers which caught that keep working.
 */
public final class UsageException extends IllegalArgumentException implements KnownFailure {
    private static final long serialVersionUID = 1L;

    public UsageException(String message) {
        super(message);
    }

    public UsageException(String message, Throwable cause) {
        super(message, cause);
    }

    @Override
    public FailureKind kind() {
        return FailureKind.USAGE;
    }
}
