package org.cardwright.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.math.BigDecimal;
import java.util.Locale;
import java.util.Random;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Number writing and reading. The suffix table (T G MEG K M MIL U N P F, any case, M = milli, letters after the
 * suffix ignored, {@code 3k3} read as 3000) is ngspice 39's, read from its manual and confirmed by loading cards
 * into the installed ngspice 39; {@link SpiceNumbersSimulatorTest} repeats that check against the binary.
 */
class SpiceNumbersTest {
    /** Values in the round trip: a million, seeded, log-uniform over 1e-20..1e20 as the brief asks. */
    private static final int ROUND_TRIP_COUNT = 1_000_000;
    private static final long SEED = 20_240_611L;

    /** Shape of a written number: suffix form (mantissa in [1, 1000)) or exponent form; lower-case suffixes. */
    private static final Pattern SUFFIX_FORM = Pattern.compile("-?[1-9][0-9]{0,2}(\\.[0-9]*[1-9])?(f|p|n|u|m|k|meg|g|t)?");
    private static final Pattern EXPONENT_FORM = Pattern.compile("-?[1-9](\\.[0-9]*[1-9])?e-?[0-9]+");
    /** Smallest magnitude written with a suffix: 1 f (femto) [1]. */
    private static final double SUFFIX_SMALLEST = 1e-15;
    /** Magnitudes from 1e15 up are written in exponent form (the largest suffix is t, tera) [1]. */
    private static final double SUFFIX_BEYOND = 1e15;
    /** Relative slack on half a unit of the last digit: the decimal half unit itself is rounded to a double [1]. */
    private static final double HALF_UNIT_ROUNDING = 1e-12;

    @ParameterizedTest(name = "{0} with {1} digits -> {2}")
    @CsvSource({
        "1.5e-3, 6, 1.5m",
        "2.5e-9, 6, 2.5n",
        "100, 6, 100",
        "1e7, 6, 10meg",
        "1e6, 6, 1meg",
        "0, 6, 0",
        "-0.0, 6, 0",
        "1.234e-18, 6, 1.234e-18",
        "999.9999999e-6, 6, 1m",
        "999.9999999, 6, 1k",
        "-4.7e-12, 3, -4.7p",
        "12345.678, 3, 12.3k",
        "1e-15, 6, 1f",
        "0.99999999e-15, 6, 1f",
        "9.99e-16, 6, 9.99e-16",
        "1e12, 6, 1t",
        "999.9999999e12, 6, 1e15",
        "1e15, 6, 1e15",
        "3.3e9, 6, 3.3g",
        "47e3, 2, 47k",
        "0.5, 6, 500m",
        "1, 1, 1",
        "25, 15, 25",
        "1.005, 3, 1.01",
        "1.2345678901234567e-7, 15, 123.456789012346n",
        "-1e300, 3, -1e300",
        "6.02214076e23, 4, 6.022e23"
    })
    void formatsWithSuffixes(double value, int digits, String expected) {
        assertEquals(expected, SpiceNumbers.format(value, digits));
    }

    @Test
    void neverWritesUpperCaseSuffixesOrMegaAsM() {
        // common practice, no source: SPICE reads M as milli, so mega must be spelled "meg"
        assertEquals("2.2meg", SpiceNumbers.format(2.2e6, 6));
        Random random = new Random(SEED);
        for (int i = 0; i < 10_000; i++) {
            String s = SpiceNumbers.format(Math.pow(10, -20 + 40 * random.nextDouble()), 6);
            assertEquals(s.toLowerCase(Locale.ROOT), s, "written number has an upper-case letter");
        }
    }

    @Test
    void formatIgnoresTheDefaultLocale() {
        Locale before = Locale.getDefault();
        try {
            Locale.setDefault(Locale.GERMANY);
            assertEquals("1.5m", SpiceNumbers.format(1.5e-3, 6));
            assertEquals(1.5e-3, SpiceNumbers.parse("1.5m"));
            Locale.setDefault(Locale.forLanguageTag("tr-TR")); // dotless i: upper-casing "mil" must not break
            assertEquals(25.4e-6, SpiceNumbers.parse("1mil"));
            assertEquals(1e6, SpiceNumbers.parse("1meg"));
        } finally {
            Locale.setDefault(before);
        }
    }

    @Test
    void formatRejectsBadArguments() {
        assertThrows(IllegalArgumentException.class, () -> SpiceNumbers.format(Double.NaN, 6));
        assertThrows(IllegalArgumentException.class, () -> SpiceNumbers.format(Double.POSITIVE_INFINITY, 6));
        assertThrows(IllegalArgumentException.class, () -> SpiceNumbers.format(1.0, 0));
        assertThrows(IllegalArgumentException.class, () -> SpiceNumbers.format(1.0, 16));
    }

    @ParameterizedTest(name = "{0} -> {1}")
    @CsvSource({
        "10pF, 1e-11",
        "1F, 1e-15",
        "1f, 1e-15",
        "3k3, 3000",
        "1MEG, 1e6",
        "1meg, 1e6",
        "1Meg, 1e6",
        "1M, 1e-3",
        "1m, 1e-3",
        "2mA, 2e-3",
        "1MIL, 25.4e-6",
        "2mil, 50.8e-6",
        "4.7uF, 4.7e-6",
        "2.5n, 2.5e-9",
        "1T, 1e12",
        "1g, 1e9",
        "1.5K, 1500",
        "1e-3, 1e-3",
        "1.5E+3, 1500",
        "1e3k, 1e6",
        ".5u, 0.5e-6",
        "5., 5",
        "-2.5n, -2.5e-9",
        "+3, 3",
        "10V, 10",
        "1e, 1",
        "50mOhm, 0.05",
        "' 7p ', 7e-12",
        "1.234e-18, 1.234e-18"
    })
    void parsesSpiceNumbers(String token, double expected) {
        assertEquals(expected, SpiceNumbers.parse(token));
    }

    @ParameterizedTest
    @ValueSource(strings = {"", "abc", "1.2.3", "e5", "--1", "1e999", "1e-999", "1e99999999999", "{x}", "1,5",
        "NaN", "Infinity", "1 2", "1e-", "1/2", "'1n'"})
    void rejectsWhatIsNotANumber(String token) {
        NumberFormatException e = assertThrows(NumberFormatException.class, () -> SpiceNumbers.parse(token));
        assertTrue(e.getMessage().contains("'" + token + "'"), "message names the token: " + e.getMessage());
    }

    /**
     * A million seeded values over 1e-20..1e20, both signs, 1 to 15 digits: the written text reads back to the
     * value the JDK's own %e formatter gives at the same digits (an independent formatter), lies within half a
     * unit in the last stated digit of the value (plus one ulp for the final conversion to double), and has the
     * documented shape.
     */
    @Test
    void roundTripsAMillionRandomValues() {
        Random random = new Random(SEED);
        for (int i = 0; i < ROUND_TRIP_COUNT; i++) {
            double magnitude = Math.pow(10, -20 + 40 * random.nextDouble());
            double value = random.nextBoolean() ? magnitude : -magnitude;
            int digits = 1 + i % SpiceNumbers.MAX_SIGNIFICANT_DIGITS;
            String written = SpiceNumbers.format(value, digits);
            double read = SpiceNumbers.parse(written);

            double reference = Double.parseDouble(String.format(Locale.ROOT, "%." + (digits - 1) + "e", value));
            if (read != reference) {
                fail("value " + value + " digits " + digits + ": wrote " + written + " read " + read
                        + " but %e gives " + reference);
            }
            BigDecimal exact = new BigDecimal(value);
            int exponent = exact.precision() - exact.scale() - 1;
            double halfUnit = 0.5 * Math.pow(10, exponent - digits + 1);
            double error = Math.abs(read - value);
            if (error > halfUnit * (1 + HALF_UNIT_ROUNDING) + Math.ulp(value)) {
                fail("value " + value + " digits " + digits + ": wrote " + written + ", error " + error
                        + " exceeds half a unit " + halfUnit);
            }
            if (!SUFFIX_FORM.matcher(written).matches() && !EXPONENT_FORM.matcher(written).matches()) {
                fail("value " + value + " digits " + digits + ": unexpected shape " + written);
            }
            boolean suffixRange = Math.abs(read) >= SUFFIX_SMALLEST && Math.abs(read) < SUFFIX_BEYOND;
            if (suffixRange != SUFFIX_FORM.matcher(written).matches()) {
                fail("value " + value + ": " + written + " uses the wrong form for its magnitude");
            }
        }
    }
}
