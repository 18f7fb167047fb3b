package org.cardwright.model;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * The sweep rule on a chamber logger's readings: rows within a few tenths of a kelvin of their set point form one
 * sweep (a logger's wander against set points several kelvin apart: common practice, no source).
 */
class SweepTemperaturesTest {
    /** Labels are sums and halves of the readings: exact to a few ulps of 400 K [K]. */
    private static final double LABEL_TOLERANCE = 1e-12;

    @Test
    void wanderingReadingsFormOneSweepPerSetPoint() {
        double[] t = {298.08, 298.22, 298.26, 358.05, 358.27, 298.15, 358.16};
        double[] labels = SweepTemperatures.labels(t, SweepTemperatures.DEFAULT_GAP);
        double low = (298.08 + 298.26) / 2;
        double high = (358.05 + 358.27) / 2;
        assertArrayEquals(new double[] {low, low, low, high, high, low, high}, labels, LABEL_TOLERANCE);
        Map<Double, List<Integer>> groups = SweepTemperatures.groupIndices(t, SweepTemperatures.DEFAULT_GAP);
        assertEquals(2, groups.size());
        assertEquals(List.of(0, 1, 2, 5), groups.get(low));
    }

    @Test
    void aGapOfZeroKeepsEveryDistinctTemperatureAndEqualReadingsKeepTheirExactValue() {
        double[] t = {298.15, 298.15, 298.25};
        assertEquals(2, SweepTemperatures.groupIndices(t, 0).size());
        assertEquals(298.15, SweepTemperatures.labels(new double[] {298.15, 298.15}, 5)[0], 0.0,
                "a sweep of one temperature is labelled with exactly that temperature");
    }

    @Test
    void aGapLargerThanTheRuleSplitsNeighbours() {
        double[] t = {298.15, 299.0, 300.5};
        // 0.85 K apart stay together, 1.5 K apart split
        assertEquals(2, SweepTemperatures.groupIndices(t, SweepTemperatures.DEFAULT_GAP).size());
        assertThrows(IllegalArgumentException.class, () -> SweepTemperatures.labels(t, -1));
    }
}
