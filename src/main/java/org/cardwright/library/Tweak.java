package org.cardwright.library;

import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.model.Param;

/**
 * One parameter pinned or nudged after the fit, then either the others refitted around it or the card only
 * rendered again with the new value.
 *
 * <p>Text forms: {@code RS=0.6} pins RS at 0.6 (card units, SPICE suffixes allowed); {@code RS=+10%} and
 * {@code RS=-5%} nudge the fitted value by a percentage; {@code RS+=50m} and {@code RS-=0.05} nudge it by an
 * amount.
 *
 * @param param  the parameter
 * @param kind   pin or nudge
 * @param amount the pinned value (card units), the relative nudge (0.1 for +10 %), or the absolute nudge (card units)
 * @param refit  true: the other fitted parameters are fitted again with this one held; false: render only
 */
public record Tweak(Param param, Kind kind, double amount, boolean refit) {
    /** How the value is found. */
    public enum Kind { PIN, NUDGE_RELATIVE, NUDGE_ABSOLUTE }

    private static final Pattern FORM = Pattern.compile("\\s*([A-Za-z0-9]+)\\s*([+-]?=)\\s*(.+?)\\s*");

    public Tweak {
        if (param == null || kind == null || !Double.isFinite(amount)) {
            throw new IllegalArgumentException("a tweak needs a parameter, a kind and a finite amount");
        }
        if (param == Param.TNOM) {
            throw new IllegalArgumentException("TNOM is where a card is stated, not a fitted value: set it as a rule (TNOM=25)");
        }
    }

    /**
     * Reads a tweak.
     *
     * @throws IllegalArgumentException naming the text
     */
    public static Tweak parse(String text, boolean refit) {
        Matcher m = FORM.matcher(text);
        if (!m.matches()) {
            throw new IllegalArgumentException("'" + text + "' is not a tweak; write e.g. RS=0.6, RS=+10%, RS+=50m");
        }
        Param p = Param.byKeyword(m.group(1)).orElseThrow(() ->
                new IllegalArgumentException("'" + m.group(1) + "' in '" + text + "' is not a diode parameter cardwright fits"));
        String value = m.group(3);
        try {
            if (m.group(2).equals("=")) {
                if (value.endsWith("%")) {
                    if (!value.startsWith("+") && !value.startsWith("-")) {
                        throw new IllegalArgumentException("'" + text + "': a percentage nudge needs a sign, e.g. +10%");
                    }
                    return new Tweak(p, Kind.NUDGE_RELATIVE, Double.parseDouble(value.substring(0, value.length() - 1)) / 100, refit);
                }
                return new Tweak(p, Kind.PIN, SpiceNumbers.parse(value), refit);
            }
            double x = SpiceNumbers.parse(value);
            return new Tweak(p, Kind.NUDGE_ABSOLUTE, m.group(2).startsWith("-") ? -x : x, refit);
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException("'" + value + "' in '" + text + "' is not a number");
        }
    }

    /** The new value [SI] from the fitted one [SI]. */
    public double apply(double fitted) {
        return switch (kind) {
            case PIN -> param.fromCardValue(amount);
            case NUDGE_RELATIVE -> fitted * (1 + amount);
            case NUDGE_ABSOLUTE -> param.fromCardValue(param.toCardValue(fitted) + amount);
        };
    }

    /** The tweak as text, in the form {@link #parse} reads, then how the card is made. */
    public String text() {
        String core = switch (kind) {
            case PIN -> param + "=" + SpiceNumbers.format(amount, 7);
            case NUDGE_RELATIVE -> param + "=" + (amount >= 0 ? "+" : "") + trim(amount * 100) + "%";
            case NUDGE_ABSOLUTE -> param + (amount >= 0 ? "+=" : "-=") + SpiceNumbers.format(Math.abs(amount), 7);
        };
        return core + (refit ? " (others refitted)" : " (render only)");
    }

    private static String trim(double x) {
        return new java.math.BigDecimal(String.format(Locale.ROOT, "%.9g", x)).stripTrailingZeros().toPlainString();
    }
}
