package org.cardwright.data;

import java.util.Objects;

/**
 * The value of a {@link Condition} and where it came from, for the user to see.
 *
 * @param value  the value in SI units (see the condition) [SI]
 * @param source where it came from, in words: "line 3 of the file", "device file parts/X.device.yaml, line 9",
 *               "--stray-capacitance", "the default"
 * @param line   the line of the data file that states it; 0 when it came from outside the file [1]
 */
public record ConditionValue(double value, String source, int line) {
    public ConditionValue {
        Objects.requireNonNull(source, "source");
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("a condition's value must be finite, got " + value);
        }
        if (line < 0) {
            throw new IllegalArgumentException("line must not be negative, got " + line);
        }
    }

    /** A value from outside the data file (line 0). */
    public ConditionValue(double value, String source) {
        this(value, source, 0);
    }

    /** A value stated on line {@code line} of the data file itself. */
    static ConditionValue inFile(double value, int line) {
        return new ConditionValue(value, "line " + line + " of the file", line);
    }
}
