package org.cardwright.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Random;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.junit.jupiter.api.Test;

/**
 * Issue 11, "Cards": values a person reads at a glance. Parameters that span decades keep the SPICE suffixes the
 * trade writes them with (IS=15.262f, IKF=46.40908m; common practice, no source); the others are plain decimals
 * (EG=0.6903036, not 690.3036m). Every form reads back to the same number and renders to the same bytes.
 */
class CardValueFormTest {
    private static final int DIGITS = 7;

    @Test
    void eachParameterKindHasItsForm() {
        assertEquals("0.6903036", SpiceNumbers.cardValue(Param.EG, 0.69030361, DIGITS));
        assertEquals("0.8526463", SpiceNumbers.cardValue(Param.RS, 0.85264631, DIGITS));
        assertEquals("0.035", SpiceNumbers.cardValue(Param.RS, 0.035, DIGITS));
        assertEquals("-0.00220409", SpiceNumbers.cardValue(Param.TCV, -2.20409e-3, DIGITS));
        assertEquals("1.5e-6", SpiceNumbers.cardValue(Param.TRS2, 1.5e-6, DIGITS));
        assertEquals("1200", SpiceNumbers.cardValue(Param.BV, 1200, DIGITS));
        assertEquals("27", SpiceNumbers.cardValue(Param.TNOM, 27, DIGITS));
        assertEquals("15.262f", SpiceNumbers.cardValue(Param.IS, 15.262e-15, DIGITS));
        assertEquals("46.40908m", SpiceNumbers.cardValue(Param.IKF, 0.04640908, DIGITS));
        assertEquals("160.2p", SpiceNumbers.cardValue(Param.CJO, 160.2e-12, DIGITS));
        assertEquals("4n", SpiceNumbers.cardValue(Param.TT, 4e-9, DIGITS));
        assertEquals("150.19", SpiceNumbers.cardValue(Param.RTH0, 150.19, DIGITS));
        assertEquals("0", SpiceNumbers.cardValue(Param.TRS1, 0, DIGITS));
    }

    @Test
    void everyFormReadsBackToTheSameTextInEveryDialect() {
        Random random = new Random(1111);
        for (int trial = 0; trial < 60; trial++) {
            Map<Param, Double> v = new EnumMap<>(Param.class);
            v.put(Param.IS, Math.pow(10, -18 + 10 * random.nextDouble()));
            v.put(Param.N, 0.8 + 2 * random.nextDouble());
            v.put(Param.RS, Math.pow(10, -4 + 6 * random.nextDouble()));
            v.put(Param.EG, 0.6 + 2 * random.nextDouble());
            v.put(Param.XTI, -3 + 8 * random.nextDouble());
            v.put(Param.TRS1, (random.nextDouble() - 0.5) * Math.pow(10, -6 + 4 * random.nextDouble()));
            v.put(Param.CJO, Math.pow(10, -14 + 5 * random.nextDouble()));
            v.put(Param.VJ, 0.3 + random.nextDouble());
            v.put(Param.M, 0.2 + 0.6 * random.nextDouble());
            v.put(Param.TT, Math.pow(10, -12 + 6 * random.nextDouble()));
            v.put(Param.BV, Math.pow(10, 0.5 + 3 * random.nextDouble()));
            v.put(Param.IBV, Math.pow(10, -9 + 6 * random.nextDouble()));
            v.put(Param.TCV, (random.nextDouble() - 0.5) * 1e-2);
            v.put(Param.TNOM, 273.15 + 20 + 10 * random.nextDouble());
            ModelCard card = new ModelCard("F" + trial, DiodeParameters.of(v), List.of("invented values, trial " + trial));
            for (Dialect d : Dialect.values()) {
                // render() refuses a card that does not read back exactly (CardWriter's read-back check)
                String text = new CardWriter(Optional.empty()).render(card, d, DIGITS).text();
                ParsedCard back = new CardReader().parse(text, "f.lib", d);
                String again = new CardWriter(Optional.empty()).render(back.toModelCard(), d, DIGITS).text();
                assertEquals(text, again, "re-read and re-rendered, byte for byte (" + d + ")");
                for (String line : text.lines().filter(l -> l.startsWith("+ ") && l.contains("=")).toList()) {
                    String keyword = line.substring(2, line.indexOf('='));
                    String value = line.substring(line.indexOf('=') + 1);
                    Param p = d.resolve(keyword).orElseThrow();
                    boolean suffixed = value.matches(".*[a-z]$");
                    if (p.fitScale() == Param.Scale.LINEAR) {
                        assertTrue(!suffixed, "a plain decimal for " + keyword + ": " + line);
                    }
                }
            }
        }
    }
}
