package org.cardwright.data;

import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * What a header cell's name says the column holds. Names are compared without regard to case; a unit may
 * follow in brackets or parentheses. A role without a quantity (the flag column) takes no unit.
 */
enum ColumnRole {
    /** Anode-to-cathode voltage of a point table. */
    VOLTAGE(Quantity.VOLTAGE, "V"),
    /** Current of an I-V point table. */
    CURRENT(Quantity.CURRENT, "I"),
    /** Reverse voltage of an I-V point table, written as a positive magnitude (datasheet habit): V = -VR. */
    REVERSE_VOLTAGE(Quantity.VOLTAGE, "VR"),
    /** Reverse current of an I-V point table, written as a positive magnitude (datasheet habit): I = -IR. */
    REVERSE_CURRENT(Quantity.CURRENT, "IR"),
    /** Capacitance of a C-V point table. */
    CAPACITANCE(Quantity.CAPACITANCE, "C"),
    /** Device temperature of the row. */
    TEMPERATURE(Quantity.TEMPERATURE, "T"),
    /** Stated 1-sigma uncertainty of V. */
    VOLTAGE_SIGMA(Quantity.VOLTAGE, "dV"),
    /** Stated 1-sigma uncertainty of I. */
    CURRENT_SIGMA(Quantity.CURRENT, "dI"),
    /** Series-resistor log: the supply voltage. */
    SUPPLY_VOLTAGE(Quantity.VOLTAGE, "Vsupply"),
    /** Series-resistor log: the series resistor. */
    SERIES_RESISTANCE(Quantity.RESISTANCE, "Rseries"),
    /** Series-resistor log: the meter reading across the diode. */
    METER_VOLTAGE(Quantity.VOLTAGE, "Vmeter"),
    /** An instrument's status or compliance flag; flagged rows are set aside. */
    FLAG(null, "status", "compliance");

    private final Quantity quantity;
    private final List<String> names;

    ColumnRole(Quantity quantity, String... names) {
        this.quantity = quantity;
        this.names = List.of(names);
    }

    /** The quantity the column holds, empty for the flag column. */
    Optional<Quantity> quantity() {
        return Optional.ofNullable(quantity);
    }

    /** The column's name as the format writes it, e.g. "Vsupply". */
    String columnName() {
        return names.get(0);
    }

    /** The role a header name stands for, compared without regard to case; empty for any other name. */
    static Optional<ColumnRole> ofName(String name) {
        String lower = name.trim().toLowerCase(Locale.ROOT);
        for (ColumnRole r : values()) {
            for (String n : r.names) {
                if (n.toLowerCase(Locale.ROOT).equals(lower)) {
                    return Optional.of(r);
                }
            }
        }
        return Optional.empty();
    }
}
