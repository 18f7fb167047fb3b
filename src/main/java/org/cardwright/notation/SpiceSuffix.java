package org.cardwright.notation;

import java.util.Locale;
import java.util.Optional;

/**
 * The SPICE scale suffixes, the one table of them in cardwright: the card writer and reader, the data reader and
 * the reading of a simulator's printout all take their letters and powers from here.
 *
 * <p>As ngspice 39 reads them (Holger Vogt et al., "Ngspice User's Manual", version 39, 2023, chapter 2, table
 * "Ngspice scale factors"), in any letter case: {@code t} 1e12, {@code g} 1e9, {@code meg} 1e6, {@code k} 1e3,
 * {@code m} 1e-3, {@code u} 1e-6, {@code n} 1e-9, {@code p} 1e-12, {@code f} 1e-15. {@code M} is milli, never
 * mega; mega is {@code meg}. ({@code mil}, 25.4e-6, is a length unit rather than a power of ten, and is left to
 * the card reader.)
 */
public enum SpiceSuffix {
    T("t", 12), G("g", 9), MEG("meg", 6), K("k", 3), M("m", -3), U("u", -6), N("n", -9), P("p", -12), F("f", -15);

    /** Power of ten of the smallest suffix, {@code f}. */
    public static final int SMALLEST_POWER = -15;
    /** Power of ten of the largest suffix, {@code t}. */
    public static final int LARGEST_POWER = 12;
    /** A regular expression that matches one suffix, without regard to case ({@code meg} tried before {@code m}). */
    public static final String PATTERN = "(?i:meg|t|g|k|m|u|n|p|f)";

    private final String text;
    private final int power;

    SpiceSuffix(String text, int power) {
        this.text = text;
        this.power = power;
    }

    /** The suffix as cardwright writes it, in lower case ({@code meg} for mega). */
    public String text() {
        return text;
    }

    /** Its power of ten. */
    public int power() {
        return power;
    }

    /** The suffix written exactly as {@code written} (any letter case), if it is one. */
    public static Optional<SpiceSuffix> of(String written) {
        String lower = written.toLowerCase(Locale.ROOT);
        for (SpiceSuffix s : values()) {
            if (s.text.equals(lower)) {
                return Optional.of(s);
            }
        }
        return Optional.empty();
    }

    /**
     * The suffix a tail of letters after a number starts with, as ngspice reads a number: {@code meg} first, else
     * the first letter ({@code pF} is pico, {@code MA} milli); empty when the first letter is no suffix (a unit).
     */
    public static Optional<SpiceSuffix> leading(String tail) {
        String lower = tail.toLowerCase(Locale.ROOT);
        if (lower.startsWith(MEG.text)) {
            return Optional.of(MEG);
        }
        return lower.isEmpty() ? Optional.empty() : of(lower.substring(0, 1)).filter(s -> s != MEG);
    }

    /** The suffix of a power of ten (a multiple of 3 in [{@value #SMALLEST_POWER}, {@value #LARGEST_POWER}], not 0). */
    public static Optional<SpiceSuffix> ofPower(int power) {
        for (SpiceSuffix s : values()) {
            if (s.power == power) {
                return Optional.of(s);
            }
        }
        return Optional.empty();
    }
}
