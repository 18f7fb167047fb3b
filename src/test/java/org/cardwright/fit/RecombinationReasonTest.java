package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * The reason printed when ISR and NR are left out for carrying too little current. The share is 1 - I(without ISR)/I,
 * which rounding can leave a few ulps below 0 when ISR is negligible: the text then says 0.0 %, never -0.0 % (a
 * negative share of a current is not a thing; common practice, no source). Seen in two corpus fits before the fix.
 */
class RecombinationReasonTest {
    @Test
    void aShareRoundedBelowZeroReadsZero() {
        String text = ForwardExtraction.recombinationTooSmall(-2.2e-16, 9.998e-7);
        assertEquals("recombination would carry only 0.0 % of the smallest measured current (9.998e-07 A): too little to "
                + "determine ISR and NR", text);
    }

    @Test
    void aPositiveShareIsPrintedAsItIs() {
        String text = ForwardExtraction.recombinationTooSmall(0.0123, 1e-9);
        assertEquals("recombination would carry only 1.2 % of the smallest measured current (1.000e-09 A): too little to "
                + "determine ISR and NR", text);
    }
}
