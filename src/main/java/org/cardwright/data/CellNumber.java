package org.cardwright.data;

import java.math.BigDecimal;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.cardwright.notation.SpiceSuffix;

/**
 * Reads one cell or setting value as a number the way instrument exports and SPICE decks write it: a plain
 * decimal ({@link DecimalText}), optionally followed by a SPICE scale suffix, and with a decimal comma where
 * the file allows one. The value stays exact (decimal); the caller converts it to SI once.
 *
 * <p>Suffixes, without regard to case, as SPICE reads them (Holger Vogt et al., "Ngspice User's Manual",
 * version 39, 2023, chapter 2, table "Ngspice scale factors"; {@code mil} is left out):
 * {@code t} 1e12, {@code g} 1e9, {@code meg} 1e6, {@code k} 1e3, {@code m} 1e-3, {@code u} 1e-6, {@code n}
 * 1e-9, {@code p} 1e-12, {@code f} 1e-15. So {@code M} is milli, never mega; {@code meg} is mega. Nothing may
 * follow the suffix (SPICE would skip trailing letters such as a unit; we refuse them so that {@code 5 mA}
 * cannot be read as 5 milli of the column's unit by accident).
 *
 * <p>A decimal comma ({@code 0,65}) is read only when the caller says the file may use one, that is when
 * cells are not separated by commas; a number holding both a comma and a point is refused.
 */
final class CellNumber {
    private static final Pattern NUMBER_AND_SUFFIX = Pattern.compile(
            "([+-]?(?:\\d++(?:[.,]\\d*+)?|[.,]\\d++)(?:[eE][+-]?\\d++)?)(" + SpiceSuffix.PATTERN + ")?");
    /**
     * Longest number read [characters]: a double needs at most 17 significant digits and a three-digit
     * exponent, so 100 leaves room for any export's padding while keeping the decimal arithmetic cheap.
     */
    static final int MAX_NUMBER_CHARS = 100;

    /**
     * A number as written.
     *
     * @param value  the number with its suffix applied, exactly
     * @param suffix the suffix as written, empty when there is none
     */
    record Reading(BigDecimal value, String suffix) {
        /** Whether the suffix is a lone capital M, which SPICE reads as milli while a reader may mean mega. */
        boolean capitalMilli() {
            return suffix.equals("M");
        }
    }

    private CellNumber() {
    }

    /**
     * The number a cell writes.
     *
     * @param text         the cell
     * @param decimalComma whether a comma may stand for the decimal point
     * @throws CellProblem when the text is empty, not a number, NaN or infinite, or uses a decimal comma where
     *                     the file's delimiter is a comma
     */
    static Reading parse(String text, boolean decimalComma) throws CellProblem {
        String t = text.strip();
        if (t.isEmpty()) {
            throw new CellProblem("empty cell");
        }
        if (t.length() > MAX_NUMBER_CHARS) {
            throw new CellProblem("cell of " + t.length() + " characters where a number is expected; a number has at most "
                    + MAX_NUMBER_CHARS);
        }
        if (isPlainDecimal(t)) {
            // the common cell: what the pattern below reads with no suffix and no comma, decided in one pass
            try {
                return new Reading(new BigDecimal(t), "");
            } catch (NumberFormatException e) {
                // only an exponent beyond the int range gets here
                throw new CellProblem("number out of range");
            }
        }
        return byPattern(t, decimalComma);
    }

    /**
     * {@link #parse}'s reading of a stripped, non-empty cell of at most {@link #MAX_NUMBER_CHARS} characters by its
     * pattern: every cell that is not a plain decimal, and the reference the plain path is held to (CellNumberPlainTest).
     */
    static Reading byPattern(String t, boolean decimalComma) throws CellProblem {
        Matcher m = NUMBER_AND_SUFFIX.matcher(t);
        if (!m.matches()) {
            DecimalText.parse(t); // throws the reason: not a finite number, or not a number
            throw new CellProblem("not a number");
        }
        String number = m.group(1);
        if (number.indexOf(',') >= 0) {
            if (!decimalComma) {
                throw new CellProblem("not a number (a decimal comma is read only in files whose cells are "
                        + "separated by semicolons or tabs)");
            }
            number = number.replace(',', '.');
        }
        String suffix = m.group(2) == null ? "" : m.group(2);
        BigDecimal value;
        try {
            value = new BigDecimal(number);
        } catch (NumberFormatException e) {
            // only an exponent beyond the int range gets here
            throw new CellProblem("number out of range");
        }
        return new Reading(value.scaleByPowerOfTen(suffixPower(suffix)), suffix);
    }

    /**
     * Whether {@code t} is, in full, a decimal that {@link #NUMBER_AND_SUFFIX} matches with the number group being
     * all of {@code t} and no suffix: an optional sign, digits with an optional point (at least one digit before
     * or after it), an optional exponent of {@code e} or {@code E}, an optional sign and at least one digit.
     * Anything else (a comma, a suffix, a blank) is left to the pattern.
     */
    static boolean isPlainDecimal(String t) {
        int n = t.length();
        int i = 0;
        if (i < n && (t.charAt(i) == '+' || t.charAt(i) == '-')) {
            i++;
        }
        int before = i;
        while (i < n && isDigit(t.charAt(i))) {
            i++;
        }
        int digits = i - before;
        if (i < n && t.charAt(i) == '.') {
            i++;
            int after = i;
            while (i < n && isDigit(t.charAt(i))) {
                i++;
            }
            digits += i - after;
        }
        if (digits == 0) {
            return false;
        }
        if (i < n && (t.charAt(i) == 'e' || t.charAt(i) == 'E')) {
            i++;
            if (i < n && (t.charAt(i) == '+' || t.charAt(i) == '-')) {
                i++;
            }
            int exponent = i;
            while (i < n && isDigit(t.charAt(i))) {
                i++;
            }
            if (i == exponent) {
                return false;
            }
        }
        return i == n;
    }

    /** An ASCII digit (the pattern's {@code \d} without UNICODE_CHARACTER_CLASS). */
    private static boolean isDigit(char c) {
        return c >= '0' && c <= '9';
    }

    /** The power of ten of a SPICE suffix [1]. */
    static int suffixPower(String suffix) {
        if (suffix.isEmpty()) {
            return 0;
        }
        return SpiceSuffix.of(suffix).orElseThrow(() -> new IllegalArgumentException("not a SPICE suffix: '" + suffix + "'"))
                .power();
    }
}
