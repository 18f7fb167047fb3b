package org.cardwright.data;

import java.util.Locale;
import java.util.Optional;

/** The quantities a measurement file's columns can hold, each with its column name and its SI unit. */
enum Quantity {
    VOLTAGE("V", "voltage", "V"),
    CURRENT("I", "current", "A"),
    CAPACITANCE("C", "capacitance", "F"),
    /** Device temperature; a column without a unit is in degrees Celsius, the unit inside is K. */
    TEMPERATURE("T", "temperature", "K");

    private final String columnName;
    private final String word;
    private final String siUnit;

    Quantity(String columnName, String word, String siUnit) {
        this.columnName = columnName;
        this.word = word;
        this.siUnit = siUnit;
    }

    /** The column name as the format writes it: V, I, C or T. */
    String columnName() {
        return columnName;
    }

    /** The quantity's name in plain words, e.g. "current". */
    String word() {
        return word;
    }

    /** The unit the records hold it in. */
    String siUnit() {
        return siUnit;
    }

    /** The quantity a header name stands for, compared without regard to case; empty for any other name. */
    static Optional<Quantity> ofColumnName(String name) {
        String upper = name.trim().toUpperCase(Locale.ROOT);
        for (Quantity q : values()) {
            if (q.columnName.equals(upper)) {
                return Optional.of(q);
            }
        }
        return Optional.empty();
    }
}
