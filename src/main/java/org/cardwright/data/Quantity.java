package org.cardwright.data;

/** The physical quantities a measurement file's cells and settings can hold, each with its SI unit. */
enum Quantity {
    VOLTAGE("voltage", "V"),
    CURRENT("current", "A"),
    CAPACITANCE("capacitance", "F"),
    /** Device temperature; a value without a unit is in degrees Celsius, the unit inside is K. */
    TEMPERATURE("temperature", "K"),
    /** Resistance of a series resistor, a meter input, a source or a lead. */
    RESISTANCE("resistance", "ohm"),
    /** Frequency of a test signal (the C-V meter's). */
    FREQUENCY("frequency", "Hz");

    private final String word;
    private final String siUnit;

    Quantity(String word, String siUnit) {
        this.word = word;
        this.siUnit = siUnit;
    }

    /** The quantity's name in plain words, e.g. "current". */
    String word() {
        return word;
    }

    /** The unit the records hold it in. */
    String siUnit() {
        return siUnit;
    }
}
