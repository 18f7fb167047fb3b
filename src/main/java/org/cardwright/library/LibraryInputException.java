package org.cardwright.library;

/** A data file of a part is unreadable or malformed; the message names the file (library-relative), line and raw text. */
public final class LibraryInputException extends java.io.IOException {
    private static final long serialVersionUID = 1L;

    public LibraryInputException(String message, Throwable cause) {
        super(message, cause);
    }
}
