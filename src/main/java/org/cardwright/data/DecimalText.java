package org.cardwright.data;

import java.math.BigDecimal;
import java.util.Locale;
import java.util.regex.Pattern;

/**
 * Reads one cell as a plain decimal number: optional sign, digits with an optional point, optional exponent
 * ({@code -1.5}, {@code .25}, {@code 3e-9}). Anything else is refused with a reason; in particular NaN and
 * infinities in every common spelling, hexadecimal, and Java's type suffixes, which {@link Double#parseDouble}
 * would quietly accept.
 */
final class DecimalText {
    private static final Pattern DECIMAL = Pattern.compile("[+-]?(\\d++(?:\\.\\d*+)?|\\.\\d++)([eE][+-]?\\d++)?");
    /** NaN and infinity as programs write them, including the spreadsheet and C runtime forms. */
    private static final Pattern NOT_FINITE = Pattern.compile(
            "[+-]?(nan|inf|infinity|infinite|\u221e|1\\.#inf\\d*|1\\.#ind\\d*|1\\.#qnan\\d*|1\\.#snan\\d*)");

    private DecimalText() {
    }

    /**
     * The number the text writes, exactly.
     *
     * @throws CellProblem when the text is empty, not a plain decimal number, or NaN or infinite
     */
    static BigDecimal parse(String text) throws CellProblem {
        String t = text.strip();
        if (t.isEmpty()) {
            throw new CellProblem("empty cell");
        }
        if (t.length() > CellNumber.MAX_NUMBER_CHARS) {
            throw new CellProblem("text of " + t.length() + " characters where a number is expected; a number has at "
                    + "most " + CellNumber.MAX_NUMBER_CHARS);
        }
        if (NOT_FINITE.matcher(t.toLowerCase(Locale.ROOT)).matches()) {
            throw new CellProblem("not a finite number");
        }
        if (!DECIMAL.matcher(t).matches()) {
            throw new CellProblem("not a number");
        }
        try {
            return new BigDecimal(t);
        } catch (NumberFormatException e) {
            // only an exponent beyond the int range gets here
            throw new CellProblem("number out of range");
        }
    }

    /**
     * The double nearest an SI value, refusing values that overflow to infinity or underflow to zero.
     *
     * @throws CellProblem when the value does not fit a double
     */
    static double toDouble(BigDecimal si) throws CellProblem {
        double d = si.doubleValue();
        if (Double.isInfinite(d)) {
            throw new CellProblem("number too large");
        }
        if (d == 0 && si.signum() != 0) {
            throw new CellProblem("number too small, it would be read as zero");
        }
        return d;
    }
}
