package org.cardwright.compare;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.cardwright.card.CardReader;
import org.cardwright.card.Dialect;
import org.cardwright.card.ParsedCard;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.sim.BuiltinCapacitance;
import org.cardwright.sim.BuiltinEngine;
import org.junit.jupiter.api.Test;

/** Two cards that agree must not be reported as different because one states what the other leaves at default. */
class CompareEdgesTest {
    @Test
    void cardsWithoutCapacitanceAndWithDefaultsCompareAsEqual() throws Exception {
        ParsedCard a = new CardReader().parse(".model A D(IS=1e-14 TT=5n TNOM=27)\n", "a.lib", Dialect.NGSPICE);
        ParsedCard b = new CardReader().parse(".model B D(IS=1e-14)\n", "b.lib", Dialect.NGSPICE);
        ComparisonPlan plan = new ComparisonPlan(List.of(300.15), 1e-9, 1e-1, List.of(1.0), List.of(0.0, 1.0, 5.0),
                ComparisonPlan.DEFAULT_FREQUENCY, new ComparisonLimits(5e-3, 2, 0.1, 0.02));
        CardComparison c = new CardComparer(new BuiltinEngine(SimulatorOptions.NGSPICE_DEFAULTS),
                new BuiltinCapacitance(SimulatorOptions.NGSPICE_DEFAULTS)).compare(a, "a.lib", b, "b.lib", plan);
        assertEquals(0, c.flaggedCount(), "TT times GMIN (attofarads) against no capacitance is not a difference");
        String text = ComparisonText.render(c, plan);
        assertEquals(false, text.lines().anyMatch(l -> l.startsWith("  TNOM") && l.endsWith("*")), text);
    }
}
