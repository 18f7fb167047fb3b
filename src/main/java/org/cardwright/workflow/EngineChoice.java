package org.cardwright.workflow;

import java.util.Locale;

/**
 * Who simulates, as a command line names it: {@code builtin}, {@code ngspice} or {@code gnucap}. An option of this
 * type is read through {@link #byName} (any case), so no command maps names by hand.
 */
public enum EngineChoice {
    /** The ngspice 39 level-1 equations (or the card's own simulator's) evaluated in process. */
    BUILTIN,
    /** The installed ngspice 39, in batch mode. */
    NGSPICE,
    /** The installed gnucap, in batch mode. */
    GNUCAP;

    /**
     * The engine called {@code name}, any case.
     *
     * @throws IllegalArgumentException naming the valid choices
     */
    public static EngineChoice byName(String name) {
        for (EngineChoice e : values()) {
            if (e.name().equalsIgnoreCase(name == null ? "" : name.trim())) {
                return e;
            }
        }
        throw new IllegalArgumentException("unknown engine '" + name + "'; choose one of " + Engines.NAMES);
    }

    /** The name on the command line, lower case. */
    @Override
    public String toString() {
        return name().toLowerCase(Locale.ROOT);
    }
}
