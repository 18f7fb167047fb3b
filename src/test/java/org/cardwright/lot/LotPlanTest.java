package org.cardwright.lot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;

import java.util.List;
import java.util.Map;
import org.cardwright.fit.ParameterRule;
import org.cardwright.model.Param;
import org.junit.jupiter.api.Test;

/** The lot's plan and a part's result survive their text form unchanged (resuming and other engines rely on it). */
class LotPlanTest {
    @Test
    void planRoundTripsThroughText() {
        LotPlan plan = new LotPlan(List.of(ParameterRule.free(Param.ISR),
                new ParameterRule(Param.TRS1, ParameterRule.Kind.OFF, Double.NaN, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY)),
                List.of("recombination current (ISR): on"), Map.of(Datasheet.Quantity.VF, 2e-3, Datasheet.Quantity.C, 5.0),
                298.15, List.of("P1", "P9"));
        LotPlan back = LotPlan.fromText(plan.toText());
        assertEquals(plan.toText(), back.toText());
        assertEquals(plan.rules(), back.rules());
        assertNull(LotPlan.fromText(plan.toText().replace("end\n", "")), "a plan cut off before its end is not taken");
    }

    @Test
    void partResultRoundTripsThroughText() {
        PartResult r = new PartResult("P 7, odd name", "abc", null, Map.of(Param.IS, 1.2345678901234567e-14, Param.N, 1.0400000000000003),
                java.util.Set.of(Param.IS), 1.5e-4, Map.of(Datasheet.Quantity.VF, 0.6661234567), Map.of(Datasheet.Quantity.VF, 0.66612));
        PartResult back = PartResult.fromText(r.toText());
        assertEquals(r.toText(), back.toText());
        assertEquals(r.values(), back.values());
        assertNull(PartResult.fromText(r.toText().substring(0, r.toText().length() / 2)));
    }

    @Test
    void partRoundTripsThroughItsEncoding() {
        LotParts.Part p = new LotParts.Part("name\twith tab", List.of(java.nio.file.Path.of("a/b.csv")),
                Map.of(java.nio.file.Path.of("a/b.csv"), new LotParts.LineMap(java.nio.file.Path.of("t.csv"), new int[] {1, 2, 9})));
        LotParts.Part back = LotParts.Part.decode(p.encode());
        assertEquals(p.name(), back.name());
        assertEquals(p.files(), back.files());
        assertEquals(9, back.lines().get(java.nio.file.Path.of("a/b.csv")).tableLines()[2]);
    }
}
