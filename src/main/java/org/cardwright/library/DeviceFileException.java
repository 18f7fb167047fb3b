package org.cardwright.library;

import java.nio.file.Path;

/** A device file is unreadable or wrong (an input problem, hence an IOException); the message names the file and the line, and the raw text where there is one. */
public final class DeviceFileException extends java.io.IOException {
    private static final long serialVersionUID = 1L;

    private final transient Path file;
    private final int line;

    public DeviceFileException(Path file, int line, String message) {
        super(file.toString().replace('\\', '/') + ":" + line + ": " + message);
        this.file = file;
        this.line = line;
    }

    public DeviceFileException(Path file, int line, String message, Throwable cause) {
        super(file.toString().replace('\\', '/') + ":" + line + ": " + message, cause);
        this.file = file;
        this.line = line;
    }

    /** The device file. */
    public Path file() {
        return file;
    }

    /** The 1-based line the problem is on; 0 when it concerns the whole file. */
    public int line() {
        return line;
    }
}
