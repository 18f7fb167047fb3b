package org.cardwright.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.cardwright.model.Param;
import org.junit.jupiter.api.Test;

/**
 * The subcircuit card of a diode with a resistor between its terminals: written in one shape, read back
 * strictly, and anything else refused with file and line. (The shape itself is ours; the SPICE element syntax
 * of .subckt, D, R and .ends is the open standard's, as every SPICE manual gives it.)
 */
class ShuntedCardTest {
    /** Relative tolerance of a value read back from a card written with 7 significant digits [1]. */
    private static final double SEVEN_DIGITS = 5e-7;

    private static final String PLAIN = "* model KX: invented test card\n.model KX D(\n+ IS=2f\n+ N=1.03\n+ RS=900m\n+ )\n";

    private static String written() {
        return ShuntedCard.render("KX", PLAIN, 149_952.1, List.of("invented test card", ""), 7);
    }

    @Test
    void writesTheShapeItDocuments() {
        assertEquals("""
                * invented test card
                *
                .subckt KX_SHUNTED A K
                DJ A K KX
                RSH A K 149.9521k
                .model KX D(
                + IS=2f
                + N=1.03
                + RS=900m
                + )
                .ends KX_SHUNTED
                """, written());
        assertEquals("KX.shunted.gnucap.lib", ShuntedCard.fileName("KX", Dialect.GNUCAP));
    }

    @Test
    void readsBackTheModelAndTheResistor() {
        String text = written();
        assertTrue(ShuntedCard.isSubcircuit(text, "KX.shunted.ngspice.lib"));
        ShuntedCard.Read r = ShuntedCard.read(text, "KX.shunted.ngspice.lib", Dialect.NGSPICE);
        assertEquals("KX", r.card().name());
        assertEquals("KX_SHUNTED", r.subcircuit());
        assertEquals(149_952.1, r.shuntResistance(), SEVEN_DIGITS * 149_952.1);
        assertEquals(2e-15, r.card().parameters().get(Param.IS), SEVEN_DIGITS * 2e-15);
        assertEquals(List.of(), r.card().notices());
        assertTrue(r.modelText().startsWith(".model KX D("), r.modelText());
        assertTrue(!ShuntedCard.isSubcircuit(PLAIN, "KX.ngspice.lib"), "a plain card is not a subcircuit");
    }

    @Test
    void acceptsCommentsTheOtherOrderAndCase() {
        String text = "* c\n.SUBCKT kx_s a k\n* inside\nrleak k a 1meg ; inline\nd1 a k kx\n.model kx d(is=1f)\n.ENDS\n* after\n";
        ShuntedCard.Read r = ShuntedCard.read(text, "f.lib", Dialect.NGSPICE);
        assertEquals(1e6, r.shuntResistance(), SEVEN_DIGITS * 1e6);
    }

    @Test
    void refusesEverythingElseNamingFileAndLine() {
        String base = written();
        refuses(base.replace("RSH A K 149.9521k\n", "RSH A K 149.9521k\nC1 A K 1p\n"), "f.lib:6:", "C1 A K 1p");
        refuses(base.replace("RSH A K 149.9521k\n", "RSH A K 149.9521k\nR2 A K 1k\n"), "f.lib:6:", "second resistor");
        refuses(base.replace("RSH A K 149.9521k", "RSH A K lots"), "f.lib:5:", "not a number");
        refuses(base.replace("RSH A K 149.9521k", "RSH A 0 1k"), "f.lib:5:", "RSH A 0 1k");
        refuses(base.replace("RSH A K 149.9521k", "RSH A K -1k"), "f.lib:5:", "positive");
        refuses(base.replace("DJ A K KX", "DJ A K OTHER"), "f.lib:4:", "OTHER");
        refuses(base.replace("DJ A K KX", "DJ K A KX"), "f.lib:4:", "DJ K A KX");
        refuses(base.replace(".subckt KX_SHUNTED A K", ".subckt KX_SHUNTED A K B"), "f.lib:3:", "two ports");
        refuses(base.replace(".ends KX_SHUNTED\n", ""), "f.lib:", "no .ends");
        refuses(base + "V1 A 0 1\n", "f.lib:12:", "follow .ends");
        refuses(base.replace(".ends KX_SHUNTED", ".ends OTHER"), "f.lib:11:", ".ends OTHER");
        refuses(base.replace("DJ A K KX\n", ""), "f.lib", "diode line");
        refuses(base.replace("+ N=1.03", "+ N=abc"), "f.lib:8:", "N=abc");
        refuses(base.replace(".model KX D(", ".model KX D(\n+ IS=3f").replace(".ends", ".model KY D()\n.ends"), "f.lib:",
                "second .model");
        refuses(".model KX D(IS=1f)\n", "f.lib:1:", ".subckt");
    }

    private static void refuses(String text, String where, String what) {
        CardFormatException e = assertThrows(CardFormatException.class, () -> ShuntedCard.read(text, "f.lib", Dialect.NGSPICE),
                "refused: " + text);
        assertTrue(e.getMessage().startsWith(where), e.getMessage());
        assertTrue(e.getMessage().contains(what), e.getMessage());
        assertTrue(!e.getMessage().contains("\n"), "one line: " + e.getMessage());
    }
}
