package org.cardwright.fit;

import java.util.Locale;
import org.cardwright.model.Param;

/**
 * What the user says about one parameter before a fit: hold it at a value, force it free, switch its term
 * off, or bound it.
 *
 * <p>Text forms (command line and device files): {@code RS=0.5} (fixed), {@code ISR=free} (fitted, term on),
 * {@code IKF=off} (term off, parameter not given), {@code N=1..2} (fitted within bounds; either side may be
 * empty: {@code RS=..10}), {@code IS=1e-12~} (fitted, starting from that value). Numbers may carry SPICE
 * suffixes only through the caller; here plain numbers in SI (TNOM in degrees C as on a card).
 *
 * @param param the parameter
 * @param kind  what to do with it
 * @param value the fixed value or start value [SI]; NaN when not used
 * @param lower lower bound [SI]; -infinity when none
 * @param upper upper bound [SI]; +infinity when none
 */
public record ParameterRule(Param param, Kind kind, double value, double lower, double upper) {

    /** The four kinds of rule. */
    public enum Kind { FIXED, FREE, OFF, BOUNDED }

    public ParameterRule {
        if (param == null || kind == null) {
            throw new IllegalArgumentException("parameter and kind are required");
        }
        if (lower > upper) {
            throw new IllegalArgumentException(param + ": lower bound " + lower + " exceeds upper bound " + upper);
        }
        if (kind == Kind.FIXED && !Double.isFinite(value)) {
            throw new IllegalArgumentException(param + ": a fixed value must be a finite number");
        }
    }

    /** Holds {@code p} at {@code value} [SI]. */
    public static ParameterRule fixed(Param p, double value) {
        return new ParameterRule(p, Kind.FIXED, value, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);
    }

    /** Forces {@code p} free (and its term on). */
    public static ParameterRule free(Param p) {
        return new ParameterRule(p, Kind.FREE, Double.NaN, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);
    }

    /**
     * Parses one rule, e.g. {@code RS=0.5}, {@code ISR=free}, {@code IKF=off}, {@code N=1..2}, {@code IS=1e-12~}.
     *
     * @throws IllegalArgumentException with a one-line message naming the text
     */
    public static ParameterRule parse(String text, NumberReader numbers) {
        int eq = text.indexOf('=');
        if (eq <= 0) {
            throw new IllegalArgumentException("'" + text + "' is not a parameter rule; write e.g. RS=0.5, ISR=free, IKF=off, N=1..2");
        }
        String key = text.substring(0, eq).trim();
        String rhs = text.substring(eq + 1).trim();
        Param p = Param.byKeyword(key).orElseThrow(() ->
                new IllegalArgumentException("'" + key + "' in '" + text + "' is not a diode parameter cardwright fits"));
        String low = rhs.toLowerCase(Locale.ROOT);
        if (low.equals("free")) {
            return free(p);
        }
        if (low.equals("off")) {
            if (!p.activeOnlyWhenGiven()) {
                throw new IllegalArgumentException("'" + text + "': only terms that exist when given (ISR, IKF, IKR, BV, RTH0) can be switched off; fix "
                        + p + " at a value instead");
            }
            return new ParameterRule(p, Kind.OFF, Double.NaN, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);
        }
        int dots = rhs.indexOf("..");
        if (dots >= 0) {
            String a = rhs.substring(0, dots).trim();
            String b = rhs.substring(dots + 2).trim();
            double lo = a.isEmpty() ? Double.NEGATIVE_INFINITY : p.fromCardValue(number(numbers, a, text));
            double hi = b.isEmpty() ? Double.POSITIVE_INFINITY : p.fromCardValue(number(numbers, b, text));
            if (lo > hi) {
                throw new IllegalArgumentException("'" + text + "': the lower bound is above the upper bound");
            }
            return new ParameterRule(p, Kind.BOUNDED, Double.NaN, lo, hi);
        }
        if (rhs.endsWith("~")) {
            double v = p.fromCardValue(number(numbers, rhs.substring(0, rhs.length() - 1).trim(), text));
            return new ParameterRule(p, Kind.FREE, v, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);
        }
        return fixed(p, p.fromCardValue(number(numbers, rhs, text)));
    }

    private static double number(NumberReader numbers, String token, String text) {
        try {
            double v = numbers.read(token);
            if (!Double.isFinite(v)) {
                throw new NumberFormatException(token);
            }
            return v;
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException("'" + token + "' in '" + text + "' is not a number");
        }
    }

    /** Reads a number token (lets the caller allow SPICE suffixes). */
    @FunctionalInterface
    public interface NumberReader {
        double read(String token);
    }

    /** The rule as text, in the form {@link #parse} reads. */
    public String text() {
        return switch (kind) {
            case FIXED -> param + "=" + param.toCardValue(value);
            case FREE -> param + (Double.isNaN(value) ? "=free" : "=" + param.toCardValue(value) + "~");
            case OFF -> param + "=off";
            case BOUNDED -> param + "=" + (Double.isInfinite(lower) ? "" : param.toCardValue(lower)) + ".."
                    + (Double.isInfinite(upper) ? "" : param.toCardValue(upper));
        };
    }
}
