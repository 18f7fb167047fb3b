package org.cardwright.card;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.cardwright.notation.SpiceSuffix;

/**
 * Writing and reading numbers the way SPICE netlists spell them.
 *
 * <p>Writing uses the engineering suffixes {@code f p n u m k meg g t} in lower case. Mega is always {@code meg}:
 * SPICE reads {@code M} (either case) as milli. Outside [1e-15, 1e15) the plain exponent form is used.
 *
 * <p>Reading follows ngspice 39: suffixes in any letter case ({@code T G MEG K M MIL U N P F}), letters after the
 * suffix ignored ({@code 10pF} is 1e-11, {@code 1F} is 1e-15, {@code 3k3} is 3000), exponent forms, signs.
 * Both directions are independent of the default locale.
 *
 * <p>On a card ({@link #cardValue}), a parameter that spans decades (one fitted on a log scale: the currents IS,
 * ISR, IKF, IKR, IBV, the capacitance CJO, the time TT, the thermal resistance RTH0) is written with a suffix, as
 * the trade writes it ({@code IS=15.262f}, {@code IKF=46.40908m}); every other parameter (N, NR, RS, EG, XTI, VJ,
 * M, FC, BV, NBV, TCV, TRS1, TRS2, TLEV, TNOM) is a plain decimal that reads at a glance ({@code EG=0.6903036},
 * {@code RS=0.8526463}), in exponent form only below 1e-4 or from 1e6 up ({@code TRS2=1.5e-6}).
 */
public final class SpiceNumbers {
    /** Fewest significant digits {@link #format} accepts. */
    public static final int MIN_SIGNIFICANT_DIGITS = 1;
    /**
     * Most significant digits {@link #format} accepts: every decimal of up to 15 digits survives a trip through a
     * double unchanged (DBL_DIG of IEEE 754 binary64), so a written card reads back to the same text.
     */
    public static final int MAX_SIGNIFICANT_DIGITS = 15;

    private static final int SMALLEST_SUFFIX_EXPONENT = SpiceSuffix.SMALLEST_POWER;
    private static final int LARGEST_SUFFIX_EXPONENT = SpiceSuffix.LARGEST_POWER;

    /** Mantissa with optional exponent, then an optional tail that starts with a letter. */
    private static final Pattern NUMBER = Pattern.compile(
            "([+-]?(?:[0-9]+\\.?[0-9]*|\\.[0-9]+))(?:[eE]([+-]?[0-9]+))?([A-Za-z][A-Za-z0-9_]*)?");

    private static final BigDecimal MIL = new BigDecimal("25.4e-6");

    private SpiceNumbers() {
    }

    /**
     * Writes {@code value} rounded to {@code significantDigits} significant digits, with an engineering suffix
     * when the rounded magnitude lies in [1e-15, 1e15), else in exponent form; trailing zeros are removed.
     *
     * @param value a finite number
     * @param significantDigits between {@link #MIN_SIGNIFICANT_DIGITS} and {@link #MAX_SIGNIFICANT_DIGITS}
     * @return for example {@code 2.5n}, {@code 10meg}, {@code -1.5m}, {@code 100}, {@code 0}, {@code 1.234e-18}
     */
    public static String format(double value, int significantDigits) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("cannot write a non-finite number: " + value);
        }
        if (significantDigits < MIN_SIGNIFICANT_DIGITS || significantDigits > MAX_SIGNIFICANT_DIGITS) {
            throw new IllegalArgumentException("significant digits must lie in [" + MIN_SIGNIFICANT_DIGITS + ", "
                    + MAX_SIGNIFICANT_DIGITS + "], got " + significantDigits);
        }
        if (value == 0.0) {
            return "0";
        }
        // BigDecimal.valueOf starts from the shortest decimal that reads back as this double, so 1.005 rounds
        // to 1.01 as a reader of the number expects; rounding happens before the exponent is chosen, so a
        // carry (999.9999999u -> 1m) lands in the right group.
        BigDecimal rounded = BigDecimal.valueOf(value)
                .round(new MathContext(significantDigits, RoundingMode.HALF_UP))
                .stripTrailingZeros();
        int decimalExponent = rounded.precision() - rounded.scale() - 1;
        int engineeringExponent = Math.floorDiv(decimalExponent, 3) * 3;
        if (engineeringExponent < SMALLEST_SUFFIX_EXPONENT || engineeringExponent > LARGEST_SUFFIX_EXPONENT) {
            return exponentForm(rounded, decimalExponent);
        }
        String mantissa = rounded.movePointLeft(engineeringExponent).stripTrailingZeros().toPlainString();
        return mantissa + SpiceSuffix.ofPower(engineeringExponent).map(SpiceSuffix::text).orElse("");
    }

    /** Smallest magnitude a plain-decimal card value is written without an exponent. */
    private static final BigDecimal PLAIN_FROM = new BigDecimal("1e-4");
    /** Magnitude from which a plain-decimal card value is written with an exponent. */
    private static final BigDecimal PLAIN_BELOW = new BigDecimal("1e6");

    /**
     * Writes the value of {@code param} as a card states it: with a SPICE suffix when the parameter spans decades
     * (fitted on a log scale), else as a plain decimal (exponent form outside [1e-4, 1e6)); see the class comment.
     *
     * @param param             the parameter, which decides the form
     * @param value             a finite number, in the card's units
     * @param significantDigits as for {@link #format}
     */
    public static String cardValue(org.cardwright.model.Param param, double value, int significantDigits) {
        if (param.fitScale() == org.cardwright.model.Param.Scale.LOG) {
            return format(value, significantDigits);
        }
        return plain(value, significantDigits);
    }

    /**
     * Writes {@code value} rounded to {@code significantDigits} significant digits as a plain decimal ({@code
     * 0.6903036}, {@code -0.00220409}, {@code 1200}), or in exponent form ({@code 1.5e-6}) when its magnitude is
     * below 1e-4 or from 1e6 up; trailing zeros are removed. Reads back with {@link #parse} to the same text.
     */
    public static String plain(double value, int significantDigits) {
        format(value, significantDigits);  // the same checks of value and digits
        if (value == 0.0) {
            return "0";
        }
        BigDecimal rounded = BigDecimal.valueOf(value)
                .round(new MathContext(significantDigits, RoundingMode.HALF_UP))
                .stripTrailingZeros();
        BigDecimal magnitude = rounded.abs();
        if (magnitude.compareTo(PLAIN_FROM) < 0 || magnitude.compareTo(PLAIN_BELOW) >= 0) {
            return exponentForm(rounded, rounded.precision() - rounded.scale() - 1);
        }
        return rounded.toPlainString();
    }

    private static String exponentForm(BigDecimal rounded, int decimalExponent) {
        String mantissa = rounded.movePointLeft(decimalExponent).stripTrailingZeros().toPlainString();
        return mantissa + "e" + decimalExponent;
    }

    /**
     * Reads a SPICE number.
     *
     * @param token for example {@code 2.5n}, {@code 1e-9}, {@code 10MEG}, {@code 4.7uF}, {@code 2mil}
     * @return the value, correctly rounded to the nearest double
     * @throws NumberFormatException naming the token when it is not a SPICE number or overflows a double
     */
    public static double parse(String token) {
        if (token == null) {
            throw new NumberFormatException("not a SPICE number: null");
        }
        String text = token.trim();
        Matcher m = NUMBER.matcher(text);
        if (!m.matches()) {
            throw new NumberFormatException("not a SPICE number: '" + token + "'");
        }
        double value;
        BigDecimal number;
        try {
            number = new BigDecimal(m.group(1));
            if (m.group(2) != null) {
                number = number.scaleByPowerOfTen(Integer.parseInt(m.group(2)));
            }
            if (m.group(3) != null) {
                number = applySuffix(number, m.group(3).toUpperCase(Locale.ROOT));
            }
            value = number.doubleValue();
        } catch (NumberFormatException | ArithmeticException e) {
            throw new NumberFormatException("SPICE number exponent out of range: '" + token + "'");
        }
        if (!Double.isFinite(value)) {
            throw new NumberFormatException("SPICE number too large for a double: '" + token + "'");
        }
        if (value == 0.0 && number.signum() != 0) {
            throw new NumberFormatException("SPICE number too small for a double: '" + token + "'");
        }
        return value;
    }

    private static BigDecimal applySuffix(BigDecimal number, String tail) {
        if (tail.startsWith("MIL")) {
            return number.multiply(MIL);
        }
        // ngspice 39 ignores letters that are not a scale factor (units such as V, A, ohm)
        return SpiceSuffix.leading(tail).map(s -> number.scaleByPowerOfTen(s.power())).orElse(number);
    }
}
