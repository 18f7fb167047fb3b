package org.cardwright.cli;

/** The documented, stable exit codes (README.md, "Exit codes"). */
public final class ExitCodes {
    /** Success: the card was written, or it reproduces the data. */
    public static final int OK = 0;
    /** verify: the card does not reproduce the data within the limits. */
    public static final int NOT_REPRODUCED = 1;
    /** The command line is wrong (unknown option, missing argument, bad value). */
    public static final int USAGE = 2;
    /** An input file (data or card) is unreadable or malformed. */
    public static final int BAD_INPUT = 3;
    /** The data cannot support a fit, or the fit failed. */
    public static final int FIT_FAILED = 4;
    /** An external simulator is missing, timed out or reported an error. */
    public static final int SIMULATOR_FAILED = 5;
    /** An output file exists (and --force was not given) or cannot be written. */
    public static final int OUTPUT_REFUSED = 6;
    /** A bug in cardwright: please report it with --stack-trace output. */
    public static final int INTERNAL_ERROR = 70;

    private ExitCodes() {
    }
}
