package org.cardwright.data;

import java.nio.file.Path;
import java.util.Objects;

/**
 * Something the reader did that the user must be told about, though it is not an error: a column it ignored,
 * a point it kept that later stages may not be able to use, a temperature it took from the read options.
 *
 * @param file    the file the notice is about, as it was given to the reader
 * @param line    physical 1-based line the notice is about, or 0 when it is about the whole file [1]
 * @param message what happened, one line, without the file and line
 */
public record Notice(Path file, int line, String message) {

    /** Checks that nothing is missing, the line is not negative and the message is one non-blank line. */
    public Notice {
        Objects.requireNonNull(file, "file");
        Objects.requireNonNull(message, "message");
        if (line < 0) {
            throw new IllegalArgumentException("line must not be negative, got " + line);
        }
        if (message.isBlank() || message.indexOf('\n') >= 0 || message.indexOf('\r') >= 0) {
            throw new IllegalArgumentException("message must be one non-blank line, got '" + message + "'");
        }
    }

    /** The notice as {@code file:line: message}; line 0 stands for the whole file. */
    @Override
    public String toString() {
        return file + ":" + line + ": " + message;
    }
}
