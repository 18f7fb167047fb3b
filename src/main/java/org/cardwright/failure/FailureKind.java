package org.cardwright.failure;

/**
 * The kinds of failure cardwright expects and explains, each with its documented exit code (README.md, "Exit
 * codes"; the same numbers as {@code cli.ExitCodes}, which a test keeps in step). Never renumber one.
 */
public enum FailureKind {
    /** The command line is wrong. */
    USAGE(2),
    /** An input file is unreadable or malformed. */
    BAD_INPUT(3),
    /** The data cannot support a fit, or the fit failed. */
    FIT(4),
    /** An external simulator is missing, timed out or failed. */
    SIMULATOR(5),
    /** An output file exists or cannot be written. */
    OUTPUT(6);

    private final int exitCode;

    FailureKind(int exitCode) {
        this.exitCode = exitCode;
    }

    /** The process exit code of this kind [1]. */
    public int exitCode() {
        return exitCode;
    }
}
