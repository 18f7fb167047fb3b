package org.cardwright.data;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * The unit of one column and how its numbers become SI: a power of ten, and for degrees Celsius or Fahrenheit
 * an offset. Conversion is done in decimal arithmetic on the cell's own text, so "1 mA" is exactly the double
 * nearest 1e-3 A and "25 degC" exactly the double nearest 298.15 K.
 *
 * <p>A spelling written exactly as the table has it is taken as written. Otherwise spellings match without
 * regard to case, unless that leaves a prefix in doubt: a capital {@code M} before V, A or F is refused as
 * ambiguous, because SPICE and many instruments read {@code M} as milli while SI reads it as mega; and a
 * resistance unit that matches both milliohm ({@code mohm}) and megohm ({@code Mohm}) when case is ignored,
 * such as {@code MOHM}, is refused too. Written exactly, {@code Mohm} and {@code MOhm} are megohm as in SI.
 *
 * @param quantity   what the column holds
 * @param written    the unit as the header writes it, or empty when the header gives none
 * @param powerOfTen the SI prefix as a power of ten, e.g. -3 for milli [1]
 * @param scale      how the prefixed number becomes SI
 */
record ColumnUnit(Quantity quantity, String written, int powerOfTen, Scale scale) {

    /** How a number, once its prefix is applied, becomes the SI value. */
    enum Scale {
        /** Already SI (V, A, F, K): nothing more to do. */
        LINEAR,
        /** Degrees Celsius: add 273.15 K. */
        CELSIUS,
        /** Degrees Fahrenheit: K = (x + 459.67) * 5/9. */
        FAHRENHEIT
    }

    /** Offset between the Celsius and Kelvin scales, by definition of the Celsius scale (SI Brochure, 2019) [K]. */
    private static final BigDecimal CELSIUS_ZERO = new BigDecimal("273.15");
    /** Absolute zero on the Fahrenheit scale, -459.67 degF by definition [degF]. */
    private static final BigDecimal FAHRENHEIT_OFFSET = new BigDecimal("459.67");
    private static final BigDecimal FIVE = BigDecimal.valueOf(5);
    private static final BigDecimal NINE = BigDecimal.valueOf(9);

    private record Spelling(String text, Quantity quantity, int powerOfTen, Scale scale) {
    }

    /** Every accepted spelling; micro is written u, the micro sign U+00B5 or the Greek mu U+03BC. */
    private static final List<Spelling> SPELLINGS = List.of(
            new Spelling("V", Quantity.VOLTAGE, 0, Scale.LINEAR),
            new Spelling("mV", Quantity.VOLTAGE, -3, Scale.LINEAR),
            new Spelling("uV", Quantity.VOLTAGE, -6, Scale.LINEAR),
            new Spelling("\u00b5V", Quantity.VOLTAGE, -6, Scale.LINEAR),
            new Spelling("\u03bcV", Quantity.VOLTAGE, -6, Scale.LINEAR),
            new Spelling("kV", Quantity.VOLTAGE, 3, Scale.LINEAR),
            new Spelling("A", Quantity.CURRENT, 0, Scale.LINEAR),
            new Spelling("mA", Quantity.CURRENT, -3, Scale.LINEAR),
            new Spelling("uA", Quantity.CURRENT, -6, Scale.LINEAR),
            new Spelling("\u00b5A", Quantity.CURRENT, -6, Scale.LINEAR),
            new Spelling("\u03bcA", Quantity.CURRENT, -6, Scale.LINEAR),
            new Spelling("nA", Quantity.CURRENT, -9, Scale.LINEAR),
            new Spelling("pA", Quantity.CURRENT, -12, Scale.LINEAR),
            new Spelling("fA", Quantity.CURRENT, -15, Scale.LINEAR),
            new Spelling("F", Quantity.CAPACITANCE, 0, Scale.LINEAR),
            new Spelling("mF", Quantity.CAPACITANCE, -3, Scale.LINEAR),
            new Spelling("uF", Quantity.CAPACITANCE, -6, Scale.LINEAR),
            new Spelling("\u00b5F", Quantity.CAPACITANCE, -6, Scale.LINEAR),
            new Spelling("\u03bcF", Quantity.CAPACITANCE, -6, Scale.LINEAR),
            new Spelling("nF", Quantity.CAPACITANCE, -9, Scale.LINEAR),
            new Spelling("pF", Quantity.CAPACITANCE, -12, Scale.LINEAR),
            new Spelling("fF", Quantity.CAPACITANCE, -15, Scale.LINEAR),
            new Spelling("K", Quantity.TEMPERATURE, 0, Scale.LINEAR),
            new Spelling("kelvin", Quantity.TEMPERATURE, 0, Scale.LINEAR),
            new Spelling("degC", Quantity.TEMPERATURE, 0, Scale.CELSIUS),
            new Spelling("\u00b0C", Quantity.TEMPERATURE, 0, Scale.CELSIUS),
            new Spelling("C", Quantity.TEMPERATURE, 0, Scale.CELSIUS),
            new Spelling("celsius", Quantity.TEMPERATURE, 0, Scale.CELSIUS),
            new Spelling("degF", Quantity.TEMPERATURE, 0, Scale.FAHRENHEIT),
            new Spelling("\u00b0F", Quantity.TEMPERATURE, 0, Scale.FAHRENHEIT),
            new Spelling("fahrenheit", Quantity.TEMPERATURE, 0, Scale.FAHRENHEIT),
            new Spelling("ohm", Quantity.RESISTANCE, 0, Scale.LINEAR),
            new Spelling("ohms", Quantity.RESISTANCE, 0, Scale.LINEAR),
            new Spelling("\u03a9", Quantity.RESISTANCE, 0, Scale.LINEAR),
            new Spelling("\u2126", Quantity.RESISTANCE, 0, Scale.LINEAR),
            new Spelling("mohm", Quantity.RESISTANCE, -3, Scale.LINEAR),
            new Spelling("mOhm", Quantity.RESISTANCE, -3, Scale.LINEAR),
            new Spelling("m\u03a9", Quantity.RESISTANCE, -3, Scale.LINEAR),
            new Spelling("kohm", Quantity.RESISTANCE, 3, Scale.LINEAR),
            new Spelling("kOhm", Quantity.RESISTANCE, 3, Scale.LINEAR),
            new Spelling("k\u03a9", Quantity.RESISTANCE, 3, Scale.LINEAR),
            new Spelling("Mohm", Quantity.RESISTANCE, 6, Scale.LINEAR),
            new Spelling("MOhm", Quantity.RESISTANCE, 6, Scale.LINEAR),
            new Spelling("M\u03a9", Quantity.RESISTANCE, 6, Scale.LINEAR),
            new Spelling("megohm", Quantity.RESISTANCE, 6, Scale.LINEAR),
            new Spelling("Gohm", Quantity.RESISTANCE, 9, Scale.LINEAR),
            new Spelling("GOhm", Quantity.RESISTANCE, 9, Scale.LINEAR),
            new Spelling("G\u03a9", Quantity.RESISTANCE, 9, Scale.LINEAR),
            new Spelling("Hz", Quantity.FREQUENCY, 0, Scale.LINEAR),
            new Spelling("kHz", Quantity.FREQUENCY, 3, Scale.LINEAR),
            new Spelling("MHz", Quantity.FREQUENCY, 6, Scale.LINEAR),
            new Spelling("GHz", Quantity.FREQUENCY, 9, Scale.LINEAR));

    ColumnUnit {
        Objects.requireNonNull(quantity, "quantity");
        Objects.requireNonNull(written, "written");
        Objects.requireNonNull(scale, "scale");
    }

    /** The unit of a column whose header gives none: SI, and degrees Celsius for temperature. */
    static ColumnUnit implicit(Quantity quantity) {
        Scale scale = quantity == Quantity.TEMPERATURE ? Scale.CELSIUS : Scale.LINEAR;
        return new ColumnUnit(quantity, "", 0, scale);
    }

    /**
     * The unit a header writes for a column of the given quantity.
     *
     * @throws CellProblem when the spelling is unknown, belongs to another quantity, or has an ambiguous
     *                     capital M prefix
     */
    static ColumnUnit parse(Quantity quantity, String written) throws CellProblem {
        String text = written.strip();
        Spelling found = null;
        for (Spelling s : SPELLINGS) {
            if (s.quantity == quantity && s.text.equals(text)) {
                found = s;
            }
        }
        if (found == null) {
            for (Spelling s : SPELLINGS) {
                if (s.quantity == quantity && s.text.equalsIgnoreCase(text)) {
                    boolean milliAsCapital = s.text.startsWith("m") && text.startsWith("M");
                    boolean prefixesDisagree = found != null && found.powerOfTen != s.powerOfTen;
                    if (milliAsCapital || prefixesDisagree) {
                        String advice = quantity == Quantity.RESISTANCE ? "mohm for milli, Mohm for mega"
                                : s.text + " for milli";
                        throw new CellProblem("ambiguous unit '" + text + "' for " + quantity.word()
                                + ": M may mean mega or milli; write " + advice);
                    }
                    found = s;
                }
            }
        }
        if (found == null) {
            for (Spelling s : SPELLINGS) {
                if (s.quantity != quantity && s.text.equalsIgnoreCase(text)) {
                    throw new CellProblem("unknown unit '" + text + "' for " + quantity.word()
                            + ": it is a " + s.quantity.word() + " unit");
                }
            }
            throw new CellProblem("unknown unit '" + text + "' for " + quantity.word()
                    + "; known: " + String.join(", ", spellingsOf(quantity)));
        }
        return new ColumnUnit(quantity, text, found.powerOfTen, found.scale);
    }

    private static List<String> spellingsOf(Quantity quantity) {
        List<String> names = new ArrayList<>();
        for (Spelling s : SPELLINGS) {
            if (s.quantity == quantity) {
                names.add(s.text);
            }
        }
        return names;
    }

    /** The value in SI units (V, A, F, K), computed exactly in decimal and rounded once. */
    BigDecimal toSi(BigDecimal value) {
        BigDecimal prefixed = value.scaleByPowerOfTen(powerOfTen);
        return switch (scale) {
            case LINEAR -> prefixed;
            case CELSIUS -> prefixed.add(CELSIUS_ZERO);
            case FAHRENHEIT -> prefixed.add(FAHRENHEIT_OFFSET).multiply(FIVE).divide(NINE, MathContext.DECIMAL128);
        };
    }

    /** Whether the unit carries a prefix other than none (mV, kohm, ...). */
    boolean hasPrefix() {
        return powerOfTen != 0;
    }

    /** The unit as a reader would name it in a message: as written, or the implicit one. */
    String displayName() {
        if (!written.isEmpty()) {
            return written;
        }
        return scale == Scale.CELSIUS ? "degC" : quantity.siUnit();
    }
}
