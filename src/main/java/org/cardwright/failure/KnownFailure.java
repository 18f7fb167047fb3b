package org.cardwright.failure;

/**
 * The one base type of every failure cardwright expects: an exception that says which kind it is, and so
 * which exit code it ends the process with. Checked ({@code DataFileException}) and unchecked
 * ({@code FitFailedException}) exceptions both implement it, which is why it is an interface. Its message is
 * one line that names the file (and line, where there is one). Anything else that reaches the command line's
 * handler is a bug in cardwright (exit 70).
 *
 * <p>This package depends on nothing, and every package may use it.
 */
public interface KnownFailure {
    /** What kind of failure this is. */
    FailureKind kind();
}
