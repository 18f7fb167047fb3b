package org.cardwright.data;

import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * How to read measurement files.
 *
 * @param defaultTemperature    device temperature for rows without a T cell, when the file states no
 *                              {@code temperature} setting; empty when the user gave none [K]
 * @param delimiter             the character between cells; empty to detect it from the header row (tab if it
 *                              holds one, else semicolon if it holds one, else comma)
 * @param meterResistance       input resistance of the meter of a series-resistor log, for files that do not
 *                              state {@code meter input resistance}; empty when the user gave none [ohm]
 * @param meterLoadingCorrection whether a series-resistor log's currents are corrected for the meter's draw;
 *                              true unless a comparison asks for the raw currents
 */
public record ReadOptions(OptionalDouble defaultTemperature, Optional<Character> delimiter,
                          OptionalDouble meterResistance, boolean meterLoadingCorrection) {

    /** The comma, the delimiter of plain CSV. */
    public static final char COMMA = ',';

    /**
     * Checks the temperature lies above absolute zero, the meter resistance is positive, and the delimiter
     * cannot be mistaken for other syntax.
     */
    public ReadOptions {
        Objects.requireNonNull(defaultTemperature, "defaultTemperature");
        Objects.requireNonNull(delimiter, "delimiter");
        Objects.requireNonNull(meterResistance, "meterResistance");
        if (defaultTemperature.isPresent()) {
            double kelvin = defaultTemperature.getAsDouble();
            if (!Double.isFinite(kelvin) || !(kelvin > 0)) {
                throw new IllegalArgumentException(
                        "default temperature must be a finite number above absolute zero, got " + kelvin + " K");
            }
        }
        if (meterResistance.isPresent()) {
            double ohms = meterResistance.getAsDouble();
            if (!Double.isFinite(ohms) || !(ohms > 0)) {
                throw new IllegalArgumentException("meter input resistance must be a positive finite number, got "
                        + ohms + " ohm");
            }
        }
        if (delimiter.isPresent()) {
            char d = delimiter.get();
            if (d == '"' || d == '#' || d == ' ' || d == '\n' || d == '\r' || d == '.' || d == '-' || d == '+'
                    || Character.isLetterOrDigit(d)) {
                throw new IllegalArgumentException("'" + d + "' cannot separate cells: it is part of the "
                        + "quoting, comment, line, blank or number syntax");
            }
        }
    }

    /** Options with the given default temperature and a fixed delimiter; no meter resistance, correction on. */
    public ReadOptions(OptionalDouble defaultTemperature, char delimiter) {
        this(defaultTemperature, Optional.of(delimiter), OptionalDouble.empty(), true);
    }

    /** No default temperature, delimiter detected from the header row, no meter resistance, correction on. */
    public static ReadOptions defaults() {
        return new ReadOptions(OptionalDouble.empty(), Optional.empty(), OptionalDouble.empty(), true);
    }

    /** These options with the given default temperature [K]. */
    public ReadOptions withDefaultTemperature(double kelvin) {
        return new ReadOptions(OptionalDouble.of(kelvin), delimiter, meterResistance, meterLoadingCorrection);
    }

    /** These options with a fixed delimiter, not detected. */
    public ReadOptions withDelimiter(char newDelimiter) {
        return new ReadOptions(defaultTemperature, Optional.of(newDelimiter), meterResistance,
                meterLoadingCorrection);
    }

    /** These options with the delimiter detected from each file's header row. */
    public ReadOptions withDetectedDelimiter() {
        return new ReadOptions(defaultTemperature, Optional.empty(), meterResistance, meterLoadingCorrection);
    }

    /** These options with the meter input resistance for series-resistor logs that do not state it [ohm]. */
    public ReadOptions withMeterResistance(double ohms) {
        return new ReadOptions(defaultTemperature, delimiter, OptionalDouble.of(ohms), meterLoadingCorrection);
    }

    /**
     * These options with the meter-loading correction switched off: a series-resistor log's current is then
     * (Vsupply - Vmeter) / (Rseries + Rsource), as if the meter drew nothing. For comparisons only; the reader
     * says so in a notice.
     */
    public ReadOptions withoutMeterLoadingCorrection() {
        return new ReadOptions(defaultTemperature, delimiter, meterResistance, false);
    }
}
