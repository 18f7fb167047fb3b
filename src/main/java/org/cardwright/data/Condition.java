package org.cardwright.data;

import java.util.Arrays;
import java.util.Locale;
import java.util.Optional;
import java.util.stream.Collectors;

/**
 * A condition that shapes a measurement and may be stated for a data file: in the file itself (a setting above
 * the header row, {@code # stray capacitance = 1.5 pF}), in a device file (a data entry's {@code options}), or on
 * the command line. Every place reads the value with the same parser (units, SPICE suffixes, range checks), and
 * the file's own statement wins over one given from outside; docs/device-files.md states the order.
 */
public enum Condition {
    /** Device temperature of rows without a T cell [K]. */
    TEMPERATURE(SettingKey.TEMPERATURE),
    /** Fixture/stray capacitance in parallel with the device, included in every C-V reading [F]. */
    STRAY_CAPACITANCE(SettingKey.STRAY_CAPACITANCE),
    /** Test-signal frequency of the C-V readings [Hz]. */
    TEST_FREQUENCY(SettingKey.TEST_FREQUENCY),
    /** Input resistance of the meter across the diode in a series-resistor log [ohm]. */
    METER_INPUT_RESISTANCE(SettingKey.METER_INPUT_RESISTANCE),
    /** 2-wire lead resistance of an I-V table, subtracted as I times it from V [ohm]. */
    LEAD_RESISTANCE(SettingKey.LEAD_RESISTANCE),
    /** Whether an I-V table's V and I are reverse-bias magnitudes: 1 for yes, 0 for no [1]. */
    REVERSE_MAGNITUDES(SettingKey.REVERSE_MAGNITUDES);

    /** The test frequency when nobody states one: 1 MHz, the usual LCR-meter setting for junction capacitance
     * (common practice, no source); it matters only where RS or TT·g is visible [Hz]. */
    public static final double DEFAULT_TEST_FREQUENCY = 1e6;

    /** Offset between the Celsius and Kelvin scales, by definition (SI Brochure, 2019) [K]. */
    private static final double CELSIUS_ZERO = 273.15;

    private final SettingKey setting;

    Condition(SettingKey setting) {
        this.setting = setting;
    }

    SettingKey setting() {
        return setting;
    }

    /** The key in words, as a data file writes it, e.g. "stray capacitance". */
    public String key() {
        return setting.key();
    }

    /** The key as a device file writes it, e.g. "stray-capacitance". */
    public String optionName() {
        return setting.key().replace(' ', '-');
    }

    /**
     * The condition a written key names, compared as data-file setting keys are (any case; blanks, hyphens and
     * underscores alike); empty for any other key.
     */
    public static Optional<Condition> byKey(String written) {
        Optional<SettingKey> k = SettingKey.of(written);
        return k.flatMap(s -> Arrays.stream(values()).filter(c -> c.setting == s).findFirst());
    }

    /** Every option name, for messages. */
    public static String optionNames() {
        return Arrays.stream(values()).map(Condition::optionName).collect(Collectors.joining(", "));
    }

    /**
     * Reads a value exactly as a data file's setting line is read: a number with an optional unit or SPICE
     * suffix ({@code 1.5 pF}, {@code 1.5p}, {@code 1 MHz}, {@code 1meg}, {@code 10 Mohm}), a temperature in degC
     * without a unit, yes/no for {@link #REVERSE_MAGNITUDES}; in SI units.
     *
     * @throws IllegalArgumentException naming the condition and what is wrong
     */
    public double parse(String text) {
        try {
            return FileSettings.given(setting, text);
        } catch (CellProblem e) {
            throw new IllegalArgumentException("cannot read " + key() + " '" + text.strip() + "': " + e.problem());
        }
    }

    /** A value of this condition for messages, with its unit: "1.5 pF", "1 MHz", "25 degC", "yes". */
    public String text(double si) {
        return switch (this) {
            case TEMPERATURE -> trim(si - CELSIUS_ZERO) + " degC";
            case STRAY_CAPACITANCE -> engineering(si, "F");
            case TEST_FREQUENCY -> engineering(si, "Hz");
            case METER_INPUT_RESISTANCE, LEAD_RESISTANCE -> engineering(si, "ohm");
            case REVERSE_MAGNITUDES -> si != 0 ? "yes" : "no";
        };
    }

    private static String engineering(double v, String unit) {
        if (v == 0 || !Double.isFinite(v)) {
            return trim(v) + " " + unit;
        }
        String[] prefixes = {"f", "p", "n", "u", "m", "", "k", "M", "G"};
        int exp = (int) Math.floor(Math.log10(Math.abs(v)) / 3) * 3;
        exp = Math.max(-15, Math.min(9, exp));
        return trim(v / Math.pow(10, exp)) + " " + prefixes[exp / 3 + 5] + unit;
    }

    private static String trim(double v) {
        String s = String.format(Locale.ROOT, "%.6g", v);
        if (s.contains("e") || s.contains("E")) {
            return s;
        }
        if (s.contains(".")) {
            s = s.replaceAll("0+$", "").replaceAll("\\.$", "");
        }
        return s;
    }
}
