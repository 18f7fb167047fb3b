package org.cardwright.data;

import java.util.Objects;
import java.util.OptionalDouble;

/**
 * How to read measurement files.
 *
 * @param defaultTemperature device temperature for files without a T column (and for empty T cells); empty
 *                           when the user gave none [K]
 * @param delimiter          the character between cells; a comma unless a caller asks for another
 */
public record ReadOptions(OptionalDouble defaultTemperature, char delimiter) {

    /** Delimiter of the options from {@link #defaults()}. */
    public static final char COMMA = ',';

    /** Checks the temperature lies above absolute zero and the delimiter cannot be mistaken for other syntax. */
    public ReadOptions {
        Objects.requireNonNull(defaultTemperature, "defaultTemperature");
        if (defaultTemperature.isPresent()) {
            double kelvin = defaultTemperature.getAsDouble();
            if (!Double.isFinite(kelvin) || !(kelvin > 0)) {
                throw new IllegalArgumentException(
                        "default temperature must be a finite number above absolute zero, got " + kelvin + " K");
            }
        }
        if (delimiter == '"' || delimiter == '#' || delimiter == ' ' || delimiter == '\n' || delimiter == '\r'
                || delimiter == '.' || delimiter == '-' || delimiter == '+'
                || Character.isLetterOrDigit(delimiter)) {
            throw new IllegalArgumentException("'" + delimiter + "' cannot separate cells: it is part of the "
                    + "quoting, comment, line, blank or number syntax");
        }
    }

    /** No default temperature, comma-separated. */
    public static ReadOptions defaults() {
        return new ReadOptions(OptionalDouble.empty(), COMMA);
    }

    /** These options with the given default temperature [K]. */
    public ReadOptions withDefaultTemperature(double kelvin) {
        return new ReadOptions(OptionalDouble.of(kelvin), delimiter);
    }

    /** These options with another delimiter. */
    public ReadOptions withDelimiter(char newDelimiter) {
        return new ReadOptions(defaultTemperature, newDelimiter);
    }
}
