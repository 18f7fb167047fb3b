package org.cardwright.data;

import java.nio.file.Path;
import java.util.Objects;

/**
 * A measurement file that cannot be read as it stands. The message is one line,
 * {@code path:line: what is wrong (value 'raw')}, so a user can open the file at that line; line 0 stands for
 * the whole file (not found, unreadable, no header).
 */
public final class DataFileException extends Exception implements org.cardwright.failure.KnownFailure {
    private static final long serialVersionUID = 1L;
    /** Longest raw value quoted in full in the message; {@link #rawValue()} always holds all of it [1]. */
    private static final int MAX_QUOTED = 80;

    private final transient Path file;
    private final int line;
    private final String problem;
    private final String rawValue;

    /**
     * @param file     the file as the user gave it
     * @param line     physical 1-based line, or 0 for the whole file [1]
     * @param problem  what is wrong, one line, without file, line or value
     * @param rawValue the text as it stands in the file, or null when no single value is to blame
     */
    public DataFileException(Path file, int line, String problem, String rawValue) {
        this(file, line, problem, rawValue, null);
    }

    /** As {@link #DataFileException(Path, int, String, String)}, keeping the exception that revealed the problem. */
    public DataFileException(Path file, int line, String problem, String rawValue, Throwable cause) {
        super(format(file, line, problem, rawValue), cause);
        if (line < 0) {
            throw new IllegalArgumentException("line must not be negative, got " + line);
        }
        this.file = file;
        this.line = line;
        this.problem = problem;
        this.rawValue = rawValue;
    }

    private static String format(Path file, int line, String problem, String rawValue) {
        Objects.requireNonNull(file, "file");
        Objects.requireNonNull(problem, "problem");
        StringBuilder s = new StringBuilder().append(file).append(':').append(line).append(": ")
                .append(oneLine(problem));
        if (rawValue != null) {
            String quoted = oneLine(rawValue);
            if (quoted.length() > MAX_QUOTED) {
                quoted = quoted.substring(0, MAX_QUOTED) + "...";
            }
            s.append(" (value '").append(quoted).append("')");
        }
        return s.toString();
    }

    /** The text with line breaks, tabs and other control characters written as escapes, so it stays one line. */
    private static String oneLine(String text) {
        StringBuilder s = new StringBuilder(text.length());
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            switch (c) {
                case '\n' -> s.append("\\n");
                case '\r' -> s.append("\\r");
                case '\t' -> s.append("\\t");
                default -> {
                    if (Character.isISOControl(c)) {
                        s.append(String.format("\\u%04x", (int) c));
                    } else {
                        s.append(c);
                    }
                }
            }
        }
        return s.toString();
    }

    /** An unreadable or malformed input: exit 3. */
    @Override
    public org.cardwright.failure.FailureKind kind() {
        return org.cardwright.failure.FailureKind.BAD_INPUT;
    }

    /** The file as the user gave it. */
    public Path file() {
        return file;
    }

    /** Physical 1-based line, or 0 when the problem is with the whole file [1]. */
    public int line() {
        return line;
    }

    /** What is wrong, without file, line or value. */
    public String problem() {
        return problem;
    }

    /** The offending text exactly as it stands in the file, or null when no single value is to blame. */
    public String rawValue() {
        return rawValue;
    }
}
