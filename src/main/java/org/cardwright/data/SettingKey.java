package org.cardwright.data;

import java.util.Locale;
import java.util.Optional;

/**
 * The settings a measurement file may state before its header row, as {@code # key = value} comment lines or
 * plain {@code key: value} lines. Keys are compared without regard to case, with runs of blanks, underscores
 * and hyphens read as one blank. docs/bench-logs.md lists them with examples.
 */
enum SettingKey {
    /** Device temperature of every row without a T cell. */
    TEMPERATURE("temperature", Form.QUANTITY, Quantity.TEMPERATURE),
    /** Input resistance of the meter across the diode (series-resistor log). */
    METER_INPUT_RESISTANCE("meter input resistance", Form.QUANTITY, Quantity.RESISTANCE),
    /** Tolerance of the meter input resistance, a bound [%] (series-resistor log). */
    METER_INPUT_RESISTANCE_TOLERANCE("meter input resistance tolerance", Form.PERCENT, null),
    /** Output resistance of the supply, in series with Rseries (series-resistor log). */
    SUPPLY_SOURCE_RESISTANCE("supply source resistance", Form.QUANTITY, Quantity.RESISTANCE),
    /** Tolerance of every series resistor, a bound [%] (series-resistor log). */
    RESISTOR_TOLERANCE("resistor tolerance", Form.PERCENT, null),
    /** Accuracy of the Vsupply values (series-resistor log). */
    SUPPLY_ACCURACY("supply accuracy", Form.ACCURACY, Quantity.VOLTAGE),
    /** Size of one count of the supply's display (series-resistor log). */
    SUPPLY_RESOLUTION("supply resolution", Form.QUANTITY, Quantity.VOLTAGE),
    /** Accuracy of the voltage readings: V of a point table, Vmeter of a series-resistor log. */
    VOLTMETER_ACCURACY("voltmeter accuracy", Form.ACCURACY, Quantity.VOLTAGE),
    /** Size of one count of the voltmeter. */
    VOLTMETER_RESOLUTION("voltmeter resolution", Form.QUANTITY, Quantity.VOLTAGE),
    /** Accuracy of the current readings of an I-V point table. */
    AMMETER_ACCURACY("ammeter accuracy", Form.ACCURACY, Quantity.CURRENT),
    /** Size of one count of the ammeter. */
    AMMETER_RESOLUTION("ammeter resolution", Form.QUANTITY, Quantity.CURRENT),
    /** Resistance of the leads in a 2-wire I-V measurement, subtracted as I times it from V. */
    LEAD_RESISTANCE("lead resistance", Form.QUANTITY, Quantity.RESISTANCE),
    /** Fixture/stray capacitance in parallel with the device, included in every reading of a C-V file. */
    STRAY_CAPACITANCE("stray capacitance", Form.QUANTITY, Quantity.CAPACITANCE),
    /** Test-signal frequency of the readings of a C-V file. */
    TEST_FREQUENCY("test frequency", Form.QUANTITY, Quantity.FREQUENCY),
    /** Whether an I-V table's V and I are reverse-bias magnitudes (yes: read as V = -V, I = -I). */
    REVERSE_MAGNITUDES("reverse magnitudes", Form.YES_NO, null);

    /** How a setting's value is written. */
    enum Form {
        /** A number with an optional unit of the setting's quantity, e.g. {@code 10 Mohm} or {@code 10meg}. */
        QUANTITY,
        /** A percentage, e.g. {@code 1 %}. */
        PERCENT,
        /** An accuracy: {@code P %} of reading, plus {@code N counts} and/or an absolute value, joined by +. */
        ACCURACY,
        /** yes or no (also true/false, on/off). */
        YES_NO
    }

    private final String key;
    private final Form form;
    private final Quantity quantity;

    SettingKey(String key, Form form, Quantity quantity) {
        this.key = key;
        this.form = form;
        this.quantity = quantity;
    }

    /** The key as the format writes it, e.g. "meter input resistance". */
    String key() {
        return key;
    }

    Form form() {
        return form;
    }

    /** The quantity of a QUANTITY value or of the absolute part of an ACCURACY; null for a PERCENT. */
    Quantity quantity() {
        return quantity;
    }

    /** The key as written, lower case, with runs of blanks, underscores and hyphens as one blank. */
    static String normalise(String written) {
        return written.strip().toLowerCase(Locale.ROOT).replaceAll("[\\s_-]+", " ");
    }

    /** The setting a written key names; empty for any other key. */
    static Optional<SettingKey> of(String written) {
        String n = normalise(written);
        for (SettingKey k : values()) {
            if (k.key.equals(n)) {
                return Optional.of(k);
            }
        }
        return Optional.empty();
    }
}
