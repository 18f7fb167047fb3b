package org.cardwright.workflow;

import java.util.Locale;

/**
 * Who simulates, as a command line names it: {@code builtin}, {@code ngspice} or {@code gnucap}. An option of this
 * type is read by picocli (which matches the lower-case {@link #toString()}), so no command maps names by hand.
 */
public enum EngineChoice {
    /** The ngspice 39 level-1 equations (or the card's own simulator's) evaluated in process. */
    BUILTIN,
    /** The installed ngspice 39, in batch mode. */
    NGSPICE,
    /** The installed gnucap, in batch mode. */
    GNUCAP;

    /** The name on the command line, lower case. */
    @Override
    public String toString() {
        return name().toLowerCase(Locale.ROOT);
    }
}
