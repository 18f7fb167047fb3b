package org.cardwright.data;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.math.BigDecimal;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * {@link CellNumber#parse} reads a plain decimal in one hand-written pass ({@link CellNumber#isPlainDecimal}) and
 * everything else through its pattern. The reference here is the reading by the pattern alone
 * ({@link CellNumber#byPattern}, the path every cell took before the one-pass path): on a seeded family of cells
 * made of digits, points, commas, exponents, signs, suffixes and blanks, both must give the same number (value and
 * scale), the same suffix, or the same refusal.
 */
class CellNumberPlainTest {
    private static final String[] PIECES = {"0", "1", "7", "12", "999", ".", ",", "e", "E", "+", "-", "m", "M",
        "meg", "k", "u", " ", "x", "e99999999999", "\u0663", "1e", "5e-3"};

    /** The reading by the pattern alone, or the refusal's message. */
    private static String reference(String text, boolean decimalComma) {
        try {
            String t = text.strip();
            if (t.isEmpty()) {
                throw new CellProblem("empty cell");
            }
            if (t.length() > CellNumber.MAX_NUMBER_CHARS) {
                return "too long";
            }
            CellNumber.Reading r = CellNumber.byPattern(t, decimalComma);
            BigDecimal v = r.value();
            String suffix = r.suffix();
            return v.unscaledValue() + " scale " + v.scale() + " suffix '" + suffix + "'";
        } catch (CellProblem e) {
            return "refused: " + e.getMessage();
        }
    }

    private static String actual(String text, boolean decimalComma) {
        try {
            if (text.strip().length() > CellNumber.MAX_NUMBER_CHARS) {
                return "too long";
            }
            CellNumber.Reading r = CellNumber.parse(text, decimalComma);
            return r.value().unscaledValue() + " scale " + r.value().scale() + " suffix '" + r.suffix() + "'";
        } catch (CellProblem e) {
            return "refused: " + e.getMessage();
        }
    }

    @Test
    void plainDecimalsAndEdgesReadAsThePatternReadsThem() {
        for (String t : new String[] {"0", "-0", "+1", "1.", ".5", ".", "-.5e3", "1e5", "1E+05", "1e", "1e+", "1.5e-3",
            "00012.3400", "1e2147483648", "1e-2147483649", "5m", "5meg", "0,5", "1.2.3", "--1", " 7 ", "\u0663"}) {
            for (boolean comma : new boolean[] {false, true}) {
                assertEquals(reference(t, comma), actual(t, comma), () -> "cell '" + t + "'");
            }
        }
    }

    @Test
    void seededFamilyReadsAsThePatternReadsIt() {
        Random random = new Random(8128L);
        for (int n = 0; n < 20_000; n++) {
            StringBuilder sb = new StringBuilder();
            int parts = 1 + random.nextInt(6);
            for (int p = 0; p < parts; p++) {
                sb.append(PIECES[random.nextInt(PIECES.length)]);
            }
            String t = sb.toString();
            boolean comma = random.nextBoolean();
            assertEquals(reference(t, comma), actual(t, comma), () -> "cell '" + t + "'");
        }
    }
}
